package com.stagewise.history.postgres;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.ServerAddress;
import com.stagewise.history.StorageException;
import com.stagewise.history.jdbc.Rows;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;

/**
 * Sets up a shop's schema on the server ({@code history server-init}) and says in plain words what
 * is wrong with a bench's connection to it ({@code history server-check}).
 */
public final class ServerCheck {
  /** Tables a bench reads, adds to and updates. */
  private static final List<String> BENCH_TABLES =
      List.of(
          "board_model",
          "stage_sheet",
          "unit",
          "repair_case",
          "confirmed_fault",
          "case_part",
          "reading",
          "suspect_list",
          "suspect",
          "repair_action",
          "case_note",
          "case_photo",
          "after_repair_reading");

  /** Tables whose rows a bench rewrites (a case's faults and parts on close-out or merge). */
  private static final List<String> REWRITTEN = List.of("confirmed_fault", "case_part");

  private static final Pattern ROLE = Pattern.compile("[a-z_][a-z0-9_]{0,62}");

  private ServerCheck() {}

  /**
   * What {@link #check} found.
   *
   * @param ok whether the bench can sync with the server
   * @param lines one plain sentence per finding, in order
   */
  public record Report(boolean ok, List<String> lines) {}

  /**
   * Creates the shop's schema (or brings it up to date) and grants each named bench role exactly
   * what a bench needs: to read the shop's records, add them and update them, and to rewrite a
   * case's list of faults and parts. No role gets the right to drop or alter tables, or to see
   * another shop's schema.
   *
   * @return one sentence per step done
   * @throws InvalidInputException if a role name is not a plain lower-case name
   * @throws StorageException saying why the server refused
   */
  public static List<String> initialise(
      ServerAddress address, Clock clock, Map<String, String> environment, List<String> roles) {
    for (String role : roles) {
      if (!ROLE.matcher(role).matches()) {
        throw new InvalidInputException(
            "--grant",
            "role",
            "expected a plain lower-case role name (letters, digits, _), got '" + role + "'");
      }
    }
    List<String> done = new ArrayList<>();
    try (PgHistory history = PgHistory.open(address, clock, environment)) {
      done.add(
          "The shop's schema "
              + address.schema()
              + " is at version "
              + history.schemaVersion()
              + " (the newest this program knows).");
      PgDatabase database = history.database();
      for (String role : roles) {
        database.write(
            "grant the bench's rights to " + role,
            c -> {
              try (Statement s = c.createStatement()) {
                String schema = address.schema();
                s.execute("GRANT USAGE ON SCHEMA " + schema + " TO " + role);
                s.execute(
                    "GRANT SELECT, INSERT, UPDATE ON "
                        + String.join(", ", BENCH_TABLES)
                        + " TO "
                        + role);
                s.execute("GRANT SELECT ON schema_version TO " + role);
                s.execute("GRANT DELETE ON " + String.join(", ", REWRITTEN) + " TO " + role);
                s.execute(
                    "GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA " + schema + " TO " + role);
              }
              return null;
            });
        done.add("Granted " + role + " a bench's rights on " + address.schema() + ".");
      }
    }
    return done;
  }

  /** Checks a bench's connection to the server and its rights there, without changing anything. */
  public static Report check(ServerAddress address, Map<String, String> environment) {
    List<String> lines = new ArrayList<>();
    Connection connection;
    try {
      connection = PgDatabase.open(address, environment);
    } catch (SQLException e) {
      lines.add(ServerProblems.translate(address, e, "connect").getMessage());
      return new Report(false, lines);
    }
    boolean ok = true;
    try (Connection c = connection) {
      lines.add(
          "Reached "
              + address
              + " as "
              + text(c, "SELECT current_user")
              + " (PostgreSQL "
              + text(c, "SHOW server_version")
              + ", "
              + (bool(
                      c,
                      "SELECT coalesce((SELECT ssl FROM pg_stat_ssl WHERE pid = pg_backend_pid()), false)")
                  ? "encrypted with TLS"
                  : "not encrypted: the server offers no TLS")
              + ").");
      String schema = address.schema();
      if (!PgMigrations.schemaExists(c, schema)) {
        lines.add(
            "The server has no shop schema "
                + schema
                + " yet: the shop's administrator sets it up with 'stagewise history server-init'.");
        return new Report(false, lines);
      }
      if (!bool(c, "SELECT has_schema_privilege(?, 'USAGE')", schema)) {
        lines.add(
            "This user may not use the shop's schema "
                + schema
                + ": ask the administrator to run 'history server-init --grant "
                + text(c, "SELECT current_user")
                + "'.");
        return new Report(false, lines);
      }
      int version = PgMigrations.currentVersion(c, schema);
      if (version < 0) {
        lines.add(
            "The schema " + schema + " holds other tables: it is not a Stagewise shop's schema.");
        return new Report(false, lines);
      } else if (version < PgMigrations.LATEST) {
        lines.add(
            "The server's schema is older (version "
                + version
                + ") than this program's ("
                + PgMigrations.LATEST
                + "): the administrator updates it with 'stagewise history server-init'.");
        ok = false;
      } else if (version > PgMigrations.LATEST) {
        lines.add(
            "The server's schema is newer (version "
                + version
                + ") than this program knows ("
                + PgMigrations.LATEST
                + "): use the newer Stagewise on this bench.");
        ok = false;
      } else {
        lines.add("The shop's schema " + schema + " is up to date (version " + version + ").");
      }
      List<String> missing = new ArrayList<>();
      for (String table : BENCH_TABLES) {
        if (!exists(c, schema, table)) {
          continue;
        }
        String qualified = schema + "." + table;
        for (String right : List.of("SELECT", "INSERT", "UPDATE")) {
          if (!bool(c, "SELECT has_table_privilege(?, '" + right + "')", qualified)) {
            missing.add(right + " on " + table);
          }
        }
        if (REWRITTEN.contains(table)
            && !bool(c, "SELECT has_table_privilege(?, 'DELETE')", qualified)) {
          missing.add("DELETE on " + table);
        }
      }
      if (missing.isEmpty()) {
        lines.add("This user has every right a bench needs.");
      } else {
        ok = false;
        lines.add(
            "This user lacks rights a bench needs ("
                + String.join(", ", missing)
                + "): ask the administrator to run 'history server-init --grant ROLE'.");
      }
      return new Report(ok, lines);
    } catch (SQLException e) {
      lines.add(ServerProblems.translate(address, e, "check the server").getMessage());
      return new Report(false, lines);
    }
  }

  private static boolean exists(Connection c, String schema, String table) throws SQLException {
    return PgDatabase.queryInt(
            c,
            "SELECT count(*) FROM pg_tables WHERE schemaname = ? AND tablename = ?",
            schema,
            table)
        > 0;
  }

  private static String text(Connection c, String sql) throws SQLException {
    try (PreparedStatement s = c.prepareStatement(sql);
        ResultSet rs = s.executeQuery()) {
      rs.next();
      return rs.getString(1);
    }
  }

  private static boolean bool(Connection c, String sql, Object... parameters) throws SQLException {
    try (PreparedStatement s = c.prepareStatement(sql)) {
      Rows.bind(s, parameters);
      try (ResultSet rs = s.executeQuery()) {
        rs.next();
        return rs.getBoolean(1);
      }
    }
  }
}
