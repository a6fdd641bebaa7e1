package com.stagewise.ui.drawing;

import static com.stagewise.ui.drawing.SchematicLayout.NODE;

import com.stagewise.ui.drawing.SchematicLayout.Pending;
import com.stagewise.ui.drawing.SchematicLayout.TextMeasure;
import com.stagewise.ui.drawing.SchematicLayout.Uplink;
import com.stagewise.ui.drawing.Sheet.AmpGlyph;
import com.stagewise.ui.drawing.Sheet.Caption;
import com.stagewise.ui.drawing.Sheet.Direction;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import com.stagewise.ui.drawing.Sheet.Symbol;
import com.stagewise.ui.drawing.Sheet.SymbolKind;
import com.stagewise.ui.drawing.Sheet.Wire;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/** One section drawn in its own frame: triangle's left edge at x = 0, output at y = 0. */
final class SectionBlock extends SheetCanvas {
  final List<Pending> inputs = new ArrayList<>();
  final List<Pending> routes = new ArrayList<>();
  final List<Uplink> uplinks = new ArrayList<>();
  final Set<String> visited = new HashSet<>();
  AmpGlyph amp;
  double minusLegEnd;
  double outEndX;
  double minX;
  double maxX;
  double minY;
  double maxY;

  SectionBlock(TextMeasure measure, String ground) {
    super(measure, ground);
  }

  /** Joins the input symbols on one line at the block's left edge and measures the block. */
  void finish() {
    amps.add(amp);
    Box box = bounds();
    double left = Math.min(box.x(), -NODE - 40);
    for (Pending input : inputs) {
      left = Math.min(left, input.x() - 40);
    }
    for (Pending input : inputs) {
      wire(input.net(), input.x(), input.y(), left, input.y());
      symbol(SymbolKind.INPUT, input.net(), left, input.y(), Direction.LEFT);
    }
    box = bounds();
    minX = box.x();
    maxX = Math.max(box.right(), outEndX + 10);
    minY = box.y();
    maxY = box.bottom();
  }

  /** Copies the block's elements into the sheet, moved by (dx, dy). */
  void emit(SheetOut out, double dx, double dy) {
    for (PartGlyph p : parts) {
      out.parts.add(
          new PartGlyph(
              p.part(),
              p.x1() + dx,
              p.y1() + dy,
              p.x2() + dx,
              p.y2() + dy,
              p.body().moved(dx, dy),
              p.firstNet(),
              p.free()));
    }
    for (AmpGlyph a : amps) {
      out.amps.add(new AmpGlyph(a.amp(), a.x() + dx, a.y() + dy, a.flipped()));
    }
    for (Wire w : wires) {
      out.wires.add(new Wire(w.net(), w.x1() + dx, w.y1() + dy, w.x2() + dx, w.y2() + dy));
    }
    for (Symbol s : symbols) {
      Caption c = s.caption();
      out.symbols.add(
          new Symbol(
              s.kind(),
              s.net(),
              s.x() + dx,
              s.y() + dy,
              s.direction(),
              s.box().moved(dx, dy),
              c == null
                  ? null
                  : new Caption(c.text(), c.box().moved(dx, dy), c.size(), c.bold(), c.kind())));
    }
    for (Caption c : captions) {
      out.captions.add(new Caption(c.text(), c.box().moved(dx, dy), c.size(), c.bold(), c.kind()));
    }
  }
}
