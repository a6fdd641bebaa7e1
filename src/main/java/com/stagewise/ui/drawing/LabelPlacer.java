package com.stagewise.ui.drawing;

import com.stagewise.ui.drawing.Sheet.Symbol;
import com.stagewise.ui.drawing.Sheet.Wire;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Places one label block per net beside a wire or symbol of that net, where it covers nothing else:
 * no part, triangle, symbol, caption, wire or other label. Where every spot is taken, the spot that
 * covers the fewest things wins. Pure Java.
 */
final class LabelPlacer {
  private static final double GAP = 4;
  private static final double[] ALONG = {0.5, 0.3, 0.7, 0.15, 0.85};

  private LabelPlacer() {}

  /**
   * Where a net's label went.
   *
   * @param box the label block
   * @param x the point on the net's wire or symbol the label belongs to
   * @param y see x
   */
  record Placement(Box box, double x, double y) {}

  /**
   * Returns a box for every net in {@code sizes} (width and height of its label block) that has a
   * wire or symbol on the sheet, in the order given.
   */
  static Map<String, Placement> place(Sheet sheet, Map<String, double[]> sizes) {
    List<Box> taken = new ArrayList<>(sheet.obstacles());
    Map<String, Placement> placed = new LinkedHashMap<>();
    for (Map.Entry<String, double[]> entry : sizes.entrySet()) {
      String net = entry.getKey();
      double w = entry.getValue()[0];
      double h = entry.getValue()[1];
      Placement best = null;
      double bestScore = Double.POSITIVE_INFINITY;
      for (Placement candidate : candidates(sheet, net, w, h)) {
        double score = score(candidate, taken);
        if (score < bestScore) {
          best = candidate;
          bestScore = score;
        }
      }
      if (best != null) {
        placed.put(net, best);
        taken.add(best.box().grown(3));
        // The leader line is in the way of later labels too: a chain of small boxes along it.
        Box box = best.box();
        double nx = Math.max(box.x(), Math.min(best.x(), box.right()));
        double ny = Math.max(box.y(), Math.min(best.y(), box.bottom()));
        double length = Math.hypot(nx - best.x(), ny - best.y());
        for (double t = 0; t < length; t += 6) {
          double f = t / length;
          taken.add(
              Box.centred(best.x() + f * (nx - best.x()), best.y() + f * (ny - best.y()), 4, 4));
        }
      }
    }
    return placed;
  }

  /**
   * Returns how bad a spot is: each thing the block covers costs 10, each thing its leader line
   * crosses 3, and every 100 px of leader 1, so that a free spot near the net wins.
   */
  static double score(Placement candidate, List<Box> taken) {
    Box box = candidate.box();
    double nx = Math.max(box.x(), Math.min(candidate.x(), box.right()));
    double ny = Math.max(box.y(), Math.min(candidate.y(), box.bottom()));
    double leader = Math.hypot(nx - candidate.x(), ny - candidate.y());
    double score = leader / 100;
    for (Box other : taken) {
      if (box.overlaps(other.grown(1))) {
        score += 10;
      } else if (leader > 6 && crosses(candidate.x(), candidate.y(), nx, ny, other.grown(-1))) {
        score += 3;
      }
    }
    return score;
  }

  /** Returns whether the segment from (x1, y1) to (x2, y2) passes through the box's inside. */
  static boolean crosses(double x1, double y1, double x2, double y2, Box box) {
    if (box.w() <= 0 || box.h() <= 0) {
      return false;
    }
    // Liang-Barsky clipping: the segment meets the box if some parameter range survives.
    double t0 = 0;
    double t1 = 1;
    double dx = x2 - x1;
    double dy = y2 - y1;
    double[] p = {-dx, dx, -dy, dy};
    double[] q = {x1 - box.x(), box.right() - x1, y1 - box.y(), box.bottom() - y1};
    for (int i = 0; i < 4; i++) {
      if (p[i] == 0) {
        if (q[i] <= 0) {
          return false;
        }
      } else {
        double t = q[i] / p[i];
        if (p[i] < 0) {
          t0 = Math.max(t0, t);
        } else {
          t1 = Math.min(t1, t);
        }
      }
    }
    return t0 < t1;
  }

  /**
   * Returns the spots to try for one net, best first: beside its longer wires, then its symbols.
   */
  static List<Placement> candidates(Sheet sheet, String net, double w, double h) {
    List<Placement> spots = new ArrayList<>();
    List<Wire> wires =
        sheet.wires().stream()
            .filter(wire -> wire.net().equals(net))
            .sorted(
                Comparator.comparingDouble((Wire wire) -> wire.horizontal() ? 0 : 1)
                    .thenComparing(Wire::length, Comparator.reverseOrder()))
            .toList();
    for (Wire wire : wires) {
      for (double t : ALONG) {
        double x = wire.x1() + t * (wire.x2() - wire.x1());
        double y = wire.y1() + t * (wire.y2() - wire.y1());
        if (wire.horizontal()) {
          for (double lift : new double[] {0, h * 0.6, h * 1.2}) {
            spots.add(new Placement(new Box(x - w / 2, y - GAP - h - lift, w, h), x, y));
            spots.add(new Placement(new Box(x - w / 2, y + GAP + lift, w, h), x, y));
            spots.add(new Placement(new Box(x + 2, y - GAP - h - lift, w, h), x, y));
            spots.add(new Placement(new Box(x - w - 2, y - GAP - h - lift, w, h), x, y));
            spots.add(new Placement(new Box(x + 2, y + GAP + lift, w, h), x, y));
            spots.add(new Placement(new Box(x - w - 2, y + GAP + lift, w, h), x, y));
          }
        } else {
          for (double shift : new double[] {0, 24, 48}) {
            spots.add(new Placement(new Box(x + GAP + 2 + shift, y - h / 2, w, h), x, y));
            spots.add(new Placement(new Box(x - GAP - 2 - w - shift, y - h / 2, w, h), x, y));
          }
        }
      }
    }
    for (Symbol symbol : sheet.symbols()) {
      if (symbol.net().equals(net)) {
        Box s = symbol.box();
        double x = symbol.x();
        double y = symbol.y();
        for (double lift : new double[] {0, h * 0.6, h * 1.2}) {
          spots.add(new Placement(new Box(s.x(), s.y() - GAP - h - lift, w, h), x, y));
          spots.add(new Placement(new Box(s.right() - w, s.y() - GAP - h - lift, w, h), x, y));
          spots.add(new Placement(new Box(s.x(), s.bottom() + GAP + lift, w, h), x, y));
          spots.add(new Placement(new Box(s.right() - w, s.bottom() + GAP + lift, w, h), x, y));
          spots.add(new Placement(new Box(s.right() + GAP + lift, s.cy() - h / 2, w, h), x, y));
          spots.add(new Placement(new Box(s.x() - GAP - w - lift, s.cy() - h / 2, w, h), x, y));
        }
      }
    }
    // Last resort: above or below the whole drawing, straight above or below a spot of the net,
    // where nothing else is; the drawing's leader line shows where it belongs.
    Box all = sheet.bounds();
    List<Placement> near = new ArrayList<>(spots);
    for (Placement anchor : near.isEmpty() ? List.<Placement>of() : List.of(near.get(0))) {
      for (int k = 0; k < 6; k++) {
        double x = anchor.x();
        double y = anchor.y();
        spots.add(new Placement(new Box(x - w / 2, all.y() - 8 - h - k * (h + 6), w, h), x, y));
        spots.add(new Placement(new Box(x - w / 2, all.bottom() + 8 + k * (h + 6), w, h), x, y));
        spots.add(new Placement(new Box(x + 8 + k * (w + 8), all.bottom() + 8, w, h), x, y));
        spots.add(new Placement(new Box(x - w - 8 - k * (w + 8), all.y() - 8 - h, w, h), x, y));
      }
    }
    return spots;
  }
}
