package com.stagewise.history.jdbc;

import com.stagewise.history.Cases;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.StageLibrary;
import com.stagewise.history.Units;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Clock;
import java.util.List;

/**
 * What the stores built on JDBC share: the units, cases and stage library over the shared SQL, each
 * reached through the store's own transactions (one at a time) and its own text search.
 */
public abstract class JdbcHistory implements HistoryStore {
  /** Counts the board models, units and cases: none means the history is empty. */
  protected static final String COUNT_RECORDS =
      "SELECT (SELECT count(*) FROM board_model) + (SELECT count(*) FROM unit)"
          + " + (SELECT count(*) FROM repair_case)";

  private final JdbcUnits units;
  private final JdbcCases cases;
  private final JdbcLibrary library;

  /** Builds the shared parts on the store's clock and SQL dialect. */
  protected JdbcHistory(Clock clock, SqlDialect dialect) {
    JdbcAccess access =
        new JdbcAccess(clock, dialect) {
          @Override
          protected <T> T read(String what, SqlWork<T> work) {
            return readSql(what, work);
          }

          @Override
          protected <T> T write(String what, SqlWork<T> work) {
            return writeSql(what, work);
          }

          @Override
          protected List<SearchHit> search(Connection connection, SearchQuery query)
              throws SQLException {
            return searchText(connection, query);
          }
        };
    this.units = new JdbcUnits(access);
    this.cases = new JdbcCases(access);
    this.library = new JdbcLibrary(access);
  }

  @Override
  public final Units units() {
    return units;
  }

  @Override
  public final Cases cases() {
    return cases;
  }

  @Override
  public final StageLibrary library() {
    return library;
  }

  /** Runs {@code work} in one read transaction of the store, one call at a time. */
  protected abstract <T> T readSql(String what, SqlWork<T> work);

  /** Runs {@code work} in one write transaction of the store, one call at a time. */
  protected abstract <T> T writeSql(String what, SqlWork<T> work);

  /** Searches the cases' text and fields the store's own way, inside a read transaction. */
  protected abstract List<SearchHit> searchText(Connection connection, SearchQuery query)
      throws SQLException;
}
