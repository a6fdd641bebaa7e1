package com.stagewise.history.postgres;

import com.stagewise.history.ServerAddress;
import com.stagewise.history.StorageException;
import java.net.ConnectException;
import java.net.NoRouteToHostException;
import java.net.SocketTimeoutException;
import java.net.UnknownHostException;
import java.sql.SQLException;

/**
 * Says in plain words what went wrong with the shop server, from the driver's error codes
 * (SQLSTATE, PostgreSQL documentation appendix A, "PostgreSQL Error Codes").
 */
final class ServerProblems {
  private ServerProblems() {}

  /** Returns whether the whole transaction may simply be tried again (deadlock, serialisation). */
  static boolean isRetryable(SQLException e) {
    String state = e.getSQLState();
    return "40001".equals(state) || "40P01".equals(state);
  }

  /** Returns whether the failure is the link to the server (unreachable, dropped, shut down). */
  static boolean isUnreachable(SQLException e) {
    String state = e.getSQLState() == null ? "" : e.getSQLState();
    return state.startsWith("08")
        || state.equals("57P01")
        || state.equals("57P02")
        || state.equals("57P03")
        || cause(e, ConnectException.class)
        || cause(e, UnknownHostException.class)
        || cause(e, NoRouteToHostException.class)
        || cause(e, SocketTimeoutException.class);
  }

  /** Returns a storage exception whose message says what is wrong and what to do. */
  static StorageException translate(ServerAddress address, SQLException e, String what) {
    String state = e.getSQLState() == null ? "" : e.getSQLState();
    String message = e.getMessage() == null ? "" : e.getMessage();
    String problem;
    if (state.equals("28P01")) {
      problem =
          "the server refused the password. Check PGPASSWORD or the line for this server in your"
              + " .pgpass file.";
    } else if (state.equals("08004") && message.contains("no password was provided")) {
      problem =
          "the server asks for a password and none was given. Put it in PGPASSWORD or in a"
              + " .pgpass file (never on the command line).";
    } else if (state.equals("28000")) {
      problem =
          "the server does not let this user in from this machine (its pg_hba.conf has no line"
              + " for it, or the role may not log in). Ask the shop's administrator.";
    } else if (state.equals("3D000")) {
      problem =
          "the server has no database "
              + address.database()
              + ". Check the address, or ask the administrator to create it.";
    } else if (state.equals("42501")) {
      problem =
          "this user lacks the right to do that ("
              + firstLine(message)
              + "). Ask the shop's administrator to grant the bench its rights"
              + " (history server-init --grant ROLE).";
    } else if (state.equals("53300")) {
      problem = "the server has no free connection. Try again later.";
    } else if (state.equals("57P03")) {
      problem = "the server is starting up or shutting down. Try again in a moment.";
    } else if (cause(e, UnknownHostException.class)) {
      problem =
          "the host name "
              + address.host()
              + " is unknown (check the address, and this machine's network).";
    } else if (isUnreachable(e)) {
      problem =
          "cannot reach the server (is it running, and does it accept connections from this"
              + " machine on port "
              + address.port()
              + "?). The bench keeps working on its own file.";
    } else {
      problem = firstLine(message);
    }
    return new StorageException("Shop server " + address + ": cannot " + what + ": " + problem, e);
  }

  private static String firstLine(String message) {
    int end = message.indexOf('\n');
    return (end < 0 ? message : message.substring(0, end)).strip();
  }

  private static boolean cause(Throwable e, Class<? extends Throwable> kind) {
    for (Throwable t = e; t != null; t = t.getCause()) {
      if (kind.isInstance(t)) {
        return true;
      }
    }
    return false;
  }
}
