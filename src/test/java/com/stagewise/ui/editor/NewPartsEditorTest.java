package com.stagewise.ui.editor;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.interchange.StageSheet;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import com.stagewise.ui.editor.EditorProblem.Place;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;

/**
 * The editor with the newer part kinds (stage sheet version 2, DESIGN.md): each added with its
 * usual designator and leads, a zener-referenced set-point built from empty and solved, and the bad
 * entries of issue 11 (a zener without its voltage, an LED without its colour, a wiper beyond its
 * track, a lead left unwired) flagged beside the part with what was typed kept.
 */
class NewPartsEditorTest {

  /**
   * A set-point buffer entered edit by edit: a zener fed from +15 V through 10 k, a trimmer across
   * it with its wiper into a follower, and an LED with its resistor on the output.
   */
  private static StageEditorModel setPoint() {
    StageEditorModel editor = new StageEditorModel();
    editor.startEmpty("Set-point buffer", "Test board");
    editor.addRail("VCC", "15");
    editor.addRail("VEE", "-15");
    String r1 = editor.addPart(PartKind.RESISTOR);
    editor.setPartNet(r1, 0, "VCC");
    editor.setPartNet(r1, 1, "REF");
    String zd = editor.addPart(PartKind.ZENER);
    editor.setPartNet(zd, 0, "GND");
    editor.setPartNet(zd, 1, "REF");
    String rv = editor.addPart(PartKind.TRIMMER);
    editor.setPartNet(rv, 0, "REF");
    editor.setPartNet(rv, 1, "SET");
    editor.setPartNet(rv, 2, "GND");
    editor.setPartPosition(rv, "0.25", false);
    String u1a =
        editor.addSection(PackageType.DUAL_8, "U1", "A", DeviceClass.CLASSIC_BIPOLAR).orElseThrow();
    editor.setSectionNet(u1a, Terminal.IN_PLUS, "SET");
    editor.setSectionNet(u1a, Terminal.IN_MINUS, "OUT");
    editor.setSectionNet(u1a, Terminal.OUT, "OUT");
    String r2 = editor.addPart(PartKind.RESISTOR);
    editor.setPartValue(r2, "1k");
    editor.setPartNet(r2, 0, "OUT");
    editor.setPartNet(r2, 1, "LAMP");
    String led = editor.addPart(PartKind.LED);
    editor.setPartChoice(led, "green");
    editor.setPartNet(led, 0, "LAMP");
    editor.setPartNet(led, 1, "GND");
    return editor;
  }

  @Test
  void eachKind_getsItsUsualDesignatorValueAndLeads() {
    StageEditorModel editor = new StageEditorModel();
    // Common practice for designators: D for diodes and LEDs, ZD for zeners, RV for trimmers.
    assertThat(editor.addPart(PartKind.DIODE)).isEqualTo("D1");
    assertThat(editor.addPart(PartKind.LED)).isEqualTo("D2");
    assertThat(editor.addPart(PartKind.ZENER)).isEqualTo("ZD1");
    assertThat(editor.addPart(PartKind.TRIMMER)).isEqualTo("RV1");
    assertThat(editor.addPart(PartKind.POTENTIOMETER)).isEqualTo("RV2");
    DraftStage draft = editor.draft();
    assertThat(draft.part("D1").nets()).hasSize(2);
    assertThat(draft.part("D1").choice()).isEqualTo("silicon");
    assertThat(draft.part("D2").choice()).isEqualTo("red");
    assertThat(draft.part("ZD1").value().text()).isEqualTo("5V1");
    assertThat(draft.part("RV1").nets()).hasSize(3);
    assertThat(draft.part("RV2").position().text()).isEqualTo("0.5");
    // Lead names as the readings contract gives them: a, k; 1, w, 2.
    assertThat(DraftEntries.leadName(draft.part("D1"), 0)).isEqualTo("anode");
    assertThat(DraftEntries.leadName(draft.part("D1"), 1)).isEqualTo("cathode");
    assertThat(DraftEntries.leadName(draft.part("RV1"), 1)).isEqualTo("wiper");
  }

  @Test
  void setPoint_builtFromEmpty_solvesAndTheFollowerSitsAtTheWipersShare() {
    StageEditorModel editor = setPoint();
    assertThat(editor.problems()).isEmpty();
    Stage stage = editor.stage().orElseThrow();
    SolveResult.Solved solved = (SolveResult.Solved) StageSolver.solve(stage);
    double ref = solved.primary().at("REF");
    // A zener fed about 1 mA sits near its marking (5V1 with its 5 % tolerance, common practice).
    assertThat(ref).isBetween(5.1 * 0.95, 5.1 * 1.05);
    // Voltage divider rule: the wiper at 0.25 of the way from REF to GND leaves 0.75 of REF, the
    // follower repeats it (its input draws next to nothing).
    assertThat(solved.primary().at("OUT")).isCloseTo(0.75 * ref, Offset.offset(2e-3));
    // And it is the same stage once written as a sheet and read back.
    assertThat(StageSheet.read(StageSheet.write(stage), "saved")).isEqualTo(stage);
  }

  @Test
  void sectionInputOnATrimmersWiper_isNotFlaggedAsTouchingNothingElse() {
    // Regression: the editor counted only a trimmer's two ends, so a follower fed from the wiper
    // was flagged "touches nothing else" and the stage could not be saved.
    StageEditorModel editor = setPoint();
    assertThat(editor.problemsOf(Place.SECTION, "U1A")).isEmpty();
    editor.setPartNet("RV1", 1, "SETT");
    assertThat(editor.problemsOf(Place.SECTION, "U1A"))
        .extracting(EditorProblem::message)
        .anyMatch(m -> m.contains("on net SET") && m.contains("touches"));
  }

  @Test
  void badEntries_areFlaggedBesideThePart_andKeptAsTyped() {
    StageEditorModel editor = setPoint();
    editor.setPartValue("ZD1", "");
    editor.setPartChoice("D1", "purple");
    editor.setPartPosition("RV1", "1.7", false);
    editor.setPartNet("RV1", 1, "");

    assertThat(editor.problemsOf(Place.PART, "ZD1"))
        .extracting(EditorProblem::message)
        .anyMatch(m -> m.contains("needs its voltage"));
    assertThat(editor.problemsOf(Place.PART, "D1"))
        .extracting(EditorProblem::message)
        .anyMatch(m -> m.contains("needs its colour"));
    assertThat(editor.problemsOf(Place.PART, "RV1"))
        .extracting(EditorProblem::message)
        .anyMatch(m -> m.contains("between 0 and 1"))
        .anyMatch(m -> m.contains("wiper is not connected"));
    assertThat(editor.draft().part("RV1").position().text()).isEqualTo("1.7");
    assertThat(editor.draft().part("D1").choice()).isEqualTo("purple");
    assertThat(editor.stage()).isEmpty();
  }

  @Test
  void editsThatDoNotFitTheKind_areRefused_andChangeNothing() {
    StageEditorModel editor = setPoint();
    DraftStage before = editor.draft();
    assertThat(editor.setPartChoice("R1", "schottky")).isFalse();
    assertThat(editor.refusal()).contains("diode or LED");
    assertThat(editor.setPartPosition("D1", "0.5", false)).isFalse();
    assertThat(editor.refusal()).contains("no wiper");
    assertThat(editor.setPartNet("D1", 2, "OUT")).isFalse();
    assertThat(editor.draft()).isEqualTo(before);
  }

  @Test
  void undo_takesEachNewPartEditBack() {
    StageEditorModel editor = setPoint();
    Stage built = editor.stage().orElseThrow();
    editor.setPartPosition("RV1", "0.8", true);
    assertThat(editor.undoLabel()).isEqualTo("set RV1 wiper to 0.8 (sealed)");
    editor.undo();
    assertThat(editor.stage()).contains(built);
  }
}
