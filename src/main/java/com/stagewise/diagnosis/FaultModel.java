package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Connectivity;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.SectionState;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Turns a fault hypothesis into the concrete circuits (scenarios) that it stands for.
 *
 * <p>Opens remove the part, shorts make it 0 Ω, a bridge adds a 0 Ω link between the two pins'
 * nets, a lifted pin moves the section's terminal to a net of its own, a missing rail holds the
 * rail net at 0 V, stuck and dead outputs are forced in the solver. Drifted parts and low rails
 * have an unknown value and are tried on a grid. A net left with no DC path is tied the way it
 * behaves on the bench: an op-amp input drifts to one rail or the other (its bias current charges
 * it), any other net reads near 0 V through the meter's own input resistance.
 */
final class FaultModel {
  /** Grid points per drifted part or low rail; values between them are interpolated. */
  static final int GRID = 40;

  /** The largest drift tried, as a factor of the marked value (beyond it, the part is open). */
  static final double MAX_DRIFT = 1000;

  /** A DMM's input resistance on DC volts: 10 MΩ (common practice for handheld meters). */
  static final double METER_OHMS = 10e6;

  /**
   * A floating op-amp input is pulled to a rail through this: it stands for the bias current that
   * charges the node (any value far above the stage's resistors gives the same reading).
   */
  static final double DRIFT_TIE_OHMS = 1e9;

  /** Designator prefix of the tie that stands for a floating input's drift to a rail. */
  static final String DRIFT_TIE = "~drift-";

  private FaultModel() {}

  /** Returns the scenarios of a fault on a base stage and base conditions, weights summing to 1. */
  static List<Scenario> scenarios(Stage base, Conditions conditions, Fault fault) {
    List<Scenario> raw = applied(base, conditions, fault);
    List<Scenario> tied = new ArrayList<>();
    // The points of a grid differ only in one value, never in which nets float: check once.
    boolean grid = raw.size() > 1 && allOnGrid(raw);
    List<String> gridFloating = grid ? floatingNets(raw.get(0)) : null;
    for (Scenario scenario : raw) {
      tied.addAll(tieFloating(scenario, grid ? gridFloating : floatingNets(scenario)));
    }
    CompensatedSum sum = new CompensatedSum();
    for (Scenario s : tied) {
      sum.add(s.weight());
    }
    double total = sum.total();
    List<Scenario> out = new ArrayList<>(tied.size());
    for (Scenario s : tied) {
      out.add(s.withWeight(s.weight() / total));
    }
    return java.util.Collections.unmodifiableList(out);
  }

  /** Whether every scenario is a point of a grid. */
  static boolean allOnGrid(List<Scenario> scenarios) {
    for (Scenario s : scenarios) {
      if (!s.onGrid()) {
        return false;
      }
    }
    return true;
  }

  /** Returns the factors tried for a part drifted high or low (above 1 for high). */
  static double[] driftFactors(double tolerance, boolean high) {
    // Start just beyond the marked tolerance, so that "high" never overlaps "healthy".
    double start = Math.log(1 + 1.5 * tolerance + 0.01);
    double end = Math.log(MAX_DRIFT);
    double[] factors = new double[GRID];
    for (int i = 0; i < GRID; i++) {
      double f = Math.exp(start + (end - start) * i / (GRID - 1));
      factors[i] = high ? f : 1 / f;
    }
    return factors;
  }

  /** Returns the factors tried for a zener's voltage drifted high or low, up to ×3 or ÷3. */
  static double[] zenerFactors(double tolerance, boolean high) {
    double start = Math.log(1 + 1.5 * tolerance + 0.01);
    double end = Math.log(MAX_ZENER_DRIFT);
    double[] factors = new double[GRID];
    for (int i = 0; i < GRID; i++) {
      double f = Math.exp(start + (end - start) * i / (GRID - 1));
      factors[i] = high ? f : 1 / f;
    }
    return factors;
  }

  /** Returns the fractions of nominal tried for a low rail: from 5 % up to just below tolerance. */
  static double[] railFractions(double tolerance) {
    double start = 0.05;
    double end = 1 - 1.5 * tolerance - 0.01;
    double[] fractions = new double[GRID];
    for (int i = 0; i < GRID; i++) {
      fractions[i] = start + (end - start) * i / (GRID - 1);
    }
    return fractions;
  }

  private static List<Scenario> applied(Stage base, Conditions conditions, Fault fault) {
    String s = fault.subject();
    return switch (fault.kind()) {
      case HEALTHY -> List.of(new Scenario(base, conditions, 1, Double.NaN, ""));
      case OPEN ->
          isTrimmer(base, s)
              ? trackOpen(base, conditions, s)
              : List.of(new Scenario(base.minusPart(s), conditions, 1, Double.NaN, ""));
      case SHORT -> List.of(new Scenario(shorted(base, s), conditions, 1, Double.NaN, ""));
      case HIGH, LOW -> drifted(base, conditions, s, fault.kind() == FaultKind.HIGH);
      case STUCK_HIGH -> forced(base, conditions, s, SectionState.HIGH);
      case STUCK_LOW -> forced(base, conditions, s, SectionState.LOW);
      case DEAD -> forced(base, conditions, s, SectionState.DEAD);
      case LIFTED -> List.of(lifted(base, conditions, s, fault.pin()));
      case BRIDGE -> bridged(base, conditions, s, fault.pin(), fault.otherPin());
      case RAIL_MISSING ->
          List.of(new Scenario(base, conditions.withDriven(s, 0.0), 1, Double.NaN, ""));
      case RAIL_LOW -> lowRail(base, conditions, s);
      case LEAKY -> leaky(base, conditions, s);
      case WIPER_OPEN -> List.of(wiperOpen(base, conditions, s));
      case MISSET -> misset(base, conditions, s);
    };
  }

  /** The largest factor tried for a zener drifted high or low: 3 (beyond, it is open or short). */
  static final double MAX_ZENER_DRIFT = 3;

  /** The range of leak resistances tried for a leaky junction: 100 Ω to 10 MΩ. */
  static final double LEAK_MIN_OHMS = 100;

  static final double LEAK_MAX_OHMS = 10e6;

  /**
   * How far a trimmer's wiper may sit from the sheet's position on a working unit: ±5 % of its
   * travel (common practice for a setting made by hand). A misset trimmer sits beyond it.
   */
  static final double SET_SPREAD = 0.05;

  /** Positions tried for a misset trimmer: every 2.5 % of the travel. */
  static final int POSITIONS = 41;

  private static boolean isTrimmer(Stage base, String ref) {
    Part part = base.part(ref).orElse(null);
    return part != null && part.kind().isTrimmer();
  }

  /** Returns the leak resistances tried for a leaky junction, log-spaced. */
  static double[] leakOhms() {
    double[] ohms = new double[GRID];
    for (int i = 0; i < GRID; i++) {
      ohms[i] = LEAK_MIN_OHMS * Math.pow(LEAK_MAX_OHMS / LEAK_MIN_OHMS, (double) i / (GRID - 1));
    }
    return ohms;
  }

  /** Returns the wiper positions tried for a misset trimmer set at {@code nominal}. */
  static double[] missetPositions(double nominal) {
    double[] positions = new double[POSITIONS];
    int n = 0;
    for (int i = 0; i < POSITIONS; i++) {
      double p = (double) i / (POSITIONS - 1);
      if (Math.abs(p - nominal) > SET_SPREAD + 1e-9) {
        positions[n++] = p;
      }
    }
    return java.util.Arrays.copyOf(positions, n);
  }

  private static List<Scenario> leaky(Stage base, Conditions conditions, String ref) {
    Part part = base.part(ref).orElseThrow();
    List<Scenario> grid = new ArrayList<>();
    for (double ohms : leakOhms()) {
      Part leak = Part.resistor("~leak-" + ref, ohms, 0, part.netA(), part.netB());
      grid.add(new Scenario(base.plusPart(leak), conditions, 1, ohms, ""));
    }
    return grid;
  }

  /** The wiper has left the track: the track stays whole between its ends, the wiper is free. */
  private static Scenario wiperOpen(Stage base, Conditions conditions, String ref) {
    Part part = base.part(ref).orElseThrow();
    Part track = Part.resistor(ref, part.value(), part.tolerance(), part.netA(), part.netB());
    return new Scenario(base.withPart(track), conditions, 1, Double.NaN, "");
  }

  /** The track is open: the wiper still touches one side or the other (two scenarios). */
  private static List<Scenario> trackOpen(Stage base, Conditions conditions, String ref) {
    Part part = base.part(ref).orElseThrow();
    double[] track = part.trackOhms();
    List<Scenario> out = new ArrayList<>();
    {
      Part upper = Part.resistor(ref, track[0], part.tolerance(), part.netA(), part.wiper());
      out.add(
          new Scenario(
              base.withPart(upper),
              conditions,
              0.5,
              Double.NaN,
              "the wiper keeps the " + part.netA() + " end"));
    }
    {
      Part lower = Part.resistor(ref, track[1], part.tolerance(), part.wiper(), part.netB());
      out.add(
          new Scenario(
              base.withPart(lower),
              conditions,
              0.5,
              Double.NaN,
              "the wiper keeps the " + part.netB() + " end"));
    }
    if (out.isEmpty()) {
      out.add(new Scenario(base.minusPart(ref), conditions, 1, Double.NaN, ""));
    }
    return out;
  }

  private static List<Scenario> misset(Stage base, Conditions conditions, String ref) {
    Part part = base.part(ref).orElseThrow();
    List<Scenario> grid = new ArrayList<>();
    for (double position : missetPositions(part.position())) {
      grid.add(
          new Scenario(base.withPart(part.withPosition(position)), conditions, 1, position, ""));
    }
    return grid;
  }

  private static Stage shorted(Stage base, String ref) {
    Part part = base.part(ref).orElseThrow();
    Part link = new Part(part.ref(), PartKind.RESISTOR, 0, 0, part.netA(), part.netB());
    return base.withPart(link);
  }

  private static List<Scenario> drifted(
      Stage base, Conditions conditions, String ref, boolean high) {
    Part part = base.part(ref).orElseThrow();
    List<Scenario> grid = new ArrayList<>();
    double[] factors =
        part.kind() == PartKind.ZENER
            ? zenerFactors(part.tolerance(), high)
            : driftFactors(part.tolerance(), high);
    for (double factor : factors) {
      double value = part.value() * factor;
      grid.add(new Scenario(base.withPart(part.withValue(value)), conditions, 1, value, ""));
    }
    return grid;
  }

  private static List<Scenario> lowRail(Stage base, Conditions conditions, String net) {
    Rail rail = base.rail(net).orElseThrow();
    double nominal = conditions.driven().getOrDefault(net, rail.volts());
    List<Scenario> grid = new ArrayList<>();
    for (double fraction : railFractions(rail.tolerance())) {
      double volts = nominal * fraction;
      grid.add(new Scenario(base, conditions.withDriven(net, volts), 1, volts, ""));
    }
    return grid;
  }

  private static List<Scenario> forced(
      Stage base, Conditions conditions, String ref, SectionState state) {
    return List.of(new Scenario(base, conditions.withForced(ref, state), 1, Double.NaN, ""));
  }

  private static Scenario lifted(Stage base, Conditions conditions, String pkg, int pin) {
    String pinNet = pkg + "." + pin + " (lifted)";
    Stage stage = base;
    for (Amplifier amp : base.sectionsOf(pkg)) {
      for (Terminal terminal : Terminal.values()) {
        if (amp.pin(terminal) == pin) {
          stage =
              stage.withAmplifier(
                  stage.amplifier(amp.ref()).orElseThrow().withNet(terminal, pinNet));
        }
      }
    }
    return new Scenario(stage, conditions, 1, Double.NaN, "");
  }

  private static List<Scenario> bridged(
      Stage base, Conditions conditions, String pkg, int pinA, int pinB) {
    Map<String, String> pins = base.pinNets();
    String netA = pins.get(pkg + "." + pinA);
    String netB = pins.get(pkg + "." + pinB);
    boolean drivenA = base.isDriven(netA);
    boolean drivenB = base.isDriven(netB);
    if (drivenA && drivenB) {
      // Two stiff sources shorted together: the weaker gives way. A rail shorted to ground
      // collapses (its fuse blows or its regulator folds back); two rails meet in the middle; a
      // test input loses to a rail or to ground (common practice, as a model).
      double a = volts(base, conditions, netA);
      double b = volts(base, conditions, netB);
      Conditions c = conditions;
      if (netA.equals(base.ground())
          || base.rail(netB).isPresent() && base.input(netA).isPresent()) {
        c = c.withDriven(netB, a);
      } else if (netB.equals(base.ground())
          || base.rail(netA).isPresent() && base.input(netB).isPresent()) {
        c = c.withDriven(netA, b);
      } else {
        double mid = (a + b) / 2;
        c = c.withDriven(netA, mid).withDriven(netB, mid);
      }
      // A stiff bench supply may also hold both nets where they are, the damage then showing only
      // as heat: both outcomes count.
      return List.of(
          new Scenario(base, c, 0.5, Double.NaN, "the weaker source gives way"),
          new Scenario(base, conditions, 0.5, Double.NaN, "both sources hold; expect heat"));
    }
    Part link = new Part("~bridge", PartKind.RESISTOR, 0, 0, netA, netB);
    return List.of(new Scenario(base.plusPart(link), conditions, 1, Double.NaN, ""));
  }

  private static double volts(Stage stage, Conditions conditions, String net) {
    Double given = conditions.driven().get(net);
    return given != null ? given : stage.drivenVolts().get(net);
  }

  /**
   * Ties every floating net of a scenario: an op-amp input to either rail of its section (two
   * scenarios), anything else to ground through the meter. At most two inputs are split; further
   * ones drift to the first section's v- rail.
   */
  private static List<Scenario> tieFloating(Scenario scenario, List<String> floatingNets) {
    if (floatingNets.isEmpty()) {
      return List.of(scenario);
    }
    List<Scenario> out = List.of(scenario);
    int split = 0;
    for (String net : floatingNets) {
      Amplifier reader = inputReader(scenario.stage(), net);
      List<Scenario> next = new ArrayList<>();
      for (Scenario s : out) {
        if (reader == null) {
          next.add(withTie(s, net, s.stage().ground(), METER_OHMS, s.weight(), s.label()));
        } else if (split < 2) {
          next.add(
              withTie(
                  s,
                  net,
                  reader.vPlus(),
                  DRIFT_TIE_OHMS,
                  s.weight() / 2,
                  join(s.label(), net + " drifts to v+")));
          next.add(
              withTie(
                  s,
                  net,
                  reader.vMinus(),
                  DRIFT_TIE_OHMS,
                  s.weight() / 2,
                  join(s.label(), net + " drifts to v-")));
        } else {
          next.add(withTie(s, net, reader.vMinus(), DRIFT_TIE_OHMS, s.weight(), s.label()));
        }
      }
      if (reader != null) {
        split++;
      }
      out = next;
    }
    // A tie to a supply pin that itself floats (a lifted supply pin) is settled by a second pass.
    List<Scenario> settled = new ArrayList<>();
    for (Scenario s : out) {
      List<String> still = floatingNets(s);
      if (!still.isEmpty()) {
        Scenario grounded = s;
        for (String net : still) {
          grounded =
              withTie(
                  grounded,
                  net,
                  grounded.stage().ground(),
                  METER_OHMS,
                  grounded.weight(),
                  grounded.label());
        }
        settled.add(grounded);
      } else {
        settled.add(s);
      }
    }
    return settled;
  }

  /** The nets of a scenario with no DC path to a driven net; a dead output drives nothing. */
  private static List<String> floatingNets(Scenario scenario) {
    java.util.Set<String> dead = new java.util.HashSet<>();
    for (Map.Entry<String, SectionState> e : scenario.conditions().forced().entrySet()) {
      if (e.getValue() == SectionState.DEAD) {
        dead.add(e.getKey());
      }
    }
    return Connectivity.floatingNets(scenario.stage(), dead);
  }

  private static Amplifier inputReader(Stage stage, String net) {
    for (Amplifier amp : stage.amplifiers()) {
      if (amp.inPlus().equals(net) || amp.inMinus().equals(net)) {
        return amp;
      }
    }
    return null;
  }

  private static Scenario withTie(
      Scenario s, String net, String to, double ohms, double weight, String label) {
    if (net.equals(to)) {
      return new Scenario(s.stage(), s.conditions(), weight, s.value(), label);
    }
    String kind = ohms == DRIFT_TIE_OHMS ? DRIFT_TIE : "~meter-";
    Part tie = Part.resistor(kind + net, ohms, 0, net, to);
    return new Scenario(s.stage().plusPart(tie), s.conditions(), weight, s.value(), label);
  }

  private static String join(String a, String b) {
    return a.isEmpty() ? b : a + ", " + b;
  }
}
