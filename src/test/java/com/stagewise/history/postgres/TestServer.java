package com.stagewise.history.postgres;

import com.stagewise.history.ServerAddress;
import java.io.IOException;
import java.net.ServerSocket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.Stream;

/**
 * A throwaway PostgreSQL cluster for the tests, made with the server's own tools ({@code initdb},
 * {@code pg_ctl}) from the distribution's packages: its own data folder in the temporary folder, a
 * free port on the loopback address only, password authentication (SCRAM) for every role, stopped
 * and deleted when the test run ends.
 *
 * <p>Run as root (as CI does), the server's tools run as the unprivileged {@code postgres} user
 * that the package creates (PostgreSQL refuses to run as root). Without PostgreSQL the tests fail
 * with a message saying how to install it: they never skip.
 */
public final class TestServer {
  /** The cluster's superuser, used only to set up schemas and roles for the tests. */
  public static final String ADMIN = "stagewise_admin";

  public static final String DATABASE = "shop";

  private static final String INSTALL_HINT =
      "PostgreSQL's server programs (initdb, pg_ctl) were not found in /usr/lib/postgresql/*/bin"
          + " or on the PATH. Install them from the distribution's packages, e.g."
          + " 'sudo apt-get install -y postgresql' on Debian or Ubuntu (.ci/run does).";

  private static TestServer running;

  private final Path bin;
  private final Path folder;
  private final Path data;
  private final int port;
  private final String adminPassword;
  private final boolean asPostgresUser;
  private final AtomicInteger schemas = new AtomicInteger();

  private TestServer(Path bin, Path folder, int port, String adminPassword, boolean asPostgres) {
    this.bin = bin;
    this.folder = folder;
    this.data = folder.resolve("data");
    this.port = port;
    this.adminPassword = adminPassword;
    this.asPostgresUser = asPostgres;
  }

  /** Returns the cluster of this test run, starting it on first use. */
  public static synchronized TestServer get() {
    if (running == null) {
      running = create();
      TestServer server = running;
      Runtime.getRuntime().addShutdownHook(new Thread(server::destroy));
    }
    return running;
  }

  private static TestServer create() {
    Path bin = findBinaries().orElseThrow(() -> new IllegalStateException(INSTALL_HINT));
    boolean root = "root".equals(System.getProperty("user.name"));
    try {
      Path folder = Files.createTempDirectory("stagewise-pg-");
      String password = "test-" + Long.toHexString(System.nanoTime());
      Path pwfile = folder.resolve("pw");
      Files.writeString(pwfile, password + "\n", StandardCharsets.UTF_8);
      if (root) {
        run(List.of("chown", "-R", "postgres:postgres", folder.toString()), false, null);
      }
      TestServer server = new TestServer(bin, folder, freePort(), password, root);
      server.run(
          List.of(
              bin.resolve("initdb").toString(),
              "-D",
              server.data.toString(),
              "-U",
              ADMIN,
              "--pwfile=" + pwfile,
              "--auth=scram-sha-256",
              "--encoding=UTF8",
              "--locale=C",
              "--no-sync"));
      Files.deleteIfExists(pwfile);
      server.start();
      try (Connection c = server.adminConnection("postgres")) {
        try (Statement s = c.createStatement()) {
          s.execute("CREATE DATABASE " + DATABASE);
        }
      }
      return server;
    } catch (IOException | SQLException e) {
      throw new IllegalStateException("cannot start the test PostgreSQL cluster: " + e, e);
    }
  }

  /** Starts (or restarts) the server and waits until it takes connections. */
  public void start() {
    run(
        List.of(
            bin.resolve("pg_ctl").toString(),
            "-D",
            data.toString(),
            "-l",
            folder.resolve("server.log").toString(),
            "-w",
            "-t",
            "60",
            "-o",
            "-p "
                + port
                + " -k "
                + folder
                + " -c listen_addresses=127.0.0.1 -c fsync=off"
                + " -c max_connections=60",
            "start"));
  }

  /** Stops the server at once (open connections are cut, as when a server goes down). */
  public void stop() {
    run(
        List.of(
            bin.resolve("pg_ctl").toString(), "-D", data.toString(), "-m", "fast", "-w", "stop"));
  }

  private void destroy() {
    try {
      stop();
    } catch (RuntimeException e) {
      // Already stopped.
    }
    try (Stream<Path> paths = Files.walk(folder)) {
      paths.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    } catch (IOException e) {
      // The temporary folder is cleaned by the system in the end.
    }
  }

  public int port() {
    return port;
  }

  /** Returns the environment (PGUSER, PGPASSWORD) of the cluster's superuser. */
  public Map<String, String> adminEnvironment() {
    return Map.of("PGUSER", ADMIN, "PGPASSWORD", adminPassword);
  }

  /** Returns the address of a new, empty shop schema (not yet created) in the test database. */
  public ServerAddress freshShop() {
    return address("shop_" + schemas.incrementAndGet() + "_" + Long.toHexString(System.nanoTime()));
  }

  /** Returns the address of the named shop schema in the test database. */
  public ServerAddress address(String schema) {
    return ServerAddress.parse(
        "test", "postgresql://127.0.0.1:" + port + "/" + DATABASE + "?schema=" + schema);
  }

  /** Returns a superuser's connection to a database of the cluster. */
  public Connection adminConnection(String database) throws SQLException {
    return PgDatabase.open(
        ServerAddress.parse("test", "postgresql://127.0.0.1:" + port + "/" + database),
        adminEnvironment());
  }

  /** Runs SQL statements as the superuser in the test database. */
  public void adminSql(String... statements) {
    try (Connection c = adminConnection(DATABASE);
        Statement s = c.createStatement()) {
      for (String sql : statements) {
        s.execute(sql);
      }
    } catch (SQLException e) {
      throw new IllegalStateException(e.getMessage(), e);
    }
  }

  private void run(List<String> command) {
    run(command, asPostgresUser, folder);
  }

  private static void run(List<String> command, boolean asPostgres, Path workDir) {
    List<String> full = new ArrayList<>();
    if (asPostgres) {
      full.addAll(List.of("runuser", "-u", "postgres", "--"));
    }
    full.addAll(command);
    try {
      ProcessBuilder builder = new ProcessBuilder(full).redirectErrorStream(true);
      if (workDir != null) {
        builder.directory(workDir.toFile());
      }
      builder.environment().put("LC_ALL", "C");
      Process process = builder.start();
      byte[] output = process.getInputStream().readAllBytes();
      if (!process.waitFor(120, TimeUnit.SECONDS) || process.exitValue() != 0) {
        throw new IllegalStateException(
            String.join(" ", command)
                + " failed: "
                + new String(output, StandardCharsets.UTF_8).strip());
      }
    } catch (IOException e) {
      throw new IllegalStateException("cannot run " + command.get(0) + ": " + e.getMessage(), e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted", e);
    }
  }

  private static Optional<Path> findBinaries() {
    List<Path> candidates = new ArrayList<>();
    Path debian = Path.of("/usr/lib/postgresql");
    if (Files.isDirectory(debian)) {
      try (Stream<Path> versions = Files.list(debian)) {
        versions.sorted(Comparator.reverseOrder()).forEach(v -> candidates.add(v.resolve("bin")));
      } catch (IOException e) {
        // Fall through to the PATH.
      }
    }
    String path = System.getenv("PATH");
    if (path != null) {
      for (String part : path.split(java.io.File.pathSeparator)) {
        candidates.add(Path.of(part));
      }
    }
    return candidates.stream()
        .filter(
            p -> Files.isExecutable(p.resolve("initdb")) && Files.isExecutable(p.resolve("pg_ctl")))
        .findFirst();
  }

  private static int freePort() throws IOException {
    try (ServerSocket socket = new ServerSocket(0)) {
      return socket.getLocalPort();
    }
  }
}
