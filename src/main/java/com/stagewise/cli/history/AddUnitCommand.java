package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.history.Units;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history add-unit}: a unit, and its board model if new, in one transaction. */
@Command(
    name = "add-unit",
    mixinStandardHelpOptions = true,
    description = "Add a unit (the board model is added too if new).")
final class AddUnitCommand extends HistorySubcommand {
  @Option(
      names = "--serial",
      required = true,
      description = "The serial number as written on the unit.")
  String serial;

  @Option(names = "--model", required = true, description = "Its board model.")
  String model;

  @Option(names = "--owner", defaultValue = "", description = "The owner or job reference.")
  String owner;

  @Override
  void run(Casework work, PrintWriter out) {
    Units.AddedUnit added = work.addUnit(serial, model, owner);
    out.println(
        json()
            ? HistoryJson.unit(added.unit(), added.boardModel())
            : "Unit " + added.unit().serial() + " of " + added.boardModel().name() + " added.");
  }
}
