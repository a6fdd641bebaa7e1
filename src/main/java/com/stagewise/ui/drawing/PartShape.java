package com.stagewise.ui.drawing;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import java.util.ArrayList;
import java.util.List;

/**
 * The body of a diode, zener, LED or trimmer as strokes, filled shapes and lead names, worked out
 * once for both the screen and the exported picture.
 *
 * <p>The usual symbols (IEC 60617 in their common form): a diode is a triangle pointing from anode
 * to cathode with a bar at the cathode; a zener's bar has bent ends; an LED adds two arrows
 * pointing away; a trimmer is the resistor's box with an arrow to the middle of its track (the
 * wiper). Lead names follow the readings contract: {@code a} and {@code k} beside a junction's
 * anode and cathode, {@code 1}, {@code 2} beside a trimmer's ends and {@code w} with the wiper's
 * net beside its arrow.
 */
final class PartShape {
  /** A straight stroke. */
  record Stroke(double x1, double y1, double x2, double y2, double width) {}

  /** A filled closed polygon, {@code x0, y0, x1, y1, …}. */
  record Fill(double[] points) {}

  /** A small text whose top-left corner is at (x, y). */
  record Label(double x, double y, String text) {}

  /** The size of the lead names. */
  static final double LEAD_FONT = 11;

  final List<Stroke> strokes = new ArrayList<>();
  final List<Fill> fills = new ArrayList<>();
  final List<Label> labels = new ArrayList<>();

  private PartShape() {}

  /** Returns whether a part is drawn by this class (not a plain resistor or capacitor). */
  static boolean drawnHere(Part part) {
    return part.kind().isJunction() || part.kind().isTrimmer();
  }

  /** Returns the body of a diode, zener, LED or trimmer. */
  static PartShape of(PartGlyph glyph) {
    PartShape shape = new PartShape();
    if (glyph.part().kind().isTrimmer()) {
      shape.trimmer(glyph);
    } else {
      shape.junction(glyph);
    }
    return shape;
  }

  /**
   * A point on the glyph's axis: {@code along} from the first net's end of the body towards the
   * second (0 to 1), {@code across} to the side (positive: right of the axis for a vertical part,
   * below it for a horizontal one).
   */
  private double[] at(PartGlyph g, double along, double across) {
    Box b = g.body();
    boolean forward = g.firstAtStart() == startsLow(g);
    double t = forward ? along : 1 - along;
    if (g.vertical()) {
      return new double[] {b.cx() + across, b.y() + t * b.h()};
    }
    return new double[] {b.x() + t * b.w(), b.cy() + across};
  }

  /** Whether (x1, y1) is the top or left end. */
  private static boolean startsLow(PartGlyph g) {
    return g.vertical() ? g.y1() <= g.y2() : g.x1() <= g.x2();
  }

  private void line(double[] a, double[] b, double width) {
    strokes.add(new Stroke(a[0], a[1], b[0], b[1], width));
  }

  private void junction(PartGlyph g) {
    double half = 9;
    int f = g.free();
    // Leads through the body up to the triangle and from the bar.
    line(at(g, 0, 0), at(g, 0.3, 0), 2);
    line(at(g, 0.7, 0), at(g, 1, 0), 2);
    double[] b1 = at(g, 0.3, -half);
    double[] b2 = at(g, 0.3, half);
    double[] tip = at(g, 0.7, 0);
    fills.add(new Fill(new double[] {b1[0], b1[1], b2[0], b2[1], tip[0], tip[1]}));
    line(at(g, 0.7, -half), at(g, 0.7, half), 2.6);
    if (g.part().kind() == PartKind.ZENER) {
      line(at(g, 0.7, -half), at(g, 0.62, -half - 4), 2.2);
      line(at(g, 0.7, half), at(g, 0.78, half + 4), 2.2);
    }
    if (g.part().kind() == PartKind.LED) {
      // Two arrows pointing away from the junction, on the side without captions.
      for (double start : new double[] {0.42, 0.58}) {
        double[] from = at(g, start, f * (half + 2));
        double[] to = at(g, start + 0.12, f * (half + 12));
        line(from, to, 1.6);
        double[] wing1 = at(g, start + 0.04, f * (half + 12));
        double[] wing2 = at(g, start + 0.14, f * (half + 6));
        fills.add(new Fill(new double[] {to[0], to[1], wing1[0], wing1[1], wing2[0], wing2[1]}));
      }
    }
    label(at(g, 0.1, f * (half + 9)), "a");
    label(at(g, 0.9, f * (half + 9)), "k");
  }

  private void trimmer(PartGlyph g) {
    // The resistor's box is drawn as for any resistor; the wiper's arrow comes in from the side
    // without captions, its net named beside the arrow's tail.
    int f = g.free();
    double across = (g.vertical() ? g.body().w() : g.body().h()) / 2;
    double[] tip = at(g, 0.5, f * (across + 1));
    double[] tail = at(g, 0.5, f * (across + 18));
    line(tail, tip, 2);
    double[] w1 = at(g, 0.42, f * (across + 8));
    double[] w2 = at(g, 0.58, f * (across + 8));
    fills.add(new Fill(new double[] {tip[0], tip[1], w1[0], w1[1], w2[0], w2[1]}));
    String wiper = "w: " + g.part().wiper();
    double width = 0.6 * LEAD_FONT * wiper.length();
    if (g.vertical()) {
      // Left or right of the tail, on the axis's level.
      double[] c = at(g, 0.5, f * (across + 18 + 4 + width / 2));
      label(c, wiper);
    } else {
      // Beside the tail, towards the second end's side of the picture.
      double[] c = at(g, 0.5, f * (across + 13));
      labels.add(new Label(c[0] + 5, c[1] - LEAD_FONT / 2, wiper));
    }
    // End numbers just outside the body, beside the leads.
    label(at(g, -0.08, f * 8), "1");
    label(at(g, 1.08, f * 8), "2");
  }

  /** A label centred on (x, y), its width estimated at 0.6 of the font size per character. */
  private void label(double[] xy, String text) {
    double width = 0.6 * LEAD_FONT * text.length();
    labels.add(new Label(xy[0] - width / 2, xy[1] - LEAD_FONT / 2, text));
  }
}
