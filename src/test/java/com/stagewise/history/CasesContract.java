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
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The contract of {@link Cases}: what every store does with cases and their records. */
public abstract class CasesContract extends StoreContract {

  @Test
  void ohmsReadings_comeBackWithTheirSecondPointAndOverRange() {
    BoardModel model = store.units().boardModel("SM-8", "Larkspur (invented)");
    Unit unit = store.units().add("SM8-5", model.id(), "");
    RepairCase opened = store.cases().open(unit.id(), "no output");
    StoredReading volts =
        new StoredReading(
            HistoryStore.newId(),
            opened.id(),
            "U3.1",
            ReadingKind.DC,
            -13.46,
            null,
            null,
            "6000-count meter",
            clock.instant());
    StoredReading overRange =
        new StoredReading(
            HistoryStore.newId(),
            opened.id(),
            "SUM",
            ReadingKind.OHMS,
            Double.POSITIVE_INFINITY,
            null,
            null,
            "6000-count meter, ohms ±(0.8 % + 3 counts)",
            clock.instant(),
            "OUT");
    StoredReading across =
        new StoredReading(
            HistoryStore.newId(),
            opened.id(),
            "R14.1",
            ReadingKind.OHMS,
            0.4,
            null,
            0.1,
            "",
            clock.instant(),
            "R14.2");
    store
        .cases()
        .addReadings(
            opened.id(),
            List.of(volts, overRange, across),
            new SuspectListRecord(
                HistoryStore.newId(),
                opened.id(),
                clock.instant(),
                "0.1.0",
                "fault",
                List.of(new StoredSuspect("R14:short", 0.97, List.of("R14:short"), "", 1)),
                ""));

    List<StoredReading> back = store.cases().caseFile(opened.id()).orElseThrow().readings();
    assertThat(back).containsExactly(volts, overRange, across);
    assertThat(back.get(1).isOverRange()).isTrue();
    assertThat(back.get(2).to()).isEqualTo("R14.2");
  }

  @Test
  void ohmsReadingWithoutASecondPoint_isRefusedAndNothingIsStored() {
    BoardModel model = store.units().boardModel("SM-8", "Larkspur (invented)");
    Unit unit = store.units().add("SM8-6", model.id(), "");
    RepairCase opened = store.cases().open(unit.id(), "no output");
    StoredReading noSecondPoint =
        new StoredReading(
            HistoryStore.newId(),
            opened.id(),
            "SUM",
            ReadingKind.OHMS,
            47000,
            null,
            null,
            "",
            clock.instant());
    SuspectListRecord list =
        new SuspectListRecord(
            HistoryStore.newId(), opened.id(), clock.instant(), "0.1.0", "fault", List.of(), "");
    assertThatThrownBy(() -> store.cases().addReadings(opened.id(), List.of(noSecondPoint), list))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("to");
    assertThat(store.cases().caseFile(opened.id()).orElseThrow().readings()).isEmpty();
  }

  @Test
  void caseLifecycle_everythingComesBackInUnitHistory() {
    BoardModel model = store.units().boardModel("PSU-30", "Harbour Instruments");
    Unit unit = store.units().add("H-0042", model.id(), "job 7781");
    RepairCase opened = store.cases().open(unit.id(), "output stuck at +13 V");
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
    store.cases().addReadings(opened.id(), List.of(reading), list);
    CaseNote note = store.cases().addNote(opened.id(), "smells of burnt resin");
    store.cases().addAction(opened.id(), ActionKind.PART_REPLACED, "R2", "47k", "47k", "replaced");
    RepairCase closed = store.cases().close(opened.id(), Outcome.FIXED, List.of("R2:open"));

    UnitHistory history = store.cases().unitHistory(unit.id()).orElseThrow();
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
    assertThat(store.cases().confirmedFaultCounts("psu-30")).isEqualTo(Map.of("R2:open", 1));
  }

  private StoredReading dc(String caseId, String at, double volts) {
    return new StoredReading(
        HistoryStore.newId(),
        caseId,
        at,
        ReadingKind.DC,
        volts,
        null,
        null,
        "6000-count meter",
        clock.instant());
  }

  @Test
  void reviseReadings_correction_keepsTheStruckReadingMarkedWithWhen() {
    BoardModel model = store.units().boardModel("PSU-30", "Harbour Instruments");
    Unit unit = store.units().add("H-0043", model.id(), "");
    RepairCase c = store.cases().open(unit.id(), "no output");
    StoredReading typo = dc(c.id(), "U1.8", 1.19);
    store.cases().addReadings(c.id(), List.of(typo), null);
    clock.advanceMillis(60_000);
    StoredReading right = dc(c.id(), "U1.8", 11.9);
    List<StoredReading> changed =
        store
            .cases()
            .reviseReadings(
                c.id(), new Cases.Revision(List.of(typo.id()), List.of(), List.of(right)), null);

    assertThat(changed).hasSize(1);
    assertThat(changed.get(0).struckAt()).isEqualTo(clock.instant());
    assertThat(changed.get(0).updatedAt()).isEqualTo(clock.instant());
    List<StoredReading> kept = store.cases().caseFile(c.id()).orElseThrow().readings();
    // Nothing is deleted: the mistyped reading is still there, struck, beside the right one.
    assertThat(kept).extracting(StoredReading::value).containsExactly(1.19, 11.9);
    assertThat(kept.get(0).struck()).isTrue();
    assertThat(kept.get(0).sameTaking(typo)).isTrue();
    assertThat(kept.get(1).struck()).isFalse();
  }

  @Test
  void reviseReadings_restore_undoesTheStrike() {
    BoardModel model = store.units().boardModel("PSU-30", "Harbour Instruments");
    Unit unit = store.units().add("H-0044", model.id(), "");
    RepairCase c = store.cases().open(unit.id(), "no output");
    StoredReading r = dc(c.id(), "OUT", 13.4);
    store.cases().addReadings(c.id(), List.of(r), null);
    store
        .cases()
        .reviseReadings(c.id(), new Cases.Revision(List.of(r.id()), List.of(), List.of()), null);
    clock.advanceMillis(5_000);
    List<StoredReading> back =
        store
            .cases()
            .reviseReadings(
                c.id(), new Cases.Revision(List.of(), List.of(r.id()), List.of()), null);

    assertThat(back.get(0).struck()).isFalse();
    assertThat(back.get(0).updatedAt()).isEqualTo(clock.instant());
    assertThat(store.cases().caseFile(c.id()).orElseThrow().readings().get(0).struck()).isFalse();
  }

  @Test
  void reviseReadings_aReadingOfAnotherCase_isRefusedAndNothingChanges() {
    BoardModel model = store.units().boardModel("PSU-30", "Harbour Instruments");
    Unit unit = store.units().add("H-0045", model.id(), "");
    RepairCase first = store.cases().open(unit.id(), "no output");
    RepairCase second = store.cases().open(unit.id(), "hum");
    StoredReading other = dc(first.id(), "OUT", 13.4);
    store.cases().addReadings(first.id(), List.of(other), null);
    StoredReading added = dc(second.id(), "OUT", 0.2);

    assertThatThrownBy(
            () ->
                store
                    .cases()
                    .reviseReadings(
                        second.id(),
                        new Cases.Revision(List.of(other.id()), List.of(), List.of(added)),
                        null))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("reading");
    assertThat(store.cases().caseFile(second.id()).orElseThrow().readings()).isEmpty();
    assertThat(store.cases().caseFile(first.id()).orElseThrow().readings().get(0).struck())
        .isFalse();
  }

  @Test
  void closeCase_twice_isRefused() {
    BoardModel model = store.units().boardModel("PSU-30", "");
    Unit unit = store.units().add("H-1", model.id(), "");
    RepairCase c = store.cases().open(unit.id(), "dead");
    store.cases().close(c.id(), Outcome.RETURNED, List.of());
    assertThatThrownBy(() -> store.cases().close(c.id(), Outcome.FIXED, List.of()))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("already closed");
  }

  @Test
  void closeCase_badFaultId_isRefusedAndNothingChanges() {
    BoardModel model = store.units().boardModel("PSU-30", "");
    Unit unit = store.units().add("H-1", model.id(), "");
    RepairCase c = store.cases().open(unit.id(), "dead");
    assertThatThrownBy(() -> store.cases().close(c.id(), Outcome.FIXED, List.of("R2 open")))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("fault id");
    assertThat(store.cases().find(c.id()).orElseThrow().status()).isEqualTo(CaseStatus.OPEN);
  }

  @Test
  void resolveCaseId_prefix_findsTheCase() {
    BoardModel model = store.units().boardModel("PSU-30", "");
    Unit unit = store.units().add("H-1", model.id(), "");
    RepairCase c = store.cases().open(unit.id(), "dead");
    assertThat(store.cases().resolveId(c.id().substring(0, 8))).isEqualTo(c.id());
    assertThatThrownBy(() -> store.cases().resolveId("ffff0000"))
        .isInstanceOf(InvalidInputException.class);
  }

  @Test
  void closeOut_withNoteAndActions_storesAllOfItAtOnce() {
    Unit unit = store.units().add("H-7", store.units().boardModel("PSU-30", "").id(), "");
    RepairCase c = store.cases().open(unit.id(), "dead");
    Cases.CloseOut closeOut =
        new Cases.CloseOut(
            Outcome.FIXED,
            List.of("R2:open"),
            "replaced R2, output back to 0 V",
            List.of(
                new Cases.ActionDraft(ActionKind.PART_REPLACED, "R2", "47k", "47k", "cracked"),
                new Cases.ActionDraft(ActionKind.REFLOW, "U1", "", "", "")));
    RepairCase closed = store.cases().close(c.id(), closeOut);
    CaseFile file = store.cases().caseFile(c.id()).orElseThrow();
    assertThat(closed.status()).isEqualTo(CaseStatus.CLOSED);
    assertThat(file.repairCase()).isEqualTo(closed);
    assertThat(file.notes()).extracting(CaseNote::text).containsExactly(closeOut.note());
    assertThat(file.actions()).extracting(a -> a.part()).containsExactly("R2", "U1");
  }

  @Test
  void closeOut_withANoteOverTheLimit_leavesTheCaseOpenAndWritesNothing() {
    Unit unit = store.units().add("H-8", store.units().boardModel("PSU-30", "").id(), "");
    RepairCase c = store.cases().open(unit.id(), "dead");
    String note = "x".repeat(Checks.MAX_TEXT + 10_000);
    assertThatThrownBy(
            () ->
                store
                    .cases()
                    .close(
                        c.id(),
                        new Cases.CloseOut(
                            Outcome.FIXED,
                            List.of(),
                            note,
                            List.of(
                                new Cases.ActionDraft(
                                    ActionKind.PART_REPLACED, "R2", "", "", "")))))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("note");
    CaseFile file = store.cases().caseFile(c.id()).orElseThrow();
    assertThat(file.repairCase().status()).isEqualTo(CaseStatus.OPEN);
    assertThat(file.notes()).isEmpty();
    assertThat(file.actions()).isEmpty();
  }

  @Test
  void closeOut_ofAClosedCase_addsNeitherNoteNorAction() {
    Unit unit = store.units().add("H-9", store.units().boardModel("PSU-30", "").id(), "");
    RepairCase c = store.cases().open(unit.id(), "dead");
    store.cases().close(c.id(), Outcome.RETURNED, List.of());
    assertThatThrownBy(
            () ->
                store
                    .cases()
                    .close(
                        c.id(),
                        new Cases.CloseOut(
                            Outcome.FIXED,
                            List.of(),
                            "late note",
                            List.of(new Cases.ActionDraft(ActionKind.OTHER, "", "", "", "x")))))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("already closed");
    CaseFile file = store.cases().caseFile(c.id()).orElseThrow();
    assertThat(file.notes()).isEmpty();
    assertThat(file.actions()).isEmpty();
  }

  @Test
  void addNote_toAnUnknownCase_isRefused() {
    assertThatThrownBy(() -> store.cases().addNote(HistoryStore.newId(), "hello"))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("no case");
  }
}
