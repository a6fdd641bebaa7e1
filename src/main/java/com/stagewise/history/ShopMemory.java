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
   * with outcome {@code fixed} confirmed each fault id; empty for an unknown model or one with no
   * such case. A case that confirmed two faults counts once for each.
   */
  public Map<String, Integer> faultCounts(String boardModel) {
    return store.cases().confirmedFaultCounts(boardModel);
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
