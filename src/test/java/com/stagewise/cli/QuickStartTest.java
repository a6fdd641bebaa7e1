package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import picocli.CommandLine;
import picocli.CommandLine.Model.OptionSpec;

/**
 * The plain forms of {@code solve} and {@code diagnose} that start without picocli ({@link
 * QuickStart}) are cross-checked against picocli itself, the parser every other call goes through:
 * the same options, and the same output, messages and exit code for the same arguments.
 */
class QuickStartTest {
  private static final String STAGE = "data/stages/ferrowick-wb2-bridge-amp.stage.json";
  private static final String READINGS =
      "data/readings/ferrowick-wb2-bridge-amp.reads-high.readings.json";
  private static final String LINE_DRIVER = "data/stages/larkspur-sm8-line-driver.stage.json";

  record Run(int code, String out, String err) {}

  private static Run quick(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  private static Run picocli(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.withPicocli(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  @Test
  void everyPlainCommand_hasTheOptionsPicocliReadsFromItsAnnotations() {
    for (QuickStart.Plain plain : QuickStart.COMMANDS) {
      CommandLine line =
          StagewiseCommand.commandLine(new String[] {plain.name()})
              .getSubcommands()
              .get(plain.name());
      List<String> valued = new ArrayList<>();
      List<String> flags = new ArrayList<>();
      List<String> required = new ArrayList<>();
      for (OptionSpec option : line.getCommandSpec().options()) {
        if (option.usageHelp() || option.versionHelp()) {
          continue;
        }
        assertThat(option.names()).as(plain.name()).hasSize(1);
        (option.arity().max() == 0 ? flags : valued).add(option.longestName());
        if (option.required()) {
          required.add(option.longestName());
        }
      }
      assertThat(plain.valued()).as(plain.name()).containsExactlyInAnyOrderElementsOf(valued);
      assertThat(plain.flags()).as(plain.name()).containsExactlyInAnyOrderElementsOf(flags);
      assertThat(plain.required()).as(plain.name()).containsExactlyInAnyOrderElementsOf(required);
    }
  }

  @ParameterizedTest
  @ValueSource(
      strings = {
        "diagnose --stage " + STAGE + " --readings " + READINGS,
        "diagnose --readings=" + READINGS + " --stage=" + STAGE + " --json --top 3",
        "diagnose --stage " + STAGE + " --readings " + READINGS + " --mains-powered --top=1",
        "diagnose --stage " + STAGE + " --readings " + READINGS + " --top 0",
        "diagnose --stage " + STAGE,
        "diagnose --stage no-such.stage.json --readings " + READINGS,
        "diagnose --batch no-such.jsonl",
        "diagnose --batch x.jsonl --stage " + STAGE,
        "solve --stage " + LINE_DRIVER,
        "solve --json --stage=" + LINE_DRIVER,
        "solve --stage " + READINGS,
      })
  void aPlainCall_givesWhatPicocliGives(String words) {
    String[] args = words.split(" ");
    assertThat(QuickStart.command(args, new PrintWriter(new StringWriter())))
        .as("starts without picocli")
        .isNotNull();

    Run quick = quick(args);
    Run picocli = picocli(args);

    assertThat(quick).isEqualTo(picocli);
    assertThat(quick.out() + quick.err()).isNotBlank();
  }

  @ParameterizedTest
  @ValueSource(
      strings = {
        "diagnose --help",
        "diagnose -h",
        "diagnose --version",
        "diagnose --stage",
        "diagnose --stage a --stage b",
        "diagnose --top x --stage " + STAGE,
        "diagnose --top -1 --stage " + STAGE,
        "diagnose --top 99999999999 --stage " + STAGE,
        "diagnose --stage " + STAGE + " extra",
        "diagnose --stage --json",
        "diagnose --json=true --stage " + STAGE,
        "diagnose @args.txt",
        "diagnose --stage " + STAGE + " -- --json",
        "diagnose --stages " + STAGE,
        "solve",
        "solve --json",
        "solve --stage " + LINE_DRIVER + " --readings x",
        "--version",
        "history units",
      })
  void anyOtherCall_isLeftToPicocli(String words) {
    String[] args = words.split(" ");

    assertThat(QuickStart.command(args, new PrintWriter(new StringWriter()))).isNull();
    assertThat(quick(args)).isEqualTo(picocli(args));
  }

  @Test
  void theVersionAlone_buildsNoCommandAndStillPrintsIt() {
    assertThat(StagewiseCommand.commandLine(new String[] {"--version"}).getSubcommands()).isEmpty();

    Run run = quick("--version");

    assertThat(run.code()).isEqualTo(ExitCode.OK);
    assertThat(run.out()).startsWith("stagewise ");
  }
}
