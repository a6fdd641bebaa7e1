package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.casework.AfterRepair;
import com.stagewise.casework.Casework;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code history show} lists the readings taken again after the repair apart from the readings of
 * the fault, each against its healthy band. Values: the textbook inverting amplifier's output
 * (−R2/R1 × 1 V = −4.7 V, about ±2 % for two 1 % resistors) read healthy, and a −15 V rail of 5 %
 * tolerance read at −11.2 V.
 */
class HistoryShowAfterRepairTest {
  @TempDir Path folder;

  @Test
  void show_listsTheReadingsAfterRepair_withTheirBandsAndVerdicts() {
    Path db = folder.resolve("h.db");
    String caseId;
    try (HistoryStore store = SqliteHistory.open(db)) {
      Casework work = new Casework(store);
      var added = work.addUnit("TA-9", "Test amp board", "");
      caseId = work.openCase(added.unit().id(), "output pinned low").id();
      work.addAfterRepair(
          caseId,
          List.of(
              new AfterRepair.Taken(new AfterRepair.CheckPoint("OUT", -4.7, -4.80, -4.60), -4.71),
              new AfterRepair.Taken(
                  new AfterRepair.CheckPoint("U1.4", -15, -15.75, -14.25), -11.2)),
          MeterSpec.DEFAULT);
    }
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code =
        StagewiseCommand.execute(
            new String[] {"history", "show", "--db", db.toString(), "--case", caseId},
            new PrintWriter(out),
            new PrintWriter(err));
    assertThat(code).as(err.toString()).isEqualTo(ExitCode.OK);
    String text = out.toString();
    assertThat(text).contains("After repair:");
    assertThat(text).containsPattern("OUT +dc -4\\.71 V  inside healthy -4\\.8 to -4\\.6 V");
    assertThat(text)
        .containsPattern("U1\\.4 +dc -11\\.2 V  OUTSIDE healthy -15\\.75 to -14\\.25 V");
    assertThat(text).doesNotContain("Readings:");
  }
}
