package com.stagewise.ui.drawing;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.StageSheet;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

/**
 * The stages the drawing tests render: every stage template, the demo library, and a few topologies
 * no template builds (built in code here) for the fallback drawing.
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

  private TestCircuits amp(
      String section, PackageType type, String inPlus, String inMinus, String out) {
    String vMinus = rails.size() > 1 ? "VEE" : "GND";
    amps.add(
        new Amplifier(
            "U1" + section,
            "U1",
            type,
            section,
            DeviceClass.CLASSIC_BIPOLAR,
            inPlus,
            inMinus,
            out,
            "VCC",
            vMinus));
    return this;
  }

  private TestCircuits u1(String inPlus, String inMinus, String out) {
    return amp("A", PackageType.DUAL_8, inPlus, inMinus, out);
  }

  private Stage build() {
    return new Stage(title, "", "GND", rails, inputs, parts, amps);
  }

  /** Returns the stages no template builds, to exercise the fallback drawing. */
  static Map<String, Stage> fallbacks() {
    Map<String, Stage> all = new LinkedHashMap<>();
    // A twin-T notch, whose loop of parts fits no role and must still be drawn.
    all.put(
        "fallback-twin-t",
        new TestCircuits("Twin-T notch (fallback drawing)", true)
            .in("IN", 0)
            .r("R1", 10e3, "IN", "A")
            .r("R2", 10e3, "A", "POS")
            .c("C3", 20e-9, "A", "GND")
            .c("C1", 10e-9, "IN", "B")
            .c("C2", 10e-9, "B", "POS")
            .r("R3", 5e3, "B", "GND")
            .r("R4", 10e3, "POS", "GND")
            .u1("POS", "OUT", "OUT")
            .build());
    // Two cascaded sections with a feedback part from the second output back to the first input.
    all.put(
        "fallback-loop",
        new TestCircuits("Two sections in a loop (fallback drawing)", true)
            .in("IN", 0)
            .r("R1", 10e3, "IN", "SUMA")
            .r("R2", 10e3, "SUMA", "OA")
            .r("R3", 10e3, "OA", "SUMB")
            .r("R4", 22e3, "SUMB", "OUT")
            .r("R5", 100e3, "OUT", "SUMA")
            .amp("A", PackageType.DUAL_8, "GND", "SUMA", "OA")
            .amp("B", PackageType.DUAL_8, "GND", "SUMB", "OUT")
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
