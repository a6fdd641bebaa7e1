package com.stagewise.ui.drawing;

import com.stagewise.ui.drawing.SchematicLayout.TextMeasure;
import com.stagewise.ui.drawing.Sheet.Dot;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import com.stagewise.ui.drawing.Sheet.Wire;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/** The whole sheet being assembled. */
final class SheetOut extends SheetCanvas {
  SheetOut(TextMeasure measure, String ground) {
    super(measure, ground);
  }

  Sheet finish() {
    return new Sheet(
        List.copyOf(parts),
        List.copyOf(amps),
        List.copyOf(wires),
        dots(),
        List.copyOf(symbols),
        List.copyOf(captions));
  }

  /** Returns a dot wherever three or more connections meet on a net. */
  private List<Dot> dots() {
    Map<String, Integer> degree = new LinkedHashMap<>();
    java.util.function.BiConsumer<Double, Double> end =
        (x, y) -> degree.merge(key(x, y), 1, Integer::sum);
    for (Wire w : wires) {
      end.accept(w.x1(), w.y1());
      end.accept(w.x2(), w.y2());
    }
    for (PartGlyph p : parts) {
      end.accept(p.x1(), p.y1());
      end.accept(p.x2(), p.y2());
    }
    List<Dot> dots = new ArrayList<>();
    Set<String> done = new HashSet<>();
    for (Map.Entry<String, Integer> point : degree.entrySet()) {
      String[] xy = point.getKey().split(";");
      double x = Double.parseDouble(xy[0]);
      double y = Double.parseDouble(xy[1]);
      int count = point.getValue();
      for (Wire w : wires) {
        if (w.hasInside(x, y)) {
          count += 2;
        }
      }
      if (count >= 3 && done.add(point.getKey())) {
        dots.add(new Dot(x, y));
      }
    }
    return List.copyOf(dots);
  }

  private String key(double x, double y) {
    // Rounded so that the same point reached by two sums of doubles is one point.
    return Math.round(x * 100) / 100.0 + ";" + Math.round(y * 100) / 100.0;
  }
}
