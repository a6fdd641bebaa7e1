package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import java.time.Clock;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The contract of readings taken again after the repair ({@link Cases#addAfterRepair}): every store
 * keeps them with their healthy band, apart from the readings of the fault, refuses bad ones whole,
 * and carries them in bundles. The band of the examples is the textbook inverting amplifier's
 * output (−R2/R1 × 1 V = −4.7 V, ±2 % for two 1 % resistors).
 */
public abstract class AfterRepairContract extends StoreContract {
  private RepairCase openCase() {
    BoardModel model = store.units().boardModel("MX-8", "Northfield");
    Unit unit = store.units().add("NF-1", model.id(), "");
    return store.cases().open(unit.id(), "output pinned low");
  }

  private AfterRepairReading reading(String caseId, String at, double volts, Double lo, Double hi) {
    return new AfterRepairReading(
        HistoryStore.newId(), caseId, at, volts, "6000-count meter", clock.instant(), lo, hi);
  }

  @Test
  void addAfterRepair_keepsEachWithItsBand_apartFromTheReadingsOfTheFault() {
    RepairCase c = openCase();
    StoredReading fault =
        new StoredReading(
            HistoryStore.newId(),
            c.id(),
            "OUT",
            ReadingKind.DC,
            -13.48,
            null,
            null,
            "m",
            clock.instant());
    store.cases().addReadings(c.id(), List.of(fault), null);
    clock.advanceMillis(60_000);
    AfterRepairReading out = reading(c.id(), "OUT", -4.70, -4.80, -4.60);
    AfterRepairReading rail = reading(c.id(), "U1.8", 14.96, null, null);
    store.cases().addAfterRepair(c.id(), List.of(out, rail));

    CaseFile file = store.cases().caseFile(c.id()).orElseThrow();
    assertThat(file.afterRepair()).containsExactly(out, rail);
    assertThat(file.afterRepair().get(0).inside()).isTrue();
    assertThat(file.afterRepair().get(1).hasBand()).isFalse();
    assertThat(file.readings()).containsExactly(fault);
  }

  @Test
  void addAfterRepair_aBadReading_isRefused_andNoneIsStored() {
    RepairCase c = openCase();
    AfterRepairReading good = reading(c.id(), "OUT", -4.70, -4.80, -4.60);
    AfterRepairReading backwards = reading(c.id(), "SUM", 0.0, 0.01, -0.01);
    assertThatThrownBy(() -> store.cases().addAfterRepair(c.id(), List.of(good, backwards)))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("afterRepair[1].healthyLow");
    AfterRepairReading notANumber = reading(c.id(), "OUT", Double.NaN, null, null);
    assertThatThrownBy(() -> store.cases().addAfterRepair(c.id(), List.of(notANumber)))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("finite");
    assertThat(store.cases().caseFile(c.id()).orElseThrow().afterRepair()).isEmpty();
  }

  @Test
  void addAfterRepair_toAnUnknownCase_isRefused() {
    String unknown = HistoryStore.newId();
    assertThatThrownBy(
            () ->
                store
                    .cases()
                    .addAfterRepair(unknown, List.of(reading(unknown, "OUT", 1, null, null))))
        .isInstanceOf(InvalidInputException.class);
  }

  @Test
  void afterRepairReadings_travelInBundles_andASecondImportChangesNothing() {
    RepairCase c = openCase();
    AfterRepairReading out = reading(c.id(), "OUT", -13.48, -4.80, -4.60);
    store.cases().addAfterRepair(c.id(), List.of(out));
    HistoryBundle bundle = store.transfer().export(new ExportSelection.All(), "test");
    assertThat(bundle.afterRepair()).containsExactly(out);
    try (HistoryStore other = openStore(Clock.systemUTC())) {
      ImportReport report = other.transfer().importBundle(bundle, "bundle.json");
      assertThat(report.conflicts()).isEmpty();
      assertThat(other.cases().caseFile(c.id()).orElseThrow().afterRepair()).containsExactly(out);
      assertThat(other.cases().caseFile(c.id()).orElseThrow().readings()).isEmpty();
      ImportReport again = other.transfer().importBundle(bundle, "bundle.json");
      assertThat(again.added()).isZero();
      assertThat(again.conflicts()).isEmpty();
    }
  }
}
