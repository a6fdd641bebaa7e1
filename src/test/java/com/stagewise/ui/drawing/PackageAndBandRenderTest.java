package com.stagewise.ui.drawing;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.PackageType;
import java.awt.image.BufferedImage;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;
import javafx.event.Event;
import javafx.scene.Node;
import javafx.scene.input.MouseButton;
import javafx.scene.input.MouseEvent;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/** Renders the package drawing and the band chart headless and checks what came out. */
class PackageAndBandRenderTest {

  @ParameterizedTest
  @EnumSource(PackageType.class)
  void packageDrawing_rendersEveryPinAndReportsTheChosenOne(PackageType type) {
    AtomicInteger chosen = new AtomicInteger();
    BufferedImage image =
        Fx.call(
            () -> {
              PackageDrawing drawing = new PackageDrawing();
              drawing.show(type, "U1", Map.of());
              drawing.highlight(type == PackageType.QUAD_14 ? 9 : 6);
              drawing.setPinText(type == PackageType.QUAD_14 ? 9 : 6, "SUM  +0.02 V");
              drawing.setPinText(1, "OUT");
              drawing.setOnPinChosen(chosen::set);
              BufferedImage shot = Fx.render(drawing, 640, 560);
              for (int pin = 1; pin <= type.pinCount(); pin++) {
                assertThat(drawing.lookup("#pin-" + pin)).as("pin %d", pin).isNotNull();
              }
              click(drawing.lookup("#pin-3"));
              return shot;
            });
    assertThat(image.getWidth()).isEqualTo(640);
    assertThat(image.getHeight()).isEqualTo(560);
    assertThat(Fx.colours(image)).isGreaterThan(5);
    assertThat(Fx.inked(image)).isBetween(0.05, 0.9);
    assertThat(chosen.get()).isEqualTo(3);
    Fx.keep(image, "package-" + type.word());
  }

  @ParameterizedTest
  @EnumSource(PackageType.class)
  void packageDrawing_inANarrowPanel_keepsFingerSizedPins(PackageType type) {
    double height = type.pinCount() == 14 ? 470 : 320;
    BufferedImage image =
        Fx.call(
            () -> {
              PackageDrawing drawing = new PackageDrawing();
              drawing.show(type, "U2", Map.of());
              drawing.highlight(2);
              drawing.setPinText(2, "FB  \u22120.003 V measured");
              BufferedImage shot = Fx.render(drawing, 370, height);
              for (int pin = 1; pin <= type.pinCount(); pin++) {
                Node node = drawing.lookup("#pin-" + pin);
                var pad = ((javafx.scene.Group) node).getChildren().get(0);
                var bounds = pad.localToScene(pad.getBoundsInLocal());
                // Stroke included, so a 48 px pad measures a little more.
                assertThat(bounds.getWidth()).as("pin %d width", pin).isGreaterThanOrEqualTo(48);
                assertThat(bounds.getHeight()).as("pin %d height", pin).isGreaterThanOrEqualTo(48);
                assertThat(bounds.getMinX()).isGreaterThanOrEqualTo(0);
                assertThat(bounds.getMaxX()).isLessThanOrEqualTo(370);
              }
              return shot;
            });
    assertThat(Fx.colours(image)).isGreaterThan(5);
    Fx.keep(image, "package-narrow-" + type.word());
  }

  @Test
  void bandChart_rendersReadingOutsideBandWithSuspects() {
    BufferedImage image =
        Fx.call(
            () -> {
              BandChart chart = new BandChart();
              chart.show(
                  "U1.7 (OUT)",
                  -4.84,
                  -4.56,
                  13.41,
                  List.of(
                      new BandChart.Marker("R2 open", 13.5),
                      new BandChart.Marker("U1B stuck high", 13.45),
                      new BandChart.Marker("R1 short", -13.5),
                      new BandChart.Marker("healthy", -4.7)));
              BufferedImage shot = Fx.render(chart, 560, 140);
              assertThat(chart.lookup("#measured-marker")).isNotNull();
              assertThat(chart.lookup("#healthy-band")).isNotNull();
              assertThat(chart.lookup("#no-reading")).isNull();
              return shot;
            });
    assertThat(image.getWidth()).isEqualTo(560);
    assertThat(Fx.colours(image)).isGreaterThan(5);
    Fx.keep(image, "band-outside");
  }

  @Test
  void bandChart_withoutReading_saysSo() {
    BufferedImage image =
        Fx.call(
            () -> {
              BandChart chart = new BandChart();
              chart.show(
                  "SUM", 0.0, 0.0, Double.NaN, List.of(new BandChart.Marker("R3 open", 0.9)));
              BufferedImage shot = Fx.render(chart, 560, 140);
              assertThat(chart.lookup("#no-reading")).isNotNull();
              assertThat(chart.lookup("#measured-marker")).isNull();
              assertThat(chart.lookup("#healthy-band")).isNotNull();
              return shot;
            });
    assertThat(Fx.inked(image)).isGreaterThan(0.01);
    Fx.keep(image, "band-no-reading");
  }

  @Test
  void bandChart_readingInsideBand() {
    BufferedImage image =
        Fx.call(
            () -> {
              BandChart chart = new BandChart();
              chart.show("U1.1", 2.41, 2.59, 2.47, List.of(new BandChart.Marker("R5 low", 2.3)));
              return Fx.render(chart, 560, 140);
            });
    assertThat(Fx.colours(image)).isGreaterThan(5);
    Fx.keep(image, "band-inside");
  }

  private static void click(Node node) {
    var bounds = node.localToScene(node.getBoundsInLocal());
    double x = bounds.getCenterX();
    double y = bounds.getCenterY();
    Event.fireEvent(
        node,
        new MouseEvent(
            MouseEvent.MOUSE_CLICKED,
            x,
            y,
            x,
            y,
            MouseButton.PRIMARY,
            1,
            false,
            false,
            false,
            false,
            true,
            false,
            false,
            true,
            false,
            true,
            null));
  }

  @Test
  void packageDrawing_readingValuesBesidePins_areNeverCutShort() {
    // Regression: in the readings screen's panel (about 352 px of room) a pin's reading such as
    // "−13.47 V" was drawn as "−13.4…". The text column now widens for it, the pins still 48 px.
    List<String> shown =
        Fx.call(
            () -> {
              PackageDrawing drawing = new PackageDrawing();
              drawing.show(PackageType.DUAL_8, "U1", Map.of());
              drawing.setPinText(1, "\u221213.47\u00a0V");
              drawing.setPinText(4, "\u221214.97\u00a0V");
              drawing.setPinText(8, "14.96\u00a0V");
              drawing.highlight(1);
              Fx.render(drawing, 352, 280);
              List<String> texts = new java.util.ArrayList<>();
              collect(drawing, texts);
              Node pad = ((javafx.scene.Group) drawing.lookup("#pin-1")).getChildren().get(0);
              assertThat(pad.localToScene(pad.getBoundsInLocal()).getWidth())
                  .isGreaterThanOrEqualTo(48);
              return texts;
            });
    assertThat(shown).contains("\u221213.47\u00a0V", "\u221214.97\u00a0V", "14.96\u00a0V");
    assertThat(shown).noneMatch(t -> t.endsWith("\u2026"));
  }

  @Test
  void packageDrawing_inALowColumn_keepsReadingValuesWhole() {
    // Regression: in the readings screen's probe column at 1024x600 and 1280x800 (332 x 200 px of
    // room, too low for 48 px pins at any column width) the readings on pins 1 and 4 were drawn
    // as "−13.4…" and "−14.9…": the columns were narrowed for pins that the height shrank anyway.
    // The texts are set after the package is shown, as the readings screen does.
    List<String> shown =
        Fx.call(
            () -> {
              PackageDrawing drawing = new PackageDrawing();
              drawing.show(PackageType.DUAL_8, "U1", Map.of());
              Fx.render(drawing, 332, 200);
              drawing.setPinText(1, "\u221213.47\u00a0V");
              drawing.setPinText(2, "1.000\u00a0V");
              drawing.setPinText(4, "\u221214.97\u00a0V");
              drawing.setPinText(8, "14.96\u00a0V");
              drawing.highlight(1);
              Fx.render(drawing, 332, 200);
              List<String> texts = new java.util.ArrayList<>();
              collect(drawing, texts);
              return texts;
            });
    assertThat(shown)
        .contains("\u221213.47\u00a0V", "\u221214.97\u00a0V", "14.96\u00a0V", "1.000\u00a0V");
    assertThat(shown).noneMatch(t -> t.contains("\u2026"));
  }

  @Test
  void bandChart_ohms_onALogAxisWithOverRange() {
    // 47 kΩ ±1 % healthy (R2 alone, series–parallel rules), the meter showing OL, an open R2
    // predicting OL: the axis holds decades of ohms and an OL zone.
    List<String> shown =
        Fx.call(
            () -> {
              BandChart chart = new BandChart();
              chart.showOhms(
                  "SUM to OUT",
                  46_530,
                  47_470,
                  Double.POSITIVE_INFINITY,
                  List.of(
                      new BandChart.Marker("R2 open", Double.POSITIVE_INFINITY),
                      new BandChart.Marker("R1 shorted", 47_000)));
              Fx.render(chart, 560, 150);
              assertThat(chart.lookup("#healthy-band")).isNotNull();
              assertThat(chart.showsOhms()).isTrue();
              List<String> texts = new java.util.ArrayList<>();
              collect(chart, texts);
              return texts;
            });
    assertThat(shown)
        .contains("healthy 46.5\u00a0kΩ to 47.5\u00a0kΩ", "OL  outside", "OL", "R2 open")
        .anyMatch(t -> t.endsWith("kΩ") && !t.startsWith("healthy"));
  }

  private static void collect(javafx.scene.Parent parent, List<String> texts) {
    for (Node n : parent.getChildrenUnmodifiable()) {
      if (n instanceof javafx.scene.text.Text t) {
        texts.add(t.getText());
      } else if (n instanceof javafx.scene.Parent p) {
        collect(p, texts);
      }
    }
  }
}
