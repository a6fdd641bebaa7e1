package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ShopMemoryTest {
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
    Map<String, Double> blended = ShopMemory.blend(priors, counts, 4);
    assertThat(blended.get("R1:open")).isCloseTo((0 + 1) / (4.0 + 4), within(TOLERANCE));
    assertThat(blended.get("R2:open")).isCloseTo((3 + 1) / (4.0 + 4), within(TOLERANCE));
    assertThat(blended.get("U1A:dead")).isCloseTo((1 + 1) / (4.0 + 4), within(TOLERANCE));
    assertThat(blended.get("VCC:missing")).isCloseTo((0 + 1) / (4.0 + 4), within(TOLERANCE));
  }

  @Test
  void blend_oneCase_doesNotDominateThePublishedPriors() {
    Map<String, Double> priors = Map.of("R1:open", 0.6, "R2:open", 0.3, "C1:short", 0.1);
    Map<String, Double> blended = ShopMemory.blend(priors, Map.of("C1:short", 1));
    // With the default strength of 10: (10 * 0.1 + 1) / 11 = 0.1818…, still well below R1:open.
    assertThat(blended.get("C1:short")).isCloseTo(2.0 / 11, within(TOLERANCE));
    assertThat(blended.get("R1:open")).isGreaterThan(blended.get("C1:short"));
    assertThat(sum(blended)).isCloseTo(1.0, within(TOLERANCE));
  }

  @Test
  void blend_manyCases_dominate() {
    Map<String, Double> priors = Map.of("R1:open", 0.6, "R2:open", 0.3, "C1:short", 0.1);
    Map<String, Double> blended = ShopMemory.blend(priors, Map.of("C1:short", 90));
    assertThat(blended.get("C1:short")).isCloseTo((1 + 90) / 100.0, within(TOLERANCE));
  }

  @Test
  void blend_noCounts_returnsTheNormalisedPriors() {
    Map<String, Double> blended = ShopMemory.blend(Map.of("a:open", 2.0, "b:open", 6.0), Map.of());
    assertThat(blended).containsEntry("a:open", 0.25).containsEntry("b:open", 0.75);
  }

  @Test
  void blend_countsForUnknownFaults_areIgnored() {
    Map<String, Double> blended =
        ShopMemory.blend(Map.of("a:open", 1.0, "b:open", 1.0), Map.of("z:open", 50), 2);
    assertThat(blended).containsOnlyKeys("a:open", "b:open");
    assertThat(blended.get("a:open")).isCloseTo(0.5, within(TOLERANCE));
  }

  @Test
  void blend_allZeroPriors_areTakenAsUniform() {
    Map<String, Double> blended = ShopMemory.blend(Map.of("a:open", 0.0, "b:open", 0.0), Map.of("a:open", 2), 2);
    assertThat(blended.get("a:open")).isCloseTo((2 * 0.5 + 2) / 4.0, within(TOLERANCE));
  }

  @Test
  void blend_badArguments_areRefused() {
    assertThatThrownBy(() -> ShopMemory.blend(Map.of(), Map.of(), 1))
        .isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> ShopMemory.blend(Map.of("a:open", -1.0), Map.of(), 1))
        .isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> ShopMemory.blend(Map.of("a:open", 1.0), Map.of("a:open", -1), 1))
        .isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> ShopMemory.blend(Map.of("a:open", 1.0), Map.of(), 0))
        .isInstanceOf(IllegalArgumentException.class);
  }

  @Test
  void hint_saysHowOften() {
    assertThat(ShopMemory.hint("R2:open", Map.of("R2:open", 3))).contains("seen 3 times on this model");
    assertThat(ShopMemory.hint("R2:open", Map.of("R2:open", 1))).contains("seen once on this model");
    assertThat(ShopMemory.hint("R1:open", Map.of("R2:open", 3))).isEmpty();
  }

  @Test
  void faultCounts_countsOnlyClosedFixedCasesOfTheModel(@TempDir Path folder) {
    try (HistoryStore store = HistoryStore.open(folder.resolve("m.db"))) {
      BoardModel mixer = store.boardModel("MX-8", "");
      BoardModel psu = store.boardModel("PSU-30", "");
      Unit a = store.addUnit("1", mixer.id(), "");
      Unit b = store.addUnit("2", mixer.id(), "");
      Unit c = store.addUnit("3", psu.id(), "");
      close(store, a, Outcome.FIXED, "U1A:dead");
      close(store, b, Outcome.FIXED, "U1A:dead", "R7:open");
      close(store, b, Outcome.NOT_FIXED, "C3:short");
      close(store, c, Outcome.FIXED, "R7:open");
      store.openCase(a.id(), "still open");
      ShopMemory memory = new ShopMemory(store);
      assertThat(memory.faultCounts("mx-8")).isEqualTo(Map.of("U1A:dead", 2, "R7:open", 1));
      assertThat(memory.faultCounts(psu.id())).isEqualTo(Map.of("R7:open", 1));
      assertThat(memory.faultCounts("no such model")).isEmpty();
    }
  }

  private static void close(HistoryStore store, Unit unit, Outcome outcome, String... faults) {
    RepairCase c = store.openCase(unit.id(), "symptom");
    store.closeCase(c.id(), outcome, List.of(faults));
  }

  private static double sum(Map<String, Double> values) {
    return values.values().stream().mapToDouble(Double::doubleValue).sum();
  }
}
