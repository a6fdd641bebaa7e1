package com.stagewise.history.jdbc;

import java.sql.Connection;
import java.sql.SQLException;

/** A unit of work inside one transaction of a store. */
@FunctionalInterface
public interface SqlWork<T> {
  /** Does the work on {@code connection}, inside a transaction the store opened. */
  T run(Connection connection) throws SQLException;
}
