package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.sqlite.SqliteHistory;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Regression: a rail named by its net with a sign, as the demo line driver's "+15V" and "-15V" (the
 * usual way schematics name split rails, common practice), gave the fault ids "-15V:missing" and
 * "+15V:low", which the history refused ("expected a fault id such as R2:open…"), so the app could
 * not store the first reading on such a stage while a missing rail led the suspects. The fault id
 * grammar (DESIGN.md) names a rail by its net.
 */
class RailFaultIdTest {
  @TempDir Path folder;

  @Test
  void railFaultIds_ofSignedNets_areKept_andMalformedIdsStillRefused() {
    assertThat(Checks.faultId("t", "f", "-15V:missing")).isEqualTo("-15V:missing");
    assertThat(Checks.faultId("t", "f", "+15V:low")).isEqualTo("+15V:low");
    assertThat(Checks.faultId("t", "f", "VCC:missing")).isEqualTo("VCC:missing");
    assertThat(Checks.faultId("t", "f", "U1.6-7:bridge")).isEqualTo("U1.6-7:bridge");
    for (String bad : List.of("R2 open", ":missing", "-15V", "-15V:Missing", "R2:open\n")) {
      assertThatThrownBy(() -> Checks.faultId("t", "f", bad))
          .as(bad)
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("fault id");
    }
    try (HistoryStore store = SqliteHistory.open(folder.resolve("h.db"))) {
      var model = store.units().boardModel("SM-8", "");
      var unit = store.units().add("SM8-77", model.id(), "");
      RepairCase c = store.cases().open(unit.id(), "no output");
      store.cases().close(c.id(), Outcome.FIXED, List.of("-15V:missing"));
      assertThat(store.cases().find(c.id()).orElseThrow().confirmedFaults())
          .containsExactly("-15V:missing");
    }
  }
}
