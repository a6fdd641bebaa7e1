package com.stagewise.cli.history;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.casework.DamagedHistory;
import com.stagewise.casework.HistoryDigest;
import com.stagewise.cli.ExitCode;
import com.stagewise.cli.StagewiseCommand;
import com.stagewise.history.demo.DemoHistory;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import picocli.CommandLine;

/** The history subcommands: their help, and that a refused one leaves the database unchanged. */
class HistorySubcommandsTest {
  @TempDir Path folder;

  record Run(int code, String out, String err) {}

  static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  static Run history(Path db, String sub, String... args) {
    List<String> all = new ArrayList<>(List.of("history", sub, "--db", db.toString()));
    all.addAll(List.of(args));
    return run(all.toArray(String[]::new));
  }

  static Stream<String> subcommands() {
    return HistoryCommand.commandLine(null).getSubcommands().keySet().stream();
  }

  @ParameterizedTest
  @MethodSource("subcommands")
  void help_ofEverySubcommand_printsItsUsageWithTheSharedOptions(String sub) {
    Run help = run("history", sub, "--help");

    assertThat(help.code()).as(help.err()).isEqualTo(ExitCode.OK);
    assertThat(help.err()).isEmpty();
    assertThat(help.out()).contains("Usage: stagewise history " + sub, "--help");
    // The server's own commands (schema and rights, connection check) work on the server only.
    if (sub.startsWith("server-")) {
      assertThat(help.out()).contains("--server");
    } else {
      assertThat(help.out()).contains("--db", "--json");
    }
    CommandLine.Model.CommandSpec spec =
        HistoryCommand.commandLine(null).getSubcommands().get(sub).getCommandSpec();
    for (CommandLine.Model.OptionSpec option : spec.options()) {
      assertThat(help.out()).contains(option.longestName());
    }
  }

  @Test
  void subcommands_areTheTwentyTwoOfTheHistory() {
    assertThat(subcommands().toList())
        .containsExactlyInAnyOrder(
            "models",
            "add-model",
            "units",
            "add-unit",
            "open-case",
            "close-case",
            "add-readings",
            "strike-reading",
            "add-note",
            "add-action",
            "attach-photo",
            "show",
            "search",
            "faults",
            "export",
            "import",
            "backup",
            "restore",
            "demo",
            "server-init",
            "server-check",
            "sync");
  }

  /** Issue 9, point 2: each refusal the probe found, now with the database left as it was. */
  @Nested
  class RefusedCommandsLeaveNothing {
    private Path demo() {
      Path db = folder.resolve("bench.db");
      assertThat(history(db, "demo").code()).isEqualTo(ExitCode.OK);
      return db;
    }

    private String openCase(Path db) {
      Run opened =
          history(db, "open-case", "--serial", "NF8-21037", "--symptom", "crackles", "--json");
      assertThat(opened.code()).as(opened.err()).isEqualTo(ExitCode.OK);
      return opened.out().replaceAll("(?s).*\"id\"\\s*:\\s*\"([0-9a-f-]+)\".*", "$1");
    }

    @Test
    void strikeReading_unknownReading_exitsTwoAndChangesNothing() {
      Path db = demo();
      String caseId = openCase(db);
      Map<String, String> before = HistoryDigest.of(db);

      Run refused = history(db, "strike-reading", "--case", caseId, "--reading", "ffff0000");

      assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
      assertThat(refused.err())
          .contains("reading")
          .contains("ffff0000")
          .doesNotContain("Exception");
      assertThat(HistoryDigest.of(db)).isEqualTo(before);
    }

    @Test
    void attachPhoto_fileThatIsNoPicture_exitsTwoAndChangesNothing() throws Exception {
      Path db = demo();
      String caseId = openCase(db);
      Path notAPicture = folder.resolve("board.jpg");
      Files.writeString(notAPicture, "GIF89a is not what this holds", StandardCharsets.UTF_8);
      Map<String, String> before = HistoryDigest.of(db);

      Run refused = history(db, "attach-photo", "--case", caseId, notAPicture.toString());

      assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
      assertThat(refused.err()).contains("board.jpg", "PNG or JPEG").doesNotContain("Exception");
      assertThat(HistoryDigest.of(db)).isEqualTo(before);
    }

    @Test
    void addUnit_blankSerial_exitsTwoAndAddsNoBoardModel() {
      Path db = demo();
      Map<String, String> before = HistoryDigest.of(db);

      Run refused = history(db, "add-unit", "--serial", "   ", "--model", "X");

      assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
      assertThat(refused.err()).contains("serial").doesNotContain("Exception");
      assertThat(HistoryDigest.of(db)).isEqualTo(before);
    }

    @Test
    void closeCase_noteOf60000Characters_exitsTwoAndLeavesTheCaseOpen() {
      Path db = demo();
      String caseId = openCase(db);
      Map<String, String> before = HistoryDigest.of(db);

      Run refused =
          history(
              db,
              "close-case",
              "--case",
              caseId,
              "--outcome",
              "fixed",
              "--fault",
              "R2:open",
              "--note",
              "n".repeat(60_000));

      assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
      assertThat(refused.err()).contains("note", "too long");
      assertThat(HistoryDigest.of(db)).isEqualTo(before);
      assertThat(history(db, "show", "--case", caseId).out()).contains(", open");
    }

    @Test
    void addModel_oneBadSheetOfTwo_exitsTwoAndKeepsNeitherModelNorFirstSheet() throws Exception {
      Path db = demo();
      Path good = folder.resolve("good.stage.json");
      Files.writeString(good, DemoHistory.bundle().stageSheets().get(0).sheetJson());
      Path bad = folder.resolve("bad.stage.json");
      Files.writeString(bad, "{\"format\": \"stagewise-stage\"}", StandardCharsets.UTF_8);
      Map<String, String> before = HistoryDigest.of(db);

      Run refused =
          history(
              db,
              "add-model",
              "--name",
              "New board",
              "--stage",
              good.toString(),
              "--stage",
              bad.toString());

      assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
      assertThat(refused.err()).contains("bad.stage.json");
      assertThat(HistoryDigest.of(db)).isEqualTo(before);
    }

    @Test
    void addReadings_readingAtAPointNotOnTheStage_exitsTwoAndStoresNothing() throws Exception {
      Path db = demo();
      String caseId = openCase(db);
      Path readings = folder.resolve("r.readings.json");
      Files.writeString(
          readings,
          """
          {"format": "stagewise-readings", "version": 1,
           "readings": [ {"at": "U1.8", "dc": 14.97}, {"at": "NOWHERE", "dc": 1.0} ]}
          """,
          StandardCharsets.UTF_8);
      Map<String, String> before = HistoryDigest.of(db);

      Run refused =
          history(db, "add-readings", "--case", caseId, "--readings", readings.toString());

      assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
      assertThat(refused.err()).contains("NOWHERE");
      assertThat(HistoryDigest.of(db)).isEqualTo(before);
    }

    @Test
    void addReadings_modelWithoutAStoredSheet_exitsTwoNamingTheWayOut() throws Exception {
      Path db = folder.resolve("bare.db");
      history(db, "add-unit", "--serial", "B-1", "--model", "Bare board");
      Run opened = history(db, "open-case", "--serial", "B-1", "--symptom", "dead", "--json");
      String caseId = opened.out().replaceAll("(?s).*\"id\"\\s*:\\s*\"([0-9a-f-]+)\".*", "$1");
      Path readings = folder.resolve("r.readings.json");
      Files.writeString(
          readings,
          "{\"format\": \"stagewise-readings\", \"version\": 1, \"readings\": []}",
          StandardCharsets.UTF_8);
      Map<String, String> before = HistoryDigest.of(db);

      Run refused =
          history(db, "add-readings", "--case", caseId, "--readings", readings.toString());

      assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
      assertThat(refused.err()).contains("has no stored stage sheet", "--stage FILE");
      assertThat(HistoryDigest.of(db)).isEqualTo(before);
    }

    @Test
    void addUnit_onADamagedFile_reportsTheDamageAndAddsNoBoardModel() throws Exception {
      Path db = demo();
      DamagedHistory.damageTheUnitTable(db);
      Map<String, String> before = HistoryDigest.of(db, List.of("unit"));

      Run refused = history(db, "add-unit", "--serial", "NEW-1", "--model", "Brand-new board");

      assertThat(refused.code()).isNotEqualTo(ExitCode.OK);
      assertThat(refused.err()).contains("damaged", "left as it is").doesNotContain("\tat ");
      assertThat(HistoryDigest.of(db, List.of("unit"))).isEqualTo(before);
    }
  }
}
