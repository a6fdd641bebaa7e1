package com.stagewise.ui.drawing;

import static com.stagewise.ui.drawing.SchematicLayout.BUS;
import static com.stagewise.ui.drawing.SchematicLayout.CELL;
import static com.stagewise.ui.drawing.SchematicLayout.HANG;
import static com.stagewise.ui.drawing.SchematicLayout.HSTEP;
import static com.stagewise.ui.drawing.SchematicLayout.LANE;
import static com.stagewise.ui.drawing.SchematicLayout.LANE_STEP;
import static com.stagewise.ui.drawing.SchematicLayout.NODE;
import static com.stagewise.ui.drawing.SchematicLayout.OUT_X;
import static com.stagewise.ui.drawing.SchematicLayout.PART_FONT;
import static com.stagewise.ui.drawing.SchematicLayout.PIN_FONT;
import static com.stagewise.ui.drawing.SchematicLayout.ROW;
import static com.stagewise.ui.drawing.SchematicLayout.SUPPLY_X;
import static com.stagewise.ui.drawing.SchematicLayout.line;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.ui.drawing.SchematicLayout.Pending;
import com.stagewise.ui.drawing.SchematicLayout.TextMeasure;
import com.stagewise.ui.drawing.SchematicLayout.Uplink;
import com.stagewise.ui.drawing.Sheet.AmpGlyph;
import com.stagewise.ui.drawing.Sheet.CaptionKind;
import com.stagewise.ui.drawing.Sheet.Direction;
import com.stagewise.ui.drawing.Sheet.SymbolKind;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Lays out one op-amp section with the parts it claims (its feedback network, the input and load
 * parts hanging off its nets) in the section's own frame: the triangle's left edge at x = 0, its
 * output at y = 0. Which parts a section claims is shared with the rest of the sheet ({@code
 * used}), so that each part is drawn once.
 */
final class SectionLayout {
  private final Stage stage;
  private final TextMeasure measure;
  private final Set<String> used;
  private final Map<String, Amplifier> outOwner;
  private final Set<String> pinNets;

  SectionLayout(
      Stage stage,
      TextMeasure measure,
      Set<String> used,
      Map<String, Amplifier> outOwner,
      Set<String> pinNets) {
    this.stage = stage;
    this.measure = measure;
    this.used = used;
    this.outOwner = outOwner;
    this.pinNets = pinNets;
  }

  /** Lays out one section with the parts around it, in its own frame. */
  SectionBlock section(Amplifier amp, boolean flipped) {
    SectionBlock b = new SectionBlock(measure, stage.ground());
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

  private void ampCaptions(SectionBlock b, Amplifier amp, double mY, double pY) {
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
  private void terminal(SectionBlock b, String net, double x, double y, int d, Amplifier amp) {
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
      SectionBlock b,
      String net,
      double x,
      double y,
      int d,
      boolean columnsFromNode,
      Amplifier amp) {
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

  /** Returns the net at a two-lead part's other end. */
  static String other(Part part, String net) {
    return part.netA().equals(net) ? part.netB() : part.netA();
  }

  private double width(String text, double size, boolean bold) {
    return measure.width(text, size, bold);
  }
}
