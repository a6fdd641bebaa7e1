package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.CaseFile;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history show}: a unit's whole history, or one case. */
@Command(
    name = "show",
    mixinStandardHelpOptions = true,
    description = "Show a unit's whole history, or one case.")
final class ShowCommand extends HistorySubcommand {
  @Option(names = "--serial", description = "The unit's serial number.")
  String serial;

  @Option(
      names = "--model",
      description = "Its board model (needed if two models have this serial).")
  String model;

  @Option(
      names = "--case",
      paramLabel = "ID",
      description = "One case (its id or first characters).")
  String caseId;

  @Override
  boolean readsOnly() {
    return true;
  }

  @Override
  void run(Casework work, PrintWriter out) {
    if ((serial == null) == (caseId == null)) {
      throw new InvalidInputException(
          "command line", "--serial/--case", "give either --serial or --case");
    }
    if (caseId != null) {
      CaseFile file =
          work.history().cases().caseFile(work.history().cases().resolveId(caseId)).orElseThrow();
      out.println(json() ? HistoryJson.caseFile(file) : HistoryText.caseFile(file));
      return;
    }
    Unit unit = Lookups.requireUnit(work.history(), serial, model);
    UnitHistory history = work.history().cases().unitHistory(unit.id()).orElseThrow();
    out.print(
        json()
            ? HistoryJson.unitHistory(history) + System.lineSeparator()
            : HistoryText.unitHistory(history));
  }
}
