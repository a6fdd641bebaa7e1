package com.stagewise.ui.drawing;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.ZenerMarking;
import com.stagewise.ui.drawing.Sheet.AmpGlyph;
import com.stagewise.ui.drawing.Sheet.Direction;
import com.stagewise.ui.drawing.Sheet.SymbolKind;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Lays out a stage as a schematic from its topology alone, by the role each part plays around each
 * op-amp section; pure Java, no toolkit.
 *
 * <p>For each section: parts between the inverting input and the output are feedback, drawn in
 * lanes above the triangle; parts between the non-inverting input and the output (positive
 * feedback) in lanes below. The network on each input is drawn as a tree growing to the left from
 * the input pin: a part to a driven input or to another section's output is a row ending in an
 * input symbol or a wire from that section; a part to ground or a rail hangs downward on the lower
 * side (or is a row ending in the symbol on the upper side); a part to an inner net continues the
 * row, whose net grows its own tree; a part from an inner net to the output goes up around the
 * feedback lanes. Parts from the output to ground or a rail are loads hanging below the output
 * wire. Sections are placed in columns by signal order (a section fed by another's output sits to
 * its right); two sections in one column joined by a part between their inverting inputs (the gain
 * resistor of a three-op-amp instrumentation amplifier) face each other, the upper one flipped,
 * with that part between them. Whatever fits no role is drawn in a row at the bottom with a
 * net-name flag at each end.
 */
final class SchematicLayout {

  /** Measures text: the width in pixels of a line at a font size. */
  interface TextMeasure {
    double width(String text, double size, boolean bold);
  }

  /** A measure for tests and as a fallback: a generous average glyph width. */
  static final TextMeasure APPROXIMATE =
      (text, size, bold) -> text.length() * size * (bold ? 0.66 : 0.6);

  static final double NODE = 30;
  static final double OUT_X = AmpGlyph.WIDTH + 30;
  static final double CELL = 124;
  static final double ROW = 74;
  static final double HANG = 96;
  static final double HSTEP = 84;
  static final double LANE = 72;
  static final double LANE_STEP = 62;
  static final double BUS = 24;
  static final double SUPPLY_X = 55;
  static final double PART_FONT = 14;
  static final double NET_FONT = 14;
  static final double PIN_FONT = 13;
  static final double BODY_LONG = 56;
  static final double BODY_SHORT = 18;
  static final double CAP_GAP = 10;
  static final double CAP_PLATE = 28;
  static final double PAIR_GAP = 80;
  static final double BLOCK_GAP = 50;
  static final double CHANNEL = 22;

  private final Stage stage;
  private final TextMeasure measure;
  private final Set<String> used = new HashSet<>();
  private final Map<String, Amplifier> outOwner = new HashMap<>();
  private final Set<String> pinNets = new HashSet<>();
  private final SectionLayout sections;

  private SchematicLayout(Stage stage, TextMeasure measure) {
    this.stage = stage;
    this.measure = measure;
    for (Amplifier amp : stage.amplifiers()) {
      outOwner.putIfAbsent(amp.out(), amp);
      pinNets.add(amp.inPlus());
      pinNets.add(amp.inMinus());
    }
    this.sections = new SectionLayout(stage, measure, used, outOwner, pinNets);
  }

  /** Returns the laid-out schematic of a stage, measuring text with {@code measure}. */
  static Sheet layout(Stage stage, TextMeasure measure) {
    return new SchematicLayout(stage, measure).build();
  }

  // ---------------------------------------------------------------------------------------------
  // Whole sheet

  private Sheet build() {
    List<Amplifier> amps = stage.amplifiers();
    Map<Amplifier, Integer> rank = ranks(amps);
    int columns = rank.values().stream().mapToInt(Integer::intValue).max().orElse(-1) + 1;
    List<List<Amplifier>> byColumn = new ArrayList<>();
    for (int c = 0; c < columns; c++) {
      int column = c;
      byColumn.add(amps.stream().filter(a -> rank.get(a) == column).toList());
    }
    // Bridges between neighbours in a column decide which sections are flipped.
    Set<Amplifier> flipped = new HashSet<>();
    Map<Amplifier, Part> bridgeBelow = new HashMap<>();
    for (List<Amplifier> column : byColumn) {
      for (int i = 0; i + 1 < column.size(); i++) {
        Amplifier upper = column.get(i);
        Amplifier lower = column.get(i + 1);
        for (Part part : stage.parts()) {
          if (!used.contains(part.ref())
              && !upper.inMinus().equals(lower.inMinus())
              && part.touches(upper.inMinus())
              && part.touches(lower.inMinus())
              && !flipped.contains(upper)) {
            used.add(part.ref());
            bridgeBelow.put(upper, part);
            flipped.add(upper);
            break;
          }
        }
      }
    }
    Map<Amplifier, SectionBlock> blocks = new LinkedHashMap<>();
    for (Amplifier amp : amps) {
      blocks.put(amp, sections.section(amp, flipped.contains(amp)));
    }

    SheetOut out = new SheetOut(measure, stage.ground());
    // Column by column: stack the blocks, then shift the column right of the previous one, leaving
    // a channel for every wire that comes in from an earlier section.
    double columnLeft = 0;
    List<double[]> columnSpans = new ArrayList<>();
    Map<Amplifier, double[]> origin = new HashMap<>();
    for (int c = 0; c < columns; c++) {
      List<Amplifier> column = byColumn.get(c);
      double minX = column.stream().mapToDouble(a -> blocks.get(a).minX).min().orElse(0);
      double maxX = column.stream().mapToDouble(a -> blocks.get(a).maxX).max().orElse(0);
      int incoming = 0;
      for (Amplifier amp : column) {
        incoming += blocks.get(amp).routes.size();
      }
      double left = c == 0 ? columnLeft : columnLeft + 24 + incoming * CHANNEL + 16;
      double ox = left - minX;
      double cursor = 0;
      for (int i = 0; i < column.size(); i++) {
        SectionBlock block = blocks.get(column.get(i));
        double oy = cursor - block.minY;
        origin.put(column.get(i), new double[] {ox, oy});
        boolean bridged = bridgeBelow.containsKey(column.get(i));
        cursor = oy + block.maxY + (bridged ? PAIR_GAP : BLOCK_GAP);
      }
      columnSpans.add(new double[] {0, cursor});
      columnLeft = ox + maxX;
    }
    // Centre every column on the tallest one.
    double tallest = columnSpans.stream().mapToDouble(s -> s[1]).max().orElse(0);
    for (int c = 0; c < columns; c++) {
      double shift = (tallest - columnSpans.get(c)[1]) / 2;
      for (Amplifier amp : byColumn.get(c)) {
        origin.get(amp)[1] += shift;
      }
    }
    for (Amplifier amp : amps) {
      double[] o = origin.get(amp);
      blocks.get(amp).emit(out, o[0], o[1]);
    }
    for (Map.Entry<Amplifier, Part> bridge : bridgeBelow.entrySet()) {
      Amplifier upper = bridge.getKey();
      Amplifier lower =
          byColumn.get(rank.get(upper)).get(byColumn.get(rank.get(upper)).indexOf(upper) + 1);
      SectionBlock a = blocks.get(upper);
      SectionBlock b = blocks.get(lower);
      double x = origin.get(upper)[0] - NODE;
      double top = origin.get(upper)[1] + a.minusLegEnd;
      double bottom = origin.get(lower)[1] + b.minusLegEnd;
      double mid = (top + bottom) / 2;
      Part part = bridge.getValue();
      String topNet = part.touches(upper.inMinus()) ? upper.inMinus() : part.netA();
      String bottomNet = lower.inMinus();
      out.wire(topNet, x, top, x, mid - HANG / 2);
      out.verticalPart(part, topNet, x, mid - HANG / 2, mid + HANG / 2);
      out.wire(bottomNet, x, mid + HANG / 2, x, bottom);
    }
    routes(out, blocks, origin, rank);
    fallbackRow(out);
    return out.finish();
  }

  /** Returns each section's column: one more than the highest column of any section feeding it. */
  private Map<Amplifier, Integer> ranks(List<Amplifier> amps) {
    Map<Amplifier, Set<Amplifier>> feeders = new HashMap<>();
    for (Amplifier amp : amps) {
      feeders.put(amp, feedersOf(amp));
    }
    Map<Amplifier, Integer> rank = relax(amps, feeders);
    if (rank == null) {
      // A loop between sections (one feeds another that feeds it back): keep only the feeds that
      // go forward in the stage's own order, so the loop's return is drawn with net flags.
      for (Amplifier amp : amps) {
        feeders.get(amp).removeIf(f -> amps.indexOf(f) >= amps.indexOf(amp));
      }
      rank = relax(amps, feeders);
    }
    return rank;
  }

  /** Returns the longest feed path to each section, or null if the feeds form a loop. */
  private static Map<Amplifier, Integer> relax(
      List<Amplifier> amps, Map<Amplifier, Set<Amplifier>> feeders) {
    Map<Amplifier, Integer> rank = new HashMap<>();
    amps.forEach(a -> rank.put(a, 0));
    for (int round = 0; round <= amps.size(); round++) {
      boolean changed = false;
      for (Amplifier amp : amps) {
        for (Amplifier feeder : feeders.get(amp)) {
          if (rank.get(feeder) + 1 > rank.get(amp)) {
            rank.put(amp, rank.get(feeder) + 1);
            changed = true;
          }
        }
      }
      if (!changed) {
        return rank;
      }
    }
    return null;
  }

  /** Returns the sections whose output reaches this section's inputs through its input networks. */
  private Set<Amplifier> feedersOf(Amplifier amp) {
    Set<Amplifier> feeders = new HashSet<>();
    Set<String> seen = new HashSet<>();
    List<String> todo = new ArrayList<>(List.of(amp.inMinus(), amp.inPlus()));
    while (!todo.isEmpty()) {
      String net = todo.remove(todo.size() - 1);
      if (!seen.add(net)) {
        continue;
      }
      Amplifier owner = outOwner.get(net);
      if (owner != null) {
        if (owner != amp) {
          feeders.add(owner);
        }
        continue;
      }
      boolean ownPin = net.equals(amp.inMinus()) || net.equals(amp.inPlus());
      if (stage.isDriven(net) || (pinNets.contains(net) && !ownPin)) {
        continue;
      }
      for (Part part : stage.parts()) {
        if (part.touches(net)) {
          todo.add(SectionLayout.other(part, net));
        }
      }
    }
    return feeders;
  }

  private void routes(
      SheetOut out,
      Map<Amplifier, SectionBlock> blocks,
      Map<Amplifier, double[]> origin,
      Map<Amplifier, Integer> rank) {
    Map<Integer, Integer> channelsUsed = new HashMap<>();
    Set<Amplifier> routedFrom = new HashSet<>();
    for (Amplifier target : stage.amplifiers()) {
      SectionBlock block = blocks.get(target);
      double[] o = origin.get(target);
      int column = rank.get(target);
      for (Pending route : block.routes) {
        Amplifier source = outOwner.get(route.net());
        SectionBlock from = blocks.get(source);
        double[] so = origin.get(source);
        double sx = so[0] + from.outEndX;
        double sy = so[1];
        double tx = o[0] + route.x();
        double ty = o[1] + route.y();
        if (rank.get(source) < column && sx < tx - 20) {
          routedFrom.add(source);
          if (Math.abs(sy - ty) < 1e-9) {
            out.wire(route.net(), sx, sy, tx, ty);
            continue;
          }
          int index = channelsUsed.merge(column, 1, Integer::sum) - 1;
          double channel = columnLeftEdge(blocks, origin, rank, column) - 24 - index * CHANNEL - 16;
          out.wire(route.net(), sx, sy, channel, sy);
          out.wire(route.net(), channel, sy, channel, ty);
          out.wire(route.net(), channel, ty, tx, ty);
        } else {
          out.symbol(SymbolKind.FLAG, route.net(), tx, ty, Direction.LEFT);
        }
      }
    }
    for (Amplifier amp : stage.amplifiers()) {
      if (!routedFrom.contains(amp)) {
        double[] o = origin.get(amp);
        out.symbol(
            SymbolKind.OUTPUT, amp.out(), o[0] + blocks.get(amp).outEndX, o[1], Direction.RIGHT);
      }
    }
  }

  private double columnLeftEdge(
      Map<Amplifier, SectionBlock> blocks,
      Map<Amplifier, double[]> origin,
      Map<Amplifier, Integer> rank,
      int column) {
    double left = Double.POSITIVE_INFINITY;
    for (Amplifier amp : stage.amplifiers()) {
      if (rank.get(amp) == column) {
        left = Math.min(left, origin.get(amp)[0] + blocks.get(amp).minX);
      }
    }
    return left;
  }

  /** Draws every part no section claimed in rows at the bottom, a net flag at each end. */
  private void fallbackRow(SheetOut out) {
    List<Part> rest = stage.parts().stream().filter(p -> !used.contains(p.ref())).toList();
    if (rest.isEmpty()) {
      return;
    }
    Box bounds = out.bounds();
    double left = bounds == null ? 0 : bounds.x();
    double y = bounds == null ? 0 : bounds.bottom() + 60;
    double x = left;
    double wrap = Math.max(left + 700, bounds == null ? 700 : bounds.right());
    for (Part part : rest) {
      used.add(part.ref());
      double flagA = flagWidth(part.netA());
      double flagB = flagWidth(part.netB());
      if (x > left && x + flagA + CELL + flagB > wrap) {
        x = left;
        y += ROW;
      }
      double x1 = x + flagA;
      out.symbol(SymbolKind.FLAG, part.netA(), x1, y, Direction.LEFT);
      out.horizontalPart(part, part.netA(), x1, x1 + CELL, y, -1);
      out.symbol(SymbolKind.FLAG, part.netB(), x1 + CELL, y, Direction.RIGHT);
      x = x1 + CELL + flagB + 30;
    }
  }

  private double flagWidth(String net) {
    return measure.width(net, NET_FONT, true) + 24;
  }

  // ---------------------------------------------------------------------------------------------
  // One section

  /** A point still to be joined up once the sections have their places. */
  record Pending(String net, double x, double y) {}

  /**
   * The top of a part that runs from an inner input-side net toward the output, going {@code -d}.
   */
  record Uplink(double x, double y, int d) {}

  private double width(String text, double size, boolean bold) {
    return measure.width(text, size, bold);
  }

  static double line(double size) {
    return Math.ceil(size * 1.3);
  }

  /**
   * Returns the text shown for a part's value, e.g. "4.7 kΩ", "100 nF"; a zener's marking "5V1"
   * (its symbol says it is a zener), a diode's class ("silicon"), an LED's colour ("red LED"), a
   * trimmer's value and wiper ("10 kΩ at 0.5").
   */
  static String valueText(Part part) {
    return switch (part.kind()) {
      case ZENER -> ZenerMarking.format(part.value());
      case DIODE -> part.diodeClass().word();
      case LED -> part.colour().word() + " LED";
      case TRIMMER, POTENTIOMETER ->
          SiValue.format(part.value(), part.kind().unit(), 3)
              + " at "
              + java.math.BigDecimal.valueOf(part.position()).stripTrailingZeros().toPlainString();
      default -> SiValue.format(part.value(), part.kind().unit(), 3);
    };
  }
}
