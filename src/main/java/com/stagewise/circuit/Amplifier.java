package com.stagewise.circuit;

import java.util.Objects;

/**
 * One op-amp section of a package, with the nets on its five terminals.
 *
 * @param ref the section's designator, e.g. {@code U1A}
 * @param packageRef the package's designator, e.g. {@code U1}
 * @param packageType the package and pinout
 * @param section the section letter within the package, e.g. {@code A}
 * @param deviceClass the class of device, which sets its typical limits
 * @param inPlus net on the non-inverting input
 * @param inMinus net on the inverting input
 * @param out net on the output
 * @param vPlus net on the positive supply pin
 * @param vMinus net on the negative supply pin
 */
public record Amplifier(
    String ref,
    String packageRef,
    PackageType packageType,
    String section,
    DeviceClass deviceClass,
    String inPlus,
    String inMinus,
    String out,
    String vPlus,
    String vMinus) {

  /** Checks the fields; see the record description. */
  public Amplifier {
    Part.requireName(ref, "ref");
    Part.requireName(packageRef, "package");
    Objects.requireNonNull(packageType, "packageType");
    Objects.requireNonNull(deviceClass, "class");
    Part.requireName(section, "section");
    if (!packageType.hasSection(section)) {
      throw new InvalidInputException(
          "",
          "section",
          ref
              + " section \""
              + section
              + "\" is not on a "
              + packageType.word()
              + " package (expected one of "
              + String.join(", ", packageType.sections())
              + ")");
    }
    Part.requireName(inPlus, "inPlus");
    Part.requireName(inMinus, "inMinus");
    Part.requireName(out, "out");
    Part.requireName(vPlus, "vPlus");
    Part.requireName(vMinus, "vMinus");
  }

  /** Returns the net on a terminal. */
  public String net(Terminal terminal) {
    return switch (terminal) {
      case IN_PLUS -> inPlus;
      case IN_MINUS -> inMinus;
      case OUT -> out;
      case V_PLUS -> vPlus;
      case V_MINUS -> vMinus;
    };
  }

  /** Returns the package pin number of a terminal. */
  public int pin(Terminal terminal) {
    return packageType.pin(section, terminal);
  }

  /** Returns the test-point name of a terminal's pin, e.g. {@code U1.6}. */
  public String pinName(Terminal terminal) {
    return packageRef + "." + pin(terminal);
  }

  /** Returns a copy with the net on one terminal replaced. */
  public Amplifier withNet(Terminal terminal, String net) {
    return new Amplifier(
        ref,
        packageRef,
        packageType,
        section,
        deviceClass,
        terminal == Terminal.IN_PLUS ? net : inPlus,
        terminal == Terminal.IN_MINUS ? net : inMinus,
        terminal == Terminal.OUT ? net : out,
        terminal == Terminal.V_PLUS ? net : vPlus,
        terminal == Terminal.V_MINUS ? net : vMinus);
  }
}
