package com.stagewise.ui.drawing;

import com.stagewise.circuit.BandFit;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.value.Engineering;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import javafx.geometry.VPos;
import javafx.scene.layout.Region;
import javafx.scene.paint.Color;
import javafx.scene.shape.Line;
import javafx.scene.shape.Polygon;
import javafx.scene.shape.Rectangle;
import javafx.scene.text.Font;
import javafx.scene.text.Text;

/**
 * A compact horizontal chart of volts at one test point, or of ohms between two points (power off):
 * the healthy band, a large marker for the measured value and small markers where the top suspects
 * would put the reading. Values outside the band stretch the axis; a band of zero width shows as a
 * thin bar; a missing (NaN) reading shows "no reading". Ohms go on a logarithmic axis with a zone
 * for OL (+∞, the meter's over-range) at its right end. AC amplitudes go on their own axis from 0
 * V, each figure stated in the reading's measure ("0.332 V RMS").
 */
public final class BandChart extends Region {
  private static final double SIDE = 22;
  private static final double AXIS_Y = 74;
  private static final double BAND_HALF = 11;
  private static final double ROW = 17;

  private String testPoint = "";
  private double healthyLow = Double.NaN;
  private double healthyHigh = Double.NaN;
  private double measured = Double.NaN;
  private List<Marker> markers = List.of();
  private int labelRowCount = 1;
  private boolean ohms;
  // The measure of an AC chart in words ("RMS"); empty for volts DC and ohms.
  private String acMeasure = "";

  /**
   * Where a suspect would put the reading: its label (e.g. "R2 open") and the volts (or ohms, +∞
   * for OL).
   */
  public record Marker(String label, double volts) {
    /** Checks the label; the volts may be any number (a non-finite one is not drawn). */
    public Marker {
      Objects.requireNonNull(label, "label");
    }
  }

  /** Creates an empty chart; {@link #show} fills it. */
  public BandChart() {
    getStyleClass().add("band-chart");
    Palette.paperAndClip(this, this::requestLayout);
    setMinHeight(130);
  }

  /**
   * Shows the chart for one test point: the healthy band from {@code healthyLow} to {@code
   * healthyHigh} volts (either order), the measured volts (NaN when there is no reading yet) and
   * the suspects' markers.
   */
  public void show(
      String testPoint,
      double healthyLow,
      double healthyHigh,
      double measured,
      List<Marker> markers) {
    ohms = false;
    acMeasure = "";
    fill(testPoint, healthyLow, healthyHigh, measured, markers);
  }

  /**
   * Shows the chart for an AC reading: the healthy band, the reading and the suspects' markers as
   * amplitudes in one measure (volts, never below 0), on an axis that never reaches below 0 V.
   *
   * @param measureWords the measure in words, e.g. "RMS", "peak", "peak-to-peak"
   */
  public void showAc(
      String testPoint,
      double healthyLow,
      double healthyHigh,
      double measured,
      List<Marker> markers,
      String measureWords) {
    ohms = false;
    acMeasure = Objects.requireNonNull(measureWords, "measureWords");
    fill(testPoint, healthyLow, healthyHigh, measured, markers);
  }

  /** Returns the measure of an AC chart in words ("RMS"); empty for DC volts and ohms. */
  public String acMeasure() {
    return acMeasure;
  }

  /**
   * Shows the chart for an ohms reading between two points on a logarithmic axis: the healthy range
   * in ohms (both +∞ when a healthy stage reads OL there), the reading (+∞ for OL, NaN for none)
   * and the suspects' markers (+∞ for OL).
   */
  public void showOhms(
      String pair, double healthyLow, double healthyHigh, double measured, List<Marker> markers) {
    ohms = true;
    acMeasure = "";
    fill(pair, healthyLow, healthyHigh, measured, markers);
  }

  /** Returns whether the chart shows ohms (on its logarithmic axis). */
  public boolean showsOhms() {
    return ohms;
  }

  private void fill(
      String testPoint,
      double healthyLow,
      double healthyHigh,
      double measured,
      List<Marker> markers) {
    this.testPoint = testPoint == null ? "" : testPoint;
    this.healthyLow = Math.min(healthyLow, healthyHigh);
    this.healthyHigh = Math.max(healthyLow, healthyHigh);
    if (Double.isNaN(healthyLow) || Double.isNaN(healthyHigh)) {
      this.healthyLow = healthyLow;
      this.healthyHigh = healthyHigh;
    }
    this.measured = measured;
    this.markers = markers == null ? List.of() : List.copyOf(markers);
    requestLayout();
    redraw(Math.max(getWidth(), computePrefWidth(-1)));
  }

  @Override
  protected double computePrefWidth(double height) {
    return 560;
  }

  @Override
  protected double computePrefHeight(double width) {
    return AXIS_Y + BAND_HALF + 12 + labelRowCount * ROW + 22;
  }

  @Override
  protected void layoutChildren() {
    redraw(getWidth());
  }

  private void redraw(double width) {
    getChildren().clear();
    if (width <= 2 * SIDE) {
      return;
    }
    double length = width - 2 * SIDE;
    List<Double> marks = markers.stream().map(Marker::volts).toList();
    ChartAxis scale =
        ohms
            ? OhmsScale.fit(healthyLow, healthyHigh, measured, marks)
            : acMeasure.isEmpty()
                ? BandScale.fit(healthyLow, healthyHigh, measured, marks)
                : BandScale.fitAmplitude(healthyLow, healthyHigh, measured, marks);
    Rectangle paper = new Rectangle(width, computePrefHeight(width), Palette.PAPER);
    getChildren().add(paper);

    Text title = text(testPoint, Palette.bold(18), Palette.INK);
    title.setX(SIDE);
    title.setY(12);
    boolean haveBand =
        ohms
            ? !Double.isNaN(healthyLow) && !Double.isNaN(healthyHigh)
            : Double.isFinite(healthyLow) && Double.isFinite(healthyHigh);
    Text range =
        text(
            haveBand ? "healthy " + bandText() : "healthy band unknown",
            Palette.font(15),
            Palette.BAND_EDGE.darker());
    if (range.getLayoutBounds().getWidth() > width - 4) {
      // A narrow card (a 1024 px window): the words in a smaller size rather than cut.
      range.setFont(Palette.font(12));
    }
    range.setX(Math.max(2, width - SIDE - range.getLayoutBounds().getWidth()));
    range.setY(12);
    getChildren().add(range);
    // The card's own line names the point: the chart's title gives way rather than overlap.
    if (title.getLayoutBounds().getWidth() + 16 <= range.getX() - SIDE) {
      getChildren().add(title);
    }

    Line axis = new Line(SIDE, AXIS_Y, SIDE + length, AXIS_Y);
    axis.setStroke(Palette.SOFT_INK);
    axis.setStrokeWidth(1.5);
    getChildren().add(axis);
    if (haveBand) {
      double x1 = SIDE + scale.position(healthyLow, length);
      double x2 = SIDE + scale.position(healthyHigh, length);
      // A band of zero width still shows: at least 4 px wide, centred on its value.
      double w = Math.max(4, x2 - x1);
      Rectangle band = new Rectangle((x1 + x2) / 2 - w / 2, AXIS_Y - BAND_HALF, w, 2 * BAND_HALF);
      band.setFill(Palette.BAND);
      band.setStroke(Palette.BAND_EDGE);
      band.setStrokeWidth(1.5);
      band.setId("healthy-band");
      getChildren().add(band);
    }

    drawMarkers(scale, length);
    double tickBaseline = AXIS_Y + BAND_HALF + 12 + labelRowCount * ROW + 10;
    for (double tick : scale.ticks(ohms ? (int) Math.max(3, length / 70) : 6)) {
      double x = SIDE + scale.position(tick, length);
      Line mark = new Line(x, AXIS_Y - 4, x, AXIS_Y + 4);
      mark.setStroke(Palette.SOFT_INK);
      getChildren().add(mark);
      // Tick values go below the suspects' labels, when the chart is tall enough for them.
      if (getHeight() <= 0 || tickBaseline + 6 <= getHeight()) {
        Text label = text(scale.tickText(tick), Palette.font(12), Palette.SOFT_INK);
        label.setX(x - label.getLayoutBounds().getWidth() / 2);
        label.setY(tickBaseline);
        getChildren().add(label);
      }
    }

    paper.setHeight(computePrefHeight(width));
    drawMeasured(scale, length, width);
  }

  private String bandText() {
    if (!ohms) {
      return Engineering.band(healthyLow, healthyHigh) + measureSuffix();
    }
    if (healthyLow == Double.POSITIVE_INFINITY) {
      return "OL";
    }
    String low = ohmsText(healthyLow);
    String high = ohmsText(healthyHigh);
    return low.equals(high) ? low : low + " to " + high;
  }

  private String measureSuffix() {
    return acMeasure.isEmpty() ? "" : " " + acMeasure;
  }

  /**
   * Returns whether an AC amplitude fits a healthy range: within the range widened at each end by
   * the reading's own uncertainty as the diagnosis takes it for an AC reading without one, ±(3 % of
   * reading + 1 mV) ({@link ReadingSet#SCOPE_PERCENT}). False when the range is unknown (NaN).
   */
  public static boolean acInside(double low, double high, double measured) {
    return BandFit.ac(low, high, measured);
  }

  /** Returns ohms as the chart prints them: "46.8 kΩ", "0.4 Ω", "OL". */
  static String ohmsText(double value) {
    return value == Double.POSITIVE_INFINITY ? "OL" : Engineering.of(value, "Ω", 3);
  }

  /**
   * Returns whether an ohms reading fits a healthy range: within the range widened by the default
   * meter's ohms uncertainty at each end and half an ohm for the test leads (common practice), or
   * OL where a healthy stage reads OL. False when the range is unknown (NaN).
   */
  public static boolean ohmsInside(double low, double high, double measured) {
    return BandFit.ohms(low, high, measured);
  }

  private boolean drawable(double value) {
    return ohms ? !Double.isNaN(value) : Double.isFinite(value);
  }

  private void drawMarkers(ChartAxis scale, double length) {
    List<Marker> shown = markers.stream().filter(m -> drawable(m.volts())).toList();
    double[] centres = new double[shown.size()];
    double[] widths = new double[shown.size()];
    List<Text> labels = new ArrayList<>();
    for (int i = 0; i < shown.size(); i++) {
      Text label = text(shown.get(i).label(), Palette.font(13), Palette.SECOND);
      labels.add(label);
      centres[i] = SIDE + scale.position(shown.get(i).volts(), length);
      widths[i] = label.getLayoutBounds().getWidth();
    }
    int[] rows = BandScale.labelRows(centres, widths, 8);
    int rowCount = 1;
    for (int i = 0; i < shown.size(); i++) {
      double x = centres[i];
      Polygon tip =
          new Polygon(x, AXIS_Y + 2, x - 6, AXIS_Y + BAND_HALF + 7, x + 6, AXIS_Y + BAND_HALF + 7);
      tip.setFill(Palette.SECOND);
      Text label = labels.get(i);
      double left = Math.max(2, Math.min(x - widths[i] / 2, SIDE + length + SIDE - widths[i] - 2));
      label.setX(left);
      label.setY(AXIS_Y + BAND_HALF + 17 + rows[i] * ROW);
      getChildren().addAll(tip, label);
      rowCount = Math.max(rowCount, rows[i] + 1);
    }
    if (rowCount != labelRowCount) {
      labelRowCount = rowCount;
      requestLayout();
    }
  }

  private void drawMeasured(ChartAxis scale, double length, double width) {
    if (!drawable(measured)) {
      Text none = text("no reading", Palette.bold(16), Palette.SOFT_INK);
      none.setId("no-reading");
      none.setX(width / 2 - none.getLayoutBounds().getWidth() / 2);
      none.setY(37);
      getChildren().add(none);
      return;
    }
    double x = SIDE + scale.position(measured, length);
    boolean inside =
        ohms
            ? ohmsInside(healthyLow, healthyHigh, measured)
            : !acMeasure.isEmpty()
                ? acInside(healthyLow, healthyHigh, measured)
                : Double.isFinite(healthyLow)
                    && measured >= healthyLow - 1e-12
                    && measured <= healthyHigh + 1e-12;
    Color mark = inside ? Palette.BAND_EDGE : Palette.OUTSIDE;
    Line needle = new Line(x, AXIS_Y - BAND_HALF - 4, x, AXIS_Y + BAND_HALF + 2);
    needle.setStroke(mark);
    needle.setStrokeWidth(4);
    Polygon head =
        new Polygon(
            x,
            AXIS_Y - BAND_HALF - 1,
            x - 9,
            AXIS_Y - BAND_HALF - 13,
            x + 9,
            AXIS_Y - BAND_HALF - 13);
    head.setFill(mark);
    head.setId("measured-marker");
    Text value =
        text(
            (ohms
                    ? ohmsText(measured)
                    : Engineering.reading(measured, MeterSpec.DEFAULT) + measureSuffix())
                + (inside ? "" : "  outside"),
            Palette.bold(16),
            Palette.MEASURED);
    double w = value.getLayoutBounds().getWidth();
    double left = Math.max(4, Math.min(x - w / 2, width - w - 4));
    Rectangle pill = new Rectangle(left - 6, 25, w + 12, 24);
    pill.setArcWidth(12);
    pill.setArcHeight(12);
    pill.setFill(Palette.MEASURED_FILL);
    pill.setStroke(mark);
    value.setX(left);
    value.setY(37);
    getChildren().addAll(needle, head, pill, value);
  }

  private static Text text(String value, Font font, Color colour) {
    Text text = new Text(value);
    text.setFont(font);
    text.setFill(colour);
    text.setTextOrigin(VPos.CENTER);
    return text;
  }
}
