package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Regression tests for absurd values that once passed (a rail of 1e308 V, a resistor of 1e200 Ω, an
 * input or a reading of -1e308 V): {@code diagnose} printed "Verdict: healthy" with "NaN %" and
 * 300-digit voltages with exit 0, or with {@code --json} exited 1 with "not a finite number: NaN".
 * Each is now refused with exit 2 and a message naming the file, the JSON path and the range.
 */
class AbsurdValuesTest {
  private static final Path STAGE =
      Path.of("data", "stages", "larkspur-sm8-line-driver.stage.json");
  private static final Path READINGS =
      Path.of("data", "readings", "larkspur-sm8-line-driver.no-feedback.readings.json");

  @TempDir Path dir;

  private Path changed(Path file, String from, String to) throws Exception {
    String text = Files.readString(file, StandardCharsets.UTF_8);
    assertThat(text).contains(from);
    Path out = dir.resolve(file.getFileName());
    Files.writeString(out, text.replace(from, to), StandardCharsets.UTF_8);
    return out;
  }

  private static void assertRefused(
      StagewiseCommandTest.Run run, Path file, String field, String range) {
    StagewiseCommandTest.assertBadInput(run, file.toString(), field, range);
    assertThat(run.out()).isEmpty();
    assertThat(run.err()).doesNotContain("NaN", "Infinity").doesNotContainPattern("[0-9]{21}");
  }

  private static StagewiseCommandTest.Run diagnose(Path stage, Path readings, boolean json) {
    return json
        ? StagewiseCommandTest.run(
            "diagnose", "--stage", stage.toString(), "--readings", readings.toString(), "--json")
        : StagewiseCommandTest.run(
            "diagnose", "--stage", stage.toString(), "--readings", readings.toString());
  }

  @Test
  void diagnose_rail1e308_wasHealthyWithNaNPercent() throws Exception {
    Path stage = changed(STAGE, "\"volts\": 15,", "\"volts\": 1e308,");
    assertRefused(diagnose(stage, READINGS, false), stage, "rails[0].volts", "-1 kV … 1 kV");
  }

  @Test
  void diagnoseJson_rail1e308_exitedOneWithNotAFiniteNumber() throws Exception {
    Path stage = changed(STAGE, "\"volts\": 15,", "\"volts\": 1e308,");
    assertRefused(diagnose(stage, READINGS, true), stage, "rails[0].volts", "-1 kV … 1 kV");
  }

  @Test
  void diagnose_resistor1e200_wasAccepted() throws Exception {
    Path stage = changed(STAGE, "\"value\": \"47k\"", "\"value\": 1e200");
    assertRefused(diagnose(stage, READINGS, false), stage, "parts[1].value", "1 mΩ … 1 TΩ");
  }

  @Test
  void solve_inputMinus1e308_wasAccepted() throws Exception {
    Path stage = changed(STAGE, "\"dc\": 1,", "\"dc\": -1e308,");
    assertRefused(
        StagewiseCommandTest.run("solve", "--stage", stage.toString()),
        stage,
        "inputs[0].dc",
        "-1 kV … 1 kV");
  }

  @Test
  void diagnose_reading1e308_wasAccepted() throws Exception {
    Path readings = changed(READINGS, "\"dc\": -13.46", "\"dc\": -1e308");
    assertRefused(diagnose(STAGE, readings, false), readings, "readings[2].dc", "±31 V");
  }

  @Test
  void diagnose_inputAt1e12Hertz_wasAccepted() throws Exception {
    Path stage = changed(STAGE, "\"hz\": 1000", "\"hz\": 1e12");
    assertRefused(diagnose(stage, READINGS, false), stage, "inputs[0].hz", "10 mHz … 100 MHz");
  }

  @Test
  void diagnose_meterOfAMillionPercent_wasAccepted() throws Exception {
    Path readings = changed(READINGS, "\"percent\": 0.5", "\"percent\": 1e6");
    assertRefused(diagnose(STAGE, readings, true), readings, "meter.percent", "0 % … 20 %");
  }
}
