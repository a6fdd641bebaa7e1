package com.stagewise.history;

import com.stagewise.circuit.InvalidInputException;
import java.net.URI;
import java.net.URISyntaxException;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Pattern;

/**
 * Where the shop server is: {@code postgresql://HOST[:PORT]/DATABASE[?schema=NAME]} (DESIGN.md,
 * "The shop server"), from {@code --server} or {@code STAGEWISE_SERVER}.
 *
 * <p>The address never carries a password: user and password come the usual PostgreSQL way ({@code
 * PGUSER} and {@code PGPASSWORD}, or a {@code .pgpass} file), so that they appear neither on a
 * command line (which every user of the machine can list) nor in a log. An address with a password
 * in it is refused. {@code schema} names the shop's own schema on the server (default {@value
 * #DEFAULT_SCHEMA}), so that several shops can share one database without seeing each other's
 * records.
 *
 * @param host the server's host name or address
 * @param port its port (PostgreSQL's default 5432 when the address has none)
 * @param database the database's name
 * @param schema the shop's schema inside it
 * @param user the user name given in the address (else PGUSER), if any
 */
public record ServerAddress(
    String host, int port, String database, String schema, Optional<String> user) {
  /** The environment variable that names the shop server. */
  public static final String ENVIRONMENT_VARIABLE = "STAGEWISE_SERVER";

  /** The shop's schema when the address names none. */
  public static final String DEFAULT_SCHEMA = "stagewise";

  /** PostgreSQL's default port. */
  public static final int DEFAULT_PORT = 5432;

  private static final Pattern NAME = Pattern.compile("[A-Za-z_][A-Za-z0-9_]{0,62}");

  /**
   * Returns the server named by {@code explicitOrNull} (the {@code --server} option), else by
   * {@code STAGEWISE_SERVER} in {@code environment}; empty when neither names one.
   *
   * @throws InvalidInputException if the address is malformed or carries a password
   */
  public static Optional<ServerAddress> resolve(
      String explicitOrNull, Map<String, String> environment) {
    if (explicitOrNull != null && !explicitOrNull.isBlank()) {
      return Optional.of(parse("--server", explicitOrNull));
    }
    String fromEnvironment = environment.get(ENVIRONMENT_VARIABLE);
    if (fromEnvironment != null && !fromEnvironment.isBlank()) {
      return Optional.of(parse(ENVIRONMENT_VARIABLE, fromEnvironment));
    }
    return Optional.empty();
  }

  /**
   * Reads an address such as {@code postgresql://bench-server:5432/shop?schema=north}.
   *
   * @param source names where the address came from, for messages
   * @throws InvalidInputException if the address is malformed or carries a password
   */
  public static ServerAddress parse(String source, String text) {
    String expected = "expected postgresql://HOST[:PORT]/DATABASE[?schema=NAME]";
    String clean = text.strip();
    String scheme = clean.toLowerCase(Locale.ROOT);
    if (!scheme.startsWith("postgresql://") && !scheme.startsWith("postgres://")) {
      throw new InvalidInputException(source, "server", expected + ", got " + Checks.quote(text));
    }
    URI uri;
    try {
      uri = new URI(clean);
    } catch (URISyntaxException e) {
      throw new InvalidInputException(source, "server", expected + ", got " + Checks.quote(text));
    }
    Optional<String> user = Optional.empty();
    String userInfo = uri.getRawUserInfo();
    if (userInfo != null) {
      if (userInfo.contains(":")) {
        throw new InvalidInputException(
            source,
            "server",
            "the address must not hold a password (command lines and logs can be read by"
                + " others); give it in PGPASSWORD or a .pgpass file instead");
      }
      user = Optional.of(userInfo);
    }
    String host = uri.getHost();
    if (host == null || host.isBlank()) {
      throw new InvalidInputException(
          source, "server", expected + " (no host), got " + Checks.quote(text));
    }
    int port = uri.getPort() < 0 ? DEFAULT_PORT : uri.getPort();
    String path = uri.getPath() == null ? "" : uri.getPath().replaceFirst("^/", "");
    if (path.isEmpty() || path.contains("/")) {
      throw new InvalidInputException(
          source, "server", expected + " (no database name), got " + Checks.quote(text));
    }
    String schema = DEFAULT_SCHEMA;
    String query = uri.getQuery();
    if (query != null && !query.isEmpty()) {
      for (String pair : query.split("&")) {
        String[] kv = pair.split("=", 2);
        String key = kv[0].toLowerCase(Locale.ROOT);
        String value = kv.length > 1 ? kv[1] : "";
        if (key.equals("password")) {
          throw new InvalidInputException(
              source,
              "server",
              "the address must not hold a password; give it in PGPASSWORD or a .pgpass file");
        } else if (key.equals("schema")) {
          if (!NAME.matcher(value).matches()) {
            throw new InvalidInputException(
                source,
                "server",
                "schema must be a plain name (letters, digits, _), got " + Checks.quote(value));
          }
          schema = value.toLowerCase(Locale.ROOT);
        } else {
          throw new InvalidInputException(
              source, "server", "unknown setting " + Checks.quote(kv[0]) + " (only schema)");
        }
      }
    }
    return new ServerAddress(host, port, path, schema, user);
  }

  /** Returns the address as people write it (no user, no password). */
  @Override
  public String toString() {
    String shown = host.contains(":") ? "[" + host + "]" : host;
    return "postgresql://"
        + shown
        + ":"
        + port
        + "/"
        + database
        + (schema.equals(DEFAULT_SCHEMA) ? "" : "?schema=" + schema);
  }
}
