package com.stagewise.ui.start;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.Unit;
import com.stagewise.ui.SafetyCaution;
import com.stagewise.ui.Step;
import com.stagewise.ui.TestBench;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class StartViewModelTest {
  @TempDir Path temp;
  private TestBench t;
  private StartViewModel model;
  private BoardModel amp;
  private Unit unit;

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    amp = t.store.units().boardModel("Test amp board", "");
    unit = t.store.units().add("TA-1001", amp.id(), "bench test");
    t.store.units().add("TA-2002", amp.id(), "");
    model = new StartViewModel(t.bench);
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  @Test
  void search_partOfSerialWithoutDash_findsAndSelectsTheOneUnit() {
    model.serialProperty().set("ta1001");
    model.search();
    assertThat(model.matches()).extracting(r -> r.unit().serial()).containsExactly("TA-1001");
    assertThat(model.selectedProperty().get().unit().id()).isEqualTo(unit.id());
    assertThat(t.bench.unitProperty().get().serial()).isEqualTo("TA-1001");
  }

  @Test
  void searchAsTyped_listsTheMatchesWithoutPuttingTheOneUnitOnTheBench() {
    model.serialProperty().set("ta-1");

    model.searchAsTyped();

    assertThat(model.matches()).extracting(r -> r.unit().serial()).containsExactly("TA-1001");
    assertThat(model.matchesNoteProperty().get()).isEqualTo("1 unit found.");
    assertThat(t.bench.unitProperty().get()).isNull();

    model.serialProperty().set("ta");
    model.searchAsTyped();

    assertThat(model.matches()).hasSize(2);
  }

  @Test
  void searchAsTyped_oneUnitFound_isOfferedToOpenWithOneTap_withoutOpeningItByItself() {
    model.serialProperty().set("ta");
    model.searchAsTyped();
    assertThat(model.onlyMatchProperty().get()).as("two units match").isNull();

    model.serialProperty().set("ta-10");
    model.searchAsTyped();

    // Still typing: the unit is offered, nothing moves.
    assertThat(model.onlyMatchProperty().get().unit().id()).isEqualTo(unit.id());
    assertThat(model.onlyMatchTextProperty().get()).isEqualTo("Open TA-1001");
    assertThat(model.selectedProperty().get()).isNull();
    assertThat(t.bench.unitProperty().get()).isNull();

    model.openOnlyMatch();

    assertThat(model.selectedProperty().get().unit().id()).isEqualTo(unit.id());
    assertThat(t.bench.unitProperty().get().serial()).isEqualTo("TA-1001");
    assertThat(model.onlyMatchProperty().get()).as("shown now, no longer offered").isNull();
    assertThat(model.onlyMatchTextProperty().get()).isEmpty();

    // Typing on to a serial that matches nothing takes the offer away.
    model.serialProperty().set("ta-109");
    model.searchAsTyped();
    assertThat(model.onlyMatchProperty().get()).isNull();
  }

  @Test
  void search_enterWithOneUnitFound_showsItAtOnce_andOffersNothingMore() {
    model.serialProperty().set("2002");
    model.searchAsTyped();
    assertThat(model.onlyMatchTextProperty().get()).isEqualTo("Open TA-2002");

    model.search(); // Enter in the serial field, or Search

    assertThat(model.selectedProperty().get().unit().serial()).isEqualTo("TA-2002");
    assertThat(model.onlyMatchProperty().get()).isNull();
  }

  @Test
  void search_empty_listsEveryUnit() {
    model.search();
    assertThat(model.matches()).hasSize(2);
    assertThat(model.matchesNoteProperty().get()).isEqualTo("2 units found.");
  }

  @Test
  void search_unknownSerial_saysSoInWords() {
    model.serialProperty().set("XX-9");
    model.search();
    assertThat(model.matches()).isEmpty();
    assertThat(model.matchesNoteProperty().get()).contains("No unit has a serial like \"XX-9\"");
  }

  @Test
  void glance_closedCase_showsOutcomeFaultsAndPartsReplaced() {
    var rc = t.store.cases().open(unit.id(), "No output");
    t.store
        .cases()
        .addAction(
            rc.id(),
            com.stagewise.history.record.ActionKind.PART_REPLACED,
            "R2",
            "open",
            "47k",
            "");
    t.store.cases().close(rc.id(), Outcome.FIXED, List.of("R2:open"));
    model.serialProperty().set("TA-1001");
    model.search();
    assertThat(model.glance())
        .singleElement()
        .satisfies(
            line -> {
              assertThat(line.outcome()).isEqualTo("fixed");
              assertThat(line.faults()).isEqualTo("R2 open");
              assertThat(line.replaced()).isEqualTo("R2 → 47k");
              assertThat(line.open()).isFalse();
            });
  }

  @Test
  void openCase_withoutSymptom_asksForIt() {
    model.serialProperty().set("TA-1001");
    model.search();
    model.openCase();
    assertThat(t.problems).containsExactly("Say what is wrong");
    assertThat(t.bench.openCaseProperty().get()).isNull();
  }

  @Test
  void openCase_withSymptom_opensItAndGoesToStage() {
    model.serialProperty().set("TA-1001");
    model.search();
    model.symptomProperty().set("Left channel dead");
    model.openCase();
    assertThat(t.bench.openCaseProperty().get().symptom()).isEqualTo("Left channel dead");
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.STAGE);
    assertThat(
            t.store
                .cases()
                .search(com.stagewise.history.SearchQuery.all().withStatus(CaseStatus.OPEN)))
        .hasSize(1);
    assertThat(t.cautions).isEmpty();
  }

  @Test
  void openCase_mainsPoweredBoard_showsTheCautionFirst() {
    t.mains.put(amp.id(), true);
    model.serialProperty().set("TA-1001");
    model.search();
    model.symptomProperty().set("Hum");
    model.openCase();
    assertThat(t.cautions).containsExactly(SafetyCaution.Reason.MAINS);
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.STAGE);
  }

  @Test
  void addUnit_withoutBoardModel_saysWhatIsNeeded() {
    model.newSerialProperty().set("TA-3003");
    model.addUnit();
    assertThat(t.problems).containsExactly("The unit needs a serial and a board model");
  }

  @Test
  void addUnit_newBoardModel_addsBothAndRemembersMains() {
    model.newSerialProperty().set("PX-7");
    model.newBoardModelProperty().set("Power board");
    model.newMainsProperty().set(true);
    model.addUnit();
    assertThat(model.selectedProperty().get().unit().serial()).isEqualTo("PX-7");
    BoardModel power = t.store.units().findBoardModel("Power board").orElseThrow();
    assertThat(t.mains).containsEntry(power.id(), true);
    assertThat(t.bench.mainsPoweredProperty().get()).isTrue();
  }

  @Test
  void resumeCase_savedAtReadings_comesBackWithStageAndReadings() {
    var rc = t.store.cases().open(unit.id(), "Distorts");
    t.resume.saveStage(rc.id(), TestBench.invertingStage("Test amp board"));
    t.resume.saveStep(rc.id(), Step.READINGS);
    t.store
        .cases()
        .addReadings(
            rc.id(),
            List.of(
                new com.stagewise.history.record.StoredReading(
                    com.stagewise.history.HistoryStore.newId(),
                    rc.id(),
                    "U1.8",
                    com.stagewise.history.record.ReadingKind.DC,
                    14.9,
                    null,
                    null,
                    "",
                    java.time.Instant.now())),
            null);
    model.serialProperty().set("TA-1001");
    model.search();
    model.resumeCase(rc.id());
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.READINGS);
    assertThat(t.bench.stageProperty().get().title()).isEqualTo("Inverting amplifier, test");
    assertThat(t.bench.readings()).extracting(r -> r.at()).containsExactly("U1.8");
  }

  @Test
  void resumeCase_mainsPoweredBoard_cautionsOncePerCaseNotOnEveryResume() {
    t.mains.put(amp.id(), true);
    model.serialProperty().set("TA-1001");
    model.search();
    model.symptomProperty().set("Hum");
    model.openCase();
    String caseId = t.bench.openCaseProperty().get().id();
    assertThat(t.cautions).containsExactly(SafetyCaution.Reason.MAINS);

    model.search();
    model.resumeCase(caseId);
    model.resumeCase(caseId);

    assertThat(t.cautions).containsExactly(SafetyCaution.Reason.MAINS);
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.STAGE);
    // Another case of the same mains-powered unit brings it again.
    model.symptomProperty().set("Crackles");
    model.openCase();
    assertThat(t.cautions).containsExactly(SafetyCaution.Reason.MAINS, SafetyCaution.Reason.MAINS);
  }
}
