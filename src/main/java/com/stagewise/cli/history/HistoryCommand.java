package com.stagewise.cli.history;

import java.util.List;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * {@code stagewise history …}: the repair history from the command line: board models, units,
 * cases, readings, notes, actions, photos of the board, search, and moving the history between
 * benches.
 *
 * <p>Every subcommand takes {@code --db FILE} (else {@code STAGEWISE_DB}, else the user's data
 * folder), {@code --json} and {@code --help}. Output is readable text by default. Each subcommand
 * checks everything it is given first and then writes all of it or nothing.
 */
@Command(
    name = "history",
    mixinStandardHelpOptions = true,
    description = "Keep and search the repair history: units, cases, readings, notes, actions.")
public final class HistoryCommand implements Runnable {
  /** The history's subcommands, in the order {@code history --help} lists them. */
  static final List<Class<?>> SUBCOMMANDS =
      List.of(
          ModelsCommand.class,
          AddModelCommand.class,
          UnitsCommand.class,
          AddUnitCommand.class,
          OpenCaseCommand.class,
          CloseCaseCommand.class,
          AddReadingsCommand.class,
          StrikeReadingCommand.class,
          AddNoteCommand.class,
          AddActionCommand.class,
          AttachPhotoCommand.class,
          ShowCommand.class,
          SearchCommand.class,
          FaultsCommand.class,
          ExportCommand.class,
          ImportCommand.class,
          BackupCommand.class,
          RestoreCommand.class,
          DemoCommand.class,
          ServerInitCommand.class,
          ServerCheckCommand.class,
          SyncCommand.class);

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  /**
   * Returns the history's command line with the subcommand {@code name} only, or with every
   * subcommand when {@code name} is null or names none of them (help, a misspelt name). Picocli
   * reads a command's options from its annotations when it is added, so a call reads only what it
   * runs (the command line starts faster).
   */
  public static CommandLine commandLine(String name) {
    return CommandTree.withSubcommands(new HistoryCommand(), SUBCOMMANDS, name);
  }

  @Override
  public void run() {
    throw new CommandLine.ParameterException(
        spec.commandLine(), "Name a history command, e.g. 'history units' (see 'history --help').");
  }
}
