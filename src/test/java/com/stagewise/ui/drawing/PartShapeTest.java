package com.stagewise.ui.drawing;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.LedColour;
import com.stagewise.circuit.Part;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The symbols of the newer parts as the usual schematic convention draws them (IEC 60617 in its
 * common form, common practice): a junction's triangle points from anode to cathode, its bar at the
 * cathode, whichever way round the layout places it; lead names beside the right leads; a trimmer's
 * wiper arrow comes in on the side without captions.
 */
class PartShapeTest {
  private static final Part D1 = Part.diode("D1", DiodeClass.SILICON, "OUT", "RECT");

  /** A horizontal glyph from x = 0 to 100 at y = 50, body 20…80. */
  private static PartGlyph horizontal(Part part, String netAtLeft, int free) {
    return new PartGlyph(part, 0, 50, 100, 50, new Box(22, 41, 56, 18), netAtLeft, free);
  }

  /** A vertical glyph from y = 0 to 100 at x = 50, body 22…78. */
  private static PartGlyph vertical(Part part, String netAtTop) {
    return new PartGlyph(part, 50, 0, 50, 100, new Box(41, 22, 18, 56), netAtTop, -1);
  }

  /** The tip of the junction's triangle: the vertex that is not on the base (two share a line). */
  private static double[] tip(PartShape shape) {
    double[] t = shape.fills.get(0).points();
    // Base ends share x (horizontal part) or y (vertical part); the third vertex is the tip.
    if (t[0] == t[2]) {
      return new double[] {t[4], t[5], t[0]};
    }
    return new double[] {t[4], t[5], t[1]};
  }

  private static PartShape.Label label(PartShape shape, String text) {
    return shape.labels.stream().filter(l -> l.text().equals(text)).findFirst().orElseThrow();
  }

  @ParameterizedTest(name = "anode at the {0}")
  @CsvSource({"left, OUT", "right, RECT"})
  void diode_trianglePointsToTheCathode_andLeadNamesSitAtTheirLeads(String where, String atLeft) {
    PartShape shape = PartShape.of(horizontal(D1, atLeft, 1));
    double[] tip = tip(shape);
    double baseX = tip[2];
    boolean anodeLeft = atLeft.equals("OUT");
    // The tip is on the cathode's side of the base.
    assertThat(tip[0] > baseX).isEqualTo(anodeLeft);
    // "a" on the anode's side of "k".
    assertThat(label(shape, "a").x() < label(shape, "k").x()).isEqualTo(anodeLeft);
    // The bar (a stroke across the axis) sits at the tip.
    assertThat(shape.strokes)
        .anySatisfy(
            s -> {
              assertThat(s.x1()).isEqualTo(tip[0]);
              assertThat(s.x2()).isEqualTo(tip[0]);
            });
  }

  @Test
  void vertical_anodeAtTheBottom_pointsUp() {
    PartShape shape = PartShape.of(vertical(D1, "RECT"));
    double[] tip = tip(shape);
    assertThat(tip[1]).isLessThan(tip[2]);
    assertThat(label(shape, "k").y()).isLessThan(label(shape, "a").y());
  }

  @Test
  void zener_barHasBentEnds_ledHasTwoArrowsOnTheFreeSide() {
    Part zener = Part.zener("ZD1", 5.1, 0.05, "GND", "REF");
    Part led = Part.led("LED1", LedColour.RED, "A", "GND");
    int plainStrokes = PartShape.of(horizontal(D1, "OUT", 1)).strokes.size();
    assertThat(PartShape.of(horizontal(zener, "GND", 1)).strokes).hasSize(plainStrokes + 2);
    PartShape below = PartShape.of(horizontal(led, "A", 1));
    PartShape above = PartShape.of(horizontal(led, "A", -1));
    // Triangle plus two arrow heads; the arrows go below the axis (y > 50) when captions are above.
    assertThat(below.fills).hasSize(3);
    assertThat(below.fills.get(1).points()[1]).isGreaterThan(50);
    assertThat(above.fills.get(1).points()[1]).isLessThan(50);
  }

  @Test
  void trimmer_wiperArrowOnTheFreeSide_namesTheWipersNet() {
    Part rv1 = Part.trimmer("RV1", 10e3, 0.2, "VCC", "NULL", "VEE", 0.5);
    for (int free : new int[] {1, -1}) {
      PartShape shape = PartShape.of(horizontal(rv1, "VCC", free));
      double[] arrowHead = shape.fills.get(0).points();
      // The head's tip touches the body's edge on the free side, in the middle of the track.
      assertThat(arrowHead[0]).isEqualTo(50.0);
      assertThat(Math.signum(arrowHead[1] - 50)).isEqualTo(free);
      PartShape.Label wiper = label(shape, "w: NULL");
      assertThat(Math.signum(wiper.y() + PartShape.LEAD_FONT / 2 - 50)).isEqualTo(free);
      assertThat(label(shape, "1").x()).isLessThan(label(shape, "2").x());
    }
  }
}
