package com.stagewise.app;

import com.stagewise.circuit.Stage;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.demo.DemoHistory;
import com.stagewise.history.record.BoardModel;
import com.stagewise.interchange.StageSheet;
import com.stagewise.ui.BoardFlags;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

/** Fills an empty history with the demo data: the demo stage library and the demo shop. */
final class DemoSetup {
  private DemoSetup() {}

  /**
   * Fills an empty history with the demo shop (board models, units, cases), marks its board models
   * mains-powered (a mixing desk and a bench supply both plug into the mains), then adds every
   * stage sheet in {@code stages} that its board model's library lacks (the model is made when
   * new).
   */
  static void fill(HistoryStore store, BoardFlags flags, Path stages) {
    DemoHistory.fill(store);
    for (String model : List.of(DemoHistory.MIXER, DemoHistory.SUPPLY)) {
      store.units().findBoardModel(model).ifPresent(m -> flags.setMainsPowered(m.id(), true));
    }
    for (Path file : sheets(stages)) {
      String json;
      try {
        json = Files.readString(file, StandardCharsets.UTF_8);
      } catch (IOException e) {
        throw new UncheckedIOException("could not read the demo stage sheet " + file, e);
      }
      Stage stage = StageSheet.read(json, file.toString());
      String board = stage.board().isBlank() ? "Demo boards" : stage.board();
      BoardModel model = store.units().boardModel(board, "");
      boolean known =
          store.library().sheets(model.id()).stream()
              .anyMatch(sheet -> sheet.title().equals(stage.title()));
      if (!known) {
        store.library().add(model.id(), stage.title(), json);
      }
    }
  }

  /** Returns the stage sheets of a folder, by file name; none when the folder is missing. */
  static List<Path> sheets(Path stages) {
    if (stages == null || !Files.isDirectory(stages)) {
      return List.of();
    }
    try (Stream<Path> files = Files.list(stages)) {
      return files
          .filter(f -> f.getFileName().toString().endsWith(StageSheet.SUFFIX))
          .sorted()
          .toList();
    } catch (IOException e) {
      throw new UncheckedIOException("could not list the demo stage sheets in " + stages, e);
    }
  }
}
