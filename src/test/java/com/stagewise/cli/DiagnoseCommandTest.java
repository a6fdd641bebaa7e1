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
}
