package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.cli.ExitCode;
import com.stagewise.history.HistoryStore;
import java.io.PrintWriter;
import java.util.concurrent.Callable;
import picocli.CommandLine.Mixin;

/**
 * A history subcommand: opens the history, runs once (changes go through the case workflow, one
 * transaction each), closes it, and returns the exit code. Failures are reported by the command
 * line's one handler.
 */
abstract class HistorySubcommand implements Callable<Integer> {
  @Mixin HistoryOptions options;

  @Override
  public final Integer call() {
    try (HistoryStore store = readsOnly() ? options.openForReading() : options.open()) {
      run(new Casework(store), options.out());
    }
    options.out().flush();
    return ExitCode.OK;
  }

  /** Runs the subcommand; reads go to {@code work.history()}, changes through {@code work}. */
  abstract void run(Casework work, PrintWriter out);

  /**
   * Returns whether the subcommand only reads: the history is then opened read-only, so that a
   * read-only file can still be listed and searched, and nothing in it can change.
   */
  boolean readsOnly() {
    return false;
  }

  boolean json() {
    return options.json;
  }
}
