package com.stagewise.history.postgres;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.ServerAddress;
import com.stagewise.history.ShopServer;
import com.stagewise.history.StorageException;
import com.stagewise.history.Transfer;
import com.stagewise.history.jdbc.JdbcHistory;
import com.stagewise.history.jdbc.Rows;
import com.stagewise.history.jdbc.SqlDialect;
import com.stagewise.history.jdbc.SqlWork;
import com.stagewise.history.record.HistoryBundle;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Clock;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The shop's repair history on a PostgreSQL server: the second {@link HistoryStore}, passing the
 * same contract tests as the bench's file, and the {@link ShopServer} that benches sync with.
 *
 * <p>Opening it brings the shop's schema up to date when this user may (numbered migrations, as the
 * file's); a bench role with only the rights to read and add records finds the schema ready or is
 * told to ask for {@code history server-init}. Calls from several threads run one at a time.
 */
public final class PgHistory extends JdbcHistory implements ShopServer {
  private final PgDatabase database;
  private final Clock clock;
  private final PgTransfer transfer;

  private PgHistory(PgDatabase database, Clock clock) {
    super(clock, SqlDialect.POSTGRES);
    this.database = database;
    this.clock = clock;
    this.transfer = new PgTransfer(this);
  }

  /**
   * Connects to the shop server as the environment's user and brings the shop's schema up to date.
   *
   * @param environment where PGUSER, PGPASSWORD and PGPASSFILE are read from
   * @throws StorageException saying in plain words why the server cannot be used
   */
  public static PgHistory open(
      ServerAddress address, Clock clock, Map<String, String> environment) {
    PgDatabase database = PgDatabase.connect(address, environment);
    try {
      PgMigrations.migrate(database, clock.millis());
      return new PgHistory(database, clock);
    } catch (RuntimeException e) {
      database.close();
      throw e;
    }
  }

  /** Returns the server schema version this program writes. */
  public static int latestSchemaVersion() {
    return PgMigrations.LATEST;
  }

  @Override
  public Transfer transfer() {
    return transfer;
  }

  @Override
  public synchronized boolean isEmpty() {
    return database.read("count records", c -> PgDatabase.queryInt(c, COUNT_RECORDS) == 0);
  }

  @Override
  public String location() {
    return database.address().toString();
  }

  /**
   * The server keeps no file on the bench.
   *
   * @throws StorageException always: the server is backed up on the server
   */
  @Override
  public Path file() {
    throw new StorageException(
        "Shop server "
            + database.address()
            + " is not a file on this bench; it is backed up on"
            + " the server (pg_dump).");
  }

  @Override
  public synchronized int schemaVersion() {
    return database.read(
        "read the schema version",
        c -> PgMigrations.currentVersion(c, database.address().schema()));
  }

  @Override
  public ServerAddress address() {
    return database.address();
  }

  @Override
  public ImportReport upload(HistoryBundle bundle, String source) {
    return transfer.importBundle(bundle, source);
  }

  @Override
  public synchronized Changes changesSince(long after, String programVersion) {
    return database.read(
        "read the changes", c -> ChangeFeed.since(c, after, programVersion, clock.instant()));
  }

  @Override
  public synchronized Map<String, Map<String, Integer>> confirmedFaultCounts() {
    return database.read(
        "count confirmed faults",
        c -> {
          try (Rows rows = new Rows(c, SqlDialect.POSTGRES)) {
            Map<String, Map<String, Integer>> counts = new LinkedHashMap<>();
            for (Object[] row :
                rows.query(
                    "SELECT m.name, f.fault_id, count(DISTINCT f.case_id) FROM confirmed_fault f"
                        + " JOIN repair_case rc ON rc.id = f.case_id JOIN unit u ON u.id ="
                        + " rc.unit_id JOIN board_model m ON m.id = u.board_model_id WHERE"
                        + " rc.status = 'closed' AND rc.outcome = 'fixed' GROUP BY m.name,"
                        + " f.fault_id ORDER BY m.name, count(DISTINCT f.case_id) DESC, f.fault_id"
                        + " COLLATE \"C\"",
                    rs -> new Object[] {rs.getString(1), rs.getString(2), rs.getInt(3)})) {
              counts
                  .computeIfAbsent((String) row[0], k -> new LinkedHashMap<>())
                  .put((String) row[1], (Integer) row[2]);
            }
            return counts;
          }
        });
  }

  @Override
  public synchronized void close() {
    database.close();
  }

  // ---- for the sub-stores -----------------------------------------------------------------------

  Clock clock() {
    return clock;
  }

  PgDatabase database() {
    return database;
  }

  synchronized <T> T read(String what, PgDatabase.Work<T> work) {
    return database.read(what, work);
  }

  synchronized <T> T write(String what, PgDatabase.Work<T> work) {
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
    return TextSearch.run(connection, query);
  }
}
