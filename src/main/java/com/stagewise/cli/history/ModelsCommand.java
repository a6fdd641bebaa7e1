package com.stagewise.cli.history;

import static com.stagewise.cli.history.Phrases.plural;

import com.stagewise.casework.Casework;
import com.stagewise.history.record.BoardModel;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.util.List;
import picocli.CommandLine.Command;

/** {@code history models}: the board models. */
@Command(name = "models", mixinStandardHelpOptions = true, description = "List the board models.")
final class ModelsCommand extends HistorySubcommand {
  @Override
  boolean readsOnly() {
    return true;
  }

  @Override
  void run(Casework work, PrintWriter out) {
    List<BoardModel> models = work.history().units().boardModels();
    if (json()) {
      out.println(HistoryJson.boardModels(models));
      return;
    }
    if (models.isEmpty()) {
      out.println("No board models yet. Add one with 'history add-model --name NAME'.");
    }
    for (BoardModel m : models) {
      int sheets = work.history().library().sheets(m.id()).size();
      out.println(
          m.name()
              + (m.maker().isEmpty() ? "" : "  (" + m.maker() + ")")
              + "  "
              + plural(sheets, "stage sheet"));
    }
  }
}
