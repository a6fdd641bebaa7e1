package com.stagewise.reference;

import com.stagewise.circuit.Stage;
import com.stagewise.solver.AcSolution;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.Phasor;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * Compares our solver with the reference simulator's answer for one stage (ngspice 39, Debian
 * package, as reference simulator): DC within 1 mV + 0.01 % at every net and used pin, AC
 * amplitudes within 0.1 % and phases within 0.1° at every net.
 */
final class SpiceComparison {
  /** DC agreement: 1 mV plus 0.01 % of the reference value. */
  static final double DC_VOLTS = 1e-3;

  static final double DC_FRACTION = 1e-4;

  /** AC amplitude agreement: 0.1 % of the reference amplitude (plus 1 nV for zero amplitudes). */
  static final double AC_FRACTION = 1e-3;

  static final double AC_FLOOR_VOLTS = 1e-9;

  /** Phase agreement in degrees, checked where the amplitude is above 1 µV. */
  static final double PHASE_DEGREES = 0.1;

  private SpiceComparison() {}

  /**
   * The DC voltages of one state.
   *
   * @param nets DC volts per net
   * @param pins DC volts per used package pin
   */
  record DcState(Map<String, Double> nets, Map<String, Double> pins) {}

  /**
   * What the reference simulator says about one stage.
   *
   * @param states the stable DC states ngspice found (one, or two for a Schmitt trigger); the AC
   *     answer is about the first
   * @param hz the AC frequency, 0 without AC
   * @param ac amplitude and phase per net (empty without AC)
   */
  record Expected(List<DcState> states, double hz, Map<String, Phasor> ac) {}

  /** Returns the expected values read from converged ngspice runs of a flattened stage. */
  static Expected of(FlatCircuit flat, List<Ngspice.Solved> solved) {
    List<DcState> states = new ArrayList<>();
    for (Ngspice.Solved one : solved) {
      Map<String, Double> nets = new LinkedHashMap<>();
      for (String net : flat.nets) {
        nets.put(net, one.dc().get(net));
      }
      Map<String, Double> pins = new LinkedHashMap<>();
      flat.pinNodes.forEach((pin, node) -> pins.put(pin, one.dc().get(node)));
      states.add(new DcState(nets, pins));
    }
    Map<String, Phasor> ac = new LinkedHashMap<>();
    if (flat.hz > 0) {
      for (String net : flat.nets) {
        ac.put(net, new Phasor(solved.get(0).acAmplitude(net), solved.get(0).acPhaseDegrees(net)));
      }
    }
    return new Expected(states, flat.hz, ac);
  }

  /**
   * Returns every disagreement between our solver and the expected values, empty when they agree.
   * Each state ngspice found is compared with the nearest of our stable operating points (a Schmitt
   * trigger has two), and ngspice must not find more states than we do.
   */
  static List<String> mismatches(Stage stage, Expected expected) {
    List<String> problems = new ArrayList<>();
    SolveResult result = StageSolver.solve(stage);
    if (!(result instanceof SolveResult.Solved solved)) {
      problems.add("our solver gave " + result);
      return problems;
    }
    if (expected.states().size() > solved.points().size()) {
      problems.add(
          "ngspice found "
              + expected.states().size()
              + " stable states, our solver "
              + solved.points().size());
    }
    OperatingPoint first = null;
    for (DcState state : expected.states()) {
      OperatingPoint point = nearest(solved.points(), state.nets());
      first = first == null ? point : first;
      compareDc(problems, "net", state.nets(), point.nets());
      compareDc(problems, "pin", state.pins(), point.pins());
    }
    OperatingPoint point = first;
    if (expected.hz() > 0) {
      Optional<AcSolution> ac = StageSolver.ac(stage, point);
      if (ac.isEmpty()) {
        problems.add("our solver gave no AC solution at " + expected.hz() + " Hz");
        return problems;
      }
      for (Map.Entry<String, Phasor> e : expected.ac().entrySet()) {
        Phasor ours = ac.get().nets().get(e.getKey());
        Phasor ref = e.getValue();
        if (ours == null) {
          problems.add("AC at " + e.getKey() + ": missing in our solution");
          continue;
        }
        double allowed = AC_FRACTION * ref.amplitude() + AC_FLOOR_VOLTS;
        if (Math.abs(ours.amplitude() - ref.amplitude()) > allowed) {
          problems.add(
              String.format(
                  Locale.ROOT,
                  "AC amplitude at %s: ours %.9g V, ngspice %.9g V",
                  e.getKey(),
                  ours.amplitude(),
                  ref.amplitude()));
        } else if (ref.amplitude() > 1e-6) {
          double diff = Math.abs(ours.phaseDegrees() - ref.phaseDegrees()) % 360;
          diff = Math.min(diff, 360 - diff);
          if (diff > PHASE_DEGREES) {
            problems.add(
                String.format(
                    Locale.ROOT,
                    "AC phase at %s: ours %.4f°, ngspice %.4f°",
                    e.getKey(),
                    ours.phaseDegrees(),
                    ref.phaseDegrees()));
          }
        }
      }
    }
    return problems;
  }

  /** Returns the largest DC difference at the expected nets, in volts. */
  static double worstDcDifference(OperatingPoint point, Map<String, Double> nets) {
    double worst = 0;
    for (Map.Entry<String, Double> e : nets.entrySet()) {
      Double ours = point.nets().get(e.getKey());
      worst =
          Math.max(worst, ours == null ? Double.POSITIVE_INFINITY : Math.abs(ours - e.getValue()));
    }
    return worst;
  }

  private static OperatingPoint nearest(List<OperatingPoint> points, Map<String, Double> nets) {
    OperatingPoint best = points.get(0);
    for (OperatingPoint p : points) {
      if (worstDcDifference(p, nets) < worstDcDifference(best, nets)) {
        best = p;
      }
    }
    return best;
  }

  private static void compareDc(
      List<String> problems, String what, Map<String, Double> expected, Map<String, Double> ours) {
    for (Map.Entry<String, Double> e : expected.entrySet()) {
      Double mine = ours.get(e.getKey());
      if (mine == null) {
        problems.add("DC at " + what + " " + e.getKey() + ": missing in our solution");
        continue;
      }
      double allowed = DC_VOLTS + DC_FRACTION * Math.abs(e.getValue());
      if (Math.abs(mine - e.getValue()) > allowed) {
        problems.add(
            String.format(
                Locale.ROOT,
                "DC at %s %s: ours %.6f V, ngspice %.6f V",
                what,
                e.getKey(),
                mine,
                e.getValue()));
      }
    }
  }
}
