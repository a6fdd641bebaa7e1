package com.stagewise.history.sqlite;

import com.stagewise.history.HistoryStore;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;

/**
 * Rounds of write-and-kill against one history file: each round starts a {@link WriterProcess} (its
 * own JVM), waits until it has reported a counted number of commits (drawn from a seeded
 * generator), and kills it at once with SIGKILL ({@link Process#destroyForcibly()}), so that the
 * kill lands while it is in the middle of its next write. No timed sleep decides when the kill
 * comes: a slow machine only makes the rounds slower. Afterwards the file is checked: every
 * acknowledged case is there, the file passes SQLite's {@code integrity_check}, every stored case
 * is whole, and the full-text indexes pass their own {@code integrity-check}.
 *
 * <p>{@code ProcessFailureTest} runs a few rounds in the suite; {@code src/scripts/kill-writes.sh}
 * runs this class's {@link #main} for hundreds.
 */
final class KillRounds {
  /** How long a writer may take to reach its count before the round counts as failed. */
  private static final long COUNT_TIMEOUT_SECONDS = 120;

  private KillRounds() {}

  /**
   * What the rounds did and what the file holds afterwards.
   *
   * @param rounds rounds run
   * @param roundsKilledAtTheirCount rounds whose writer reached its count of commits and was then
   *     killed (the others died or hung before it)
   * @param acknowledged ids of every case a writer reported as committed
   * @param stored ids of every case in the file afterwards
   * @param integrity SQLite's {@code integrity_check} answer ({@code ok} when sound)
   * @param casesNotWhole cases whose readings, suspects or notes are not all there
   * @param symptomTextRows rows of the symptom full-text index (one per stored case when sound)
   */
  record Result(
      int rounds,
      int roundsKilledAtTheirCount,
      Set<String> acknowledged,
      Set<String> stored,
      String integrity,
      List<String> casesNotWhole,
      int symptomTextRows) {

    /** Returns the acknowledged cases that are not in the file: writes lost. */
    Set<String> lost() {
      Set<String> lost = new HashSet<>(acknowledged);
      lost.removeAll(stored);
      return lost;
    }
  }

  /**
   * Runs the rounds against {@code file} and checks it.
   *
   * @param maxCommits each round's writer is killed after 1 to this many acknowledged commits
   * @throws SQLException if the file cannot be read afterwards, or a full-text index fails its
   *     integrity check
   */
  static Result run(Path file, int rounds, long seed, int maxCommits)
      throws IOException, InterruptedException, SQLException {
    Random random = new Random(seed);
    Set<String> acknowledged = ConcurrentHashMap.newKeySet();
    int killedAtCount = 0;
    for (int round = 0; round < rounds; round++) {
      int count = 1 + random.nextInt(maxCommits);
      Process child = start(file, "KILL-" + round, 0);
      Reader reader = new Reader(child, acknowledged, count);
      reader.start();
      boolean reached = reader.reached.await(COUNT_TIMEOUT_SECONDS, TimeUnit.SECONDS);
      child.destroyForcibly();
      if (!child.waitFor(30, TimeUnit.SECONDS)) {
        throw new IllegalStateException("writer of round " + round + " did not die");
      }
      reader.join(10_000);
      if (reached) {
        killedAtCount++;
      }
    }
    return check(file, rounds, killedAtCount, acknowledged);
  }

  private static Result check(Path file, int rounds, int killedAtCount, Set<String> acknowledged)
      throws SQLException {
    String integrity;
    try (HistoryStore store = SqliteHistory.open(file)) {
      integrity = store.transfer().integrityCheck();
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + file)) {
      Set<String> stored = new HashSet<>(strings(c, "SELECT id FROM repair_case"));
      List<String> notWhole = new ArrayList<>();
      notWhole.addAll(
          strings(
              c,
              "SELECT c.id FROM repair_case c WHERE (SELECT count(*) FROM reading r"
                  + " WHERE r.case_id = c.id) <> "
                  + WriterProcess.READINGS));
      notWhole.addAll(
          strings(
              c,
              "SELECT c.id FROM repair_case c WHERE (SELECT count(*) FROM case_note n"
                  + " WHERE n.case_id = c.id) <> "
                  + WriterProcess.NOTES));
      notWhole.addAll(
          strings(
              c,
              "SELECT c.id FROM repair_case c WHERE (SELECT count(*) FROM suspect s JOIN"
                  + " suspect_list l ON l.id = s.suspect_list_id WHERE l.case_id = c.id) <> "
                  + WriterProcess.SUSPECTS));
      // FTS5's own check: throws when an index does not match its table.
      execute(c, "INSERT INTO symptom_text (symptom_text) VALUES ('integrity-check')");
      execute(c, "INSERT INTO note_text (note_text) VALUES ('integrity-check')");
      int symptomRows = Integer.parseInt(strings(c, "SELECT count(*) FROM symptom_text").get(0));
      return new Result(
          rounds,
          killedAtCount,
          Set.copyOf(acknowledged),
          stored,
          integrity,
          notWhole,
          symptomRows);
    }
  }

  /** Starts a writer JVM on the class path of this one. */
  static Process start(Path file, String label, int count) throws IOException {
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    ProcessBuilder builder =
        new ProcessBuilder(
            java,
            "-Xshare:auto",
            "-XX:TieredStopAtLevel=1",
            "-Dslf4j.internal.verbosity=ERROR",
            "-cp",
            System.getProperty("java.class.path"),
            WriterProcess.class.getName(),
            file.toString(),
            label,
            Integer.toString(count));
    builder.redirectError(ProcessBuilder.Redirect.DISCARD);
    return builder.start();
  }

  /** Collects the ids a writer reports as committed and says when it has reached its count. */
  static final class Reader extends Thread {
    private final Process child;
    private final Set<String> reported;
    private final int count;
    final CountDownLatch reached = new CountDownLatch(1);
    volatile int committed;

    Reader(Process child, Set<String> reported, int count) {
      this.child = child;
      this.reported = reported;
      this.count = count;
      setDaemon(true);
    }

    @Override
    public void run() {
      try (BufferedReader in =
          new BufferedReader(
              new InputStreamReader(child.getInputStream(), StandardCharsets.UTF_8))) {
        for (String line; (line = in.readLine()) != null; ) {
          if (line.startsWith("committed ")) {
            reported.add(line.substring("committed ".length()));
            committed++;
            if (committed == count) {
              reached.countDown();
            }
          }
        }
      } catch (IOException e) {
        // The child was killed mid-line: what was read before is what it reported.
      }
    }
  }

  static List<String> strings(Connection c, String sql) throws SQLException {
    List<String> values = new ArrayList<>();
    try (PreparedStatement s = c.prepareStatement(sql);
        ResultSet rs = s.executeQuery()) {
      while (rs.next()) {
        values.add(rs.getString(1));
      }
    }
    return values;
  }

  private static void execute(Connection c, String sql) throws SQLException {
    try (PreparedStatement s = c.prepareStatement(sql)) {
      s.execute();
    }
  }

  /**
   * Runs the rounds and prints the figures. Arguments: the history file (a new one), the number of
   * rounds, and optionally the seed and the largest count of commits before a kill.
   */
  public static void main(String[] args) throws Exception {
    Path file = Path.of(args[0]);
    int rounds = Integer.parseInt(args[1]);
    long seed = args.length > 2 ? Long.parseLong(args[2]) : 20260304L;
    int maxCommits = args.length > 3 ? Integer.parseInt(args[3]) : 8;
    long start = System.nanoTime();
    Result r;
    try {
      r = run(file, rounds, seed, maxCommits);
    } catch (SQLException e) {
      throw new UncheckedIOException(new IOException("the file failed a check: " + e, e));
    }
    System.out.printf(
        Locale.ROOT,
        "rounds: %d (killed at their count: %d), seed %d, 1..%d commits before each kill%n"
            + "acknowledged writes: %d, stored cases: %d, acknowledged writes lost: %d%n"
            + "cases not whole: %d, integrity_check: %s, symptom index rows: %d%n"
            + "time: %.0f s%n",
        r.rounds(),
        r.roundsKilledAtTheirCount(),
        seed,
        maxCommits,
        r.acknowledged().size(),
        r.stored().size(),
        r.lost().size(),
        r.casesNotWhole().size(),
        r.integrity(),
        r.symptomTextRows(),
        (System.nanoTime() - start) / 1e9);
    boolean sound =
        r.lost().isEmpty()
            && r.casesNotWhole().isEmpty()
            && r.integrity().equals("ok")
            && r.symptomTextRows() == r.stored().size()
            && r.roundsKilledAtTheirCount() == r.rounds();
    System.exit(sound ? 0 : 1);
  }
}
