package com.stagewise.cli.history;

import java.util.List;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** Builds a command's line with only the subcommands a call names. */
public final class CommandTree {
  private CommandTree() {}

  /**
   * Returns the command line of {@code command} with the subcommand called {@code name} only, or
   * with all of {@code subcommands} when {@code name} is null or is none of their names.
   */
  public static CommandLine withSubcommands(
      Object command, List<Class<?>> subcommands, String name) {
    CommandLine line = new CommandLine(command);
    boolean known = name != null && subcommands.stream().anyMatch(c -> nameOf(c).equals(name));
    for (Class<?> subcommand : subcommands) {
      if (!known || nameOf(subcommand).equals(name)) {
        line.addSubcommand(subcommand);
      }
    }
    return line;
  }

  /**
   * Returns where the first word of {@code args} from {@code from} on stands that is not an option,
   * or -1.
   */
  public static int firstWordAt(String[] args, int from) {
    for (int i = from; i < args.length; i++) {
      if (!args[i].startsWith("-")) {
        return i;
      }
    }
    return -1;
  }

  /**
   * Returns picocli's complaint about a command line (printed as bad input). Typed as a plain
   * runtime exception so that a class that throws it need not load picocli's to be checked.
   */
  public static RuntimeException problem(CommandLine line, String message) {
    return new CommandLine.ParameterException(line, message);
  }

  /** Returns the name a command's annotation gives it. */
  public static String nameOf(Class<?> command) {
    return command.getAnnotation(Command.class).name();
  }
}
