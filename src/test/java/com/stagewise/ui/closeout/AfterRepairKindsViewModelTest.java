package com.stagewise.ui.closeout;

import static com.stagewise.ui.closeout.AfterRepairCase.type;
import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Reading;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.ui.TestBench;
import com.stagewise.ui.widget.ValuePadModel;
import java.nio.file.Path;
import java.util.List;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The check after the repair with AC and ohms points, on the textbook inverting amplifier (R1 = 10
 * kΩ, R2 = 47 kΩ, 1 %; 1 V DC and 100 mV peak at 1 kHz in): the output read in AC RMS during the
 * diagnosis is read again in AC RMS against 0.1 V × R2/R1 / √2 = 0.332 V (textbook gain, and a
 * sine's RMS is its peak over √2), and the ohms from SUM to OUT with the power off against R2
 * alone, 47 kΩ ± 1 % (R1's other end, the input, floats with the power off: DESIGN.md's power-off
 * model), 46.5 kΩ to 47.5 kΩ.
 */
class AfterRepairKindsViewModelTest {
  private static final String NBSP = "\u00a0";

  @TempDir Path temp;
  private TestBench t;
  private String caseId;

  @BeforeEach
  void setUp() {
    // The readings of the fault: the output in DC, in AC RMS (a meter), and ohms across R2.
    AfterRepairCase opened =
        AfterRepairCase.open(
            temp,
            "TA-10",
            "No output",
            List.of(
                Reading.dc("OUT", -13.48),
                Reading.ac("OUT", 0.0, 1000, AcMeasure.RMS),
                Reading.ohms("SUM", "OUT", Double.POSITIVE_INFINITY)));
    t = opened.t;
    caseId = opened.caseId;
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  @Test
  void start_listsTheAcAndOhmsPoints_withTheirMeasureAndBandInWords() {
    AfterRepairViewModel check = new AfterRepairViewModel(t.bench);
    check.start();

    assertThat(check.rows())
        .extracting(r -> r.point().kind() + " " + r.point().at())
        .containsExactly("DC OUT", "AC OUT", "OHMS SUM");
    CheckRow ac = check.rows().get(1);
    double rms = 0.1 * 4.7 / Math.sqrt(2);
    assertThat(ac.point().nominal()).isCloseTo(rms, Offset.offset(rms * 1e-3));
    assertThat(ac.point().low()).isLessThan(rms);
    assertThat(ac.point().high()).isGreaterThan(rms);
    assertThat(ac.label()).startsWith("OUT (AC volts RMS at 1" + NBSP + "kHz): ").contains(" to ");
    CheckRow ohms = check.rows().get(2);
    assertThat(ohms.label()).isEqualTo("R2 (power off): 46.5" + NBSP + "kΩ to 47.5" + NBSP + "kΩ");
  }

  @Test
  void thePad_takesEachPointInItsUnit_andTheCautionStandsWhileOhmsAreRead() {
    AfterRepairViewModel check = new AfterRepairViewModel(t.bench);
    check.start();
    assertThat(check.padLineProperty().get()).isEqualTo("DC volts");
    assertThat(check.pad().quantityProperty().get()).isEqualTo(ValuePadModel.Quantity.VOLTS);
    assertThat(check.powerOffProperty().get()).isFalse();
    type(check, "-4.70");

    assertThat(check.padLineProperty().get()).isEqualTo("AC volts RMS at 1" + NBSP + "kHz");
    assertThat(check.pad().quantityProperty().get()).isEqualTo(ValuePadModel.Quantity.VOLTS);
    assertThat(check.powerOffProperty().get()).isFalse();
    type(check, "0.333");

    assertThat(check.padLineProperty().get()).isEqualTo("Ohms (power off)");
    assertThat(check.pad().quantityProperty().get()).isEqualTo(ValuePadModel.Quantity.METER_OHMS);
    assertThat(check.powerOffProperty().get()).isTrue();
    // Common practice before an ohms check: unplug, discharge, wait.
    assertThat(AfterRepairViewModel.POWER_OFF_CAUTION).contains("unplug", "discharge", "wait");
    type(check, "46k9");

    assertThat(check.rows()).allMatch(r -> r.value() != null && !r.outside());
    assertThat(check.rows().get(1).verdict())
        .isEqualTo("333.0" + NBSP + "mV RMS: inside the healthy band");
    assertThat(check.rows().get(2).verdict()).contains("kΩ: inside the healthy band");
    assertThat(check.summaryProperty().get())
        .startsWith("3 of 3 readings are inside the healthy band.");
    // Every point read: the pad leaves ohms, and the caution goes with it.
    assertThat(check.powerOffProperty().get()).isFalse();
  }

  @Test
  void peakTypedForRms_andOl_areOutside_storedInTheirKinds_andClosingAsFixedAsksNamingThem() {
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);
    closeOut.checkAfterRepair();
    AfterRepairViewModel check = closeOut.afterRepair();
    type(check, "-4.70");
    // 0.47 V is the output's peak; the meter reads RMS, so a healthy stage shows 0.332 V.
    type(check, "0.47");
    check.pad().press(ValuePadModel.OVER_RANGE);
    check.enter();

    assertThat(check.rows().get(1).verdict())
        .startsWith("470.0" + NBSP + "mV RMS: OUTSIDE the healthy band, ")
        .endsWith("above its top end");
    assertThat(check.rows().get(2).verdict())
        .isEqualTo("OL: OUTSIDE the healthy band, above its top end");
    assertThat(check.summaryProperty().get())
        .startsWith("1 of 3 readings are inside the healthy band.")
        .contains(
            "OUT (AC volts RMS at 1" + NBSP + "kHz): reads 470.0" + NBSP + "mV RMS, expected ")
        .contains("R2 (power off): reads OL, expected 46.5" + NBSP + "kΩ to 47.5" + NBSP + "kΩ");
    check.store(closeOut::endCheck);

    List<AfterRepairReading> stored = t.store.cases().caseFile(caseId).orElseThrow().afterRepair();
    assertThat(stored)
        .extracting(r -> r.kind().word() + " " + r.at() + " " + r.inside())
        .containsExactly("dc OUT true", "ac OUT false", "ohms SUM false");
    assertThat(stored.get(1).measure()).isEqualTo("rms");
    assertThat(stored.get(1).hz()).isEqualTo(1000.0);
    assertThat(stored.get(2).to()).isEqualTo("OUT");
    assertThat(stored.get(2).value()).isEqualTo(Double.POSITIVE_INFINITY);
    assertThat(t.store.cases().caseFile(caseId).orElseThrow().readings()).isEmpty();

    closeOut.toggleFault("R2:open", true);
    closeOut.outcomeProperty().set(Outcome.FIXED);
    closeOut.closeCase();
    assertThat(closeOut.questionProperty().get())
        .contains("OUT (AC volts RMS at 1" + NBSP + "kHz): reads 470.0" + NBSP + "mV RMS")
        .contains("R2 (power off): reads OL, expected 46.5" + NBSP + "kΩ to 47.5" + NBSP + "kΩ")
        .contains("Close the case as fixed anyway?");
    assertThat(t.store.cases().find(caseId).orElseThrow().status()).isEqualTo(CaseStatus.OPEN);
    closeOut.closeAnyway();
    assertThat(t.store.cases().find(caseId).orElseThrow().status()).isEqualTo(CaseStatus.CLOSED);
  }

  @Test
  void aNegativeAcAmplitude_isRefusedPlainly_andWhatWasTypedStays() {
    AfterRepairViewModel check = new AfterRepairViewModel(t.bench);
    check.start();
    assertThat(check.pad().unsignedProperty().get()).as("DC volts take a sign").isEmpty();
    type(check, "-4.70");
    // An AC amplitude is a magnitude: the pad's sign key is off for the AC point.
    assertThat(check.pad().unsignedProperty().get()).isEqualTo(ValuePadModel.AC_AMPLITUDE);
    type(check, "-0.33");
    assertThat(t.problems).containsExactly("An AC amplitude has no sign");
    assertThat(check.pad().problemProperty().get()).contains("type it without the minus sign");
    assertThat(check.pad().textProperty().get()).isEqualTo("-0.33");
    assertThat(check.currentProperty().get()).isEqualTo(1);
    assertThat(check.rows().get(1).value()).isNull();
  }
}
