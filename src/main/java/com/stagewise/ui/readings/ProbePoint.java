package com.stagewise.ui.readings;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A place to put the meter probe: a package pin or a net, with what it is in words.
 *
 * @param at the test point as the readings name it, {@code U1.8} or {@code OUT}
 * @param kind DC level or AC amplitude
 * @param hz the frequency of an AC reading, 0 for DC
 * @param packageRef the package of a pin (empty for a net)
 * @param pin the pin number (0 for a net)
 * @param title what to probe, e.g. "U1 pin 8 — positive supply pin (VCC)"
 * @param why why this point now (may be empty)
 */
public record ProbePoint(
    String at, Reading.Kind kind, double hz, String packageRef, int pin, String title, String why) {

  /** Returns whether this is a package pin. */
  public boolean isPin() {
    return pin > 0;
  }

  /** Returns a copy with another reason. */
  public ProbePoint because(String reason) {
    return new ProbePoint(at, kind, hz, packageRef, pin, title, reason);
  }

  /** Returns the short call shown large, e.g. "Probe U1 pin 8" or "Probe net OUT (AC, 1 kHz)". */
  public String call() {
    String where = isPin() ? packageRef + " pin " + pin : "net " + at;
    return "Probe " + where + (kind == Reading.Kind.AC ? " (AC at " + Words.hertz(hz) + ")" : "");
  }

  /** Returns the DC probe point for a test point of the stage, if it names a used pin or a net. */
  public static Optional<ProbePoint> of(Stage stage, String at, Reading.Kind kind, double hz) {
    Map<String, String> pins = stage.pinNets();
    if (pins.containsKey(at)) {
      int dot = at.lastIndexOf('.');
      String pkg = at.substring(0, dot);
      int pin = Integer.parseInt(at.substring(dot + 1));
      return Optional.of(
          new ProbePoint(at, kind, hz, pkg, pin, pinTitle(stage, pkg, pin, pins.get(at)), ""));
    }
    if (stage.nets().contains(at)) {
      return Optional.of(new ProbePoint(at, kind, hz, "", 0, netTitle(stage, at, pins), ""));
    }
    return Optional.empty();
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
                        "Rails first: a missing or low supply explains everything downstream, so check "
                            + Words.pin(at)
                            + " before the signal pins."))
            .ifPresent(rails::add);
      }
    }
    return rails;
  }

  /** Returns every test point of the stage: package pins first, then the nets (ground left out). */
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
    return points;
  }
}
