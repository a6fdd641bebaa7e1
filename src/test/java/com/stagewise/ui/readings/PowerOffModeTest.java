package com.stagewise.ui.readings;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestStage;
import com.stagewise.history.record.BoardModel;
import com.stagewise.ui.Step;
import com.stagewise.ui.TestBench;
import com.stagewise.ui.widget.ValuePadModel;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Set;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The readings screen's power-off mode, without the toolkit, on the textbook inverting amplifier
 * (R1 10 kΩ from IN to SUM, R2 47 kΩ feedback from SUM to OUT, both 1 %).
 *
 * <p>Outside facts: with R2 open or R1 shorted the inverting amplifier has no working loop gain, so
 * its output clamps 1.5 V above the negative rail and SUM follows the input; both faults put the
 * same volts on every pin (any op-amp textbook). With the power off the rails and inputs float and
 * the op-amp draws nothing (DESIGN.md's power-off model), so SUM to OUT reads R2 alone and IN to
 * OUT reads R1 and R2 in series (series and parallel resistors, any circuits textbook).
 */
class PowerOffModeTest {
  /** Volts from a rail to a clamped classic-bipolar output (DESIGN.md, common practice). */
  private static final double HEADROOM = 1.5;

  @TempDir Path temp;
  private TestBench t;
  private ReadingsViewModel model;

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    BoardModel board = t.store.units().boardModel("Test amp board", "");
    var unit = t.store.units().add("TA-2", board.id(), "");
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

  private void type(String text) {
    model.pad().textProperty().set(text);
    model.addReading();
  }

  private void openFeedbackVolts() {
    type("14.96");
    type("-14.97");
    model.choose("U1.1");
    type(String.format(Locale.ROOT, "%.2f", -14.97 + HEADROOM));
    model.choose("U1.2");
    type("1.0");
  }

  @Test
  void voltsCannotSplitTheLeadingPair_soThePowerOffCheckIsOfferedAndOneTapTakesIt() {
    openFeedbackVolts();
    assertThat(t.bench.diagnosisProperty().get().suspects().get(0).group())
        .contains("R2:open", "R1:short");
    PowerOffMode mode = model.powerOff();
    assertThat(mode.leadingProperty().get()).isTrue();
    assertThat(mode.activeProperty().get()).isFalse();
    assertThat(mode.cautionsShownProperty().get()).isZero();

    model.takeSuggestedOhmsCheck();

    assertThat(mode.activeProperty().get()).isTrue();
    assertThat(mode.cautionsShownProperty().get()).isEqualTo(1);
    assertThat(PowerOffMode.CAUTION).contains("unplug", "discharge", "wait", "ohms", "local codes");
    assertThat(model.pad().quantityProperty().get()).isEqualTo(ValuePadModel.Quantity.METER_OHMS);
    assertThat(Set.of(mode.fromProperty().get().at(), mode.toProperty().get().at()))
        .isEqualTo(
            Set.of(mode.suggestedProperty().get().at(), mode.suggestedProperty().get().to()));
    // The why in words, without what the caution and the call already say.
    assertThat(mode.whyProperty().get())
        .contains("if R2 is open")
        .doesNotContain("R2:open", "R1:short", "unplug");
  }

  @Test
  void ohmsReading_overRangeAcrossTheFeedbackResistor_leavesItAloneAndIsStored() {
    openFeedbackVolts();
    model.setPowerOff(true);
    model.choose("SUM");
    model.choose("OUT");
    assertThat(model.powerOff().call().get()).isEqualTo("Read ohms from net SUM to net OUT");
    model.pad().press(ValuePadModel.OVER_RANGE);
    model.addReading();

    var first = t.bench.diagnosisProperty().get().suspects().get(0);
    assertThat(first.fault()).isEqualTo("R2:open");
    assertThat(first.group()).containsExactly("R2:open");
    var file = t.store.cases().caseFile(t.bench.openCaseProperty().get().id()).orElseThrow();
    assertThat(file.readings())
        .filteredOn(r -> r.to().equals("OUT"))
        .singleElement()
        .satisfies(
            r -> {
              assertThat(r.at()).isEqualTo("SUM");
              assertThat(r.value()).isEqualTo(Double.POSITIVE_INFINITY);
            });
    // Its card: R2 alone across SUM–OUT, 47 kΩ ±1 % when healthy, OL read: outside.
    ReadingRow card = model.rows().get(0);
    assertThat(card.reading().kind()).isEqualTo(Reading.Kind.OHMS);
    assertThat(card.title()).isEqualTo("Ohms from net SUM to net OUT, power off");
    assertThat(card.healthyLow()).isCloseTo(47_000 * 0.99, within(1e-6));
    assertThat(card.healthyHigh()).isCloseTo(47_000 * 1.01, within(1e-6));
    assertThat(card.healthy()).isFalse();
    assertThat(card.predictions()).containsEntry("R2 open", Double.POSITIVE_INFINITY);
    // After the reading the pad is empty and the powered volts wait where they were left.
    assertThat(model.pad().textProperty().get()).isEmpty();
  }

  @Test
  void ohmsAcrossTheInputResistor_nearZero_pointsAtItsShort_kKeyReadsKiloOhms() {
    openFeedbackVolts();
    model.setPowerOff(true);
    model.choose("R1.1");
    model.choose("R1.2");
    assertThat(model.powerOff().fromProperty().get().title()).startsWith("R1 lead 1 (R1.1)");
    model.pad().textProperty().set("0.4");
    model.addReading();
    assertThat(t.bench.diagnosisProperty().get().suspects().get(0).fault()).isEqualTo("R1:short");
    // IN to OUT with the k key: R1 and R2 in series, 57 kΩ ±1 % when healthy.
    model.choose("IN");
    model.choose("OUT");
    for (String key : new String[] {"5", "7", "k", "1"}) {
      model.pad().press(key);
    }
    assertThat(model.pad().valueProperty().get()).isEqualTo(57_100.0);
    model.addReading();
    ReadingRow card = model.rows().get(0);
    assertThat(card.healthyLow()).isCloseTo(57_000 * 0.99, within(1e-6));
    assertThat(card.healthyHigh()).isCloseTo(57_000 * 1.01, within(1e-6));
    assertThat(card.healthy()).isTrue();
  }

  @Test
  void parallelPaths_healthyRangeIsTheSeriesParallelClosedForm() {
    // SUM to GND: R1 + R4 (IN to GND) in parallel with R2 + R3 (OUT to GND):
    // (10k + 100k) ∥ (47k + 10k) = 110k · 57k / 167k (any circuits textbook); every part at 1 %
    // scales the network by the same factor, so the range is ±1 % of it.
    Stage stage =
        TestStage.splitSupply(15)
            .input("IN", 1)
            .r("R1", 10e3, "IN", "SUM")
            .r("R2", 47e3, "SUM", "OUT")
            .r("R3", 10e3, "OUT", "GND")
            .r("R4", 100e3, "IN", "GND")
            .amp("U1A", "GND", "SUM", "OUT")
            .build();
    t.bench.stageProperty().set(stage);
    model.setPowerOff(true);
    model.choose("SUM");
    model.choose("GND");
    type("37k5");
    double closed = 110e3 * 57e3 / 167e3;
    ReadingRow card = model.rows().get(0);
    assertThat(card.healthyLow()).isCloseTo(closed * 0.99, within(1e-6));
    assertThat(card.healthyHigh()).isCloseTo(closed * 1.01, within(1e-6));
    assertThat(card.healthy()).isTrue();
  }

  @Test
  void switchingModes_keepsWhatWasTypedInEach() {
    model.pad().textProperty().set("14.9");
    model.setPowerOff(true);
    assertThat(model.pad().textProperty().get()).isEmpty();
    model.pad().textProperty().set("46k");
    model.setPowerOff(false);
    assertThat(model.pad().textProperty().get()).isEqualTo("14.9");
    assertThat(model.pad().quantityProperty().get()).isEqualTo(ValuePadModel.Quantity.VOLTS);
    model.setPowerOff(true);
    assertThat(model.pad().textProperty().get()).isEqualTo("46k");
    // The caution comes up each time the mode is entered.
    assertThat(model.powerOff().cautionsShownProperty().get()).isEqualTo(2);
  }

  @Test
  void addReading_withOnePoint_asksForTheSecond() {
    model.setPowerOff(true);
    model.powerOff().fillNext(false);
    model.choose("SUM");
    type("47k");
    assertThat(t.problems).containsExactly("Choose two points");
    assertThat(t.bench.readings()).isEmpty();
    assertThat(model.pad().textProperty().get()).isEqualTo("47k");
  }

  @Test
  void correct_anOhmsReading_putsItsPairAndValueBack() {
    model.setPowerOff(true);
    model.choose("SUM");
    model.choose("OUT");
    type("4k68");
    model.setPowerOff(false);
    model.correct(model.rows().get(0));
    assertThat(model.powerOff().activeProperty().get()).isTrue();
    assertThat(model.powerOff().fromProperty().get().at()).isEqualTo("SUM");
    assertThat(model.powerOff().toProperty().get().at()).isEqualTo("OUT");
    assertThat(model.pad().valueProperty().get()).isEqualTo(4680.0);
    assertThat(model.correctingTextProperty().get()).contains("SUM to OUT 4.68");
    type("46k8");
    assertThat(t.bench.readings()).containsExactly(Reading.ohms("SUM", "OUT", 46_800));
    assertThat(t.bench.struckReadings()).hasSize(1);
  }

  @Test
  void partLeads_areProbePoints_withTheirNamesInWords() {
    Stage stage =
        TestStage.splitSupply(15)
            .input("IN", 1)
            .r("R1", 10e3, "IN", "SUM")
            .r("R2", 47e3, "SUM", "OUT")
            .part(Part.diode("D1", DiodeClass.SILICON, "OUT", "RECT"))
            .r("R3", 10e3, "RECT", "GND")
            .amp("U1A", "GND", "SUM", "OUT")
            .build();
    t.bench.stageProperty().set(stage);
    assertThat(model.testPoints()).extracting(ProbePoint::at).contains("D1.a", "D1.k", "R2.1");
    model.choose("D1.a");
    assertThat(model.probeProperty().get().at()).isEqualTo("D1.a");
    assertThat(model.probeProperty().get().call()).isEqualTo("Probe D1 anode");
    assertThat(model.probeProperty().get().title())
        .isEqualTo("D1 anode (D1.a) — on net OUT, diode");
  }

  @Test
  void shortWhy_keepsWhatEachSuspectReads_andDropsTheRepeatedCaution() {
    String why =
        "The unit is mains-powered, and this check tells the leading suspects apart with the"
            + " power off, so it comes first. Power off: unplug the unit, discharge its capacitors"
            + " and wait, then read ohms from net SUM to net OUT (across R2): OL if R2 is open;"
            + " 47 kΩ if R1 is shorted";
    assertThat(PowerOffMode.shortWhy(why))
        .isEqualTo(
            "The unit is mains-powered and this check tells the leading suspects apart. Across R2:"
                + " OL if R2 is open; 47 kΩ if R1 is shorted.");
    assertThat(PowerOffMode.shortWhy("Chosen by you.")).isEqualTo("Chosen by you.");
  }
}
