package com.stagewise.ui.drawing;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.Stage;
import com.stagewise.ui.drawing.Sheet.Caption;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import com.stagewise.ui.drawing.Sheet.Wire;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Checks the pure schematic layout of every stage topology without the toolkit. */
class SchematicLayoutTest {

  static Stream<Arguments> stages() {
    return TestCircuits.all().entrySet().stream().map(e -> Arguments.of(e.getKey(), e.getValue()));
  }

  private static Sheet layout(Stage stage) {
    return SchematicLayout.layout(stage, SchematicLayout.APPROXIMATE);
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("stages")
  void everyPartAndSectionGetsExactlyOnePlace(String name, Stage stage) {
    Sheet sheet = layout(stage);
    assertThat(sheet.parts().stream().map(p -> p.part().ref()).toList())
        .containsExactlyInAnyOrderElementsOf(stage.parts().stream().map(Part::ref).toList());
    assertThat(sheet.amps()).hasSize(stage.amplifiers().size());
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("stages")
  void noBodiesOrCaptionsOverlap(String name, Stage stage) {
    Sheet sheet = layout(stage);
    List<Box> solid = new ArrayList<>();
    List<String> what = new ArrayList<>();
    for (PartGlyph part : sheet.parts()) {
      solid.add(part.body());
      what.add("body " + part.part().ref());
    }
    sheet
        .amps()
        .forEach(
            a ->
                a.slices()
                    .forEach(
                        slice -> {
                          solid.add(slice);
                          what.add("triangle " + a.amp().ref());
                        }));
    for (Caption caption : sheet.captions()) {
      // Pin signs sit inside the triangle by design.
      if (caption.kind() != Sheet.CaptionKind.PIN_SIGN
          && caption.kind() != Sheet.CaptionKind.AMP_REF) {
        solid.add(caption.box());
        what.add("caption " + caption.text());
      }
    }
    sheet
        .symbols()
        .forEach(
            s -> {
              solid.add(s.box());
              what.add("symbol " + s.kind() + " " + s.net());
            });
    for (int i = 0; i < solid.size(); i++) {
      for (int j = i + 1; j < solid.size(); j++) {
        assertThat(solid.get(i).overlaps(solid.get(j)))
            .as("%s overlaps %s", what.get(i), what.get(j))
            .isFalse();
      }
    }
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("stages")
  void wiresOfDifferentNetsNeitherOverlapNorTouchBodies(String name, Stage stage) {
    Sheet sheet = layout(stage);
    List<Wire> wires = sheet.wires();
    for (int i = 0; i < wires.size(); i++) {
      for (int j = i + 1; j < wires.size(); j++) {
        Wire a = wires.get(i);
        Wire b = wires.get(j);
        if (!a.net().equals(b.net()) && a.horizontal() == b.horizontal()) {
          assertThat(collinearShare(a, b)).as("%s and %s run on top of each other", a, b).isFalse();
        }
      }
      for (PartGlyph part : sheet.parts()) {
        assertThat(wires.get(i).box(2).overlaps(part.body().grown(-1)))
            .as("%s runs through %s", wires.get(i), part.part().ref())
            .isFalse();
      }
    }
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("stages")
  void templatesDrawWithoutCrossings(String name, Stage stage) {
    Sheet sheet = layout(stage);
    // The fallback drawing may cross; every template topology must not.
    if (!name.startsWith("fallback")) {
      assertThat(crossings(sheet)).as("crossing wires").isEmpty();
    }
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("stages")
  void everyNetLabelIsPlacedFreeOfEverythingElse(String name, Stage stage) {
    Sheet sheet = layout(stage);
    Map<String, double[]> sizes = new LinkedHashMap<>();
    List<String> signalNets =
        stage.nets().stream()
            .filter(net -> !net.equals(stage.ground()) && stage.rail(net).isEmpty())
            .toList();
    for (String net : signalNets) {
      // About the size of "OUT −13.41 V +13.50 V" over a measured line; driven nets one line.
      sizes.put(net, stage.isDriven(net) ? new double[] {120, 26} : new double[] {160, 46});
    }
    Map<String, Box> placed = new LinkedHashMap<>();
    LabelPlacer.place(sheet, sizes).forEach((net, placement) -> placed.put(net, placement.box()));
    // Rails and ground go in a strip above the drawing, not beside a flag (see SchematicDrawing).
    assertThat(placed.keySet()).containsExactlyInAnyOrderElementsOf(signalNets);
    List<Box> obstacles = sheet.obstacles();
    List<Box> labels = new ArrayList<>(placed.values());
    for (Map.Entry<String, Box> label : placed.entrySet()) {
      for (Box obstacle : obstacles) {
        assertThat(label.getValue().overlaps(obstacle))
            .as("label of %s covers something at %s", label.getKey(), obstacle)
            .isFalse();
      }
    }
    for (int i = 0; i < labels.size(); i++) {
      for (int j = i + 1; j < labels.size(); j++) {
        assertThat(labels.get(i).overlaps(labels.get(j))).as("two labels overlap").isFalse();
      }
    }
  }

  @Test
  void instrumentation_placesInputStagesLeftOfTheDifferenceStage() {
    Sheet sheet = layout(TestCircuits.all().get("template-instrumentation"));
    var byRef = new LinkedHashMap<String, Sheet.AmpGlyph>();
    sheet.amps().forEach(a -> byRef.put(a.amp().ref(), a));
    assertThat(byRef.get("U1A").x()).isEqualTo(byRef.get("U1B").x());
    assertThat(byRef.get("U1C").x()).isGreaterThan(byRef.get("U1A").x() + 200);
    // The upper input stage faces the lower one, so the gain resistor sits between them.
    assertThat(byRef.get("U1A").flipped()).isTrue();
    assertThat(byRef.get("U1B").flipped()).isFalse();
    PartGlyph gain =
        sheet.parts().stream().filter(p -> p.part().ref().equals("R2")).findFirst().orElseThrow();
    assertThat(gain.vertical()).isTrue();
    assertThat(gain.body().cy()).isBetween(byRef.get("U1A").y(), byRef.get("U1B").y());
  }

  @Test
  void inverting_putsFeedbackAboveAndInputLeft() {
    Sheet sheet = layout(TestCircuits.all().get("template-inverting"));
    Sheet.AmpGlyph amp = sheet.amps().get(0);
    PartGlyph r1 = part(sheet, "R1");
    PartGlyph r2 = part(sheet, "R2");
    assertThat(r2.body().bottom()).isLessThan(amp.box().y());
    assertThat(r1.body().right()).isLessThan(amp.box().x());
    assertThat(r1.vertical()).isFalse();
  }

  @Test
  void stageWithoutSections_isDrawnAsFallbackRows() {
    Stage stage =
        new Stage(
            "divider",
            "",
            "GND",
            List.of(),
            List.of(),
            List.of(
                Part.resistor("R1", 1e3, 0.01, "A", "B"),
                Part.resistor("R2", 1e3, 0.01, "B", "GND")),
            List.of());
    Sheet sheet = layout(stage);
    assertThat(sheet.parts()).hasSize(2);
    assertThat(sheet.symbols()).filteredOn(s -> s.kind() == Sheet.SymbolKind.FLAG).hasSize(4);
  }

  private static PartGlyph part(Sheet sheet, String ref) {
    return sheet.parts().stream().filter(p -> p.part().ref().equals(ref)).findFirst().orElseThrow();
  }

  /** Returns whether two wires of the same direction lie on one line and share a stretch. */
  private static boolean collinearShare(Wire a, Wire b) {
    if (a.horizontal() && b.horizontal() && a.y1() == b.y1()) {
      return overlap(a.x1(), a.x2(), b.x1(), b.x2()) > 0;
    }
    if (!a.horizontal() && !b.horizontal() && a.x1() == b.x1()) {
      return overlap(a.y1(), a.y2(), b.y1(), b.y2()) > 0;
    }
    return false;
  }

  private static double overlap(double a1, double a2, double b1, double b2) {
    return Math.min(Math.max(a1, a2), Math.max(b1, b2))
        - Math.max(Math.min(a1, a2), Math.min(b1, b2));
  }

  @Test
  void crossings_seesAPlus() {
    Sheet sheet =
        new Sheet(
            List.of(),
            List.of(),
            List.of(new Wire("A", 0, 5, 10, 5), new Wire("B", 5, 0, 5, 10)),
            List.of(),
            List.of(),
            List.of());
    assertThat(crossings(sheet)).hasSize(1);
  }

  @Test
  void inverting_dotsOnlyWhereThreeConnectionsMeet() {
    // Regression: an input wire's end, a rounding error off, drew a junction dot at the terminal.
    // Common practice: a dot marks a junction of three or more; a plain corner gets none.
    Sheet sheet = layout(TestCircuits.all().get("template-inverting"));
    assertThat(sheet.dots()).hasSize(2);
    Sheet.AmpGlyph amp = sheet.amps().get(0);
    assertThat(sheet.dots()).anyMatch(d -> d.y() == amp.minusY() && d.x() < amp.x());
    assertThat(sheet.dots())
        .anyMatch(d -> d.y() == amp.y() && d.x() > amp.x() + Sheet.AmpGlyph.WIDTH);
  }

  @Test
  void collinearShare_seesWiresOnTopOfEachOther() {
    // The check itself must be able to fail.
    assertThat(collinearShare(new Wire("A", 0, 0, 10, 0), new Wire("B", 5, 0, 20, 0))).isTrue();
    assertThat(collinearShare(new Wire("A", 0, 0, 10, 0), new Wire("B", 10, 0, 20, 0))).isFalse();
    assertThat(collinearShare(new Wire("A", 3, 0, 3, 10), new Wire("B", 3, 9, 3, 20))).isTrue();
    assertThat(new Wire("A", 0, 5, 20, 5).box(2).overlaps(new Box(8, 0, 4, 10))).isTrue();
  }

  /** Returns the pairs of wires of different nets that cross (a vertical through a horizontal). */
  static List<String> crossings(Sheet sheet) {
    List<String> found = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    for (Wire h : sheet.wires()) {
      if (!h.horizontal()) {
        continue;
      }
      for (Wire v : sheet.wires()) {
        if (v.horizontal() || v.net().equals(h.net())) {
          continue;
        }
        double x = v.x1();
        double y = h.y1();
        boolean inH = x > Math.min(h.x1(), h.x2()) && x < Math.max(h.x1(), h.x2());
        boolean inV = y > Math.min(v.y1(), v.y2()) && y < Math.max(v.y1(), v.y2());
        if (inH && inV && seen.add(h + "|" + v)) {
          found.add(h.net() + " crosses " + v.net() + " at " + x + "," + y);
        }
      }
    }
    return found;
  }
}
