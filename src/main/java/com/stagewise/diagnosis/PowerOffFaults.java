package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.solver.OhmsPrediction;
import com.stagewise.solver.PowerOff;
import java.util.Map;
import java.util.Optional;

/**
 * What each fault does to a power-off (ohms) reading: the stage as the ohmmeter sees it under a
 * fault, and the reading it then gives.
 *
 * <p>An open part is gone (its leads still sit on their nets); a shorted part or capacitor is 0 Ω
 * (read as the solver's 1 mΩ floor); a drifted part has the value given; a lifted pin touches
 * nothing (op-amp pins draw nothing with the power off, so only readings at that pin change); a
 * solder bridge is a 0 Ω link between the two pins' nets, whatever drives them when powered. A
 * stuck or dead output and a missing or low rail leave the network as it is: the ohmmeter cannot
 * see them.
 *
 * <p>The newer parts: a leaky junction is its leak resistance (the value given) between anode and
 * cathode; a zener drifted high or low changes nothing (junctions do not conduct at the meter's
 * test voltage); a trimmer whose wiper is open is its whole track between the ends; a misset
 * trimmer has its wiper at the position given; an open track leaves the wiper on one end's side:
 * the second end's when the value given is 1, else the first end's (the diagnosis's open-track
 * scenarios carry no side, so its ohms prediction takes the first end: a known limit).
 */
public final class PowerOffFaults {
  private PowerOffFaults() {}

  /**
   * Returns the stage as the ohmmeter sees it under a fault.
   *
   * @param value the part's value for a drifted part ({@code high}/{@code low}), the leak ohms of a
   *     leaky junction, the wiper position of a misset trimmer, the end (0 or 1) an open track's
   *     wiper keeps; ignored otherwise
   * @throws IllegalArgumentException if the fault names nothing of the stage
   */
  public static Stage apply(Stage base, Fault fault, double value) {
    String s = fault.subject();
    return switch (fault.kind()) {
      case OPEN -> {
        Part p = part(base, s);
        if (!p.kind().isTrimmer()) {
          yield base.minusPart(s);
        }
        double[] track = p.trackOhms();
        yield value == 1
            ? base.withPart(Part.resistor(s, track[1], p.tolerance(), p.wiper(), p.netB()))
            : base.withPart(Part.resistor(s, track[0], p.tolerance(), p.netA(), p.wiper()));
      }
      case SHORT -> {
        Part p = part(base, s);
        yield base.withPart(new Part(s, PartKind.RESISTOR, 0, 0, p.netA(), p.netB()));
      }
      case HIGH, LOW -> {
        yield base.withPart(part(base, s).withValue(value));
      }
      case LEAKY -> {
        Part p = part(base, s);
        if (!(value > 0) || !Double.isFinite(value)) {
          throw new IllegalArgumentException(fault.id() + " needs its leak resistance");
        }
        yield base.plusPart(Part.resistor("~leak-" + s, value, 0, p.netA(), p.netB()));
      }
      case WIPER_OPEN -> {
        Part p = part(base, s);
        yield base.withPart(Part.resistor(s, p.value(), p.tolerance(), p.netA(), p.netB()));
      }
      case MISSET -> {
        Part p = part(base, s);
        if (!(value >= 0 && value <= 1)) {
          throw new IllegalArgumentException(fault.id() + " needs the wiper's position, 0 to 1");
        }
        yield base.withPart(p.withPosition(value));
      }
      case LIFTED -> lifted(base, s, fault.pin());
      case BRIDGE -> {
        Map<String, String> pins = base.pinNets();
        String a = pins.get(s + "." + fault.pin());
        String b = pins.get(s + "." + fault.otherPin());
        if (a == null || b == null) {
          throw new IllegalArgumentException(fault.id() + " names a pin the stage does not use");
        }
        yield base.plusPart(new Part("~bridge", PartKind.RESISTOR, 0, 0, a, b));
      }
      case HEALTHY, STUCK_HIGH, STUCK_LOW, DEAD, RAIL_MISSING, RAIL_LOW -> base;
    };
  }

  /**
   * Returns whether the network {@link #apply} gives for a fault depends on the value given: a
   * drifted part's value, a leaky junction's leak ohms, a misset trimmer's position, an open
   * track's end. A network kept for such a fault must be kept per value.
   */
  static boolean takesValue(FaultKind kind) {
    return switch (kind) {
      case HIGH, LOW, LEAKY, MISSET, OPEN -> true;
      default -> false;
    };
  }

  /**
   * Returns what the ohmmeter reads between two points under a fault.
   *
   * <p>Part leads are taken on the healthy stage (an open part's leads still touch their nets);
   * package pins on the faulted one (a lifted pin touches nothing).
   *
   * @param value the part's value for a drifted part; ignored otherwise
   * @throws IllegalArgumentException if a point names nothing of the stage
   */
  public static OhmsPrediction predict(Stage base, Fault fault, double value, String a, String b) {
    PowerOff healthy = PowerOff.of(base);
    return faulted(base, fault, value).predict(onFaulted(healthy, a), onFaulted(healthy, b));
  }

  /**
   * Returns the power-off network under a fault; ask it with points passed through {@link
   * #onFaulted(PowerOff, String)}.
   */
  public static PowerOff faulted(Stage base, Fault fault, double value) {
    return PowerOff.of(apply(base, fault, value));
  }

  /**
   * Returns the name under which a point is found on a faulted stage: a part lead becomes its net
   * (the part may be gone), a net or pin stays as it is.
   *
   * @param healthy the healthy stage's network
   * @throws IllegalArgumentException if the point names nothing of the stage
   */
  public static String onFaulted(PowerOff healthy, String point) {
    Optional<String> net = healthy.node(point);
    if (net.isEmpty()) {
      throw new IllegalArgumentException(
          "\"" + point + "\" is no net, package pin or part lead of the stage");
    }
    return healthy.isLead(point) ? net.get() : point;
  }

  private static Part part(Stage base, String ref) {
    Part part = base.part(ref).orElse(null);
    if (part == null) {
      throw new IllegalArgumentException("the stage has no part " + ref);
    }
    return part;
  }

  private static Stage lifted(Stage base, String pkg, int pin) {
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
    return stage;
  }
}
