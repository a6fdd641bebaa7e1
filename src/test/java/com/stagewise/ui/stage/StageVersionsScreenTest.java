package com.stagewise.ui.stage;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Stage;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.StageSheet;
import com.stagewise.ui.Step;
import com.stagewise.ui.TestBench;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Where a stage is picked: the library stages' versions with who saved them and when, an edit
 * offered to the next unit of the model first, and an old case keeping its own version.
 */
class StageVersionsScreenTest {
  @TempDir Path temp;
  private TestBench t;
  private BoardModel board;
  private Unit first;
  private Unit second;

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    board = t.store.units().boardModel("Test amp board", "");
    t.store
        .library()
        .add(
            board.id(),
            "Inverting amplifier, test",
            StageSheet.write(TestBench.invertingStage(board.name())));
    first = t.store.units().add("TA-1", board.id(), "");
    second = t.store.units().add("TA-2", board.id(), "");
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  private StageViewModel screenFor(Unit unit, RepairCase rc) {
    t.bench.showUnit(unit, board);
    t.bench.stageProperty().set(null);
    t.bench.startCase(rc);
    t.bench.go(Step.STAGE);
    StageViewModel model = new StageViewModel(t.bench);
    model.loadLibrary();
    return model;
  }

  @Test
  void editedLibraryStage_isANewVersion_offeredFirstToTheNextUnit_andTheOldCaseKeepsItsOwn() {
    RepairCase old = t.store.cases().open(first.id(), "Dead");
    StageViewModel model = screenFor(first, old);
    Stage v1 = model.library().get(0).stage();
    model.choose(v1);
    model.useStage();
    assertThat(t.store.cases().find(old.id()).orElseThrow().stageSheetId()).isNotNull();

    // The next unit: the technician edits the library stage (R2 is 100k on this board).
    RepairCase next = t.store.cases().open(second.id(), "Distorts");
    StageViewModel nextScreen = screenFor(second, next);
    assertThat(nextScreen.libraryModel().caseNoteProperty().get()).isEmpty();
    nextScreen.choose(nextScreen.library().get(0).stage());
    nextScreen.openEditor(false);
    nextScreen.editor().setPartValue("R2", "100k");
    nextScreen.useEdited(nextScreen.editor().save().orElseThrow());
    nextScreen.useStage();

    // A third look at the library: one stage, at version 2, latest first among its versions.
    StageViewModel later = screenFor(second, next);
    assertThat(later.library()).hasSize(1);
    LibraryEntry offered = later.library().get(0);
    assertThat(offered.version()).isEqualTo(2);
    assertThat(offered.stage().part("R2").orElseThrow().value()).isEqualTo(100_000.0);
    assertThat(offered.versionLine()).startsWith("version 2, saved by ");
    later.libraryModel().showVersions(offered);
    assertThat(later.libraryModel().versions())
        .extracting(LibraryEntry::version)
        .containsExactly(2, 1);

    // The old case, opened again on the stage screen with no stage kept on the bench, shows and
    // uses version 1 and says that a newer one exists.
    StageViewModel reopened = screenFor(first, old);
    assertThat(reopened.stageProperty().get()).isEqualTo(v1);
    assertThat(reopened.libraryModel().caseNoteProperty().get())
        .contains("version 1")
        .contains("A newer version exists: version 2");
  }

  @Test
  void onlyStageOfTheModel_isChosenForANewCase_butACaseKeepsItsOwnVersion() {
    // A new case on a model with one stage in its library: that stage is chosen, its parts listed
    // and its expected volts worked out, without a tap.
    RepairCase old = t.store.cases().open(first.id(), "Dead");
    StageViewModel model = screenFor(first, old);
    assertThat(model.library()).hasSize(1);
    LibraryEntry only = model.library().get(0);
    assertThat(model.stageProperty().get()).isSameAs(only.stage());
    assertThat(model.libraryModel().chosenForYouProperty().get()).isSameAs(only);
    assertThat(model.parts()).extracting(r -> r.part().ref()).contains("R1", "R2");
    assertThat(model.expectedProperty().get()).isNotNull();
    assertThat(model.libraryModel().versions())
        .extracting(LibraryEntry::version)
        .containsExactly(1);
    model.useStage();
    Stage v1 = model.stageProperty().get();

    // The next unit edits the stage: the library's only entry is now version 2.
    RepairCase next = t.store.cases().open(second.id(), "Distorts");
    StageViewModel nextScreen = screenFor(second, next);
    nextScreen.openEditor(false);
    nextScreen.editor().setPartValue("R2", "100k");
    nextScreen.useEdited(nextScreen.editor().save().orElseThrow());
    nextScreen.useStage();

    // The old case keeps version 1: it gets THAT version, not the library's only (newer) entry,
    // and nothing is chosen for the technician in the list.
    StageViewModel reopened = screenFor(first, old);
    assertThat(reopened.library()).hasSize(1);
    assertThat(reopened.library().get(0).version()).isEqualTo(2);
    assertThat(reopened.stageProperty().get()).isEqualTo(v1);
    assertThat(reopened.stageProperty().get().part("R2").orElseThrow().value())
        .isNotEqualTo(100_000.0);
    assertThat(reopened.libraryModel().chosenForYouProperty().get()).isNull();
  }
}
