package com.stagewise.reference;

import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.StageSheet;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

/**
 * The stages checked against the reference simulator: every template's default stage, every demo
 * sheet in {@code data/stages/}, and the hand-built stages of {@link HandStages}.
 */
final class ReferenceStages {
  private ReferenceStages() {}

  /**
   * Where a stage comes from.
   *
   * @param kind {@code template}, {@code sheet} or {@code hand}
   * @param id the template id, the sheet's path from the project root, or the hand-built id
   */
  record Source(String kind, String id) {
    /** Returns a file-name-safe name, e.g. {@code template-inverting}. */
    String name() {
      String base = id.replaceAll("^.*/", "").replace(".stage.json", "");
      return kind.equals("hand") ? base : kind + "-" + base;
    }
  }

  /** A stage with where it comes from. */
  record Named(Source source, Stage stage) {}

  /** The demo stage library, from the project root. */
  static final Path SHEETS = Path.of("data", "stages");

  /** Returns every stage to check, in a fixed order: templates, sheets, hand-built stages. */
  static List<Named> all() {
    List<Named> all = new ArrayList<>();
    for (StageTemplate template : Templates.all()) {
      all.add(new Named(new Source("template", template.name()), template.build()));
    }
    for (Path sheet : sheets()) {
      String id = SHEETS.resolve(sheet.getFileName()).toString().replace('\\', '/');
      all.add(new Named(new Source("sheet", id), StageSheet.read(sheet)));
    }
    for (Map.Entry<String, Stage> hand : HandStages.all().entrySet()) {
      all.add(new Named(new Source("hand", hand.getKey()), hand.getValue()));
    }
    return all;
  }

  private static List<Path> sheets() {
    try (Stream<Path> files = Files.list(SHEETS)) {
      return files
          .filter(f -> f.getFileName().toString().endsWith(StageSheet.SUFFIX))
          .sorted()
          .toList();
    } catch (IOException e) {
      throw new UncheckedIOException("cannot list the demo sheets in " + SHEETS, e);
    }
  }

  /**
   * Returns the stage a source names.
   *
   * @throws IllegalArgumentException if there is no such stage any more
   */
  static Stage resolve(Source source) {
    return all().stream()
        .filter(n -> n.source().equals(source))
        .map(Named::stage)
        .findFirst()
        .orElseThrow(() -> new IllegalArgumentException("no stage " + source));
  }
}
