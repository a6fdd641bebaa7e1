package com.stagewise.ui.drawing;

import com.stagewise.circuit.Part;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import com.stagewise.ui.drawing.Sheet.Wire;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.function.Consumer;
import javafx.scene.Cursor;
import javafx.scene.Group;
import javafx.scene.paint.Color;
import javafx.scene.shape.Line;
import javafx.scene.shape.StrokeLineCap;

/**
 * The touch targets of a schematic: every wire stands for its net, every part's lead for that lead
 * ({@code R2.1}, {@code D1.a}, {@code D1.k}, {@code RV1.w}), so that a point to probe can be tapped
 * where it is drawn. The points chosen are drawn lit. A target is 16 px thick at scale 1, wider
 * than the line it covers (finger-sized along its length).
 */
public final class SchematicTargets {
  private static final double THICK = 16;
  private Consumer<String> onChosen = point -> {};
  private Set<String> chosen = Set.of();
  private Runnable changed = () -> {};

  /** Sets what happens when a net or a lead is tapped: it gets the point's name. */
  public void setOnPointChosen(Consumer<String> action) {
    onChosen = action == null ? point -> {} : action;
  }

  /** Lights the points given (nets and part leads); an empty set lights none. */
  public void setChosen(Set<String> points) {
    chosen = points == null ? Set.of() : Set.copyOf(points);
    changed.run();
  }

  void whenChanged(Runnable redraw) {
    changed = redraw;
  }

  /** One target: a point's name and the segment that stands for it. */
  record Target(String point, double x1, double y1, double x2, double y2) {}

  /** Returns the targets of a laid-out sheet: wires first, then part leads (drawn on top). */
  static List<Target> of(Sheet sheet) {
    List<Target> targets = new ArrayList<>();
    for (Wire w : sheet.wires()) {
      targets.add(new Target(w.net(), w.x1(), w.y1(), w.x2(), w.y2()));
    }
    for (PartGlyph g : sheet.parts()) {
      Part p = g.part();
      List<String> leads = p.leads();
      String first = p.ref() + "." + leads.get(0);
      String last = p.ref() + "." + leads.get(leads.size() - 1);
      String atStart = g.firstAtStart() ? first : last;
      String atEnd = g.firstAtStart() ? last : first;
      Box b = g.body();
      if (g.vertical()) {
        boolean down = g.y1() <= g.y2();
        targets.add(new Target(atStart, g.x1(), g.y1(), g.x1(), down ? b.y() : b.bottom()));
        targets.add(new Target(atEnd, g.x2(), g.y2(), g.x2(), down ? b.bottom() : b.y()));
      } else {
        boolean right = g.x1() <= g.x2();
        targets.add(new Target(atStart, g.x1(), g.y1(), right ? b.x() : b.right(), g.y1()));
        targets.add(new Target(atEnd, g.x2(), g.y2(), right ? b.right() : b.x(), g.y2()));
      }
      if (p.kind().isTrimmer()) {
        // The wiper's arrow comes in from the side without captions (PartShape).
        double across = (g.vertical() ? b.w() : b.h()) / 2;
        int f = g.free();
        targets.add(
            g.vertical()
                ? new Target(
                    p.ref() + ".w",
                    b.cx() + f * (across + 1),
                    b.cy(),
                    b.cx() + f * (across + 18),
                    b.cy())
                : new Target(
                    p.ref() + ".w",
                    b.cx(),
                    b.cy() + f * (across + 1),
                    b.cx(),
                    b.cy() + f * (across + 18)));
      }
    }
    return targets;
  }

  /** Returns the layer to put on top of the drawing: lit points, then the invisible targets. */
  Group layer(Sheet sheet) {
    Group layer = new Group();
    List<Target> targets = of(sheet);
    for (Target t : targets) {
      if (chosen.contains(t.point())) {
        Line lit = line(t, 7, Palette.HIGHLIGHT.deriveColor(0, 1, 1, 0.75));
        lit.setMouseTransparent(true);
        layer.getChildren().add(lit);
      }
    }
    for (Target t : targets) {
      Line hit = line(t, THICK, Color.TRANSPARENT);
      hit.setId("point-" + t.point());
      hit.setCursor(Cursor.HAND);
      hit.setOnMouseClicked(e -> onChosen.accept(t.point()));
      layer.getChildren().add(hit);
    }
    return layer;
  }

  private static Line line(Target t, double width, Color colour) {
    Line line = new Line(t.x1(), t.y1(), t.x2(), t.y2());
    line.setStroke(colour);
    line.setStrokeWidth(width);
    line.setStrokeLineCap(StrokeLineCap.BUTT);
    return line;
  }
}
