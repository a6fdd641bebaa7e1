package com.stagewise.circuit;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A part of a stage: a resistor or capacitor between two nets; a diode, zener or LED between an
 * anode net ({@code netA}) and a cathode net ({@code netB}); or a trimmer or potentiometer, whose
 * track runs from {@code netA} to {@code netB} with its wiper on {@code wiper}.
 *
 * @param ref the designator, e.g. {@code R2}, {@code D1}, {@code RV1}
 * @param kind the kind of part
 * @param value ohms, farads, a zener's marked volts (above 0), a trimmer's end-to-end ohms; 0 for a
 *     diode or LED; finite and not negative (0 Ω is a link)
 * @param tolerance the marked tolerance as a fraction (0.01 for 1 %), in [0, 1)
 * @param netA the first net (a junction's anode, a trimmer's first end)
 * @param netB the second net (a junction's cathode, a trimmer's second end)
 * @param wiper a trimmer's wiper net; null for every other kind
 * @param position a trimmer's wiper position, the share of the track from {@code netA} to the wiper
 *     (0 to 1); NaN for every other kind
 * @param sealed whether a trimmer is factory-set and sealed (its position known); false otherwise
 * @param diodeClass a junction's class ({@code silicon} for a zener, {@code led} for an LED); null
 *     for every other kind
 * @param colour an LED's colour; null for every other kind
 */
public record Part(
    String ref,
    PartKind kind,
    double value,
    double tolerance,
    String netA,
    String netB,
    String wiper,
    double position,
    boolean sealed,
    DiodeClass diodeClass,
    LedColour colour) {

  /**
   * The record's own equality, written out: the generated one is set up through method handles on
   * its first call, which cost a fresh command-line run several milliseconds (doubles compare as
   * {@link Double#compare} does, as the generated one does).
   */
  @Override
  public boolean equals(Object o) {
    if (this == o) {
      return true;
    }
    return o instanceof Part p
        && ref.equals(p.ref)
        && kind == p.kind
        && Double.compare(value, p.value) == 0
        && Double.compare(tolerance, p.tolerance) == 0
        && netA.equals(p.netA)
        && netB.equals(p.netB)
        && Objects.equals(wiper, p.wiper)
        && Double.compare(position, p.position) == 0
        && sealed == p.sealed
        && diodeClass == p.diodeClass
        && colour == p.colour;
  }

  /** The generated hash's formula (31 × the hash so far + each field's, from 0), written out. */
  @Override
  public int hashCode() {
    int h = ref.hashCode();
    h = 31 * h + kind.hashCode();
    h = 31 * h + Double.hashCode(value);
    h = 31 * h + Double.hashCode(tolerance);
    h = 31 * h + netA.hashCode();
    h = 31 * h + netB.hashCode();
    h = 31 * h + Objects.hashCode(wiper);
    h = 31 * h + Double.hashCode(position);
    h = 31 * h + Boolean.hashCode(sealed);
    h = 31 * h + Objects.hashCode(diodeClass);
    return 31 * h + Objects.hashCode(colour);
  }

  /** Checks the fields; see the record description. */
  public Part {
    Objects.requireNonNull(kind, "kind");
    requireName(ref, "ref");
    requireName(netA, "nets[0]");
    requireName(netB, kind.isTrimmer() ? "nets[2]" : "nets[1]");
    if (!Double.isFinite(value) || value < 0) {
      throw new InvalidInputException(
          "", "value", ref + " value (" + value + ") must be a finite number, 0 or more");
    }
    if (!Double.isFinite(tolerance) || tolerance < 0 || tolerance >= 1) {
      throw new InvalidInputException(
          "", "tolerance", ref + " tolerance (" + tolerance + ") must be between 0 and 1");
    }
    if (kind.isTrimmer()) {
      requireName(wiper, "nets[1]");
      if (!(position >= 0 && position <= 1)) {
        throw new InvalidInputException(
            "",
            "position",
            ref
                + " position ("
                + position
                + ") must be between 0 and 1 (the wiper's share of the track from the first end)");
      }
    } else {
      wiper = null;
      position = Double.NaN;
      sealed = false;
    }
    if (kind.isJunction()) {
      if (kind == PartKind.LED) {
        if (colour == null) {
          throw new InvalidInputException(
              "",
              "colour",
              ref + " is an LED and needs its colour (expected " + LedColour.words() + ")");
        }
        diodeClass = DiodeClass.LED;
      } else {
        colour = null;
        diodeClass = kind == PartKind.ZENER || diodeClass == null ? DiodeClass.SILICON : diodeClass;
        if (diodeClass == DiodeClass.LED) {
          throw new InvalidInputException(
              "",
              "class",
              ref
                  + " is a "
                  + kind.word()
                  + "; class led is for kind led (expected silicon or schottky)");
        }
      }
      if (kind == PartKind.ZENER && !(value > 0)) {
        throw new InvalidInputException(
            "",
            "value",
            ref
                + " is a zener and needs its voltage (expected a marking such as 5V1, 12V or 3.3V)");
      }
      if (kind != PartKind.ZENER) {
        value = 0;
      }
    } else {
      diodeClass = null;
      colour = null;
    }
  }

  /** Returns a resistor or capacitor (or another two-net part with no further detail). */
  public Part(String ref, PartKind kind, double value, double tolerance, String netA, String netB) {
    this(ref, kind, value, tolerance, netA, netB, null, Double.NaN, false, null, null);
  }

  /** Returns a resistor with the given value in ohms. */
  public static Part resistor(String ref, double ohms, double tolerance, String netA, String netB) {
    return new Part(ref, PartKind.RESISTOR, ohms, tolerance, netA, netB);
  }

  /** Returns a capacitor with the given value in farads. */
  public static Part capacitor(
      String ref, double farads, double tolerance, String netA, String netB) {
    return new Part(ref, PartKind.CAPACITOR, farads, tolerance, netA, netB);
  }

  /** Returns a diode of a class ({@code silicon}, {@code schottky}) from anode to cathode. */
  public static Part diode(String ref, DiodeClass diodeClass, String anode, String cathode) {
    return new Part(
        ref, PartKind.DIODE, 0, 0, anode, cathode, null, Double.NaN, false, diodeClass, null);
  }

  /** Returns an LED of a colour from anode to cathode. */
  public static Part led(String ref, LedColour colour, String anode, String cathode) {
    return new Part(
        ref, PartKind.LED, 0, 0, anode, cathode, null, Double.NaN, false, DiodeClass.LED, colour);
  }

  /** Returns a zener marked {@code volts}, from anode to cathode (it breaks down cathode high). */
  public static Part zener(
      String ref, double volts, double tolerance, String anode, String cathode) {
    return new Part(
        ref,
        PartKind.ZENER,
        volts,
        tolerance,
        anode,
        cathode,
        null,
        Double.NaN,
        false,
        DiodeClass.SILICON,
        null);
  }

  /** Returns a trimmer of {@code ohms} end to end, nets {@code [end, wiper, end]}. */
  public static Part trimmer(
      String ref,
      double ohms,
      double tolerance,
      String endA,
      String wiper,
      String endB,
      double position) {
    return new Part(
        ref, PartKind.TRIMMER, ohms, tolerance, endA, endB, wiper, position, false, null, null);
  }

  /** Returns a junction's anode net (the first net). */
  public String anode() {
    return netA;
  }

  /** Returns a junction's cathode net (the second net). */
  public String cathode() {
    return netB;
  }

  /**
   * Returns the nets in sheet order: {@code [a, b]}, or for a trimmer {@code [end, wiper, end]}.
   */
  public List<String> nets() {
    return kind.isTrimmer() ? List.of(netA, wiper, netB) : List.of(netA, netB);
  }

  /** Returns the names of the leads, in the order of {@link #nets}: {@code 1, 2}; {@code a, k}. */
  public List<String> leads() {
    if (kind.isTrimmer()) {
      return List.of("1", "w", "2");
    }
    return kind.isJunction() ? List.of("a", "k") : List.of("1", "2");
  }

  /** Returns the net on a lead ({@code 1}, {@code 2}, {@code a}, {@code k}, {@code w}), or null. */
  public String leadNet(String lead) {
    int i = leads().indexOf(lead);
    return i < 0 ? null : nets().get(i);
  }

  /**
   * Returns the junction figures of a diode, zener or LED (class typical figures; a zener's
   * breakdown at its value).
   *
   * @throws IllegalStateException if the part is not a junction
   */
  public JunctionFigures junction() {
    return switch (kind) {
      case DIODE -> diodeClass.figures(null);
      case LED -> DiodeClass.LED.figures(colour);
      case ZENER -> DiodeClass.zener(value);
      default -> throw new IllegalStateException(ref + " is not a junction");
    };
  }

  /** Returns a copy with another value (ohms, farads, a zener's volts). */
  public Part withValue(double newValue) {
    return new Part(
        ref, kind, newValue, tolerance, netA, netB, wiper, position, sealed, diodeClass, colour);
  }

  /** Returns a copy of a trimmer with its wiper at another position (0 to 1). */
  public Part withPosition(double newPosition) {
    return new Part(
        ref, kind, value, tolerance, netA, netB, wiper, newPosition, sealed, diodeClass, colour);
  }

  /** Returns a copy with another designator. */
  public Part withRef(String newRef) {
    return new Part(
        newRef, kind, value, tolerance, netA, netB, wiper, position, sealed, diodeClass, colour);
  }

  /** Returns a copy with another tolerance. */
  public Part withTolerance(double newTolerance) {
    return new Part(
        ref, kind, value, newTolerance, netA, netB, wiper, position, sealed, diodeClass, colour);
  }

  /** Returns a copy whose terminals on {@code oldNet} are moved to {@code newNet}. */
  public Part withNetRenamed(String oldNet, String newNet) {
    return new Part(
        ref,
        kind,
        value,
        tolerance,
        netA.equals(oldNet) ? newNet : netA,
        netB.equals(oldNet) ? newNet : netB,
        wiper != null && wiper.equals(oldNet) ? newNet : wiper,
        position,
        sealed,
        diodeClass,
        colour);
  }

  /** Returns whether any terminal is on {@code net}. */
  public boolean touches(String net) {
    return netA.equals(net) || netB.equals(net) || net.equals(wiper);
  }

  /** Returns the resistive sections of a trimmer: {@code {netA–wiper ohms, wiper–netB ohms}}. */
  public double[] trackOhms() {
    return new double[] {value * position, value * (1 - position)};
  }

  /** Returns the parts of a list in sheet order whose kinds need stage sheet version 2. */
  public static List<Part> newerKinds(List<Part> parts) {
    List<Part> newer = new ArrayList<>();
    for (Part part : parts) {
      if (part.kind().sheetVersion() > 1) {
        newer.add(part);
      }
    }
    return newer;
  }

  static void requireName(String name, String field) {
    if (name == null || name.isBlank()) {
      throw new InvalidInputException("", field, "a name is required here");
    }
  }
}
