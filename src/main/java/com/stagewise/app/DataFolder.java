package com.stagewise.app;

import java.nio.file.Path;
import java.util.Map;

/**
 * Where the app keeps its files.
 *
 * @param data the data folder: the settings live here
 * @param database the history database file
 */
record DataFolder(Path data, Path database) {

  /** Returns {@code $XDG_DATA_HOME/stagewise}, else {@code ~/.local/share/stagewise}. */
  static Path dataHome(Map<String, String> environment, String home) {
    String xdg = environment.get("XDG_DATA_HOME");
    // The XDG base directory specification says a relative XDG_DATA_HOME is to be ignored.
    if (xdg != null && !xdg.isBlank() && Path.of(xdg).isAbsolute()) {
      return Path.of(xdg, "stagewise");
    }
    return Path.of(home, ".local", "share", "stagewise");
  }

  /** Returns the settings file. */
  Path settings() {
    return data.resolve("settings.properties");
  }

  /** Returns the folder that keeps where open cases were left, beside the database. */
  Path openCases() {
    Path parent = database.toAbsolutePath().getParent();
    return parent.resolve(database.getFileName() + ".open-cases");
  }
}
