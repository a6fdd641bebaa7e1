package com.stagewise.reference;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestStage;
import com.stagewise.circuit.template.Templates;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Stages built in code for the reference checks, beside the templates and the demo sheets: shapes
 * that exercise the model where the library does not (a supply fed through a resistor, a quad
 * package, a rail-to-rail part). Test data only, nothing here is demo data.
 */
final class HandStages {
  private HandStages() {}

  /** Returns the hand-built stages by id, in a fixed order. */
  static Map<String, Stage> all() {
    Map<String, Stage> stages = new LinkedHashMap<>();
    stages.put(
        "hand-inverting-dual",
        TestStage.splitSupply(15)
            .title("Inverting, gain -4.7, dual package")
            .input("IN", 1.0, 0.1, 1000)
            .r("R1", 10e3, "IN", "SUM")
            .r("R2", 47e3, "SUM", "OUT")
            .c("C1", 100e-12, "SUM", "OUT")
            .amp(
                "U1A",
                "U1",
                PackageType.DUAL_8,
                "A",
                DeviceClass.CLASSIC_BIPOLAR,
                "GND",
                "SUM",
                "OUT",
                "VCC",
                "VEE")
            .build());
    stages.put(
        "hand-two-stage-quad",
        TestStage.splitSupply(12)
            .title("Two sections of a quad: non-inverting gain 3 then inverting -2")
            .input("IN", 0.8, 0.05, 500)
            .r("R1", 10e3, "FB1", "GND")
            .r("R2", 20e3, "FB1", "MID")
            .r("R3", 10e3, "MID", "SUM")
            .r("R4", 20e3, "SUM", "OUT")
            .amp(
                "U1A",
                "U1",
                PackageType.QUAD_14,
                "A",
                DeviceClass.RAIL_TO_RAIL,
                "IN",
                "FB1",
                "MID",
                "VCC",
                "VEE")
            .amp(
                "U1B",
                "U1",
                PackageType.QUAD_14,
                "B",
                DeviceClass.RAIL_TO_RAIL,
                "GND",
                "SUM",
                "OUT",
                "VCC",
                "VEE")
            .build());
    stages.put(
        "hand-filtered-supply",
        TestStage.empty()
            .title("Non-inverting on a single supply fed through 100 R")
            .rail("VCC", 12)
            .input("IN", 1.5, 0.2, 2000)
            .r("R9", 100, "VCC", "V+")
            .r("R1", 10e3, "FB", "GND")
            .r("R2", 47e3, "FB", "OUT")
            .r("RL", 2.2e3, "OUT", "GND")
            .c("C9", 10e-6, "V+", "GND")
            .amp(
                "U1A",
                "U1",
                PackageType.SINGLE_8,
                "A",
                DeviceClass.GROUND_SENSING,
                "IN",
                "FB",
                "OUT",
                "V+",
                "GND")
            .build());
    // The precision rectifier on the negative half: its diode turns off, the loop opens and the
    // output clamps low while the load holds the rectified output at ground.
    stages.put(
        "hand-rectifier-negative-half",
        Templates.named("precision-rectifier").build(Map.of("vin", "-1", "vac", "0.1")));
    // A zener pushed hard into breakdown, and a schottky limiter driven into limiting.
    stages.put(
        "hand-zener-hard",
        Templates.named("zener-reference").build(Map.of("r1", "470", "zd1", "3V3")));
    stages.put(
        "hand-schottky-limiter",
        Templates.named("diode-limiter").build(Map.of("vin", "-0.5", "diode", "schottky")));
    // A gain trimmer at the end of its travel (position 1: the wiper sits on the foot end).
    stages.put("hand-trimmer-end", Templates.named("gain-trim").build(Map.of("pos", "1")));
    return stages;
  }
}
