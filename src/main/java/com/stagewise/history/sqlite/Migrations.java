package com.stagewise.history.sqlite;

import com.stagewise.history.StorageException;
import com.stagewise.history.jdbc.Rows;
import com.stagewise.history.jdbc.SqlDialect;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Brings a history file's schema up to the newest version, one numbered SQL script at a time.
 *
 * <p>The scripts are {@code migrations/V<n>__<what>.sql} beside this class; each is applied in its
 * own transaction together with its row in {@code schema_version}, so a file is always at exactly
 * one version. The schema is never changed any other way.
 */
final class Migrations {
  /** The scripts in order; script {@code i} brings the schema to version {@code i + 1}. */
  static final List<String> SCRIPTS =
      List.of(
          "V1__core_tables.sql",
          "V2__full_text_search.sql",
          "V3__sync.sql",
          "V4__ohms_readings.sql",
          "V5__struck_readings.sql",
          "V6__stage_versions.sql",
          "V7__ac_measure.sql",
          "V8__case_photos.sql",
          "V9__after_repair_readings.sql",
          "V10__after_repair_kinds.sql");

  /** The schema version this program writes. */
  static final int LATEST = SCRIPTS.size();

  private Migrations() {}

  /** Returns the file's schema version, 0 for a new, empty file. */
  static int currentVersion(Database database) throws SQLException {
    int tables =
        database.queryInt(
            "SELECT count(*) FROM sqlite_master WHERE type = 'table' AND name = 'schema_version'");
    return tables == 0
        ? 0
        : database.queryInt("SELECT coalesce(max(version), 0) FROM schema_version");
  }

  /**
   * Refuses a file whose schema this program does not know (too new), without changing it.
   *
   * @throws StorageException if the file was made by a newer program
   */
  static int requireKnown(Database database) {
    int version = database.read("read the schema version", connection -> currentVersion(database));
    if (version > LATEST) {
      throw StorageException.unusableFile(
          "The history database "
              + database.path()
              + " was made by a newer Stagewise (schema version "
              + version
              + ", this program knows up to "
              + LATEST
              + "). It was left as it is; use the newer program.");
    }
    return version;
  }

  /** Returns SQLite's own integrity check of the file: {@code ok}, or what is wrong. */
  static String integrityCheck(Connection connection) throws SQLException {
    try (Rows rows = new Rows(connection, SqlDialect.SQLITE)) {
      return String.join("; ", rows.query("PRAGMA integrity_check", rs -> rs.getString(1)));
    }
  }

  /**
   * Applies every script the file lacks, up to {@code target}.
   *
   * @throws StorageException if the file was made by a newer program, or a script fails (the file
   *     is then left at the last version that was applied completely)
   */
  static void migrate(Database database, int target, long nowMillis) {
    int version = requireKnown(database);
    for (int next = version + 1; next <= target; next++) {
      int step = next;
      String script = SCRIPTS.get(step - 1);
      List<String> statements = statements(load(script));
      database.write(
          "update the schema to version " + step,
          connection -> {
            // Another program may have migrated the file while this one waited for the lock.
            if (currentVersion(database) >= step) {
              return null;
            }
            if (step == 1) {
              run(connection, "PRAGMA application_id = " + Database.APPLICATION_ID);
              run(
                  connection,
                  "CREATE TABLE schema_version (version INTEGER PRIMARY KEY, "
                      + "applied_at INTEGER NOT NULL, script TEXT NOT NULL)");
            }
            for (String statement : statements) {
              run(connection, statement);
            }
            try (PreparedStatement insert =
                connection.prepareStatement(
                    "INSERT INTO schema_version (version, applied_at, script) VALUES (?, ?, ?)")) {
              insert.setInt(1, step);
              insert.setLong(2, nowMillis);
              insert.setString(3, script);
              insert.executeUpdate();
            }
            return null;
          });
    }
  }

  private static void run(Connection connection, String sql) throws SQLException {
    try (PreparedStatement statement = connection.prepareStatement(sql)) {
      statement.execute();
    }
  }

  private static String load(String script) {
    try (InputStream in = Migrations.class.getResourceAsStream("migrations/" + script)) {
      if (in == null) {
        throw new IllegalStateException("missing migration script " + script);
      }
      return new String(in.readAllBytes(), StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new IllegalStateException("cannot read migration script " + script, e);
    }
  }

  /**
   * Splits a script into statements: a statement ends with a line ending in {@code ;}, except
   * inside a trigger body, which ends with {@code END;}. Lines starting with {@code --} are
   * comments.
   */
  static List<String> statements(String script) {
    List<String> statements = new ArrayList<>();
    StringBuilder current = new StringBuilder();
    boolean inTrigger = false;
    for (String line : script.split("\n")) {
      String trimmed = line.strip();
      if (trimmed.isEmpty() || trimmed.startsWith("--")) {
        continue;
      }
      if (current.length() == 0 && trimmed.toUpperCase(Locale.ROOT).startsWith("CREATE TRIGGER")) {
        inTrigger = true;
      }
      current.append(line).append('\n');
      boolean ends =
          inTrigger ? trimmed.toUpperCase(Locale.ROOT).equals("END;") : trimmed.endsWith(";");
      if (ends) {
        statements.add(current.toString().strip());
        current.setLength(0);
        inTrigger = false;
      }
    }
    if (current.length() > 0) {
      throw new IllegalStateException("migration script ends inside a statement: " + current);
    }
    return statements;
  }
}
