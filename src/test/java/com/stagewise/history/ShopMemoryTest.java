package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import com.stagewise.history.sqlite.SqliteHistory;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ShopMemoryTest {
  private static final double TOLERANCE = 1e-12;

  @Test
  void hint_saysHowOften() {
    assertThat(ShopMemory.hint("R2:open", Map.of("R2:open", 3)))
        .contains("seen 3 times on this model");
    assertThat(ShopMemory.hint("R2:open", Map.of("R2:open", 1)))
        .contains("seen once on this model");
    assertThat(ShopMemory.hint("R1:open", Map.of("R2:open", 3))).isEmpty();
  }

  @Test
  void faultCounts_countsOnlyClosedFixedCasesOfTheModel(@TempDir Path folder) {
    try (HistoryStore store = SqliteHistory.open(folder.resolve("m.db"))) {
      BoardModel mixer = store.units().boardModel("MX-8", "");
      BoardModel psu = store.units().boardModel("PSU-30", "");
      Unit a = store.units().add("1", mixer.id(), "");
      Unit b = store.units().add("2", mixer.id(), "");
      Unit c = store.units().add("3", psu.id(), "");
      close(store, a, Outcome.FIXED, "U1A:dead");
      close(store, b, Outcome.FIXED, "U1A:dead", "R7:open");
      close(store, b, Outcome.NOT_FIXED, "C3:short");
      close(store, c, Outcome.FIXED, "R7:open");
      store.cases().open(a.id(), "still open");
      ShopMemory memory = new ShopMemory(store);
      assertThat(memory.faultCounts("mx-8")).isEqualTo(Map.of("U1A:dead", 2, "R7:open", 1));
      assertThat(memory.faultCounts(psu.id())).isEqualTo(Map.of("R7:open", 1));
      assertThat(memory.faultCounts("no such model")).isEmpty();
    }
  }

  private static void close(HistoryStore store, Unit unit, Outcome outcome, String... faults) {
    RepairCase c = store.cases().open(unit.id(), "symptom");
    store.cases().close(c.id(), outcome, List.of(faults));
  }

  private static double sum(Map<String, Double> values) {
    return values.values().stream().mapToDouble(Double::doubleValue).sum();
  }
}
