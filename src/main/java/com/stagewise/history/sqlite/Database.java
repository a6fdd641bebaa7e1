package com.stagewise.history.sqlite;

import com.stagewise.history.StorageException;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Properties;
import org.sqlite.SQLiteErrorCode;
import org.sqlite.SQLiteException;
import org.sqlite.SQLiteOpenMode;

/**
 * One connection to the history file, with the settings every use needs and the transactions.
 *
 * <p>Settings: write-ahead log (readers never wait for the writer), foreign keys on, a busy timeout
 * so that a second program writing the same file waits instead of failing, and {@code synchronous =
 * FULL} so that a transaction reported committed survives a power cut (with {@code NORMAL} the last
 * transactions before the cut may roll back). Writes take the write lock at their start ({@code
 * BEGIN IMMEDIATE}): a transaction that reads first and upgrades later could fail with "database is
 * locked" without waiting.
 *
 * <p>Not thread-safe by itself; {@link SqliteHistory} serialises its use.
 */
final class Database implements AutoCloseable {
  /**
   * Marks our files in the SQLite header ("SWH1"), so that another program's database is refused.
   */
  static final int APPLICATION_ID = 0x53574831;

  /** How long a statement waits for another program's write lock before it reports busy. */
  static final int BUSY_TIMEOUT_MS = 10_000;

  /** The page cache per connection, in KiB. */
  static final int CACHE_KIB = 65_536;

  /** Retries of a whole write transaction that still found the file busy, with growing pauses. */
  private static final int WRITE_ATTEMPTS = 6;

  private static final byte[] SQLITE_MAGIC =
      "SQLite format 3\0".getBytes(java.nio.charset.StandardCharsets.US_ASCII);

  /** What to do about a damaged file (a backup is a complete history file of its own). */
  static final String RESTORE_HINT =
      "To restore a backup, move the damaged file aside and copy the backup in its place;"
          + " commands that only read (list, show, search, export) may still read what is left.";

  private final Path path;
  private final Connection connection;
  private final boolean readOnly;
  private boolean inTransaction;

  private Database(Path path, Connection connection, boolean readOnly) {
    this.path = path;
    this.connection = connection;
    this.readOnly = readOnly;
  }

  /** A unit of work inside a transaction. */
  @FunctionalInterface
  interface Work<T> {
    T run(Connection connection) throws SQLException;
  }

  /**
   * Opens (or creates) the database file at {@code path} and checks that it is one of ours.
   *
   * <p>Nothing is written to a file that is not an SQLite database or that belongs to another
   * program; such a file is refused with a message that says so.
   *
   * @throws StorageException if the file or its folder cannot be used
   */
  static Database open(Path path) {
    Path file = path.toAbsolutePath().normalize();
    checkBeforeOpening(file);
    Database database = connect(file, false, false);
    try {
      database.checkOwnership();
      // Refuse a newer schema before anything is written: even switching the journal mode
      // rewrites the file's header.
      Migrations.requireKnown(database);
      database.requireUndamaged();
      try (PreparedStatement wal =
              database.connection.prepareStatement("PRAGMA journal_mode = WAL");
          ResultSet rs = wal.executeQuery()) {
        rs.next();
      }
      // A page cache of 64 MiB (default 2 MiB): an import of thousands of cases touches index pages
      // all over the file (ids are random), and a small cache spills them to the log
      // mid-transaction.
      database.execute("PRAGMA cache_size = -" + CACHE_KIB);
      return database;
    } catch (SQLException | RuntimeException e) {
      database.closeQuietly();
      throw e instanceof StorageException se ? se : translate(file, e, "open");
    }
  }

  /**
   * Opens an existing database file for reading only: nothing is created beside it and nothing in
   * it changes, so a file on read-only media or in a read-only folder can be read. Every write
   * through it is refused.
   *
   * @throws StorageException if the file is missing, not an SQLite file, or another program's
   */
  static Database openReadOnly(Path path) {
    Path file = path.toAbsolutePath().normalize();
    if (!Files.exists(file)) {
      throw StorageException.unusableFile(
          "The history database "
              + file
              + " does not exist: nothing has been recorded there yet. Choose another file with"
              + " --db or STAGEWISE_DB.");
    }
    checkRegularSqliteFile(file);
    // In a folder where SQLite cannot make its shared-memory file, open the file as immutable:
    // nobody can be writing it there, and without the flag SQLite could not open it at all.
    Path folder = file.getParent();
    boolean immutable =
        !Files.exists(file.resolveSibling(file.getFileName() + "-shm"))
            && (folder == null || !canCreateIn(folder));
    Database database = connect(file, true, immutable);
    try {
      database.checkOwnership();
      return database;
    } catch (RuntimeException e) {
      database.closeQuietly();
      throw e;
    } catch (SQLException e) {
      database.closeQuietly();
      throw translate(file, e, "open");
    }
  }

  private static Database connect(Path file, boolean readOnly, boolean immutable) {
    Properties settings = new Properties();
    settings.setProperty("busy_timeout", Integer.toString(BUSY_TIMEOUT_MS));
    settings.setProperty("foreign_keys", "true");
    settings.setProperty("synchronous", "FULL");
    if (readOnly) {
      settings.setProperty("open_mode", Integer.toString(SQLiteOpenMode.READONLY.flag));
    }
    String url =
        immutable
            ? "jdbc:sqlite:"
                + file.toUri().toString().replaceFirst("^file://", "file:")
                + "?immutable=1"
            : "jdbc:sqlite:" + file;
    try {
      return new Database(file, DriverManager.getConnection(url, settings), readOnly);
    } catch (SQLException e) {
      throw translate(file, e, "open");
    }
  }

  private static void checkBeforeOpening(Path file) {
    Path folder = file.getParent();
    if (Files.isDirectory(file)) {
      throw StorageException.unusableFile(
          "The history database " + file + " is a folder, not a file.");
    }
    if (!Files.exists(file)) {
      if (folder == null || !Files.isDirectory(folder)) {
        try {
          Files.createDirectories(folder);
        } catch (IOException | RuntimeException e) {
          throw StorageException.unusableFile(
              "Cannot create the folder " + folder + " for the history database: " + e.getMessage(),
              e);
        }
      }
      if (!canCreateIn(folder)) {
        throw StorageException.unusableFile(
            "Cannot create the history database in "
                + folder
                + ": the folder is not writable. Choose another file with --db or STAGEWISE_DB.");
      }
      return;
    }
    checkRegularSqliteFile(file);
    if (!Files.isWritable(file) || !canCreateIn(folder)) {
      throw StorageException.unusableFile(
          "The history database "
              + file
              + " cannot be written: the file or its folder is read-only (the database needs to"
              + " write its log file beside it). Copy it to a writable folder, or fix the permissions.");
    }
  }

  /**
   * Refuses anything but a regular file that is empty or starts with SQLite's header, without
   * writing to it (and without blocking on a named pipe or a device).
   */
  private static void checkRegularSqliteFile(Path file) {
    if (!Files.isRegularFile(file)) {
      throw StorageException.unusableFile(
          "The history database "
              + file
              + " is not a regular file (a device, a named pipe or a socket). It was left as it is;"
              + " choose another file with --db or STAGEWISE_DB.");
    }
    byte[] head = new byte[SQLITE_MAGIC.length];
    int read;
    try (InputStream in = Files.newInputStream(file)) {
      read = in.readNBytes(head, 0, head.length);
    } catch (IOException e) {
      throw StorageException.unusableFile(
          "Cannot read the history database " + file + ": " + e.getMessage(), e);
    }
    // An empty file is what SQLite itself makes for a new database; anything else must be one.
    if (read > 0 && (read < head.length || !Arrays.equals(head, SQLITE_MAGIC))) {
      throw StorageException.unusableFile(
          "The file "
              + file
              + " is not a Stagewise history database (it is not an SQLite file). "
              + "It was left as it is; choose another file with --db or STAGEWISE_DB.");
    }
  }

  /**
   * Returns whether a new file can be made in {@code folder} (tries it, since root ignores modes).
   */
  private static boolean canCreateIn(Path folder) {
    if (!Files.isWritable(folder)) {
      return false;
    }
    try {
      Path probe = Files.createTempFile(folder, ".stagewise-probe", ".tmp");
      Files.delete(probe);
      return true;
    } catch (IOException | RuntimeException e) {
      return false;
    }
  }

  private void checkOwnership() throws SQLException {
    int applicationId = queryInt("PRAGMA application_id");
    int objects = queryInt("SELECT count(*) FROM sqlite_master");
    if (applicationId != APPLICATION_ID && !(applicationId == 0 && objects == 0)) {
      throw StorageException.unusableFile(
          "The file "
              + path
              + " is an SQLite database, but not a Stagewise history database. It was left as it"
              + " is; choose another file with --db or STAGEWISE_DB.");
    }
  }

  /**
   * Refuses a damaged file before anything is written to it: SQLite's {@code quick_check} reads
   * every page (not the indexes' agreement with their tables, which the full check adds), so that a
   * write cannot succeed on the sound pages of a file whose other pages are broken. It costs one
   * read of the file, done once when a history is opened for writing.
   */
  private void requireUndamaged() throws SQLException {
    List<String> problems = new ArrayList<>();
    try (PreparedStatement check = connection.prepareStatement("PRAGMA quick_check(5)");
        ResultSet rs = check.executeQuery()) {
      while (rs.next()) {
        problems.add(rs.getString(1));
      }
    }
    if (!problems.equals(List.of("ok"))) {
      throw StorageException.unusableFile(
          "The history database "
              + path
              + " is damaged ("
              + String.join("; ", problems)
              + "). It was left as it is and nothing is written to it. "
              + RESTORE_HINT);
    }
  }

  Path path() {
    return path;
  }

  Connection connection() {
    return connection;
  }

  int queryInt(String sql) throws SQLException {
    try (PreparedStatement statement = connection.prepareStatement(sql);
        ResultSet rs = statement.executeQuery()) {
      return rs.next() ? rs.getInt(1) : 0;
    }
  }

  /**
   * Runs {@code work} in one write transaction and returns its result: all of it is committed, or
   * none of it.
   *
   * <p>If another program holds the write lock longer than the busy timeout, the transaction is
   * retried a few times before the user is told that the file is busy.
   */
  <T> T write(String what, Work<T> work) {
    if (inTransaction) {
      throw new IllegalStateException("nested transaction");
    }
    if (readOnly) {
      throw new StorageException(
          "History database "
              + path
              + ": cannot "
              + what
              + ": it was opened for reading only. Nothing was changed.");
    }
    for (int attempt = 1; ; attempt++) {
      try {
        return transaction("BEGIN IMMEDIATE", work);
      } catch (SQLException e) {
        if (!isBusy(e) || attempt >= WRITE_ATTEMPTS) {
          throw translate(path, e, what);
        }
        pause(attempt);
      }
    }
  }

  /**
   * Runs {@code work} in one read transaction, so that it sees one consistent state of the file.
   */
  <T> T read(String what, Work<T> work) {
    if (inTransaction) {
      throw new IllegalStateException("nested transaction");
    }
    for (int attempt = 1; ; attempt++) {
      try {
        return transaction("BEGIN DEFERRED", work);
      } catch (SQLException e) {
        if (!isBusy(e) || attempt >= WRITE_ATTEMPTS) {
          throw translate(path, e, what);
        }
        pause(attempt);
      }
    }
  }

  /**
   * Runs {@code work} outside any transaction (for statements that cannot run inside one, such as
   * {@code VACUUM INTO} and the online backup), retrying while the file is busy.
   */
  <T> T outsideTransaction(String what, Work<T> work) {
    if (inTransaction) {
      throw new IllegalStateException("nested transaction");
    }
    for (int attempt = 1; ; attempt++) {
      try {
        return work.run(connection);
      } catch (SQLException e) {
        if (!isBusy(e) || attempt >= WRITE_ATTEMPTS) {
          throw translate(path, e, what);
        }
        pause(attempt);
      }
    }
  }

  private <T> T transaction(String begin, Work<T> work) throws SQLException {
    execute(begin);
    inTransaction = true;
    boolean committed = false;
    try {
      T result = work.run(connection);
      execute("COMMIT");
      committed = true;
      return result;
    } finally {
      inTransaction = false;
      if (!committed) {
        rollbackQuietly();
      }
    }
  }

  void execute(String sql) throws SQLException {
    try (PreparedStatement statement = connection.prepareStatement(sql)) {
      statement.execute();
    }
  }

  private void rollbackQuietly() {
    try {
      execute("ROLLBACK");
    } catch (SQLException e) {
      // No transaction left to roll back: SQLite ends it by itself after some errors.
    }
  }

  private static void pause(int attempt) {
    try {
      Thread.sleep(50L * attempt * attempt);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new StorageException("Interrupted while waiting for the history database.", e);
    }
  }

  static boolean isBusy(SQLException e) {
    if (e instanceof SQLiteException se) {
      SQLiteErrorCode code = se.getResultCode();
      return code == SQLiteErrorCode.SQLITE_BUSY
          || code == SQLiteErrorCode.SQLITE_LOCKED
          || code.name().startsWith("SQLITE_BUSY_")
          || code.name().startsWith("SQLITE_LOCKED_");
    }
    return false;
  }

  /**
   * Returns a storage exception whose message says in plain words what went wrong with the file.
   */
  static StorageException translate(Path file, Exception e, String what) {
    if (e instanceof StorageException se) {
      return se;
    }
    String code = e instanceof SQLiteException se ? se.getResultCode().name() : "";
    String problem;
    if (code.startsWith("SQLITE_CORRUPT") || code.equals("SQLITE_NOTADB")) {
      problem = "the file is damaged (" + plain(e) + "). It was left as it is. " + RESTORE_HINT;
    } else if (code.startsWith("SQLITE_BUSY") || code.startsWith("SQLITE_LOCKED")) {
      problem =
          "another program kept the database busy for too long. Nothing was changed; try again.";
    } else if (code.startsWith("SQLITE_READONLY")) {
      problem = "the file or its folder is read-only. Nothing was changed.";
    } else if (code.startsWith("SQLITE_CANTOPEN")) {
      problem = "the file cannot be opened (check that the folder exists and is writable).";
    } else if (code.startsWith("SQLITE_FULL")) {
      problem = "the disk is full. Nothing was changed.";
    } else if (code.startsWith("SQLITE_IOERR")) {
      problem = "the disk reported an error (" + plain(e) + "). Nothing was changed.";
    } else {
      problem = plain(e);
    }
    String message = "History database " + file + ": cannot " + what + ": " + problem;
    return code.startsWith("SQLITE_CORRUPT") || code.equals("SQLITE_NOTADB")
        ? StorageException.unusableFile(message, e)
        : new StorageException(message, e);
  }

  private static String plain(Exception e) {
    String message = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    // sqlite-jdbc prefixes "[SQLITE_CORRUPT] The database disk image is malformed (...)".
    return message.replaceFirst("^\\[[A-Z_]+\\]\\s*", "");
  }

  private void closeQuietly() {
    try {
      connection.close();
    } catch (SQLException e) {
      // Closing after a failed open: the first failure is the one to report.
    }
  }

  @Override
  public void close() {
    try {
      connection.close();
    } catch (SQLException e) {
      throw translate(path, e, "close");
    }
  }
}
