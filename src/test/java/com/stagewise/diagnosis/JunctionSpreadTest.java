package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Templates;
import org.junit.jupiter.api.Test;

/**
 * Regression tests for the healthy spread of nodes held by a conducting junction, which one Newton
 * step with the old factors held to about N·Vt (0.05 V) whatever the change.
 */
class JunctionSpreadTest {
  /**
   * A uniform distribution over ±t has the standard deviation t/√3 (any statistics text); the
   * prediction's spread adds the other parts' shares to it, so it is at least this.
   */
  private static double uniformSd(double halfWidth) {
    return halfWidth / Math.sqrt(3);
  }

  @Test
  void zenerReference_healthySpread_coversTheZenersTolerance() {
    // Zener-referenced buffer: REF sits at the zener's voltage, 5V1 ± 5 % (the template's zener).
    Stage stage = Templates.named("zener-reference").build();
    TestPoints points = new TestPoints(stage);
    Prediction healthy = HealthyCallMeasure.healthyPrediction(stage, points);
    double sd = healthy.dcSd()[points.index.get("REF")];
    assertThat(sd).isGreaterThan(0.9 * uniformSd(0.05 * 5.1));
    assertThat(sd).isLessThan(2 * uniformSd(0.05 * 5.1));
  }

  @Test
  void inputClamp_healthySpread_followsTheRailTheClampDiodeHoldsItTo() {
    // Input clamp: the input is driven past VCC, so PIN sits a diode drop above VCC and follows
    // VCC's ±5 % tolerance (common practice for a clamp to the rail).
    Stage stage = Templates.named("input-clamp").build();
    TestPoints points = new TestPoints(stage);
    Prediction healthy = HealthyCallMeasure.healthyPrediction(stage, points);
    double sd = healthy.dcSd()[points.index.get("PIN")];
    assertThat(sd).isGreaterThan(0.9 * uniformSd(0.05 * 15));
  }
}
