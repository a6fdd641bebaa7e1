package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HistoryStoreTest {
  @TempDir Path folder;
  private HistoryStore store;
  private final Clock clock =
      Clock.fixed(Instant.parse("2026-03-04T10:15:30.123Z"), ZoneOffset.UTC);

  @BeforeEach
  void open() {
    store = HistoryStore.open(folder.resolve("h.db"), clock);
  }

  @AfterEach
  void close() {
    store.close();
  }

  @Test
  void open_newFile_isAtLatestSchemaAndEmpty() {
    assertThat(store.schemaVersion()).isEqualTo(HistoryStore.latestSchemaVersion());
    assertThat(store.isEmpty()).isTrue();
    assertThat(store.integrityCheck()).isEqualTo("ok");
  }

  @Test
  void boardModel_sameNameOtherCase_returnsTheExistingOne() {
    BoardModel first = store.boardModel("MX-8 mixer main board", "Northfield Audio");
    BoardModel again = store.boardModel("mx-8 MIXER main board", "");
    assertThat(again).isEqualTo(first);
    assertThat(store.boardModels()).hasSize(1);
  }

  @Test
  void addUnit_duplicateSerialInModel_isRefused() {
    BoardModel model = store.boardModel("PSU-30", "");
    store.addUnit("A100", model.id(), "");
    assertThatThrownBy(() -> store.addUnit("A100", model.id(), ""))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("A100");
  }

  @Test
  void caseLifecycle_everythingComesBackInUnitHistory() {
    BoardModel model = store.boardModel("PSU-30", "Harbour Instruments");
    Unit unit = store.addUnit("H-0042", model.id(), "job 7781");
    RepairCase opened = store.openCase(unit.id(), "output stuck at +13 V");
    StoredReading reading =
        new StoredReading(
            HistoryStore.newId(),
            opened.id(),
            "U1.1",
            ReadingKind.DC,
            13.41,
            null,
            0.05,
            "6000-count",
            clock.instant());
    SuspectListRecord list =
        new SuspectListRecord(
            HistoryStore.newId(),
            opened.id(),
            clock.instant(),
            "0.1.0",
            "fault",
            List.of(new StoredSuspect("R2:open", 0.91, List.of("R2:open"), "output saturated", 1)),
            "U1.2 dc");
    store.addReadings(opened.id(), List.of(reading), list);
    CaseNote note = store.addNote(opened.id(), "smells of burnt resin");
    store.addAction(opened.id(), ActionKind.PART_REPLACED, "R2", "47k", "47k", "replaced");
    RepairCase closed = store.closeCase(opened.id(), Outcome.FIXED, List.of("R2:open"));

    UnitHistory history = store.unitHistory(unit.id()).orElseThrow();
    assertThat(history.unit()).isEqualTo(unit);
    assertThat(history.boardModel()).isEqualTo(model);
    assertThat(history.cases()).hasSize(1);
    CaseFile file = history.cases().get(0);
    assertThat(file.repairCase()).isEqualTo(closed);
    assertThat(file.repairCase().status()).isEqualTo(CaseStatus.CLOSED);
    assertThat(file.readings()).containsExactly(reading);
    assertThat(file.suspectLists()).containsExactly(list);
    assertThat(file.notes()).containsExactly(note);
    assertThat(file.actions()).hasSize(1);
    assertThat(store.confirmedFaultCounts("psu-30")).isEqualTo(Map.of("R2:open", 1));
  }

  @Test
  void closeCase_twice_isRefused() {
    BoardModel model = store.boardModel("PSU-30", "");
    Unit unit = store.addUnit("H-1", model.id(), "");
    RepairCase c = store.openCase(unit.id(), "dead");
    store.closeCase(c.id(), Outcome.RETURNED, List.of());
    assertThatThrownBy(() -> store.closeCase(c.id(), Outcome.FIXED, List.of()))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("already closed");
  }

  @Test
  void closeCase_badFaultId_isRefusedAndNothingChanges() {
    BoardModel model = store.boardModel("PSU-30", "");
    Unit unit = store.addUnit("H-1", model.id(), "");
    RepairCase c = store.openCase(unit.id(), "dead");
    assertThatThrownBy(() -> store.closeCase(c.id(), Outcome.FIXED, List.of("R2 open")))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("fault id");
    assertThat(store.repairCase(c.id()).orElseThrow().status()).isEqualTo(CaseStatus.OPEN);
  }

  @Test
  void resolveCaseId_prefix_findsTheCase() {
    BoardModel model = store.boardModel("PSU-30", "");
    Unit unit = store.addUnit("H-1", model.id(), "");
    RepairCase c = store.openCase(unit.id(), "dead");
    assertThat(store.resolveCaseId(c.id().substring(0, 8))).isEqualTo(c.id());
    assertThatThrownBy(() -> store.resolveCaseId("ffff0000"))
        .isInstanceOf(InvalidInputException.class);
  }
}
