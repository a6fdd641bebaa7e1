package com.stagewise.circuit.template;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.ArrayList;
import java.util.List;

/** A stage being put together by a template, part by part, from its parameter values. */
final class Draft {
  /**
   * Resistor tolerance of the templates: 1 % metal film, the usual fit in signal stages (common
   * practice).
   */
  static final double RESISTOR_TOLERANCE = 0.01;

  /**
   * Capacitor tolerance of the templates: 10 %, usual for film and ceramic parts (common practice).
   */
  static final double CAPACITOR_TOLERANCE = 0.10;

  /** Rail tolerance of the templates: 5 %, usual for a regulated supply (common practice). */
  static final double RAIL_TOLERANCE = 0.05;

  static final String GND = "GND";
  static final String VCC = "VCC";
  static final String VEE = "VEE";

  private final Values values;
  private final String title;
  private final List<Rail> rails = new ArrayList<>();
  private final List<TestInput> inputs = new ArrayList<>();
  private final List<Part> parts = new ArrayList<>();
  private final List<Amplifier> amplifiers = new ArrayList<>();
  private String negativeSupply = VEE;

  Draft(Values values) {
    this.values = values;
    this.title = values.title();
  }

  /** Adds the rails VCC ({@code vcc}, above 0) and VEE ({@code vee}, below 0). */
  Draft dualRails() {
    double vcc = values.number("vcc");
    double vee = values.number("vee");
    if (!(vcc > 0)) {
      throw values.error("vcc", "vcc (" + values.text("vcc") + ") must be above 0 V");
    }
    if (!(vee < 0)) {
      throw values.error(
          "vee", "vee (" + values.text("vee") + ") must be below 0 V for a split supply");
    }
    rails.add(new Rail(VCC, vcc, RAIL_TOLERANCE));
    rails.add(new Rail(VEE, vee, RAIL_TOLERANCE));
    negativeSupply = VEE;
    return this;
  }

  /** Adds the single rail VCC ({@code vcc}, above 0); the negative supply pin goes to ground. */
  Draft singleRail() {
    double vcc = values.number("vcc");
    if (!(vcc > 0)) {
      throw values.error("vcc", "vcc (" + values.text("vcc") + ") must be above 0 V");
    }
    rails.add(new Rail(VCC, vcc, RAIL_TOLERANCE));
    negativeSupply = GND;
    return this;
  }

  /**
   * Adds a test input on {@code net}: DC from parameter {@code dc}; AC amplitude from {@code ac}
   * (none when null or 0) at the frequency of parameter {@code hz}.
   */
  Draft input(String net, String dc, String ac, String hz) {
    double amplitude = ac == null ? 0 : values.nonNegative(ac);
    double frequency = amplitude > 0 ? values.positive(hz) : 0;
    inputs.add(new TestInput(net, values.number(dc), amplitude, frequency));
    return this;
  }

  /** Adds a resistor whose value is parameter {@code param}. */
  Draft r(String ref, String param, String netA, String netB) {
    return r(ref, values.positive(param), netA, netB);
  }

  /** Adds a resistor of {@code ohms}. */
  Draft r(String ref, double ohms, String netA, String netB) {
    parts.add(Part.resistor(ref, ohms, RESISTOR_TOLERANCE, netA, netB));
    return this;
  }

  /** Adds a capacitor whose value is parameter {@code param}. */
  Draft c(String ref, String param, String netA, String netB) {
    parts.add(Part.capacitor(ref, values.positive(param), CAPACITOR_TOLERANCE, netA, netB));
    return this;
  }

  /** Zener tolerance of the templates: 5 %, the usual small zener grade (common practice). */
  static final double ZENER_TOLERANCE = 0.05;

  /**
   * Trimmer tolerance of the templates: 20 % end to end, usual for cermet trimmers (common
   * practice).
   */
  static final double TRIMMER_TOLERANCE = 0.20;

  /** Adds a diode of the class in parameter {@code param}, anode to cathode. */
  Draft diode(String ref, String param, String anode, String cathode) {
    parts.add(Part.diode(ref, values.diodeClass(param), anode, cathode));
    return this;
  }

  /** Adds an LED of the colour in parameter {@code param}, anode to cathode. */
  Draft led(String ref, String param, String anode, String cathode) {
    parts.add(Part.led(ref, values.ledColour(param), anode, cathode));
    return this;
  }

  /** Adds a zener marked as parameter {@code param}, anode to cathode. */
  Draft zener(String ref, String param, String anode, String cathode) {
    parts.add(Part.zener(ref, values.zener(param), ZENER_TOLERANCE, anode, cathode));
    return this;
  }

  /** Adds a trimmer of parameter {@code param}, wiper at parameter {@code position}. */
  Draft trimmer(String ref, String param, String position, String endA, String wiper, String endB) {
    parts.add(
        Part.trimmer(
            ref,
            values.positive(param),
            TRIMMER_TOLERANCE,
            endA,
            wiper,
            endB,
            values.fraction(position)));
    return this;
  }

  /**
   * Adds section {@code section} of package {@code pkg}, supplied from VCC and the negative supply.
   */
  Draft section(
      String pkg,
      PackageType type,
      String section,
      DeviceClass deviceClass,
      String inPlus,
      String inMinus,
      String out) {
    if (!type.hasSection(section)) {
      throw new InvalidInputException(
          values.source(), "package", "a " + type.word() + " package has no section " + section);
    }
    amplifiers.add(
        new Amplifier(
            pkg + section,
            pkg,
            type,
            section,
            deviceClass,
            inPlus,
            inMinus,
            out,
            VCC,
            negativeSupply));
    return this;
  }

  /**
   * Adds section A of package U1 of the type and class given by the {@code package} and {@code
   * class} parameters.
   */
  Draft u1(String inPlus, String inMinus, String out) {
    return section(
        "U1",
        values.packageType("package"),
        "A",
        values.deviceClass("class"),
        inPlus,
        inMinus,
        out);
  }

  Stage build() {
    return new Stage(title, "", GND, rails, inputs, parts, amplifiers);
  }
}
