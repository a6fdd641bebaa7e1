package com.stagewise.history.sqlite;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.SearchQuery;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The history file under process death and under two writers: separate JVMs write cases while this
 * test kills them after a counted number of commits or lets them write the same file at once.
 */
class ProcessFailureTest {
  /** Rounds of write-and-kill; each costs a JVM start (about half a second here). */
  private static final int KILL_ROUNDS = 14;

  /** Each writer is killed after 1 to this many acknowledged commits (seeded). */
  private static final int MOST_COMMITS_BEFORE_KILL = 8;

  private static final long SEED = 20260304L;

  @TempDir Path folder;

  @Test
  void killedWriter_losesNothingReportedAndLeavesNothingHalfWritten() throws Exception {
    Path file = folder.resolve("killed.db");
    // KillRounds waits for each writer's counted commits, then kills it (SIGKILL) in the middle of
    // its next write: no timed sleep, so a loaded machine cannot make a round kill too early.
    KillRounds.Result result = KillRounds.run(file, KILL_ROUNDS, SEED, MOST_COMMITS_BEFORE_KILL);
    assertThat(result.roundsKilledAtTheirCount())
        .as("rounds in which the writer reached its count of commits before the kill")
        .isEqualTo(KILL_ROUNDS);
    // At least one commit a round: the acknowledged cases come from every round.
    assertThat(result.acknowledged()).hasSizeGreaterThanOrEqualTo(KILL_ROUNDS);
    assertThat(result.integrity()).isEqualTo("ok");
    assertThat(result.stored()).containsAll(result.acknowledged());
    assertThat(result.lost()).isEmpty();
    // Every stored case is whole: its readings, suspect list with suspects, and notes.
    assertThat(result.casesNotWhole()).isEmpty();
    // The full-text indexes hold exactly the stored symptoms (FTS5 integrity-check passed in run).
    assertThat(result.symptomTextRows()).isEqualTo(result.stored().size());
  }

  @Test
  void twoWritersAtOnce_loseNothingAndNeverReportLocked() throws Exception {
    Path file = folder.resolve("shared.db");
    // Create the file first, so that both writers find the schema in place.
    SqliteHistory.open(file).close();
    int perWriter = 120;
    Set<String> reported = ConcurrentHashMap.newKeySet();
    List<Process> children = new ArrayList<>();
    List<KillRounds.Reader> readers = new ArrayList<>();
    for (String label : List.of("LEFT", "RIGHT")) {
      Process child = start(file, label, perWriter);
      KillRounds.Reader reader = new KillRounds.Reader(child, reported, perWriter);
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
    try (HistoryStore store = SqliteHistory.open(file)) {
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
}
