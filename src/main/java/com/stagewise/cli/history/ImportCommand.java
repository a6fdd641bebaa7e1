package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.history.ImportReport;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.interchange.history.HistoryBundleJson;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.nio.file.Path;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

/** {@code history import}: a bundle merged into the history, all of it or nothing. */
@Command(
    name = "import",
    mixinStandardHelpOptions = true,
    description = "Merge a JSON bundle into the history (all of it or nothing).")
final class ImportCommand extends HistorySubcommand {
  @Parameters(paramLabel = "FILE", description = "The bundle file.")
  Path file;

  @Override
  void run(Casework work, PrintWriter out) {
    HistoryBundle bundle = HistoryBundleJson.read(file);
    ImportReport report = work.importBundle(bundle, file.toString());
    out.print(
        json()
            ? HistoryJson.importReport(report) + System.lineSeparator()
            : HistoryText.importReport(report));
  }
}
