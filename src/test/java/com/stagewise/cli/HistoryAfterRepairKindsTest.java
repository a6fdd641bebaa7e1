package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.casework.AfterRepair;
import com.stagewise.casework.Casework;
import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code history show} (text and {@code --json}), {@code export} and {@code import} with readings
 * after the repair in AC and ohms: each with its kind, its measure and frequency or its second
 * point, and its healthy band; a bundle with a bad one is refused (exit 2, the field named) and
 * nothing is imported. Values: the textbook inverting amplifier (0.47 V peak out for 0.1 V peak in
 * at gain −47k/10k, 0.332 V RMS as a sine's peak over √2; R2 = 47 kΩ ± 1 % with the power off).
 */
class HistoryAfterRepairKindsTest {
  @TempDir Path folder;

  private record Run(int code, String out, String err) {}

  private static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  private String caseWithCheck(Path db) {
    try (HistoryStore store = SqliteHistory.open(db)) {
      Casework work = new Casework(store);
      var added = work.addUnit("TA-11", "Test amp board", "");
      String caseId = work.openCase(added.unit().id(), "no output").id();
      AfterRepair.CheckPoint rms =
          new AfterRepair.CheckPoint(
              "U1.1", Reading.Kind.AC, "", AcMeasure.RMS, 1000, 0.3323, 0.329, 0.336, "");
      AfterRepair.CheckPoint r2 =
          new AfterRepair.CheckPoint(
              "SUM", Reading.Kind.OHMS, "OUT", null, 0, 47e3, 46_530, 47_470, "R2");
      work.addAfterRepair(
          caseId,
          List.of(
              new AfterRepair.Taken(rms, 0.333),
              new AfterRepair.Taken(r2, 46_900),
              new AfterRepair.Taken(r2, Double.POSITIVE_INFINITY)),
          MeterSpec.DEFAULT);
      return caseId;
    }
  }

  @Test
  void show_listsAcAndOhmsReadingsAfterRepair_withTheirKinds_inTextAndJson() throws Exception {
    Path db = folder.resolve("h.db");
    String caseId = caseWithCheck(db);
    Run text = run("history", "show", "--db", db.toString(), "--case", caseId);
    assertThat(text.code()).as(text.err()).isEqualTo(ExitCode.OK);
    assertThat(text.out())
        .containsPattern("U1\\.1 +ac 0\\.333 V rms at 1000 Hz  inside healthy 0\\.329 to 0\\.336 V")
        .containsPattern("SUM +to OUT +ohms 46900 Ω  inside healthy 46530 to 47470 Ω")
        .containsPattern("SUM +to OUT +ohms OL  OUTSIDE healthy 46530 to 47470 Ω");

    Run json = run("history", "show", "--db", db.toString(), "--case", caseId, "--json");
    assertThat(json.code()).as(json.err()).isEqualTo(ExitCode.OK);
    // With --case, the case itself is the document.
    JsonNode list = new ObjectMapper().readTree(json.out()).path("afterRepair");
    assertThat(list.size()).isEqualTo(3);
    assertThat(list.get(0).path("kind").asText()).isEqualTo("ac");
    assertThat(list.get(0).path("measure").asText()).isEqualTo("rms");
    assertThat(list.get(0).path("hz").asDouble()).isEqualTo(1000.0);
    assertThat(list.get(1).path("kind").asText()).isEqualTo("ohms");
    assertThat(list.get(1).path("to").asText()).isEqualTo("OUT");
    assertThat(list.get(2).path("value").asText()).isEqualTo("OL");
  }

  @Test
  void aBundleWithABadReadingAfterRepair_isRefused_exit2_andNothingIsImported() throws Exception {
    Path db = folder.resolve("h.db");
    caseWithCheck(db);
    Path bundle = folder.resolve("shop.json");
    assertThat(run("history", "export", "--db", db.toString(), "--out", bundle.toString()).code())
        .isEqualTo(ExitCode.OK);
    String text = Files.readString(bundle, StandardCharsets.UTF_8);
    assertThat(text).contains("\"version\" : 6", "\"measure\" : \"rms\"");
    Path broken = folder.resolve("broken.json");
    Files.writeString(broken, text.replace("\"measure\" : \"rms\"", "\"measure\" : \"mean\""));
    Path other = folder.resolve("other.db");
    Run refused = run("history", "import", "--db", other.toString(), broken.toString());
    assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(refused.err())
        .contains("broken.json", "afterRepair[0].measure", "rms, peak or pp")
        .doesNotContain("Exception");
    Run fine = run("history", "import", "--db", other.toString(), bundle.toString());
    assertThat(fine.code()).as(fine.err()).isEqualTo(ExitCode.OK);
    try (HistoryStore store = SqliteHistory.open(other)) {
      assertThat(store.cases().search(com.stagewise.history.SearchQuery.all())).hasSize(1);
    }
  }
}
