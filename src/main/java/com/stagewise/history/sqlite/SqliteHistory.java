package com.stagewise.history.sqlite;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.SyncLedger;
import com.stagewise.history.Transfer;
import com.stagewise.history.jdbc.JdbcHistory;
import com.stagewise.history.jdbc.SqlDialect;
import com.stagewise.history.jdbc.SqlWork;
import com.stagewise.history.record.HistoryBundle;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Clock;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The shop's repair history in one SQLite file: the embedded {@link HistoryStore}.
 *
 * <p>The file may be used by several programs at once: a writer waits for another's write lock (up
 * to a timeout, then retries) instead of failing. Calls from several threads run one at a time.
 */
public final class SqliteHistory extends JdbcHistory implements SyncLedger {
  private final Database database;
  private final Clock clock;
  private final SqliteTransfer transfer;
  private final Ledger ledger;

  private SqliteHistory(Database database, Clock clock) {
    super(clock, SqlDialect.SQLITE);
    this.database = database;
    this.clock = clock;
    this.transfer = new SqliteTransfer(this);
    this.ledger = new Ledger(this);
  }

  /**
   * Opens the history file at {@code file}, creating it (and its folder) if missing, and brings its
   * schema up to date.
   *
   * @throws StorageException if the file is not a history database, is damaged, was made by a newer
   *     program, or cannot be written; the file is then left as it was
   */
  public static SqliteHistory open(Path file) {
    return open(file, Clock.systemUTC());
  }

  /** Opens the history file as {@link #open(Path)} does, taking times from {@code clock}. */
  public static SqliteHistory open(Path file, Clock clock) {
    return open(file, clock, Migrations.LATEST);
  }

  /** Opens the history file with its schema brought to {@code schemaVersion} (for fixtures). */
  static SqliteHistory open(Path file, Clock clock, int schemaVersion) {
    Database database = Database.open(file);
    try {
      Migrations.migrate(database, schemaVersion, clock.millis());
      return new SqliteHistory(database, clock);
    } catch (RuntimeException e) {
      database.close();
      throw e;
    }
  }

  /**
   * Opens an existing history file for reading only: nothing is created, migrated or written, so a
   * read-only file (or folder) can still be listed and searched. Every write through the store is
   * refused.
   *
   * @throws StorageException if the file is missing, not a history database, damaged, or of a
   *     schema this program does not know; the file is left as it was
   */
  public static SqliteHistory openReadOnly(Path file) {
    return openReadOnly(file, Clock.systemUTC());
  }

  /** Opens the history file for reading as {@link #openReadOnly(Path)} does, with a clock. */
  public static SqliteHistory openReadOnly(Path file, Clock clock) {
    Database database = Database.openReadOnly(file);
    try {
      Migrations.requireKnown(database);
      return new SqliteHistory(database, clock);
    } catch (RuntimeException e) {
      database.close();
      throw e;
    }
  }

  /** Returns the schema version this program writes. */
  public static int latestSchemaVersion() {
    return Migrations.LATEST;
  }

  @Override
  public Transfer transfer() {
    return transfer;
  }

  @Override
  public synchronized boolean isEmpty() {
    return database.read("count records", c -> database.queryInt(COUNT_RECORDS) == 0);
  }

  @Override
  public String location() {
    return database.path().toString();
  }

  @Override
  public Path file() {
    return database.path();
  }

  @Override
  public synchronized int schemaVersion() {
    return database.read("read the schema version", c -> Migrations.currentVersion(database));
  }

  // ---- the bench's side of sync (SyncLedger)
  // -----------------------------------------------------

  @Override
  public int pendingCount() {
    return ledger.pendingCount();
  }

  @Override
  public List<Batch> pendingBatches(int max, String programVersion) {
    return ledger.pendingBatches(max, programVersion);
  }

  @Override
  public void uploaded(Batch batch) {
    ledger.uploaded(batch);
  }

  @Override
  public ImportReport mergeFromServer(HistoryBundle bundle, String source) {
    return ledger.mergeFromServer(bundle, source);
  }

  @Override
  public long pulledThrough(String server) {
    return ledger.pulledThrough(server);
  }

  @Override
  public void pulled(String server, long through) {
    ledger.pulled(server, through);
  }

  @Override
  public void synced(String server, Instant at) {
    ledger.synced(server, at);
  }

  @Override
  public Optional<Instant> lastSync(String server) {
    return ledger.lastSync(server);
  }

  @Override
  public void cacheShopCounts(Map<String, Map<String, Integer>> counts) {
    ledger.cacheShopCounts(counts);
  }

  @Override
  public Map<String, Integer> shopCounts(String boardModelName) {
    return ledger.shopCounts(boardModelName);
  }

  @Override
  public synchronized void close() {
    database.close();
  }

  // ---- for the sub-stores -----------------------------------------------------------------------

  Clock clock() {
    return clock;
  }

  Database database() {
    return database;
  }

  /** Runs {@code work} in one read transaction, one call at a time. */
  synchronized <T> T read(String what, Database.Work<T> work) {
    return database.read(what, work);
  }

  /** Runs {@code work} in one write transaction, one call at a time. */
  synchronized <T> T write(String what, Database.Work<T> work) {
    return database.write(what, work);
  }

  @Override
  protected <T> T readSql(String what, SqlWork<T> work) {
    return read(what, work::run);
  }

  @Override
  protected <T> T writeSql(String what, SqlWork<T> work) {
    return write(what, work::run);
  }

  @Override
  protected List<SearchHit> searchText(Connection connection, SearchQuery query)
      throws SQLException {
    return Search.run(connection, query);
  }
}
