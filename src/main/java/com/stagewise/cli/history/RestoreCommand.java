package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Map;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history restore}: the history replaced by a backup, the current one saved first. */
@Command(
    name = "restore",
    mixinStandardHelpOptions = true,
    description = "Replace the history with a backup (the current one is saved first).")
final class RestoreCommand extends HistorySubcommand {
  @Option(names = "--from", required = true, paramLabel = "FILE", description = "The backup file.")
  Path file;

  @Override
  void run(Casework work, PrintWriter out) {
    Path saved = work.restoreFrom(file);
    out.println(
        json()
            ? HistoryJson.fields(
                Map.of("restoredFrom", file.toString(), "previousSavedTo", saved.toString()))
            : "History restored from "
                + file
                + ". The previous history was saved to "
                + saved
                + ".");
  }
}
