package com.stagewise.diagnosis;

import com.stagewise.circuit.InvalidInputException;
import java.util.Objects;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * One fault hypothesis, identified by the fault-id grammar of the design notes.
 *
 * <p>Ids: {@code healthy}; {@code R2:open|short|high|low}; {@code U1A:stuck-high|stuck-low|dead};
 * {@code U1.3:lifted}; {@code U1.6-7:bridge}; {@code VCC:missing|low}; {@code D1:open|short|leaky};
 * {@code ZD1:high|low}; {@code RV1:wiper-open|open|misset}.
 *
 * @param kind the kind of fault
 * @param subject the designator, section, package, or rail net the fault is on ("" when healthy)
 * @param pin the package pin for {@code lifted}, the lower pin for {@code bridge}; else 0
 * @param otherPin the higher pin of a bridge; else 0
 */
public record Fault(FaultKind kind, String subject, int pin, int otherPin) {

  /** The hypothesis that nothing is wrong. */
  public static final Fault HEALTHY = new Fault(FaultKind.HEALTHY, "", 0, 0);

  private static final Pattern BRIDGE = Pattern.compile("(.+)\\.(\\d+)-(\\d+):bridge");
  private static final Pattern LIFTED = Pattern.compile("(.+)\\.(\\d+):lifted");

  /** Checks the fields; see the record description. */
  public Fault {
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(subject, "subject");
  }

  /** Returns a fault on a part, section or rail (not a pin). */
  public static Fault of(String subject, FaultKind kind) {
    return new Fault(kind, subject, 0, 0);
  }

  /** Returns an open joint at one package pin. */
  public static Fault lifted(String packageRef, int pin) {
    return new Fault(FaultKind.LIFTED, packageRef, pin, 0);
  }

  /** Returns a solder bridge between two pins of a package (in either order). */
  public static Fault bridge(String packageRef, int pinA, int pinB) {
    return new Fault(FaultKind.BRIDGE, packageRef, Math.min(pinA, pinB), Math.max(pinA, pinB));
  }

  /** Returns the fault id, e.g. {@code R2:open} or {@code U1.6-7:bridge}. */
  public String id() {
    return switch (kind) {
      case HEALTHY -> "healthy";
      case LIFTED -> subject + "." + pin + ":lifted";
      case BRIDGE -> subject + "." + pin + "-" + otherPin + ":bridge";
      default -> subject + ":" + kind.suffix();
    };
  }

  /**
   * Parses a fault id. Whether {@code X:low} is a drifted part or a low rail is decided by {@code
   * railNets}: the id names a rail when its subject is one of them.
   *
   * @throws InvalidInputException if the text does not follow the fault-id grammar
   */
  public static Fault parse(String id, java.util.Set<String> railNets) {
    if (id == null || id.isBlank()) {
      throw new InvalidInputException(
          "", "fault", "a fault id is required (e.g. R2:open, U1A:dead, healthy)");
    }
    String text = id.trim();
    if (text.equals("healthy")) {
      return HEALTHY;
    }
    Matcher bridge = BRIDGE.matcher(text);
    if (bridge.matches()) {
      return bridge(
          bridge.group(1), Integer.parseInt(bridge.group(2)), Integer.parseInt(bridge.group(3)));
    }
    Matcher lifted = LIFTED.matcher(text);
    if (lifted.matches()) {
      return lifted(lifted.group(1), Integer.parseInt(lifted.group(2)));
    }
    int colon = text.lastIndexOf(':');
    if (colon > 0) {
      String subject = text.substring(0, colon);
      String suffix = text.substring(colon + 1);
      boolean rail = railNets.contains(subject);
      switch (suffix) {
        case "open":
          return of(subject, FaultKind.OPEN);
        case "short":
          return of(subject, FaultKind.SHORT);
        case "high":
          return of(subject, FaultKind.HIGH);
        case "low":
          return of(subject, rail ? FaultKind.RAIL_LOW : FaultKind.LOW);
        case "stuck-high":
          return of(subject, FaultKind.STUCK_HIGH);
        case "stuck-low":
          return of(subject, FaultKind.STUCK_LOW);
        case "dead":
          return of(subject, FaultKind.DEAD);
        case "missing":
          return of(subject, FaultKind.RAIL_MISSING);
        case "leaky":
          return of(subject, FaultKind.LEAKY);
        case "wiper-open":
          return of(subject, FaultKind.WIPER_OPEN);
        case "misset":
          return of(subject, FaultKind.MISSET);
        default:
          break;
      }
    }
    throw new InvalidInputException(
        "",
        "fault",
        "\""
            + id
            + "\" is not a fault id (expected e.g. healthy, R2:open, R2:high, U1A:stuck-high,"
            + " U1A:dead, U1.3:lifted, U1.6-7:bridge, VCC:missing, VCC:low, D1:leaky, ZD1:high,"
            + " RV1:wiper-open, RV1:misset)");
  }

  @Override
  public String toString() {
    return id();
  }
}
