package com.stagewise.ui.drawing;

import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.ui.drawing.Sheet.AmpGlyph;
import com.stagewise.ui.drawing.Sheet.Caption;
import com.stagewise.ui.drawing.Sheet.Dot;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import com.stagewise.ui.drawing.Sheet.Symbol;
import com.stagewise.ui.drawing.Sheet.Wire;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.Map;
import java.util.Set;
import javafx.geometry.VPos;
import javafx.scene.Group;
import javafx.scene.Node;
import javafx.scene.layout.Region;
import javafx.scene.paint.Color;
import javafx.scene.shape.Circle;
import javafx.scene.shape.Line;
import javafx.scene.shape.Polygon;
import javafx.scene.shape.Rectangle;
import javafx.scene.shape.StrokeLineCap;
import javafx.scene.text.Font;
import javafx.scene.text.Text;
import javafx.scene.transform.Scale;

/**
 * A schematic of a stage, drawn from its topology (see {@link SchematicLayout}): resistors as IEC
 * rectangles, capacitors as two plates, op-amp sections as triangles with their pin numbers, and a
 * label per net with up to three values in three styles: the first (e.g. expected volts) in blue, a
 * second (e.g. what a suspect predicts) in magenta beside it, and the measured value in black on
 * amber below. It scales to fit its size, keeping proportions.
 */
public final class SchematicDrawing extends Region {
  private static final double NAME_FONT = 12;
  private static final double VALUE_FONT = 14;
  private static final double PAD = 4;
  private static final double MARGIN = 16;
  private static final double LEGEND_HEIGHT = 30;

  private final Group content = new Group();
  private final Scale scale = new Scale(1, 1, 0, 0);
  private Stage stage;
  private Sheet sheet;
  private Map<String, String> first = Map.of();
  private Map<String, String> second = Map.of();
  private String secondCaption = "";
  private Map<String, String> measured = Map.of();
  private Box extent = new Box(0, 0, 1, 1);

  /** The stage's title as the legend shows it ({@link Titles#fitted}). */
  private String shownTitle = "";

  private Map<String, LabelPlacer.Placement> labelBoxes = Map.of();
  private final SchematicTargets targets = new SchematicTargets();

  /** Creates an empty drawing; {@link #show} gives it a stage. */
  public SchematicDrawing() {
    getStyleClass().add("schematic-drawing");
    Palette.paperAndClip(this, this::redraw);
    content.getTransforms().add(scale);
    getChildren().add(content);
    setMinSize(200, 150);
    targets.whenChanged(this::redraw);
  }

  /** Returns the drawing's touch targets: tap a net or a part's lead; the chosen ones are lit. */
  public SchematicTargets targets() {
    return targets;
  }

  /** Shows a stage and redraws; the net labels stay as they were set. */
  public void show(Stage stage) {
    this.stage = stage;
    this.sheet = SchematicLayout.layout(stage, SchematicDrawing::measure);
    redraw();
  }

  /** Sets the first value shown per net (e.g. expected volts, "−4.70 V"); an empty map clears. */
  public void setNetLabels(Map<String, String> text) {
    first = copy(text);
    redraw();
  }

  /**
   * Sets a second value per net (e.g. a suspect's predicted volts), drawn beside the first in
   * another colour, with a caption for the legend (e.g. "if R2 open"); an empty map clears.
   */
  public void setSecondLabels(Map<String, String> text, String caption) {
    second = copy(text);
    secondCaption = caption == null ? "" : caption;
    redraw();
  }

  /** Sets the measured value per net (drawn below the others, black on amber); empty clears. */
  public void setMeasured(Map<String, String> text) {
    measured = copy(text);
    redraw();
  }

  /** Returns where each net's label went, in drawing coordinates (for tests and tools). */
  Map<String, LabelPlacer.Placement> labelBoxes() {
    return labelBoxes;
  }

  /** Returns the laid-out sheet, or null before the first {@link #show}. */
  Sheet sheet() {
    return sheet;
  }

  @Override
  protected double computePrefWidth(double height) {
    return Math.max(400, extent.w() + 2 * MARGIN);
  }

  @Override
  protected double computePrefHeight(double width) {
    return Math.max(300, extent.h() + 2 * MARGIN);
  }

  @Override
  protected void layoutChildren() {
    double fit =
        Math.min((getWidth() - 2 * MARGIN) / extent.w(), (getHeight() - 2 * MARGIN) / extent.h());
    // Never blow a small stage up past 1.7 times: it would look coarse, not clearer.
    double s = Math.max(0.2, Math.min(1.7, fit));
    scale.setX(s);
    scale.setY(s);
    content.setLayoutX((getWidth() - extent.w() * s) / 2 - extent.x() * s);
    content.setLayoutY((getHeight() - extent.h() * s) / 2 - extent.y() * s);
  }

  private static Map<String, String> copy(Map<String, String> text) {
    Map<String, String> copy = new LinkedHashMap<>();
    if (text != null) {
      text.forEach(
          (net, value) -> {
            if (net != null && value != null && !value.isBlank()) {
              copy.put(net, value);
            }
          });
    }
    return copy;
  }

  private void redraw() {
    content.getChildren().clear();
    if (sheet == null) {
      return;
    }
    for (Wire wire : sheet.wires()) {
      content.getChildren().add(line(wire.x1(), wire.y1(), wire.x2(), wire.y2(), 2));
    }
    for (PartGlyph part : sheet.parts()) {
      drawPart(part);
    }
    for (AmpGlyph amp : sheet.amps()) {
      Box box = amp.box();
      Polygon triangle =
          new Polygon(box.x(), box.y(), box.x(), box.bottom(), box.right(), box.cy());
      triangle.setFill(Palette.AMP_FILL);
      triangle.setStroke(Palette.INK);
      triangle.setStrokeWidth(2.2);
      triangle.setId("amp-" + amp.amp().ref());
      content.getChildren().add(triangle);
    }
    for (Dot dot : sheet.dots()) {
      content.getChildren().add(new Circle(dot.x(), dot.y(), 4, Palette.INK));
    }
    for (Symbol symbol : sheet.symbols()) {
      drawSymbol(symbol);
    }
    for (Caption caption : sheet.captions()) {
      content.getChildren().add(caption(caption));
    }
    content.getChildren().add(targets.layer(sheet));
    drawLabels();
    drawLegend();
    requestLayout();
  }

  private void drawPart(PartGlyph glyph) {
    Box body = glyph.body();
    boolean vertical = glyph.vertical();
    Group group = new Group();
    group.setId("part-" + glyph.part().ref());
    if (vertical) {
      double top = Math.min(glyph.y1(), glyph.y2());
      double bottom = Math.max(glyph.y1(), glyph.y2());
      group.getChildren().add(line(glyph.x1(), top, glyph.x1(), body.y(), 2));
      group.getChildren().add(line(glyph.x1(), body.bottom(), glyph.x1(), bottom, 2));
    } else {
      double left = Math.min(glyph.x1(), glyph.x2());
      double right = Math.max(glyph.x1(), glyph.x2());
      group.getChildren().add(line(left, glyph.y1(), body.x(), glyph.y1(), 2));
      group.getChildren().add(line(body.right(), glyph.y1(), right, glyph.y1(), 2));
    }
    if (PartShape.drawnHere(glyph.part())) {
      if (glyph.part().kind().isTrimmer()) {
        Rectangle rect = new Rectangle(body.x(), body.y(), body.w(), body.h());
        rect.setFill(Palette.PART_FILL);
        rect.setStroke(Palette.INK);
        rect.setStrokeWidth(2);
        group.getChildren().add(rect);
      }
      PartShape shape = PartShape.of(glyph);
      for (PartShape.Stroke st : shape.strokes) {
        group.getChildren().add(line(st.x1(), st.y1(), st.x2(), st.y2(), st.width()));
      }
      for (PartShape.Fill f : shape.fills) {
        Polygon polygon = new Polygon(f.points());
        polygon.setFill(Palette.INK);
        polygon.setStroke(Palette.INK);
        group.getChildren().add(polygon);
      }
      for (PartShape.Label l : shape.labels) {
        group
            .getChildren()
            .add(text(l.text(), Palette.font(PartShape.LEAD_FONT), Palette.SOFT_INK, l.x(), l.y()));
      }
      content.getChildren().add(group);
      return;
    }
    if (glyph.part().kind() == PartKind.CAPACITOR) {
      // Two plates across the lead, 4 px in from the body box on the lead's axis.
      if (vertical) {
        group.getChildren().add(line(body.x(), body.y() + 2, body.right(), body.y() + 2, 3.2));
        group
            .getChildren()
            .add(line(body.x(), body.bottom() - 2, body.right(), body.bottom() - 2, 3.2));
      } else {
        group.getChildren().add(line(body.x() + 2, body.y(), body.x() + 2, body.bottom(), 3.2));
        group
            .getChildren()
            .add(line(body.right() - 2, body.y(), body.right() - 2, body.bottom(), 3.2));
      }
    } else {
      Rectangle rect = new Rectangle(body.x(), body.y(), body.w(), body.h());
      rect.setFill(Palette.PART_FILL);
      rect.setStroke(Palette.INK);
      rect.setStrokeWidth(2);
      group.getChildren().add(rect);
    }
    content.getChildren().add(group);
  }

  private void drawSymbol(Symbol symbol) {
    double x = symbol.x();
    double y = symbol.y();
    switch (symbol.kind()) {
      case GROUND -> {
        content.getChildren().add(line(x, y, x, y + 8, 2));
        content.getChildren().add(line(x - 12, y + 8, x + 12, y + 8, 2.4));
        content.getChildren().add(line(x - 7.5, y + 13.5, x + 7.5, y + 13.5, 2.4));
        content.getChildren().add(line(x - 3, y + 19, x + 3, y + 19, 2.4));
      }
      case RAIL -> {
        boolean across =
            symbol.direction() == Sheet.Direction.UP || symbol.direction() == Sheet.Direction.DOWN;
        content
            .getChildren()
            .add(across ? line(x - 9, y, x + 9, y, 3) : line(x, y - 9, x, y + 9, 3));
        content.getChildren().add(caption(symbol.caption()));
      }
      case INPUT, OUTPUT -> {
        double cx = symbol.direction() == Sheet.Direction.LEFT ? x - 5 : x + 5;
        Circle ring = new Circle(cx, y, 5, Palette.PAPER);
        ring.setStroke(Palette.INK);
        ring.setStrokeWidth(2);
        content.getChildren().addAll(ring, caption(symbol.caption()));
      }
      case FLAG -> {
        Box text = symbol.caption().box().grown(3);
        Rectangle tag = new Rectangle(text.x(), text.y(), text.w(), text.h());
        tag.setArcWidth(8);
        tag.setArcHeight(8);
        tag.setFill(Palette.PAPER);
        tag.setStroke(Palette.SOFT_INK);
        tag.setStrokeWidth(1.5);
        double edge = symbol.direction() == Sheet.Direction.LEFT ? text.right() : text.x();
        content.getChildren().addAll(line(x, y, edge, y, 2), tag, caption(symbol.caption()));
      }
      default -> throw new IllegalStateException("unknown symbol " + symbol.kind());
    }
  }

  private void drawLabels() {
    Set<String> nets = new LinkedHashSet<>();
    nets.addAll(first.keySet());
    nets.addAll(second.keySet());
    nets.addAll(measured.keySet());
    // Rails and ground are the same everywhere on the sheet: their labels go in a strip at the
    // top instead of beside one of their many flags.
    Map<String, double[]> onSheet = new LinkedHashMap<>();
    Map<String, double[]> supplies = new LinkedHashMap<>();
    for (String net : nets) {
      boolean supply = stage != null && (net.equals(stage.ground()) || stage.rail(net).isPresent());
      (supply ? supplies : onSheet).put(net, labelSize(net));
    }
    labelBoxes = new LinkedHashMap<>(LabelPlacer.place(sheet, onSheet));
    Box all = sheet.bounds();
    for (Map.Entry<String, LabelPlacer.Placement> entry : labelBoxes.entrySet()) {
      drawLabel(entry.getKey(), entry.getValue(), true);
      all = all.union(entry.getValue().box());
    }
    if (!supplies.isEmpty()) {
      double stripHeight = supplies.values().stream().mapToDouble(size -> size[1]).max().orElse(0);
      double x = all.x();
      double y = all.y() - 10 - stripHeight;
      for (Map.Entry<String, double[]> entry : supplies.entrySet()) {
        double[] size = entry.getValue();
        Box box = new Box(x, y, size[0], size[1]);
        LabelPlacer.Placement placement = new LabelPlacer.Placement(box, box.x(), box.y());
        labelBoxes.put(entry.getKey(), placement);
        drawLabel(entry.getKey(), placement, false);
        x += size[0] + 10;
        all = all.union(box);
      }
    }
    // A long title is cut to about the sheet's width rather than widening (and so shrinking) it.
    shownTitle =
        Titles.fitted(stage == null ? "" : stage.title(), all.w(), t -> measure(t, 15, true));
    extent =
        new Box(
            all.x(),
            all.y() - LEGEND_HEIGHT,
            Math.max(all.w(), legendWidth()),
            all.h() + LEGEND_HEIGHT);
  }

  /** Returns the width of the legend line drawn by {@link #drawLegend}. */
  private double legendWidth() {
    double width = 0;
    if (!shownTitle.isEmpty()) {
      width += measure(shownTitle, 15, true) + 24;
    }
    if (!first.isEmpty()) {
      width += 19 + measure("expected", 14, false) + 18;
    }
    if (!second.isEmpty()) {
      width += 19 + measure(secondCaption.isEmpty() ? "second" : secondCaption, 14, false) + 18;
    }
    if (!measured.isEmpty()) {
      width += 19 + measure("measured", 14, false) + 18;
    }
    return width;
  }

  private double[] labelSize(String net) {
    double top = measure(net, NAME_FONT, true);
    if (first.containsKey(net)) {
      top += 6 + measure(first.get(net), VALUE_FONT, true);
    }
    if (second.containsKey(net)) {
      top += 8 + measure(second.get(net), VALUE_FONT, true);
    }
    double width = top;
    double height = Math.ceil(VALUE_FONT * 1.3);
    if (measured.containsKey(net)) {
      width = Math.max(width, measure(measured.get(net), VALUE_FONT, true) + 8);
      height += Math.ceil(VALUE_FONT * 1.3) + 4;
    }
    return new double[] {width + 2 * PAD, height + 2 * PAD};
  }

  private void drawLabel(String net, LabelPlacer.Placement placement, boolean anchored) {
    Box box = placement.box();
    Group label = new Group();
    label.setId("label-" + net);
    // A thin leader from the nearest point of the block to the spot on the net it belongs to.
    double nx = Math.max(box.x(), Math.min(placement.x(), box.right()));
    double ny = Math.max(box.y(), Math.min(placement.y(), box.bottom()));
    if (anchored && Math.hypot(nx - placement.x(), ny - placement.y()) > 3) {
      Line leader = new Line(placement.x(), placement.y(), nx, ny);
      leader.setStroke(Palette.EXPECTED);
      leader.setStrokeWidth(1.2);
      leader.getStrokeDashArray().addAll(3.0, 3.0);
      label.getChildren().add(leader);
    }
    // A small ring marks the spot; a ring, so it is not taken for a junction dot.
    if (anchored) {
      Circle spot = new Circle(placement.x(), placement.y(), 3.2, Color.WHITE);
      spot.setStroke(Palette.EXPECTED);
      spot.setStrokeWidth(1.6);
      label.getChildren().add(spot);
    }
    Rectangle back = new Rectangle(box.x(), box.y(), box.w(), box.h());
    back.setArcWidth(8);
    back.setArcHeight(8);
    back.setFill(Color.WHITE);
    back.setStroke(Palette.GRID);
    label.getChildren().add(back);
    double lineHeight = Math.ceil(VALUE_FONT * 1.3);
    double x = box.x() + PAD;
    double y = box.y() + PAD;
    Text name =
        text(
            net,
            Palette.bold(NAME_FONT),
            Palette.SOFT_INK,
            x,
            y + (lineHeight - NAME_FONT * 1.3) / 2 + 1);
    label.getChildren().add(name);
    x += measure(net, NAME_FONT, true) + 6;
    if (first.containsKey(net)) {
      label
          .getChildren()
          .add(text(first.get(net), Palette.bold(VALUE_FONT), Palette.EXPECTED, x, y));
      x += measure(first.get(net), VALUE_FONT, true) + 8;
    }
    if (second.containsKey(net)) {
      label
          .getChildren()
          .add(text(second.get(net), Palette.bold(VALUE_FONT), Palette.SECOND, x, y));
    }
    if (measured.containsKey(net)) {
      double my = y + lineHeight + 4;
      double w = measure(measured.get(net), VALUE_FONT, true) + 8;
      Rectangle pill = new Rectangle(box.x() + PAD, my - 1, w, lineHeight + 2);
      pill.setArcWidth(8);
      pill.setArcHeight(8);
      pill.setFill(Palette.MEASURED_FILL);
      label
          .getChildren()
          .addAll(
              pill,
              text(
                  measured.get(net),
                  Palette.bold(VALUE_FONT),
                  Palette.MEASURED,
                  box.x() + PAD + 4,
                  my));
    }
    content.getChildren().add(label);
  }

  private void drawLegend() {
    double y = extent.y() + 4;
    double x = extent.x();
    if (!shownTitle.isEmpty()) {
      content.getChildren().add(text(shownTitle, Palette.bold(15), Palette.INK, x, y));
      x += measure(shownTitle, 15, true) + 24;
    }
    if (!first.isEmpty()) {
      x = legendEntry("expected", Palette.EXPECTED, null, x, y);
    }
    if (!second.isEmpty()) {
      x =
          legendEntry(
              secondCaption.isEmpty() ? "second" : secondCaption, Palette.SECOND, null, x, y);
    }
    if (!measured.isEmpty()) {
      legendEntry("measured", Palette.MEASURED, Palette.MEASURED_FILL, x, y);
    }
  }

  private double legendEntry(String words, Color colour, Color fill, double x, double y) {
    Rectangle swatch = new Rectangle(x, y + 3, 14, 14);
    swatch.setFill(fill == null ? colour : fill);
    swatch.setStroke(colour);
    content.getChildren().addAll(swatch, text(words, Palette.font(14), colour, x + 19, y));
    return x + 19 + measure(words, 14, false) + 18;
  }

  private Node caption(Caption caption) {
    Color colour =
        switch (caption.kind()) {
          case PIN_NUMBER -> Palette.SOFT_INK;
          default -> Palette.INK;
        };
    Font font = caption.bold() ? Palette.bold(caption.size()) : Palette.font(caption.size());
    return text(caption.text(), font, colour, caption.box().x(), caption.box().y());
  }

  private static Text text(String value, Font font, Color colour, double x, double y) {
    Text text = new Text(x, y, value);
    text.setFont(font);
    text.setFill(colour);
    text.setTextOrigin(VPos.TOP);
    return text;
  }

  private static Line line(double x1, double y1, double x2, double y2, double width) {
    Line line = new Line(x1, y1, x2, y2);
    line.setStroke(Palette.INK);
    line.setStrokeWidth(width);
    line.setStrokeLineCap(StrokeLineCap.ROUND);
    return line;
  }

  /** Measures a line of text in the drawings' font. */
  static double measure(String value, double size, boolean bold) {
    Text text = new Text(value);
    text.setFont(bold ? Palette.bold(size) : Palette.font(size));
    return Math.ceil(text.getLayoutBounds().getWidth());
  }
}
