package com.stagewise.cli;

import java.io.PrintWriter;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;

/**
 * Runs the plain forms of {@code solve} and {@code diagnose} without building picocli's model of
 * the command line; every other call (help, version, an unknown or repeated option, a value picocli
 * would refuse, any other command) is left to picocli, which then gives its usual help and
 * messages.
 *
 * <p>Why: the first picocli command line built in a fresh JVM costs as much as reading, solving and
 * printing a demo stage, because picocli's classes are built for Java 5 and the class-data sharing
 * archive cannot hold them (DEVELOPERS.md, "Start-up of the command line"). A call that names its
 * stage and readings in the plain way needs none of that. {@code QuickStartTest} checks that the
 * option names here are the ones picocli reads from the commands' annotations, and that both ways
 * give the same output and exit code.
 */
final class QuickStart {
  private QuickStart() {}

  /** One command that may start this way: its name, its options and how it is made from them. */
  record Plain(
      String name, List<String> valued, List<String> flags, List<String> required, Maker maker) {}

  /** Makes a command from the options given (each valued option's text, each flag as "true"). */
  interface Maker {
    /** Returns the command, or null when a value needs picocli's conversion or its message. */
    Callable<Integer> make(Map<String, String> options, PrintWriter out);
  }

  /** The commands that may start without picocli. */
  static final List<Plain> COMMANDS =
      List.of(
          new Plain(
              "diagnose",
              List.of("--stage", "--readings", "--batch", "--top"),
              List.of("--json", "--mains-powered"),
              List.of(),
              new DiagnoseMaker()),
          new Plain(
              "solve",
              List.of("--stage"),
              List.of("--json"),
              List.of("--stage"),
              new SolveMaker()));

  // Named classes rather than method references: a method reference's class is spun on its first
  // call, which is the start of every command-line run this class serves.

  /** Makes {@code diagnose} ({@link DiagnoseCommand#plain}). */
  private static final class DiagnoseMaker implements Maker {
    @Override
    public Callable<Integer> make(Map<String, String> options, PrintWriter out) {
      return DiagnoseCommand.plain(options, out);
    }
  }

  /** Makes {@code solve} ({@link SolveCommand#plain}). */
  private static final class SolveMaker implements Maker {
    @Override
    public Callable<Integer> make(Map<String, String> options, PrintWriter out) {
      return SolveCommand.plain(options, out);
    }
  }

  /**
   * Returns the command {@code args} call for in its plain form, ready to run, or null when the
   * call is for picocli.
   */
  static Callable<Integer> command(String[] args, PrintWriter out) {
    if (args.length == 0) {
      return null;
    }
    for (Plain plain : COMMANDS) {
      if (plain.name().equals(args[0])) {
        Map<String, String> options = options(args, plain);
        return options == null ? null : plain.maker().make(options, out);
      }
    }
    return null;
  }

  /**
   * Returns the options of {@code args} after the command's name, or null when any word is not one
   * of the command's options in the form {@code --name value}, {@code --name=value} or {@code
   * --flag}, is given twice, has a value that starts with a dash, or a required option is missing.
   */
  static Map<String, String> options(String[] args, Plain plain) {
    Map<String, String> options = new HashMap<>();
    for (int i = 1; i < args.length; i++) {
      String word = args[i];
      int equals = word.indexOf('=');
      String name = equals < 0 ? word : word.substring(0, equals);
      String value;
      if (plain.flags().contains(name) && equals < 0) {
        value = "true";
      } else if (plain.valued().contains(name)) {
        if (equals >= 0) {
          value = word.substring(equals + 1);
        } else if (i + 1 < args.length) {
          value = args[++i];
        } else {
          return null;
        }
        if (value.startsWith("-") || value.startsWith("@")) {
          return null;
        }
      } else {
        return null;
      }
      if (options.put(name, value) != null) {
        return null;
      }
    }
    for (String required : plain.required()) {
      if (!options.containsKey(required)) {
        return null;
      }
    }
    return options;
  }

  /** Returns the path a value names, or null when it is no path (picocli then says why). */
  static Path path(String value) {
    if (value == null) {
      return null;
    }
    try {
      return Path.of(value);
    } catch (InvalidPathException e) {
      return null;
    }
  }

  /** Returns a whole number of at most nine digits, or -1 when the text is anything else. */
  static int count(String value) {
    if (value.isEmpty() || value.length() > 9) {
      return -1;
    }
    for (int i = 0; i < value.length(); i++) {
      if (value.charAt(i) < '0' || value.charAt(i) > '9') {
        return -1;
      }
    }
    return Integer.parseInt(value);
  }
}
