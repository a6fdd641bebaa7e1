package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;

/**
 * The command line builds only the command a call names (for a quick start) and every command where
 * the user needs to see them all: help, a missing or a misspelt name.
 */
class CommandTreeTest {
  private static final String[] ALL = {
    "help", "solve", "diagnose", "template", "history", "report", "stage"
  };

  @Test
  void aNamedCommand_isTheOnlyOneBuilt() {
    var line = StagewiseCommand.commandLine(new String[] {"diagnose", "--stage", "a.json"});

    assertThat(line.getSubcommands().keySet()).containsExactly("diagnose");
  }

  @Test
  void aNamedHistorySubcommand_isTheOnlyOneOfTheHistoryBuilt() {
    var line = StagewiseCommand.commandLine(new String[] {"history", "units", "--json"});

    assertThat(line.getSubcommands().keySet()).containsExactly("history");
    assertThat(line.getSubcommands().get("history").getSubcommands().keySet())
        .containsExactly("units");
  }

  @Test
  void helpOrNoNameOrAMisspeltName_buildsEveryCommandInTheHelpOrder() {
    for (String[] args : new String[][] {{}, {"--help"}, {"help", "solve"}, {"diagnoze"}}) {
      var line = StagewiseCommand.commandLine(args);

      assertThat(line.getSubcommands().keySet()).as(String.join(" ", args)).containsExactly(ALL);
      assertThat(line.getSubcommands().get("history").getSubcommands()).hasSize(22);
    }
  }

  @Test
  void helpOfTheHistory_buildsEveryHistorySubcommand() {
    var line = StagewiseCommand.commandLine(new String[] {"history", "--help"});

    assertThat(line.getSubcommands().keySet()).containsExactly("history");
    assertThat(line.getSubcommands().get("history").getSubcommands()).hasSize(22);
  }

  @Test
  void aMisspeltHistorySubcommand_stillGetsTheListOfTheRightNames() {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();

    int code =
        StagewiseCommand.execute(
            new String[] {"history", "unitz"}, new PrintWriter(out), new PrintWriter(err));

    assertThat(code).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(err.toString()).contains("unitz");
    assertThat(
            StagewiseCommand.commandLine(new String[] {"history", "unitz"})
                .getSubcommands()
                .get("history")
                .getSubcommands())
        .containsKeys("units", "show", "add-readings");
  }

  @Test
  void helpOfTheRoot_listsEveryCommand() {
    StringWriter out = new StringWriter();

    StagewiseCommand.execute(
        new String[] {"--help"}, new PrintWriter(out), new PrintWriter(new StringWriter()));

    for (String name : ALL) {
      assertThat(out.toString()).contains("  " + name);
    }
  }
}
