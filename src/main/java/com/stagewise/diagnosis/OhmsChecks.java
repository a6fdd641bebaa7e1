package com.stagewise.diagnosis;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.solver.OhmsPrediction;
import com.stagewise.solver.PowerOff;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Power-off (ohms) readings in the diagnosis: their likelihood under each hypothesis, and the ohms
 * checks worth taking next.
 *
 * <p>A hypothesis predicts the reading between two points from {@link PowerOffFaults} (a drifted
 * part at the value that fits the readings best): the nominal resistance with the healthy range of
 * the part tolerances taken as a uniform spread, plus the meter's ohms uncertainty (its half-width
 * as a uniform error) and a floor for the test leads. A reading beyond the meter's top range shows
 * OL; the chance of OL follows from the same normal spread. As with volts, a small share of every
 * reading is a misread (log-uniform over the meter's span), so one slip never eliminates the truth.
 */
final class OhmsChecks {
  /**
   * Resistance of the test leads and their contact, ohms: a few tenths of an ohm unless the meter's
   * relative mode nulls it (common practice); taken as a model floor.
   */
  static final double LEAD_OHMS = 0.3;

  /** Relative model floor (junctions not quite off, board leakage): 0.5 % (common practice). */
  static final double RELATIVE_FLOOR = 0.005;

  /** Decades a misread may land in, log-uniform (0.1 Ω … 1 GΩ). */
  static final double MISREAD_DECADES = 10;

  /** Chance that a misread shows OL. */
  static final double MISREAD_OL = 0.1;

  static final double[] NODES = {0, Math.sqrt(3), -Math.sqrt(3)};
  static final double[] NODE_WEIGHTS = {2.0 / 3, 1.0 / 6, 1.0 / 6};
  private static final int LISTED = 3;

  /**
   * The share of the leading suspects' uncertainty (entropy) an ohms check must resolve to be said
   * to tell them apart (our choice: more than half of what there is to know).
   */
  static final double SPLIT_SHARE = 0.5;

  private final Stage stage;
  private final PowerOff healthy;
  private final CheckPairs checkPairs;

  /**
   * Each fault's network, with its readings at the check pairs: one per value where the network
   * depends on it ({@link PowerOffFaults#takesValue}: a drifted part, a leaky junction, a misset
   * trimmer, an open track), else one per fault.
   */
  private final Map<Object, Faulted> networks = new HashMap<>();

  /** The check pairs' points as found on a faulted stage, by the pair's index. */
  private final String[][] onFaultedPairs;

  /** The resistors across each check pair ("R2"), by the pair's index, found when first asked. */
  private final String[] acrossPairs;

  OhmsChecks(Stage stage) {
    this.stage = stage;
    this.healthy = PowerOff.of(stage);
    this.checkPairs = new CheckPairs(stage, healthy);
    List<String[]> all = checkPairs.all();
    this.onFaultedPairs = new String[all.size()][];
    for (int k = 0; k < onFaultedPairs.length; k++) {
      onFaultedPairs[k] = new String[] {onFaulted(all.get(k)[0]), onFaulted(all.get(k)[1])};
    }
    this.acrossPairs = new String[all.size()];
  }

  /** A fault's power-off network and what it reads at each check pair, filled as asked. */
  private static final class Faulted {
    final PowerOff network;
    final OhmsPrediction[] atPair;

    Faulted(PowerOff network, int pairs) {
      this.network = network;
      this.atPair = new OhmsPrediction[pairs];
    }
  }

  /** Returns whether a point names a net, package pin or part lead of the stage. */
  boolean knows(String point) {
    return healthy.node(point).isPresent();
  }

  /** Returns the net a part lead sits on, or the point itself for a net or pin. */
  String onFaulted(String point) {
    return PowerOffFaults.onFaulted(healthy, point);
  }

  /** Returns the prediction between two points under a fault (value: a drifted part's value). */
  synchronized OhmsPrediction predict(Fault fault, double value, String a, String b) {
    return faulted(fault, value).network.predict(onFaulted(a), onFaulted(b));
  }

  /**
   * Returns the predictions at every check pair ({@link CheckPairs#all()}) under a fault (value: a
   * drifted part's value); do not change the array.
   */
  synchronized OhmsPrediction[] predictAll(Fault fault, double value) {
    Faulted f = faulted(fault, value);
    for (int k = 0; k < f.atPair.length; k++) {
      at(f, k);
    }
    return f.atPair;
  }

  /** Returns the predictions at the pairs given (indices of {@link CheckPairs#all()}), by pair. */
  private synchronized OhmsPrediction[][] predictAt(List<Diagnoser.Scored> top, int[] pairs) {
    Faulted[] faulted = new Faulted[top.size()];
    for (int h = 0; h < faulted.length; h++) {
      faulted[h] = faulted(top.get(h).hypothesis.fault, top.get(h).best.value());
    }
    OhmsPrediction[][] out = new OhmsPrediction[pairs.length][faulted.length];
    for (int k = 0; k < pairs.length; k++) {
      for (int h = 0; h < faulted.length; h++) {
        out[k][h] = at(faulted[h], pairs[k]);
      }
    }
    return out;
  }

  private OhmsPrediction at(Faulted f, int pair) {
    OhmsPrediction p = f.atPair[pair];
    if (p == null) {
      p = f.network.predict(onFaultedPairs[pair][0], onFaultedPairs[pair][1]);
      f.atPair[pair] = p;
    }
    return p;
  }

  private Faulted faulted(Fault fault, double value) {
    boolean drift = fault.kind() == FaultKind.HIGH || fault.kind() == FaultKind.LOW;
    // Keyed by the value wherever the network depends on it: a leaky junction's or a misset
    // trimmer's network kept under its id alone would answer for every later value with the
    // first one's, so that what was asked before changed the answer.
    Object key =
        PowerOffFaults.takesValue(fault.kind()) ? new FaultAtValue(fault.id(), value) : fault.id();
    Faulted kept = networks.get(key);
    if (kept == null) {
      kept =
          new Faulted(
              drift && Double.isNaN(value) ? healthy : PowerOffFaults.faulted(stage, fault, value),
              onFaultedPairs.length);
      networks.put(key, kept);
    }
    return kept;
  }

  /** Returns the summed log-likelihood of the ohms readings under a fault with a drifted value. */
  double logLikelihood(Fault fault, double value, List<Reading> ohms, MeterSpec meter) {
    double sum = 0;
    for (Reading r : ohms) {
      OhmsPrediction p = predict(fault, value, r.at(), r.to());
      sum += logLikelihood(p, r.isOverRange(), r.value(), meter, r.uncertainty());
    }
    return sum;
  }

  static double logLikelihood(
      OhmsPrediction p,
      boolean overRange,
      double value,
      MeterSpec meter,
      java.util.OptionalDouble given) {
    double pOl = overRangeChance(p, meter);
    if (overRange) {
      return Math.log((1 - Evidence.MISREAD) * pOl + Evidence.MISREAD * MISREAD_OL);
    }
    double tail = (1 - MISREAD_OL) / (Math.max(value, 0.1) * Math.log(10) * MISREAD_DECADES);
    double core = 0;
    if (p.connected()) {
      double variance = variance(p, meter, given);
      double d = value - p.nominal();
      core = (1 - pOl) * Math.exp(-d * d / (2 * variance)) / Math.sqrt(2 * Math.PI * variance);
    }
    return Math.log((1 - Evidence.MISREAD) * core + Evidence.MISREAD * tail);
  }

  /** The variance of a numeric reading about the nominal: tolerances, meter, leads and floor. */
  static double variance(OhmsPrediction p, MeterSpec meter, java.util.OptionalDouble given) {
    double spread = Evidence.SPREAD_MARGIN * (p.high() - p.low()) / Math.sqrt(12);
    double u = given.isPresent() ? given.getAsDouble() : meter.ohmsUncertainty(p.nominal());
    double floor = LEAD_OHMS + RELATIVE_FLOOR * p.nominal();
    return spread * spread + u * u / 3 + floor * floor;
  }

  /** The chance the meter shows OL: beyond its top range, or nothing connects. */
  static double overRangeChance(OhmsPrediction p, MeterSpec meter) {
    if (!p.connected()) {
      return 1;
    }
    double sd = Math.sqrt(variance(p, meter, java.util.OptionalDouble.empty()));
    return normalCdf((p.nominal() - meter.ohmsOverRange()) / sd);
  }

  private static double normalCdf(double z) {
    // Abramowitz and Stegun 7.1.26 for erf (error below 1.5e-7).
    double x = Math.abs(z) / Math.sqrt(2);
    double t = 1 / (1 + 0.3275911 * x);
    double erf =
        1
            - ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t
                    + 0.254829592)
                * t
                * Math.exp(-x * x);
    return z >= 0 ? (1 + erf) / 2 : (1 - erf) / 2;
  }

  /** Returns every pair of points an ohms check may be taken between ({@link CheckPairs}). */
  List<String[]> pairs() {
    return checkPairs.all();
  }

  /**
   * Returns the ohms checks worth taking next among the leading suspects, best first: each pair of
   * points (nets and used pins) by its expected information gain in bits.
   *
   * @param top the leading hypotheses with their probabilities (summing to about 1)
   * @param taken the ohms readings already taken
   */
  List<ProbeAdvice> plan(List<Diagnoser.Scored> top, List<Reading> taken, MeterSpec meter) {
    if (top.size() < 2) {
      return List.of();
    }
    double mass = CompensatedSum.probability(top);
    double[] prior = new double[top.size()];
    for (int h = 0; h < prior.length; h++) {
      prior[h] = top.get(h).probability / mass;
    }
    double entropy = entropy(prior);
    List<String[]> done = new ArrayList<>();
    for (Reading r : taken) {
      done.add(new String[] {onFaulted(r.at()), onFaulted(r.to())});
    }
    int[] pairs = checkPairs.indices(done);
    OhmsPrediction[][] table = predictAt(top, pairs);
    OhmsGain gain = new OhmsGain(prior, entropy, meter);
    List<Candidate> advice = new ArrayList<>();
    for (int k = 0; k < pairs.length; k++) {
      double bits = Math.round(gain.of(table[k]) * 10000) / 10000.0;
      if (bits > 0) {
        advice.add(new Candidate(pairs[k], bits, table[k], acrossAt(pairs[k]).isEmpty()));
      }
    }
    advice.sort(new MostBitsFirst());
    // Two neighbouring pins read what their two nets read unless a joint is open: list the pins
    // only when that promises more, else the nets (ties keep the nets, listed first above).
    // Only the listed checks get their why.
    List<ProbeAdvice> listed = new ArrayList<>();
    Set<String> nets = new HashSet<>();
    for (Candidate c : advice) {
      if (listed.size() >= LISTED) {
        break;
      }
      String a = checkPairs.all().get(c.pair())[0];
      String b = checkPairs.all().get(c.pair())[1];
      String netA = healthy.node(a).orElseThrow();
      String netB = healthy.node(b).orElseThrow();
      String key = netA.equals(netB) ? CheckPairs.key(a, b) : CheckPairs.key(netA, netB);
      if (nets.add(key)) {
        listed.add(
            new ProbeAdvice(a, Reading.Kind.OHMS, 0, c.bits(), why(a, b, top, c.predicted()), b));
      }
    }
    return listed;
  }

  /** An ohms check before its why is written: the pair's index, its bits, its predictions. */
  private record Candidate(int pair, double bits, OhmsPrediction[] predicted, boolean acrossNone) {}

  /** The most bits first, then a pair with a resistor across it (a class: a lambda spins one). */
  private static final class MostBitsFirst implements Comparator<Candidate> {
    @Override
    public int compare(Candidate x, Candidate y) {
      int byBits = Double.compare(-x.bits(), -y.bits());
      return byBits != 0 ? byBits : Integer.compare(x.acrossNone() ? 1 : 0, y.acrossNone() ? 1 : 0);
    }
  }

  /** Returns the resistors across a check pair, kept once found. */
  private synchronized String acrossAt(int pair) {
    if (acrossPairs[pair] == null) {
      acrossPairs[pair] = across(checkPairs.all().get(pair)[0], checkPairs.all().get(pair)[1]);
    }
    return acrossPairs[pair];
  }

  /**
   * Returns the ohms check that tells the leading suspects apart with the power off, when the best
   * one resolves at least {@link #SPLIT_SHARE} of the uncertainty among them (its expected bits
   * over the leading suspects alone, against their entropy); empty otherwise, or with fewer than
   * two leading suspects. Its why says first that the unit is mains-powered.
   */
  Optional<ProbeAdvice> splitting(
      List<Diagnoser.Scored> leading, List<Reading> taken, MeterSpec meter) {
    if (leading.size() < 2) {
      return Optional.empty();
    }
    double mass = CompensatedSum.probability(leading);
    double[] prior = new double[leading.size()];
    for (int h = 0; h < prior.length; h++) {
      prior[h] = leading.get(h).probability / mass;
    }
    List<ProbeAdvice> checks = plan(leading, taken, meter);
    // entropy() is in nats, the checks' gains in bits.
    if (checks.isEmpty() || checks.get(0).bits() < SPLIT_SHARE * entropy(prior) / Math.log(2)) {
      return Optional.empty();
    }
    ProbeAdvice best = checks.get(0);
    return Optional.of(
        new ProbeAdvice(
            best.at(),
            Reading.Kind.OHMS,
            0,
            best.bits(),
            "The unit is mains-powered, and this check tells the leading suspects apart with the"
                + " power off, so it comes first. "
                + best.why(),
            best.to()));
  }

  static java.util.OptionalDouble none() {
    return java.util.OptionalDouble.empty();
  }

  static double entropy(double[] p) {
    double h = 0;
    for (double x : p) {
      if (x > 0) {
        h -= x * Math.log(x);
      }
    }
    return h;
  }

  /** Returns the resistors whose two leads are on the two points' nets, e.g. "R2". */
  private String across(String a, String b) {
    String netA = healthy.node(a).orElse("");
    String netB = healthy.node(b).orElse("");
    List<String> refs = new ArrayList<>();
    for (Part p : stage.parts()) {
      if (p.kind() == PartKind.RESISTOR
          && (p.netA().equals(netA) && p.netB().equals(netB)
              || p.netA().equals(netB) && p.netB().equals(netA))) {
        refs.add(p.ref());
      }
    }
    return String.join(", ", refs);
  }

  private String why(String a, String b, List<Diagnoser.Scored> top, OhmsPrediction[] predicted) {
    StringBuilder text = new StringBuilder("Power off: unplug the unit, discharge its capacitors");
    text.append(" and wait, then read ohms from ")
        .append(pointWords(a))
        .append(" to ")
        .append(pointWords(b));
    String across = across(a, b);
    if (!across.isEmpty()) {
      text.append(" (across ").append(across).append(")");
    }
    text.append(": ");
    List<String> parts = new ArrayList<>();
    List<OhmsPrediction> shown = new ArrayList<>();
    for (int h = 0; h < top.size() && parts.size() < 3; h++) {
      OhmsPrediction p = predicted[h];
      boolean distinct = true;
      for (OhmsPrediction x : shown) {
        distinct &= !similar(x, p);
      }
      if (!distinct) {
        continue;
      }
      shown.add(p);
      Fault fault = top.get(h).hypothesis.fault;
      String reads = text(p);
      parts.add(
          fault.kind() == FaultKind.HEALTHY
              ? reads + " when healthy"
              : reads + " " + ifFault(fault, top.get(h).best.value()));
    }
    text.append(String.join("; ", parts));
    for (int h = 0; h < predicted.length; h++) {
      if (!predicted[h].creep().isEmpty()) {
        OhmsPrediction.Creep c = predicted[h].creep().get(0);
        text.append(
            String.format(
                Locale.ROOT,
                ". %s (%s) makes the reading creep for about %.0f s: wait until it settles",
                c.ref(),
                Units.format(c.farads(), "F"),
                c.seconds()));
        break;
      }
    }
    return text.toString();
  }

  /** Returns a point in words: "U1 pin 2", "net SUM", "R14 lead 1", "D1 anode", "RV1 wiper". */
  private String pointWords(String point) {
    if (healthy.isLead(point)) {
      int dot = point.lastIndexOf('.');
      String lead = point.substring(dot + 1);
      String word =
          switch (lead) {
            case "a" -> "anode";
            case "k" -> "cathode";
            case "w" -> "wiper";
            default -> "lead " + lead;
          };
      return point.substring(0, dot) + " " + word;
    }
    String words = Wording.point(point);
    return words.equals(point) ? "net " + point : words;
  }

  /**
   * Returns the condition under which a suspect gives its reading, in words: "if R15 is open", "if
   * R14 is shorted", "if R7 has drifted to about 180 kΩ", "if U1 pin 3 is lifted"; never a fault id
   * (those stay in files and {@code --json}).
   */
  String ifFault(Fault fault, double value) {
    String s = fault.subject();
    boolean known = Double.isFinite(value);
    Part part = stage.part(s).orElse(null);
    PartKind kind = part == null ? PartKind.RESISTOR : part.kind();
    String unit = kind == PartKind.CAPACITOR ? "F" : kind == PartKind.ZENER ? "V" : "Ω";
    return switch (fault.kind()) {
      case HEALTHY -> "when healthy";
      case OPEN -> "if " + s + " is open";
      case SHORT -> "if " + s + " is shorted";
      case HIGH, LOW ->
          known
              ? "if " + s + " has drifted to about " + Units.format(value, unit)
              : "if " + s + " has drifted " + (fault.kind() == FaultKind.HIGH ? "high" : "low");
      case LEAKY ->
          "if "
              + s
              + " is leaky"
              + (known ? " (about " + Units.format(value, "Ω") + " across it)" : "");
      case LIFTED -> "if " + s + " pin " + fault.pin() + " is lifted";
      case BRIDGE ->
          "with a solder bridge between " + s + " pins " + fault.pin() + " and " + fault.otherPin();
      case WIPER_OPEN -> "if the wiper of " + s + " is open";
      case MISSET -> "if " + s + " is set wrong";
      default -> {
        String words = Wording.fault(fault.id());
        yield "with " + (words.startsWith("Rail ") ? "r" + words.substring(1) : words);
      }
    };
  }

  private static boolean similar(OhmsPrediction x, OhmsPrediction y) {
    if (!x.connected() || !y.connected()) {
      return x.connected() == y.connected();
    }
    double a = x.nominal();
    double b = y.nominal();
    return Math.abs(a - b) <= 0.02 * Math.max(a, b) + LEAD_OHMS;
  }

  /** Returns a predicted reading in words, e.g. "47.0 kΩ (46.5–47.5 kΩ)", "OL", "about 0 Ω". */
  static String text(OhmsPrediction p) {
    if (!p.connected()) {
      return "OL";
    }
    if (p.nominal() < LEAD_OHMS) {
      return "about 0 Ω";
    }
    if (p.high() - p.low() < 1e-6 * p.nominal()) {
      return Units.format(p.nominal(), "Ω");
    }
    return Units.format(p.nominal(), "Ω")
        + " ("
        + Units.format(p.low(), "Ω")
        + " to "
        + Units.format(p.high(), "Ω")
        + ")";
  }
}
