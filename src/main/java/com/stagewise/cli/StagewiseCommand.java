package com.stagewise.cli;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.cli.history.CommandTree;
import com.stagewise.cli.history.HistoryCommand;
import com.stagewise.history.StorageException;
import java.io.PrintWriter;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The root of the command line: {@code stagewise <command> …}. */
@Command(
    name = "stagewise",
    mixinStandardHelpOptions = true,
    versionProvider = StagewiseCommand.Version.class,
    description = "Bench tool for diagnosing op-amp stages and keeping the repair history.")
public final class StagewiseCommand implements Runnable {
  /**
   * The commands, in the order {@code --help} lists them; {@code history} stands for its own tree
   * ({@link HistoryCommand#commandLine}). In a class of their own, so that a call that starts
   * without picocli ({@link QuickStart}) loads none of picocli's classes.
   */
  private static final class Commands {
    static final List<Class<?>> ALL =
        List.of(
            CommandLine.HelpCommand.class,
            SolveCommand.class,
            DiagnoseCommand.class,
            TemplateCommand.class,
            HistoryCommand.class,
            ReportCommand.class,
            StageCommand.class);
  }

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw CommandTree.problem(spec.commandLine(), "Name a command, e.g. 'solve'.");
  }

  /**
   * Runs the command line and returns the process exit code.
   *
   * <p>Bad input (unknown option, a bad file) prints one message and returns {@link
   * ExitCode#BAD_INPUT}; any other failure prints a short message and returns {@link
   * ExitCode#INTERNAL_ERROR}. Stack traces are never printed for bad input.
   */
  public static int execute(String[] args, PrintWriter out, PrintWriter err) {
    Callable<Integer> plain = QuickStart.command(args, out);
    if (plain != null) {
      int code;
      try {
        code = plain.call();
      } catch (Exception e) {
        code = failed(e, err);
      }
      out.flush();
      err.flush();
      return code;
    }
    return withPicocli(args, out, err);
  }

  /** Runs {@code args} through picocli, as {@link #execute} does every call but the plain ones. */
  static int withPicocli(String[] args, PrintWriter out, PrintWriter err) {
    CommandLine line = commandLine(args);
    line.setOut(out);
    line.setErr(err);
    line.setParameterExceptionHandler(
        (ex, argv) -> {
          err.println("stagewise: " + ex.getMessage());
          err.flush();
          return ExitCode.BAD_INPUT;
        });
    line.setExecutionExceptionHandler((ex, cmd, parseResult) -> failed(ex, err));
    int code = line.execute(args);
    out.flush();
    err.flush();
    return code;
  }

  /**
   * Prints the message of a command's failure and returns its exit code: bad input (and a history
   * file that cannot be used) names what to fix, anything else is an internal error.
   */
  private static int failed(Exception ex, PrintWriter err) {
    if (ex instanceof InvalidInputException || ex instanceof StorageException) {
      // Both messages are written for the user: the file, the field or the fault, and what to
      // do; on one line, whatever text of the user's they quote.
      err.println("stagewise: " + oneLine(ex.getMessage()));
    } else {
      err.println("stagewise: internal error: " + ex);
    }
    err.flush();
    boolean badFile = ex instanceof StorageException se && se.isUnusableFile();
    return ex instanceof InvalidInputException || badFile
        ? ExitCode.BAD_INPUT
        : ExitCode.INTERNAL_ERROR;
  }

  /**
   * Returns the command line for {@code args}: with only the command they name (and only the
   * history subcommand they name), with none for the version alone, or with every command for help,
   * a misspelt or a missing name. Picocli reads each command's options from its annotations when
   * the command is added; reading all of them took about as long as a whole diagnosis of a demo
   * stage.
   */
  static CommandLine commandLine(String[] args) {
    int at = CommandTree.firstWordAt(args, 0);
    String name = at < 0 ? null : args[at];
    boolean one =
        name != null
            && Commands.ALL.stream()
                .anyMatch(
                    c -> c != CommandLine.HelpCommand.class && CommandTree.nameOf(c).equals(name));
    CommandLine line = new CommandLine(new StagewiseCommand());
    if (isVersion(args)) {
      return line;
    }
    for (Class<?> command : Commands.ALL) {
      String commandName = CommandTree.nameOf(command);
      if (one && !commandName.equals(name)) {
        continue;
      }
      if (command == HistoryCommand.class) {
        int sub = one ? CommandTree.firstWordAt(args, at + 1) : -1;
        line.addSubcommand(commandName, HistoryCommand.commandLine(sub < 0 ? null : args[sub]));
      } else {
        line.addSubcommand(command);
      }
    }
    return line;
  }

  /** Returns whether {@code args} ask for the version only (it needs no command built). */
  private static boolean isVersion(String[] args) {
    return args.length == 1 && (args[0].equals("--version") || args[0].equals("-V"));
  }

  /**
   * Returns a message on one line: a line break or another control character that it quotes from
   * the user's text is shown escaped ({@code \\n}, {@code \\u0007}).
   */
  static String oneLine(String message) {
    StringBuilder text = new StringBuilder(message.length());
    for (int i = 0; i < message.length(); i++) {
      char c = message.charAt(i);
      if (c == '\n') {
        text.append("\\n");
      } else if (c == '\r') {
        text.append("\\r");
      } else if (Character.isISOControl(c)) {
        text.append(String.format(java.util.Locale.ROOT, "\\u%04x", (int) c));
      } else {
        text.append(c);
      }
    }
    return text.toString();
  }

  /** Prints the version recorded in the jar's manifest. */
  static final class Version implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
      return new String[] {"stagewise " + Casework.version()};
    }
  }
}
