package com.stagewise.cli.history;

import static com.stagewise.cli.history.Phrases.plural;

import com.stagewise.casework.Casework;
import com.stagewise.history.ExportSelection;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.interchange.history.HistoryBundleJson;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Map;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history export}: the history, or a part of it, as one bundle file. */
@Command(
    name = "export",
    mixinStandardHelpOptions = true,
    description = "Write the history, or a part of it, to one JSON bundle.")
final class ExportCommand extends HistorySubcommand {
  @Option(
      names = "--out",
      required = true,
      paramLabel = "FILE",
      description = "The bundle file to write.")
  Path file;

  @Option(names = "--serial", description = "Only this unit.")
  String serial;

  @Option(
      names = "--model",
      description = "Only this board model (or, with --serial, the unit's model).")
  String model;

  @Option(
      names = "--from",
      paramLabel = "DATE",
      description = "Only cases opened on or after this date (UTC).")
  String from;

  @Option(
      names = "--to",
      paramLabel = "DATE",
      description = "Only cases opened on or before this date (UTC).")
  String to;

  @Override
  boolean readsOnly() {
    return true;
  }

  @Override
  void run(Casework work, PrintWriter out) {
    ExportSelection selection;
    if (serial != null) {
      selection =
          new ExportSelection.OneUnit(Lookups.requireUnit(work.history(), serial, model).id());
    } else if (model != null) {
      selection =
          new ExportSelection.OneBoardModel(Lookups.requireModel(work.history(), model).id());
    } else if (from != null || to != null) {
      selection =
          new ExportSelection.OpenedBetween(
              from == null ? Instant.EPOCH : Lookups.time("--from", from, false),
              to == null ? Instant.parse("9999-12-31T00:00:00Z") : Lookups.time("--to", to, true));
    } else {
      selection = new ExportSelection.All();
    }
    HistoryBundle bundle = work.history().transfer().export(selection, Casework.version());
    HistoryBundleJson.write(bundle, file);
    if (json()) {
      out.println(
          HistoryJson.fields(
              Map.of("bundle", file.toString(), "cases", Integer.toString(bundle.cases().size()))));
    } else {
      out.println(
          "Exported "
              + plural(bundle.cases().size(), "case")
              + " of "
              + plural(bundle.units().size(), "unit")
              + " ("
              + plural(bundle.size(), "record")
              + ") to "
              + file
              + ".");
    }
  }
}
