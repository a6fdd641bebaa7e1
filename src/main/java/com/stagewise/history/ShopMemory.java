package com.stagewise.history;

import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * The shop's memory of a board model: which faults its closed, fixed cases confirmed.
 *
 * <p>The diagnosis blends {@link #faultCounts} into its published priors ({@code
 * com.stagewise.diagnosis.Priors#blend}) when a case belongs to a known board model, and a hint
 * like {@link #hint} stands beside a suspect.
 */
public final class ShopMemory {
  private final HistoryStore store;

  /** Creates the memory of the shop whose history is {@code store}. */
  public ShopMemory(HistoryStore store) {
    this.store = Objects.requireNonNull(store, "store");
  }

  /**
   * Returns, for a board model (its name, ignoring letter case, or its id), how many closed cases
   * with outcome {@code fixed} confirmed each fault id, most often first; empty for an unknown
   * model or one with no such case. A case that confirmed two faults counts once for each. On a
   * bench that syncs with a shop server, the shop-wide counts kept at the last sync are blended in
   * (per fault the larger count), so the memory is the whole shop's, offline too.
   */
  public Map<String, Integer> faultCounts(String boardModel) {
    Map<String, Integer> own = store.cases().confirmedFaultCounts(boardModel);
    if (!(store instanceof SyncLedger ledger)) {
      return own;
    }
    // The shop server's counts, kept on the bench at its last sync, hold this bench's synced
    // cases too: per fault the larger of the two counts is the shop's (cases not yet sent are in
    // the bench's own count only). Adding them would count the bench's synced cases twice.
    String name = store.units().findBoardModel(boardModel).map(m -> m.name()).orElse(boardModel);
    Map<String, Integer> shop = ledger.shopCounts(name);
    if (shop.isEmpty()) {
      return own;
    }
    Map<String, Integer> blended = new java.util.LinkedHashMap<>(own);
    shop.forEach((fault, n) -> blended.merge(fault, n, Math::max));
    java.util.List<Map.Entry<String, Integer>> sorted =
        new java.util.ArrayList<>(blended.entrySet());
    sorted.sort(
        Map.Entry.<String, Integer>comparingByValue()
            .reversed()
            .thenComparing(Map.Entry.comparingByKey()));
    Map<String, Integer> ordered = new java.util.LinkedHashMap<>();
    sorted.forEach(e -> ordered.put(e.getKey(), e.getValue()));
    return ordered;
  }

  /**
   * Returns the hint shown beside a suspect, such as "seen 3 times on this model", or empty when
   * the fault was never confirmed on the model.
   */
  public static Optional<String> hint(String faultId, Map<String, Integer> counts) {
    int n = counts.getOrDefault(faultId, 0);
    if (n <= 0) {
      return Optional.empty();
    }
    return Optional.of(n == 1 ? "seen once on this model" : "seen " + n + " times on this model");
  }
}
