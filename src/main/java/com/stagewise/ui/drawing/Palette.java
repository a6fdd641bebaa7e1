package com.stagewise.ui.drawing;

import javafx.scene.paint.Color;
import javafx.scene.text.Font;
import javafx.scene.text.FontWeight;

/**
 * The colours and fonts of the drawings: dark ink on a warm light ground, high contrast, with one
 * colour per kind of value (expected, a suspect's prediction, measured) that stays distinct for the
 * common forms of colour blindness (blue, magenta, black on amber).
 */
final class Palette {
  // Set by use(): the ordinary colours, or the darker ones of the high-contrast setting. Read at
  // each redraw, on the JavaFX thread only.
  static Color PAPER;
  static Color INK;
  static Color SOFT_INK;
  static Color GRID;
  static Color PART_FILL;
  static Color AMP_FILL;
  static Color EXPECTED;
  static Color SECOND;
  static Color MEASURED;
  static Color MEASURED_FILL;
  static Color HIGHLIGHT;
  static Color HIGHLIGHT_RING;
  static Color BAND;
  static Color BAND_EDGE;
  static Color OUTSIDE;
  static Color PIN_FILL;
  static Color BODY;

  static {
    use(false);
  }

  /**
   * Takes the ordinary colours, or for a dim bench the high-contrast ones: white paper, black ink,
   * each kind of value a darker shade of its own colour (the same hues, so the meaning stays).
   */
  static void use(boolean highContrast) {
    PAPER = Color.web(highContrast ? "#ffffff" : "#fbfaf6");
    INK = Color.web(highContrast ? "#000000" : "#1c2128");
    SOFT_INK = Color.web(highContrast ? "#1c2128" : "#5b6470");
    GRID = Color.web(highContrast ? "#8a9099" : "#d9dde3");
    PART_FILL = Color.web("#ffffff");
    AMP_FILL = Color.web(highContrast ? "#ffffff" : "#eef3f8");
    EXPECTED = Color.web(highContrast ? "#003c85" : "#0b57b8");
    SECOND = Color.web(highContrast ? "#6e0052" : "#a1277f");
    MEASURED = Color.web(highContrast ? "#000000" : "#111111");
    MEASURED_FILL = Color.web("#ffd76a");
    HIGHLIGHT = Color.web("#ffb300");
    HIGHLIGHT_RING = Color.web(highContrast ? "#8a3700" : "#c45100");
    BAND = Color.web(highContrast ? "#9fd8ae" : "#bfe3c8");
    BAND_EDGE = Color.web(highContrast ? "#0d4d24" : "#2e7d4a");
    OUTSIDE = Color.web(highContrast ? "#7d0f0a" : "#b3261e");
    PIN_FILL = Color.web(highContrast ? "#aab1bb" : "#c9ced6");
    BODY = Color.web(highContrast ? "#000000" : "#2b3038");
  }

  private Palette() {}

  /**
   * Gives a drawing the paper colour, clips whatever it draws to its own bounds, and repaints it
   * with {@code redraw} whenever the high-contrast setting changes ({@link DrawingLook}).
   */
  static void paperAndClip(javafx.scene.layout.Region region, Runnable redraw) {
    paper(region);
    javafx.scene.shape.Rectangle clip = new javafx.scene.shape.Rectangle();
    clip.widthProperty().bind(region.widthProperty());
    clip.heightProperty().bind(region.heightProperty());
    region.setClip(clip);
    javafx.beans.value.ChangeListener<Boolean> follow =
        (o, was, on) -> {
          paper(region);
          redraw.run();
        };
    // Held by the drawing itself, so that a drawing no longer shown can go (weak listener).
    region.getProperties().put(Palette.class, follow);
    DrawingLook.highContrast().addListener(new javafx.beans.value.WeakChangeListener<>(follow));
  }

  private static void paper(javafx.scene.layout.Region region) {
    region.setBackground(
        new javafx.scene.layout.Background(
            new javafx.scene.layout.BackgroundFill(
                PAPER, javafx.scene.layout.CornerRadii.EMPTY, javafx.geometry.Insets.EMPTY)));
  }

  static Font font(double size) {
    return Font.font("System", FontWeight.NORMAL, size);
  }

  static Font bold(double size) {
    return Font.font("System", FontWeight.BOLD, size);
  }
}
