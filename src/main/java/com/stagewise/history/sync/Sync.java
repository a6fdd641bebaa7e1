package com.stagewise.history.sync;

import com.stagewise.history.ImportReport;
import com.stagewise.history.ShopServer;
import com.stagewise.history.StorageException;
import com.stagewise.history.SyncLedger;
import com.stagewise.history.record.HistoryBundle;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Syncs a bench's history with the shop server: everyone else's records come down, the bench's new
 * and changed records go up, both merged by id with the bundle rules, and the shop-wide fault
 * counts are kept on the bench for working offline.
 *
 * <p>Nothing is lost or doubled when a sync is cut at any point: records come down in small
 * batches, each merged in one transaction on the bench, and the bench notes the server's change
 * number it has merged through only after all of them; records go up one case (with its records)
 * per server transaction, and a record leaves the bench's pending list only after the server
 * committed it. A cut sync therefore repeats some work next time, which merges as unchanged.
 * Conflicts (the same record changed on both sides) are reported and each side keeps its copy.
 */
public final class Sync {
  /** Cases per bench transaction when merging what came down. */
  static final int CASES_PER_MERGE = 100;

  /** Batches read from the bench's pending list at a time. */
  static final int BATCHES_PER_READ = 200;

  private final SyncLedger bench;
  private final ShopServer server;
  private final String benchName;
  private final String programVersion;
  private final Clock clock;

  /**
   * Creates a sync of {@code bench} (named {@code benchName} in the server's conflict messages)
   * with {@code server}.
   */
  public Sync(
      SyncLedger bench, ShopServer server, String benchName, String programVersion, Clock clock) {
    this.bench = Objects.requireNonNull(bench, "bench");
    this.server = Objects.requireNonNull(server, "server");
    this.benchName = benchName;
    this.programVersion = programVersion;
    this.clock = clock;
  }

  /** Told how far a sync has come. */
  @FunctionalInterface
  public interface Progress {
    /**
     * Called after each step.
     *
     * @param phase {@code down} or {@code up}
     * @param done records merged or sent so far in that phase
     * @param total records to merge or send in that phase (as known when it started)
     */
    void step(String phase, int done, int total);

    /** Progress that nobody watches. */
    Progress NONE = (phase, done, total) -> {};
  }

  /**
   * Runs one sync: down, up, the shop's counts.
   *
   * @throws StorageException if the server or the bench fails; what was done until then stays done,
   *     and the next sync finishes the rest
   */
  public SyncReport run(Progress progress) {
    String key = server.address().toString();
    Map<String, ImportReport.Conflict> conflicts = new LinkedHashMap<>();
    int[] down = down(key, progress, conflicts);
    int up = up(progress, conflicts);
    bench.cacheShopCounts(server.confirmedFaultCounts());
    Instant end = clock.instant();
    bench.synced(key, end);
    return new SyncReport(key, down[0], down[1], up, new ArrayList<>(conflicts.values()), end);
  }

  /** Returns {records that came down new or newer, records already here}. */
  private int[] down(String key, Progress progress, Map<String, ImportReport.Conflict> conflicts) {
    long after = bench.pulledThrough(key);
    ShopServer.Changes changes = server.changesSince(after, programVersion);
    List<HistoryBundle> chunks = Bundles.split(changes.bundle(), CASES_PER_MERGE);
    int total = Bundles.size(changes.bundle());
    int done = 0;
    int merged = 0;
    int unchanged = 0;
    for (HistoryBundle chunk : chunks) {
      ImportReport report = bench.mergeFromServer(chunk, "shop server " + key);
      merged += report.added() + report.updated();
      unchanged += report.unchanged();
      for (ImportReport.Conflict c : report.conflicts()) {
        conflicts.putIfAbsent(c.kind() + " " + c.id(), c);
      }
      done += Bundles.size(chunk);
      progress.step("down", Math.min(done, total), total);
    }
    if (changes.through() > after) {
      bench.pulled(key, changes.through());
    }
    return new int[] {merged, unchanged};
  }

  /** Returns how many pending records were sent (conflicting ones not counted). */
  private int up(Progress progress, Map<String, ImportReport.Conflict> conflicts) {
    int total = bench.pendingCount();
    int done = 0;
    int sent = 0;
    while (true) {
      List<SyncLedger.Batch> batches = bench.pendingBatches(BATCHES_PER_READ, programVersion);
      if (batches.isEmpty()) {
        break;
      }
      for (SyncLedger.Batch batch : batches) {
        ImportReport report = server.upload(batch.bundle(), "bench " + benchName);
        var mine = batch.pendingIds();
        int conflicting = 0;
        for (ImportReport.Conflict c : report.conflicts()) {
          // Records that only came along for their children's sake are the server's business.
          if (mine.contains(c.id())) {
            conflicts.putIfAbsent(c.kind() + " " + c.id(), c);
            conflicting++;
          }
        }
        bench.uploaded(batch);
        done += batch.pending().size();
        sent += batch.pending().size() - conflicting;
        progress.step("up", Math.min(done, Math.max(total, done)), Math.max(total, done));
      }
      if (batches.size() < BATCHES_PER_READ) {
        // Whatever is still pending changed again while it went up: the next sync sends it.
        break;
      }
    }
    return sent;
  }
}
