package com.stagewise.ui.readings;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.StoredReading;
import com.stagewise.ui.Step;
import com.stagewise.ui.TestBench;
import com.stagewise.ui.suspects.SuspectsViewModel;
import com.stagewise.ui.widget.ValuePadModel;
import java.nio.file.Path;
import java.util.Locale;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * AC readings on the readings screen's pad (issue: a meter's RMS reading was once compared with a
 * peak expectation): the pad says AC and the measure, the technician picks AC for any point, the
 * test frequency can be changed and the expectation follows it.
 *
 * <p>The stage is the textbook inverting amplifier of {@link TestBench#invertingStage}: gain −R2/R1
 * = −4.7 with a 0.1 V peak test signal at 1 kHz, so its output carries 0.47 V peak (any op-amp
 * textbook). A sine's RMS value is its peak over √2 (any circuits textbook): 0.332 V.
 */
class AcPadTest {
  private static final double ROOT2 = Math.sqrt(2);
  private static final String NBSP = "\u00a0";

  @TempDir Path temp;
  private TestBench t;
  private ReadingsViewModel model;

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    BoardModel board = t.store.units().boardModel("Test amp board", "");
    var unit = t.store.units().add("TA-1", board.id(), "");
    t.bench.showUnit(unit, board);
    t.bench.startCase(t.store.cases().open(unit.id(), "No treble"));
    model = new ReadingsViewModel(t.bench);
    t.bench.stageProperty().set(TestBench.invertingStage(board.name()));
    t.bench.go(Step.READINGS);
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  private void type(double value) {
    model.pad().textProperty().set(String.format(Locale.ROOT, "%.3f", value));
    model.addReading();
  }

  private void healthyRails() {
    type(14.96);
    type(-14.97);
  }

  @Test
  void pad_onAStageWithATestSignal_offersAcInTheInputsMeasure_atItsFrequency() {
    AcChoice ac = model.ac();
    assertThat(ac.availableProperty().get()).isTrue();
    assertThat(ac.hzProperty().get()).isEqualTo(1000);
    // The stage sheet states its input as a peak (the contract's default).
    assertThat(ac.measureProperty().get()).isEqualTo(AcMeasure.PEAK);
    // The first probe is a supply pin, read in DC (rails first, common practice).
    assertThat(ac.acProperty().get()).isFalse();
    assertThat(ac.padTitle().get()).isEqualTo("DC volts");
    assertThat(ac.signalProperty().get()).contains("IN").contains("peak").contains("1\u00a0kHz");
  }

  @Test
  void anyPoint_canBeReadInAc_andTheCallAndPadSayTheMeasure() {
    model.choose("U1.1");
    model.setAc(true);
    ProbePoint p = model.probeProperty().get();
    assertThat(p.at()).isEqualTo("U1.1");
    assertThat(p.kind()).isEqualTo(Reading.Kind.AC);
    assertThat(p.hz()).isEqualTo(1000);
    assertThat(p.call()).isEqualTo("Probe U1 pin 1 (AC volts peak at 1\u00a0kHz)");
    model.setMeasure(AcMeasure.RMS);
    assertThat(model.probeProperty().get().call())
        .isEqualTo("Probe U1 pin 1 (AC volts RMS at 1\u00a0kHz)");
    assertThat(model.ac().padTitle().get()).isEqualTo("AC volts RMS at 1\u00a0kHz");
    // A point picked while the pad is on AC is read in AC, in the measure chosen.
    model.choose("SUM");
    assertThat(model.probeProperty().get().kind()).isEqualTo(Reading.Kind.AC);
    assertThat(model.probeProperty().get().measure()).isEqualTo(AcMeasure.RMS);
    model.setAc(false);
    assertThat(model.probeProperty().get().kind()).isEqualTo(Reading.Kind.DC);
    assertThat(model.probeProperty().get().call()).isEqualTo("Probe net SUM");
  }

  @Test
  void rmsReading_isComparedWithTheAcExpectationInRms() {
    healthyRails();
    model.choose("U1.1");
    model.setAc(true);
    model.setMeasure(AcMeasure.RMS);
    type(0.332);
    ReadingRow row = model.rows().get(0);
    assertThat(row.reading().kind()).isEqualTo(Reading.Kind.AC);
    assertThat(row.reading().measure()).contains(AcMeasure.RMS);
    // The band is the expected peak band over √2: 0.47 × 0.99 … 0.47/0.99 V peak (1 % resistors,
    // one at a time), in RMS 0.3290 … 0.3357 V.
    assertThat(row.healthyLow()).isCloseTo(0.47 * 0.99 / ROOT2, within(1e-4));
    assertThat(row.healthyHigh()).isCloseTo(0.47 / 0.99 / ROOT2, within(1e-4));
    assertThat(row.healthy()).isTrue();
    // Stored with its measure, so the history says RMS.
    var file = t.store.cases().caseFile(t.bench.openCaseProperty().get().id()).orElseThrow();
    assertThat(file.readings()).last().extracting(StoredReading::measureWord).isEqualTo("rms");
    // The same 0.332 taken as a peak is well below the 0.47 V peak a healthy stage gives there.
    model.choose("U1.1");
    model.setAc(true);
    model.setMeasure(AcMeasure.PEAK);
    type(0.332);
    ReadingRow asPeak = model.rows().get(0);
    assertThat(asPeak.healthyLow()).isCloseTo(0.47 * 0.99, within(1e-4));
    assertThat(asPeak.healthy()).isFalse();
  }

  @Test
  void acReadings_appearInTheSuspectsTable_inTheirMeasure() {
    SuspectsViewModel suspects = new SuspectsViewModel(t.bench);
    healthyRails();
    model.choose("U1.1");
    model.setAc(true);
    model.setMeasure(AcMeasure.RMS);
    type(0.332);
    var row =
        suspects.comparison().stream().filter(r -> !r.ac().isEmpty()).findFirst().orElseThrow();
    assertThat(row.at()).isEqualTo("U1.1");
    assertThat(row.ac()).isEqualTo("AC RMS at 1\u00a0kHz");
    assertThat(row.measured()).isEqualTo(0.332);
    assertThat(row.healthy()).isCloseTo(0.47 / ROOT2, within(1e-4));
    assertThat(row.predicted()).isFinite();
  }

  @Test
  void testFrequency_changed_theExpectationFollowsTheStage() {
    // A single-pole low-pass (C across R2): |G| = 4.7/√(1 + (f/fc)²), fc = 1/(2π·R2·C) ≈ 33.86 Hz
    // with 100 nF (textbook). At 100 Hz the output carries 0.47/√(1 + (100/fc)²) V peak.
    Stage withC =
        t.bench.stageProperty().get().plusPart(Part.capacitor("C1", 100e-9, 0.1, "SUM", "OUT"));
    t.bench.stageProperty().set(withC);
    model.pad().textProperty().set("0.1");
    model.ac().frequencyTextProperty().set("100");
    model.setTestFrequency();
    assertThat(model.ac().frequencyProblemProperty().get()).isEmpty();
    assertThat(t.bench.stageProperty().get().inputs().get(0).hz()).isEqualTo(100);
    assertThat(model.ac().hzProperty().get()).isEqualTo(100);
    double fc = 1 / (2 * Math.PI * 47e3 * 100e-9);
    double expected = 0.47 / Math.sqrt(1 + (100 / fc) * (100 / fc));
    assertThat(model.expectedAcProperty().get().hz()).isEqualTo(100);
    assertThat(model.expectedAcProperty().get().at("OUT")).isCloseTo(expected, within(1e-4));
    // What was typed on the pad is not lost by the change.
    assertThat(model.pad().textProperty().get()).isEqualTo("0.1");
    // The diagnosis takes AC readings at the new frequency.
    healthyRails();
    model.choose("OUT");
    model.setAc(true);
    type(expected);
    assertThat(t.problems).isEmpty();
    assertThat(t.bench.readings()).last().extracting(Reading::hz).isEqualTo(100.0);
  }

  @Test
  void testFrequency_withAcReadingsStanding_isRefused_andWhatWasTypedStays() {
    healthyRails();
    model.choose("OUT");
    model.setAc(true);
    type(0.47);
    model.ac().frequencyTextProperty().set("10k");
    model.setTestFrequency();
    assertThat(model.ac().frequencyProblemProperty().get())
        .contains("AC readings taken at 1\u00a0kHz stand")
        .contains("Strike them out");
    assertThat(model.ac().frequencyTextProperty().get()).isEqualTo("10k");
    assertThat(t.bench.stageProperty().get().inputs().get(0).hz()).isEqualTo(1000);
  }

  @Test
  void testFrequency_notAFrequency_saysWhatToType_andKeepsIt() {
    model.ac().frequencyTextProperty().set("1,5 kilo");
    model.setTestFrequency();
    assertThat(model.ac().frequencyProblemProperty().get())
        .contains("\"1,5 kilo\"")
        .contains("e.g. 1k");
    assertThat(model.ac().frequencyTextProperty().get()).isEqualTo("1,5 kilo");
    model.ac().frequencyTextProperty().set("0");
    model.setTestFrequency();
    assertThat(model.ac().frequencyProblemProperty().get()).contains("out of range");
    assertThat(t.bench.stageProperty().get().inputs().get(0).hz()).isEqualTo(1000);
  }

  private ReadingRow rowAt(String at, Reading.Kind kind) {
    return model.rows().stream()
        .filter(r -> r.reading().at().equals(at) && r.reading().kind() == kind)
        .findFirst()
        .orElseThrow();
  }

  @Test
  void testFrequency_changed_keepsTheUndoOfAStruckReading() {
    // A rail mistyped (1.496 V for 14.96 V at U1 pin 8), struck out, then the frequency changed:
    // the strike can still be undone, and the undone reading stands on the retuned stage.
    type(1.496);
    type(-14.97);
    model.strike(rowAt("U1.8", Reading.Kind.DC));
    assertThat(model.undoTextProperty().get()).startsWith("Struck out U1 pin 8");

    model.ac().frequencyTextProperty().set("2k");
    model.setTestFrequency();

    assertThat(model.ac().frequencyProblemProperty().get()).isEmpty();
    assertThat(t.bench.stageProperty().get().inputs().get(0).hz()).isEqualTo(2000);
    assertThat(model.undoTextProperty().get()).startsWith("Struck out U1 pin 8");
    model.undo();
    assertThat(t.problems).isEmpty();
    assertThat(t.bench.readings()).extracting(Reading::value).containsExactly(-14.97, 1.496);
    assertThat(t.bench.struckReadings()).isEmpty();
    assertThat(model.undoTextProperty().get()).isEmpty();
    var file = t.store.cases().caseFile(t.bench.openCaseProperty().get().id()).orElseThrow();
    assertThat(file.readings()).noneMatch(StoredReading::struck);
  }

  @Test
  void testFrequency_changed_keepsTheUndoOfACorrection() {
    type(1.496);
    type(-14.97);
    model.correct(rowAt("U1.8", Reading.Kind.DC));
    model.pad().textProperty().set("14.96");
    model.addReading();
    assertThat(model.undoTextProperty().get()).startsWith("Corrected U1 pin 8");

    model.ac().frequencyTextProperty().set("500");
    model.setTestFrequency();

    assertThat(t.bench.stageProperty().get().inputs().get(0).hz()).isEqualTo(500);
    assertThat(model.undoTextProperty().get()).startsWith("Corrected U1 pin 8");
    model.undo();
    assertThat(t.problems).isEmpty();
    assertThat(t.bench.readings()).extracting(Reading::value).containsExactly(-14.97, 1.496);
  }

  @Test
  void testFrequency_changed_afterStrikingAnAcReading_forgetsOnlyThatUndo() {
    // An AC reading struck at 1 kHz cannot stand again at 2 kHz (every AC reading is judged at the
    // stage's one test frequency): the strike stays, with its undo forgotten rather than refused.
    healthyRails();
    model.choose("OUT");
    model.setAc(true);
    type(0.47);
    model.strike(rowAt("OUT", Reading.Kind.AC));
    assertThat(model.undoTextProperty().get()).startsWith("Struck out");

    model.ac().frequencyTextProperty().set("2k");
    model.setTestFrequency();

    assertThat(t.bench.stageProperty().get().inputs().get(0).hz()).isEqualTo(2000);
    assertThat(model.undoTextProperty().get()).isEmpty();
    assertThat(t.bench.struckReadings())
        .extracting(s -> s.reading().kind())
        .containsExactly(Reading.Kind.AC);
    assertThat(t.problems).isEmpty();
  }

  @Test
  void acPad_hasNoSign_aNegativeAmplitudeIsRefusedPlainly_andDcAndOhmsKeepTheirRules() {
    healthyRails();
    model.choose("U1.1");
    assertThat(model.pad().unsignedProperty().get()).as("DC volts take a sign").isEmpty();
    model.setAc(true);
    // An RMS, peak or peak-to-peak amplitude is a magnitude (any circuits textbook).
    assertThat(model.pad().unsignedProperty().get()).isEqualTo(ValuePadModel.AC_AMPLITUDE);

    model.pad().textProperty().set("-0.332");
    model.addReading();

    assertThat(t.problems).containsExactly("An AC amplitude has no sign");
    assertThat(t.problemTexts.get(0))
        .contains("The pad holds −332.0" + NBSP + "mV, below 0 V.")
        .contains("take the minus sign away");
    assertThat(model.pad().textProperty().get()).isEqualTo("-0.332");
    assertThat(t.bench.readings()).hasSize(2);
    var file = t.store.cases().caseFile(t.bench.openCaseProperty().get().id()).orElseThrow();
    assertThat(file.readings()).hasSize(2);

    // Power off: the ohms pad has no sign key at all and refuses a negative value in words.
    model.setPowerOff(true);
    assertThat(model.pad().quantityProperty().get()).isEqualTo(ValuePadModel.Quantity.METER_OHMS);
    assertThat(model.pad().unsignedProperty().get()).isEmpty();
    model.pad().textProperty().set("-47k");
    assertThat(model.pad().valueProperty().get()).isNull();
    assertThat(model.pad().problemProperty().get()).contains("cannot be negative");
    model.setPowerOff(false);

    // Back on DC volts the sign is taken again.
    model.setAc(false);
    assertThat(model.pad().unsignedProperty().get()).isEmpty();
    model.pad().textProperty().set("-13.46");
    model.addReading();
    assertThat(t.bench.readings()).last().isEqualTo(Reading.dc("U1.1", -13.46));
  }
}
