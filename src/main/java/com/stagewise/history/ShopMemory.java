package com.stagewise.history;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * The shop's memory of a board model: which faults its closed, fixed cases confirmed, and how to
 * blend those counts into the published fault priors so that a single case does not dominate.
 *
 * <p>The diagnosis takes {@link #blend} of its published priors and {@link #faultCounts} when a
 * case belongs to a known board model, and shows {@link #hint} beside a suspect.
 */
public final class ShopMemory {
  /**
   * How many cases' worth of evidence the published priors count for in {@link #blend}: with 10,
   * one confirmed case moves a fault's prior at most by about a tenth of the way towards certainty,
   * and the shop's own counts outweigh the published priors once the model has more than 10
   * fixed cases. A judgement call (common practice for additive smoothing is a pseudo-count of
   * the order of the catalogue's size or a few tens), not a published figure.
   */
  public static final double DEFAULT_STRENGTH = 10.0;

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
    return store.confirmedFaultCounts(boardModel);
  }

  /**
   * Returns the published priors blended with the shop's counts by additive (Dirichlet, or
   * Laplace) smoothing: {@code p(f) = (strength · q(f) + n(f)) / (strength + N)}, where {@code q}
   * is the published prior normalised to sum to 1, {@code n(f)} the shop's count for fault {@code
   * f} and {@code N} the sum of the counts over the published faults. The published priors act as
   * {@code strength} imaginary cases, so one real case shifts the priors only a little, and many
   * cases come to dominate.
   *
   * <p>The result has exactly the keys of {@code publishedPriors} and sums to 1. Counts for faults
   * that are not among the published priors are ignored (the diagnosis cannot rank a fault it does
   * not know). Priors that are all zero are taken as uniform.
   *
   * @param publishedPriors relative prior weights per fault id (not negative, finite; they need
   *     not sum to 1)
   * @param counts confirmed cases per fault id (not negative)
   * @param strength the weight of the published priors in cases (positive, finite)
   * @throws IllegalArgumentException for an empty prior map, a negative or non-finite weight, a
   *     negative count or a strength that is not positive
   */
  public static Map<String, Double> blend(
      Map<String, Double> publishedPriors, Map<String, Integer> counts, double strength) {
    if (publishedPriors.isEmpty()) {
      throw new IllegalArgumentException("publishedPriors must name at least one fault");
    }
    if (!(strength > 0) || !Double.isFinite(strength)) {
      throw new IllegalArgumentException("strength (" + strength + ") must be positive and finite");
    }
    double total = 0;
    for (Map.Entry<String, Double> prior : publishedPriors.entrySet()) {
      double weight = prior.getValue();
      if (!(weight >= 0) || !Double.isFinite(weight)) {
        throw new IllegalArgumentException(
            "prior of " + prior.getKey() + " (" + weight + ") must be a finite number >= 0");
      }
      total += weight;
    }
    long seen = 0;
    for (Map.Entry<String, Integer> count : counts.entrySet()) {
      if (count.getValue() < 0) {
        throw new IllegalArgumentException(
            "count of " + count.getKey() + " (" + count.getValue() + ") must be >= 0");
      }
      if (publishedPriors.containsKey(count.getKey())) {
        seen += count.getValue();
      }
    }
    int faults = publishedPriors.size();
    Map<String, Double> blended = new LinkedHashMap<>();
    for (Map.Entry<String, Double> prior : publishedPriors.entrySet()) {
      double q = total > 0 ? prior.getValue() / total : 1.0 / faults;
      int n = counts.getOrDefault(prior.getKey(), 0);
      blended.put(prior.getKey(), (strength * q + n) / (strength + seen));
    }
    return blended;
  }

  /** Returns {@link #blend} with {@link #DEFAULT_STRENGTH}. */
  public static Map<String, Double> blend(
      Map<String, Double> publishedPriors, Map<String, Integer> counts) {
    return blend(publishedPriors, counts, DEFAULT_STRENGTH);
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
