package com.stagewise.ui.drawing;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import java.util.ArrayList;
import java.util.List;

/**
 * A laid-out schematic in drawing coordinates (pixels at scale 1, y down): every part, op-amp
 * section, wire, junction dot, symbol and caption with its place. Pure data, drawn by {@link
 * SchematicDrawing} and checked by tests without the toolkit.
 *
 * @param parts the resistors and capacitors
 * @param amps the op-amp sections
 * @param wires straight wire segments, each on one net
 * @param dots junction dots (three or more wire ends meet)
 * @param symbols ground, rail, input, output and net-name symbols
 * @param captions designators, values, pin numbers and names
 */
record Sheet(
    List<PartGlyph> parts,
    List<AmpGlyph> amps,
    List<Wire> wires,
    List<Dot> dots,
    List<Symbol> symbols,
    List<Caption> captions) {

  /** What a caption says, which sets its style. */
  enum CaptionKind {
    DESIGNATOR,
    VALUE,
    PIN_NUMBER,
    PIN_SIGN,
    AMP_REF,
    NET_NAME
  }

  /** The kinds of symbol at the end of a wire. */
  enum SymbolKind {
    GROUND,
    RAIL,
    INPUT,
    OUTPUT,
    FLAG
  }

  /** Which way a symbol points from its wire end. */
  enum Direction {
    UP,
    DOWN,
    LEFT,
    RIGHT
  }

  /**
   * One line of text.
   *
   * @param text the words
   * @param box where it goes (top-left corner, measured width and line height)
   * @param size the font size in pixels
   * @param bold whether bold
   * @param kind what it says
   */
  record Caption(String text, Box box, double size, boolean bold, CaptionKind kind) {}

  /**
   * A two-terminal part between two points, horizontal or vertical, its body centred.
   *
   * @param part the part drawn
   * @param x1 first terminal x
   * @param y1 first terminal y
   * @param x2 second terminal x
   * @param y2 second terminal y
   * @param body the body's box (resistor rectangle or capacitor plates)
   * @param firstNet the net at (x1, y1), or null when it does not matter
   * @param free the side of the axis without captions, where a symbol draws its extras (a trimmer's
   *     wiper, an LED's arrows, lead names): +1 right of a vertical part or below a horizontal one,
   *     −1 left or above
   */
  record PartGlyph(
      Part part, double x1, double y1, double x2, double y2, Box body, String firstNet, int free) {
    boolean vertical() {
      return x1 == x2;
    }

    /** Whether the part's first net (a junction's anode, a trimmer's end 1) is at (x1, y1). */
    boolean firstAtStart() {
      return firstNet == null || part.netA().equals(firstNet) || !part.netB().equals(firstNet);
    }
  }

  /**
   * One op-amp section drawn as a triangle pointing right.
   *
   * @param amp the section
   * @param x the left edge of the triangle
   * @param y the vertical centre (the output's height)
   * @param flipped whether the non-inverting input is the upper one
   */
  record AmpGlyph(Amplifier amp, double x, double y, boolean flipped) {
    static final double WIDTH = 100;
    static final double HALF_HEIGHT = 60;
    static final double PIN_OFFSET = 30;

    Box box() {
      return new Box(x, y - HALF_HEIGHT, WIDTH, 2 * HALF_HEIGHT);
    }

    /** Returns the triangle as a few boxes side by side (stepped), for overlap checks. */
    List<Box> slices() {
      List<Box> slices = new ArrayList<>();
      int n = 8;
      for (int i = 0; i < n; i++) {
        double left = x + i * WIDTH / n;
        double half = HALF_HEIGHT * (1 - (double) i / n);
        slices.add(new Box(left, y - half, WIDTH / n, 2 * half));
      }
      return slices;
    }

    double minusY() {
      return flipped ? y + PIN_OFFSET : y - PIN_OFFSET;
    }

    double plusY() {
      return flipped ? y - PIN_OFFSET : y + PIN_OFFSET;
    }
  }

  /**
   * A straight wire on one net.
   *
   * @param net the net
   * @param x1 one end x
   * @param y1 one end y
   * @param x2 other end x
   * @param y2 other end y
   */
  record Wire(String net, double x1, double y1, double x2, double y2) {
    boolean horizontal() {
      return y1 == y2;
    }

    double length() {
      return Math.abs(x2 - x1) + Math.abs(y2 - y1);
    }

    /** Returns the wire as a thin box for overlap checks. */
    Box box(double thickness) {
      return Box.spanning(x1, y1, x2, y2).grown(thickness / 2);
    }

    /** Returns whether the point lies on the wire strictly between its ends. */
    boolean hasInside(double x, double y) {
      // A point a rounding error away from an end is that end, not inside.
      double e = 1e-6;
      if (horizontal()) {
        return Math.abs(y - y1) < e && x > Math.min(x1, x2) + e && x < Math.max(x1, x2) - e;
      }
      return Math.abs(x - x1) < e && y > Math.min(y1, y2) + e && y < Math.max(y1, y2) - e;
    }
  }

  /** A junction dot. */
  record Dot(double x, double y) {}

  /**
   * A symbol at a wire end.
   *
   * @param kind ground, rail, input, output or a net-name flag
   * @param net the net it stands for
   * @param x the wire end x
   * @param y the wire end y
   * @param direction which way it points from the wire end
   * @param box the area it covers, caption included
   * @param caption the net name shown with it, if any (null for ground)
   */
  record Symbol(
      SymbolKind kind,
      String net,
      double x,
      double y,
      Direction direction,
      Box box,
      Caption caption) {}

  /** Returns the box holding everything drawn. */
  Box bounds() {
    Box all = null;
    for (Box box : obstacles()) {
      all = all == null ? box : all.union(box);
    }
    return all == null ? new Box(0, 0, 1, 1) : all;
  }

  /** Returns every box that a label must not cover: bodies, triangles, symbols, captions, wires. */
  List<Box> obstacles() {
    List<Box> boxes = new ArrayList<>();
    parts.forEach(p -> boxes.add(p.body()));
    amps.forEach(a -> boxes.addAll(a.slices()));
    symbols.forEach(s -> boxes.add(s.box()));
    captions.forEach(c -> boxes.add(c.box()));
    wires.forEach(w -> boxes.add(w.box(2)));
    return boxes;
  }
}
