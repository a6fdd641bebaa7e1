package com.stagewise.diagnosis;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.RecursiveTask;

/**
 * The next probes of a diagnosis: the volts probes and the power-off (ohms) checks together, sorted
 * by expected bits (with the mains-powered rule below).
 */
final class NextProbes {
  /** Ohms checks are planned over the hypotheses that hold this share of the probability. */
  private static final double OHMS_MASS = 0.999;

  /** … and at most this many of them. */
  private static final int OHMS_HYPOTHESES = 24;

  /** Suspects within this factor of the first one's probability are the leading suspects. */
  private static final double LEADING_FACTOR = 10;

  /** … at most this many of them. */
  private static final int LEADING_MOST = 6;

  private final Stage stage;
  private final TestPoints points;
  private final Evidence evidence;
  private final OhmsChecks ohmsChecks;

  NextProbes(Stage stage, TestPoints points, Evidence evidence, OhmsChecks ohmsChecks) {
    this.stage = stage;
    this.points = points;
    this.evidence = evidence;
    this.ohmsChecks = ohmsChecks;
  }

  /** The most informative first (a named comparator: a lambda spins a class on first use). */
  private static final Comparator<ProbeAdvice> MOST_BITS_FIRST = new MostBitsFirst();

  private static final class MostBitsFirst implements Comparator<ProbeAdvice> {
    @Override
    public int compare(ProbeAdvice a, ProbeAdvice b) {
      return Double.compare(-a.bits(), -b.bits());
    }
  }

  /**
   * Returns the volts probes with the best power-off (ohms) checks among them, all sorted by bits:
   * an ohms check comes first only when it tells the leading suspects apart better than any volts
   * probe. When the unit is mains-powered, an ohms check that splits the leading suspects comes
   * first whatever the bits.
   */
  List<ProbeAdvice> plan(
      Diagnoser.Ranking ranking,
      List<Evidence.Bound> bound,
      List<Reading> ohms,
      MeterSpec meter,
      boolean mainsPowered) {
    List<Diagnoser.Scored> top = new ArrayList<>();
    double mass = 0;
    for (Diagnoser.Scored s : ranking.scored()) {
      if (mass >= OHMS_MASS || top.size() >= OHMS_HYPOTHESES) {
        break;
      }
      top.add(s);
      mass += s.probability;
    }
    // The power-off checks are planned on another core while this thread plans the volts probes.
    OhmsPlanning ohmsPlanning = new OhmsPlanning(ohmsChecks, top, ohms, meter);
    ohmsPlanning.fork();
    ProbePlanner planner = new ProbePlanner(stage, points, evidence);
    List<ProbeAdvice> volts = planner.plan(ranking, bound, meter);
    List<ProbeAdvice> all = new ArrayList<>(volts);
    all.addAll(ohmsPlanning.join());
    all.sort(MOST_BITS_FIRST);
    all = new ArrayList<>(all.subList(0, Math.min(volts.size() + 2, all.size())));
    if (mainsPowered) {
      List<Diagnoser.Scored> leading = new ArrayList<>();
      for (Diagnoser.Scored s : ranking.scored()) {
        if (leading.size() >= LEADING_MOST
            || s.probability < ranking.first().probability / LEADING_FACTOR) {
          break;
        }
        leading.add(s);
      }
      Optional<ProbeAdvice> first = ohmsChecks.splitting(leading, ohms, meter);
      if (first.isPresent()) {
        ProbeAdvice check = first.get();
        double bits = check.bits();
        for (ProbeAdvice a : all) {
          // Its bits as the other probes count them (over the same suspects), where it is listed.
          if (same(a, check)) {
            bits = a.bits();
          }
        }
        for (java.util.Iterator<ProbeAdvice> it = all.iterator(); it.hasNext(); ) {
          if (same(it.next(), check)) {
            it.remove();
          }
        }
        all.add(
            0,
            new ProbeAdvice(check.at(), check.kind(), check.hz(), bits, check.why(), check.to()));
      }
    }
    return all;
  }

  /**
   * {@link #plan} as a task of the common pool, to {@code fork} and later {@code join} (a class: a
   * lambda spins one on first use).
   */
  Planning planning(
      Diagnoser.Ranking ranking,
      List<Evidence.Bound> bound,
      List<Reading> ohms,
      MeterSpec meter,
      boolean mainsPowered) {
    return new Planning(this, ranking, bound, ohms, meter, mainsPowered);
  }

  /** The next probes of one ranking, worked out as a task; see {@link #planning}. */
  static final class Planning extends RecursiveTask<List<ProbeAdvice>> {
    private final NextProbes probes;
    private final Diagnoser.Ranking ranking;
    private final List<Evidence.Bound> bound;
    private final List<Reading> ohms;
    private final MeterSpec meter;
    private final boolean mainsPowered;

    private Planning(
        NextProbes probes,
        Diagnoser.Ranking ranking,
        List<Evidence.Bound> bound,
        List<Reading> ohms,
        MeterSpec meter,
        boolean mainsPowered) {
      this.probes = probes;
      this.ranking = ranking;
      this.bound = bound;
      this.ohms = ohms;
      this.meter = meter;
      this.mainsPowered = mainsPowered;
    }

    @Override
    protected List<ProbeAdvice> compute() {
      return probes.plan(ranking, bound, ohms, meter, mainsPowered);
    }
  }

  /** The power-off checks over the top hypotheses, worked out as a task. */
  private static final class OhmsPlanning extends RecursiveTask<List<ProbeAdvice>> {
    private final OhmsChecks checks;
    private final List<Diagnoser.Scored> top;
    private final List<Reading> ohms;
    private final MeterSpec meter;

    OhmsPlanning(
        OhmsChecks checks, List<Diagnoser.Scored> top, List<Reading> ohms, MeterSpec meter) {
      this.checks = checks;
      this.top = top;
      this.ohms = ohms;
      this.meter = meter;
    }

    @Override
    protected List<ProbeAdvice> compute() {
      return checks.plan(top, ohms, meter);
    }
  }

  private static boolean same(ProbeAdvice a, ProbeAdvice b) {
    return a.kind() == b.kind()
        && (a.kind() == Reading.Kind.OHMS
            ? Set.of(a.at(), a.to()).equals(Set.of(b.at(), b.to()))
            : a.at().equals(b.at()));
  }
}
