package com.stagewise.circuit;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The three ways an AC amplitude is stated, checked against a sampled sine: the RMS by its
 * definition (the square root of the mean of the squares over whole periods) and the peak-to-peak
 * as the highest sample less the lowest. Textbook facts: RMS of a sine is peak/√2 ≈ 0.7071 × peak;
 * peak-to-peak is twice the peak.
 */
class AcMeasureTest {
  private static final int SAMPLES = 100_000;
  private static final double TOLERANCE = 1e-9;

  @ParameterizedTest
  @CsvSource({"1.0", "0.47", "0.0012", "13.5"})
  void fromPeak_matchesASampledSine(double peak) {
    double squares = 0;
    double high = Double.NEGATIVE_INFINITY;
    double low = Double.POSITIVE_INFINITY;
    for (int i = 0; i < SAMPLES; i++) {
      // Three whole periods, sampled evenly, with a phase offset so no sample sits on a crest.
      double v = peak * Math.sin(2 * Math.PI * 3 * (i + 0.37) / SAMPLES);
      squares += v * v;
      high = Math.max(high, v);
      low = Math.min(low, v);
    }
    double rms = Math.sqrt(squares / SAMPLES);
    assertThat(AcMeasure.RMS.fromPeak(peak))
        .isCloseTo(rms, org.assertj.core.data.Offset.offset(TOLERANCE * peak + 1e-12));
    // The sampled crest falls short of the true peak by at most (1 − cos(π·3/SAMPLES)) of it.
    assertThat(AcMeasure.PP.fromPeak(peak))
        .isCloseTo(high - low, org.assertj.core.data.Offset.offset(1e-7 * peak));
    assertThat(AcMeasure.PEAK.fromPeak(peak)).isEqualTo(peak);
    // A figure to remember (common practice): 1 V peak reads 0.7071 V on a true-RMS meter.
    assertThat(AcMeasure.RMS.fromPeak(1.0))
        .isCloseTo(0.70710678, org.assertj.core.data.Offset.offset(1e-8));
  }

  @ParameterizedTest
  @EnumSource(AcMeasure.class)
  void toPeak_undoesFromPeak(AcMeasure measure) {
    for (double peak : new double[] {0, 1e-6, 0.1, 0.47, 1, 14.2}) {
      assertThat(measure.toPeak(measure.fromPeak(peak)))
          .isCloseTo(peak, org.assertj.core.data.Offset.offset(1e-15 + 1e-15 * peak));
    }
  }

  @Test
  void peak_isExact_soVersionOneFiguresStayBitForBit() {
    double v = 0.1 + 0.2;
    assertThat(AcMeasure.PEAK.toPeak(v)).isEqualTo(v);
    assertThat(AcMeasure.PEAK.fromPeak(v)).isEqualTo(v);
  }

  @Test
  void of_readsTheFileWords() {
    assertThat(AcMeasure.of("rms")).contains(AcMeasure.RMS);
    assertThat(AcMeasure.of("peak")).contains(AcMeasure.PEAK);
    assertThat(AcMeasure.of("pp")).contains(AcMeasure.PP);
    assertThat(AcMeasure.of("RMS")).contains(AcMeasure.RMS);
    assertThat(AcMeasure.of("average")).isEmpty();
    assertThat(AcMeasure.of("")).isEmpty();
  }

  @Test
  void testInput_peakAc_andTheSameSignalInAnotherMeasure() {
    TestInput rms = new TestInput("IN", 0, 0.5, 1000, AcMeasure.RMS);
    assertThat(rms.peakAc())
        .isCloseTo(0.5 * Math.sqrt(2), org.assertj.core.data.Offset.offset(1e-15));
    TestInput pp = rms.withMeasure(AcMeasure.PP);
    assertThat(pp.ac())
        .isCloseTo(2 * 0.5 * Math.sqrt(2), org.assertj.core.data.Offset.offset(1e-15));
    assertThat(pp.peakAc()).isCloseTo(rms.peakAc(), org.assertj.core.data.Offset.offset(1e-15));
    assertThat(new TestInput("IN", 0, 0.5, 1000).measure()).isEqualTo(AcMeasure.PEAK);
  }

  @Test
  void reading_measureOnlyWithAc() {
    Reading ac = Reading.ac("OUT", 0.33, 1000, AcMeasure.RMS);
    assertThat(ac.measure()).contains(AcMeasure.RMS);
    org.assertj.core.api.Assertions.assertThatThrownBy(
            () ->
                new Reading(
                    "OUT",
                    Reading.Kind.DC,
                    1,
                    0,
                    java.util.OptionalDouble.empty(),
                    "",
                    java.util.Optional.of(AcMeasure.RMS)))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("only with \"ac\"");
  }
}
