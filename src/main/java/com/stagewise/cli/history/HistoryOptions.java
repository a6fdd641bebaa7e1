package com.stagewise.cli.history;

import com.stagewise.history.DatabaseLocation;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.PrintWriter;
import java.nio.file.Path;
import picocli.CommandLine;
import picocli.CommandLine.Option;

/** The options every history subcommand has: the database and the output form. */
final class HistoryOptions {
  @Option(
      names = "--db",
      paramLabel = "FILE",
      description = "The history database (default: $STAGEWISE_DB, else the data folder).")
  Path db;

  @Option(names = "--json", description = "Print JSON instead of text.")
  boolean json;

  @CommandLine.Spec(CommandLine.Spec.Target.MIXEE)
  CommandLine.Model.CommandSpec spec;

  HistoryStore open() {
    return SqliteHistory.open(DatabaseLocation.resolve(db));
  }

  HistoryStore openForReading() {
    return SqliteHistory.openReadOnly(DatabaseLocation.resolve(db));
  }

  PrintWriter out() {
    return spec.commandLine().getOut();
  }
}
