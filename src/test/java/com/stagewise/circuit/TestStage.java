package com.stagewise.circuit;

import java.util.ArrayList;
import java.util.List;

/**
 * The one builder of stages in code for tests (nothing built here is demo data): rails, inputs,
 * resistors and capacitors at 1 % and 10 %, rails at 5 %, op-amp sections placed in packages either
 * by the caller or, by default, in quad packages in the order they are added.
 *
 * <pre>{@code
 * Stage s = TestStage.splitSupply(15).input("IN", 1).r("R1", 10e3, "IN", "SUM")
 *     .r("R2", 47e3, "SUM", "OUT").amp("U1A", "GND", "SUM", "OUT").build();
 * }</pre>
 */
public final class TestStage {
  private String title = "test stage";
  private final List<Rail> rails = new ArrayList<>();
  private final List<TestInput> inputs = new ArrayList<>();
  private final List<Part> parts = new ArrayList<>();
  private final List<Amplifier> amps = new ArrayList<>();

  private TestStage() {}

  /** Returns a builder with no rails yet. */
  public static TestStage empty() {
    return new TestStage();
  }

  /** Returns a builder with {@code VCC} at {@code +volts} and {@code VEE} at {@code -volts}. */
  public static TestStage splitSupply(double volts) {
    return new TestStage().rail("VCC", volts).rail("VEE", -volts);
  }

  /** Sets the stage's title ("test stage" unless given). */
  public TestStage title(String title) {
    this.title = title;
    return this;
  }

  /** Adds a rail at 5 % tolerance. */
  public TestStage rail(String net, double volts) {
    rails.add(new Rail(net, volts, 0.05));
    return this;
  }

  /** Adds a DC test input. */
  public TestStage input(String net, double dc) {
    inputs.add(TestInput.dc(net, dc));
    return this;
  }

  /** Adds a test input with an AC amplitude (peak) at {@code hz}. */
  public TestStage input(String net, double dc, double ac, double hz) {
    inputs.add(new TestInput(net, dc, ac, hz));
    return this;
  }

  /** Adds a resistor at 1 %. */
  public TestStage r(String ref, double ohms, String a, String b) {
    return part(Part.resistor(ref, ohms, 0.01, a, b));
  }

  /** Adds a capacitor at 10 %. */
  public TestStage c(String ref, double farads, String a, String b) {
    return part(Part.capacitor(ref, farads, 0.1, a, b));
  }

  /** Adds any part. */
  public TestStage part(Part part) {
    parts.add(part);
    return this;
  }

  /** Adds a classic-bipolar section on {@code VCC}/{@code VEE}, in the next free quad section. */
  public TestStage amp(String ref, String inPlus, String inMinus, String out) {
    return amp(ref, DeviceClass.CLASSIC_BIPOLAR, inPlus, inMinus, out, "VCC", "VEE");
  }

  /** Adds a section of the given class and supplies, in the next free quad section. */
  public TestStage amp(
      String ref,
      DeviceClass type,
      String inPlus,
      String inMinus,
      String out,
      String vPlus,
      String vMinus) {
    String pkg = "U" + (amps.size() / 4 + 1);
    String section = List.of("A", "B", "C", "D").get(amps.size() % 4);
    return amp(
        new Amplifier(
            ref, pkg, PackageType.QUAD_14, section, type, inPlus, inMinus, out, vPlus, vMinus));
  }

  /** Adds a section in the package and section the caller names. */
  public TestStage amp(
      String ref,
      String pkg,
      PackageType type,
      String section,
      DeviceClass cls,
      String inPlus,
      String inMinus,
      String out,
      String vPlus,
      String vMinus) {
    return amp(new Amplifier(ref, pkg, type, section, cls, inPlus, inMinus, out, vPlus, vMinus));
  }

  /** Adds a section as it is. */
  public TestStage amp(Amplifier amp) {
    amps.add(amp);
    return this;
  }

  /** Returns the stage, ground {@code GND}. */
  public Stage build() {
    return new Stage(title, "", "GND", rails, inputs, parts, amps);
  }

  /**
   * Returns an inverting stage on ±15 V: IN -R1- SUM -R2- OUT, in+ at ground, gain −R2/R1 (any
   * circuits textbook).
   */
  public static Stage inverting(double r1, double r2, double vin) {
    return splitSupply(15)
        .input("IN", vin)
        .r("R1", r1, "IN", "SUM")
        .r("R2", r2, "SUM", "OUT")
        .amp("U1A", "GND", "SUM", "OUT")
        .build();
  }
}
