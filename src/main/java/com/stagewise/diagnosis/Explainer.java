package com.stagewise.diagnosis;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/** Puts a diagnosis into a technician's words: observations, whys and confirming checks. */
final class Explainer {
  private final Stage stage;
  private final TestPoints points;
  private final double span;
  private final Map<String, Integer> shopCounts;
  private final ConfirmingChecks checks;

  Explainer(Stage stage, TestPoints points, double span, Map<String, Integer> shopCounts) {
    this.stage = stage;
    this.points = points;
    this.span = span;
    this.shopCounts = shopCounts;
    this.checks = new ConfirmingChecks(stage);
  }

  /** Returns what the readings show, judged against the healthy stage's prediction. */
  List<Observation> observations(
      Diagnoser.Hypothesis healthy, List<Evidence.Bound> readings, ReadingSet set) {
    Prediction expected = healthy.predictions.get(0);
    List<Observation> out = new ArrayList<>();
    for (Evidence.Bound r : readings) {
      String net = points.netOf.get(r.point());
      if (r.ac()) {
        double mean = Evidence.mean(expected, r);
        if (mean > 0.01 && r.value() < 0.1 * mean) {
          out.add(
              new Observation(
                  r.at(),
                  String.format(
                      Locale.ROOT, "no AC signal where %s is expected", acVolts(r, mean))));
        } else if (Evidence.score(expected, r) > 4) {
          out.add(
              new Observation(
                  r.at(),
                  String.format(
                      Locale.ROOT,
                      "AC amplitude %s where %s is expected",
                      acVolts(r, r.value()),
                      acVolts(r, mean))));
        }
        continue;
      }
      Optional<Rail> rail = stage.rail(net);
      Amplifier output = null;
      for (Amplifier a : stage.amplifiers()) {
        if (a.out().equals(net)) {
          output = a;
          break;
        }
      }
      if (rail.isPresent()) {
        addIfAny(out, railObservation(rail.get(), r));
      } else if (output != null && !points.isPin(r.point())
          || output != null && isOutputPin(output, r.at())) {
        addIfAny(out, outputObservation(output, r, expected));
      } else if (Evidence.score(expected, r) > 4) {
        out.add(
            new Observation(
                r.at(),
                String.format(
                    Locale.ROOT,
                    "reads %s where %s is expected",
                    volts(r.value()),
                    volts(Evidence.mean(expected, r)))));
      }
    }
    out.addAll(inputPairs(readings, expected));
    return out;
  }

  private static void addIfAny(List<Observation> out, Optional<Observation> observation) {
    if (observation.isPresent()) {
      out.add(observation.get());
    }
  }

  private boolean isOutputPin(Amplifier amp, String at) {
    return at.equals(amp.pinName(Terminal.OUT));
  }

  private Optional<Observation> railObservation(Rail rail, Evidence.Bound r) {
    double nominal = rail.volts();
    if (Math.abs(r.value()) < 0.1 * Math.abs(nominal)) {
      return Optional.of(
          new Observation(
              r.at(),
              String.format(Locale.ROOT, "rail %s at %s: missing", rail.net(), volts(r.value()))));
    }
    double allowed = Math.abs(nominal) * rail.tolerance() + Math.sqrt(3 * r.variance());
    if (Math.abs(r.value() - nominal) > allowed) {
      String how = Math.abs(r.value()) < Math.abs(nominal) ? "low" : "high";
      return Optional.of(
          new Observation(
              r.at(),
              String.format(
                  Locale.ROOT,
                  "rail %s %s: %s where %s is expected",
                  rail.net(),
                  how,
                  volts(r.value()),
                  volts(nominal))));
    }
    return Optional.empty();
  }

  private Optional<Observation> outputObservation(
      Amplifier amp, Evidence.Bound r, Prediction expected) {
    double vPlus = stage.drivenVolts().getOrDefault(amp.vPlus(), Double.NaN);
    double vMinus = stage.drivenVolts().getOrDefault(amp.vMinus(), Double.NaN);
    double v = r.value();
    var type = amp.deviceClass();
    if (!Double.isNaN(vPlus)
        && Math.abs(v - vPlus) < 0.5 * type.headroomHigh().low() + 0.01
        && vPlus != 0) {
      return Optional.of(
          new Observation(r.at(), "output reads the v+ rail itself: shorted or bridged to it"));
    }
    if (!Double.isNaN(vMinus)
        && Math.abs(v - vMinus) < 0.5 * type.headroomLow().low() + 0.01
        && vMinus != 0) {
      return Optional.of(
          new Observation(r.at(), "output reads the v- rail itself: shorted or bridged to it"));
    }
    if (!Double.isNaN(vPlus) && v >= vPlus - type.headroomHigh().high() - 0.05 && v < vPlus) {
      return Optional.of(new Observation(r.at(), "output at the upper limit: saturated"));
    }
    if (!Double.isNaN(vMinus) && v <= vMinus + type.headroomLow().high() + 0.05 && v > vMinus) {
      return Optional.of(new Observation(r.at(), "output at the lower limit: saturated"));
    }
    if (Evidence.score(expected, r) > 4) {
      return Optional.of(
          new Observation(
              r.at(),
              String.format(
                  Locale.ROOT,
                  "output reads %s where %s is expected",
                  volts(v),
                  volts(Evidence.mean(expected, r)))));
    }
    return Optional.empty();
  }

  private List<Observation> inputPairs(List<Evidence.Bound> readings, Prediction expected) {
    List<Observation> out = new ArrayList<>();
    for (Amplifier amp : stage.amplifiers()) {
      Evidence.Bound plus = find(readings, amp, Terminal.IN_PLUS);
      Evidence.Bound minus = find(readings, amp, Terminal.IN_MINUS);
      if (plus == null || minus == null) {
        continue;
      }
      double expectedGap =
          Math.abs(expected.dcMean()[plus.point()] - expected.dcMean()[minus.point()]);
      double gap = Math.abs(plus.value() - minus.value());
      String where = amp.ref() + " inputs";
      if (expectedGap < 0.01 && gap > 0.05) {
        out.add(
            new Observation(
                where,
                String.format(
                    Locale.ROOT,
                    "inputs of %s differ by %s: feedback lost",
                    amp.ref(),
                    volts(gap))));
      } else if (expectedGap < 0.01 && gap <= 0.01) {
        out.add(
            new Observation(
                where,
                String.format(
                    Locale.ROOT,
                    "inputs of %s within %s of each other: feedback holds",
                    amp.ref(),
                    volts(Math.max(gap, 1e-3)))));
      }
    }
    return out;
  }

  private Evidence.Bound find(List<Evidence.Bound> readings, Amplifier amp, Terminal terminal) {
    for (Evidence.Bound r : readings) {
      if (!r.ac()
          && (r.at().equals(amp.pinName(terminal))
              || r.at().equals(amp.net(terminal)) && !points.isPin(r.point()))) {
        return r;
      }
    }
    return null;
  }

  /** Returns the why of a suspect: what it is, which readings it explains and which it does not. */
  String why(Fault fault, Prediction best, OptionalDouble estimate, List<Evidence.Bound> readings) {
    StringBuilder text = new StringBuilder(describe(fault, estimate));
    if (!best.label().isEmpty()) {
      text.append(" (").append(best.label()).append(')');
    }
    text.append('.');
    List<Evidence.Bound> explains = new ArrayList<>();
    List<Evidence.Bound> misses = new ArrayList<>();
    for (Evidence.Bound r : readings) {
      (Evidence.score(best, r) <= 3 ? explains : misses).add(r);
    }
    // Only the readings listed are written out (formatting numbers is most of a re-rank's texts).
    if (!explains.isEmpty()) {
      text.append(" Explains ").append(String.join("; ", limit(explains, best))).append('.');
    }
    if (!misses.isEmpty()) {
      text.append(" Does not explain ").append(String.join("; ", limit(misses, best))).append('.');
    }
    Integer seen = shopCounts.get(fault.id());
    if (seen != null && seen > 0) {
      text.append(" Seen ")
          .append(seen)
          .append(seen == 1 ? " time" : " times")
          .append(" on this board model.");
    }
    return text.toString();
  }

  /**
   * Returns the sentence that names the suspects reading the same as this one at every point,
   * powered or not (see {@link SameReadings}), with a leading space; empty when there are none.
   */
  static String sameReadings(List<String> same) {
    if (same.isEmpty()) {
      return "";
    }
    List<String> words = new ArrayList<>();
    for (String id : same) {
      String w = id.equals(Fault.HEALTHY.id()) ? "a working stage" : Wording.fault(id);
      // "Solder bridge …", "Rail … missing" mid-sentence; a part's name keeps its capital.
      boolean word = w.length() > 1 && Character.isLowerCase(w.charAt(1));
      words.add(word ? Character.toLowerCase(w.charAt(0)) + w.substring(1) : w);
    }
    return " Same readings as "
        + String.join(", ", words)
        + " at every point, powered or not; only a look or lifting a leg splits them.";
  }

  /**
   * A test point for a technician: a pin with what it is ("U1 pin 8 (positive supply pin)"), or a
   * net.
   */
  private String pointWords(Evidence.Bound r) {
    if (!points.isPin(r.point())) {
      return r.at();
    }
    int dot = r.at().lastIndexOf('.');
    String role = pinRole(r.at().substring(0, dot), Integer.parseInt(r.at().substring(dot + 1)));
    return Wording.point(r.at()) + " (" + role + ")";
  }

  /** Returns the readings in words, the first five and a count of the rest when over six. */
  private List<String> limit(List<Evidence.Bound> items, Prediction best) {
    int shown = items.size() <= 6 ? items.size() : 5;
    List<String> out = new ArrayList<>(shown + 1);
    for (Evidence.Bound r : items.subList(0, shown)) {
      out.add(reads(r, best));
    }
    if (shown < items.size()) {
      out.add("and " + (items.size() - 5) + " more");
    }
    return out;
  }

  /** Returns one reading beside what a suspect's prediction gives there, in words. */
  private String reads(Evidence.Bound r, Prediction best) {
    return String.format(
            Locale.ROOT,
            "%s %s at %s, where this fault gives %s",
            r.ac() ? "AC" : "",
            acVolts(r, r.value()),
            pointWords(r),
            acVolts(r, Evidence.mean(best, r)))
        .trim();
  }

  /** Returns the fault in plain words, e.g. "R7 drifted high: reads as about 180k, marked 47k". */
  String describe(Fault fault, OptionalDouble estimate) {
    String s = fault.subject();
    return switch (fault.kind()) {
      case HEALTHY -> "No fault: the readings fit a working stage";
      case OPEN ->
          partKind(s).isTrimmer()
              ? s + "'s track open between its ends (marked " + marked(s) + ")"
              : s + " open (marked " + marked(s) + ")";
      case SHORT -> s + " shorted (marked " + marked(s) + ")";
      case HIGH, LOW -> {
        String way = fault.kind() == FaultKind.HIGH ? "high" : "low";
        yield estimate.isPresent()
            ? s
                + " drifted "
                + way
                + ": reads as about "
                + value(s, estimate.getAsDouble())
                + ", marked "
                + marked(s)
            : s + " drifted " + way + " (marked " + marked(s) + ")";
      }
      case STUCK_HIGH -> s + " output stuck at its upper limit";
      case STUCK_LOW -> s + " output stuck at its lower limit";
      case DEAD -> s + " output dead: it no longer drives";
      case LIFTED ->
          "open joint at pin " + fault.pin() + " of " + s + " (" + pinRole(s, fault.pin()) + ")";
      case BRIDGE -> bridgeWords(fault);
      case RAIL_MISSING -> "rail " + s + " missing at the stage";
      case RAIL_LOW ->
          estimate.isPresent()
              ? String.format(
                  Locale.ROOT,
                  "rail %s low: about %s where %s is expected",
                  s,
                  volts(estimate.getAsDouble()),
                  volts(railVolts(s)))
              : "rail " + s + " low";
      case LEAKY ->
          s
              + " leaky: passes reverse current"
              + (estimate.isPresent()
                  ? ", as if about " + Units.format(estimate.getAsDouble(), "Ω") + " sat across it"
                  : "")
              + " ("
              + marked(s)
              + ")";
      case WIPER_OPEN -> s + "'s wiper no longer touches its track (" + marked(s) + ")";
      case MISSET ->
          estimate.isPresent()
              ? String.format(
                  Locale.ROOT,
                  "%s misset: set at about %.2f of its travel, where the sheet says %.2f",
                  s,
                  estimate.getAsDouble(),
                  position(s))
              : s + " misset (" + marked(s) + ")";
    };
  }

  private String bridgeWords(Fault fault) {
    String pkg = fault.subject();
    Map<String, String> pins = stage.pinNets();
    String netA = pins.get(pkg + "." + fault.pin());
    String netB = pins.get(pkg + "." + fault.otherPin());
    String text =
        "solder bridge between pins "
            + fault.pin()
            + " and "
            + fault.otherPin()
            + " of "
            + pkg
            + " ("
            + pinRole(pkg, fault.pin())
            + " to "
            + pinRole(pkg, fault.otherPin())
            + ", nets "
            + netA
            + " and "
            + netB
            + ")";
    boolean railA = stage.rail(netA).isPresent();
    boolean railB = stage.rail(netB).isPresent();
    if (railA || railB) {
      String rail = railA ? netA : netB;
      String other = railA ? netB : netA;
      boolean stiff = stage.isDriven(other);
      text +=
          stiff
              ? "; it shorts rail "
                  + rail
                  + " to "
                  + other
                  + ": expect a blown fuse, a hot regulator or a supply in current limit"
              : "; it ties "
                  + other
                  + " to rail "
                  + rail
                  + ": a section output there fights the rail and runs hot";
    }
    return text;
  }

  private String pinRole(String pkg, int pin) {
    PackageType type = stage.packageType(pkg).orElse(null);
    if (type == null) {
      return "pin " + pin;
    }
    var role = type.role(pin).orElse(null);
    if (role == null) {
      return "pin " + pin;
    }
    return role.terminal().words()
        + (role.section().isEmpty() || type.sections().size() == 1 ? "" : " " + role.section());
  }

  /** A rail's volts on the sheet, 0 for a net no rail drives. */
  private double railVolts(String net) {
    Rail rail = stage.rail(net).orElse(null);
    return rail == null ? 0.0 : rail.volts();
  }

  /** A trimmer's wiper position on the sheet, NaN for a part the stage lacks. */
  private double position(String ref) {
    Part part = stage.part(ref).orElse(null);
    return part == null ? Double.NaN : part.position();
  }

  private String marked(String ref) {
    return checks.marked(ref);
  }

  private String value(String ref, double value) {
    return checks.value(ref, value);
  }

  private PartKind partKind(String ref) {
    return checks.partKind(ref);
  }

  /** Returns how to confirm a fault at the bench, with the power off where ohms are read. */
  String confirmingCheck(Fault fault, OptionalDouble estimate) {
    return checks.of(fault, estimate);
  }

  /**
   * Returns volts as the reading states them: DC as they are, an AC peak in the reading's measure
   * with the measure named unless it is peak (the plain "AC amplitude" of version 1).
   */
  static String acVolts(Evidence.Bound r, double volts) {
    String text = volts(r.stated(volts));
    return r.ac() && r.measure() != AcMeasure.PEAK ? text + " " + r.measure().words() : text;
  }

  private static String volts(double v) {
    return Units.volts(v);
  }
}
