package com.stagewise.circuit.value;

import java.util.Optional;

/**
 * The SI prefixes that part values use, from femto to tera (SI Brochure, BIPM, 9th edition).
 *
 * <p>Printing uses the symbols below; reading also accepts {@code u} and the Greek small mu
 * (U+03BC) for micro, and {@code K} for kilo (IEC 60062 writes K in the RKM code).
 */
enum Prefix {
  FEMTO('f', -15),
  PICO('p', -12),
  NANO('n', -9),
  // U+00B5 MICRO SIGN: the character a keyboard and most fonts give for micro.
  MICRO('\u00b5', -6),
  MILLI('m', -3),
  NONE(' ', 0),
  KILO('k', 3),
  MEGA('M', 6),
  GIGA('G', 9),
  TERA('T', 12);

  /** The characters that name a prefix when reading, as a regular-expression character class. */
  static final String LETTERS = "fpnu\u00b5\u03bcmkKMGT";

  private final char symbol;
  private final int exponent;

  Prefix(char symbol, int exponent) {
    this.symbol = symbol;
    this.exponent = exponent;
  }

  /** Returns the printed symbol, or the empty string for {@link #NONE}. */
  String symbol() {
    return this == NONE ? "" : String.valueOf(symbol);
  }

  /** Returns the power of ten this prefix stands for. */
  int exponent() {
    return exponent;
  }

  /** Returns the prefix a letter names when reading, if any; case matters (m is milli, M mega). */
  static Optional<Prefix> ofLetter(char letter) {
    switch (letter) {
      case 'u':
      case '\u03bc':
        return Optional.of(MICRO);
      case 'K':
        return Optional.of(KILO);
      default:
        for (Prefix prefix : values()) {
          if (prefix != NONE && prefix.symbol == letter) {
            return Optional.of(prefix);
          }
        }
        return Optional.empty();
    }
  }

  /** Returns the prefix for a power of ten that is a multiple of 3 between -15 and 12. */
  static Prefix ofExponent(int exponent) {
    for (Prefix prefix : values()) {
      if (prefix.exponent == exponent) {
        return prefix;
      }
    }
    throw new IllegalArgumentException("no SI prefix for 10^" + exponent);
  }

  /** Returns the smallest power of ten that has a prefix here. */
  static int smallestExponent() {
    return FEMTO.exponent;
  }

  /** Returns the largest power of ten that has a prefix here. */
  static int largestExponent() {
    return TERA.exponent;
  }
}
