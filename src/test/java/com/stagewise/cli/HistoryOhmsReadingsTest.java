package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Power-off (ohms) readings through the history: {@code history add-readings} keeps them, {@code
 * show} lists them, and a bundle carries them from one bench to another unchanged.
 *
 * <p>The case is the demo line driver with its feedback resistor R15 open: the op-amp runs open
 * loop and its output sits at the lower limit while the inverting input follows IN (textbook
 * inverting amplifier, common practice); with the power off, an open R15 leaves nothing between SUM
 * and OUT but the op-amp's pins, which draw nothing (DESIGN.md power-off model), so the ohmmeter
 * shows OL there.
 */
class HistoryOhmsReadingsTest {
  private static final Path STAGE =
      Path.of("data", "stages", "larkspur-sm8-line-driver.stage.json");
  private static final Path OHMS_READINGS =
      Path.of("data", "readings", "larkspur-sm8-line-driver.no-feedback-ohms.readings.json");

  @TempDir Path folder;

  private record Run(int code, String out, String err) {}

  private static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  private static Run history(Path db, String... args) {
    List<String> all = new ArrayList<>(List.of("history", args[0], "--db", db.toString()));
    all.addAll(List.of(args).subList(1, args.length));
    return run(all.toArray(String[]::new));
  }

  private static JsonNode json(Run run) throws Exception {
    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    return new ObjectMapper().readTree(run.out());
  }

  private String openCase(Path db) throws Exception {
    assertThat(
            history(
                    db,
                    "add-model",
                    "--name",
                    "SM-8",
                    "--maker",
                    "Larkspur (invented)",
                    "--stage",
                    STAGE.toString())
                .code())
        .isEqualTo(ExitCode.OK);
    assertThat(history(db, "add-unit", "--serial", "SM8-77", "--model", "SM-8").code())
        .isEqualTo(ExitCode.OK);
    return json(history(db, "open-case", "--serial", "SM8-77", "--symptom", "no output", "--json"))
        .get("id")
        .textValue();
  }

  @Test
  void addReadings_keepsAnOhmsReadingAndItDecidesTheSuspect() throws Exception {
    Path db = folder.resolve("bench.db");
    String caseId = openCase(db);

    JsonNode stored =
        json(
            history(
                db,
                "add-readings",
                "--case",
                caseId,
                "--readings",
                OHMS_READINGS.toString(),
                "--json"));

    JsonNode ohms = null;
    for (JsonNode r : stored.get("readings")) {
      if (r.get("kind").textValue().equals("ohms")) {
        ohms = r;
      }
    }
    assertThat(ohms).as("the ohms reading among %s", stored.get("readings")).isNotNull();
    assertThat(ohms.get("at").textValue()).isEqualTo("SUM");
    assertThat(ohms.get("to").textValue()).isEqualTo("OUT");
    assertThat(ohms.get("value").textValue()).isEqualTo("OL");
    assertThat(ohms.get("meter").textValue()).contains("ohms ±(0.8 % + 3 counts)");
    JsonNode first = stored.get("suspectList").get("suspects").get(0);
    assertThat(first.get("fault").textValue()).isEqualTo("R15:open");
    assertThat(first.get("group")).hasSize(1);

    Run shown = history(db, "show", "--case", caseId);
    assertThat(shown.code()).as(shown.err()).isEqualTo(ExitCode.OK);
    assertThat(shown.out()).containsPattern("SUM +to OUT +ohms OL");
  }

  @Test
  void bundle_carriesOhmsReadingsFromBenchToBench() throws Exception {
    Path left = folder.resolve("left.db");
    String caseId = openCase(left);
    Path readings = folder.resolve("mixed.readings.json");
    // 10 kΩ across the input resistor R14 (in tolerance), and the feedback open.
    Files.writeString(
        readings,
        """
        {"format": "stagewise-readings", "version": 2,
         "readings": [ {"at": "U3.1", "dc": -13.46},
                       {"at": "R14.1", "to": "R14.2", "ohms": 9987.5},
                       {"at": "SUM", "to": "OUT", "ohms": "OL"} ]}
        """,
        StandardCharsets.UTF_8);
    assertThat(
            history(left, "add-readings", "--case", caseId, "--readings", readings.toString())
                .code())
        .isEqualTo(ExitCode.OK);
    JsonNode before = json(history(left, "show", "--case", caseId, "--json")).get("readings");

    Path bundle = folder.resolve("bundle.json");
    assertThat(history(left, "export", "--out", bundle.toString()).code()).isEqualTo(ExitCode.OK);
    String text = Files.readString(bundle, StandardCharsets.UTF_8);
    assertThat(text).contains("\"to\"", "\"OL\"", "\"ohms\"");

    Path right = folder.resolve("right.db");
    json(history(right, "import", bundle.toString(), "--json"));
    JsonNode after = json(history(right, "show", "--case", caseId, "--json")).get("readings");
    assertThat(after).isEqualTo(before);
    assertThat(after.toString()).contains("R14.2", "9987.5", "OL");
    // Importing it again changes nothing and reports no conflict: the records are equal.
    JsonNode again = json(history(right, "import", bundle.toString(), "--json"));
    assertThat(again.get("added").intValue()).isZero();
    assertThat(again.get("conflicts")).isEmpty();
  }

  @Test
  void bundle_withANegativeOhmsReading_isRefusedNamingTheField() throws Exception {
    Path left = folder.resolve("left.db");
    String caseId = openCase(left);
    assertThat(
            history(left, "add-readings", "--case", caseId, "--readings", OHMS_READINGS.toString())
                .code())
        .isEqualTo(ExitCode.OK);
    Path bundle = folder.resolve("bundle.json");
    assertThat(history(left, "export", "--out", bundle.toString()).code()).isEqualTo(ExitCode.OK);
    String text = Files.readString(bundle, StandardCharsets.UTF_8);
    Path broken = folder.resolve("broken.json");
    Files.writeString(
        broken,
        text.replaceAll("\"value\"\\s*:\\s*\"OL\"", "\"value\": -5"),
        StandardCharsets.UTF_8);
    assertThat(Files.readString(broken)).contains("\"value\": -5");
    Run refused = history(folder.resolve("right.db"), "import", broken.toString());
    assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(refused.err()).contains("broken.json", "value").doesNotContain("Exception");
  }
}
