package com.stagewise.casework;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestStage;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.sqlite.SqliteHistory;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The points of the check after a repair in their own kind, each against its healthy band, checked
 * against textbook closed forms: the inverting amplifier's AC gain −R2/R1 with the RMS of a sine
 * its peak over √2 (and peak-to-peak twice the peak), and the resistance between two nets of a
 * series–parallel resistor network with the power off.
 */
class AfterRepairKindsTest {
  /** Relative tolerance for closed forms computed the same way (rounding only). */
  private static final double EXACT = 1e-9;

  @TempDir Path folder;

  /**
   * The textbook inverting amplifier with a 100 mV peak test signal at 1 kHz into IN, a 4.7 kΩ
   * resistor from IN to ground and a 10 kΩ load from OUT to ground (both change nothing powered: IN
   * is driven, OUT is driven by the op-amp); every resistor 1 %.
   */
  private static Stage stage() {
    return TestStage.splitSupply(15)
        .input("IN", 0, 0.1, 1000)
        .r("R1", 10e3, "IN", "SUM")
        .r("R2", 47e3, "SUM", "OUT")
        .r("R3", 4.7e3, "IN", "GND")
        .r("RL", 10e3, "OUT", "GND")
        .amp("U1A", "GND", "SUM", "OUT")
        .build();
  }

  @Test
  void acPoint_hasTheInvertingAmplifiersBand_inTheMeasureItWasReadIn() {
    List<AfterRepair.CheckPoint> points =
        AfterRepair.points(
            stage(),
            List.of(
                Reading.ac("OUT", 0.33, 1000, AcMeasure.RMS),
                Reading.ac("OUT", 0.94, 1000, AcMeasure.PP)));
    AfterRepair.CheckPoint rms = points.get(0);
    AfterRepair.CheckPoint pp = points.get(1);
    // Textbook: |gain| = R2/R1 = 4.7, so 0.47 V peak at OUT; a sine's RMS is its peak / √2 and
    // its peak-to-peak twice its peak.
    double peak = 0.1 * 47e3 / 10e3;
    assertThat(rms.kind()).isEqualTo(Reading.Kind.AC);
    assertThat(rms.measure()).isEqualTo(AcMeasure.RMS);
    assertThat(rms.hz()).isEqualTo(1000);
    // The op-amp's finite open-loop gain (2e5) takes a few parts per 100 000 off the textbook gain.
    assertThat(rms.nominal()).isCloseTo(peak / Math.sqrt(2), within(peak * 1e-4));
    assertThat(pp.nominal()).isCloseTo(2 * peak, within(peak * 1e-4));
    // 1 % resistors: one at its tolerance end moves the gain by 1 %, both by at most about 2 %.
    assertThat(rms.low()).isBetween(0.975 * rms.nominal(), 0.991 * rms.nominal());
    assertThat(rms.high()).isBetween(1.009 * rms.nominal(), 1.025 * rms.nominal());
    assertThat(pp.low() / pp.nominal()).isCloseTo(rms.low() / rms.nominal(), within(EXACT));

    assertThat(rms.inside(0.333)).isTrue();
    // A peak typed where RMS was asked for is far outside the RMS band.
    assertThat(rms.inside(peak)).isFalse();
    // Within the reading's own AC uncertainty, ±(3 % of reading + 1 mV) (DESIGN.md, readings): a
    // value 2.8 % above the band's top still fits it; one 7 % above does not.
    assertThat(rms.inside(rms.high() * 1.028)).isTrue();
    assertThat(rms.inside(rms.high() * 1.07)).isFalse();
    assertThat(pp.inside(0.94)).isTrue();
    assertThat(pp.inside(0.47)).isFalse();
  }

  @Test
  void ohmsPoint_hasTheSeriesParallelResistance_andItsToleranceBand() {
    List<AfterRepair.CheckPoint> points =
        AfterRepair.points(
            stage(),
            List.of(
                Reading.ohms("SUM", "OUT", 16.2e3),
                Reading.ohms("OUT", "VCC", Double.POSITIVE_INFINITY)));
    AfterRepair.CheckPoint acrossR2 = points.get(0);
    // Power off (DESIGN.md): the inputs and rails float, the op-amp draws nothing, so SUM to OUT
    // is R2 in parallel with the series path R1 + R3 + RL (series-parallel closed form).
    double path = 10e3 + 4.7e3 + 10e3;
    double expected = 47e3 * path / (47e3 + path);
    assertThat(acrossR2.kind()).isEqualTo(Reading.Kind.OHMS);
    assertThat(acrossR2.to()).isEqualTo("OUT");
    assertThat(acrossR2.across()).isEqualTo("R2");
    assertThat(acrossR2.nominal()).isCloseTo(expected, within(expected * EXACT));
    // Every resistor at −1 % (or +1 %) scales every resistance of the network by 0.99 (1.01).
    assertThat(acrossR2.low()).isCloseTo(0.99 * expected, within(expected * EXACT));
    assertThat(acrossR2.high()).isCloseTo(1.01 * expected, within(expected * EXACT));
    assertThat(acrossR2.inside(16.2e3)).isTrue();
    // R2 open leaves only the series path: 24.7 kΩ, far outside.
    assertThat(acrossR2.inside(path)).isFalse();
    assertThat(acrossR2.inside(Double.POSITIVE_INFINITY)).isFalse();

    // Nothing connects OUT to a floating rail: a healthy stage reads OL there.
    AfterRepair.CheckPoint toRail = points.get(1);
    assertThat(toRail.hasBand()).isTrue();
    assertThat(toRail.high()).isEqualTo(Double.POSITIVE_INFINITY);
    assertThat(toRail.inside(Double.POSITIVE_INFINITY)).isTrue();
    assertThat(toRail.inside(16.2e3)).isFalse();
    assertThat(toRail.across()).isEmpty();
  }

  @Test
  void points_areEachDistinctPointOnce_inItsOwnKind_inTheOrderFirstRead() {
    List<AfterRepair.CheckPoint> points =
        AfterRepair.points(
            stage(),
            List.of(
                Reading.dc("OUT", 0.01),
                Reading.ac("OUT", 0.33, 1000, AcMeasure.RMS),
                Reading.ac("OUT", 0.34, 1000, AcMeasure.RMS),
                Reading.ohms("SUM", "OUT", 16.2e3),
                Reading.ohms("OUT", "SUM", 16.1e3),
                Reading.dc("OUT", 0.02),
                Reading.ac("OUT", 0.94, 1000, AcMeasure.PP),
                Reading.dc("SUM", 0.0)));
    assertThat(points)
        .extracting(
            p ->
                p.kind()
                    + " "
                    + p.at()
                    + (p.to().isEmpty() ? "" : "-" + p.to())
                    + (p.measure() == null ? "" : " " + p.measure().word()))
        .containsExactly("DC OUT", "AC OUT rms", "OHMS SUM-OUT", "AC OUT pp", "DC SUM");
    // DC: the inverting amplifier with no DC input rests at 0 V (textbook), within a band.
    assertThat(points.get(0).nominal()).isCloseTo(0, within(1e-3));
  }

  @Test
  void addAfterRepair_storesEachInItsKind_withItsBand_andTheSameVerdict() {
    List<AfterRepair.CheckPoint> points =
        AfterRepair.points(
            stage(),
            List.of(
                Reading.ac("OUT", 0.33, 1000, AcMeasure.RMS),
                Reading.ohms("SUM", "OUT", 16.2e3),
                Reading.ohms("OUT", "VCC", Double.POSITIVE_INFINITY)));
    List<AfterRepairReading> stored;
    try (HistoryStore store = SqliteHistory.open(folder.resolve("h.db"))) {
      Casework work = new Casework(store);
      var added = work.addUnit("TA-9", "Test amp board", "");
      String caseId = work.openCase(added.unit().id(), "no output").id();
      work.addAfterRepair(
          caseId,
          List.of(
              new AfterRepair.Taken(points.get(0), 0.333),
              new AfterRepair.Taken(points.get(1), Double.POSITIVE_INFINITY),
              new AfterRepair.Taken(points.get(2), Double.POSITIVE_INFINITY)),
          MeterSpec.DEFAULT);
      stored = store.cases().caseFile(caseId).orElseThrow().afterRepair();
      assertThat(store.cases().caseFile(caseId).orElseThrow().readings()).isEmpty();
    }
    assertThat(stored)
        .extracting(
            r ->
                r.kind()
                    + " "
                    + r.at()
                    + " "
                    + r.to()
                    + " "
                    + r.measure()
                    + " "
                    + r.hz()
                    + " "
                    + r.inside())
        .containsExactly(
            "AC OUT  rms 1000.0 true",
            "OHMS SUM OUT null null false",
            "OHMS OUT VCC null null true");
    assertThat(stored.get(0).healthyLow()).isEqualTo(points.get(0).low());
    assertThat(stored.get(1).value()).isEqualTo(Double.POSITIVE_INFINITY);
    assertThat(stored.get(1).healthyHigh()).isEqualTo(points.get(1).high());
    assertThat(stored.get(2).healthyLow()).isEqualTo(Double.POSITIVE_INFINITY);
    assertThat(stored.get(0).meterText()).startsWith("scope");
    assertThat(stored.get(1).meterText()).contains("ohms");
    assertThat(stored).allMatch(r -> r.kind() != ReadingKind.DC);
  }
}
