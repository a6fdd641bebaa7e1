package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.LinkedHashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Blending the published priors with the shop's counts (additive smoothing). */
class PriorsTest {
  private static final double TOLERANCE = 1e-12;

  @Test
  void blend_uniformPriorsWithStrengthEqualToFaultCount_isLaplaceAddOne() {
    // Laplace (add-one) smoothing, (n_f + 1) / (N + B) for B outcomes: Manning, Raghavan and
    // Schütze, "Introduction to Information Retrieval" (2008), eq. 13.7. Uniform published priors
    // with strength B are exactly that estimator.
    Map<String, Double> priors = new LinkedHashMap<>();
    priors.put("R1:open", 1.0);
    priors.put("R2:open", 1.0);
    priors.put("U1A:dead", 1.0);
    priors.put("VCC:missing", 1.0);
    Map<String, Integer> counts = Map.of("R2:open", 3, "U1A:dead", 1);
    Map<String, Double> blended = Priors.blend(priors, counts, 4);
    assertThat(blended.get("R1:open")).isCloseTo((0 + 1) / (4.0 + 4), within(TOLERANCE));
    assertThat(blended.get("R2:open")).isCloseTo((3 + 1) / (4.0 + 4), within(TOLERANCE));
    assertThat(blended.get("U1A:dead")).isCloseTo((1 + 1) / (4.0 + 4), within(TOLERANCE));
    assertThat(blended.get("VCC:missing")).isCloseTo((0 + 1) / (4.0 + 4), within(TOLERANCE));
  }

  @Test
  void blend_oneCase_doesNotDominateThePublishedPriors() {
    Map<String, Double> priors = Map.of("R1:open", 0.6, "R2:open", 0.3, "C1:short", 0.1);
    Map<String, Double> blended = Priors.blend(priors, Map.of("C1:short", 1));
    // With the shop strength of 20: (20 * 0.1 + 1) / 21 = 0.1429, still well below R1:open.
    assertThat(blended.get("C1:short")).isCloseTo(3.0 / 21, within(TOLERANCE));
    assertThat(blended.get("R1:open")).isGreaterThan(blended.get("C1:short"));
    assertThat(sum(blended)).isCloseTo(1.0, within(TOLERANCE));
  }

  @Test
  void blend_manyCases_dominate() {
    Map<String, Double> priors = Map.of("R1:open", 0.6, "R2:open", 0.3, "C1:short", 0.1);
    Map<String, Double> blended = Priors.blend(priors, Map.of("C1:short", 90));
    // (20 * 0.1 + 90) / 110: the shop's own history now outweighs the published figures.
    assertThat(blended.get("C1:short")).isCloseTo((2 + 90) / 110.0, within(TOLERANCE));
    assertThat(blended.get("C1:short")).isGreaterThan(blended.get("R1:open"));
  }

  @Test
  void blend_noCounts_returnsTheNormalisedPriors() {
    Map<String, Double> blended = Priors.blend(Map.of("a:open", 2.0, "b:open", 6.0), Map.of());
    assertThat(blended).containsEntry("a:open", 0.25).containsEntry("b:open", 0.75);
  }

  @Test
  void blend_countsForUnknownFaults_areIgnored() {
    Map<String, Double> blended =
        Priors.blend(Map.of("a:open", 1.0, "b:open", 1.0), Map.of("z:open", 50), 2);
    assertThat(blended).containsOnlyKeys("a:open", "b:open");
    assertThat(blended.get("a:open")).isCloseTo(0.5, within(TOLERANCE));
  }

  @Test
  void blend_allZeroPriors_areTakenAsUniform() {
    Map<String, Double> blended =
        Priors.blend(Map.of("a:open", 0.0, "b:open", 0.0), Map.of("a:open", 2), 2);
    assertThat(blended.get("a:open")).isCloseTo((2 * 0.5 + 2) / 4.0, within(TOLERANCE));
  }

  @Test
  void blend_badArguments_areRefused() {
    assertThatThrownBy(() -> Priors.blend(Map.of(), Map.of(), 1))
        .isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> Priors.blend(Map.of("a:open", -1.0), Map.of(), 1))
        .isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> Priors.blend(Map.of("a:open", 1.0), Map.of("a:open", -1), 1))
        .isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> Priors.blend(Map.of("a:open", 1.0), Map.of(), 0))
        .isInstanceOf(IllegalArgumentException.class);
  }

  private static double sum(Map<String, Double> values) {
    return values.values().stream().mapToDouble(Double::doubleValue).sum();
  }
}
