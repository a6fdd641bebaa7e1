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
}
