package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Map;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history backup}: a consistent copy of the history in a new file. */
@Command(
    name = "backup",
    mixinStandardHelpOptions = true,
    description = "Write a consistent copy of the history to a new file (safe while the app runs).")
final class BackupCommand extends HistorySubcommand {
  @Option(
      names = "--out",
      required = true,
      paramLabel = "FILE",
      description = "The backup file (must not exist).")
  Path file;

  @Override
  boolean readsOnly() {
    return true;
  }

  @Override
  void run(Casework work, PrintWriter out) {
    work.history().transfer().backupTo(file);
    out.println(
        json()
            ? HistoryJson.fields(Map.of("backup", file.toString()))
            : "Backup written to " + file + ".");
  }
}
