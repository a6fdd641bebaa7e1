package com.stagewise.cli.history;

import static com.stagewise.history.HistoryStore.shortId;

import com.stagewise.casework.Casework;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history open-case}: a case for a unit, with the symptom as reported. */
@Command(
    name = "open-case",
    mixinStandardHelpOptions = true,
    description = "Open a case for a unit, with the symptom as reported.")
final class OpenCaseCommand extends HistorySubcommand {
  @Option(names = "--serial", required = true, description = "The unit's serial number.")
  String serial;

  @Option(
      names = "--model",
      description = "Its board model (needed if two models have this serial).")
  String model;

  @Option(names = "--symptom", required = true, description = "The symptom as reported.")
  String symptom;

  @Override
  void run(Casework work, PrintWriter out) {
    Unit unit = Lookups.requireUnit(work.history(), serial, model);
    RepairCase opened = work.openCase(unit.id(), symptom);
    out.println(
        json()
            ? HistoryJson.repairCase(opened)
            : "Case " + shortId(opened.id()) + " opened for " + unit.serial() + ".");
  }
}
