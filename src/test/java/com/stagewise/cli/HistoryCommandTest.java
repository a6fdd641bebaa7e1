package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.history.demo.DemoHistory;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HistoryCommandTest {
  @TempDir Path folder;

  /** What one run of the command line printed and returned. */
  record Run(int code, String out, String err) {}

  private Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  private Run history(Path db, String... args) {
    List<String> all = new ArrayList<>(List.of("history"));
    all.add(args[0]);
    all.add("--db");
    all.add(db.toString());
    all.addAll(List.of(args).subList(1, args.length));
    return run(all.toArray(String[]::new));
  }

  private static JsonNode json(Run run) throws Exception {
    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    return new ObjectMapper().readTree(run.out());
  }

  @Test
  void wholeCase_fromUnitToCloseOut() throws Exception {
    Path db = folder.resolve("bench.db");
    Path stage = folder.resolve("driver.stage.json");
    Files.writeString(stage, DemoStage.MIXER, StandardCharsets.UTF_8);
    assertThat(
            history(
                    db,
                    "add-model",
                    "--name",
                    "MX-8",
                    "--maker",
                    "Northfield (invented)",
                    "--stage",
                    stage.toString())
                .code())
        .isEqualTo(ExitCode.OK);
    assertThat(
            history(db, "add-unit", "--serial", "NF8-1", "--model", "mx-8", "--owner", "job 1")
                .out())
        .contains("NF8-1");
    JsonNode opened =
        json(
            history(
                db,
                "open-case",
                "--serial",
                "NF8-1",
                "--symptom",
                "Output stuck low; no signal",
                "--json"));
    String caseId = opened.get("id").textValue();
    assertThat(opened.get("status").textValue()).isEqualTo("open");

    // An inverting stage whose feedback resistor is open runs open-loop: with +1 V at IN the output
    // sits at its lower limit, about 1.5 V above the -15 V rail for a bipolar part (DESIGN.md), and
    // the inverting input follows IN through R1 (textbook op-amp behaviour, common practice).
    Path readings = folder.resolve("case.readings.json");
    Files.writeString(
        readings,
        """
        {"format": "stagewise-readings", "version": 1,
         "readings": [ {"at": "U1.8", "dc": 14.97}, {"at": "U1.4", "dc": -14.96},
                       {"at": "U1.1", "dc": -13.48}, {"at": "U1.2", "dc": 0.99} ]}
        """,
        StandardCharsets.UTF_8);
    JsonNode stored =
        json(
            history(
                db,
                "add-readings",
                "--case",
                caseId.substring(0, 8),
                "--readings",
                readings.toString(),
                "--json"));
    assertThat(stored.get("readings")).hasSize(4);
    JsonNode list = stored.get("suspectList");
    assertThat(list.get("programVersion").textValue()).isNotEmpty();
    List<String> faults = new ArrayList<>();
    double total = 0;
    for (JsonNode suspect : list.get("suspects")) {
      faults.add(suspect.get("fault").textValue());
      suspect.get("group").forEach(g -> faults.add(g.textValue()));
      total += suspect.get("probability").doubleValue();
    }
    assertThat(faults).contains("R2:open");
    assertThat(total).isBetween(0.99, 1.01);

    // The third reading struck out by its number, then restored; a number out of range is bad
    // input.
    Run struck = history(db, "strike-reading", "--case", caseId, "--reading", "3");
    assertThat(struck.code()).as(struck.err()).isEqualTo(ExitCode.OK);
    assertThat(struck.out()).contains("U1.1").contains("struck out");
    assertThat(history(db, "show", "--case", caseId).out()).contains("struck out");
    Run nine = history(db, "strike-reading", "--case", caseId, "--reading", "9");
    assertThat(nine.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(nine.err()).contains("reading").contains("1 to 4").doesNotContain("Exception");
    JsonNode restored =
        json(
            history(
                db, "strike-reading", "--case", caseId, "--reading", "3", "--restore", "--json"));
    assertThat(restored.get("readings").get(0).has("struckAt")).isFalse();
    assertThat(restored.get("readings").get(0).get("updatedAt")).isNotNull();

    assertThat(
            history(
                    db,
                    "add-action",
                    "--case",
                    caseId,
                    "--kind",
                    "part-replaced",
                    "--part",
                    "R2",
                    "--old",
                    "47k",
                    "--new",
                    "47k")
                .code())
        .isEqualTo(ExitCode.OK);
    assertThat(
            history(
                    db,
                    "add-note",
                    "--case",
                    caseId,
                    "--text",
                    "Cracked resistor; quote \"A\"; done")
                .code())
        .isEqualTo(ExitCode.OK);
    assertThat(
            history(db, "close-case", "--case", caseId, "--outcome", "fixed", "--fault", "R2:open")
                .out())
        .contains("closed: fixed");

    Run show = history(db, "show", "--serial", "nf8-1");
    assertThat(show.out())
        .contains(
            "Unit NF8-1",
            "Found: R2:open",
            "part-replaced R2",
            "Cracked resistor; quote \"A\"; done",
            "U1.1",
            "-13.48 V");
    JsonNode shown = json(history(db, "show", "--case", caseId, "--json"));
    assertThat(shown.get("suspectLists")).hasSize(1);
    assertThat(shown.get("notes").get(0).get("text").textValue())
        .isEqualTo("Cracked resistor; quote \"A\"; done");

    assertThat(json(history(db, "search", "--part", "R2", "--json")).get("hits")).hasSize(1);
    assertThat(history(db, "search", "--text", "cracked").out()).contains("[Cracked]");
    assertThat(history(db, "faults", "--model", "MX-8").out())
        .contains("R2:open", "seen once on this model");
  }

  @Test
  void exportImportBackupRestore_betweenTwoBenches() throws Exception {
    Path left = folder.resolve("left.db");
    Path right = folder.resolve("right.db");
    assertThat(history(left, "demo").out()).contains("invented");
    Path bundle = folder.resolve("bundle.json");
    assertThat(history(left, "export", "--out", bundle.toString()).out())
        .contains("Exported 6 cases");
    JsonNode report = json(history(right, "import", bundle.toString(), "--json"));
    assertThat(report.get("added").intValue()).isGreaterThan(0);
    assertThat(report.get("conflicts")).isEmpty();
    assertThat(history(right, "import", bundle.toString()).out())
        .contains("0 added", "0 conflicts");
    Path one = folder.resolve("one.json");
    assertThat(history(left, "export", "--serial", "NF8-21037", "--out", one.toString()).out())
        .contains("2 cases of 1 unit");

    Path backup = folder.resolve("backup.db");
    assertThat(history(right, "backup", "--out", backup.toString()).code()).isEqualTo(ExitCode.OK);
    history(right, "add-unit", "--serial", "LATE-1", "--model", DemoHistory.MIXER);
    assertThat(history(right, "restore", "--from", backup.toString()).out())
        .contains("previous history was saved");
    assertThat(history(right, "units").out()).doesNotContain("LATE-1").contains("NF8-21037");
  }

  @Test
  void badInput_exitsTwoWithOneMessage() throws Exception {
    Path db = folder.resolve("bad.db");
    history(db, "demo");
    Run noCase = history(db, "add-note", "--case", "ffffffff", "--text", "x");
    assertThat(noCase.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(noCase.err())
        .contains("no case has the id")
        .doesNotContain("Exception")
        .doesNotContain("\tat ");
    Run badOutcome = history(db, "close-case", "--case", "ffffffff", "--outcome", "maybe");
    assertThat(badOutcome.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(badOutcome.err()).contains("--outcome");
    Run badDate = history(db, "search", "--from", "last week");
    assertThat(badDate.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(badDate.err()).contains("--from").contains("2026-03-01");
    Path broken = folder.resolve("broken.json");
    Files.writeString(
        broken, "{\"format\": \"stagewise-history\", \"version\": 9}", StandardCharsets.UTF_8);
    Run newer = history(db, "import", broken.toString());
    assertThat(newer.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(newer.err()).contains(broken.toString()).contains("version");
    assertThat(history(db, "demo").code()).isEqualTo(ExitCode.BAD_INPUT);
  }

  @Test
  void fileThatIsNoDatabase_exitsTwoAsBadInputWithAClearMessageAndStaysAsItWas() throws Exception {
    Path file = folder.resolve("letter.txt");
    Files.writeString(
        file, "Dear customer, your mixer is ready.\n".repeat(30), StandardCharsets.UTF_8);
    byte[] before = Files.readAllBytes(file);
    Run run = history(file, "units");
    // A file that is no history is bad input (issue 9): exit 2, not an internal error.
    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.err())
        .startsWith("stagewise: The file ")
        .contains("is not a Stagewise history database")
        .doesNotContain("Exception");
    assertThat(Files.readAllBytes(file)).isEqualTo(before);
  }

  /** The demo's mixer stage, read back from the demo data's stored sheet. */
  static final class DemoStage {
    static final String MIXER = DemoHistory.bundle().stageSheets().get(0).sheetJson();
  }
}
