package com.stagewise.ui.drawing;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Map;
import javafx.application.Platform;
import javafx.scene.layout.BackgroundFill;
import javafx.scene.paint.Color;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The high-contrast setting reaches the drawings, and every colour that carries text or a value
 * stands out from the paper by the contrast ratios of WCAG 2.1 (W3C Recommendation, success
 * criteria 1.4.3 and 1.4.6: relative luminance and contrast ratio as defined there): at least 4.5:1
 * in the ordinary colours (level AA for normal text) and at least 7:1 in the high-contrast ones
 * (level AAA), for a dim bench.
 */
class DrawingLookTest {
  @BeforeAll
  static void toolkit() {
    try {
      Platform.startup(() -> {});
    } catch (IllegalStateException alreadyRunning) {
      // Another test class started the toolkit first.
    }
  }

  @AfterEach
  void ordinaryAgain() throws Exception {
    onFx(() -> DrawingLook.highContrast().set(false));
  }

  @Test
  void textColours_standOutFromThePaper_byTheWcagRatios() throws Exception {
    onFx(() -> DrawingLook.highContrast().set(false));
    assertThat(worstRatio()).as("ordinary colours, WCAG AA").isGreaterThanOrEqualTo(4.5);
    onFx(() -> DrawingLook.highContrast().set(true));
    assertThat(worstRatio()).as("high-contrast colours, WCAG AAA").isGreaterThanOrEqualTo(7.0);
  }

  @Test
  void switchingToHighContrast_repaintsADrawingAlreadyShown() throws Exception {
    BandChart[] chart = new BandChart[1];
    onFx(
        () -> {
          chart[0] = new BandChart();
          chart[0].resize(400, 160);
          chart[0].show("Net OUT", -4.75, -4.65, -13.47, List.of());
          chart[0].layout();
        });
    Color before = paper(chart[0]);
    onFx(
        () -> {
          DrawingLook.highContrast().set(true);
          chart[0].layout();
        });
    Color after = paper(chart[0]);
    assertThat(before).isEqualTo(Color.web("#fbfaf6"));
    assertThat(after).isEqualTo(Color.WHITE);
    // The chart's own drawing is repainted too: its paper and its axis in the new colours.
    List<javafx.scene.Node> drawn = chart[0].getChildrenUnmodifiable();
    assertThat(((javafx.scene.shape.Rectangle) drawn.get(0)).getFill()).isEqualTo(Color.WHITE);
    assertThat(drawn)
        .filteredOn(n -> n instanceof javafx.scene.shape.Line)
        .first()
        .extracting(n -> ((javafx.scene.shape.Line) n).getStroke())
        .isEqualTo(Color.web("#1c2128"));
  }

  private static double worstRatio() {
    Map<String, Color> text =
        Map.of(
            "ink", Palette.INK,
            "soft ink", Palette.SOFT_INK,
            "expected", Palette.EXPECTED,
            "a suspect's prediction", Palette.SECOND,
            "healthy band's edge", Palette.BAND_EDGE,
            "outside", Palette.OUTSIDE);
    return text.values().stream().mapToDouble(c -> ratio(c, Palette.PAPER)).min().orElseThrow();
  }

  /** WCAG 2.1 contrast ratio: (L1 + 0.05) / (L2 + 0.05), L the relative luminance. */
  private static double ratio(Color a, Color b) {
    double la = luminance(a);
    double lb = luminance(b);
    return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
  }

  private static double luminance(Color c) {
    return 0.2126 * linear(c.getRed())
        + 0.7152 * linear(c.getGreen())
        + 0.0722 * linear(c.getBlue());
  }

  private static double linear(double channel) {
    return channel <= 0.03928 ? channel / 12.92 : Math.pow((channel + 0.055) / 1.055, 2.4);
  }

  private static Color paper(BandChart chart) throws Exception {
    Color[] colour = new Color[1];
    onFx(
        () -> {
          BackgroundFill fill = chart.getBackground().getFills().get(0);
          colour[0] = (Color) fill.getFill();
        });
    return colour[0];
  }

  private static void onFx(Runnable work) throws Exception {
    java.util.concurrent.CompletableFuture<Void> done =
        new java.util.concurrent.CompletableFuture<>();
    Platform.runLater(
        () -> {
          try {
            work.run();
            done.complete(null);
          } catch (RuntimeException | Error e) {
            done.completeExceptionally(e);
          }
        });
    done.get(30, java.util.concurrent.TimeUnit.SECONDS);
  }
}
