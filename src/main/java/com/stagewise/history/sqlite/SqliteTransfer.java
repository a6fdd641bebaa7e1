package com.stagewise.history.sqlite;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.ExportSelection;
import com.stagewise.history.ImportReport;
import com.stagewise.history.Transfer;
import com.stagewise.history.jdbc.Exporter;
import com.stagewise.history.jdbc.Importer;
import com.stagewise.history.jdbc.SqlDialect;
import com.stagewise.history.record.HistoryBundle;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import org.sqlite.SQLiteConnection;

/** Export, import, backup and restore of the SQLite file. */
final class SqliteTransfer implements Transfer {
  private final SqliteHistory history;

  SqliteTransfer(SqliteHistory history) {
    this.history = history;
  }

  @Override
  public HistoryBundle export(ExportSelection selection, String programVersion) {
    Instant now = history.clock().instant();
    return history.read(
        "export", c -> Exporter.export(c, SqlDialect.SQLITE, selection, programVersion, now));
  }

  @Override
  public ImportReport importBundle(HistoryBundle bundle, String source) {
    Instant now = history.clock().instant();
    return history.write(
        "import", c -> new Importer(c, SqlDialect.SQLITE, source, now).run(bundle));
  }

  @Override
  public void backupTo(Path target) {
    synchronized (history) {
      Path file = target.toAbsolutePath().normalize();
      if (Files.exists(file)) {
        throw new InvalidInputException(
            file.toString(), "", "already exists; choose a new file name for the backup");
      }
      history
          .database()
          .outsideTransaction(
              "make a backup",
              c -> {
                try (var statement = c.prepareStatement("VACUUM INTO ?")) {
                  statement.setString(1, file.toString());
                  statement.execute();
                }
                return null;
              });
    }
  }

  @Override
  public Path restoreFrom(Path backup) {
    Path source = backup.toAbsolutePath().normalize();
    if (!Files.isRegularFile(source)) {
      throw new InvalidInputException(source.toString(), "", "no such backup file");
    }
    try {
      if (Files.size(source) == 0) {
        throw new InvalidInputException(
            source.toString(), "", "the file is empty, not a backup; nothing was restored");
      }
    } catch (IOException e) {
      throw new InvalidInputException(source.toString(), "", "cannot read the backup file");
    }
    checkBackup(source);
    synchronized (history) {
      Path file = history.file();
      String stamp = history.clock().instant().toString().replace(":", "").replace(".", "");
      Path saved = file.resolveSibling(file.getFileName() + ".before-restore-" + stamp);
      backupTo(saved);
      Database database = history.database();
      database.outsideTransaction(
          "restore from a backup",
          c -> {
            // SQLite's online backup, run backwards: copies every page of the backup into this
            // file under its write lock, so other programs see either the old or the restored
            // history.
            c.unwrap(SQLiteConnection.class).getDatabase().restore("main", source.toString(), null);
            return null;
          });
      Migrations.migrate(database, Migrations.LATEST, history.clock().millis());
      return saved;
    }
  }

  /** Refuses a backup that is not a sound history file of a schema this program reads. */
  private static void checkBackup(Path source) {
    try (Database candidate = Database.openReadOnly(source)) {
      int version = candidate.read("read the backup", c -> Migrations.currentVersion(candidate));
      if (version == 0 || version > Migrations.LATEST) {
        throw new InvalidInputException(
            source.toString(),
            "",
            "not a backup of a history this program can read (schema version "
                + version
                + "); nothing was restored");
      }
      String check = candidate.read("check the backup", Migrations::integrityCheck);
      if (!check.equals("ok")) {
        throw new InvalidInputException(
            source.toString(), "", "the backup is damaged (" + check + "); nothing was restored");
      }
    }
  }

  @Override
  public String integrityCheck() {
    return history.read("check the file", Migrations::integrityCheck);
  }
}
