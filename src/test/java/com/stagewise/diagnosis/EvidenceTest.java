package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The likelihood of one reading: a normal density (the textbook formula, {@code exp(−d²/2σ²) /
 * √(2πσ²)}) mixed with a uniform misread tail, here worked out in the test from the formula with
 * {@link StrictMath}; far outside the prediction (where e^x is 0 in double precision, IEEE 754)
 * only the tail is left, which the diagnosis returns without working out the exponential.
 */
class EvidenceTest {
  /** Rails of ±15 V: the tail is uniform over ±(1.2·15 + 1) V. */
  private static final double SPAN = 15;

  private static final double TAIL = 1 / (2 * (1.2 * SPAN + 1));

  /** Relative tolerance: the formula in a different order of operations. */
  private static final double RELATIVE = 1e-14;

  @ParameterizedTest(name = "{0} standard deviations out")
  @CsvSource({"0", "1", "3", "10", "30", "38.5", "38.6", "38.7", "40", "100", "1e4"})
  void logLikelihood_isTheNormalDensityWithTheMisreadTail(double sds) {
    Evidence evidence = new Evidence(SPAN);
    double variance = 2.5e-7;
    double mean = 1.234;
    double value = mean + sds * Math.sqrt(variance);
    double d = value - mean;
    double normal =
        StrictMath.exp(-d * d / (2 * variance)) / StrictMath.sqrt(2 * StrictMath.PI * variance);
    double expected = StrictMath.log(0.99 * normal + 0.01 * TAIL);
    assertThat(evidence.logLikelihood(value, mean, variance))
        .isCloseTo(expected, within(RELATIVE * Math.abs(expected)));
  }

  @ParameterizedTest(name = "{0} V off")
  @CsvSource({"0.1", "1", "-5", "30"})
  void logLikelihood_farOutside_isTheTailAlone(double off) {
    // ln(0.01 / (2·(1.2·15 + 1))) = ln(0.01 / 38): the misread tail of a ±15 V stage.
    assertThat(new Evidence(SPAN).logLikelihood(2 + off, 2, 1e-6))
        .isCloseTo(Math.log(0.01 / 38), within(1e-14));
  }
}
