package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import java.time.Clock;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The contract of {@link Transfer}: export and import between any two stores. */
public abstract class TransferContract extends StoreContract {

  @Test
  void exportThenImport_intoAnEmptyStore_bringsEverything() {
    BoardModel model = store.units().boardModel("MX-8", "Northfield");
    store.library().add(model.id(), "Input", "{}");
    Unit unit = store.units().add("NF-1", model.id(), "job 1");
    RepairCase c = store.cases().open(unit.id(), "hum");
    store.cases().addNote(c.id(), "warm");
    HistoryBundle bundle = store.transfer().export(new ExportSelection.All(), "test");
    try (HistoryStore other = openStore(Clock.systemUTC())) {
      ImportReport report = other.transfer().importBundle(bundle, "bundle.json");
      assertThat(report.added()).isEqualTo(5);
      assertThat(report.conflicts()).isEmpty();
      assertThat(other.cases().unitHistory(unit.id()).orElseThrow())
          .isEqualTo(store.cases().unitHistory(unit.id()).orElseThrow());
      ImportReport again = other.transfer().importBundle(bundle, "bundle.json");
      assertThat(again.added()).isZero();
      assertThat(again.unchanged()).isEqualTo(5);
    }
  }

  @Test
  void aStruckReading_travelsStruck_andTheLaterStrikeOrRestoreWins() {
    BoardModel model = store.units().boardModel("MX-8", "Northfield");
    Unit unit = store.units().add("NF-3", model.id(), "");
    RepairCase c = store.cases().open(unit.id(), "hum");
    StoredReading r =
        new StoredReading(
            HistoryStore.newId(),
            c.id(),
            "OUT",
            ReadingKind.DC,
            1.19,
            null,
            null,
            "m",
            clock.instant());
    store.cases().addReadings(c.id(), List.of(r), null);
    HistoryBundle standing = store.transfer().export(new ExportSelection.All(), "test");
    clock.advanceMillis(1_000);
    store
        .cases()
        .reviseReadings(c.id(), new Cases.Revision(List.of(r.id()), List.of(), List.of()), null);
    HistoryBundle struck = store.transfer().export(new ExportSelection.All(), "test");
    try (HistoryStore other = openStore(clock)) {
      other.transfer().importBundle(standing, "standing.json");
      ImportReport report = other.transfer().importBundle(struck, "struck.json");
      assertThat(report.updated()).isEqualTo(1);
      assertThat(report.conflicts()).isEmpty();
      StoredReading there = other.cases().caseFile(c.id()).orElseThrow().readings().get(0);
      assertThat(there.struck()).isTrue();
      assertThat(there.struckAt()).isEqualTo(clock.instant());
      // The older copy that still stands does not undo the strike.
      ImportReport older = other.transfer().importBundle(standing, "standing.json");
      assertThat(other.cases().caseFile(c.id()).orElseThrow().readings().get(0).struck()).isTrue();
      assertThat(older.updated()).isZero();
    }
  }

  @Test
  void importBundle_withADanglingReference_importsNothing() {
    BoardModel model = store.units().boardModel("MX-8", "");
    Unit unit = store.units().add("NF-1", model.id(), "");
    HistoryBundle bundle = store.transfer().export(new ExportSelection.All(), "test");
    Unit orphan = new Unit(HistoryStore.newId(), "NF-2", HistoryStore.newId(), "", clock.instant());
    HistoryBundle broken =
        new HistoryBundle(
            bundle.version(),
            bundle.exportedAt(),
            bundle.programVersion(),
            bundle.boardModels(),
            bundle.stageSheets(),
            List.of(unit, orphan),
            bundle.cases(),
            bundle.readings(),
            bundle.suspectLists(),
            bundle.actions(),
            bundle.notes());
    try (HistoryStore other = openStore(Clock.systemUTC())) {
      assertThatThrownBy(() -> other.transfer().importBundle(broken, "bundle.json"))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("bundle.json")
          .hasMessageContaining("units[1].boardModelId");
      assertThat(other.isEmpty()).isTrue();
    }
  }

  @Test
  void integrityCheck_ofAFreshStore_isOk() {
    assertThat(store.transfer().integrityCheck()).isEqualTo("ok");
  }
}
