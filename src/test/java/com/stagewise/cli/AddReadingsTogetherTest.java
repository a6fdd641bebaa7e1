package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code history add-readings} stores with the case the diagnosis of all the case's standing
 * readings, not of the new file's alone: a case built up file by file (or partly in the app) then
 * carries the suspect list the app shows for it.
 *
 * <p>The case is the demo line driver (an inverting stage, U3A with R14 in and R15 across it) whose
 * output sits at the lower limit: −13.45 V at OUT on ±15 V rails, about 1.5 V inside the negative
 * rail, as a classic bipolar output clamps (DESIGN.md's device classes; textbook inverting
 * amplifier, common practice). That one reading says the stage is faulty; a healthy positive rail
 * alone says nothing against a working stage. Both together must still say faulty, and must give
 * exactly what {@code diagnose} gives for a readings file holding both.
 */
class AddReadingsTogetherTest {
  private static final Path STAGE =
      Path.of("data", "stages", "larkspur-sm8-line-driver.stage.json");

  @TempDir Path folder;

  private Path db;
  private String caseId;

  private record Run(int code, String out, String err) {}

  private static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  private Run history(String... args) {
    List<String> all = new ArrayList<>(List.of("history", args[0], "--db", db.toString()));
    all.addAll(List.of(args).subList(1, args.length));
    return run(all.toArray(String[]::new));
  }

  private static JsonNode json(Run run) throws Exception {
    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    return new ObjectMapper().readTree(run.out());
  }

  private Path readings(String name, String lines) throws Exception {
    Path file = folder.resolve(name + ".readings.json");
    Files.writeString(
        file,
        "{\"format\": \"stagewise-readings\", \"version\": 1, \"readings\": [" + lines + "]}");
    return file;
  }

  @BeforeEach
  void openCase() throws Exception {
    db = folder.resolve("bench.db");
    String[] model = {
      "add-model", "--name", "SM-8", "--maker", "Larkspur (invented)", "--stage", STAGE.toString()
    };
    assertThat(history(model).code()).isEqualTo(ExitCode.OK);
    assertThat(history("add-unit", "--serial", "SM8-31", "--model", "SM-8").code())
        .isEqualTo(ExitCode.OK);
    caseId =
        json(history("open-case", "--serial", "SM8-31", "--symptom", "no output", "--json"))
            .get("id")
            .textValue();
  }

  private JsonNode add(Path file) throws Exception {
    return json(history("add-readings", "--case", caseId, "--readings", file.toString(), "--json"))
        .get("suspectList");
  }

  private static JsonNode diagnose(Path file) throws Exception {
    return json(
        run("diagnose", "--stage", STAGE.toString(), "--readings", file.toString(), "--json"));
  }

  /**
   * The stored list and the diagnosis name the same faults, in order, with the same odds ({@code
   * diagnose --json} prints six decimals).
   */
  private static void assertSameSuspects(JsonNode stored, JsonNode diagnosis) {
    assertThat(stored.get("verdict").textValue()).isEqualTo(diagnosis.get("verdict").textValue());
    JsonNode kept = stored.get("suspects");
    JsonNode given = diagnosis.get("suspects");
    assertThat(kept.size()).isPositive().isLessThanOrEqualTo(given.size());
    for (int i = 0; i < kept.size(); i++) {
      assertThat(kept.get(i).get("fault").textValue())
          .as("suspect %d", i + 1)
          .isEqualTo(given.get(i).get("fault").textValue());
      assertThat(kept.get(i).get("probability").doubleValue())
          .as("suspect %d's probability", i + 1)
          .isCloseTo(given.get(i).get("probability").doubleValue(), within(5e-7));
    }
  }

  @Test
  void aSecondFile_isDiagnosedWithTheReadingsStoredBefore() throws Exception {
    Path out = readings("out", "{\"at\": \"OUT\", \"dc\": -13.45}");
    Path rail = readings("rail", "{\"at\": \"U3.8\", \"dc\": 14.98}");
    Path both =
        readings("both", "{\"at\": \"OUT\", \"dc\": -13.45}, {\"at\": \"U3.8\", \"dc\": 14.98}");
    // The premise: the rail alone looks like a working stage, the output alone does not.
    assertThat(diagnose(rail).get("verdict").textValue()).isEqualTo("healthy");
    assertThat(add(out).get("verdict").textValue()).isEqualTo("fault");

    JsonNode stored = add(rail);

    assertSameSuspects(stored, diagnose(both));
    Run text = history("show", "--case", caseId);
    assertThat(text.out()).as(text.err()).contains("fault");
  }

  @Test
  void aStruckReading_isLeftOutOfTheNextFilesDiagnosis() throws Exception {
    // The output was misread first (the mistyped −13.45 V) and struck out; then the rail is read.
    Path out = readings("out", "{\"at\": \"OUT\", \"dc\": -13.45}");
    Path rail = readings("rail", "{\"at\": \"U3.8\", \"dc\": 14.98}");
    add(out);
    Run struck = history("strike-reading", "--case", caseId, "--reading", "1");
    assertThat(struck.code()).as(struck.err()).isEqualTo(ExitCode.OK);

    JsonNode stored = add(rail);

    assertSameSuspects(stored, diagnose(rail));
    assertThat(stored.get("verdict").textValue()).isEqualTo("healthy");
  }

  @Test
  void theTextSaysHowManyEarlierReadingsJoinedTheDiagnosis() throws Exception {
    add(readings("out", "{\"at\": \"OUT\", \"dc\": -13.45}"));
    Path rail = readings("rail", "{\"at\": \"U3.8\", \"dc\": 14.98}");

    Run text = history("add-readings", "--case", caseId, "--readings", rail.toString());

    assertThat(text.code()).as(text.err()).isEqualTo(ExitCode.OK);
    assertThat(text.out())
        .contains("1 reading stored in case")
        .contains("Diagnosed together with the case's 1 earlier reading (struck ones left out).")
        .contains("Verdict: fault");
  }
}
