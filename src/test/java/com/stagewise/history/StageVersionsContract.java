package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.Unit;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The contract of library stage versions ({@link StageLibrary}, {@link StageVersions}): what every
 * store does when a stage is saved again, used for a case, and carried between benches.
 *
 * <p>The texts are stand-ins: the store keeps a sheet's text exactly and never parses it.
 */
public abstract class StageVersionsContract extends StoreContract {
  private static final String FIRST = "{\"format\": \"stagewise-stage\", \"version\": 1}";
  private static final String EDITED = FIRST.replace("}", ", \"title\": \"R2 now 100k\"}");
  private static final String OTHER_EDIT = FIRST.replace("}", ", \"title\": \"C1 added\"}");

  @Test
  void save_changedText_isTheNextVersion_andTheEarlierStaysAsItWas() {
    BoardModel model = store.units().boardModel("MX-8", "");
    StageSheetRecord v1 = store.library().save(model.id(), "Input buffer", FIRST, "Ann");
    clock.advanceMillis(60_000);
    StageSheetRecord v2 = store.library().save(model.id(), "Input buffer", EDITED, "Ben");

    assertThat(v1.version()).isEqualTo(1);
    assertThat(v2.version()).isEqualTo(2);
    assertThat(v2.savedBy()).isEqualTo("Ben");
    assertThat(v2.savedAt())
        .isEqualTo(clock.instant().truncatedTo(java.time.temporal.ChronoUnit.MILLIS));
    assertThat(store.library().versions(model.id(), "Input buffer")).containsExactly(v2, v1);
    assertThat(store.library().find(v1.id())).contains(v1);
    assertThat(store.library().find(v1.id()).orElseThrow().sheetJson()).isEqualTo(FIRST);
  }

  @Test
  void save_theSameTextAgain_isTheVersionKept_andAddsNothing() {
    BoardModel model = store.units().boardModel("MX-8", "");
    StageSheetRecord v1 = store.library().save(model.id(), "Input buffer", FIRST, "Ann");
    clock.advanceMillis(1);
    assertThat(store.library().save(model.id(), "input BUFFER", FIRST, "Ben")).isEqualTo(v1);
    assertThat(store.library().sheets(model.id())).containsExactly(v1);
  }

  @Test
  void latest_offersTheStageSavedLastFirst_eachAtItsLatestVersion() {
    BoardModel model = store.units().boardModel("MX-8", "");
    store.library().save(model.id(), "Input buffer", FIRST, "Ann");
    clock.advanceMillis(1);
    StageSheetRecord output = store.library().save(model.id(), "Output", FIRST, "Ann");
    clock.advanceMillis(1);
    StageSheetRecord edited = store.library().save(model.id(), "Input buffer", EDITED, "Ben");

    assertThat(store.library().latest(model.id())).containsExactly(edited, output);
    assertThat(store.library().sheets(model.id())).hasSize(3);
  }

  @Test
  void useForCase_recordsTheVersion_andTheCaseKeepsIt_afterLaterEditsAndClosing() {
    BoardModel model = store.units().boardModel("MX-8", "");
    Unit unit = store.units().add("NF-1", model.id(), "");
    RepairCase rc = store.cases().open(unit.id(), "no output");

    StageSheetRecord used = store.library().useForCase(rc.id(), "Input buffer", FIRST, "Ann");
    assertThat(store.cases().find(rc.id()).orElseThrow().stageSheetId()).isEqualTo(used.id());

    clock.advanceMillis(1);
    StageSheetRecord later = store.library().save(model.id(), "Input buffer", EDITED, "Ben");
    store.cases().close(rc.id(), Outcome.FIXED, List.of("R2:open"));

    RepairCase closed = store.cases().find(rc.id()).orElseThrow();
    assertThat(closed.stageSheetId()).isEqualTo(used.id());
    assertThat(later.version()).isEqualTo(2);
    assertThat(store.library().find(closed.stageSheetId()).orElseThrow().sheetJson())
        .isEqualTo(FIRST);
  }

  @Test
  void useForCase_anEditedStage_isANewVersion_thatTheCaseUses() {
    BoardModel model = store.units().boardModel("MX-8", "");
    Unit unit = store.units().add("NF-1", model.id(), "");
    StageSheetRecord v1 = store.library().save(model.id(), "Input buffer", FIRST, "Ann");
    RepairCase rc = store.cases().open(unit.id(), "no output");
    clock.advanceMillis(1);

    StageSheetRecord used = store.library().useForCase(rc.id(), "Input buffer", EDITED, "Ben");

    assertThat(used.version()).isEqualTo(2);
    assertThat(store.cases().find(rc.id()).orElseThrow().stageSheetId()).isEqualTo(used.id());
    assertThat(store.library().versions(model.id(), "Input buffer")).containsExactly(used, v1);
  }

  @Test
  void useForCase_anUnknownCase_isRefused_andSavesNothing() {
    BoardModel model = store.units().boardModel("MX-8", "");
    assertThatThrownBy(
            () -> store.library().useForCase(HistoryStore.newId(), "Input buffer", FIRST, "Ann"))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("case");
    assertThat(store.library().sheets(model.id())).isEmpty();
  }

  @Test
  void bundleRoundTrip_keepsNumbersWhoAndWhen_andTheCasesVersion() {
    BoardModel model = store.units().boardModel("MX-8", "");
    Unit unit = store.units().add("NF-1", model.id(), "");
    RepairCase rc = store.cases().open(unit.id(), "no output");
    store.library().save(model.id(), "Input buffer", FIRST, "Ann");
    clock.advanceMillis(1);
    StageSheetRecord used = store.library().useForCase(rc.id(), "Input buffer", EDITED, "Ben");
    HistoryBundle bundle = store.transfer().export(new ExportSelection.All(), "test");

    try (HistoryStore other = openStore(clock)) {
      other.transfer().importBundle(bundle, "bundle.json");
      assertThat(other.library().sheets(model.id()))
          .containsExactlyElementsOf(store.library().sheets(model.id()));
      assertThat(other.cases().find(rc.id()).orElseThrow().stageSheetId()).isEqualTo(used.id());
      // The same bundle again: nothing is duplicated.
      ImportReport again = other.transfer().importBundle(bundle, "bundle.json");
      assertThat(again.added()).isZero();
      assertThat(other.library().sheets(model.id())).hasSize(2);
    }
  }

  @Test
  void twoBenches_differentEditsUnderOneNumber_bothKept_theLaterSavedMovesOn_sameNumbersOnBoth() {
    BoardModel model = store.units().boardModel("MX-8", "");
    store.library().save(model.id(), "Input buffer", FIRST, "Ann");
    try (HistoryStore other = openStore(clock)) {
      other
          .transfer()
          .importBundle(store.transfer().export(new ExportSelection.All(), "t"), "a.json");
      // Each bench saves its own edit as version 2, the first bench a minute earlier.
      clock.advanceMillis(60_000);
      StageSheetRecord ours = store.library().save(model.id(), "Input buffer", EDITED, "Ann");
      clock.advanceMillis(60_000);
      StageSheetRecord theirs = other.library().save(model.id(), "Input buffer", OTHER_EDIT, "Ben");
      assertThat(ours.version()).isEqualTo(2);
      assertThat(theirs.version()).isEqualTo(2);

      // Their bench learns of ours: ours was saved first and keeps 2; theirs moves to 3.
      other
          .transfer()
          .importBundle(store.transfer().export(new ExportSelection.All(), "t"), "a.json");
      assertThat(other.library().versions(model.id(), "Input buffer"))
          .extracting(s -> s.version() + " " + s.savedBy() + " " + s.sheetJson())
          .containsExactly("3 Ben " + OTHER_EDIT, "2 Ann " + EDITED, "1 Ann " + FIRST);

      // And ours learns of theirs: the same numbers on both benches, nothing lost or doubled.
      store
          .transfer()
          .importBundle(other.transfer().export(new ExportSelection.All(), "t"), "b.json");
      assertThat(store.library().versions(model.id(), "Input buffer"))
          .extracting(s -> s.version() + " " + s.savedBy() + " " + s.sheetJson())
          .containsExactly("3 Ben " + OTHER_EDIT, "2 Ann " + EDITED, "1 Ann " + FIRST);
    }
  }

  @Test
  void twoBenches_theSameEditSavedOnBoth_isOneVersion_andTheCasesFollowIt() {
    BoardModel model = store.units().boardModel("MX-8", "");
    store.library().save(model.id(), "Input buffer", FIRST, "Ann");
    try (HistoryStore other = openStore(clock)) {
      other
          .transfer()
          .importBundle(store.transfer().export(new ExportSelection.All(), "t"), "a.json");
      Unit unit = other.units().add("NF-2", model.id(), "");
      RepairCase rc = other.cases().open(unit.id(), "hum");
      clock.advanceMillis(1);
      store.library().save(model.id(), "Input buffer", EDITED, "Ann");
      StageSheetRecord theirs = other.library().useForCase(rc.id(), "Input buffer", EDITED, "Ben");

      ImportReport report =
          store
              .transfer()
              .importBundle(other.transfer().export(new ExportSelection.All(), "t"), "b");
      assertThat(store.library().sheets(model.id())).hasSize(2);
      StageSheetRecord kept = store.library().versions(model.id(), "Input buffer").get(0);
      assertThat(kept.savedBy()).isEqualTo("Ann");
      assertThat(kept.id()).isNotEqualTo(theirs.id());
      assertThat(store.cases().find(rc.id()).orElseThrow().stageSheetId()).isEqualTo(kept.id());
      assertThat(report.matched()).anyMatch(m -> m.contains("version 2"));
    }
  }

  @Test
  void olderBundle_withoutNumbers_isReadAsTheNextVersion_unlessItsTextIsKept() {
    BoardModel model = store.units().boardModel("MX-8", "");
    store.library().save(model.id(), "Input buffer", FIRST, "Ann");
    Instant at = clock.instant();
    HistoryBundle older =
        new HistoryBundle(
            2,
            at,
            "0.9",
            List.of(model),
            List.of(
                new StageSheetRecord(HistoryStore.newId(), model.id(), "Input buffer", FIRST, at),
                new StageSheetRecord(HistoryStore.newId(), model.id(), "Input buffer", EDITED, at)),
            List.of(),
            List.of(),
            List.of(),
            List.of(),
            List.of(),
            List.of());

    store.transfer().importBundle(older, "older.json");

    assertThat(store.library().versions(model.id(), "Input buffer"))
        .extracting(s -> s.version() + " " + s.sheetJson())
        .containsExactly("2 " + EDITED, "1 " + FIRST);
  }

  @Test
  void bundle_caseNamingAnUnknownStageVersion_isRefused_andNothingIsImported() {
    BoardModel model = store.units().boardModel("MX-8", "");
    Unit unit = store.units().add("NF-1", model.id(), "");
    Instant at = clock.instant();
    RepairCase rc =
        new RepairCase(
            HistoryStore.newId(),
            unit.id(),
            at,
            "hum",
            com.stagewise.history.record.CaseStatus.OPEN,
            null,
            null,
            List.of(),
            at,
            HistoryStore.newId());
    HistoryBundle bundle =
        new HistoryBundle(
            3,
            at,
            "t",
            List.of(model),
            List.of(),
            List.of(unit),
            List.of(rc),
            List.of(),
            List.of(),
            List.of(),
            List.of());
    assertThatThrownBy(() -> store.transfer().importBundle(bundle, "bad.json"))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("bad.json")
        .hasMessageContaining("cases[0].stageSheetId")
        .hasMessageContaining("no stage sheet with id");
    assertThat(store.cases().find(rc.id())).isEmpty();
  }
}
