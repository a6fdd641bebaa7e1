package com.stagewise.history.postgres;

import com.stagewise.history.ExportSelection;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.ServerAddress;
import com.stagewise.history.SyncLedger;
import com.stagewise.history.demo.SyntheticHistory;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.history.sync.Sync;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.time.Clock;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.UUID;
import java.util.function.Supplier;

/**
 * Measures the shop server beside the bench's file, in one run on one machine (a program, run by
 * {@code src/scripts/bench-server.sh}; not a test).
 *
 * <ol>
 *   <li>Sync of 10,000 generated cases (10 readings, one note each, {@link SyntheticHistory}): up
 *       from a bench to an empty shop schema, then down to an empty second bench; beside it the
 *       same cases carried the bundle way (export from the first bench, import into an empty file).
 *   <li>Search over N generated cases (default 1,000,000; symptom and one note each, words drawn by
 *       Zipf's law over 5,000 words as {@link SyntheticHistory#textWord}), the same rows written to
 *       the server and to a bench file: serial lookup, a rare word, two usual words, the most
 *       common word; each the median of 15 runs after 3 warm-up runs.
 * </ol>
 *
 * <p>Arguments: {@code [CASES_FOR_SEARCH] [FOLDER]}. The server is a throwaway cluster ({@link
 * TestServer}).
 */
public final class ServerMeasure {
  private ServerMeasure() {}

  public static void main(String[] args) throws Exception {
    int searchCases = args.length > 0 ? Integer.parseInt(args[0]) : 1_000_000;
    Path folder =
        args.length > 1 ? Path.of(args[1]) : Files.createTempDirectory("stagewise-measure-");
    Files.createDirectories(folder);
    TestServer server = TestServer.get();
    syncMeasure(server, folder);
    searchMeasure(server, folder, searchCases);
  }

  private static void syncMeasure(TestServer server, Path folder) {
    Path a = folder.resolve("sync-a.db");
    Path b = folder.resolve("sync-b.db");
    Path c = folder.resolve("sync-c.db");
    for (Path p : List.of(a, b, c)) {
      p.toFile().delete();
    }
    ServerAddress address = server.freshShop();
    try (HistoryStore benchA = SqliteHistory.open(a);
        HistoryStore benchB = SqliteHistory.open(b);
        HistoryStore benchC = SqliteHistory.open(c);
        PgHistory shop = PgHistory.open(address, Clock.systemUTC(), server.adminEnvironment())) {
      SyntheticHistory.fill(benchA, 10_000, 10, 7, 2_000);
      int pending = ((SyncLedger) benchA).pendingCount();
      long t0 = System.nanoTime();
      var up = sync(benchA, shop);
      long t1 = System.nanoTime();
      var down = sync(benchB, shop);
      long t2 = System.nanoTime();
      HistoryBundle bundle = benchA.transfer().export(new ExportSelection.All(), "measure");
      var imported = benchC.transfer().importBundle(bundle, "measure");
      long t3 = System.nanoTime();
      System.out.printf(
          Locale.ROOT,
          "sync up, 10,000 cases (%d records pending, %d sent): %.1f s%n",
          pending,
          up.up(),
          (t1 - t0) / 1e9);
      System.out.printf(
          Locale.ROOT,
          "sync down to an empty bench (%d records): %.1f s%n",
          down.down(),
          (t2 - t1) / 1e9);
      System.out.printf(
          Locale.ROOT,
          "bench to bench by bundle, export + import (%d records): %.1f s%n",
          imported.added(),
          (t3 - t2) / 1e9);
    }
  }

  private static com.stagewise.history.sync.SyncReport sync(HistoryStore bench, PgHistory shop) {
    return new Sync((SyncLedger) bench, shop, "measure", "measure", Clock.systemUTC())
        .run(Sync.Progress.NONE);
  }

  private static void searchMeasure(TestServer server, Path folder, int cases) throws Exception {
    Path file = folder.resolve("search-" + cases + ".db");
    file.toFile().delete();
    ServerAddress address = server.freshShop();
    try (HistoryStore made = SqliteHistory.open(file)) {
      made.units().boardModel("warm-up", "");
    }
    try (PgHistory shop = PgHistory.open(address, Clock.systemUTC(), server.adminEnvironment())) {
      shop.units().boardModel("warm-up", "");
    }
    long g0 = System.nanoTime();
    try (Connection pg = PgDatabase.open(address, server.adminEnvironment())) {
      generate(pg, cases, false);
    }
    long g1 = System.nanoTime();
    try (Connection lite = DriverManager.getConnection("jdbc:sqlite:" + file)) {
      generate(lite, cases, true);
    }
    long g2 = System.nanoTime();
    System.out.printf(
        Locale.ROOT,
        "generated %,d cases with a note each: server %.0f s, bench file %.0f s%n",
        cases,
        (g1 - g0) / 1e9,
        (g2 - g1) / 1e9);
    try (HistoryStore bench = SqliteHistory.open(file);
        PgHistory shop = PgHistory.open(address, Clock.systemUTC(), server.adminEnvironment())) {
      String serial = SyntheticHistory.serial(cases / 8);
      String rare = SyntheticHistory.word(2_000);
      String usual = SyntheticHistory.word(20) + " " + SyntheticHistory.word(40);
      String common = SyntheticHistory.word(0);
      List<String[]> rows = new ArrayList<>();
      for (String[] q :
          new String[][] {
            {"serial", serial},
            {"rare word", rare},
            {"two usual words", usual},
            {"most common", common}
          }) {
        SearchQuery query =
            q[0].equals("serial")
                ? SearchQuery.all().withSerial(q[1])
                : SearchQuery.all().withText(q[1]);
        double onServer = median(() -> shop.cases().search(query).size());
        double lite = median(() -> bench.cases().search(query).size());
        rows.add(
            new String[] {
              q[0] + " (" + q[1] + ")",
              String.format(Locale.ROOT, "%.1f ms", onServer),
              String.format(Locale.ROOT, "%.1f ms", lite),
              String.format(Locale.ROOT, "%.1f", onServer / lite)
            });
      }
      System.out.printf(
          Locale.ROOT, "search over %,d cases: query | server | bench file | ratio%n", cases);
      for (String[] row : rows) {
        System.out.println(String.join(" | ", row));
      }
    }
  }

  private static double median(Supplier<Integer> search) {
    for (int i = 0; i < 3; i++) {
      search.get();
    }
    double[] ms = new double[15];
    for (int i = 0; i < ms.length; i++) {
      long t = System.nanoTime();
      search.get();
      ms[i] = (System.nanoTime() - t) / 1e6;
    }
    Arrays.sort(ms);
    return ms[ms.length / 2];
  }

  /** Writes the same generated rows (seeded) to either store, in batches. */
  private static void generate(Connection c, int cases, boolean sqlite) throws SQLException {
    Random random = new Random(11);
    c.setAutoCommit(false);
    String model = new UUID(random.nextLong(), random.nextLong()).toString();
    try (PreparedStatement m =
        c.prepareStatement(
            "INSERT INTO board_model (id, name, maker, notes, updated_at) VALUES (?, ?, '', '', 0)")) {
      m.setString(1, model);
      m.setString(2, "Generated board");
      m.executeUpdate();
    }
    int units = SyntheticHistory.unitsFor(cases);
    List<String> unitIds = new ArrayList<>(units);
    try (PreparedStatement u =
        c.prepareStatement(
            "INSERT INTO unit (id, serial, board_model_id, owner, updated_at)"
                + " VALUES (?, ?, ?, '', 0)")) {
      for (int i = 0; i < units; i++) {
        String id = new UUID(random.nextLong(), random.nextLong()).toString();
        unitIds.add(id);
        u.setString(1, id);
        u.setString(2, SyntheticHistory.serial(i));
        u.setString(3, model);
        u.addBatch();
        if (i % 5_000 == 4_999) {
          u.executeBatch();
        }
      }
      u.executeBatch();
    }
    try (PreparedStatement rc =
            c.prepareStatement(
                "INSERT INTO repair_case (id, unit_id, opened_at, symptom, status, closed_at,"
                    + " outcome, updated_at) VALUES (?, ?, ?, ?, 'open', NULL, NULL, ?)");
        PreparedStatement note =
            c.prepareStatement(
                "INSERT INTO case_note (id, case_id, at, text, updated_at) VALUES (?, ?, ?, ?, ?)")) {
      for (int i = 0; i < cases; i++) {
        String id = new UUID(random.nextLong(), random.nextLong()).toString();
        long at = 1_600_000_000_000L + i * 60_000L;
        rc.setString(1, id);
        rc.setString(2, unitIds.get(i % units));
        rc.setLong(3, at);
        rc.setString(4, sentence(random, 8));
        rc.setLong(5, at);
        rc.addBatch();
        note.setString(1, new UUID(random.nextLong(), random.nextLong()).toString());
        note.setString(2, id);
        note.setLong(3, at);
        note.setString(4, sentence(random, 14));
        note.setLong(5, at);
        note.addBatch();
        if (i % 5_000 == 4_999) {
          rc.executeBatch();
          note.executeBatch();
          if (!sqlite) {
            c.commit();
          }
        }
      }
      rc.executeBatch();
      note.executeBatch();
    }
    c.commit();
  }

  private static String sentence(Random random, int words) {
    StringBuilder text = new StringBuilder();
    for (int w = 0; w < words; w++) {
      if (w > 0) {
        text.append(' ');
      }
      text.append(SyntheticHistory.textWord(random));
    }
    return text.toString();
  }
}
