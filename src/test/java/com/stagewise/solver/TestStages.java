package com.stagewise.solver;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.ArrayList;
import java.util.List;

/** Small stages built in code for the solver's tests (nothing here is demo data). */
final class TestStages {
  private final List<Rail> rails = new ArrayList<>();
  private final List<TestInput> inputs = new ArrayList<>();
  private final List<Part> parts = new ArrayList<>();
  private final List<Amplifier> amps = new ArrayList<>();

  static TestStages splitSupply(double volts) {
    TestStages s = new TestStages();
    s.rails.add(new Rail("VCC", volts, 0.05));
    s.rails.add(new Rail("VEE", -volts, 0.05));
    return s;
  }

  TestStages rail(String net, double volts) {
    rails.add(new Rail(net, volts, 0.05));
    return this;
  }

  TestStages input(String net, double dc) {
    inputs.add(TestInput.dc(net, dc));
    return this;
  }

  TestStages acInput(String net, double dc, double ac, double hz) {
    inputs.add(new TestInput(net, dc, ac, hz));
    return this;
  }

  TestStages r(String ref, double ohms, String a, String b) {
    parts.add(Part.resistor(ref, ohms, 0.01, a, b));
    return this;
  }

  TestStages c(String ref, double farads, String a, String b) {
    parts.add(Part.capacitor(ref, farads, 0.1, a, b));
    return this;
  }

  TestStages amp(String ref, String inPlus, String inMinus, String out) {
    return amp(ref, DeviceClass.CLASSIC_BIPOLAR, inPlus, inMinus, out, "VCC", "VEE");
  }

  TestStages amp(
      String ref,
      DeviceClass type,
      String inPlus,
      String inMinus,
      String out,
      String vPlus,
      String vMinus) {
    String pkg = "U" + (amps.size() / 4 + 1);
    String section = List.of("A", "B", "C", "D").get(amps.size() % 4);
    amps.add(
        new Amplifier(
            ref, pkg, PackageType.QUAD_14, section, type, inPlus, inMinus, out, vPlus, vMinus));
    return this;
  }

  Stage build() {
    return new Stage("test stage", "", "GND", rails, inputs, parts, amps);
  }

  /** An inverting stage: IN -R1- SUM -R2- OUT, in+ at ground. */
  static Stage inverting(double r1, double r2, double vin) {
    return splitSupply(15)
        .input("IN", vin)
        .r("R1", r1, "IN", "SUM")
        .r("R2", r2, "SUM", "OUT")
        .amp("U1A", "GND", "SUM", "OUT")
        .build();
  }
}
