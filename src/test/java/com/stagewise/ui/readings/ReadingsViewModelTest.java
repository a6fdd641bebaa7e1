package com.stagewise.ui.readings;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Reading;
import com.stagewise.history.record.BoardModel;
import com.stagewise.ui.Step;
import com.stagewise.ui.TestBench;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ReadingsViewModelTest {
  /** Volts from a rail to a clamped classic-bipolar output (DESIGN.md, common practice). */
  private static final double HEADROOM = 1.5;

  @TempDir Path temp;
  private TestBench t;
  private ReadingsViewModel model;

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    BoardModel board = t.store.units().boardModel("Test amp board", "");
    var unit = t.store.units().add("TA-1", board.id(), "");
    t.bench.showUnit(unit, board);
    t.bench.startCase(t.store.cases().open(unit.id(), "Output pinned"));
    model = new ReadingsViewModel(t.bench);
    t.bench.stageProperty().set(TestBench.invertingStage(board.name()));
    t.bench.go(Step.READINGS);
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  private void read(double volts) {
    model.pad().textProperty().set(String.format(java.util.Locale.ROOT, "%.3f", volts));
    model.addReading();
  }

  @Test
  void probe_beforeAnyReading_isThePositiveSupplyPin() {
    // dual-8 pinout (DESIGN.md, industry standard): v+ is pin 8, v- is pin 4. Rails first is
    // common practice: a missing supply explains everything downstream.
    assertThat(model.probeProperty().get().at()).isEqualTo("U1.8");
    assertThat(model.probeProperty().get().title())
        .isEqualTo("U1 pin 8 — positive supply pin (VCC)");
    read(14.96);
    assertThat(model.probeProperty().get().at()).isEqualTo("U1.4");
    read(-14.97);
    assertThat(model.probeProperty().get()).isNotNull();
    assertThat(model.probeProperty().get().at()).isNotIn("U1.8", "U1.4");
  }

  @Test
  void addReading_openFeedbackResistor_ranksItFirstAndStoresEverything() {
    // Textbook: with Rf open the inverting stage runs open-loop; no current flows in R1, so the
    // inverting input follows the 1 V input and the output clamps 1.5 V above the negative rail.
    read(14.96);
    read(-14.97);
    model.choose("U1.1");
    read(-14.97 + HEADROOM);
    model.choose("U1.2");
    read(1.0);
    var first = t.bench.diagnosisProperty().get().suspects().get(0);
    assertThat(first.group()).contains("R2:open");
    assertThat(model.verdictProperty().get()).startsWith("Most likely: ");
    assertThat(model.topSuspects()).hasSizeLessThanOrEqualTo(ReadingsViewModel.TOP);
    assertThat(model.rows()).hasSize(4);
    // Newest first; the output reading lies far outside the healthy range of about -4.7 V.
    assertThat(model.rows().get(1).reading().at()).isEqualTo("U1.1");
    assertThat(model.rows().get(1).healthy()).isFalse();
    assertThat(model.rows().get(3).healthy()).isTrue();
    var file = t.store.cases().caseFile(t.bench.openCaseProperty().get().id()).orElseThrow();
    assertThat(file.readings())
        .extracting(r -> r.at())
        .containsExactly("U1.8", "U1.4", "U1.1", "U1.2");
    assertThat(file.suspectLists()).hasSize(4);
    assertThat(file.suspectLists().get(3).suspects().get(0).fault()).isEqualTo(first.fault());
  }

  @Test
  void addReading_emptyPad_asksForTheValue() {
    model.addReading();
    assertThat(t.problems).containsExactly("Type the reading first");
    assertThat(t.bench.readings()).isEmpty();
  }

  @Test
  void addReading_clearsThePad() {
    read(14.96);
    assertThat(model.pad().textProperty().get()).isEmpty();
    assertThat(t.bench.readings()).containsExactly(Reading.dc("U1.8", 14.96));
  }

  @Test
  void choose_net_namesWhereToFindIt() {
    model.choose("SUM");
    assertThat(model.probeProperty().get().title()).isEqualTo("Net SUM — at R1, R2 and U1 pin 2");
    model.followSuggestion();
    assertThat(model.probeProperty().get().at()).isEqualTo("U1.8");
  }

  @Test
  void expected_inverting_matchesClosedForm() {
    // Inverting amplifier: Vout = -(Rf/Rin) Vin = -4.7 V (textbook closed form).
    assertThat(model.expectedProperty().get().at("OUT"))
        .isCloseTo(-4.7, org.assertj.core.data.Offset.offset(1e-3));
  }

  @Test
  void stage_arrivingAfterReadings_asOnResume_diagnosesThemAtOnce() {
    var again = new ReadingsViewModel(t.bench);
    t.bench.stageProperty().set(null);
    t.bench
        .readings()
        .setAll(Reading.dc("U1.8", 14.96), Reading.dc("U1.4", -14.97), Reading.dc("U1.1", -13.47));
    t.bench.stageProperty().set(TestBench.invertingStage("Test amp board"));
    assertThat(t.bench.diagnosisProperty().get()).isNotNull();
    assertThat(again.rows()).hasSize(3);
    assertThat(again.probeProperty().get().at()).isNotIn("U1.8", "U1.4");
  }

  private boolean railSuspected() {
    return t.bench.diagnosisProperty().get().suspects().get(0).fault().startsWith("VCC:");
  }

  @Test
  void correct_aMistypedRailReading_strikesItAndTheDiagnosisFollowsTheRightValue() {
    // 1.496 V typed for 14.96 V on the +15 V supply pin (dual-8: pin 8 is v+, DESIGN.md): a rail
    // that low is the first explanation; once corrected it is not (the textbook stage is healthy
    // with its rails within 5 %).
    read(1.496);
    read(-14.97);
    model.choose("U1.1");
    read(-4.70);
    assertThat(railSuspected()).isTrue();

    ReadingRow typo = model.rows().get(2);
    assertThat(typo.reading().value()).isEqualTo(1.496);
    model.correct(typo);
    assertThat(model.probeProperty().get().at()).isEqualTo("U1.8");
    assertThat(model.pad().textProperty().get()).isEqualTo("1.496");
    assertThat(model.correctingTextProperty().get()).contains("U1 pin 8");
    model.pad().textProperty().set("14.96");
    model.addReading();

    assertThat(model.correctingTextProperty().get()).isEmpty();
    assertThat(railSuspected()).isFalse();
    assertThat(t.bench.readings()).extracting(Reading::value).containsExactly(-14.97, -4.70, 14.96);
    assertThat(model.rows().get(model.rows().size() - 1).struck()).isTrue();
    assertThat(model.undoTextProperty().get()).startsWith("Corrected U1 pin 8");
    var file = t.store.cases().caseFile(t.bench.openCaseProperty().get().id()).orElseThrow();
    // Nothing deleted: the history holds the mistyped reading, struck with when, and the right one.
    assertThat(file.readings())
        .extracting(r -> r.value())
        .containsExactly(1.496, -14.97, -4.70, 14.96);
    assertThat(file.readings().get(0).struckAt()).isNotNull();
    assertThat(file.readings().subList(1, 4)).noneMatch(r -> r.struck());
    // The stored suspect list is the one of the readings that stand.
    assertThat(file.suspectLists().get(file.suspectLists().size() - 1).suspects().get(0).fault())
        .isEqualTo(t.bench.diagnosisProperty().get().suspects().get(0).fault());

    model.undo();
    assertThat(railSuspected()).isTrue();
    assertThat(t.bench.readings())
        .extracting(Reading::value)
        .containsExactlyInAnyOrder(1.496, -14.97, -4.70);
    file = t.store.cases().caseFile(t.bench.openCaseProperty().get().id()).orElseThrow();
    assertThat(file.readings())
        .filteredOn(r -> r.struck())
        .extracting(r -> r.value())
        .containsExactly(14.96);
  }

  @Test
  void strike_aReading_leavesItOutOfTheDiagnosis_andUndoBringsItBack() {
    read(14.96);
    read(-14.97);
    model.choose("U1.1");
    read(-13.47); // far from the healthy -4.7 V: the output looks stuck low
    String withIt = t.bench.diagnosisProperty().get().suspects().get(0).fault();
    ReadingRow out = model.rows().get(0);
    assertThat(out.reading().at()).isEqualTo("U1.1");

    model.strike(out);

    assertThat(t.bench.readings()).extracting(Reading::at).containsExactly("U1.8", "U1.4");
    assertThat(model.rows()).hasSize(3);
    ReadingRow struck = model.rows().get(2);
    assertThat(struck.struck()).isTrue();
    assertThat(struck.struckAt()).isNotNull();
    assertThat(model.undoTextProperty().get()).startsWith("Struck out U1 pin 1");
    // With only the rails read, the output fault is no longer called.
    assertThat(t.bench.diagnosisProperty().get().suspects().get(0).fault()).isNotEqualTo(withIt);
    var file = t.store.cases().caseFile(t.bench.openCaseProperty().get().id()).orElseThrow();
    assertThat(file.readings()).hasSize(3);
    assertThat(file.readings().get(2).struck()).isTrue();

    model.undo();
    assertThat(t.bench.readings()).extracting(Reading::at).contains("U1.1");
    assertThat(t.bench.struckReadings()).isEmpty();
    assertThat(t.bench.diagnosisProperty().get().suspects().get(0).fault()).isEqualTo(withIt);
    assertThat(model.undoTextProperty().get()).isEmpty();
  }

  @Test
  void strike_everyReading_leavesNoDiagnosis_andTheStruckOnesListed() {
    read(14.96);
    model.strike(model.rows().get(0));
    assertThat(t.bench.readings()).isEmpty();
    assertThat(t.bench.diagnosisProperty().get()).isNull();
    assertThat(model.rows()).singleElement().matches(ReadingRow::struck);
    model.restore(model.rows().get(0));
    assertThat(t.bench.readings()).containsExactly(Reading.dc("U1.8", 14.96));
  }
}
