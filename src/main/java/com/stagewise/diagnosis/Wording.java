package com.stagewise.diagnosis;

/**
 * Fault ids and test points in a technician's words, for screens, reports and the texts of a
 * diagnosis. Files and {@code --json} keep the ids themselves (DESIGN.md, "Fault ids").
 */
public final class Wording {
  private Wording() {}

  /**
   * Returns a fault id in words: {@code R2:open} gives "R2 open", {@code U2A:stuck-high} gives "U2A
   * output stuck high", {@code U1.6-7:bridge} gives "Solder bridge U1 pins 6–7". An id of a kind
   * this version does not know is returned with its colon as a space.
   */
  public static String fault(String id) {
    if (id == null || id.isEmpty()) {
      return "";
    }
    if (id.equals("healthy")) {
      return "Nothing wrong (healthy stage)";
    }
    int colon = id.lastIndexOf(':');
    if (colon < 0) {
      return id;
    }
    String what = id.substring(0, colon);
    String kind = id.substring(colon + 1);
    return switch (kind) {
      case "open" -> what + " open";
      case "short" -> what + " shorted";
      case "high" -> what + " drifted high";
      case "low" ->
          what.matches("[A-Za-z]+\\d*[A-Za-z]*") && !what.matches("[RC]\\d+.*")
              ? "Rail " + what + " low"
              : what + " drifted low";
      case "stuck-high" -> what + " output stuck high";
      case "stuck-low" -> what + " output stuck low";
      case "dead" -> what + " output dead (not driving)";
      case "lifted" -> point(what) + " lifted (open joint)";
      case "bridge" -> "Solder bridge " + point(what).replace("pin ", "pins ").replace("-", "–");
      case "missing" -> "Rail " + what + " missing";
      case "leaky" -> what + " leaky";
      case "wiper-open" -> what + " wiper open";
      case "misset" -> what + " set wrong";
      default -> what + " " + kind.replace('-', ' ');
    };
  }

  /**
   * Returns a test point in words: {@code U1.8} gives "U1 pin 8", a net keeps its name. Pins are
   * named this one way in every sentence.
   */
  public static String point(String at) {
    int dot = at.lastIndexOf('.');
    if (dot > 0 && dot < at.length() - 1 && Character.isDigit(at.charAt(dot + 1))) {
      return at.substring(0, dot) + " pin " + at.substring(dot + 1);
    }
    return at;
  }
}
