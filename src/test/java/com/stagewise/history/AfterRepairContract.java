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

  private AfterRepairReading ac(String caseId, double rms, Double lo, Double hi) {
    return new AfterRepairReading(
        HistoryStore.newId(),
        caseId,
        "OUT",
        rms,
        "scope",
        clock.instant(),
        lo,
        hi,
        ReadingKind.AC,
        "rms",
        1000.0,
        "");
  }

  private AfterRepairReading ohms(String caseId, double value, Double lo, Double hi) {
    return new AfterRepairReading(
        HistoryStore.newId(),
        caseId,
        "SUM",
        value,
        "meter, ohms",
        clock.instant(),
        lo,
        hi,
        ReadingKind.OHMS,
        null,
        null,
        "OUT");
  }

  @Test
  void addAfterRepair_keepsAcAndOhmsReadings_withTheirKindMeasureFrequencyAndSecondPoint() {
    RepairCase c = openCase();
    AfterRepairReading dc = reading(c.id(), "OUT", -4.70, -4.80, -4.60);
    AfterRepairReading rms = ac(c.id(), 0.333, 0.329, 0.336);
    AfterRepairReading across = ohms(c.id(), 46_900, 46_530.0, 47_470.0);
    AfterRepairReading open = ohms(c.id(), Double.POSITIVE_INFINITY, 46_530.0, 47_470.0);
    AfterRepairReading toRail =
        new AfterRepairReading(
            HistoryStore.newId(),
            c.id(),
            "OUT",
            Double.POSITIVE_INFINITY,
            "meter, ohms",
            clock.instant(),
            Double.POSITIVE_INFINITY,
            Double.POSITIVE_INFINITY,
            ReadingKind.OHMS,
            null,
            null,
            "VCC");
    store.cases().addAfterRepair(c.id(), List.of(dc, rms, across, open, toRail));

    List<AfterRepairReading> back = store.cases().caseFile(c.id()).orElseThrow().afterRepair();
    assertThat(back).containsExactly(dc, rms, across, open, toRail);
    assertThat(back.get(1).kind()).isEqualTo(ReadingKind.AC);
    assertThat(back.get(1).measure()).isEqualTo("rms");
    assertThat(back.get(1).hz()).isEqualTo(1000.0);
    assertThat(back.get(2).to()).isEqualTo("OUT");
    assertThat(back)
        .extracting(AfterRepairReading::inside)
        .containsExactly(true, true, true, false, true);
  }

  @Test
  void addAfterRepair_refusesBadAcAndOhmsReadings_namingTheField_andStoresNone() {
    RepairCase c = openCase();
    AfterRepairReading good = ac(c.id(), 0.333, 0.329, 0.336);
    assertThatThrownBy(
            () -> store.cases().addAfterRepair(c.id(), List.of(good, ac(c.id(), -0.3, null, null))))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("afterRepair[1].value");
    assertThatThrownBy(
            () -> store.cases().addAfterRepair(c.id(), List.of(ohms(c.id(), -5, null, null))))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("afterRepair[0].value");
    assertThatThrownBy(
            () ->
                store
                    .cases()
                    .addAfterRepair(
                        c.id(), List.of(ohms(c.id(), 47e3, Double.POSITIVE_INFINITY, 47_470.0))))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("afterRepair[0].healthyLow");
    assertThat(store.cases().caseFile(c.id()).orElseThrow().afterRepair()).isEmpty();
  }

  @Test
  void acAndOhmsReadingsAfterRepair_travelInBundles_withTheirKinds() {
    RepairCase c = openCase();
    AfterRepairReading rms = ac(c.id(), 0.47, 0.329, 0.336);
    AfterRepairReading open = ohms(c.id(), Double.POSITIVE_INFINITY, 46_530.0, 47_470.0);
    store.cases().addAfterRepair(c.id(), List.of(rms, open));
    HistoryBundle bundle = store.transfer().export(new ExportSelection.All(), "test");
    assertThat(bundle.afterRepair()).containsExactly(rms, open);
    try (HistoryStore other = openStore(Clock.systemUTC())) {
      ImportReport report = other.transfer().importBundle(bundle, "bundle.json");
      assertThat(report.conflicts()).isEmpty();
      assertThat(other.cases().caseFile(c.id()).orElseThrow().afterRepair())
          .containsExactly(rms, open);
      assertThat(other.transfer().importBundle(bundle, "bundle.json").added()).isZero();
    }
  }
}
