package com.stagewise.ui.drawing;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.ZenerMarking;
import com.stagewise.ui.drawing.Sheet.AmpGlyph;
import com.stagewise.ui.drawing.Sheet.Caption;
import com.stagewise.ui.drawing.Sheet.CaptionKind;
import com.stagewise.ui.drawing.Sheet.Direction;
import com.stagewise.ui.drawing.Sheet.Dot;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import com.stagewise.ui.drawing.Sheet.Symbol;
import com.stagewise.ui.drawing.Sheet.SymbolKind;
import com.stagewise.ui.drawing.Sheet.Wire;
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

  private SchematicLayout(Stage stage, TextMeasure measure) {
    this.stage = stage;
    this.measure = measure;
    for (Amplifier amp : stage.amplifiers()) {
      outOwner.putIfAbsent(amp.out(), amp);
      pinNets.add(amp.inPlus());
      pinNets.add(amp.inMinus());
    }
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
    Map<Amplifier, Block> blocks = new LinkedHashMap<>();
    for (Amplifier amp : amps) {
      blocks.put(amp, section(amp, flipped.contains(amp)));
    }

    Out out = new Out();
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
        Block block = blocks.get(column.get(i));
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
      Block a = blocks.get(upper);
      Block b = blocks.get(lower);
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
          todo.add(other(part, net));
        }
      }
    }
    return feeders;
  }

  private void routes(
      Out out,
      Map<Amplifier, Block> blocks,
      Map<Amplifier, double[]> origin,
      Map<Amplifier, Integer> rank) {
    Map<Integer, Integer> channelsUsed = new HashMap<>();
    Set<Amplifier> routedFrom = new HashSet<>();
    for (Amplifier target : stage.amplifiers()) {
      Block block = blocks.get(target);
      double[] o = origin.get(target);
      int column = rank.get(target);
      for (Pending route : block.routes) {
        Amplifier source = outOwner.get(route.net());
        Block from = blocks.get(source);
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
      Map<Amplifier, Block> blocks,
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
  private void fallbackRow(Out out) {
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

  private Block section(Amplifier amp, boolean flipped) {
    Block b = new Block();
    double mY = flipped ? AmpGlyph.PIN_OFFSET : -AmpGlyph.PIN_OFFSET;
    double pY = -mY;
    int dM = flipped ? 1 : -1;
    int dP = -dM;
    String minus = amp.inMinus();
    String plus = amp.inPlus();
    String outNet = amp.out();
    b.amp = new AmpGlyph(amp, 0, 0, flipped);
    b.wire(minus, 0, mY, -NODE, mY);
    b.wire(plus, 0, pY, -NODE, pY);
    b.wire(outNet, AmpGlyph.WIDTH, 0, OUT_X, 0);
    ampCaptions(b, amp, mY, pY);

    // Feedback lanes on the inverting side, positive feedback on the other.
    List<Part> feedback =
        claim(p -> p.touches(minus) && p.touches(outNet) && !minus.equals(outNet));
    b.minusLegEnd = mY;
    double prevLeft = mY;
    double prevRight = 0;
    double lane = mY;
    int lanes = 0;
    if (minus.equals(outNet)) {
      lane = mY + dM * LANE;
      b.wire(minus, -NODE, mY, -NODE, lane);
      b.wire(minus, -NODE, lane, OUT_X, lane);
      b.wire(minus, OUT_X, lane, OUT_X, 0);
      prevRight = lane;
      lanes = 1;
      b.minusLegEnd = lane;
    }
    for (Part part : feedback) {
      lane = mY + dM * (LANE + lanes * LANE_STEP);
      b.wire(minus, -NODE, prevLeft, -NODE, lane);
      b.horizontalPart(part, minus, -NODE, OUT_X, lane, dM);
      b.wire(outNet, OUT_X, lane, OUT_X, prevRight);
      prevLeft = lane;
      prevRight = lane;
      lanes++;
      b.minusLegEnd = lane;
    }
    double upLane = mY + dM * (LANE + lanes * LANE_STEP);
    double upRight = prevRight;

    List<Part> positive = claim(p -> p.touches(plus) && p.touches(outNet) && !plus.equals(outNet));
    double pPrevLeft = pY;
    double pPrevRight = 0;
    int pLanes = 0;
    for (Part part : positive) {
      double pLane = pY + dP * (LANE + pLanes * LANE_STEP);
      b.wire(plus, -NODE, pPrevLeft, -NODE, pLane);
      b.horizontalPart(part, plus, -NODE, OUT_X, pLane, dP);
      b.wire(outNet, OUT_X, pLane, OUT_X, pPrevRight);
      pPrevLeft = pLane;
      pPrevRight = pLane;
      pLanes++;
    }
    double downLane = pY + dP * (LANE + pLanes * LANE_STEP);
    double downRight = pPrevRight;

    // The input networks, grown as trees to the left of each input pin.
    if (!minus.equals(outNet)) {
      if (isTerminal(minus, amp)) {
        terminal(b, minus, -NODE, mY, dM, amp);
      } else {
        node(b, minus, -NODE, mY, dM, feedback.isEmpty(), amp);
      }
    }
    if (isTerminal(plus, amp)) {
      terminal(b, plus, -NODE, pY, dP, amp);
    } else if (!plus.equals(outNet)) {
      node(b, plus, -NODE, pY, dP, positive.isEmpty(), amp);
    }
    // Parts from an inner input-side net to the output run around the feedback lanes.
    for (Uplink up : b.uplinks) {
      boolean fromPlusSide = up.d() == dP;
      double laneY = fromPlusSide ? upLane : downLane;
      double right = fromPlusSide ? upRight : downRight;
      b.wire(outNet, up.x(), up.y(), up.x(), laneY);
      b.wire(outNet, up.x(), laneY, OUT_X, laneY);
      b.wire(outNet, OUT_X, laneY, OUT_X, right);
      if (fromPlusSide) {
        upLane += dM * LANE_STEP;
        upRight = laneY;
      } else {
        downLane += dP * LANE_STEP;
        downRight = laneY;
      }
    }

    // Loads: parts from the output to ground or a rail, hanging below the output wire.
    List<Part> loads = claim(p -> p.touches(outNet) && isSupplyOrGround(other(p, outNet)));
    double x = OUT_X + 44;
    double end = OUT_X + 30;
    for (Part part : loads) {
      String far = other(part, outNet);
      b.verticalPart(part, outNet, x, 0, HANG);
      b.supplySymbol(far, x, HANG, Direction.DOWN);
      end = x + 30;
      x += HSTEP;
    }
    b.wire(outNet, OUT_X, 0, end, 0);
    b.outEndX = end;
    b.finish();
    return b;
  }

  private void ampCaptions(Block b, Amplifier amp, double mY, double pY) {
    double topY = Math.min(mY, pY);
    double bottomY = Math.max(mY, pY);
    String topPin = Integer.toString(amp.pin(mY < pY ? Terminal.IN_MINUS : Terminal.IN_PLUS));
    String bottomPin = Integer.toString(amp.pin(mY < pY ? Terminal.IN_PLUS : Terminal.IN_MINUS));
    b.caption(
        topPin,
        -10 - width(topPin, PIN_FONT, false) / 2,
        topY - 3 - line(PIN_FONT),
        PIN_FONT,
        false,
        CaptionKind.PIN_NUMBER);
    b.caption(
        bottomPin,
        -10 - width(bottomPin, PIN_FONT, false) / 2,
        bottomY + 3,
        PIN_FONT,
        false,
        CaptionKind.PIN_NUMBER);
    String outPin = Integer.toString(amp.pin(Terminal.OUT));
    b.caption(
        outPin, AmpGlyph.WIDTH + 6, -3 - line(PIN_FONT), PIN_FONT, false, CaptionKind.PIN_NUMBER);
    b.caption("\u2212", 6, mY - line(17) / 2, 17, true, CaptionKind.PIN_SIGN);
    b.caption("+", 6, pY - line(17) / 2, 17, true, CaptionKind.PIN_SIGN);
    String ref = amp.ref();
    b.caption(
        ref,
        38 - width(ref, PART_FONT, true) / 2 + 4,
        -line(PART_FONT) / 2,
        PART_FONT,
        true,
        CaptionKind.AMP_REF);
    // Supply pins: short stubs from the triangle's top and bottom edges, each ending in its rail.
    double edge = AmpGlyph.HALF_HEIGHT * (1 - SUPPLY_X / AmpGlyph.WIDTH);
    // Long enough for the pin number to sit beside the stub, clear of the rail's bar.
    double stub = line(PIN_FONT) + 8;
    b.wire(amp.vPlus(), SUPPLY_X, -edge, SUPPLY_X, -edge - stub);
    b.supplySymbol(amp.vPlus(), SUPPLY_X, -edge - stub, Direction.UP);
    b.wire(amp.vMinus(), SUPPLY_X, edge, SUPPLY_X, edge + stub);
    b.supplySymbol(amp.vMinus(), SUPPLY_X, edge + stub, Direction.DOWN);
    String vp = Integer.toString(amp.pin(Terminal.V_PLUS));
    String vm = Integer.toString(amp.pin(Terminal.V_MINUS));
    b.caption(
        vp, SUPPLY_X + 11, -edge - 3 - line(PIN_FONT), PIN_FONT, false, CaptionKind.PIN_NUMBER);
    b.caption(vm, SUPPLY_X + 11, edge + 3, PIN_FONT, false, CaptionKind.PIN_NUMBER);
  }

  /** Draws what sits directly on an input pin that is itself a driven net or another's output. */
  private void terminal(Block b, String net, double x, double y, int d, Amplifier amp) {
    if (outOwner.containsKey(net) && outOwner.get(net) != amp) {
      b.routes.add(new Pending(net, x, y));
    } else if (stage.input(net).isPresent()) {
      b.inputs.add(new Pending(net, x, y));
    } else if (isSupplyOrGround(net)) {
      if (d > 0) {
        b.wire(net, x, y, x, y + 14);
        b.supplySymbol(net, x, y + 14, Direction.DOWN);
      } else {
        b.wire(net, x, y, x - 24, y);
        b.supplySymbol(net, x - 24, y, Direction.LEFT);
      }
    } else {
      b.wire(net, x, y, x - 24, y);
      b.symbol(SymbolKind.FLAG, net, x - 24, y, Direction.LEFT);
    }
  }

  private boolean isTerminal(String net, Amplifier amp) {
    return stage.isDriven(net) || (outOwner.containsKey(net) && outOwner.get(net) != amp);
  }

  private boolean isSupplyOrGround(String net) {
    return net.equals(stage.ground()) || stage.rail(net).isPresent();
  }

  /**
   * Lays out the tree of parts hanging off {@code net}, whose node is at (x, y), growing left and
   * in direction {@code d} (+1 down, −1 up); returns the lowest (d = +1) or highest extent reached.
   */
  private double node(
      Block b, String net, double x, double y, int d, boolean columnsFromNode, Amplifier amp) {
    List<Part> here = claim(p -> p.touches(net));
    List<Part> hangers = new ArrayList<>();
    List<Part> uplinks = new ArrayList<>();
    List<Part> rows = new ArrayList<>();
    for (Part part : here) {
      String far = other(part, net);
      if (far.equals(amp.out())) {
        uplinks.add(part);
      } else if (d > 0 && isSupplyOrGround(far)) {
        hangers.add(part);
      } else {
        rows.add(part);
      }
    }
    double extent = y + d * 30;
    int column = 0;
    double lastColumn = x;
    for (Part part : hangers) {
      double cx = x - (columnsFromNode ? BUS : HSTEP) - column * HSTEP;
      String far = other(part, net);
      b.verticalPart(part, net, cx, y, y + HANG);
      b.supplySymbol(far, cx, y + HANG, Direction.DOWN);
      extent = Math.max(extent, y + HANG + 28);
      lastColumn = cx;
      column++;
    }
    for (Part part : uplinks) {
      double cx = x - (columnsFromNode ? BUS : HSTEP) - column * HSTEP;
      b.verticalPart(part, net, cx, y, y - d * HANG);
      b.uplinks.add(new Uplink(cx, y - d * HANG, d));
      lastColumn = cx;
      column++;
    }
    // Every node gets a short wire of its own, so that its net has somewhere to carry a label.
    double rowX = (column > 0 ? lastColumn : x) - BUS;
    if (!rows.isEmpty()) {
      b.wire(net, x, y, rowX, y);
    } else if (column > 0) {
      b.wire(net, x, y, lastColumn, y);
    }
    double rowY = y;
    for (int k = 0; k < rows.size(); k++) {
      Part part = rows.get(k);
      if (k > 0) {
        double nextY =
            d > 0 ? Math.max(rowY + ROW, extent + 24) : Math.min(rowY - ROW, extent - 24);
        b.wire(net, rowX, rowY, rowX, nextY);
        rowY = nextY;
      }
      double endX = rowX - CELL;
      String far = other(part, net);
      b.horizontalPart(part, far, endX, rowX, rowY, d);
      double reach = rowY + d * 30;
      if (outOwner.containsKey(far) && outOwner.get(far) != amp) {
        b.routes.add(new Pending(far, endX, rowY));
      } else if (stage.input(far).isPresent()) {
        b.inputs.add(new Pending(far, endX, rowY));
      } else if (isSupplyOrGround(far)) {
        b.supplySymbol(
            far, endX, rowY, far.equals(stage.ground()) ? Direction.DOWN : Direction.LEFT);
      } else if (stage.isDriven(far) || pinNets.contains(far) || b.visited.contains(far)) {
        b.symbol(SymbolKind.FLAG, far, endX, rowY, Direction.LEFT);
      } else {
        b.visited.add(far);
        reach = node(b, far, endX, rowY, d, true, amp);
      }
      extent = d > 0 ? Math.max(extent, reach) : Math.min(extent, reach);
    }
    return extent;
  }

  private List<Part> claim(java.util.function.Predicate<Part> test) {
    List<Part> claimed = new ArrayList<>();
    for (Part part : stage.parts()) {
      if (!used.contains(part.ref()) && test.test(part)) {
        used.add(part.ref());
        claimed.add(part);
      }
    }
    return claimed;
  }

  private static String other(Part part, String net) {
    return part.netA().equals(net) ? part.netB() : part.netA();
  }

  private double width(String text, double size, boolean bold) {
    return measure.width(text, size, bold);
  }

  private static double line(double size) {
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

  // ---------------------------------------------------------------------------------------------
  // Collecting elements

  /** Collects elements in some coordinate frame. */
  private class Canvas {
    final List<PartGlyph> parts = new ArrayList<>();
    final List<AmpGlyph> amps = new ArrayList<>();
    final List<Wire> wires = new ArrayList<>();
    final List<Symbol> symbols = new ArrayList<>();
    final List<Caption> captions = new ArrayList<>();

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
      symbol(
          net.equals(stage.ground()) ? SymbolKind.GROUND : SymbolKind.RAIL, net, x, y, direction);
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

  /** One section drawn in its own frame: triangle's left edge at x = 0, output at y = 0. */
  private final class Block extends Canvas {
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
    void emit(Out out, double dx, double dy) {
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
        out.captions.add(
            new Caption(c.text(), c.box().moved(dx, dy), c.size(), c.bold(), c.kind()));
      }
    }
  }

  /** The whole sheet being assembled. */
  private final class Out extends Canvas {
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
}
