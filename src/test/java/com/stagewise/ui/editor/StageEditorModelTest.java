package com.stagewise.ui.editor;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.StageSheet;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import com.stagewise.ui.editor.EditorProblem.Place;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class StageEditorModelTest {
  private static final Offset<Double> MILLIVOLT = Offset.offset(1e-3);

  static Stream<Path> demoSheets() throws IOException {
    try (Stream<Path> files = Files.list(Path.of("data", "stages"))) {
      List<Path> sheets =
          files.filter(f -> f.toString().endsWith(StageSheet.SUFFIX)).sorted().toList();
      assertThat(sheets).isNotEmpty();
      return sheets.stream();
    }
  }

  static Stream<StageTemplate> templates() {
    return Templates.all().stream();
  }

  /** Builds the textbook inverting amplifier from an empty stage, edit by edit. */
  private static StageEditorModel invertingFromEmpty() {
    StageEditorModel editor = new StageEditorModel();
    editor.startEmpty("Inverting amplifier", "Test board");
    editor.addRail("VCC", "15");
    editor.addRail("VEE", "-15");
    editor.addInput("IN", "0.5");
    String r1 = editor.addPart(PartKind.RESISTOR);
    editor.setPartValue(r1, "10k");
    editor.setPartNet(r1, 0, "IN");
    editor.setPartNet(r1, 1, "SUM");
    String r2 = editor.addPart(PartKind.RESISTOR);
    editor.setPartValue(r2, "47k");
    editor.setPartNet(r2, 0, "SUM");
    editor.setPartNet(r2, 1, "OUT");
    String u1a =
        editor.addSection(PackageType.DUAL_8, "U1", "A", DeviceClass.CLASSIC_BIPOLAR).orElseThrow();
    editor.setSectionNet(u1a, Terminal.IN_PLUS, "GND");
    editor.setSectionNet(u1a, Terminal.IN_MINUS, "SUM");
    editor.setSectionNet(u1a, Terminal.OUT, "OUT");
    return editor;
  }

  @Nested
  class RoundTrip {
    @ParameterizedTest
    @MethodSource("com.stagewise.ui.editor.StageEditorModelTest#demoSheets")
    void demoSheet_openedAndSavedUnchanged_readsBackAsTheSameStage(Path file) {
      Stage original = StageSheet.read(file);
      StageEditorModel editor = new StageEditorModel();
      editor.startFrom(original, file.getFileName().toString());

      assertThat(editor.problems()).isEmpty();
      Stage saved = editor.save().orElseThrow();
      Stage readBack = StageSheet.read(StageSheet.write(saved), "saved");

      assertThat(readBack).isEqualTo(original);
      assertThat(editor.hasUnsavedEdits()).isFalse();
    }

    @ParameterizedTest
    @MethodSource("com.stagewise.ui.editor.StageEditorModelTest#templates")
    void template_openedAndSavedUnchanged_isTheSameStage(StageTemplate template) {
      Stage original = template.build();
      StageEditorModel editor = new StageEditorModel();
      editor.startFrom(original, template.title());

      assertThat(StageSheet.read(StageSheet.write(editor.save().orElseThrow()), "saved"))
          .isEqualTo(StageSheet.read(StageSheet.write(original), "template"));
    }
  }

  @Nested
  class Building {
    @Test
    void invertingAmplifier_builtFromEmpty_solvesToTheTextbookGain() {
      StageEditorModel editor = invertingFromEmpty();

      assertThat(editor.problems()).isEmpty();
      Stage stage = editor.stage().orElseThrow();
      // Textbook inverting amplifier: Vout = -(Rf / Rin) * Vin = -4.7 * 0.5 V (the solver's finite
      // open-loop gain of 2e5 changes it by far less than a millivolt).
      SolveResult.Solved solved = (SolveResult.Solved) StageSolver.solve(stage);
      assertThat(solved.primary().at("OUT")).isCloseTo(-2.35, MILLIVOLT);
    }

    @Test
    void newSection_takesThePinsOfTheDesignPinout() {
      StageEditorModel editor = new StageEditorModel();
      editor.addRail("VCC", "12");
      String ref =
          editor
              .addSection(PackageType.QUAD_14, "U3", "C", DeviceClass.GROUND_SENSING)
              .orElseThrow();
      DraftStage.DraftSection c = editor.draft().section(ref);

      // DESIGN.md quad-14: 8 out3, 9 in-3, 10 in+3, 4 v+, 11 v-.
      assertThat(ref).isEqualTo("U3C");
      assertThat(c.pin(Terminal.OUT)).isEqualTo(8);
      assertThat(c.pin(Terminal.IN_MINUS)).isEqualTo(9);
      assertThat(c.pin(Terminal.IN_PLUS)).isEqualTo(10);
      assertThat(c.pin(Terminal.V_PLUS)).isEqualTo(4);
      assertThat(c.pin(Terminal.V_MINUS)).isEqualTo(11);
      // Supplied from the only rail and ground, as a single-supply stage is.
      assertThat(c.net(Terminal.V_PLUS)).isEqualTo("VCC");
      assertThat(c.net(Terminal.V_MINUS)).isEqualTo("GND");
    }

    @Test
    void supplyPin_isSharedByEverySectionOfThePackage() {
      StageEditorModel editor = invertingFromEmpty();
      editor.addSection(PackageType.DUAL_8, "U1", "B", DeviceClass.RAIL_TO_RAIL);
      assertThat(editor.draft().section("U1B").deviceClass())
          .as("a second section joins its package's class")
          .isEqualTo(DeviceClass.CLASSIC_BIPOLAR);

      editor.addRail("V12", "12");
      editor.setSectionNet("U1B", Terminal.V_PLUS, "V12");

      assertThat(editor.draft().section("U1A").net(Terminal.V_PLUS)).isEqualTo("V12");
    }

    @Test
    void colourBands_setTheValueAndTolerance() {
      StageEditorModel editor = invertingFromEmpty();
      // IEC 60062: yellow violet red gold = 47 x 100 ohms, ±5 %.
      editor.setPartValueFromBands("R2", List.of("yellow", "violet", "red", "gold"));

      assertThat(editor.draft().part("R2").value().exact()).isEqualTo(4700.0);
      assertThat(editor.draft().part("R2").tolerance().exact()).isEqualTo(0.05);
    }

    @Test
    void smdCode_setsTheValue() {
      StageEditorModel editor = invertingFromEmpty();
      // Three-digit SMD code: 473 = 47 x 10^3 ohms (common marking practice).
      editor.setPartValueFromSmd("R2", "473");

      assertThat(editor.draft().part("R2").value().exact()).isEqualTo(47000.0);
    }

    @Test
    void renameNet_changesItEverywhere() {
      StageEditorModel editor = invertingFromEmpty();
      editor.renameNet("SUM", "INV");

      assertThat(editor.draft().part("R1").nets()).containsExactly("IN", "INV");
      assertThat(editor.draft().section("U1A").net(Terminal.IN_MINUS)).isEqualTo("INV");
      assertThat(editor.problems()).isEmpty();
    }
  }

  @Nested
  class BadEdits {
    @Test
    void netLeftWithOnePart_isFlaggedBesideThatPart() {
      StageEditorModel editor = invertingFromEmpty();
      editor.setPartNet("R2", 1, "OTU");

      assertThat(editor.problemsOf(Place.PART, "R2"))
          .extracting(EditorProblem::message)
          .anyMatch(m -> m.contains("net OTU") && m.contains("touches nothing else"));
      assertThat(editor.stage()).isEmpty();
    }

    @Test
    void twoSectionsOnTheSamePins_areFlaggedBesideTheSecond() {
      StageEditorModel editor = invertingFromEmpty();
      editor.addSection(PackageType.DUAL_8, "U1", "B", DeviceClass.CLASSIC_BIPOLAR);
      editor.setSectionLetter("U1B", "A");

      assertThat(editor.problemsOf(Place.SECTION, "U1B"))
          .extracting(EditorProblem::message)
          .anyMatch(m -> m.contains("section A of U1") && m.contains("already uses"));
    }

    @Test
    void noGround_isFlagged() {
      StageEditorModel editor = invertingFromEmpty();
      editor.setSectionNet("U1A", Terminal.IN_PLUS, "REF");
      editor.addInput("REF", "0");

      assertThat(editor.problemsOf(Place.STAGE, ""))
          .extracting(EditorProblem::message)
          .anyMatch(m -> m.contains("ground net GND touches no part"));
    }

    @Test
    void sectionWithNoSupply_isFlaggedBesideIt() {
      StageEditorModel editor = invertingFromEmpty();
      editor.removeRail(1);
      editor.removeRail(0);

      assertThat(editor.problemsOf(Place.SECTION, "U1A"))
          .extracting(EditorProblem::message)
          .anyMatch(m -> m.contains("U1A has no supply"));
    }

    @Test
    void sectionWithBothSupplyPinsOnOneNet_isFlagged() {
      StageEditorModel editor = invertingFromEmpty();
      editor.setSectionNet("U1A", Terminal.V_MINUS, "VCC");

      assertThat(editor.problemsOf(Place.SECTION, "U1A"))
          .extracting(EditorProblem::message)
          .anyMatch(m -> m.contains("no supply") && m.contains("both on net VCC"));
    }

    @Test
    void valueThatIsNotAValue_isKeptAsTypedAndFlagged() {
      StageEditorModel editor = invertingFromEmpty();
      editor.setPartValue("R2", "4k7x");

      assertThat(editor.draft().part("R2").value().text()).isEqualTo("4k7x");
      assertThat(editor.problemsOf(Place.PART, "R2"))
          .extracting(EditorProblem::message)
          .anyMatch(m -> m.contains("4k7x"));
      assertThat(editor.save()).isEmpty();
      assertThat(editor.refusal()).contains("cannot be saved yet");
      assertThat(editor.draft().part("R2").value().text()).isEqualTo("4k7x");
    }

    @Test
    void capacitorOnlyNet_isFlaggedAsFloating() {
      StageEditorModel editor = invertingFromEmpty();
      String c1 = editor.addPart(PartKind.CAPACITOR);
      editor.setPartNet(c1, 0, "OUT");
      editor.setPartNet(c1, 1, "TAP");
      String c2 = editor.addPart(PartKind.CAPACITOR);
      editor.setPartNet(c2, 0, "TAP");
      editor.setPartNet(c2, 1, "GND");

      assertThat(editor.problems())
          .extracting(EditorProblem::message)
          .anyMatch(m -> m.contains("net TAP has no DC path"));
    }

    @Test
    void impossibleSectionLetter_isRefusedAndChangesNothing() {
      StageEditorModel editor = invertingFromEmpty();
      DraftStage before = editor.draft();

      assertThat(editor.addSection(PackageType.DUAL_8, "U1", "C", DeviceClass.CLASSIC_BIPOLAR))
          .isEmpty();
      assertThat(editor.refusal()).contains("no section C");
      assertThat(editor.draft()).isEqualTo(before);
    }

    @Test
    void takenDesignator_isRefused() {
      StageEditorModel editor = invertingFromEmpty();

      assertThat(editor.renamePart("R2", "R1")).isFalse();
      assertThat(editor.refusal()).contains("R1 is already used");
      assertThat(editor.draft().part("R2")).isNotNull();
    }

    @Test
    void unwiredPart_saysWhichEnd() {
      StageEditorModel editor = invertingFromEmpty();
      String r3 = editor.addPart(PartKind.RESISTOR);
      editor.setPartNet(r3, 0, "OUT");

      assertThat(editor.problemsOf(Place.PART, r3))
          .extracting(EditorProblem::message)
          .containsExactly(r3 + " end 2 is not connected yet: choose its net");
    }
  }

  @Nested
  class UndoAndQuestions {
    @Test
    void everyEdit_undoesBackToEmptyAndRedoesToTheSameStage() {
      StageEditorModel editor = invertingFromEmpty();
      DraftStage built = editor.draft();
      int edits = 0;
      while (editor.canUndo()) {
        editor.undo();
        edits++;
      }
      // 15 calls, one of which (R1's value 10k, already its value) changes nothing.
      assertThat(edits).isEqualTo(14);
      assertThat(editor.draft()).isEqualTo(DraftStage.empty("Inverting amplifier", "Test board"));
      while (editor.canRedo()) {
        editor.redo();
      }
      assertThat(editor.draft()).isEqualTo(built);
    }

    @Test
    void deletedPart_comesBackOnUndo() {
      StageEditorModel editor = invertingFromEmpty();
      DraftStage.DraftPart r2 = editor.draft().part("R2");
      editor.removePart("R2");
      assertThat(editor.undoLabel()).isEqualTo("delete R2");
      editor.undo();

      assertThat(editor.draft().part("R2")).isEqualTo(r2);
    }

    @Test
    void startingAgainWithUnsavedEdits_asksFirst() {
      StageEditorModel editor = invertingFromEmpty();
      DraftStage built = editor.draft();
      editor.startEmpty("", "");

      assertThat(editor.question()).isPresent();
      assertThat(editor.question().orElseThrow().text()).contains("would be lost");
      editor.answer(false);
      assertThat(editor.draft()).isEqualTo(built);

      editor.startEmpty("", "");
      editor.answer(true);
      assertThat(editor.draft().parts()).isEmpty();
      assertThat(editor.hasUnsavedEdits()).isFalse();
    }

    @Test
    void closingAfterSave_asksNothing() {
      StageEditorModel editor = invertingFromEmpty();
      editor.save().orElseThrow();
      boolean[] closed = {false};
      editor.close(() -> closed[0] = true);

      assertThat(closed[0]).isTrue();
      assertThat(editor.question()).isEmpty();
    }

    @Test
    void listeners_hearEveryEdit() {
      StageEditorModel editor = new StageEditorModel();
      int[] heard = {0};
      editor.addListener(() -> heard[0]++);
      editor.addRail("VCC", "15");
      editor.undo();
      editor.redo();

      assertThat(heard[0]).isEqualTo(3);
    }
  }
}
