package com.stagewise.diagnosis;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingRules;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Ranks the faults that explain a set of readings on one stage and says what to probe next.
 *
 * <p>Built once per stage: the predictions of every hypothesis are computed on first use and kept,
 * so re-ranking after one more reading costs only the likelihoods and the probe choice. When an
 * input net is read and differs from the sheet, the stage is diagnosed with the measured level (the
 * fault may be upstream), which needs predictions of its own; they are kept too. Safe to call from
 * several threads.
 */
public final class Diagnoser {
  /** Suspects listed when the caller does not ask for a number. */
  public static final int DEFAULT_TOP = 12;

  /** Two hypotheses whose evidence differs by less than this factor cannot be told apart. */
  static final double GROUP_FACTOR = 10;

  /** A hypothesis below this share of the first suspect's probability is left off the list. */
  private static final double LIST_FLOOR = 1e-4;

  private final Stage stage;
  private final FaultCatalogue.Entries catalogue;
  private final Map<String, Double> priors;
  private final Map<String, Integer> shopCounts;
  private final TestPoints points;
  private final Evidence evidence;
  private final OhmsChecks ohmsChecks;
  private final SameReadings sameReadings;

  /** Suspects named at most as reading the same as another everywhere. */
  private static final int SAME_LISTED = 3;

  private final double span;
  private final Map<Map<String, Double>, List<Hypothesis>> models;

  /** Whether the unit is mains-powered (then a power-off check that splits the leaders leads). */
  private final boolean mainsPowered;

  /** Each model's readings' log-likelihoods, kept across re-ranks (by the model's identity). */
  private final Map<List<Hypothesis>, Likelihoods> likelihoods = new java.util.IdentityHashMap<>();

  private Diagnoser(Stage stage, Map<String, Integer> shopCounts) {
    this.stage = stage;
    this.catalogue = FaultCatalogue.of(stage);
    Map<String, Double> published = Priors.published(stage, catalogue.faults());
    this.priors =
        shopCounts.isEmpty()
            ? published
            : Priors.blend(published, shopCounts, Priors.SHOP_STRENGTH);
    this.shopCounts = Map.copyOf(shopCounts);
    this.points = new TestPoints(stage);
    double max = 1;
    for (Rail rail : stage.rails()) {
      max = Math.max(max, Math.abs(rail.volts()));
    }
    this.span = max;
    this.evidence = new Evidence(max);
    this.ohmsChecks = new OhmsChecks(stage);
    this.sameReadings = new SameReadings(points, ohmsChecks);
    this.models = new ConcurrentHashMap<>();
    this.mainsPowered = false;
  }

  private Diagnoser(Diagnoser base, boolean mainsPowered) {
    this.stage = base.stage;
    this.catalogue = base.catalogue;
    this.priors = base.priors;
    this.shopCounts = base.shopCounts;
    this.points = base.points;
    this.span = base.span;
    this.evidence = base.evidence;
    this.ohmsChecks = base.ohmsChecks;
    this.sameReadings = base.sameReadings;
    this.models = base.models;
    this.mainsPowered = mainsPowered;
  }

  /**
   * Returns this diagnoser for a unit that is (or is not) mains-powered: when it is, and a
   * power-off (ohms) check tells the leading suspects apart (it resolves more than half of the
   * uncertainty among them), that check is the first next probe even where a powered probe promises
   * more bits; the other probes stay sorted by bits. Working unpowered is the safe way on such a
   * unit.
   */
  public Diagnoser mainsPowered(boolean mains) {
    return mains == mainsPowered ? this : new Diagnoser(this, mains);
  }

  /** Returns a diagnoser for a stage with the published priors. */
  public static Diagnoser of(Stage stage) {
    return new Diagnoser(stage, Map.of());
  }

  /**
   * Returns a diagnoser whose priors blend the published ones with the shop's counts of confirmed
   * faults on the stage's board model (fault id to count).
   */
  public static Diagnoser of(Stage stage, Map<String, Integer> shopCounts) {
    return new Diagnoser(stage, shopCounts);
  }

  /** Returns the stage this diagnoser works on. */
  public Stage stage() {
    return stage;
  }

  /** Returns the fault ids of the catalogue, healthy first. */
  public List<String> faults() {
    List<String> ids = new ArrayList<>();
    for (Fault fault : catalogue.faults()) {
      ids.add(fault.id());
    }
    return java.util.Collections.unmodifiableList(ids);
  }

  /** Returns the diagnosis of a set of readings, listing {@link #DEFAULT_TOP} suspects at most. */
  public Diagnosis diagnose(ReadingSet readings) {
    return diagnose(readings, DEFAULT_TOP);
  }

  /**
   * Returns the diagnosis of a set of readings.
   *
   * @param top the most suspects to list, 1 or more
   * @throws InvalidInputException for any problem of {@link ReadingRules#problems}: a reading at no
   *     net or used pin of the stage, far beyond every rail, or an AC reading the stage cannot have
   */
  public Diagnosis diagnose(ReadingSet readings, int top) {
    if (top < 1) {
      throw new InvalidInputException(
          "", "top", "the number of suspects (" + top + ") must be 1 or more");
    }
    ReadingRules.requireSound(stage, readings, "");
    readings = leadsOnNets(readings);
    List<String> notes = new ArrayList<>();
    Map<String, Double> inputs = MeasuredInputs.of(stage, points, readings, notes);
    List<Hypothesis> hypotheses = model(inputs);
    List<Evidence.Bound> bound = new ArrayList<>();
    List<Reading> ohms = new ArrayList<>();
    for (Reading r : readings.readings()) {
      if (r.kind() == Reading.Kind.OHMS) {
        ohms.add(r);
      } else {
        bound.add(Evidence.bind(points, readings, r, stage));
      }
    }
    Ranking ranking = rank(hypotheses, bound, ohms, readings.meter());
    // The next probes and the suspects' texts both follow from the ranking alone: the probes are
    // planned on another core while this thread words the suspects.
    NextProbes.Planning planning =
        new NextProbes(stage, points, evidence, ohmsChecks)
            .planning(ranking, bound, ohms, readings.meter(), mainsPowered);
    planning.fork();
    notes.addAll(catalogue.notes());
    Explainer explainer = new Explainer(stage, points, span, shopCounts);
    List<Suspect> suspects = suspects(ranking, bound, top, explainer);
    Verdict verdict = verdict(ranking);
    String check =
        verdict == Verdict.HEALTHY
            ? ""
            : explainer.confirmingCheck(
                ranking.first().hypothesis.fault, ranking.first().estimate());
    if (verdict == Verdict.HEALTHY) {
      List<String> unseen = new ArrayList<>();
      for (String f : suspects.get(0).group()) {
        if (!f.equals(Fault.HEALTHY.id())) {
          unseen.add(f);
        }
      }
      if (!unseen.isEmpty()) {
        List<String> named = new ArrayList<>();
        for (String f : unseen.subList(0, Math.min(8, unseen.size()))) {
          named.add(Wording.fault(f));
        }
        notes.add(
            "These readings cannot rule out: "
                + String.join(", ", named)
                + (unseen.size() > 8 ? " and " + (unseen.size() - 8) + " more" : "")
                + ". The next probe, or the symptom itself, may tell them apart.");
      }
      notes.add(
          "Healthy by these readings. This does not mean the unit is safe: follow local codes and"
              + " licensed practice on powered equipment.");
    }
    List<Observation> observations = explainer.observations(hypotheses.get(0), bound, readings);
    return new Diagnosis(verdict, observations, suspects, planning.join(), check, notes);
  }

  /**
   * Returns the first suspect for these readings and those of its group that read the same as it at
   * every point, powered or not ({@link SameReadings}), the first suspect first: the faults no
   * further reading can tell apart from it.
   */
  List<String> sameAsFirst(ReadingSet readings) {
    ReadingRules.requireSound(stage, readings, "");
    readings = leadsOnNets(readings);
    List<Hypothesis> hypotheses =
        model(MeasuredInputs.of(stage, points, readings, new ArrayList<>()));
    List<Evidence.Bound> bound = new ArrayList<>();
    List<Reading> ohms = new ArrayList<>();
    for (Reading r : readings.readings()) {
      if (r.kind() == Reading.Kind.OHMS) {
        ohms.add(r);
      } else {
        bound.add(Evidence.bind(points, readings, r, stage));
      }
    }
    Ranking ranking = rank(hypotheses, bound, ohms, readings.meter());
    Scored first = ranking.first();
    List<String> same = new ArrayList<>(List.of(first.hypothesis.fault.id()));
    for (Scored other : ranking.scored()) {
      if (other != first
          && Math.abs(other.logEvidence - first.logEvidence) <= Math.log(GROUP_FACTOR)
          && other.probability >= LIST_FLOOR * first.probability
          && sameReadings.same(first, other)) {
        same.add(other.hypothesis.fault.id());
      }
    }
    return same;
  }

  /** A hypothesis with its prior and the predictions of its scenarios. */
  static final class Hypothesis {
    final Fault fault;
    final double prior;
    final List<Prediction> predictions;

    Hypothesis(Fault fault, double prior, List<Prediction> predictions) {
      this.fault = fault;
      this.prior = prior;
      this.predictions = predictions;
    }
  }

  /** A hypothesis scored against the readings. */
  static final class Scored {
    final Hypothesis hypothesis;
    final double logEvidence;
    final Prediction best;
    final double[] scenarioWeights;
    double probability;

    Scored(Hypothesis hypothesis, double logEvidence, Prediction best, double[] scenarioWeights) {
      this.hypothesis = hypothesis;
      this.logEvidence = logEvidence;
      this.best = best;
      this.scenarioWeights = scenarioWeights;
    }

    OptionalDouble estimate() {
      return Double.isNaN(best.value()) ? OptionalDouble.empty() : OptionalDouble.of(best.value());
    }
  }

  /** The most probable first (a named comparator: a lambda spins a class on first use). */
  private static final Comparator<Scored> MOST_PROBABLE_FIRST = new MostProbableFirst();

  private static final class MostProbableFirst implements Comparator<Scored> {
    @Override
    public int compare(Scored a, Scored b) {
      return Double.compare(-a.probability, -b.probability);
    }
  }

  /** Hypotheses sorted by posterior probability, highest first. */
  record Ranking(List<Scored> scored) {
    Scored first() {
      return scored.get(0);
    }

    double probability(String faultId) {
      for (Scored s : scored) {
        if (s.hypothesis.fault.id().equals(faultId)) {
          return s.probability;
        }
      }
      return 0;
    }
  }

  /** The hypotheses for these readings' inputs, predicted if not yet (for tests). */
  List<Hypothesis> hypotheses(ReadingSet readings) {
    return model(MeasuredInputs.of(stage, points, leadsOnNets(readings), new ArrayList<>()));
  }

  /** The hypotheses for these inputs, built once per inputs (a lock, not a lambda). */
  private List<Hypothesis> model(Map<String, Double> inputs) {
    List<Hypothesis> built = models.get(inputs);
    if (built != null) {
      return built;
    }
    synchronized (models) {
      built = models.get(inputs);
      if (built == null) {
        built = Hypotheses.build(stage, points, catalogue, priors, inputs);
        models.put(inputs, built);
      }
      return built;
    }
  }

  /** Volts readings at a part lead ({@code R2.1}) are readings at the lead's net. */
  private ReadingSet leadsOnNets(ReadingSet readings) {
    List<Reading> out = new ArrayList<>();
    boolean changed = false;
    for (Reading r : readings.readings()) {
      if (r.kind() != Reading.Kind.OHMS
          && !points.index.containsKey(r.at())
          && ohmsChecks.knows(r.at())
          && !r.at().equals(ohmsChecks.onFaulted(r.at()))) {
        out.add(r.movedTo(ohmsChecks.onFaulted(r.at())));
        changed = true;
      } else {
        out.add(r);
      }
    }
    return changed ? new ReadingSet(readings.meter(), out) : readings;
  }

  private Ranking rank(
      List<Hypothesis> hypotheses,
      List<Evidence.Bound> bound,
      List<Reading> ohms,
      MeterSpec meter) {
    double[] weight = readingWeights(bound);
    Likelihoods table;
    synchronized (likelihoods) {
      table = likelihoods.get(hypotheses);
      if (table == null) {
        table = new Likelihoods(hypotheses, evidence);
        likelihoods.put(hypotheses, table);
      }
    }
    // Every prediction's log weight and weighted log-likelihood, each prediction's terms added in
    // the readings' order, and each hypothesis scored from its own: one task per hypothesis.
    double[] sums = new double[table.total()];
    Scored[] each = new Scored[hypotheses.size()];
    table.sums(
        bound, weight, sums, new ScoreOne(hypotheses, table, sums, ohmsChecks, ohms, meter, each));
    List<Scored> scored = new ArrayList<>(List.of(each));
    double maxLog = Double.NEGATIVE_INFINITY;
    for (Scored s : scored) {
      maxLog = Math.max(maxLog, s.logEvidence + Math.log(s.hypothesis.prior));
    }
    double sum = 0;
    for (Scored s : scored) {
      s.probability = Math.exp(s.logEvidence + Math.log(s.hypothesis.prior) - maxLog);
      sum += s.probability;
    }
    for (Scored s : scored) {
      s.probability /= sum;
    }
    scored.sort(MOST_PROBABLE_FIRST);
    return new Ranking(scored);
  }

  /**
   * Weights of the readings in the evidence: readings of one kind on one net of the working stage
   * (the net by name and its package pins) share a weight of 1. Where no pin is lifted they read
   * the same node, so counting each in full would count one node's evidence twice or thrice; where
   * a pin is lifted they still differ by volts, which even half a weight makes plain.
   */
  private double[] readingWeights(List<Evidence.Bound> bound) {
    Map<String, Integer> perNode = new HashMap<>();
    for (Evidence.Bound r : bound) {
      String node = (r.ac() ? "ac:" : "dc:") + points.netOf.get(r.point());
      Integer count = perNode.get(node);
      perNode.put(node, count == null ? 1 : count + 1);
    }
    double[] weight = new double[bound.size()];
    for (int i = 0; i < weight.length; i++) {
      Evidence.Bound r = bound.get(i);
      weight[i] = 1.0 / perNode.get((r.ac() ? "ac:" : "dc:") + points.netOf.get(r.point()));
    }
    return weight;
  }

  private List<Suspect> suspects(
      Ranking ranking, List<Evidence.Bound> bound, int top, Explainer explainer) {
    List<Scored> listed = new ArrayList<>();
    double firstProbability = ranking.first().probability;
    for (Scored s : ranking.scored()) {
      if (listed.size() >= top || s.probability < LIST_FLOOR * firstProbability) {
        break;
      }
      listed.add(s);
    }
    double total = CompensatedSum.probability(listed);
    List<Suspect> suspects = new ArrayList<>();
    for (Scored s : listed) {
      List<String> group = new ArrayList<>();
      List<String> same = new ArrayList<>();
      for (Scored other : ranking.scored()) {
        if (Math.abs(other.logEvidence - s.logEvidence) <= Math.log(GROUP_FACTOR)
            && other.probability >= LIST_FLOOR * firstProbability) {
          group.add(other.hypothesis.fault.id());
          if (other != s && same.size() < SAME_LISTED && sameReadings.same(s, other)) {
            same.add(other.hypothesis.fault.id());
          }
        }
      }
      boolean consistent = true;
      for (Evidence.Bound r : bound) {
        if (!(Evidence.score(s.best, r) <= 3)) {
          consistent = false;
          break;
        }
      }
      Map<String, Double> predicted = new LinkedHashMap<>();
      Map<String, Double> predictedAc = new LinkedHashMap<>();
      for (int i = 0; i < points.size; i++) {
        predicted.put(points.names.get(i), s.best.dcMean()[i]);
        if (s.best.acMean() != null) {
          predictedAc.put(points.names.get(i), s.best.acMean()[i]);
        }
      }
      suspects.add(
          new Suspect(
              s.hypothesis.fault.id(),
              s.probability / total,
              consistent,
              group,
              explainer.why(s.hypothesis.fault, s.best, s.estimate(), bound)
                  + Explainer.sameReadings(same),
              s.estimate(),
              predicted,
              predictedAc));
    }
    return suspects;
  }

  private static Verdict verdict(Ranking ranking) {
    double healthy = ranking.probability(Fault.HEALTHY.id());
    // Healthy when a working stage explains the readings best: faults that fit as well sit in its
    // group, and the notes name them, since these readings cannot rule them out.
    if (ranking.first().hypothesis.fault.kind() == FaultKind.HEALTHY) {
      return Verdict.HEALTHY;
    }
    // A working stage is still in play: more readings are needed before naming a fault.
    return healthy < 0.05 ? Verdict.FAULT : Verdict.INCONCLUSIVE;
  }
}
