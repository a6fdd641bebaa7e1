package com.stagewise.ui.closeout;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.casework.AfterRepair;
import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Reading;
import com.stagewise.ui.TestBench;
import java.util.List;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.Test;

/**
 * A point read outside its band after the repair is said in one sentence of the same shape for
 * every kind: "POINT: reads VALUE, expected LOW to HIGH", the point's kind in brackets after it.
 *
 * <p>The stage is the textbook inverting amplifier (gain −R2/R1 = −4.7, 0.1 V peak in at 1 kHz, so
 * 0.47 V peak out, 0.94 V peak to peak, 0.47/√2 = 0.332 V RMS for a sine), and R2 = 47 kΩ ± 1 %
 * alone between SUM and OUT with the power off (the input floats: DESIGN.md's power-off model).
 */
class CheckRowWordsTest {
  private static final String NBSP = "\u00a0";

  private static List<CheckRow> rows(List<Reading> read, double value) {
    return AfterRepair.points(TestBench.invertingStage("Test amp board"), read).stream()
        .map(p -> new CheckRow(p, CheckRow.title(p), value, false))
        .toList();
  }

  @Test
  void dcPoint_readsAndExpected() {
    CheckRow row = rows(List.of(Reading.dc("OUT", -13.48)), -13.48).get(0);
    // −4.7 V nominal, within about ±2 % for 1 % parts.
    assertThat(row.point().nominal()).isCloseTo(-4.7, Offset.offset(0.01));
    assertThat(row.outsideSentence())
        .isEqualTo("OUT: reads −13.48" + NBSP + "V, expected " + row.bandWords())
        .contains("−4.7");
  }

  @Test
  void acPointInEachMeasure_namesTheMeasureInBrackets() {
    // 20.0 mV: a 6000-count meter on its 600 mV range shows tenths of a millivolt (DESIGN.md's
    // default meter).
    List<CheckRow> rows =
        rows(
            List.of(
                Reading.ac("OUT", 0.02, 1000, AcMeasure.RMS),
                Reading.ac("OUT", 0.02, 1000, AcMeasure.PEAK),
                Reading.ac("OUT", 0.02, 1000, AcMeasure.PP)),
            0.02);
    assertThat(rows).hasSize(3);
    double[] nominal = {0.47 / Math.sqrt(2), 0.47, 0.94};
    for (int i = 0; i < 3; i++) {
      CheckRow row = rows.get(i);
      assertThat(row.point().nominal()).isCloseTo(nominal[i], Offset.offset(nominal[i] * 1e-3));
      assertThat(row.outside()).isTrue();
      assertThat(row.outsideSentence())
          .isEqualTo(
              "OUT (AC volts "
                  + row.point().measure().words()
                  + " at 1"
                  + NBSP
                  + "kHz): reads 20.0"
                  + NBSP
                  + "mV "
                  + row.point().measure().words()
                  + ", expected "
                  + row.bandWords());
    }
  }

  @Test
  void ohmsPointReadingOl_namesTheResistorWithThePowerOff() {
    CheckRow row =
        rows(
                List.of(Reading.ohms("SUM", "OUT", Double.POSITIVE_INFINITY)),
                Double.POSITIVE_INFINITY)
            .get(0);
    assertThat(row.outsideSentence())
        .isEqualTo("R2 (power off): reads OL, expected 46.5" + NBSP + "kΩ to 47.5" + NBSP + "kΩ");
  }
}
