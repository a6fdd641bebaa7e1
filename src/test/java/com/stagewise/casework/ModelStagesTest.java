package com.stagewise.casework;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Stage;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.interchange.StageSheet;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The board models' library stages in versions, through the case workflow. */
class ModelStagesTest {
  @TempDir Path folder;
  private HistoryStore store;
  private Casework ann;
  private Casework ben;
  private BoardModel model;
  private Unit first;
  private Unit second;

  @BeforeEach
  void open() throws Exception {
    store = SqliteHistory.open(folder.resolve("h.db"));
    Clock clock = Clock.fixed(Instant.parse("2026-03-04T10:15:30Z"), ZoneOffset.UTC);
    ann = new Casework(store, clock, "Ann");
    ben = new Casework(store, clock, "Ben");
    Path sheet = folder.resolve("driver.stage.json");
    Files.writeString(sheet, CaseworkTest.DRIVER, StandardCharsets.UTF_8);
    model = ann.addBoardModel("TB-1", "", List.of(sheet));
    first = ann.addUnit("SN-1", "TB-1", "").unit();
    second = ann.addUnit("SN-2", "TB-1", "").unit();
  }

  @AfterEach
  void close() {
    store.close();
  }

  @Test
  void useForCase_theLibraryStageUnchanged_isItsVersion_notANewOne() {
    RepairCase rc = ann.openCase(first.id(), "no output");
    LibraryStage offered = ann.stageLibrary(model).get(0);

    LibraryStage used = ann.library().useForCase(rc.id(), offered.stage());

    assertThat(used.sheet()).isEqualTo(offered.sheet());
    assertThat(store.library().sheets(model.id())).hasSize(1);
    // The sheet from the file is kept exactly, not rewritten.
    assertThat(used.sheet().sheetJson()).isEqualTo(CaseworkTest.DRIVER);
  }

  @Test
  void editedStage_isTheNextVersion_offeredToTheNextUnit_andTheOldCaseKeepsItsVersion() {
    RepairCase old = ann.openCase(first.id(), "no output");
    Stage v1 = ann.stageLibrary(model).get(0).stage();
    ann.library().useForCase(old.id(), v1);
    ann.closeCase(old.id(), Outcome.FIXED, List.of("R2:open"), "");

    // Ben finds R2 is 100k on this board: the edited stage is used for the next case.
    Stage edited = v1.withPart("R2", p -> p.withValue(100e3));
    RepairCase next = ben.openCase(second.id(), "distorts");
    LibraryStage v2 = ben.library().useForCase(next.id(), edited);

    assertThat(v2.version()).isEqualTo(2);
    assertThat(v2.sheet().savedBy()).isEqualTo("Ben");
    // The next unit of the model is offered the latest version first, and only it.
    List<LibraryStage> offered = ann.stageLibrary(model);
    assertThat(offered).hasSize(1);
    assertThat(offered.get(0).version()).isEqualTo(2);
    assertThat(offered.get(0).stage().part("R2").orElseThrow().value()).isEqualTo(100e3);
    assertThat(ann.library().versions(model, "line DRIVER"))
        .extracting(s -> s.version() + " " + s.sheet().savedBy())
        .containsExactly("2 Ben", "1 ");

    // The old case still shows and uses the version it was diagnosed with, and says a newer one
    // exists.
    CaseStage oldStage = ann.library().ofCase(old.id()).orElseThrow();
    assertThat(oldStage.used().version()).isEqualTo(1);
    assertThat(oldStage.used().stage()).isEqualTo(v1);
    assertThat(oldStage.newerExists()).isTrue();
    assertThat(oldStage.latest().version()).isEqualTo(2);
    CaseStage nextStage = ann.library().ofCase(next.id()).orElseThrow();
    assertThat(nextStage.newerExists()).isFalse();
    assertThat(nextStage.used().stage()).isEqualTo(edited);
  }

  @Test
  void ofCase_aCaseWithNoStageKept_isEmpty() {
    RepairCase rc = ann.openCase(first.id(), "no output");
    assertThat(ann.library().ofCase(rc.id())).isEmpty();
  }

  @Test
  void storedStage_byTitle_isTheLatestVersion_notSeveralSheets() {
    Stage v1 = ann.stageLibrary(model).get(0).stage();
    ann.addToLibrary(model, v1.withPart("R2", p -> p.withValue(22e3)));
    assertThat(ann.storedStage(model, null).version()).isEqualTo(2);
    assertThat(ann.storedStage(model, "Line driver").stage().part("R2").orElseThrow().value())
        .isEqualTo(22e3);
    // Saving the same stage again adds nothing.
    ann.addToLibrary(model, StageSheet.read(StageSheet.write(v1), "again"));
    assertThat(store.library().sheets(model.id())).hasSize(2);
  }
}
