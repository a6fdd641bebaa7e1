package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.cli.ExitCode;
import com.stagewise.history.DatabaseLocation;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.SyncLedger;
import com.stagewise.history.postgres.PgHistory;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.history.sync.Sync;
import com.stagewise.history.sync.SyncReport;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Clock;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/**
 * {@code history sync}: this bench's history and the shop server's, merged both ways by id with the
 * bundle rules, with progress on the error stream and a summary (JSON with {@code --json}).
 */
@Command(
    name = "sync",
    mixinStandardHelpOptions = true,
    description =
        "Sync this bench's history with the shop server: the others' records come down, this"
            + " bench's new and changed ones go up; conflicts are reported, never overwritten. A"
            + " cut sync loses nothing: run it again.")
final class SyncCommand implements Callable<Integer> {
  @Option(
      names = "--db",
      paramLabel = "FILE",
      description = "The history database (default: $STAGEWISE_DB, else the data folder).")
  Path db;

  @Option(names = "--json", description = "Print the summary as JSON.")
  boolean json;

  @Option(names = "--quiet", description = "No progress lines.")
  boolean quiet;

  @Mixin ServerOption server;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    var address = server.require();
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    Path file = DatabaseLocation.resolve(db);
    try (HistoryStore bench = SqliteHistory.open(file)) {
      if (!(bench instanceof SyncLedger ledger)) {
        throw new InvalidInputException(file.toString(), "db", "expected a bench's history file");
      }
      try (PgHistory shop = PgHistory.open(address, Clock.systemUTC(), System.getenv())) {
        Sync sync =
            new Sync(
                ledger, shop, file.getFileName().toString(), Casework.version(), Clock.systemUTC());
        SyncReport report =
            sync.run(
                quiet
                    ? Sync.Progress.NONE
                    : (phase, done, total) -> {
                      err.print("\r" + bar(phase, done, total));
                      if (done >= total) {
                        err.println();
                      }
                      err.flush();
                    });
        out.println(json ? HistoryJson.syncReport(report) : text(report));
      }
    }
    out.flush();
    return ExitCode.OK;
  }

  private static String bar(String phase, int done, int total) {
    int width = 30;
    int filled = total == 0 ? width : (int) ((long) width * done / total);
    return String.format(
        Locale.ROOT,
        "%-4s [%s%s] %d/%d",
        phase,
        "#".repeat(filled),
        ".".repeat(width - filled),
        done,
        total);
  }

  private static String text(SyncReport report) {
    StringBuilder text =
        new StringBuilder(
            String.format(
                Locale.ROOT,
                "Synced with %s at %s: %d records came down (%d already here), %d went up,"
                    + " %d conflicts.",
                report.server(),
                HistoryText.when(report.endedAt()),
                report.down(),
                report.downUnchanged(),
                report.up(),
                report.conflicts().size()));
    for (ImportReport.Conflict c : report.conflicts()) {
      text.append(System.lineSeparator())
          .append("  conflict: ")
          .append(c.kind())
          .append(' ')
          .append(c.id())
          .append(": ")
          .append(c.reason());
    }
    return text.toString();
  }
}
