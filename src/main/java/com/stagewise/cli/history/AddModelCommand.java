package com.stagewise.cli.history;

import static com.stagewise.cli.history.Phrases.plural;

import com.stagewise.casework.Casework;
import com.stagewise.history.record.BoardModel;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history add-model}: a board model with its stage sheets, all or nothing. */
@Command(
    name = "add-model",
    mixinStandardHelpOptions = true,
    description = "Add a board model, optionally with its stage sheets (all of them or nothing).")
final class AddModelCommand extends HistorySubcommand {
  @Option(names = "--name", required = true, description = "The board model's name.")
  String name;

  @Option(names = "--maker", defaultValue = "", description = "Its maker.")
  String maker;

  @Option(
      names = "--stage",
      paramLabel = "FILE",
      description = "A stage sheet (*.stage.json) to keep with it; repeatable.")
  List<Path> stages = new ArrayList<>();

  @Override
  void run(Casework work, PrintWriter out) {
    BoardModel model = work.addBoardModel(name, maker, stages);
    if (json()) {
      out.println(HistoryJson.boardModels(List.of(model)));
    } else {
      out.println(
          "Board model "
              + model.name()
              + " ("
              + plural(work.history().library().sheets(model.id()).size(), "stage sheet")
              + ").");
    }
  }
}
