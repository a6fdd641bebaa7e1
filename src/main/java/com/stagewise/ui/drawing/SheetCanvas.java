package com.stagewise.ui.drawing;

import static com.stagewise.ui.drawing.SchematicLayout.BODY_LONG;
import static com.stagewise.ui.drawing.SchematicLayout.BODY_SHORT;
import static com.stagewise.ui.drawing.SchematicLayout.CAP_GAP;
import static com.stagewise.ui.drawing.SchematicLayout.CAP_PLATE;
import static com.stagewise.ui.drawing.SchematicLayout.NET_FONT;
import static com.stagewise.ui.drawing.SchematicLayout.PART_FONT;
import static com.stagewise.ui.drawing.SchematicLayout.line;
import static com.stagewise.ui.drawing.SchematicLayout.valueText;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.ui.drawing.SchematicLayout.TextMeasure;
import com.stagewise.ui.drawing.Sheet.AmpGlyph;
import com.stagewise.ui.drawing.Sheet.Caption;
import com.stagewise.ui.drawing.Sheet.CaptionKind;
import com.stagewise.ui.drawing.Sheet.Direction;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import com.stagewise.ui.drawing.Sheet.Symbol;
import com.stagewise.ui.drawing.Sheet.SymbolKind;
import com.stagewise.ui.drawing.Sheet.Wire;
import java.util.ArrayList;
import java.util.List;

/**
 * Collects the elements of a schematic in some coordinate frame: parts with their captions,
 * triangles, wires, supply and net symbols.
 */
class SheetCanvas {
  private final TextMeasure measure;
  private final String ground;

  final List<PartGlyph> parts = new ArrayList<>();
  final List<AmpGlyph> amps = new ArrayList<>();
  final List<Wire> wires = new ArrayList<>();
  final List<Symbol> symbols = new ArrayList<>();
  final List<Caption> captions = new ArrayList<>();

  SheetCanvas(TextMeasure measure, String ground) {
    this.measure = measure;
    this.ground = ground;
  }

  private double width(String text, double size, boolean bold) {
    return measure.width(text, size, bold);
  }

  void wire(String net, double x1, double y1, double x2, double y2) {
    if (x1 != x2 || y1 != y2) {
      wires.add(new Wire(net, x1, y1, x2, y2));
    }
  }

  void caption(String text, double x, double y, double size, boolean bold, CaptionKind kind) {
    captions.add(
        new Caption(text, new Box(x, y, width(text, size, bold), line(size)), size, bold, kind));
  }

  /** A part across (x1, y)–(x2, y); its captions go above (d = −1) or below (d = +1). */
  void horizontalPart(Part part, String firstNet, double x1, double x2, double y, int d) {
    double cx = (x1 + x2) / 2;
    Box body =
        part.kind() == PartKind.CAPACITOR
            ? Box.centred(cx, y, CAP_GAP + 4, CAP_PLATE)
            : Box.centred(cx, y, BODY_LONG, BODY_SHORT);
    parts.add(new PartGlyph(part, x1, y, x2, y, body, firstNet, -d));
    String value = valueText(part);
    double wRef = width(part.ref(), PART_FONT, true);
    double wValue = width(value, PART_FONT, false);
    double total = wRef + 6 + wValue;
    double top = d < 0 ? body.y() - 3 - line(PART_FONT) : body.bottom() + 3;
    caption(part.ref(), cx - total / 2, top, PART_FONT, true, CaptionKind.DESIGNATOR);
    caption(value, cx - total / 2 + wRef + 6, top, PART_FONT, false, CaptionKind.VALUE);
  }

  /** A part across (x, y1)–(x, y2); its captions go to the right of the body. */
  void verticalPart(Part part, String firstNet, double x, double y1, double y2) {
    double cy = (y1 + y2) / 2;
    Box body =
        part.kind() == PartKind.CAPACITOR
            ? Box.centred(x, cy, CAP_PLATE, CAP_GAP + 4)
            : Box.centred(x, cy, BODY_SHORT, BODY_LONG);
    parts.add(new PartGlyph(part, x, y1, x, y2, body, firstNet, -1));
    double left = body.right() + 5;
    caption(part.ref(), left, cy - line(PART_FONT), PART_FONT, true, CaptionKind.DESIGNATOR);
    caption(valueText(part), left, cy, PART_FONT, false, CaptionKind.VALUE);
  }

  void supplySymbol(String net, double x, double y, Direction direction) {
    symbol(net.equals(ground) ? SymbolKind.GROUND : SymbolKind.RAIL, net, x, y, direction);
  }

  void symbol(SymbolKind kind, String net, double x, double y, Direction direction) {
    if (kind == SymbolKind.GROUND) {
      symbols.add(new Symbol(kind, net, x, y, Direction.DOWN, new Box(x - 12, y, 24, 22), null));
      return;
    }
    double w = width(net, NET_FONT, true);
    double h = line(NET_FONT);
    Box text;
    Box mark;
    switch (kind) {
      case RAIL -> {
        switch (direction) {
          case UP -> {
            mark = Box.centred(x, y, 18, 2);
            text = new Box(x - w / 2, y - 3 - h, w, h);
          }
          case DOWN -> {
            mark = Box.centred(x, y, 18, 2);
            text = new Box(x - w / 2, y + 3, w, h);
          }
          case LEFT -> {
            mark = Box.centred(x, y, 2, 18);
            text = new Box(x - 5 - w, y - h / 2, w, h);
          }
          default -> {
            mark = Box.centred(x, y, 2, 18);
            text = new Box(x + 5, y - h / 2, w, h);
          }
        }
      }
      case INPUT, FLAG -> {
        boolean left = direction == Direction.LEFT;
        mark = left ? new Box(x - 11, y - 6, 12, 12) : new Box(x - 1, y - 6, 12, 12);
        text = left ? new Box(x - 16 - w, y - h / 2, w, h) : new Box(x + 16, y - h / 2, w, h);
      }
      default -> {
        mark = new Box(x - 1, y - 6, 12, 12);
        text = new Box(x + 16, y - h / 2, w, h);
      }
    }
    Caption caption = new Caption(net, text, NET_FONT, true, CaptionKind.NET_NAME);
    symbols.add(
        new Symbol(
            kind,
            net,
            x,
            y,
            direction,
            mark.union(text.grown(kind == SymbolKind.FLAG ? 4 : 0)),
            caption));
  }

  Box bounds() {
    return new Sheet(parts, amps, wires, List.of(), symbols, captions)
        .obstacles().stream().reduce(Box::union).orElse(null);
  }
}
