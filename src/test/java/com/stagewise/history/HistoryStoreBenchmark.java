package com.stagewise.history;

import com.stagewise.history.demo.SyntheticHistory;
import com.stagewise.history.sqlite.SqliteHistory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
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
 * Lookups in a large history: 100,000 cases with 10 readings each (1,000,000 readings), one note
 * each, 25,000 units of 50 board models (generated, {@link SyntheticHistory}).
 *
 * <p>Full-text queries return the default 50 best hits with snippets. The database is {@code
 * -Dstagewise.bench.db=FILE} (default {@code target/bench/history-100k.db}); it is generated on
 * first use (see DEVELOPERS.md, "History store"). Sample time: the median is the {@code p0.50} line
 * of JMH's report.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class HistoryStoreBenchmark {
  static final int CASES = 100_000;
  static final int READINGS_PER_CASE = 10;

  private HistoryStore store;
  private List<String> unitIds;
  private final Random random = new Random(42);

  @Setup(Level.Trial)
  public void open() throws Exception {
    Path file = Path.of(System.getProperty("stagewise.bench.db", "target/bench/history-100k.db"));
    boolean fresh = !Files.exists(file);
    store = SqliteHistory.open(file);
    if (fresh) {
      SyntheticHistory.fill(store, CASES, READINGS_PER_CASE, 1, 2_000);
    }
    unitIds = store.units().list(null).stream().map(u -> u.id()).toList();
  }

  @TearDown(Level.Trial)
  public void close() {
    store.close();
  }

  @Benchmark
  public List<SearchHit> searchBySerial() {
    int unit = random.nextInt(SyntheticHistory.unitsFor(CASES));
    return store.cases().search(SearchQuery.all().withSerial(SyntheticHistory.serial(unit)));
  }

  /** A word picked uniformly from the vocabulary: a specific word, in few texts (typical query). */
  @Benchmark
  public List<SearchHit> fullTextSpecificWord() {
    return store
        .cases()
        .search(
            SearchQuery.all()
                .withText(SyntheticHistory.word(random.nextInt(SyntheticHistory.VOCABULARY))));
  }

  /** Two words drawn as they occur in the texts (so often common ones), both required. */
  @Benchmark
  public List<SearchHit> fullTextTwoUsualWords() {
    return store
        .cases()
        .search(
            SearchQuery.all()
                .withText(
                    SyntheticHistory.textWord(random) + " " + SyntheticHistory.textWord(random)));
  }

  /** The most frequent word, in about a third of all texts: the worst case. */
  @Benchmark
  public List<SearchHit> fullTextMostCommonWord() {
    return store.cases().search(SearchQuery.all().withText(SyntheticHistory.word(0)));
  }

  @Benchmark
  public UnitHistory unitHistory() {
    return store.cases().unitHistory(unitIds.get(random.nextInt(unitIds.size()))).orElseThrow();
  }
}
