package com.stagewise.diagnosis;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * Chooses the test points worth reading next by their expected information gain over the current
 * suspect list.
 *
 * <p>The gain of a candidate is the mutual information between the fault and the reading it would
 * give: the entropy of the suspect list now, less its expected entropy after the reading. The
 * reading's distribution under each hypothesis is a mixture of its most likely scenarios, each a
 * normal density (prediction spread plus the instrument's uncertainty); the expectation is taken by
 * three-point Gauss–Hermite quadrature about each scenario's mean.
 */
final class ProbePlanner {
  /**
   * Hypotheses considered: enough to hold this share of the probability, at most {@link
   * #MAX_HYPOTHESES}.
   */
  private static final double MASS = 0.999;

  private static final int MAX_HYPOTHESES = 24;
  private static final int SCENARIOS_PER_HYPOTHESIS = 3;
  private static final int LISTED = 6;

  /** Gauss–Hermite nodes (in standard deviations) and weights for three points. */
  private static final double[] NODES = {0, Math.sqrt(3), -Math.sqrt(3)};

  private static final double[] NODE_WEIGHTS = {2.0 / 3, 1.0 / 6, 1.0 / 6};

  private final Stage stage;
  private final TestPoints points;
  private final Evidence evidence;

  /** The measure an AC probe is stated in: that of the stage's AC input. */
  private final AcMeasure measure;

  ProbePlanner(Stage stage, TestPoints points, Evidence evidence) {
    this.measure = Reading.acMeasure(stage);
    this.stage = stage;
    this.points = points;
    this.evidence = evidence;
  }

  private record Component(int hypothesis, double weight, Prediction prediction) {}

  /** Returns the best probes, most informative first. */
  List<ProbeAdvice> plan(Diagnoser.Ranking ranking, List<Evidence.Bound> read, MeterSpec meter) {
    List<Diagnoser.Scored> top = new ArrayList<>();
    double mass = 0;
    for (Diagnoser.Scored s : ranking.scored()) {
      if (mass >= MASS || top.size() >= MAX_HYPOTHESES) {
        break;
      }
      top.add(s);
      mass += s.probability;
    }
    double[] prior = new double[top.size()];
    List<Component> components = new ArrayList<>();
    for (int h = 0; h < top.size(); h++) {
      Diagnoser.Scored s = top.get(h);
      prior[h] = s.probability / mass;
      Integer[] order = new Integer[s.scenarioWeights.length];
      for (int v = 0; v < order.length; v++) {
        order[v] = v;
      }
      java.util.Arrays.sort(order, new HeaviestFirst(s.scenarioWeights));
      double kept = 0;
      int count = Math.min(SCENARIOS_PER_HYPOTHESIS, order.length);
      for (int k = 0; k < count; k++) {
        kept += s.scenarioWeights[order[k]];
      }
      for (int k = 0; k < count; k++) {
        components.add(
            new Component(
                h, s.scenarioWeights[order[k]] / kept, s.hypothesis.predictions.get(order[k])));
      }
    }
    double entropy = entropy(prior);
    Set<String> taken = new HashSet<>();
    for (Evidence.Bound r : read) {
      taken.add((r.ac() ? "ac:" : "dc:") + r.at());
    }
    List<ProbeAdvice> advice = new ArrayList<>();
    boolean ac = false;
    double hz = 0;
    for (TestInput input : stage.inputs()) {
      if (input.hasAc()) {
        ac = true;
        hz = input.hz();
        break;
      }
    }
    for (int i = 0; i < points.size; i++) {
      String name = points.names.get(i);
      if (name.equals(stage.ground())) {
        continue;
      }
      if (!taken.contains("dc:" + name)) {
        double bits = round(gain(i, false, prior, components, entropy, meter));
        advice.add(new ProbeAdvice(name, Reading.Kind.DC, 0, bits, why(i, false, top)));
      }
      if (ac && isOutput(i) && !taken.contains("ac:" + name)) {
        double bits = round(gain(i, true, prior, components, entropy, meter));
        advice.add(
            new ProbeAdvice(name, Reading.Kind.AC, hz, bits, why(i, true, top), "", measure));
      }
    }
    // Best first; on a tie prefer a package pin (a technician probes the pins), then sheet order.
    advice.sort(new MostBitsPinsFirst());
    return advice.subList(0, Math.min(LISTED, advice.size()));
  }

  /** Bits to 1/10000: finer differences are quadrature noise, and equal figures should tie. */
  /** A hypothesis's scenarios, heaviest first (classes rather than lambdas: see Perturbation). */
  private record HeaviestFirst(double[] weights) implements Comparator<Integer> {
    @Override
    public int compare(Integer a, Integer b) {
      return Double.compare(-weights[a], -weights[b]);
    }
  }

  /** The most bits first; on a tie a package pin first. */
  private final class MostBitsPinsFirst implements Comparator<ProbeAdvice> {
    @Override
    public int compare(ProbeAdvice a, ProbeAdvice b) {
      int byBits = Double.compare(-a.bits(), -b.bits());
      return byBits != 0 ? byBits : Integer.compare(pinLast(a), pinLast(b));
    }

    private int pinLast(ProbeAdvice a) {
      return points.isPin(points.index.get(a.at())) ? 0 : 1;
    }
  }

  private static double round(double bits) {
    return Math.round(bits * 10000) / 10000.0;
  }

  private boolean isOutput(int i) {
    String net = points.netOf.get(i);
    for (Amplifier amp : stage.amplifiers()) {
      if (amp.out().equals(net)) {
        return true;
      }
    }
    return false;
  }

  private double gain(
      int point,
      boolean ac,
      double[] prior,
      List<Component> components,
      double entropy,
      MeterSpec meter) {
    int n = components.size();
    double[] mean = new double[n];
    double[] variance = new double[n];
    for (int c = 0; c < n; c++) {
      Prediction p = components.get(c).prediction;
      mean[c] = mean(p, point, ac);
      variance[c] = variance(p, point, ac, meter);
    }
    double expected = 0;
    double[] posterior = new double[prior.length];
    for (int c = 0; c < n; c++) {
      Component source = components.get(c);
      double sourceWeight = prior[source.hypothesis] * source.weight;
      for (int q = 0; q < NODES.length; q++) {
        double m = mean[c] + NODES[q] * Math.sqrt(variance[c]);
        java.util.Arrays.fill(posterior, 0);
        double max = Double.NEGATIVE_INFINITY;
        double[] logs = new double[n];
        for (int d = 0; d < n; d++) {
          logs[d] = evidence.logLikelihood(m, mean[d], variance[d]);
          max = Math.max(max, logs[d]);
        }
        double total = 0;
        for (int d = 0; d < n; d++) {
          Component other = components.get(d);
          double w = prior[other.hypothesis] * other.weight * Math.exp(logs[d] - max);
          posterior[other.hypothesis] += w;
          total += w;
        }
        for (int h = 0; h < posterior.length; h++) {
          posterior[h] /= total;
        }
        expected += sourceWeight * NODE_WEIGHTS[q] * entropy(posterior);
      }
    }
    return Math.max(0, (entropy - expected) / Math.log(2));
  }

  /** Returns a scenario's predicted DC level or AC amplitude (peak) at a test point. */
  static double mean(Prediction p, int point, boolean ac) {
    return ac ? (p.acMean() == null ? 0 : p.acMean()[point]) : p.dcMean()[point];
  }

  /** Returns the variance of a reading at a test point about a scenario's prediction. */
  double variance(Prediction p, int point, boolean ac, MeterSpec meter) {
    double mean = mean(p, point, ac);
    // The scope's figure on the value as the technician will state it, back in peak volts.
    double u =
        ac
            ? measure.toPeak(
                ReadingSet.SCOPE_PERCENT / 100 * Math.abs(measure.fromPeak(mean))
                    + ReadingSet.SCOPE_FLOOR_VOLTS)
            : meter.uncertainty(mean);
    Evidence.Bound probe = new Evidence.Bound(point, ac, mean, u * u / 3, points.names.get(point));
    return Evidence.variance(p, probe);
  }

  private static double entropy(double[] p) {
    double h = 0;
    for (double x : p) {
      if (x > 0) {
        h -= x * Math.log(x);
      }
    }
    return h;
  }

  private String why(int point, boolean ac, List<Diagnoser.Scored> top) {
    List<String> parts = new ArrayList<>();
    List<Double> seen = new ArrayList<>();
    for (Diagnoser.Scored s : top) {
      if (parts.size() >= 3) {
        break;
      }
      double v =
          ac ? (s.best.acMean() == null ? 0 : s.best.acMean()[point]) : s.best.dcMean()[point];
      boolean distinct = true;
      for (double x : seen) {
        distinct &= !(Math.abs(x - v) < 0.02 + 0.01 * Math.abs(v));
      }
      if (distinct) {
        seen.add(v);
        parts.add(
            String.format(
                Locale.ROOT,
                "%s puts it at %s",
                Wording.fault(s.hypothesis.fault.id()),
                Units.volts(ac ? measure.fromPeak(v) : v)));
      }
    }
    if (parts.size() < 2) {
      // Every likely fault predicts the same here: the reading checks, it does not decide.
      return seen.isEmpty()
          ? "a check of the readings so far"
          : String.format(
              Locale.ROOT,
              "the likely faults all put it near %s: a check of the readings so far",
              Units.volts(ac ? measure.fromPeak(seen.get(0)) : seen.get(0)));
    }
    String head =
        measure == AcMeasure.PEAK ? "AC amplitude: " : "AC volts " + measure.words() + ": ";
    return (ac ? head : "") + String.join(", ", parts);
  }
}
