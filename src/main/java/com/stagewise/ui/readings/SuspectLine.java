package com.stagewise.ui.readings;

import javafx.geometry.Orientation;
import javafx.scene.Node;
import javafx.scene.control.Label;
import javafx.scene.layout.Region;
import javafx.scene.text.Text;

/**
 * One suspect's line on the readings screen: its name on the left and its probability (a bar and
 * the percentage) on the right; where the column leaves the name too little room for one line
 * beside the bar (larger text, a narrow column), the bar goes under the name instead, which then
 * has the whole width to wrap in, so that no word of a fault's name is broken or cut.
 */
final class SuspectLine extends Region {
  private static final double GAP = 10;
  private static final double UNDER = 2;
  private final Label name;
  private final Node gauge;

  SuspectLine(Label name, Node gauge) {
    this.name = name;
    this.gauge = gauge;
    getStyleClass().add("suspect-line");
    getChildren().addAll(name, gauge);
  }

  @Override
  public Orientation getContentBias() {
    return Orientation.HORIZONTAL;
  }

  /** Whether the name fits on one line beside the gauge in a line this wide. */
  private boolean sideBySide(double inner) {
    return inner - gauge.prefWidth(-1) - GAP >= Math.ceil(name.prefWidth(-1));
  }

  /** Returns the width of the name's longest word in its font, with the label's own insets. */
  private double longestWord() {
    double widest = 0;
    String text = name.getText() == null ? "" : name.getText();
    for (String word : text.split("\\s+")) {
      Text measured = new Text(word);
      measured.setFont(name.getFont());
      widest = Math.max(widest, measured.getLayoutBounds().getWidth());
    }
    return Math.ceil(widest) + name.snappedLeftInset() + name.snappedRightInset() + 1;
  }

  private double insetsWidth() {
    return snappedLeftInset() + snappedRightInset();
  }

  private double insetsHeight() {
    return snappedTopInset() + snappedBottomInset();
  }

  @Override
  protected double computeMinWidth(double height) {
    return insetsWidth() + Math.max(longestWord(), gauge.prefWidth(-1));
  }

  @Override
  protected double computePrefWidth(double height) {
    return insetsWidth() + name.prefWidth(-1) + GAP + gauge.prefWidth(-1);
  }

  @Override
  protected double computeMinHeight(double width) {
    return computePrefHeight(width);
  }

  @Override
  protected double computePrefHeight(double width) {
    double gaugeHeight = gauge.prefHeight(-1);
    if (width < 0) {
      return insetsHeight() + Math.max(name.prefHeight(-1), gaugeHeight);
    }
    double inner = width - insetsWidth();
    if (sideBySide(inner)) {
      double nameWidth = inner - gauge.prefWidth(-1) - GAP;
      return insetsHeight() + Math.max(name.prefHeight(nameWidth), gaugeHeight);
    }
    return insetsHeight() + name.prefHeight(inner) + UNDER + gaugeHeight;
  }

  @Override
  protected void layoutChildren() {
    double x = snappedLeftInset();
    double y = snappedTopInset();
    double inner = getWidth() - insetsWidth();
    double gaugeWidth = gauge.prefWidth(-1);
    double gaugeHeight = gauge.prefHeight(-1);
    if (sideBySide(inner)) {
      double nameWidth = inner - gaugeWidth - GAP;
      double nameHeight = name.prefHeight(nameWidth);
      double row = Math.max(nameHeight, gaugeHeight);
      name.resizeRelocate(x, y + (row - nameHeight) / 2, nameWidth, nameHeight);
      gauge.resizeRelocate(
          x + inner - gaugeWidth, y + (row - gaugeHeight) / 2, gaugeWidth, gaugeHeight);
    } else {
      double nameHeight = name.prefHeight(inner);
      name.resizeRelocate(x, y, inner, nameHeight);
      gauge.resizeRelocate(x + inner - gaugeWidth, y + nameHeight + UNDER, gaugeWidth, gaugeHeight);
    }
  }
}
