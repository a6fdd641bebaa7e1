package com.stagewise.interchange.history;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.demo.SyntheticHistory;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Importing a bundle of 10,000 cases (100,000 readings, 10,000 notes, about 7,000 actions, 2,500
 * units): reading the JSON and merging it into an empty history in one transaction.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 5)
@Fork(1)
public class HistoryImportBenchmark {
  private byte[] json;
  private Path folder;
  private HistoryStore target;

  @Setup(Level.Trial)
  public void makeBundle() throws Exception {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    HistoryBundleJson.write(SyntheticHistory.bundle(10_000, 10, 7), out);
    json = out.toByteArray();
    folder = Files.createTempDirectory("stagewise-import-bench");
  }

  @Setup(Level.Invocation)
  public void emptyHistory() {
    target = SqliteHistory.open(folder.resolve("import-" + System.nanoTime() + ".db"));
  }

  /** Closes and deletes each imported history (about 40 MB each), so that none piles up. */
  @TearDown(Level.Invocation)
  public void closeHistory() throws IOException {
    target.close();
    deleteEverythingIn(folder);
  }

  /** Deletes the temporary folder, so that a run leaves nothing behind. */
  @TearDown(Level.Trial)
  public void removeFolder() throws IOException {
    deleteEverythingIn(folder);
    Files.deleteIfExists(folder);
  }

  private static void deleteEverythingIn(Path folder) throws IOException {
    // The history file and its journal files (-wal, -shm) beside it.
    try (Stream<Path> files = Files.list(folder)) {
      for (Path f : files.toList()) {
        Files.deleteIfExists(f);
      }
    }
  }

  @Benchmark
  public ImportReport importTenThousandCases() {
    return target
        .transfer()
        .importBundle(
            HistoryBundleJson.read(new ByteArrayInputStream(json), "bench.json"), "bench.json");
  }
}
