package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.util.List;
import java.util.Map;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history units}: the units, of one board model or all. */
@Command(
    name = "units",
    mixinStandardHelpOptions = true,
    description = "List the units, of one board model or all.")
final class UnitsCommand extends HistorySubcommand {
  @Option(names = "--model", description = "Only units of this board model.")
  String model;

  @Override
  boolean readsOnly() {
    return true;
  }

  @Override
  void run(Casework work, PrintWriter out) {
    String modelId = model == null ? null : Lookups.requireModel(work.history(), model).id();
    List<Unit> units = work.history().units().list(modelId);
    Map<String, BoardModel> models = Lookups.modelsById(work.history());
    if (json()) {
      out.println(HistoryJson.units(units, models));
      return;
    }
    if (units.isEmpty()) {
      out.println("No units yet. Add one with 'history add-unit --serial S --model M'.");
    }
    for (Unit u : units) {
      out.println(
          u.serial()
              + "  "
              + models.get(u.boardModelId()).name()
              + (u.owner().isEmpty() ? "" : "  " + u.owner()));
    }
  }
}
