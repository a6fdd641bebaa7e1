package com.stagewise.ui.drawing;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The usual op-amp stages built in code, with the nets and designators the stage templates use,
 * for the drawing tests (textbook topologies; values are typical, nothing here is demo data).
 */
final class TestCircuits {
  private final String title;
  private final List<Rail> rails = new ArrayList<>();
  private final List<TestInput> inputs = new ArrayList<>();
  private final List<Part> parts = new ArrayList<>();
  private final List<Amplifier> amps = new ArrayList<>();

  private TestCircuits(String title, boolean split) {
    this.title = title;
    rails.add(new Rail("VCC", split ? 15 : 12, 0.05));
    if (split) {
      rails.add(new Rail("VEE", -15, 0.05));
    }
  }

  private TestCircuits in(String net, double volts) {
    inputs.add(TestInput.dc(net, volts));
    return this;
  }

  private TestCircuits r(String ref, double ohms, String a, String b) {
    parts.add(Part.resistor(ref, ohms, 0.01, a, b));
    return this;
  }

  private TestCircuits c(String ref, double farads, String a, String b) {
    parts.add(Part.capacitor(ref, farads, 0.1, a, b));
    return this;
  }

  private TestCircuits amp(String section, PackageType type, String inPlus, String inMinus, String out) {
    String vMinus = rails.size() > 1 ? "VEE" : "GND";
    amps.add(
        new Amplifier(
            "U1" + section, "U1", type, section, DeviceClass.CLASSIC_BIPOLAR, inPlus, inMinus, out, "VCC", vMinus));
    return this;
  }

  private TestCircuits u1(String inPlus, String inMinus, String out) {
    return amp("A", PackageType.DUAL_8, inPlus, inMinus, out);
  }

  private Stage build() {
    return new Stage(title, "", "GND", rails, inputs, parts, amps);
  }

  /** Returns every topology the stage templates build, keyed by a short file-friendly name. */
  static Map<String, Stage> all() {
    Map<String, Stage> all = new LinkedHashMap<>();
    all.put("inverting", new TestCircuits("Inverting amplifier", true).in("IN", 1)
        .r("R1", 10e3, "IN", "SUM").r("R2", 47e3, "SUM", "OUT").u1("GND", "SUM", "OUT").build());
    all.put("non-inverting", new TestCircuits("Non-inverting amplifier", true).in("IN", 0.5)
        .r("R1", 10e3, "FB", "GND").r("R2", 22e3, "FB", "OUT").u1("IN", "FB", "OUT").build());
    all.put("voltage-follower", new TestCircuits("Voltage follower", true).in("IN", 2)
        .r("R1", 10e3, "OUT", "GND").u1("IN", "OUT", "OUT").build());
    for (int n = 2; n <= 4; n++) {
      TestCircuits s = new TestCircuits("Summing amplifier, " + n + " inputs", true);
      for (int i = 1; i <= n; i++) {
        s.in("IN" + i, 0.1 * i).r("R" + i, 10e3, "IN" + i, "SUM");
      }
      all.put("summing-" + n, s.r("R5", 10e3, "SUM", "OUT").u1("GND", "SUM", "OUT").build());
    }
    all.put("difference", new TestCircuits("Difference amplifier", true).in("IN1", 1).in("IN2", 1.5)
        .r("R1", 10e3, "IN1", "NEG").r("R2", 22e3, "NEG", "OUT").r("R3", 10e3, "IN2", "POS")
        .r("R4", 22e3, "POS", "GND").u1("POS", "NEG", "OUT").build());
    all.put("integrator", new TestCircuits("Integrator", true).in("IN", 0)
        .r("R1", 10e3, "IN", "SUM").c("C1", 10e-9, "SUM", "OUT").r("R2", 1e6, "SUM", "OUT")
        .u1("GND", "SUM", "OUT").build());
    all.put("integrator-no-dc-path", new TestCircuits("Integrator without DC feedback", true).in("IN", 0)
        .r("R1", 10e3, "IN", "SUM").c("C1", 10e-9, "SUM", "OUT").u1("GND", "SUM", "OUT").build());
    all.put("differentiator", new TestCircuits("Differentiator", true).in("IN", 0)
        .c("C1", 10e-9, "IN", "MID").r("R1", 1e3, "MID", "SUM").r("R2", 10e3, "SUM", "OUT")
        .u1("GND", "SUM", "OUT").build());
    all.put("differentiator-plain", new TestCircuits("Differentiator without series resistor", true).in("IN", 0)
        .c("C1", 10e-9, "IN", "SUM").r("R2", 10e3, "SUM", "OUT").u1("GND", "SUM", "OUT").build());
    all.put("instrumentation", new TestCircuits("Three-op-amp instrumentation amplifier", true)
        .in("IN1", 2.5).in("IN2", 2.55)
        .r("R1", 10e3, "OA", "GA").r("R2", 2.2e3, "GA", "GB").r("R3", 10e3, "GB", "OB")
        .r("R4", 10e3, "OA", "DN").r("R5", 10e3, "DN", "OUT").r("R6", 10e3, "OB", "DP")
        .r("R7", 10e3, "DP", "GND")
        .amp("A", PackageType.QUAD_14, "IN1", "GA", "OA")
        .amp("B", PackageType.QUAD_14, "IN2", "GB", "OB")
        .amp("C", PackageType.QUAD_14, "DP", "DN", "OUT").build());
    all.put("transimpedance", new TestCircuits("Transimpedance amplifier", true).in("IN", -1)
        .r("R1", 10e6, "IN", "SUM").r("R2", 1e6, "SUM", "OUT").c("C1", 10e-12, "SUM", "OUT")
        .u1("GND", "SUM", "OUT").build());
    all.put("sallen-key-low-pass", new TestCircuits("Sallen-Key low-pass filter", true).in("IN", 0)
        .r("R1", 10e3, "IN", "JCT").r("R2", 10e3, "JCT", "POS").c("C1", 22e-9, "JCT", "OUT")
        .c("C2", 10e-9, "POS", "GND").u1("POS", "OUT", "OUT").build());
    all.put("inverting-schmitt-trigger", new TestCircuits("Inverting Schmitt trigger", true).in("IN", 0)
        .r("R1", 10e3, "POS", "GND").r("R2", 100e3, "POS", "OUT").u1("POS", "IN", "OUT").build());
    all.put("single-supply-inverting", new TestCircuits("Single-supply inverting amplifier", false).in("IN", 0)
        .c("C1", 1e-6, "IN", "AC").r("R1", 10e3, "AC", "SUM").r("R2", 47e3, "SUM", "OUT")
        .r("R3", 100e3, "VCC", "BIAS").r("R4", 100e3, "BIAS", "GND").c("C2", 10e-6, "BIAS", "GND")
        .u1("BIAS", "SUM", "OUT").build());
    // Not a template: a twin-T notch, whose loop of parts fits no role and must still be drawn.
    all.put("fallback-twin-t", new TestCircuits("Twin-T notch (fallback drawing)", true).in("IN", 0)
        .r("R1", 10e3, "IN", "A").r("R2", 10e3, "A", "POS").c("C3", 20e-9, "A", "GND")
        .c("C1", 10e-9, "IN", "B").c("C2", 10e-9, "B", "POS").r("R3", 5e3, "B", "GND")
        .r("R4", 10e3, "POS", "GND").u1("POS", "OUT", "OUT").build());
    return all;
  }
}
