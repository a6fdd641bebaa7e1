package com.stagewise.ui.drawing;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Stage;
import java.awt.image.BufferedImage;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Renders the schematic of every stage topology headless at the bench app's screen size. */
class SchematicRenderTest {

  static Stream<Arguments> stages() {
    return TestCircuits.all().entrySet().stream().map(e -> Arguments.of(e.getKey(), e.getValue()));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("stages")
  void rendersWithLabelsForEveryNet(String name, Stage stage) {
    Map<String, String> expected = new LinkedHashMap<>();
    Map<String, String> suspect = new LinkedHashMap<>();
    Map<String, String> measured = new LinkedHashMap<>();
    int i = 0;
    for (String net : stage.nets()) {
      if (net.equals(stage.ground())) {
        continue;
      }
      double volts = stage.drivenVolts().getOrDefault(net, -4.7 + i);
      expected.put(net, com.stagewise.circuit.value.Engineering.volts(volts));
      if (!stage.isDriven(net)) {
        suspect.put(net, com.stagewise.circuit.value.Engineering.volts(13.5 - i));
        if (i % 2 == 0) {
          measured.put(net, com.stagewise.circuit.value.Engineering.volts(13.41 - i));
        }
      }
      i++;
    }
    SchematicDrawing[] holder = new SchematicDrawing[1];
    BufferedImage image =
        Fx.call(
            () -> {
              SchematicDrawing drawing = new SchematicDrawing();
              holder[0] = drawing;
              drawing.show(stage);
              drawing.setNetLabels(expected);
              drawing.setSecondLabels(suspect, "if R2 open");
              drawing.setMeasured(measured);
              BufferedImage shot = Fx.render(drawing, 1100, 620);
              for (var part : stage.parts()) {
                assertThat(drawing.lookup("#part-" + part.ref())).as(part.ref()).isNotNull();
              }
              for (String net : expected.keySet()) {
                assertThat(drawing.lookup("#label-" + net)).as("label of %s", net).isNotNull();
              }
              return shot;
            });
    assertThat(image.getWidth()).isEqualTo(1100);
    assertThat(image.getHeight()).isEqualTo(620);
    assertThat(Fx.inked(image)).isBetween(0.02, 0.6);
    assertThat(Fx.colours(image)).isGreaterThan(8);
    Fx.keep(image, "schematic-" + name);
  }
}
