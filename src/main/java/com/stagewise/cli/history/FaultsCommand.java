package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.history.ShopMemory;
import com.stagewise.history.record.BoardModel;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.util.Map;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history faults}: the shop's memory of a board model. */
@Command(
    name = "faults",
    mixinStandardHelpOptions = true,
    description = "Show the faults confirmed on a board model's fixed cases (the shop's memory).")
final class FaultsCommand extends HistorySubcommand {
  @Option(names = "--model", required = true, description = "The board model.")
  String model;

  @Override
  boolean readsOnly() {
    return true;
  }

  @Override
  void run(Casework work, PrintWriter out) {
    BoardModel boardModel = Lookups.requireModel(work.history(), model);
    Map<String, Integer> counts = work.shopCounts(boardModel);
    if (json()) {
      out.println(HistoryJson.faultCounts(boardModel.name(), counts));
      return;
    }
    if (counts.isEmpty()) {
      out.println("No fixed cases with a confirmed fault on " + boardModel.name() + " yet.");
    }
    counts.forEach(
        (fault, n) -> out.println(fault + "  " + ShopMemory.hint(fault, counts).orElse("")));
  }
}
