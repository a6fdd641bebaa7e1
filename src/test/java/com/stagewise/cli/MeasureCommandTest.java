package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * {@code solve} and {@code diagnose} with AC figures stated as RMS, peak or peak-to-peak (the
 * {@code measure} of DESIGN.md's stage sheet and readings contracts).
 *
 * <p>The recorded documents under {@code interchange/measure} were written by this program as it
 * was before measures existed (the version that landed the interchange split), from the demo line
 * driver and version-1 readings files; a version-1 file must give exactly that answer again, with
 * only the new {@code measure} keys added.
 */
class MeasureCommandTest {
  private static final Path STAGE =
      Path.of("data", "stages", "larkspur-sm8-line-driver.stage.json");
  private static final Path RECORDED =
      Path.of("src", "test", "resources", "interchange", "measure");
  private static final ObjectMapper JSON = new ObjectMapper();

  @TempDir Path dir;

  @ParameterizedTest
  @ValueSource(strings = {"healthy-ac", "low-gain-ac"})
  void versionOneReadings_giveTheDiagnosisRecordedBeforeMeasures(String name) throws Exception {
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose",
            "--stage",
            STAGE.toString(),
            "--readings",
            RECORDED.resolve("line-driver." + name + ".readings.json").toString(),
            "--json");
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    JsonNode now = JSON.readTree(run.out());
    int acProbes = 0;
    for (JsonNode probe : now.get("nextProbes")) {
      if (probe.get("kind").asText().equals("ac")) {
        // The one addition: an AC probe says its measure, peak as the stage's input is stated.
        assertThat(probe.get("measure").asText()).isEqualTo("peak");
        ((ObjectNode) probe).remove("measure");
        acProbes++;
      } else {
        assertThat(probe.has("measure")).isFalse();
      }
    }
    assertThat(acProbes).isPositive();
    JsonNode before =
        JSON.readTree(
            Files.readString(RECORDED.resolve("line-driver." + name + ".diagnosis-v1.json")));
    assertThat(now).isEqualTo(before);
  }

  @Test
  void solveJson_ofAVersionOneSheet_isAsRecordedWithItsMeasureSaid() throws Exception {
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run("solve", "--stage", STAGE.toString(), "--json");
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    JsonNode now = JSON.readTree(run.out());
    assertThat(now.get("ac").get("measure").asText()).isEqualTo("peak");
    ((ObjectNode) now.get("ac")).remove("measure");
    assertThat(now)
        .isEqualTo(
            JSON.readTree(Files.readString(RECORDED.resolve("line-driver.solution-v1.json"))));
  }

  @Test
  void solve_ofAnRmsInput_statesTheAmplitudesInRms() throws Exception {
    // The same 0.1 V input stated as RMS: a real peak of 0.1·√2; the output of this inverting
    // stage (gain −47k/10k, textbook inverting amplifier) is 0.47 V RMS.
    Path sheet = dir.resolve("rms.stage.json");
    Files.writeString(
        sheet,
        Files.readString(STAGE)
            .replace(
                "\"ac\": 0.1, \"hz\": 1000}", "\"ac\": 0.1, \"hz\": 1000, \"measure\": \"rms\"}"));
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run("solve", "--stage", sheet.toString(), "--json");
    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    JsonNode ac = JSON.readTree(run.out()).get("ac");
    assertThat(ac.get("measure").asText()).isEqualTo("rms");
    assertThat(ac.get("nets").get("OUT").get("amplitude").asDouble())
        .isCloseTo(0.47, org.assertj.core.data.Offset.offset(0.47 * 1e-3));
    assertThat(ac.get("nets").get("IN").get("amplitude").asDouble())
        .isCloseTo(0.1, org.assertj.core.data.Offset.offset(1e-12));
    StagewiseCommandTest.Run table = StagewiseCommandTest.run("solve", "--stage", sheet.toString());
    assertThat(table.out()).contains("AC RMS at 1000 Hz");
  }

  @Test
  void rmsReading_thatAPeakComparisonCallsHealthy_isOutsideTheBand() throws Exception {
    // A meter's AC volts read 0.468 V RMS at OUT: the stage's 0.47 V peak is 0.332 V RMS, so the
    // output swings √2 times too far. Taken as a peak (as a version-1 reader would), it fits. The
    // rails are read too; the output's DC level is not, so the AC reading decides.
    String readings =
        Files.readString(RECORDED.resolve("line-driver.healthy-ac.readings.json"))
            .replace("    {\"at\": \"U3.1\", \"dc\": -4.69},\n", "");
    assertThat(readings).doesNotContain("U3.1");
    Path asPeak = dir.resolve("peak.readings.json");
    Files.writeString(asPeak, readings);
    Path asRms = dir.resolve("rms.readings.json");
    Files.writeString(
        asRms,
        readings.replace(
            "{\"at\": \"OUT\", \"ac\": 0.468, \"hz\": 1000}",
            "{\"at\": \"OUT\", \"ac\": 0.468, \"hz\": 1000, \"measure\": \"rms\"}"));
    JsonNode peak = diagnose(asPeak);
    JsonNode rms = diagnose(asRms);
    assertThat(peak.get("verdict").asText()).isEqualTo("healthy");
    assertThat(peak.get("observations")).isEmpty();
    assertThat(rms.get("verdict").asText()).isEqualTo("fault");
    // Expected: 0.47 V peak / √2 = 0.3323 V RMS (the stage's gain 4.7 on a 0.1 V peak input).
    assertThat(rms.get("observations").toString().replace('\u00a0', ' '))
        .contains("AC amplitude 468 mV RMS where 332.3 mV RMS is expected");
    // A gain √2 too high: R15 high or R14 low, the two ways the inverting gain R15/R14 rises.
    assertThat(rms.get("suspects").get(0).get("group").toString()).contains("R15:high", "R14:low");
  }

  @Test
  void diagnoseText_saysTheMeasureOfAnAcProbe() {
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose",
            "--stage",
            STAGE.toString(),
            "--readings",
            RECORDED.resolve("line-driver.low-gain-ac.readings.json").toString());
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    assertThat(run.out()).contains("ac peak at 1000 Hz");
  }

  @Test
  void badMeasure_exitsTwoNamingFileAndPath() throws Exception {
    Path bad = dir.resolve("bad.readings.json");
    Files.writeString(
        bad,
        Files.readString(RECORDED.resolve("line-driver.healthy-ac.readings.json"))
            .replace("\"hz\": 1000}", "\"hz\": 1000, \"measure\": \"avg\"}"));
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose", "--stage", STAGE.toString(), "--readings", bad.toString());
    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.err())
        .contains(bad.toString(), "readings[3].measure", "\"rms\", \"peak\" or \"pp\"")
        .doesNotContain("Exception");
  }

  private JsonNode diagnose(Path readings) throws Exception {
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose", "--stage", STAGE.toString(), "--readings", readings.toString(), "--json");
    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    return JSON.readTree(run.out());
  }
}
