package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.circuit.value.ZenerMarking;
import com.stagewise.solver.OhmsPrediction;
import com.stagewise.solver.PowerOff;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * How to confirm a suspect at the bench: the check a technician makes before replacing a part (ohms
 * with the power off, the meter's diode test, a powered reading of a rail or a zener), with what a
 * good and a faulty part read.
 */
final class ConfirmingChecks {
  private final Stage stage;

  ConfirmingChecks(Stage stage) {
    this.stage = stage;
  }

  /** Returns a part's marking in words, or "?" for a part the stage lacks. */
  String marked(String ref) {
    Part part = stage.part(ref).orElse(null);
    return part == null ? "?" : marking(part);
  }

  /** A part's marking in words: its value, a diode's class, an LED's colour, a trimmer's set. */
  private String marking(Part p) {
    return switch (p.kind()) {
      case DIODE -> p.diodeClass().word() + " diode";
      case LED -> p.colour().word() + " LED";
      case ZENER -> ZenerMarking.format(p.value()) + " zener";
      case TRIMMER, POTENTIOMETER ->
          value(p.ref(), p.value())
              + " "
              + p.kind().word()
              + String.format(Locale.ROOT, ", set at %.2f", p.position());
      default -> value(p.ref(), p.value());
    };
  }

  /**
   * The diode test across a junction, as a meter shows it (about 1 mA test current, common practice
   * for handheld meters): its forward volts from the class's figures.
   */
  private String diodeTest(String ref) {
    Part part = stage.part(ref).orElse(null);
    if (part == null || !part.kind().isJunction()) {
      return "";
    }
    double forward = part.junction().forwardVolts(DIODE_TEST_AMPS);
    return "put the meter on its diode test across "
        + ref
        + ", red lead on the anode ("
        + ref
        + ".a): expect about "
        + String.format(Locale.ROOT, "%.1f V", forward)
        + " one way and OL the other (reverse the leads)";
  }

  /** A handheld meter's diode-test current: about 1 mA (common practice). */
  static final double DIODE_TEST_AMPS = 1e-3;

  /** Returns a value in the unit of the part's kind. */
  String value(String ref, double value) {
    return Units.format(value, partKind(ref).unit());
  }

  /** Returns how to confirm a fault at the bench, with the power off where ohms are read. */
  String of(Fault fault, OptionalDouble estimate) {
    String check = atTheBench(fault, estimate);
    String inCircuit = inCircuit(fault, estimate);
    return inCircuit.isEmpty() ? check : check + " " + inCircuit;
  }

  /**
   * Returns, for a resistor open, shorted or drifted, what the ohmmeter reads across it in circuit
   * with the power off (no leg lifted: the rest of the network in parallel), good and with the
   * fault: the same power-off predictions the next probes and the ohms readings use ({@link
   * PowerOffFaults}); empty for other faults, or a drifted part whose value is not estimated.
   */
  String inCircuit(Fault fault, OptionalDouble estimate) {
    String s = fault.subject();
    boolean drift = fault.kind() == FaultKind.HIGH || fault.kind() == FaultKind.LOW;
    if (partKind(s) != PartKind.RESISTOR
        || stage.part(s).isEmpty()
        || !(fault.kind() == FaultKind.OPEN || fault.kind() == FaultKind.SHORT || drift)
        || drift && estimate.isEmpty()) {
      return "";
    }
    String a = s + ".1";
    String b = s + ".2";
    PowerOff healthy = PowerOff.of(stage);
    OhmsPrediction good =
        healthy.predict(PowerOffFaults.onFaulted(healthy, a), PowerOffFaults.onFaulted(healthy, b));
    OhmsPrediction bad =
        PowerOffFaults.predict(stage, fault, drift ? estimate.getAsDouble() : Double.NaN, a, b);
    return "Before lifting a leg: in circuit, with the power off, "
        + s
        + " reads "
        + OhmsChecks.text(good)
        + " when good (the rest of the network in parallel) and "
        + OhmsChecks.text(bad)
        + " with this fault.";
  }

  private String atTheBench(Fault fault, OptionalDouble estimate) {
    String s = fault.subject();
    String powerOff = "Power off, unplug the unit and discharge its capacitors; then ";
    if (partKind(s).isJunction()
        && (fault.kind() == FaultKind.OPEN
            || fault.kind() == FaultKind.SHORT
            || fault.kind() == FaultKind.LEAKY)) {
      return powerOff
          + diodeTest(s)
          + ". An open "
          + partKind(s).word()
          + " reads OL both ways, a shorted one near 0 V both ways, a leaky one a low reading"
          + " the reverse way too; lift one leg if the rest of the circuit confuses the reading.";
    }
    if (partKind(s).isTrimmer()) {
      Part part = stage.part(s).orElseThrow();
      double[] track = part.trackOhms();
      String ends =
          ": expect "
              + value(s, part.value())
              + " end to end (pins 1 and 2), and from the wiper (w) about "
              + value(s, track[0])
              + " to pin 1 and "
              + value(s, track[1])
              + " to pin 2 at the sheet's setting";
      return switch (fault.kind()) {
        case MISSET ->
            (estimate.isPresent()
                    ? String.format(
                        Locale.ROOT,
                        "%s now sits at about %.2f of its travel. ",
                        s,
                        estimate.getAsDouble())
                    : "")
                + "Set it back as the unit's adjustment procedure says (with power on, reading the"
                + " stage's output while turning it); or "
                + powerOff.substring(0, 1).toLowerCase(Locale.ROOT)
                + powerOff.substring(1)
                + "read "
                + s
                + ends
                + ".";
        case WIPER_OPEN ->
            powerOff
                + "read "
                + s
                + ends
                + ". A wiper that has left the track reads OL (or jumps about) from w to both ends"
                + " while the ends still read "
                + value(s, part.value())
                + ".";
        default ->
            powerOff
                + "read "
                + s
                + ends
                + ". An open track reads OL end to end; the wiper then reaches only one end.";
      };
    }
    return switch (fault.kind()) {
      case HEALTHY, LEAKY, WIPER_OPEN, MISSET -> "";
      case OPEN ->
          partKind(s) == PartKind.RESISTOR
              ? powerOff
                  + "lift one leg of "
                  + s
                  + " and read its ohms: expect "
                  + marked(s)
                  + "; an open part reads OL."
              : powerOff
                  + "lift one leg of "
                  + s
                  + " and check it with a capacitance meter: expect "
                  + marked(s)
                  + "; an open part reads near zero.";
      case SHORT ->
          powerOff
              + "lift one leg of "
              + s
              + " and read its ohms: a short reads near 0 Ω"
              + (partKind(s) == PartKind.CAPACITOR
                  ? "; a good capacitor charges up towards OL."
                  : " where " + marked(s) + " is marked.");
      case HIGH, LOW ->
          partKind(s) == PartKind.ZENER
              ? "With power on, read across "
                  + s
                  + " from its anode ("
                  + s
                  + ".a) to its cathode ("
                  + s
                  + ".k): a good one reads about minus its marked "
                  + marked(s)
                  + " (the cathode the higher)"
                  + (estimate.isPresent()
                      ? "; this reading suggests about "
                          + value(s, estimate.getAsDouble())
                          + " instead"
                      : "")
                  + ". Confirm with the part lifted, fed from a supply through a resistor at about"
                  + " 5 mA."
              : powerOff
                  + "lift one leg of "
                  + s
                  + " and measure it: marked "
                  + marked(s)
                  + (estimate.isPresent()
                      ? ", this reading suggests about " + value(s, estimate.getAsDouble())
                      : "")
                  + ".";
      case STUCK_HIGH, STUCK_LOW, DEAD -> {
        Amplifier amp = stage.amplifier(s).orElse(null);
        String pins =
            amp == null
                ? "its supply pins"
                : Wording.point(amp.pinName(Terminal.V_PLUS))
                    + " and "
                    + Wording.point(amp.pinName(Terminal.V_MINUS));
        yield "With power on, first read the supply at "
            + pins
            + " against ground; if both are right, power off, lift the output pin"
            + (amp == null ? "" : " (" + Wording.point(amp.pinName(Terminal.OUT)) + ")")
            + " and read it again powered: a section that still sits at a limit (or floats) with its output free is faulty. Replace the whole package.";
      }
      case LIFTED ->
          powerOff
              + "inspect pin "
              + fault.pin()
              + " of "
              + s
              + " under magnification and read ohms from the pin itself to its pad or trace: a good joint reads near 0 Ω. Reflow it.";
      case BRIDGE ->
          powerOff
              + "inspect pins "
              + fault.pin()
              + " and "
              + fault.otherPin()
              + " of "
              + s
              + " under magnification and read ohms between them: a bridge reads near 0 Ω (compare with the nets' resistance on a good unit).";
      case RAIL_MISSING ->
          "Read "
              + s
              + " at its source (regulator output or supply connector) and follow it to the package pins: fuse, series resistor, connector, trace.";
      case RAIL_LOW ->
          "Read "
              + s
              + " at its source with the stage connected and with it disconnected: a rail that recovers unloaded points at the load (a shorted part downstream); one that stays low points at the supply.";
    };
  }

  /** Returns the kind of a part (a resistor for a name the stage lacks). */
  PartKind partKind(String ref) {
    Part part = stage.part(ref).orElse(null);
    return part == null ? PartKind.RESISTOR : part.kind();
  }
}
