package com.stagewise.reference;

import com.stagewise.circuit.JunctionFigures;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.reference.FlatCircuit.Branch;
import com.stagewise.reference.FlatCircuit.Mode;
import com.stagewise.reference.FlatCircuit.Section;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.DeviceParams;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * An ngspice netlist (ngspice 39, Debian package, as reference simulator) that models a stage with
 * exactly the op-amp model of our solver, plus which SPICE node each of our nodes became.
 *
 * <p>Each section is an XSPICE {@code limit} element (the ngspice manual's "limit" code model: a
 * gain with output limits and a smoothed corner) whose input is {@code v(in+) − v(in−)} with the
 * input offset added by a series source, whose gain is the open-loop gain and whose limits are the
 * clamp {@code [v(v−) + headroomLow, v(v+) − headroomHigh]}, behind the output resistance to the
 * output net. Bias currents are current sources that draw from each input's net. Resistors below 1
 * mΩ are written at 1 mΩ, as the solver models them.
 *
 * <p>The limits of a {@code limit} element are numbers, so they are computed from the supply pins'
 * voltages: a supply pin on a driven net (a rail, ground or an input), or on a node held by a
 * single tie to a driven net, has a known voltage. When the interval is empty both limits are the
 * mid-supply point, written as a plain source, as the solver does. A supply pin on a solved net (a
 * rail fed through a resistor) is modelled with a cascade of two limiters whose limits follow the
 * pin voltages through behavioural sources that apply the same mid-supply rule.
 *
 * @param text the netlist, ready for {@code ngspice -b}
 * @param spiceNodes our node name → SPICE node name ({@code 0} for ground)
 */
record SpiceNetlist(String text, Map<String, String> spiceNodes) {

  /**
   * Smoothing band of the limiter's corners, in volts. The output deviates from the hard clamp by
   * at most this much, and only when the demand lies within it of a limit: far below a meter count.
   */
  static final double LIMIT_RANGE = 1e-6;

  /** The limiter's corner band for a second, relaxed attempt, in volts (still below a count). */
  static final double RELAXED_LIMIT_RANGE = 1e-4;

  /** Returns the netlist of a stage with nominal parts under the given solver conditions. */
  static SpiceNetlist of(Stage stage, Conditions conditions) {
    return of(FlatCircuit.of(stage, conditions), stage.title());
  }

  /** Returns the netlist of a flattened (perhaps faulted) circuit with tight tolerances. */
  static SpiceNetlist of(FlatCircuit flat, String title) {
    return of(flat, title, false);
  }

  /**
   * Returns the netlist of a flattened (perhaps faulted) circuit.
   *
   * @param relaxed whether to use ngspice's default-like tolerances and a wider limiter corner
   *     ({@link #RELAXED_LIMIT_RANGE}): a second attempt for a circuit whose tight run did not
   *     converge; still far within a meter count
   */
  static SpiceNetlist of(FlatCircuit flat, String title, boolean relaxed) {
    return of(flat, title, relaxed, Map.of());
  }

  /**
   * Returns the netlist of a flattened circuit whose DC solution starts from the given node
   * voltages ({@code .nodeset}, keyed by SPICE node name): ngspice holds the nodes there for its
   * first iterations, then lets them go and converges to a true solution nearby. Used to start a
   * stage with positive feedback in one of its stable states rather than at its unstable middle.
   */
  static SpiceNetlist of(
      FlatCircuit flat, String title, boolean relaxed, Map<String, Double> nodeset) {
    Body body = body(flat, relaxed);
    StringBuilder text = new StringBuilder();
    text.append("* ")
        .append(oneLine(title))
        .append(" (Stagewise op-amp model: clamped source behind Rout)\n");
    text.append(options(relaxed)).append('\n');
    text.append(body.lines());
    for (Map.Entry<String, Double> e : nodeset.entrySet()) {
      text.append(".nodeset v(")
          .append(e.getKey())
          .append(")=")
          .append(num(e.getValue()))
          .append('\n');
    }
    text.append(".control\n");
    text.append("set numdgt=15\n");
    text.append("echo @@op\n");
    text.append("op\n");
    text.append("print all\n");
    if (flat.hz > 0) {
      text.append("echo @@ac\n");
      text.append("ac lin 1 ").append(num(flat.hz)).append(' ').append(num(flat.hz)).append('\n');
      text.append("print all\n");
    }
    text.append("echo @@end\n");
    // Without quit 0, ngspice 39 in batch mode exits with status 1.
    text.append("quit 0\n");
    text.append(".endc\n");
    text.append(".end\n");
    return new SpiceNetlist(text.toString(), body.spiceNodes());
  }

  /** The simulator options line: tight tolerances, or ngspice's default-like ones when relaxed. */
  static String options(boolean relaxed) {
    return relaxed
        ? ".options reltol=1e-6 vntol=1e-9 abstol=1e-12 itl1=1000"
        : ".options reltol=1e-9 vntol=1e-12 abstol=1e-15 itl1=500";
  }

  /**
   * The element lines of a circuit (sources, parts, sections) without title, options or analyses.
   *
   * @param lines the element lines, each ending in a newline
   * @param spiceNodes our node name → SPICE node name ({@code 0} for ground)
   */
  record Body(String lines, Map<String, String> spiceNodes) {}

  /**
   * Returns the element lines of a flattened circuit; see {@link #of(FlatCircuit, String,
   * boolean)}.
   */
  static Body body(FlatCircuit flat, boolean relaxed) {
    double limitRange = relaxed ? RELAXED_LIMIT_RANGE : LIMIT_RANGE;
    Map<String, String> names = new LinkedHashMap<>();
    int next = 1;
    for (String node : flat.nodes()) {
      names.put(node, node.equals(flat.ground) ? "0" : "n" + next++);
    }
    Writer w = new Writer(names);
    for (Map.Entry<String, String> e : names.entrySet()) {
      w.line("* node " + e.getValue() + " = " + oneLine(e.getKey()));
    }
    int v = 0;
    for (Map.Entry<String, Double> source : flat.driven.entrySet()) {
      v++;
      double ac = flat.acDrive.getOrDefault(source.getKey(), 0.0);
      w.line("* driven " + oneLine(source.getKey()));
      w.line(
          "V"
              + v
              + " "
              + w.node(source.getKey())
              + " 0 DC "
              + num(source.getValue())
              + (ac > 0 ? " AC " + num(ac) : ""));
    }
    int r = 0;
    int c = 0;
    int d = 0;
    for (Branch branch : flat.branches) {
      w.line("* " + oneLine(branch.label()));
      if (branch.junction() != null) {
        // ngspice's D element (the SPICE2 junction model): IS, N, RS; a zener's BV, IBV, NBV.
        d++;
        JunctionFigures f = branch.junction();
        w.line("D" + d + " " + w.node(branch.a()) + " " + w.node(branch.b()) + " dm" + d);
        w.line(
            ".model dm"
                + d
                + " D(IS="
                + num(f.saturationAmps())
                + " N="
                + num(f.emission())
                + " RS="
                + num(f.seriesOhms())
                + (f.breaksDown()
                    ? " BV="
                        + num(f.breakdownVolts())
                        + " IBV="
                        + num(f.breakdownAmps())
                        + " NBV="
                        + num(f.emission())
                    : "")
                + ")");
      } else if (branch.kind() == PartKind.RESISTOR) {
        r++;
        w.line(
            "R"
                + r
                + " "
                + w.node(branch.a())
                + " "
                + w.node(branch.b())
                + " "
                + num(Math.max(branch.value(), FlatCircuit.SHORT_OHMS)));
      } else if (branch.value() > 0) {
        // A 0 F capacitor is no part at all; SPICE rejects a zero capacitance.
        c++;
        w.line(
            "C"
                + c
                + " "
                + w.node(branch.a())
                + " "
                + w.node(branch.b())
                + " "
                + num(branch.value()));
      }
    }
    for (int k = 0; k < flat.sections.size(); k++) {
      writeSection(w, flat, k + 1, flat.sections.get(k), limitRange);
    }
    return new Body(w.text.toString(), Map.copyOf(names));
  }

  private static void writeSection(
      Writer w, FlatCircuit flat, int k, Section s, double limitRange) {
    DeviceParams p = s.params();
    String inPlus = w.node(s.node(Terminal.IN_PLUS));
    String inMinus = w.node(s.node(Terminal.IN_MINUS));
    String out = w.node(s.node(Terminal.OUT));
    String src = "s" + k + "o";
    w.line("* section " + oneLine(s.ref()) + " (" + s.mode().name().toLowerCase(Locale.ROOT) + ")");
    // Bias currents leave each input's net into the section (solver convention); on a driven net
    // they change no voltage and are left out.
    if (p.biasPlus() != 0 && !flat.isDriven(s.node(Terminal.IN_PLUS))) {
      w.line("Ibp" + k + " " + inPlus + " 0 DC " + num(p.biasPlus()));
    }
    if (p.biasMinus() != 0 && !flat.isDriven(s.node(Terminal.IN_MINUS))) {
      w.line("Ibm" + k + " " + inMinus + " 0 DC " + num(p.biasMinus()));
    }
    if (s.mode() == Mode.DEAD) {
      w.line("* dead: no source, no output resistance");
      return;
    }
    w.line("Rout" + k + " " + src + " " + out + " " + num(p.outputResistance()));
    OptionalDouble vPlus = knownVolts(flat, s.node(Terminal.V_PLUS));
    OptionalDouble vMinus = knownVolts(flat, s.node(Terminal.V_MINUS));
    if (vPlus.isPresent() && vMinus.isPresent()) {
      double high = vPlus.getAsDouble() - p.headroomHigh();
      double low = vMinus.getAsDouble() + p.headroomLow();
      if (high < low) {
        double mid = (vPlus.getAsDouble() + vMinus.getAsDouble()) / 2;
        w.line("* limits collapse to mid-supply");
        w.line("Vs" + k + " " + src + " 0 DC " + num(mid));
        return;
      }
      switch (s.mode()) {
        case STUCK_HIGH -> w.line("Vs" + k + " " + src + " 0 DC " + num(high));
        case STUCK_LOW -> w.line("Vs" + k + " " + src + " 0 DC " + num(low));
        default -> {
          w.line("Voff" + k + " s" + k + "p " + inPlus + " DC " + num(p.offset()));
          w.line("A" + k + " %vd(s" + k + "p " + inMinus + ") " + src + " lim" + k);
          w.line(
              ".model lim"
                  + k
                  + " limit(gain="
                  + num(p.gain())
                  + " out_lower_limit="
                  + num(low)
                  + " out_upper_limit="
                  + num(high)
                  + " limit_range="
                  + num(limitRange)
                  + ")");
        }
      }
      return;
    }
    // Limits that follow solved supply-pin voltages: lo = v(v-) + hL, hi = v(v+) - hH, both at
    // mid-supply when that interval is empty (the solver's rule), as behavioural sources.
    w.line("* supply pins on solved nets: limits follow them");
    String lo = "s" + k + "l";
    String hi = "s" + k + "h";
    String vp = "v(" + w.node(s.node(Terminal.V_PLUS)) + ")";
    String vm = "v(" + w.node(s.node(Terminal.V_MINUS)) + ")";
    String empty =
        "(" + vp + "-" + num(p.headroomHigh()) + " < " + vm + "+" + num(p.headroomLow()) + ")";
    String mid = "(" + vp + "+" + vm + ")/2";
    w.line(
        "Blo"
            + k
            + " "
            + lo
            + " 0 V = "
            + empty
            + " ? "
            + mid
            + " : "
            + vm
            + "+"
            + num(p.headroomLow()));
    w.line(
        "Bhi"
            + k
            + " "
            + hi
            + " 0 V = "
            + empty
            + " ? "
            + mid
            + " : "
            + vp
            + "-"
            + num(p.headroomHigh()));
    switch (s.mode()) {
      case STUCK_HIGH -> w.line("Vs" + k + " " + src + " " + hi + " DC 0");
      case STUCK_LOW -> w.line("Vs" + k + " " + src + " " + lo + " DC 0");
      default -> {
        String d = "s" + k + "d";
        w.line("Voff" + k + " s" + k + "p " + inPlus + " DC " + num(p.offset()));
        w.line("Ed" + k + " " + d + " 0 s" + k + "p " + inMinus + " " + num(p.gain()));
        // y = lo + max(d - lo, 0) = max(d, lo); out = hi - max(hi - y, 0) = min(y, hi).
        w.line("Aa" + k + " %vd(" + d + " " + lo + ") s" + k + "x pos" + k);
        w.line("Ey" + k + " s" + k + "y " + lo + " s" + k + "x 0 1");
        w.line("Ab" + k + " %vd(" + hi + " s" + k + "y) s" + k + "z pos" + k);
        w.line("Eo" + k + " " + src + " " + hi + " 0 s" + k + "z 1");
        w.line(
            ".model pos"
                + k
                + " limit(gain=1 out_lower_limit=0 out_upper_limit=1e6 limit_range="
                + num(limitRange)
                + ")");
      }
    }
  }

  /**
   * Returns the DC voltage of a node when it is known before solving: a driven node, or a node
   * whose only DC connections are resistors to one and the same driven node (a floating pin tied to
   * a rail), since supply pins draw no current in the model.
   */
  static OptionalDouble knownVolts(FlatCircuit flat, String node) {
    if (flat.isDriven(node)) {
      return OptionalDouble.of(flat.drivenVolts(node));
    }
    String target = null;
    for (Branch branch : flat.branches) {
      if (branch.kind() != PartKind.RESISTOR
          || !(branch.a().equals(node) || branch.b().equals(node))) {
        continue;
      }
      String other = branch.a().equals(node) ? branch.b() : branch.a();
      if (!flat.isDriven(other) || (target != null && !target.equals(other))) {
        return OptionalDouble.empty();
      }
      target = other;
    }
    for (Section s : flat.sections) {
      boolean loads =
          (s.mode() != Mode.DEAD && s.node(Terminal.OUT).equals(node))
              || (s.node(Terminal.IN_PLUS).equals(node) && s.params().biasPlus() != 0)
              || (s.node(Terminal.IN_MINUS).equals(node) && s.params().biasMinus() != 0);
      if (loads) {
        return OptionalDouble.empty();
      }
    }
    return target == null ? OptionalDouble.empty() : OptionalDouble.of(flat.drivenVolts(target));
  }

  /** Formats a number for SPICE: plain exponent notation, never the default locale. */
  static String num(double value) {
    return String.format(Locale.ROOT, "%.15e", value);
  }

  private static String oneLine(String text) {
    return text.replaceAll("[\\r\\n]+", " ");
  }

  private static final class Writer {
    final StringBuilder text = new StringBuilder();
    final Map<String, String> names;

    Writer(Map<String, String> names) {
      this.names = names;
    }

    String node(String node) {
      String name = names.get(node);
      if (name == null) {
        throw new IllegalArgumentException("node " + node + " is not in the circuit");
      }
      return name;
    }

    void line(String line) {
      text.append(line).append('\n');
    }
  }
}
