package com.stagewise.history.sqlite;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.SearchQuery;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The history file under process death and under two writers: separate JVMs write cases while this
 * test kills them at random moments or lets them write the same file at once.
 */
class ProcessFailureTest {
  /** Rounds of write-and-kill; each costs a JVM start (about half a second here). */
  private static final int KILL_ROUNDS = 14;

  private static final long SEED = 20260304L;

  @TempDir Path folder;

  @Test
  void killedWriter_losesNothingReportedAndLeavesNothingHalfWritten() throws Exception {
    Path file = folder.resolve("killed.db");
    Random random = new Random(SEED);
    Set<String> reported = ConcurrentHashMap.newKeySet();
    int roundsKilledMidWrite = 0;
    for (int round = 0; round < KILL_ROUNDS; round++) {
      Process child = start(file, "KILL-" + round, 0);
      Reader reader = new Reader(child, reported);
      reader.start();
      assertThat(reader.awaitReady()).as("writer %d started", round).isTrue();
      // Let it write for 20 to 300 ms, then kill it at once (SIGKILL: no shutdown hooks run).
      Thread.sleep(20 + random.nextInt(280));
      child.destroyForcibly();
      assertThat(child.waitFor(30, TimeUnit.SECONDS)).isTrue();
      reader.join(10_000);
      if (reader.committed > 0) {
        roundsKilledMidWrite++;
      }
    }
    assertThat(roundsKilledMidWrite)
        .as("rounds in which cases were written before the kill")
        .isGreaterThan(KILL_ROUNDS / 2);
    assertThat(reported).isNotEmpty();

    try (HistoryStore store = HistoryStore.open(file)) {
      assertThat(store.transfer().integrityCheck()).isEqualTo("ok");
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + file)) {
      Set<String> stored = ConcurrentHashMap.newKeySet();
      stored.addAll(strings(c, "SELECT id FROM repair_case"));
      assertThat(stored).containsAll(reported);
      // Every stored case is whole: its readings, suspect list with suspects, and notes.
      assertThat(
              strings(
                  c,
                  "SELECT c.id FROM repair_case c WHERE (SELECT count(*) FROM reading r WHERE r.case_id = c.id) <> "
                      + WriterProcess.READINGS))
          .isEmpty();
      assertThat(
              strings(
                  c,
                  "SELECT c.id FROM repair_case c WHERE (SELECT count(*) FROM case_note n WHERE n.case_id = c.id) <> "
                      + WriterProcess.NOTES))
          .isEmpty();
      assertThat(
              strings(
                  c,
                  "SELECT c.id FROM repair_case c WHERE (SELECT count(*) FROM suspect s JOIN suspect_list l"
                      + " ON l.id = s.suspect_list_id WHERE l.case_id = c.id) <> "
                      + WriterProcess.SUSPECTS))
          .isEmpty();
      // The full-text indexes hold exactly the stored symptoms and notes (FTS5 integrity-check).
      execute(c, "INSERT INTO symptom_text (symptom_text) VALUES ('integrity-check')");
      execute(c, "INSERT INTO note_text (note_text) VALUES ('integrity-check')");
      assertThat(strings(c, "SELECT count(*) FROM symptom_text"))
          .containsExactly(Integer.toString(stored.size()));
    }
  }

  @Test
  void twoWritersAtOnce_loseNothingAndNeverReportLocked() throws Exception {
    Path file = folder.resolve("shared.db");
    // Create the file first, so that both writers find the schema in place.
    HistoryStore.open(file).close();
    int perWriter = 120;
    Set<String> reported = ConcurrentHashMap.newKeySet();
    List<Process> children = new ArrayList<>();
    List<Reader> readers = new ArrayList<>();
    for (String label : List.of("LEFT", "RIGHT")) {
      Process child = start(file, label, perWriter);
      Reader reader = new Reader(child, reported);
      reader.start();
      children.add(child);
      readers.add(reader);
    }
    for (int i = 0; i < children.size(); i++) {
      Process child = children.get(i);
      assertThat(child.waitFor(120, TimeUnit.SECONDS)).isTrue();
      readers.get(i).join(10_000);
      String errors = new String(child.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
      assertThat(errors).doesNotContainIgnoringCase("locked").doesNotContainIgnoringCase("busy");
      assertThat(child.exitValue()).as("writer exit code; errors: %s", errors).isZero();
      assertThat(readers.get(i).committed).isEqualTo(perWriter);
    }
    assertThat(reported).hasSize(2 * perWriter);
    try (HistoryStore store = HistoryStore.open(file)) {
      assertThat(store.cases().search(SearchQuery.all().withLimit(10_000))).hasSize(2 * perWriter);
      assertThat(store.transfer().integrityCheck()).isEqualTo("ok");
    }
  }

  private static Process start(Path file, String label, int count) throws IOException {
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
    builder.redirectError(ProcessBuilder.Redirect.PIPE);
    return builder.start();
  }

  /** Collects the ids a writer reports as committed. */
  private static final class Reader extends Thread {
    private final Process child;
    private final Set<String> reported;
    private final java.util.concurrent.CountDownLatch ready =
        new java.util.concurrent.CountDownLatch(1);
    private volatile int committed;

    Reader(Process child, Set<String> reported) {
      this.child = child;
      this.reported = reported;
      setDaemon(true);
    }

    boolean awaitReady() throws InterruptedException {
      return ready.await(60, TimeUnit.SECONDS);
    }

    @Override
    public void run() {
      try (BufferedReader in =
          new BufferedReader(
              new InputStreamReader(child.getInputStream(), StandardCharsets.UTF_8))) {
        for (String line; (line = in.readLine()) != null; ) {
          if (line.equals("ready")) {
            ready.countDown();
          } else if (line.startsWith("committed ")) {
            reported.add(line.substring("committed ".length()));
            committed++;
          }
        }
      } catch (IOException e) {
        // The child was killed mid-line: what was read before is what it reported.
      }
    }
  }

  private static List<String> strings(Connection c, String sql) throws SQLException {
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
}
