package com.stagewise.cli.history;

import static com.stagewise.cli.history.Phrases.plural;

import com.stagewise.casework.Casework;
import com.stagewise.history.ImportReport;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import picocli.CommandLine.Command;

/** {@code history demo}: invented demo units and cases in an empty history. */
@Command(
    name = "demo",
    mixinStandardHelpOptions = true,
    description = "Fill an empty history with invented demo units and cases.")
final class DemoCommand extends HistorySubcommand {
  @Override
  void run(Casework work, PrintWriter out) {
    ImportReport report = work.fillWithDemo();
    out.println(
        json()
            ? HistoryJson.importReport(report)
            : "Demo history added ("
                + plural(report.added(), "record")
                + "); all of it is invented.");
  }
}
