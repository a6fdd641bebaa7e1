package com.stagewise.history.postgres;

import com.stagewise.history.ServerAddress;
import com.stagewise.history.StorageException;
import com.stagewise.history.jdbc.Rows;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Map;
import java.util.Properties;

/**
 * One connection to the shop server, in the shop's schema, with the transactions.
 *
 * <p>Credentials come the usual PostgreSQL way: the user from the address or {@code PGUSER}, the
 * password from {@code PGPASSWORD} or else the driver's own reading of {@code .pgpass} (or {@code
 * PGPASSFILE}); they are never part of a message. TLS is used when the server offers it ({@code
 * sslmode=prefer}).
 *
 * <p>Every write transaction first takes one lock per shop schema ({@code pg_advisory_xact_lock}):
 * writes to a shop run one at a time, so the change numbers that sync reads (schema version 3)
 * become visible in the order they were drawn, and a reader that has seen number n has seen every
 * smaller one. A shop's benches write small transactions, so the lock costs little.
 *
 * <p>Not thread-safe by itself; {@link PgHistory} serialises its use.
 */
final class PgDatabase implements AutoCloseable {
  /** How long to wait for the server to answer a connection, in seconds. */
  static final int CONNECT_TIMEOUT_S = 10;

  /** How long one statement may wait for the network before the link counts as lost, seconds. */
  static final int SOCKET_TIMEOUT_S = 120;

  /** Retries of a whole transaction that the server aborted as a deadlock or serialisation loss. */
  private static final int ATTEMPTS = 5;

  private final ServerAddress address;
  private final Connection connection;
  private boolean inTransaction;

  private PgDatabase(ServerAddress address, Connection connection) {
    this.address = address;
    this.connection = connection;
  }

  /** A unit of work inside a transaction. */
  @FunctionalInterface
  interface Work<T> {
    T run(Connection connection) throws SQLException;
  }

  /**
   * Connects to the server as the user of the environment.
   *
   * @throws StorageException saying in plain words why the server cannot be used
   */
  static PgDatabase connect(ServerAddress address, Map<String, String> environment) {
    try {
      return new PgDatabase(address, open(address, environment));
    } catch (SQLException e) {
      throw ServerProblems.translate(address, e, "connect");
    }
  }

  /** Opens a plain connection (auto-commit) to the address, in its shop's schema. */
  static Connection open(ServerAddress address, Map<String, String> environment)
      throws SQLException {
    Properties settings = new Properties();
    String user = address.user().orElse(environment.get("PGUSER"));
    if (user != null && !user.isBlank()) {
      settings.setProperty("user", user);
    } else {
      settings.setProperty("user", System.getProperty("user.name"));
    }
    String password = environment.get("PGPASSWORD");
    if (password != null && !password.isEmpty()) {
      settings.setProperty("password", password);
    }
    String passFile = environment.get("PGPASSFILE");
    if (passFile != null && !passFile.isBlank()) {
      settings.setProperty("PGPASSFILE", passFile);
    }
    settings.setProperty("sslmode", "prefer");
    settings.setProperty("currentSchema", address.schema());
    settings.setProperty("ApplicationName", "stagewise");
    settings.setProperty("connectTimeout", Integer.toString(CONNECT_TIMEOUT_S));
    settings.setProperty("loginTimeout", Integer.toString(CONNECT_TIMEOUT_S));
    settings.setProperty("socketTimeout", Integer.toString(SOCKET_TIMEOUT_S));
    settings.setProperty("tcpKeepAlive", "true");
    String host = address.host().contains(":") ? "[" + address.host() + "]" : address.host();
    String url = "jdbc:postgresql://" + host + ":" + address.port() + "/" + address.database();
    return DriverManager.getConnection(url, settings);
  }

  ServerAddress address() {
    return address;
  }

  Connection connection() {
    return connection;
  }

  /** Runs {@code work} in one write transaction (holding the shop's write lock). */
  <T> T write(String what, Work<T> work) {
    return transaction(
        what,
        false,
        c -> {
          try (PreparedStatement lock =
              c.prepareStatement("SELECT pg_advisory_xact_lock(hashtext(?))")) {
            lock.setString(1, "stagewise writes " + address.schema());
            lock.execute();
          }
          return work.run(c);
        });
  }

  /** Runs {@code work} in one read-only transaction that sees one consistent state. */
  <T> T read(String what, Work<T> work) {
    return transaction(what, true, work);
  }

  private <T> T transaction(String what, boolean readOnly, Work<T> work) {
    if (inTransaction) {
      throw new IllegalStateException("nested transaction");
    }
    for (int attempt = 1; ; attempt++) {
      inTransaction = true;
      boolean committed = false;
      try {
        connection.setAutoCommit(false);
        try (Statement begin = connection.createStatement()) {
          begin.execute(
              readOnly
                  ? "SET TRANSACTION ISOLATION LEVEL REPEATABLE READ, READ ONLY"
                  : "SET TRANSACTION ISOLATION LEVEL READ COMMITTED");
        }
        T result = work.run(connection);
        connection.commit();
        committed = true;
        return result;
      } catch (SQLException e) {
        rollbackQuietly();
        committed = true;
        if (!ServerProblems.isRetryable(e) || attempt >= ATTEMPTS) {
          throw ServerProblems.translate(address, e, what);
        }
      } finally {
        inTransaction = false;
        if (!committed) {
          rollbackQuietly();
        }
      }
    }
  }

  /** Runs one statement outside a transaction (auto-commit). */
  void execute(String sql) {
    try {
      connection.setAutoCommit(true);
      try (Statement statement = connection.createStatement()) {
        statement.execute(sql);
      }
    } catch (SQLException e) {
      throw ServerProblems.translate(address, e, "run " + sql.split(" ")[0]);
    }
  }

  static int queryInt(Connection c, String sql, Object... parameters) throws SQLException {
    try (PreparedStatement statement = c.prepareStatement(sql)) {
      Rows.bind(statement, parameters);
      try (ResultSet rs = statement.executeQuery()) {
        return rs.next() ? rs.getInt(1) : 0;
      }
    }
  }

  private void rollbackQuietly() {
    try {
      if (!connection.isClosed() && !connection.getAutoCommit()) {
        connection.rollback();
      }
    } catch (SQLException e) {
      // The link is gone or the transaction already ended: the server rolls it back itself.
    }
  }

  @Override
  public void close() {
    try {
      connection.close();
    } catch (SQLException e) {
      // Closing a connection whose link is gone: nothing is left to close on this side.
    }
  }
}
