package com.stagewise.history.postgres;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.ExportSelection;
import com.stagewise.history.ImportReport;
import com.stagewise.history.Transfer;
import com.stagewise.history.jdbc.Exporter;
import com.stagewise.history.jdbc.Importer;
import com.stagewise.history.jdbc.SqlDialect;
import com.stagewise.history.record.HistoryBundle;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/** Export and import on the shop server; backups of a server are the server's own (pg_dump). */
final class PgTransfer implements Transfer {
  private static final List<String> TABLES =
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
          "after_repair_reading",
          "schema_version");

  private final PgHistory history;

  PgTransfer(PgHistory history) {
    this.history = history;
  }

  @Override
  public HistoryBundle export(ExportSelection selection, String programVersion) {
    Instant now = history.clock().instant();
    return history.read(
        "export", c -> Exporter.export(c, SqlDialect.POSTGRES, selection, programVersion, now));
  }

  @Override
  public ImportReport importBundle(HistoryBundle bundle, String source) {
    Instant now = history.clock().instant();
    return history.write(
        "import", c -> new Importer(c, SqlDialect.POSTGRES, source, now).run(bundle));
  }

  /**
   * A server is not copied to a file by a bench.
   *
   * @throws InvalidInputException always, saying how a server is backed up
   */
  @Override
  public void backupTo(Path target) {
    throw new InvalidInputException(
        history.location(),
        "backup",
        "a shop server is backed up on the server with PostgreSQL's own tools (pg_dump);"
            + " 'history backup' copies a bench's file");
  }

  /**
   * A server is not replaced from a bench's file.
   *
   * @throws InvalidInputException always, saying how a server is restored
   */
  @Override
  public Path restoreFrom(Path backup) {
    throw new InvalidInputException(
        history.location(),
        "restore",
        "a shop server is restored on the server with PostgreSQL's own tools (pg_restore);"
            + " 'history restore' replaces a bench's file");
  }

  /**
   * Returns {@code ok} when the shop's schema is at the version this program writes, every table is
   * there and every constraint is validated (the server enforces them on every write), else what is
   * wrong.
   */
  @Override
  public String integrityCheck() {
    String schema = history.database().address().schema();
    return history.read(
        "check the schema",
        c -> {
          List<String> problems = new ArrayList<>();
          int version = PgMigrations.currentVersion(c, schema);
          if (version != PgMigrations.LATEST) {
            problems.add(
                "schema version " + version + ", this program writes " + PgMigrations.LATEST);
          }
          for (String table : TABLES) {
            if (PgDatabase.queryInt(
                    c,
                    "SELECT count(*) FROM pg_tables WHERE schemaname = ? AND tablename = ?",
                    schema,
                    table)
                == 0) {
              problems.add("table " + table + " is missing");
            }
          }
          int unchecked =
              PgDatabase.queryInt(
                  c,
                  "SELECT count(*) FROM pg_constraint k JOIN pg_namespace n ON n.oid ="
                      + " k.connamespace WHERE n.nspname = ? AND NOT k.convalidated",
                  schema);
          if (unchecked > 0) {
            problems.add(unchecked + " constraints are not validated");
          }
          return problems.isEmpty() ? "ok" : String.join("; ", problems);
        });
  }
}
