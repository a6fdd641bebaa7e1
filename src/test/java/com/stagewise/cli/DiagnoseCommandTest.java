package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class DiagnoseCommandTest {
  @TempDir Path dir;

  /** Every demo readings file with its stage sheet (named by the readings file's first part). */
  static Stream<Path[]> demoPairs() throws IOException {
    try (Stream<Path> files = Files.list(Path.of("data", "readings"))) {
      return files
          .filter(f -> f.toString().endsWith(".readings.json"))
          .sorted()
          .map(
              f ->
                  new Path[] {
                    Path.of(
                        "data",
                        "stages",
                        f.getFileName().toString().split("\\.")[0] + ".stage.json"),
                    f
                  })
          .toList()
          .stream();
    }
  }

  @ParameterizedTest
  @MethodSource("demoPairs")
  void diagnoseJson_everyDemoReading_givesTheContractDocument(Path stage, Path readings)
      throws Exception {
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose",
            "--stage",
            stage.toString(),
            "--readings",
            readings.toString(),
            "--json",
            "--top",
            "4");
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    JsonNode doc = new ObjectMapper().readTree(run.out());
    // The contract of DESIGN.md, "Diagnosis".
    assertThat(doc.get("format").asText()).isEqualTo("stagewise-diagnosis");
    assertThat(doc.get("version").asInt()).isEqualTo(1);
    assertThat(doc.get("verdict").asText()).isIn("healthy", "fault", "inconclusive");
    assertThat(doc.get("suspects").size()).isBetween(1, 4);
    double sum = 0;
    double previous = 2;
    for (JsonNode s : doc.get("suspects")) {
      assertThat(s.get("fault").asText()).isNotBlank();
      assertThat(s.get("consistent").isBoolean()).isTrue();
      assertThat(s.get("group").isArray()).isTrue();
      assertThat(s.get("why").asText()).isNotBlank();
      double p = s.get("probability").asDouble();
      assertThat(p).isLessThanOrEqualTo(previous);
      previous = p;
      sum += p;
    }
    assertThat(sum).isCloseTo(1.0, org.assertj.core.data.Offset.offset(1e-4));
    double bits = Double.MAX_VALUE;
    for (JsonNode p : doc.get("nextProbes")) {
      assertThat(p.get("kind").asText()).isIn("dc", "ac", "ohms");
      if (p.get("kind").asText().equals("ohms")) {
        // A power-off check names its second point and says to unplug and discharge first.
        assertThat(p.get("to").asText()).isNotBlank();
        assertThat(p.get("why").asText()).contains("unplug", "discharge");
      }
      assertThat(p.get("bits").asDouble()).isLessThanOrEqualTo(bits);
      bits = p.get("bits").asDouble();
    }
  }

  @Test
  void diagnose_readableTable_namesTheFirstSuspect() {
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose",
            "--stage",
            "data/stages/larkspur-sm8-line-driver.stage.json",
            "--readings",
            "data/readings/larkspur-sm8-line-driver.no-feedback.readings.json");
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    assertThat(run.out())
        .contains("Verdict: fault", "Suspects:", "Probe next:", "To confirm the first suspect:");
  }

  @Test
  void diagnose_pinTheStageDoesNotUse_isBadInputNamingTheFile() throws IOException {
    Path readings = dir.resolve("bad.readings.json");
    Files.writeString(
        readings,
        "{\"format\": \"stagewise-readings\", \"version\": 1, \"readings\": [{\"at\": \"U3.9\", \"dc\": 1.0}]}");
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose",
            "--stage",
            "data/stages/larkspur-sm8-line-driver.stage.json",
            "--readings",
            readings.toString());
    StagewiseCommandTest.assertBadInput(run, "bad.readings.json", "U3", "pin 9");
  }

  @Test
  void diagnose_valueFarBeyondTheRails_isBadInput() throws IOException {
    Path readings = dir.resolve("far.readings.json");
    Files.writeString(
        readings,
        "{\"format\": \"stagewise-readings\", \"version\": 1, \"readings\": [{\"at\": \"OUT\", \"dc\": 480}]}");
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose",
            "--stage",
            "data/stages/larkspur-sm8-line-driver.stage.json",
            "--readings",
            readings.toString());
    StagewiseCommandTest.assertBadInput(run, "far.readings.json", "480", "rail");
  }

  @Test
  void diagnose_topBelowOne_isBadInput() {
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose",
            "--stage",
            "data/stages/larkspur-sm8-line-driver.stage.json",
            "--readings",
            "data/readings/larkspur-sm8-line-driver.no-feedback.readings.json",
            "--top",
            "0");
    StagewiseCommandTest.assertBadInput(run, "--top");
  }

  @Test
  void batch_givesOneDiagnosisALine_sameAsTheSingleCommand_andAnErrorLineForBadInput()
      throws Exception {
    // DESIGN.md, "Command line": one {"stage", "readings"} a line, one diagnosis a line out, or
    // {"error": ...} for a bad line while the others still run; exit 2 if any line was bad.
    Path stage = Path.of("data", "stages", "larkspur-sm8-line-driver.stage.json").toAbsolutePath();
    Path readings =
        Path.of("data", "readings", "larkspur-sm8-line-driver.no-feedback.readings.json")
            .toAbsolutePath();
    String embedded = new ObjectMapper().readTree(readings.toFile()).toString();
    Path batch = dir.resolve("cases.jsonl");
    Files.writeString(
        batch,
        String.join(
                "\n",
                "{\"stage\": \"" + stage + "\", \"readings\": \"" + readings + "\"}",
                "{\"stage\": \"" + stage + "\", \"readings\": " + embedded + "}",
                "{\"stage\": \"missing.stage.json\", \"readings\": \"" + readings + "\"}",
                "not json at all",
                "",
                "{\"stage\": \"" + stage + "\", \"readings\": \"" + readings + "\", \"extra\": 1}")
            + "\n");
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run("diagnose", "--batch", batch.toString(), "--top", "4");
    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    String[] lines = run.out().split("\n");
    assertThat(lines).hasSize(5);
    StagewiseCommandTest.Run single =
        StagewiseCommandTest.run(
            "diagnose",
            "--stage",
            stage.toString(),
            "--readings",
            readings.toString(),
            "--json",
            "--top",
            "4");
    ObjectMapper mapper = new ObjectMapper();
    JsonNode expected = mapper.readTree(single.out());
    assertThat(mapper.readTree(lines[0])).isEqualTo(expected);
    assertThat(mapper.readTree(lines[1])).isEqualTo(expected);
    assertThat(mapper.readTree(lines[2]).get("error").asText()).contains("missing.stage.json");
    assertThat(mapper.readTree(lines[3]).get("error").asText()).contains("line 4");
    assertThat(mapper.readTree(lines[4]).get("error").asText()).contains("extra");
    assertThat(run.err()).doesNotContain("Exception");
  }

  @Test
  void batch_withStageToo_isRefused() throws Exception {
    Path batch = dir.resolve("cases.jsonl");
    Files.writeString(batch, "");
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose", "--batch", batch.toString(), "--stage", "x.stage.json");
    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.err()).contains("--batch");
  }
}
