package com.stagewise.circuit;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * The op-amp packages Stagewise knows, with their industry-standard pinouts (top view, pins counted
 * counter-clockwise from pin 1).
 *
 * <p>Supply pins are shared by every section of a package. Adjacent pins (solder-bridge candidates)
 * are neighbours on the same side of the package only.
 */
public enum PackageType {
  /** One section: 1 offset, 2 in-, 3 in+, 4 v-, 5 offset, 6 out, 7 v+, 8 n/c. */
  SINGLE_8("single-8", 8, List.of("A")) {
    @Override
    int pinOf(int sectionIndex, Terminal terminal) {
      return switch (terminal) {
        case IN_MINUS -> 2;
        case IN_PLUS -> 3;
        case V_MINUS -> 4;
        case OUT -> 6;
        case V_PLUS -> 7;
      };
    }
  },
  /** Two sections: 1 outA, 2 in-A, 3 in+A, 4 v-, 5 in+B, 6 in-B, 7 outB, 8 v+. */
  DUAL_8("dual-8", 8, List.of("A", "B")) {
    @Override
    int pinOf(int sectionIndex, Terminal terminal) {
      return switch (terminal) {
        case V_MINUS -> 4;
        case V_PLUS -> 8;
        case OUT -> sectionIndex == 0 ? 1 : 7;
        case IN_MINUS -> sectionIndex == 0 ? 2 : 6;
        case IN_PLUS -> sectionIndex == 0 ? 3 : 5;
      };
    }
  },
  /**
   * Four sections (A–D are 1–4): 1 out1, 2 in-1, 3 in+1, 4 v+, 5 in+2, 6 in-2, 7 out2, 8 out3, 9
   * in-3, 10 in+3, 11 v-, 12 in+4, 13 in-4, 14 out4.
   */
  QUAD_14("quad-14", 14, List.of("A", "B", "C", "D")) {
    private final int[][] signalPins = {{1, 2, 3}, {7, 6, 5}, {8, 9, 10}, {14, 13, 12}};

    @Override
    int pinOf(int sectionIndex, Terminal terminal) {
      return switch (terminal) {
        case V_PLUS -> 4;
        case V_MINUS -> 11;
        case OUT -> signalPins[sectionIndex][0];
        case IN_MINUS -> signalPins[sectionIndex][1];
        case IN_PLUS -> signalPins[sectionIndex][2];
      };
    }
  };

  private final String word;
  private final int pinCount;
  private final List<String> sections;

  PackageType(String word, int pinCount, List<String> sections) {
    this.word = word;
    this.pinCount = pinCount;
    this.sections = sections;
  }

  abstract int pinOf(int sectionIndex, Terminal terminal);

  /** Returns the word used in stage sheets, e.g. {@code dual-8}. */
  public String word() {
    return word;
  }

  /** Returns the number of pins of the package. */
  public int pinCount() {
    return pinCount;
  }

  /** Returns the section letters of the package, e.g. {@code [A, B]}. */
  public List<String> sections() {
    return sections;
  }

  /** Returns whether the package has the section with this letter. */
  public boolean hasSection(String section) {
    return sections.contains(section);
  }

  /**
   * Returns the pin number of a section's terminal.
   *
   * @throws IllegalArgumentException if the package has no such section
   */
  public int pin(String section, Terminal terminal) {
    int index = sections.indexOf(section);
    if (index < 0) {
      throw new IllegalArgumentException(word + " has no section " + section);
    }
    return pinOf(index, terminal);
  }

  /** Returns what a pin is: one section's terminal, a shared supply pin, or nothing we model. */
  public Optional<PinRole> role(int pin) {
    for (String section : sections) {
      for (Terminal terminal : Terminal.values()) {
        if (pin(section, terminal) == pin) {
          return Optional.of(new PinRole(terminal.isSupply() ? "" : section, terminal));
        }
      }
    }
    return Optional.empty();
  }

  /** Returns every terminal pin of one section, supply pins included. */
  public Map<Terminal, Integer> pins(String section) {
    Map<Terminal, Integer> pins = new EnumMap<>(Terminal.class);
    for (Terminal terminal : Terminal.values()) {
      pins.put(terminal, pin(section, terminal));
    }
    return pins;
  }

  /**
   * Returns the pairs of adjacent pins on the same side, lower pin first (for 8 pins 1-2, 2-3, 3-4,
   * 5-6, 6-7, 7-8; for 14 pins 1-2 … 6-7 and 8-9 … 13-14).
   */
  public List<int[]> adjacentPairs() {
    List<int[]> pairs = new ArrayList<>();
    int perSide = pinCount / 2;
    for (int pin = 1; pin < pinCount; pin++) {
      if (pin != perSide) {
        pairs.add(new int[] {pin, pin + 1});
      }
    }
    return pairs;
  }

  /**
   * Returns the package type named by {@code word}, e.g. {@code quad-14}.
   *
   * @throws InvalidInputException if the word names no package type
   */
  public static PackageType of(String word) {
    for (PackageType type : values()) {
      if (type.word.equals(word == null ? "" : word.toLowerCase(Locale.ROOT))) {
        return type;
      }
    }
    throw new InvalidInputException(
        "",
        "packageType",
        "\"" + word + "\" is not a package type (expected single-8, dual-8 or quad-14)");
  }

  /**
   * What one package pin is.
   *
   * @param section the section letter, empty for a supply pin shared by all sections
   * @param terminal the terminal
   */
  public record PinRole(String section, Terminal terminal) {}
}
