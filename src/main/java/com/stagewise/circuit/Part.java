package com.stagewise.circuit;

import java.util.Objects;

/**
 * A resistor or capacitor between two nets.
 *
 * @param ref the designator, e.g. {@code R2}
 * @param kind resistor or capacitor
 * @param value ohms or farads, finite and not negative (0 Ω is a link)
 * @param tolerance the marked tolerance as a fraction (0.01 for 1 %), in [0, 1)
 * @param netA the first net
 * @param netB the second net
 */
public record Part(
    String ref, PartKind kind, double value, double tolerance, String netA, String netB) {

  /** Checks the fields; see the record description. */
  public Part {
    Objects.requireNonNull(kind, "kind");
    requireName(ref, "ref");
    requireName(netA, "nets[0]");
    requireName(netB, "nets[1]");
    if (!Double.isFinite(value) || value < 0) {
      throw new InvalidInputException(
          "", "value", ref + " value (" + value + ") must be a finite number, 0 or more");
    }
    if (!Double.isFinite(tolerance) || tolerance < 0 || tolerance >= 1) {
      throw new InvalidInputException(
          "", "tolerance", ref + " tolerance (" + tolerance + ") must be between 0 and 1");
    }
  }

  /** Returns a resistor with the given value in ohms. */
  public static Part resistor(String ref, double ohms, double tolerance, String netA, String netB) {
    return new Part(ref, PartKind.RESISTOR, ohms, tolerance, netA, netB);
  }

  /** Returns a capacitor with the given value in farads. */
  public static Part capacitor(
      String ref, double farads, double tolerance, String netA, String netB) {
    return new Part(ref, PartKind.CAPACITOR, farads, tolerance, netA, netB);
  }

  /** Returns a copy with another value (ohms or farads). */
  public Part withValue(double newValue) {
    return new Part(ref, kind, newValue, tolerance, netA, netB);
  }

  /** Returns a copy whose terminal on {@code oldNet} is moved to {@code newNet}. */
  public Part withNetRenamed(String oldNet, String newNet) {
    return new Part(
        ref,
        kind,
        value,
        tolerance,
        netA.equals(oldNet) ? newNet : netA,
        netB.equals(oldNet) ? newNet : netB);
  }

  /** Returns whether either terminal is on {@code net}. */
  public boolean touches(String net) {
    return netA.equals(net) || netB.equals(net);
  }

  static void requireName(String name, String field) {
    if (name == null || name.isBlank()) {
      throw new InvalidInputException("", field, "a name is required here");
    }
  }
}
