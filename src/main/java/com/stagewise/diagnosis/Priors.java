package com.stagewise.diagnosis;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Prior probabilities of the faults of a stage, in one place.
 *
 * <p>Each fault's weight is the relative failure rate of the item it is on times the share of that
 * item's failures in that mode. The mode shares follow the failure-mode distributions published in
 * the Reliability Analysis Center's FMD-97 and reproduced in MIL-HDBK-338B (from memory; rounded):
 * fixed film resistor open 59 %, parameter change 36 %, short 5 %; ceramic capacitor short 49 %,
 * change of value 29 %, open 22 %; linear IC improper output 77 %, no output 23 %. The relative
 * rates between items (a section, a resistor, a joint, a rail) and the split of drift into high and
 * low are common practice at the repair bench, not from a published table.
 *
 * <p>The shop's own history is blended in by additive smoothing: each confirmed fault of a closed
 * case on the same board model counts as one observation against {@link #SHOP_STRENGTH} pseudo
 * observations spread as the published priors, so one case does not dominate.
 */
public final class Priors {
  /**
   * Share of the prior on "healthy": the stage is suspect, but often turns out fine (common
   * practice).
   */
  static final double HEALTHY_SHARE = 0.2;

  /**
   * Pseudo-count of the published priors when blending with the shop's counts: after 20 confirmed
   * cases on a model, its own history weighs as much as the published figures.
   */
  public static final double SHOP_STRENGTH = 20;

  // Relative failure rates per item (common practice, from memory): a supply rail that fails
  // (blown fuse, dead regulator, broken connector) is the most common cause of a dead stage.
  private static final double SECTION_RATE = 2.0;
  private static final double RESISTOR_RATE = 1.0;
  private static final double CAPACITOR_RATE = 1.0;

  /** Diodes, zeners and LEDs fail about as often as a fixed resistor (common practice). */
  private static final double DIODE_RATE = 1.0;

  /** Trimmers fail (and are turned) more often than fixed resistors: twice (common practice). */
  private static final double TRIMMER_RATE = 2.0;

  private static final double JOINT_RATE = 0.25;
  private static final double BRIDGE_RATE = 0.08;
  private static final double RAIL_RATE = 2.5;

  private Priors() {}

  /** Returns the published prior of every fault, normalised to sum to 1. */
  public static Map<String, Double> published(Stage stage, List<Fault> faults) {
    Map<String, Double> weights = new LinkedHashMap<>();
    double faultTotal = 0;
    for (Fault fault : faults) {
      if (fault.kind() != FaultKind.HEALTHY) {
        double w = weight(stage, fault);
        weights.put(fault.id(), w);
        faultTotal += w;
      }
    }
    Map<String, Double> priors = new LinkedHashMap<>();
    priors.put(Fault.HEALTHY.id(), HEALTHY_SHARE);
    for (Map.Entry<String, Double> e : weights.entrySet()) {
      priors.put(e.getKey(), (1 - HEALTHY_SHARE) * e.getValue() / faultTotal);
    }
    return priors;
  }

  /**
   * Returns the published priors blended with the shop's counts by additive (Dirichlet, or Laplace)
   * smoothing: {@code p(f) = (strength · q(f) + n(f)) / (strength + N)}, where {@code q} is the
   * published prior normalised to sum to 1, {@code n(f)} the shop's count for fault {@code f} and
   * {@code N} the sum of the counts over the published faults. The published priors act as {@code
   * strength} imaginary cases, so one real case shifts the priors only a little, and many cases
   * come to dominate.
   *
   * <p>The result has exactly the keys of {@code publishedPriors} and sums to 1. Counts for faults
   * that are not among the published priors are ignored (the diagnosis cannot rank a fault it does
   * not know). Priors that are all zero are taken as uniform.
   *
   * @param publishedPriors relative prior weights per fault id (not negative, finite; they need not
   *     sum to 1)
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

  /** Returns {@link #blend} with {@link #SHOP_STRENGTH}. */
  public static Map<String, Double> blend(
      Map<String, Double> publishedPriors, Map<String, Integer> counts) {
    return blend(publishedPriors, counts, SHOP_STRENGTH);
  }

  private static double weight(Stage stage, Fault fault) {
    String s = fault.subject();
    return switch (fault.kind()) {
      case HEALTHY -> 0;
      case OPEN, SHORT, HIGH, LOW, LEAKY, WIPER_OPEN, MISSET -> {
        Part part = stage.part(s).orElse(null);
        PartKind kind = part == null ? PartKind.RESISTOR : part.kind();
        yield switch (kind) {
          case RESISTOR -> RESISTOR_RATE * resistorShare(fault.kind());
          case CAPACITOR -> CAPACITOR_RATE * capacitorShare(fault.kind());
          case DIODE, LED -> DIODE_RATE * diodeShare(fault.kind());
          case ZENER -> DIODE_RATE * zenerShare(fault.kind());
          case TRIMMER, POTENTIOMETER -> TRIMMER_RATE * trimmerShare(fault.kind());
        };
      }
      // Improper output 77 % is split evenly between the two limits; no output 23 %.
      case STUCK_HIGH, STUCK_LOW -> SECTION_RATE * 0.385;
      case DEAD -> SECTION_RATE * 0.23;
      case LIFTED -> JOINT_RATE;
      case BRIDGE -> BRIDGE_RATE;
      case RAIL_MISSING -> RAIL_RATE * 0.6;
      case RAIL_LOW -> RAIL_RATE * 0.4;
    };
  }

  private static double resistorShare(FaultKind kind) {
    return switch (kind) {
      case OPEN -> 0.59;
      case SHORT -> 0.05;
      // Film resistors drift upward far more often than downward (common practice): 2 to 1.
      case HIGH -> 0.24;
      case LOW -> 0.12;
      default -> 0;
    };
  }

  /**
   * Small-signal diodes and LEDs: short 49 %, open 36 %, parameter change (here: leaky) 15 %, the
   * RAC FMD-97 shares for general-purpose diodes as MIL-HDBK-338B reproduces them (from memory,
   * rounded).
   */
  private static double diodeShare(FaultKind kind) {
    return switch (kind) {
      case SHORT -> 0.49;
      case OPEN -> 0.36;
      case LEAKY -> 0.15;
      default -> 0;
    };
  }

  /**
   * Zeners: parameter change 69 % (split between voltage high, low and leaky), open 18 %, short 13
   * % (the same sources for voltage-reference diodes, from memory, rounded).
   */
  private static double zenerShare(FaultKind kind) {
    return switch (kind) {
      case HIGH -> 0.25;
      case LOW -> 0.25;
      case LEAKY -> 0.19;
      case OPEN -> 0.18;
      case SHORT -> 0.13;
      default -> 0;
    };
  }

  /**
   * Trimmers: an open track about half, an erratic or lifted wiper about a third (the same sources
   * for variable resistors, from memory, rounded); a misset one is common enough on the bench to
   * get the rest (common practice).
   */
  private static double trimmerShare(FaultKind kind) {
    return switch (kind) {
      case OPEN -> 0.35;
      case WIPER_OPEN -> 0.35;
      case MISSET -> 0.30;
      default -> 0;
    };
  }

  private static double capacitorShare(FaultKind kind) {
    return switch (kind) {
      case SHORT -> 0.49;
      case OPEN -> 0.22;
      // Ceramic capacitors lose capacitance with age and bias far more often than they gain it.
      case LOW -> 0.2;
      case HIGH -> 0.09;
      default -> 0;
    };
  }
}
