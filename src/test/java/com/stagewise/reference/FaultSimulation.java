package com.stagewise.reference;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Range;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.reference.FlatCircuit.Branch;
import com.stagewise.reference.FlatCircuit.Mode;
import com.stagewise.reference.FlatCircuit.Section;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.DeviceParams;
import com.stagewise.solver.Phasor;
import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.SplittableRandom;

/**
 * Simulates one faulted unit of a stage with ngspice (ngspice 39, Debian package, as reference
 * simulator), independently of the diagnosis code: random in-tolerance parts, rails and device
 * parameters, the fault applied to the flattened circuit here, then meter readings with the meter's
 * error added.
 */
final class FaultSimulation {
  /** A drifted part is off by a factor drawn uniformly from this interval (×3…×10 or ÷3…÷10). */
  static final double DRIFT_MIN = 3;

  static final double DRIFT_MAX = 10;

  /** A low rail sits at 50–85 % of its nominal voltage. */
  static final double LOW_RAIL_MIN = 0.50;

  static final double LOW_RAIL_MAX = 0.85;

  /**
   * The scope's accuracy for AC readings, ±(3 % of reading + 1 mV): the readings contract's default
   * for an AC reading without its own uncertainty.
   */
  static final double SCOPE_FRACTION = 0.03;

  static final double SCOPE_VOLTS = 1e-3;

  /** AC readings are shown to 0.1 mV. */
  static final double SCOPE_RESOLUTION = 1e-4;

  private FaultSimulation() {}

  /**
   * A floating node tied to where its bias or leakage current pulls it.
   *
   * @param node the node (a net, or {@code pin:U1.3} for a lifted pin)
   * @param to the node it is tied to through 1 GΩ
   * @param why what pulls it there
   * @param group every node of the floating group (held together by resistors)
   */
  record Tie(String node, String to, String why, List<String> group) {}

  /**
   * One reading as the readings contract writes it.
   *
   * @param at a net or {@code PACKAGE.PIN}
   * @param kind {@code dc} or {@code ac}
   * @param volts the shown value
   * @param hz the frequency of an AC reading, else 0
   */
  record Reading(String at, String kind, double volts, double hz) {}

  /**
   * One power-off reading between two nets, as the truth generator computed it.
   *
   * @param at the first net
   * @param to the second net
   * @param exact ngspice's resistance in ohms ({@link Double#POSITIVE_INFINITY}: nothing connects)
   * @param shown what the ohmmeter shows ({@link Double#POSITIVE_INFINITY}: OL)
   */
  record Ohms(String at, String to, double exact, double shown) {}

  /** One simulated unit. */
  record Case(
      String fault,
      long seed,
      int sample,
      Map<String, Double> parts,
      Map<String, Double> rails,
      Map<String, DeviceParams> devices,
      Double faultValue,
      List<Tie> ties,
      Map<String, Double> exactDc,
      double hz,
      Map<String, Phasor> exactAc,
      List<Reading> readings,
      List<String> partial,
      String start,
      String solvedBy,
      List<Ohms> ohms) {}

  /** A case ngspice could not solve. */
  record Dropped(String fault, long seed, int sample, String reason) {}

  /** Returns the simulated case, or why it was dropped. */
  static Object simulate(Stage stage, String fault, long seed, int sample, MeterModel meter) {
    SplittableRandom rnd = new SplittableRandom(seed);
    Map<String, Double> parts = new LinkedHashMap<>();
    List<Part> randomParts = new ArrayList<>();
    for (Part part : stage.parts()) {
      double value = part.value() * (1 + uniform(rnd, -part.tolerance(), part.tolerance()));
      parts.put(part.ref(), value);
      randomParts.add(part.withValue(value));
    }
    List<Rail> randomRails = new ArrayList<>();
    for (Rail rail : stage.rails()) {
      double volts = rail.volts() * (1 + uniform(rnd, -rail.tolerance(), rail.tolerance()));
      randomRails.add(new Rail(rail.net(), volts, rail.tolerance()));
    }
    Conditions conditions = Conditions.NOMINAL;
    Map<String, DeviceParams> devices = new LinkedHashMap<>();
    for (Amplifier amp : stage.amplifiers()) {
      DeviceParams params = randomDevice(rnd, amp.deviceClass());
      devices.put(amp.ref(), params);
      conditions = conditions.withDevice(amp.ref(), params);
    }
    Stage unit = stage.withParts(randomParts).withRails(randomRails);
    FlatCircuit flat = FlatCircuit.of(unit, conditions);
    Double faultValue = apply(flat, stage, fault, rnd);
    // Power off, before any floating node is tied (a tie stands for a bias current, which flows
    // only
    // with the power on). The meter's error is drawn from a random stream of its own, so that the
    // volts readings stay exactly as they were before power-off readings joined.
    SpicePowerOff.Answer off = SpicePowerOff.ofUnit(flat, stage);
    SplittableRandom ohmsRnd = new SplittableRandom(seed ^ OHMS_STREAM);
    List<Ohms> ohms = new ArrayList<>();
    for (int k = 0; k < off.pairs().size(); k++) {
      double exact = off.ohms()[k];
      ohms.add(
          new Ohms(
              off.pairs().get(k)[0],
              off.pairs().get(k)[1],
              Double.isInfinite(exact) ? exact : significant(exact),
              ohmmeterReading(ohmsRnd, OhmsMeterModel.HANDHELD, exact)));
    }
    List<Tie> ties = tieFloating(flat, rnd);
    Map<String, Double> rails = new LinkedHashMap<>();
    for (Rail rail : stage.rails()) {
      rails.put(rail.net(), flat.driven.get(rail.net()));
    }
    // Each section starts high or low at random, as a real unit powers up in either state of a
    // Schmitt trigger; a stage with one stable state ends there whatever the start.
    boolean[] start = new boolean[flat.sections.size()];
    StringBuilder startWords = new StringBuilder();
    for (int k = 0; k < start.length; k++) {
      start[k] = rnd.nextBoolean();
      startWords
          .append(k == 0 ? "" : " ")
          .append(flat.sections.get(k).ref())
          .append(start[k] ? ":high" : ":low");
    }
    SpiceSolve.Attempt attempt = SpiceSolve.attempt(flat, stage.title(), start);
    if (!(attempt.outcome() instanceof Ngspice.Solved solved)) {
      return new Dropped(fault, seed, sample, ((Ngspice.Failed) attempt.outcome()).reason());
    }
    Map<String, Double> exactDc = new LinkedHashMap<>();
    for (String net : flat.nets) {
      exactDc.put(net, solved.dc().get(net));
    }
    flat.pinNodes.forEach((pin, node) -> exactDc.put(pin, solved.dc().get(node)));
    Map<String, Phasor> exactAc = new LinkedHashMap<>();
    if (flat.hz > 0) {
      for (Amplifier amp : stage.amplifiers()) {
        exactAc.put(
            amp.out(), new Phasor(solved.acAmplitude(amp.out()), solved.acPhaseDegrees(amp.out())));
      }
    }
    List<Reading> readings = new ArrayList<>();
    exactDc.forEach(
        (at, volts) -> readings.add(new Reading(at, "dc", meterReading(rnd, meter, volts), 0)));
    exactAc.forEach(
        (at, phasor) ->
            readings.add(new Reading(at, "ac", scopeReading(rnd, phasor.amplitude()), flat.hz)));
    // A partial set as a technician takes it: the output, then one or two package pins.
    String output = stage.amplifiers().get(0).out();
    List<String> pins = new ArrayList<>(flat.pinNodes.keySet());
    pins.removeIf(
        pin ->
            stage.pinNets().get(pin).equals(output) && !flat.pinNodes.get(pin).startsWith("pin:"));
    Set<String> partial = new LinkedHashSet<>();
    partial.add(output);
    int wanted = 1 + Math.min(pins.size(), 1 + rnd.nextInt(2));
    while (partial.size() < wanted) {
      partial.add(pins.get(rnd.nextInt(pins.size())));
    }
    return new Case(
        fault,
        seed,
        sample,
        parts,
        rails,
        devices,
        faultValue,
        ties,
        round(exactDc),
        flat.hz,
        exactAc,
        readings,
        List.copyOf(partial),
        startWords.toString(),
        attempt.how(),
        ohms);
  }

  /** Device parameters drawn uniformly within the class's ranges (bias currents independently). */
  static DeviceParams randomDevice(SplittableRandom rnd, DeviceClass cls) {
    return new DeviceParams(
        uniform(rnd, cls.openLoopGain()),
        uniform(rnd, cls.offset()),
        uniform(rnd, cls.biasCurrent()),
        uniform(rnd, cls.biasCurrent()),
        cls.outputResistance(),
        uniform(rnd, cls.headroomLow()),
        uniform(rnd, cls.headroomHigh()));
  }

  /**
   * Applies a fault to the flattened circuit; returns the faulted value for a drifted part, else
   * null.
   */
  static Double apply(FlatCircuit flat, Stage stage, String fault, SplittableRandom rnd) {
    if (fault.equals("healthy")) {
      return null;
    }
    int colon = fault.lastIndexOf(':');
    String ref = fault.substring(0, colon);
    String kind = fault.substring(colon + 1);
    if (stage.rail(ref).isPresent()) {
      // Rail faults: "low" is also a part fault's word, so the ref decides.
      double nominal = stage.rail(ref).orElseThrow().volts();
      switch (kind) {
        case "missing" -> flat.driven.put(ref, 0.0);
        case "low" -> flat.driven.put(ref, nominal * uniform(rnd, LOW_RAIL_MIN, LOW_RAIL_MAX));
        default -> throw new IllegalArgumentException("unknown rail fault " + fault);
      }
      return null;
    }
    Part part = stage.part(ref).orElse(null);
    if (part != null && part.kind().isTrimmer()) {
      return applyToTrimmer(flat, part, kind, rnd);
    }
    switch (kind) {
      case "leaky" -> {
        // A leaky junction: a resistance across it, drawn log-uniformly.
        Branch b = flat.branches.get(flat.branchIndex(ref));
        double ohms = LEAK_MIN * Math.pow(LEAK_MAX / LEAK_MIN, rnd.nextDouble());
        flat.branches.add(new Branch("leak " + ref, PartKind.RESISTOR, b.a(), b.b(), ohms));
        return ohms;
      }
      case "open" -> flat.branches.remove(flat.branchIndex(ref));
      case "short" -> {
        int i = flat.branchIndex(ref);
        Branch b = flat.branches.get(i);
        flat.branches.set(
            i, new Branch(b.label(), PartKind.RESISTOR, b.a(), b.b(), FlatCircuit.SHORT_OHMS));
      }
      case "high", "low" -> {
        int i = flat.branchIndex(ref);
        Branch b = flat.branches.get(i);
        double factor = uniform(rnd, DRIFT_MIN, DRIFT_MAX);
        if (b.junction() != null) {
          // A zener's voltage drifted: factor drawn uniformly, its breakdown follows.
          double zf = uniform(rnd, ZENER_DRIFT_MIN, ZENER_DRIFT_MAX);
          double volts = kind.equals("high") ? b.value() * zf : b.value() / zf;
          flat.branches.set(
              i, new Branch(b.label(), b.kind(), b.a(), b.b(), volts, DiodeClass.zener(volts)));
          return volts;
        }
        double value = kind.equals("high") ? b.value() * factor : b.value() / factor;
        flat.branches.set(i, new Branch(b.label(), b.kind(), b.a(), b.b(), value));
        return value;
      }
      case "stuck-high", "stuck-low", "dead" -> {
        int k = flat.sectionIndex(ref);
        Mode mode =
            kind.equals("dead")
                ? Mode.DEAD
                : kind.equals("stuck-high") ? Mode.STUCK_HIGH : Mode.STUCK_LOW;
        flat.sections.set(k, flat.sections.get(k).withMode(mode));
      }
      case "lifted" -> {
        String node = "pin:" + ref;
        for (int k = 0; k < flat.sections.size(); k++) {
          Section s = flat.sections.get(k);
          for (Terminal t : Terminal.values()) {
            if (s.pins().get(t).equals(ref)) {
              s = s.withNode(t, node);
            }
          }
          flat.sections.set(k, s);
        }
        flat.pinNodes.put(ref, node);
      }
      case "bridge" -> {
        int dot = ref.lastIndexOf('.');
        String pkg = ref.substring(0, dot);
        String[] pins = ref.substring(dot + 1).split("-");
        String a = flat.pinNodes.get(pkg + "." + pins[0]);
        String b = flat.pinNodes.get(pkg + "." + pins[1]);
        flat.branches.add(
            new Branch("bridge " + ref, PartKind.RESISTOR, a, b, FlatCircuit.SHORT_OHMS));
      }
      default -> throw new IllegalArgumentException("unknown fault kind in " + fault);
    }
    return null;
  }

  /** A leaky junction's leak resistance: log-uniform from 2 kΩ to 200 kΩ (common practice). */
  static final double LEAK_MIN = 2e3;

  static final double LEAK_MAX = 200e3;

  /** A drifted zener's voltage factor: uniform from 1.15 to 1.6 (as a model of the fault). */
  static final double ZENER_DRIFT_MIN = 1.15;

  static final double ZENER_DRIFT_MAX = 1.6;

  /** A misset trimmer sits at least this far (share of travel) from its sheet position. */
  static final double MISSET_MIN = 0.15;

  /**
   * Applies a trimmer fault to its two track sections: the wiper off the track (the track whole end
   * to end), the track open (the wiper keeps one end, drawn at random), or the wiper moved to a
   * position drawn uniformly at least {@link #MISSET_MIN} from the sheet's.
   */
  private static Double applyToTrimmer(
      FlatCircuit flat, Part part, String kind, SplittableRandom rnd) {
    String ref = part.ref();
    int upper = flat.branchIndex(FlatCircuit.upperTrack(ref));
    Branch up = flat.branches.get(upper);
    int lower = flat.branchIndex(FlatCircuit.lowerTrack(ref));
    Branch down = flat.branches.get(lower);
    // The unit's own end-to-end value (drawn within tolerance) is the sum of its two sections.
    double ohms = up.value() + down.value();
    switch (kind) {
      case "wiper-open" -> {
        flat.branches.set(
            upper, new Branch(ref, PartKind.RESISTOR, part.netA(), part.netB(), ohms));
        flat.branches.remove(lower);
        return null;
      }
      case "open" -> {
        // Recorded as the fault value: 0 when the wiper keeps the first end, 1 the second.
        boolean keepsFirst = rnd.nextBoolean();
        flat.branches.remove(keepsFirst ? lower : upper);
        return keepsFirst ? 0.0 : 1.0;
      }
      case "misset" -> {
        double nominal = part.position();
        double position;
        do {
          position = rnd.nextDouble();
        } while (Math.abs(position - nominal) < MISSET_MIN);
        flat.branches.set(
            upper, new Branch(up.label(), up.kind(), up.a(), up.b(), ohms * position));
        flat.branches.set(
            lower,
            new Branch(down.label(), down.kind(), down.a(), down.b(), ohms * (1 - position)));
        return position;
      }
      default -> throw new IllegalArgumentException("unknown trimmer fault " + ref + ":" + kind);
    }
  }

  /**
   * Ties every group of nodes with no DC path to a source through 1 GΩ to where it drifts: a group
   * that holds an op-amp input goes to that section's v+ or v- pin (drawn at random: the input's
   * bias current pulls it until the input stage saturates at one rail), and that input's bias
   * source is dropped since the tie stands for it; any other group (a lifted supply pin, a net
   * between capacitors) goes to ground, where a meter's input resistance pulls it.
   */
  static List<Tie> tieFloating(FlatCircuit flat, SplittableRandom rnd) {
    List<Tie> ties = new ArrayList<>();
    List<Set<String>> groups = flat.floatingGroups();
    Set<String> floating = new LinkedHashSet<>();
    groups.forEach(floating::addAll);
    for (Set<String> group : groups) {
      Tie tie = null;
      for (int k = 0; k < flat.sections.size() && tie == null; k++) {
        Section s = flat.sections.get(k);
        for (Terminal input : List.of(Terminal.IN_PLUS, Terminal.IN_MINUS)) {
          if (group.contains(s.node(input))) {
            Terminal supply = rnd.nextBoolean() ? Terminal.V_PLUS : Terminal.V_MINUS;
            String to = s.node(supply);
            if (floating.contains(to)) {
              to = flat.ground;
            }
            tie =
                new Tie(
                    s.node(input),
                    to,
                    s.ref() + " " + input.symbol() + " bias current",
                    List.copyOf(group));
            break;
          }
        }
      }
      if (tie == null) {
        tie =
            new Tie(
                group.iterator().next(),
                flat.ground,
                "no source: meter and leakage pull it to ground",
                List.copyOf(group));
      }
      flat.branches.add(
          new Branch("tie", PartKind.RESISTOR, tie.node(), tie.to(), FlatCircuit.TIE_OHMS));
      ties.add(tie);
      for (int k = 0; k < flat.sections.size(); k++) {
        Section s = flat.sections.get(k);
        DeviceParams p = s.params();
        double plus = group.contains(s.node(Terminal.IN_PLUS)) ? 0 : p.biasPlus();
        double minus = group.contains(s.node(Terminal.IN_MINUS)) ? 0 : p.biasMinus();
        flat.sections.set(k, s.withParams(p.withBias(plus, minus)));
      }
    }
    return ties;
  }

  /**
   * Returns what the meter shows for {@code volts}: the true value plus an error drawn uniformly
   * within the meter's accuracy, rounded to the resolution of the autoranged range.
   */
  static double meterReading(SplittableRandom rnd, MeterModel meter, double volts) {
    double u = meter.uncertainty(volts);
    double shown = volts + uniform(rnd, -u, u);
    return roundTo(shown, meter.resolution(shown));
  }

  /** Salt of the random stream of the ohmmeter's errors ("ohms" in ASCII). */
  static final long OHMS_STREAM = 0x6f686d73L;

  /**
   * Returns what the ohmmeter shows for a resistance: the error drawn uniformly within its
   * accuracy, rounded to the range's resolution, OL ({@link Double#POSITIVE_INFINITY}) beyond the
   * top range or where nothing connects; never below 0.
   */
  static double ohmmeterReading(SplittableRandom rnd, OhmsMeterModel meter, double ohms) {
    if (!Double.isFinite(ohms) || ohms > meter.overRange()) {
      return Double.POSITIVE_INFINITY;
    }
    double u = meter.uncertainty(ohms);
    double shown = Math.max(0, ohms + uniform(rnd, -u, u));
    double rounded = roundTo(shown, meter.resolution(shown));
    return rounded > meter.overRange() ? Double.POSITIVE_INFINITY : rounded;
  }

  /** Returns what the scope shows for an amplitude: ±(3 % + 1 mV), to 0.1 mV, never negative. */
  static double scopeReading(SplittableRandom rnd, double amplitude) {
    double u = SCOPE_FRACTION * amplitude + SCOPE_VOLTS;
    return Math.max(0, roundTo(amplitude + uniform(rnd, -u, u), SCOPE_RESOLUTION));
  }

  /** Rounds to a decimal resolution (1e-4, 1e-3, …) so that the result prints without noise. */
  static double roundTo(double value, double resolution) {
    BigDecimal step = new BigDecimal(resolution, new MathContext(1));
    return new BigDecimal(value)
        .divide(step, 0, java.math.RoundingMode.HALF_EVEN)
        .multiply(step)
        .doubleValue();
  }

  /** Returns the values rounded to 9 significant digits, enough for any comparison and compact. */
  static Map<String, Double> round(Map<String, Double> values) {
    Map<String, Double> rounded = new LinkedHashMap<>();
    values.forEach((k, v) -> rounded.put(k, significant(v)));
    return rounded;
  }

  static double significant(double v) {
    return v == 0 ? 0 : new BigDecimal(v).round(new MathContext(9)).doubleValue();
  }

  private static double uniform(SplittableRandom rnd, Range range) {
    return uniform(rnd, range.low(), range.high());
  }

  private static double uniform(SplittableRandom rnd, double low, double high) {
    return high > low ? low + (high - low) * rnd.nextDouble() : low;
  }
}
