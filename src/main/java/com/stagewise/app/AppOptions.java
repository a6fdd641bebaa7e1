package com.stagewise.app;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.interchange.StageSheet;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * The desktop app's own options: {@code --demo}, {@code --db FILE}, and a stage sheet to open (a
 * {@code *.stage.json} file, as a file manager passes it when the sheet is opened with the app).
 *
 * @param demo whether to start with the demo data
 * @param db the database named by {@code --db}, or null
 * @param sheet the stage sheet to open on the stage screen, or null
 */
record AppOptions(boolean demo, Path db, Path sheet) {

  /**
   * Returns whether every argument is a desktop-app option (so the app, not the command line,
   * starts).
   */
  static boolean isDesktop(String[] args) {
    try {
      parse(List.of(args));
      return true;
    } catch (InvalidInputException e) {
      return false;
    }
  }

  /**
   * Reads the options.
   *
   * @throws InvalidInputException for any other argument, or {@code --db} without a file
   */
  static AppOptions parse(List<String> args) {
    boolean demo = false;
    Path db = null;
    Path sheet = null;
    for (int i = 0; i < args.size(); i++) {
      String arg = args.get(i);
      if (arg.equals("--demo")) {
        demo = true;
      } else if (arg.equals("--db") && i + 1 < args.size()) {
        db = Path.of(args.get(++i));
      } else if (arg.startsWith("--db=")) {
        db = Path.of(arg.substring("--db=".length()));
      } else if (arg.endsWith(StageSheet.SUFFIX) && !arg.startsWith("-") && sheet == null) {
        sheet = Path.of(arg);
      } else {
        throw new InvalidInputException(
            "command line",
            arg,
            "expected --demo, --db FILE or a stage sheet file (" + StageSheet.SUFFIX + ")");
      }
    }
    return new AppOptions(demo, db, sheet);
  }

  /**
   * Returns where the app keeps its files, for this environment.
   *
   * <p>The history database is {@code --db}, else {@code STAGEWISE_DB}, else — with {@code --demo}
   * — a demo database {@code demo/stagewise-demo.db} in the data folder (so that demo data never
   * mixes with a real history), else {@code stagewise.db} in the data folder. The data folder is
   * {@code $XDG_DATA_HOME/stagewise}, else {@code ~/.local/share/stagewise} (DESIGN.md).
   */
  DataFolder folder(Map<String, String> environment, String home) {
    Path data = DataFolder.dataHome(environment, home);
    Path file;
    if (db != null) {
      file = db;
    } else if (environment.get("STAGEWISE_DB") != null
        && !environment.get("STAGEWISE_DB").isBlank()) {
      file = Path.of(environment.get("STAGEWISE_DB"));
    } else if (demo) {
      file = data.resolve("demo").resolve("stagewise-demo.db");
    } else {
      file = data.resolve("stagewise.db");
    }
    return new DataFolder(data, file);
  }
}
