package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairCase;
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
