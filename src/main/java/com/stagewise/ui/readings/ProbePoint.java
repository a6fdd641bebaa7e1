package com.stagewise.ui.readings;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A place to put the meter probe: a package pin, a part lead or a net, with what it is in words.
 *
 * @param at the test point as the readings name it, {@code U1.8}, {@code D1.a} or {@code OUT}
 * @param kind DC level, AC amplitude, or ohms (power off, one of a pair of points)
 * @param hz the frequency of an AC reading, 0 for DC
 * @param packageRef the package of a pin, the part of a lead (empty for a net)
 * @param pin the pin number (0 for a lead or a net)
 * @param title what to probe, e.g. "U1 pin 8 — positive supply pin (VCC)"
 * @param why why this point now (may be empty)
 * @param measure how an AC reading here is stated (the stage's AC input's measure)
 */
public record ProbePoint(
    String at,
    Reading.Kind kind,
    double hz,
    String packageRef,
    int pin,
    String title,
    String why,
    AcMeasure measure) {

  /** Returns whether this is a package pin. */
  public boolean isPin() {
    return pin > 0;
  }

  /** Returns whether this is a part's lead ({@code R2.1}, {@code D1.a}, {@code RV1.w}). */
  public boolean isLead() {
    return pin == 0 && !packageRef.isEmpty();
  }

  /** Returns the point in a few words: "U1 pin 8", "D1 anode", "net OUT". */
  public String shortName() {
    if (isPin()) {
      return packageRef + " pin " + pin;
    }
    if (isLead()) {
      return packageRef + " " + leadWord(at.substring(packageRef.length() + 1));
    }
    return "net " + at;
  }

  /** Returns a copy with another reason. */
  public ProbePoint because(String reason) {
    return new ProbePoint(at, kind, hz, packageRef, pin, title, reason, measure);
  }

  /** Returns a copy whose AC reading is stated in another measure. */
  public ProbePoint withMeasure(AcMeasure other) {
    return new ProbePoint(at, kind, hz, packageRef, pin, title, why, other);
  }

  /** Returns the same point read another way: DC, or AC at {@code acHz}. */
  public ProbePoint readAs(Reading.Kind newKind, double acHz) {
    return new ProbePoint(
        at, newKind, newKind == Reading.Kind.AC ? acHz : 0, packageRef, pin, title, why, measure);
  }

  /**
   * Returns the short call shown large, e.g. "Probe U1 pin 8" or "Probe net OUT (AC volts RMS at 1
   * kHz)".
   */
  public String call() {
    return "Probe "
        + shortName()
        + (kind == Reading.Kind.AC
            ? " (AC volts " + measure.words() + " at " + Words.hertz(hz) + ")"
            : "");
  }

  /** Returns the DC probe point for a test point of the stage, if it names a used pin or a net. */
  public static Optional<ProbePoint> of(Stage stage, String at, Reading.Kind kind, double hz) {
    Map<String, String> pins = stage.pinNets();
    if (pins.containsKey(at)) {
      int dot = at.lastIndexOf('.');
      String pkg = at.substring(0, dot);
      int pin = Integer.parseInt(at.substring(dot + 1));
      return Optional.of(
          new ProbePoint(
              at,
              kind,
              hz,
              pkg,
              pin,
              pinTitle(stage, pkg, pin, pins.get(at)),
              "",
              Reading.acMeasure(stage)));
    }
    if (stage.nets().contains(at)) {
      return Optional.of(
          new ProbePoint(
              at, kind, hz, "", 0, netTitle(stage, at, pins), "", Reading.acMeasure(stage)));
    }
    int dot = at.lastIndexOf('.');
    if (dot > 0) {
      String ref = at.substring(0, dot);
      String lead = at.substring(dot + 1);
      Optional<Part> part = stage.part(ref);
      if (part.isPresent() && part.get().leadNet(lead) != null) {
        String title =
            ref
                + " "
                + leadWord(lead)
                + " ("
                + at
                + ") — on net "
                + part.get().leadNet(lead)
                + ", "
                + part.get().kind().name().toLowerCase(java.util.Locale.ROOT);
        return Optional.of(
            new ProbePoint(at, kind, hz, ref, 0, title, "", Reading.acMeasure(stage)));
      }
    }
    return Optional.empty();
  }

  /**
   * Returns the point to probe next: the first supply pin not yet read, then the diagnosis's best
   * probe, else null when there is nothing more worth probing.
   */
  static ProbePoint next(Stage stage, Diagnosis diagnosis, List<Reading> readings) {
    for (ProbePoint rail : rails(stage)) {
      if (readings.stream()
          .noneMatch(r -> r.at().equals(rail.at()) && r.kind() == Reading.Kind.DC)) {
        return rail;
      }
    }
    if (diagnosis == null || readings.isEmpty()) {
      return null;
    }
    for (ProbeAdvice advice : diagnosis.nextProbes()) {
      if (advice.kind() == Reading.Kind.OHMS) {
        // A power-off check has two points: the power-off mode offers it (PowerOffMode).
        continue;
      }
      Optional<ProbePoint> point = of(stage, advice.at(), advice.kind(), advice.hz());
      if (point.isPresent()) {
        return point.get().because(advice.why());
      }
    }
    return null;
  }

  /** Returns a lead's name in words: "anode", "cathode", "wiper", "end 1", "lead 2". */
  static String leadWord(String lead) {
    return switch (lead) {
      case "a" -> "anode";
      case "k" -> "cathode";
      case "w" -> "wiper";
      default -> "lead " + lead;
    };
  }

  /** Returns where a net can be found: "Net SUM — at R1, R2 and U1 pin 2". */
  private static String netTitle(Stage stage, String net, Map<String, String> pins) {
    List<String> places = new ArrayList<>();
    stage.parts().stream().filter(p -> p.touches(net)).forEach(p -> places.add(p.ref()));
    pins.forEach(
        (pin, n) -> {
          if (n.equals(net)) {
            places.add(Words.pin(pin));
          }
        });
    if (stage.rail(net).isPresent()) {
      places.add(0, "the supply rail");
    } else if (stage.input(net).isPresent()) {
      places.add(0, "the stage's input");
    }
    if (places.isEmpty()) {
      return "Net " + net;
    }
    String list =
        places.size() == 1
            ? places.get(0)
            : String.join(", ", places.subList(0, places.size() - 1))
                + " and "
                + places.get(places.size() - 1);
    return "Net " + net + " — at " + list;
  }

  private static String pinTitle(Stage stage, String pkg, int pin, String net) {
    PackageType type = stage.packageType(pkg).orElseThrow();
    String role =
        type.role(pin)
            .map(
                r ->
                    r.terminal().words()
                        + (r.section().isEmpty() || type.sections().size() == 1
                            ? ""
                            : " of section " + r.section()))
            .orElse("pin");
    return pkg + " pin " + pin + " — " + role + " (" + net + ")";
  }

  /**
   * Returns the supply pins of every package, positive first, as a technician checks them before
   * anything else: a missing rail explains everything downstream.
   */
  public static List<ProbePoint> rails(Stage stage) {
    List<ProbePoint> rails = new ArrayList<>();
    for (String pkg : stage.packages()) {
      Amplifier first = stage.sectionsOf(pkg).get(0);
      for (Terminal t : new Terminal[] {Terminal.V_PLUS, Terminal.V_MINUS}) {
        String at = first.pinName(t);
        of(stage, at, Reading.Kind.DC, 0)
            .map(
                p ->
                    p.because(
                        "Rails first: a missing or low supply explains everything downstream, so"
                            + " check "
                            + Words.pin(at)
                            + " before the signal pins."))
            .ifPresent(rails::add);
      }
    }
    return rails;
  }

  /**
   * Returns every test point of the stage: package pins first, then the nets (ground left out),
   * then every part's leads.
   */
  public static List<ProbePoint> all(Stage stage) {
    List<ProbePoint> points = new ArrayList<>();
    for (String at : stage.pinNets().keySet()) {
      of(stage, at, Reading.Kind.DC, 0).ifPresent(points::add);
    }
    for (String net : stage.nets()) {
      if (!net.equals(stage.ground())) {
        of(stage, net, Reading.Kind.DC, 0).ifPresent(points::add);
      }
    }
    for (Part part : stage.parts()) {
      for (String lead : part.leads()) {
        of(stage, part.ref() + "." + lead, Reading.Kind.DC, 0).ifPresent(points::add);
      }
    }
    return points;
  }

  /** Returns every point an ohmmeter's lead may touch: as {@link #all}, with ground. */
  public static List<ProbePoint> allForOhms(Stage stage) {
    List<ProbePoint> points = new ArrayList<>(all(stage));
    of(stage, stage.ground(), Reading.Kind.DC, 0).ifPresent(g -> points.add(0, g));
    return points;
  }
}
