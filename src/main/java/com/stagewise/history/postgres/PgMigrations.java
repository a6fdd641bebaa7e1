package com.stagewise.history.postgres;

import com.stagewise.history.StorageException;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;

/**
 * Brings a shop's schema on the server up to the newest version, one numbered SQL script at a time,
 * as the bench's file is (scripts {@code migrations/V<n>__<what>.sql} beside this class, each in
 * its own transaction together with its row in {@code schema_version}).
 */
final class PgMigrations {
  /** The scripts in order; script {@code i} brings the schema to version {@code i + 1}. */
  static final List<String> SCRIPTS =
      List.of(
          "V1__core_tables.sql",
          "V2__full_text_search.sql",
          "V3__change_numbers.sql",
          "V4__ohms_readings.sql",
          "V5__struck_readings.sql",
          "V6__stage_versions.sql",
          "V7__ac_measure.sql",
          "V8__case_photos.sql",
          "V9__after_repair_readings.sql",
          "V10__after_repair_kinds.sql");

  /** The schema version this program writes. */
  static final int LATEST = SCRIPTS.size();

  private PgMigrations() {}

  /** Returns whether the shop's schema exists on the server. */
  static boolean schemaExists(Connection c, String schema) throws SQLException {
    return PgDatabase.queryInt(c, "SELECT count(*) FROM pg_namespace WHERE nspname = ?", schema)
        > 0;
  }

  /**
   * Returns the schema's version: 0 for an empty schema, -1 for a schema that holds other tables
   * but no {@code schema_version} (not a shop's schema).
   */
  static int currentVersion(Connection c, String schema) throws SQLException {
    int marker =
        PgDatabase.queryInt(
            c,
            "SELECT count(*) FROM pg_tables WHERE schemaname = ? AND tablename = 'schema_version'",
            schema);
    if (marker == 0) {
      int tables =
          PgDatabase.queryInt(c, "SELECT count(*) FROM pg_tables WHERE schemaname = ?", schema);
      return tables == 0 ? 0 : -1;
    }
    return PgDatabase.queryInt(c, "SELECT coalesce(max(version), 0) FROM schema_version");
  }

  /**
   * Creates the shop's schema if missing and applies every script it lacks.
   *
   * @throws StorageException if the schema belongs to something else, was made by a newer program,
   *     or this user may not change it (the message says to run {@code history server-init} as the
   *     shop's administrator)
   */
  static void migrate(PgDatabase database, long nowMillis) {
    migrate(database, nowMillis, LATEST);
  }

  /** Applies the scripts the schema lacks up to version {@code target} (for fixtures). */
  static void migrate(PgDatabase database, long nowMillis, int target) {
    String schema = database.address().schema();
    int version = database.read("read the schema version", c -> versionOf(c, schema));
    if (version == NO_USAGE) {
      throw new StorageException(
          "Shop server "
              + database.address()
              + ": this user may not use the shop's schema "
              + schema
              + ". Ask the shop's administrator to run 'stagewise history server-init --grant"
              + " ROLE' for this bench's role. The bench keeps working on its own file.");
    }
    requireKnown(database, version);
    if (version >= target) {
      return;
    }
    for (int next = Math.max(version, 0) + 1; next <= target; next++) {
      int step = next;
      String script = SCRIPTS.get(step - 1);
      String text = load(script);
      try {
        database.write(
            "update the server's schema to version " + step,
            c -> {
              if (!schemaExists(c, schema)) {
                try (Statement create = c.createStatement()) {
                  create.execute("CREATE SCHEMA " + schema);
                }
              }
              if (currentVersion(c, schema) >= step) {
                return null;
              }
              try (Statement statement = c.createStatement()) {
                if (step == 1) {
                  statement.execute(
                      "CREATE TABLE schema_version (version INTEGER PRIMARY KEY,"
                          + " applied_at BIGINT NOT NULL, script TEXT NOT NULL)");
                }
                statement.execute(text);
              }
              try (PreparedStatement insert =
                  c.prepareStatement(
                      "INSERT INTO schema_version (version, applied_at, script) VALUES (?, ?, ?)")) {
                insert.setInt(1, step);
                insert.setLong(2, nowMillis);
                insert.setString(3, script);
                insert.executeUpdate();
              }
              return null;
            });
      } catch (StorageException e) {
        if (e.getCause() instanceof SQLException se && "42501".equals(se.getSQLState())) {
          throw new StorageException(
              "Shop server "
                  + database.address()
                  + ": the shop's schema is at version "
                  + Math.max(version, 0)
                  + " and this program needs version "
                  + LATEST
                  + ", but this user may not update it. Ask the shop's administrator to run"
                  + " 'stagewise history server-init' with this program. The bench keeps working"
                  + " on its own file.",
              e);
        }
        throw e;
      }
    }
  }

  /** What {@link #versionOf} returns for a schema that this user may not use. */
  private static final int NO_USAGE = -2;

  private static int versionOf(Connection c, String schema) throws SQLException {
    if (!schemaExists(c, schema)) {
      return 0;
    }
    if (PgDatabase.queryInt(
            c, "SELECT CASE WHEN has_schema_privilege(?, 'USAGE') THEN 1 ELSE 0 END", schema)
        == 0) {
      return NO_USAGE;
    }
    return currentVersion(c, schema);
  }

  /**
   * Refuses a schema that is not a shop's, or was made by a newer program.
   *
   * @throws StorageException saying which
   */
  static void requireKnown(PgDatabase database, int version) {
    if (version < 0) {
      throw new StorageException(
          "Shop server "
              + database.address()
              + ": the schema "
              + database.address().schema()
              + " holds other tables and is not a Stagewise shop's schema. It was left as it is;"
              + " name another schema in the address (?schema=NAME).");
    }
    if (version > LATEST) {
      throw new StorageException(
          "Shop server "
              + database.address()
              + " was set up by a newer Stagewise (schema version "
              + version
              + ", this program knows up to "
              + LATEST
              + "). Use the newer program on this bench; it keeps working on its own file.");
    }
  }

  private static String load(String script) {
    try (InputStream in = PgMigrations.class.getResourceAsStream("migrations/" + script)) {
      if (in == null) {
        throw new IllegalStateException("missing migration script " + script);
      }
      return new String(in.readAllBytes(), StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new IllegalStateException("cannot read migration script " + script, e);
    }
  }
}
