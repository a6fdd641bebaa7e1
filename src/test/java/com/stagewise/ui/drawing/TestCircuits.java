package com.stagewise.ui.drawing;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestStage;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.StageSheet;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.stream.Stream;

/**
 * The stages the drawing tests render: every stage template, the demo library, and a few topologies
 * no template builds (built in code here) for the fallback drawing.
 */
final class TestCircuits {
  private TestCircuits() {}

  /** Returns the stages no template builds, to exercise the fallback drawing. */
  static Map<String, Stage> fallbacks() {
    Map<String, Stage> all = new LinkedHashMap<>();
    // A twin-T notch, whose loop of parts fits no role and must still be drawn.
    all.put(
        "fallback-twin-t",
        TestStage.splitSupply(15)
            .title("Twin-T notch (fallback drawing)")
            .input("IN", 0)
            .r("R1", 10e3, "IN", "A")
            .r("R2", 10e3, "A", "POS")
            .c("C3", 20e-9, "A", "GND")
            .c("C1", 10e-9, "IN", "B")
            .c("C2", 10e-9, "B", "POS")
            .r("R3", 5e3, "B", "GND")
            .r("R4", 10e3, "POS", "GND")
            .amp(
                "U1A",
                "U1",
                PackageType.DUAL_8,
                "A",
                DeviceClass.CLASSIC_BIPOLAR,
                "POS",
                "OUT",
                "OUT",
                "VCC",
                "VEE")
            .build());
    // Two cascaded sections with a feedback part from the second output back to the first input.
    all.put(
        "fallback-loop",
        TestStage.splitSupply(15)
            .title("Two sections in a loop (fallback drawing)")
            .input("IN", 0)
            .r("R1", 10e3, "IN", "SUMA")
            .r("R2", 10e3, "SUMA", "OA")
            .r("R3", 10e3, "OA", "SUMB")
            .r("R4", 22e3, "SUMB", "OUT")
            .r("R5", 100e3, "OUT", "SUMA")
            .amp(
                "U1A",
                "U1",
                PackageType.DUAL_8,
                "A",
                DeviceClass.CLASSIC_BIPOLAR,
                "GND",
                "SUMA",
                "OA",
                "VCC",
                "VEE")
            .amp(
                "U1B",
                "U1",
                PackageType.DUAL_8,
                "B",
                DeviceClass.CLASSIC_BIPOLAR,
                "GND",
                "SUMB",
                "OUT",
                "VCC",
                "VEE")
            .build());
    return all;
  }

  /**
   * Returns every stage template with its default values, the variants the templates offer (summing
   * with 2 and 4 inputs, integrator without R2, differentiator without R1), the stage sheets of the
   * demo library and the fallbacks.
   */
  static Map<String, Stage> all() {
    Map<String, Stage> all = new LinkedHashMap<>();
    for (StageTemplate template : Templates.all()) {
      all.put("template-" + template.name(), template.build());
    }
    all.put("template-summing-2", Templates.named("summing").build(Map.of("inputs", "2")));
    all.put("template-summing-4", Templates.named("summing").build(Map.of("inputs", "4")));
    all.put("template-integrator-no-r2", Templates.named("integrator").build(Map.of("r2", "none")));
    all.put(
        "template-differentiator-no-r1",
        Templates.named("differentiator").build(Map.of("r1", "none")));
    try (Stream<Path> files = Files.list(Path.of("data", "stages"))) {
      for (Path file :
          files.filter(f -> f.toString().endsWith(StageSheet.SUFFIX)).sorted().toList()) {
        String name = file.getFileName().toString().replace(StageSheet.SUFFIX, "");
        all.put("library-" + name, StageSheet.read(file));
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    all.putAll(fallbacks());
    return all;
  }
}
