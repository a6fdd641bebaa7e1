package com.stagewise.ui.history;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.CaseFile;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The history screen's lines of the readings after the repair name each reading's kind: DC as
 * before, AC with its measure and frequency, ohms between its two points with the power off.
 * Values: the textbook inverting amplifier (−4.7 V out; 0.332 V RMS for 0.1 V peak in, a sine's
 * peak over √2; R2 = 47 kΩ ± 1 % between SUM and OUT with the power off).
 */
class AfterRepairLinesTest {
  private static final String NBSP = "\u00a0";
  private static final Instant AT = Instant.parse("2026-05-06T09:10:11Z");

  @Test
  void lines_sayEachReadingsKind_measure_andBand() {
    RepairCase c =
        new RepairCase("c1", "u1", AT, "no output", CaseStatus.OPEN, null, null, List.of(), AT);
    List<AfterRepairReading> readings =
        List.of(
            new AfterRepairReading("a1", "c1", "U1.1", -4.71, "m", AT, -4.8, -4.6),
            new AfterRepairReading(
                "a2", "c1", "U1.1", 0.47, "s", AT, 0.329, 0.336, ReadingKind.AC, "rms", 1000.0, ""),
            new AfterRepairReading(
                "a3",
                "c1",
                "SUM",
                46_900,
                "m",
                AT,
                46_530.0,
                47_470.0,
                ReadingKind.OHMS,
                null,
                null,
                "OUT"));
    List<String> lines =
        HistoryViewModel.afterRepairLines(
            new CaseFile(c, List.of(), List.of(), List.of(), List.of(), List.of(), readings));
    assertThat(lines.get(0)).startsWith("U1 pin 1:  ").contains("inside the healthy band");
    assertThat(lines.get(1))
        .startsWith("U1 pin 1 (AC volts RMS at 1" + NBSP + "kHz):  470.0" + NBSP + "mV")
        .contains("OUTSIDE the healthy band 329" + NBSP + "mV to 336" + NBSP + "mV");
    assertThat(lines.get(2))
        .startsWith("SUM to OUT (power off):  46.9" + NBSP + "kΩ")
        .contains("inside the healthy band 46.5" + NBSP + "kΩ to 47.5" + NBSP + "kΩ");
  }
}
