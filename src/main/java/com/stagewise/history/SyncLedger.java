package com.stagewise.history;

import com.stagewise.history.record.HistoryBundle;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * A bench's side of syncing with the shop server (the bench's file implements it): which of its
 * records the server has not yet confirmed, what it last merged from the server, and the server's
 * shop-wide fault counts kept for working offline.
 *
 * <p>A record added or changed on the bench is listed as pending until {@link #uploaded} confirms
 * the very change that was sent; a change made meanwhile keeps it listed. Records merged from the
 * server are not listed (unless the bench kept its own, differing copy).
 */
public interface SyncLedger {

  /** Returns how many records wait to go up. */
  int pendingCount();

  /**
   * Returns up to {@code max} batches of pending records, each one small bundle that stands on its
   * own: a case with its pending readings, suspect lists, actions and notes (and its unit and board
   * model, which the server may know under other ids), or a unit, or a board model with its pending
   * stage sheets.
   */
  List<Batch> pendingBatches(int max, String programVersion);

  /** Marks a batch's records as on the server, unless one changed again since it was read. */
  void uploaded(Batch batch);

  /**
   * Merges records from the server in one transaction, by the bundle rules, and takes every merged
   * record off the pending list (a conflict stays: the bench's own copy was kept).
   */
  ImportReport mergeFromServer(HistoryBundle bundle, String source);

  /** Returns the last change number merged from {@code server}, 0 if none. */
  long pulledThrough(String server);

  /** Records that everything from {@code server} up to change number {@code through} is merged. */
  void pulled(String server, long through);

  /** Records that a sync with {@code server} ended at {@code at}. */
  void synced(String server, Instant at);

  /** Returns when the last sync with {@code server} (or any server, for null) ended, if ever. */
  Optional<Instant> lastSync(String server);

  /** Replaces the cached shop-wide confirmed-fault counts (board model name → fault → count). */
  void cacheShopCounts(Map<String, Map<String, Integer>> counts);

  /** Returns the cached shop-wide counts of a board model (by name, ignoring case). */
  Map<String, Integer> shopCounts(String boardModelName);

  /**
   * A record waiting to go up.
   *
   * @param kind its kind (the bundle check's names: {@code case}, {@code note}, …)
   * @param id its id
   * @param version how many changes of it the list has seen
   */
  record Pending(String kind, String id, long version) {}

  /**
   * One bundle to upload in one transaction, and the pending records it carries.
   *
   * @param bundle the records, with the parents they need
   * @param pending the pending records in it (the others are there for their children's sake)
   */
  record Batch(HistoryBundle bundle, List<Pending> pending) {
    public Batch {
      pending = List.copyOf(pending);
    }

    /** Returns the ids of the pending records. */
    public Set<String> pendingIds() {
      return pending.stream().map(Pending::id).collect(Collectors.toSet());
    }
  }
}
