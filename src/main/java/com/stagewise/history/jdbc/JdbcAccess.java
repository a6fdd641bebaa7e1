package com.stagewise.history.jdbc;

import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Clock;
import java.util.List;

/**
 * What the shared parts of a store need from the store they serve: its clock, its SQL dialect, one
 * transaction at a time, and its text search (the one piece each database does its own way).
 */
public abstract class JdbcAccess {
  private final Clock clock;
  private final SqlDialect dialect;

  protected JdbcAccess(Clock clock, SqlDialect dialect) {
    this.clock = clock;
    this.dialect = dialect;
  }

  /** Returns the clock that stamps every record the store writes. */
  public final Clock clock() {
    return clock;
  }

  /** Returns the store's SQL dialect. */
  public final SqlDialect dialect() {
    return dialect;
  }

  /** Runs {@code work} in one read transaction, one call at a time. */
  protected abstract <T> T read(String what, SqlWork<T> work);

  /** Runs {@code work} in one write transaction, one call at a time. */
  protected abstract <T> T write(String what, SqlWork<T> work);

  /** Searches the cases' text and fields, inside a read transaction. */
  protected abstract List<SearchHit> search(Connection connection, SearchQuery query)
      throws SQLException;

  /** Returns a row reader and writer for one transaction on {@code connection}. */
  final Rows rows(Connection connection) {
    return new Rows(connection, dialect);
  }
}
