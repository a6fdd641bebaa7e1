package com.stagewise.cli;

import static com.stagewise.cli.StagewiseCommandTest.assertBadInput;
import static com.stagewise.cli.StagewiseCommandTest.run;
import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Bad input on the newer parts (issue 11): a zener without its voltage, an LED without its colour,
 * a trimmer at position 1.7, a diode with one net. Each demo sheet is broken in one place; {@code
 * solve} and {@code stage check} both exit 2 with one line naming the file, the field and what to
 * write there (DESIGN.md: the stage sheet's version 2 contract), no stack trace.
 */
class JunctionInputCommandTest {
  @TempDir Path dir;

  @ParameterizedTest(name = "{0}")
  @CsvSource(
      delimiter = '|',
      textBlock =
          """
          zener without a voltage | data/stages/halden-psu30-set-point.stage.json | "value": "6V2", |  | parts[1].value | zener's voltage | 5V1
          LED without a colour | data/stages/brannock-tc4-over-temp.stage.json | "colour": "red", |  | parts[3].colour | LED's colour | red
          trimmer position 1.7 | data/stages/quillon-lx2-offset-null.stage.json | "position": 0.5 | "position": 1.7 | position | between 0 and 1 | 1.7
          diode with one net | data/stages/ostrander-dl5-peak-rectifier.stage.json | "nets": ["U7_OUT", "CH2_RECT"] | "nets": ["U7_OUT"] | parts[0].nets | two net names [anode, cathode] | D7
          """)
  void brokenPart_exits2_namingTheFileFieldAndWhatToWrite(
      String what,
      String sheet,
      String take,
      String put,
      String field,
      String expected,
      String hint)
      throws IOException {
    String text = Files.readString(Path.of(sheet), StandardCharsets.UTF_8);
    assertThat(text).as(what).contains(take);
    Path broken = dir.resolve("broken.stage.json");
    Files.writeString(broken, text.replace(take, put == null ? "" : put));

    StagewiseCommandTest.Run solve = run("solve", "--stage", broken.toString());
    assertBadInput(solve, broken.toString(), field, expected, hint);

    StagewiseCommandTest.Run check = run("stage", "check", broken.toString());
    assertThat(check.code()).as(what).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(check.out() + check.err())
        .contains(broken.toString())
        .contains(field)
        .doesNotContain("\tat ", "Exception");
    // The file on disk is what the technician wrote: nothing lost.
    assertThat(Files.readString(broken, StandardCharsets.UTF_8))
        .isEqualTo(text.replace(take, put == null ? "" : put));
  }
}
