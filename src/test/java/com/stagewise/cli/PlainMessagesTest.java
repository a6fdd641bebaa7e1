package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Regression tests for messages and outputs the hostile-documents fuzz test found wrong: each names
 * what broke. Every refusal is one line that names the file once, the JSON path and what was
 * expected, in plain words.
 */
class PlainMessagesTest {
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

  @Test
  void partKindOfTheWrongType_repeatedTheFileAndThePath() throws Exception {
    Path stage = changed(STAGE, "\"kind\": \"resistor\"", "\"kind\": 0");
    StagewiseCommandTest.Run run = StagewiseCommandTest.run("solve", "--stage", stage.toString());
    StagewiseCommandTest.assertBadInput(
        run,
        stage
            + ": parts[0].kind: expected resistor, capacitor, diode, zener, led, trimmer or potentiometer as a string,"
            + " found the number 0");
    assertThat(run.err().indexOf(stage.toString()))
        .isEqualTo(run.err().lastIndexOf(stage.toString()));
  }

  @Test
  void infiniteRail_wasQuotedAsTheNumberInfinity() throws Exception {
    Path stage = changed(STAGE, "\"volts\": 15,", "\"volts\": Infinity,");
    StagewiseCommandTest.Run run = StagewiseCommandTest.run("solve", "--stage", stage.toString());
    StagewiseCommandTest.assertBadInput(
        run,
        "rails[0].volts",
        "a number that is not finite (\"Infinity\", which JSON does not allow)");
    assertThat(run.err()).doesNotContain("the number Infinity");
  }

  @Test
  void nanReading_wasQuotedAsTheNumberNaN() throws Exception {
    Path readings = changed(READINGS, "\"dc\": -13.46", "\"dc\": NaN");
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose", "--stage", STAGE.toString(), "--readings", readings.toString());
    StagewiseCommandTest.assertBadInput(run, readings.toString(), "readings[2].dc", "\"NaN\"");
    assertThat(run.err()).doesNotContain("the number NaN");
  }

  @Test
  void lineBreakInATestPoint_splitTheMessageInTwo() throws Exception {
    Path readings = changed(READINGS, "\"at\": \"OUT\"", "\"at\": \"OU\\nT\"");
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "diagnose", "--stage", STAGE.toString(), "--readings", readings.toString());
    // assertBadInput also checks that the refusal is one line.
    StagewiseCommandTest.assertBadInput(
        run, readings.toString(), "readings[4].at", "control character");
  }

  @Test
  void lineBreakInTheFormat_splitTheMessageInTwo() throws Exception {
    Path stage = changed(STAGE, "\"format\": \"stagewise-stage\"", "\"format\": \"line\\nbreak\"");
    StagewiseCommandTest.Run run = StagewiseCommandTest.run("solve", "--stage", stage.toString());
    // assertBadInput also checks that the refusal is one line; the break is shown escaped.
    StagewiseCommandTest.assertBadInput(run, stage.toString(), "format", "line\\nbreak");
  }

  @Test
  void longStringValue_wasQuotedInFull() throws Exception {
    String longText = "x".repeat(70_000);
    Path stage =
        changed(STAGE, "\"value\": \"47k\"", "\"value\": true, \"z\": \"" + longText + "\"");
    StagewiseCommandTest.Run run = StagewiseCommandTest.run("solve", "--stage", stage.toString());
    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.err().length()).isLessThan(1_000);
  }

  @Test
  void smallSolvedVoltage_printedWithMoreThanTwentyDigits() throws Exception {
    // A net a few microvolts from ground printed every digit of the double in plain form
    // ("0.0000123456789012345678"); it now keeps the exponent form beyond 20 digits.
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run(
            "solve",
            "--stage",
            Path.of("data", "stages", "larkspur-sm8-insert-return.stage.json").toString(),
            "--json");
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    assertThat(run.out()).doesNotContainPattern("[0-9]{21}");
  }
}
