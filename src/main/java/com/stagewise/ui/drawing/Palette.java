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
  static final Color PAPER = Color.web("#fbfaf6");
  static final Color INK = Color.web("#1c2128");
  static final Color SOFT_INK = Color.web("#5b6470");
  static final Color GRID = Color.web("#d9dde3");
  static final Color PART_FILL = Color.web("#ffffff");
  static final Color AMP_FILL = Color.web("#eef3f8");
  static final Color EXPECTED = Color.web("#0b57b8");
  static final Color SECOND = Color.web("#a1277f");
  static final Color MEASURED = Color.web("#111111");
  static final Color MEASURED_FILL = Color.web("#ffd76a");
  static final Color HIGHLIGHT = Color.web("#ffb300");
  static final Color HIGHLIGHT_RING = Color.web("#c45100");
  static final Color BAND = Color.web("#bfe3c8");
  static final Color BAND_EDGE = Color.web("#2e7d4a");
  static final Color OUTSIDE = Color.web("#b3261e");
  static final Color PIN_FILL = Color.web("#c9ced6");
  static final Color BODY = Color.web("#2b3038");

  private Palette() {}

  /** Gives a drawing the paper colour and clips whatever it draws to its own bounds. */
  static void paperAndClip(javafx.scene.layout.Region region) {
    region.setBackground(
        new javafx.scene.layout.Background(
            new javafx.scene.layout.BackgroundFill(
                PAPER, javafx.scene.layout.CornerRadii.EMPTY, javafx.geometry.Insets.EMPTY)));
    javafx.scene.shape.Rectangle clip = new javafx.scene.shape.Rectangle();
    clip.widthProperty().bind(region.widthProperty());
    clip.heightProperty().bind(region.heightProperty());
    region.setClip(clip);
  }

  static Font font(double size) {
    return Font.font("System", FontWeight.NORMAL, size);
  }

  static Font bold(double size) {
    return Font.font("System", FontWeight.BOLD, size);
  }
}
