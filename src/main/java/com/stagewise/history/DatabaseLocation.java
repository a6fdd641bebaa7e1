package com.stagewise.history;

import java.nio.file.Path;
import java.util.Map;

/**
 * Where the history database lives: the file given on the command line ({@code --db}), else the
 * environment variable {@code STAGEWISE_DB}, else {@code $XDG_DATA_HOME/stagewise/stagewise.db},
 * else {@code ~/.local/share/stagewise/stagewise.db} (DESIGN.md).
 */
public final class DatabaseLocation {
  /** The environment variable that names the history database. */
  public static final String ENVIRONMENT_VARIABLE = "STAGEWISE_DB";

  /** The database's file name inside the data folder. */
  public static final String FILE_NAME = "stagewise.db";

  private DatabaseLocation() {}

  /** Returns the database file for this process's environment and home folder. */
  public static Path resolve(Path explicitOrNull) {
    return resolve(explicitOrNull, System.getenv(), System.getProperty("user.home"));
  }

  /**
   * Returns the database file for the given option, environment and home folder.
   *
   * @param explicitOrNull the {@code --db} option, or null
   */
  public static Path resolve(Path explicitOrNull, Map<String, String> environment, String home) {
    if (explicitOrNull != null) {
      return explicitOrNull;
    }
    String fromEnvironment = environment.get(ENVIRONMENT_VARIABLE);
    if (fromEnvironment != null && !fromEnvironment.isBlank()) {
      return Path.of(fromEnvironment);
    }
    String dataHome = environment.get("XDG_DATA_HOME");
    // The XDG base directory specification says a relative XDG_DATA_HOME is invalid and ignored.
    if (dataHome != null && !dataHome.isBlank() && Path.of(dataHome).isAbsolute()) {
      return Path.of(dataHome, "stagewise", FILE_NAME);
    }
    return Path.of(home, ".local", "share", "stagewise", FILE_NAME);
  }
}
