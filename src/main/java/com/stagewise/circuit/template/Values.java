package com.stagewise.circuit.template;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.LedColour;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.ZenerMarking;
import java.util.HashMap;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;

/** The parameter values of one build of a template, checked and read with their defaults. */
final class Values {
  private final StageTemplate template;
  private final Map<String, String> given;

  Values(StageTemplate template, Map<String, String> values) {
    this.template = template;
    this.given = new HashMap<>(values);
    for (String name : values.keySet()) {
      if (template.parameters().stream().noneMatch(p -> p.name().equals(name))) {
        throw error(
            name,
            "unknown parameter \""
                + name
                + "\" (expected one of "
                + String.join(", ", template.parameters().stream().map(Parameter::name).toList())
                + ")");
      }
    }
  }

  /** Returns the title of the template being built. */
  String title() {
    return template.title();
  }

  String source() {
    return "template " + template.name();
  }

  InvalidInputException error(String parameter, String problem) {
    return new InvalidInputException(source(), parameter, problem);
  }

  /** Returns the text of a parameter: the given value, else its default. */
  String text(String name) {
    String value = given.get(name);
    if (value != null && !value.isBlank()) {
      return value.strip();
    }
    return template.parameters().stream()
        .filter(p -> p.name().equals(name))
        .findFirst()
        .orElseThrow(
            () ->
                new IllegalStateException(
                    "template " + template.name() + " has no parameter " + name))
        .defaultValue();
  }

  /** Returns a number in SI units, any sign. */
  double number(String name) {
    try {
      return SiValue.parse(text(name));
    } catch (InvalidInputException e) {
      throw error(name, e.getMessage());
    }
  }

  /** Returns a part value (ohms or farads), which must be above 0. */
  double positive(String name) {
    double value = number(name);
    if (!(value > 0)) {
      throw error(name, name + " (" + text(name) + ") must be above 0");
    }
    return value;
  }

  /** Returns a value of 0 or more (an AC amplitude, a frequency). */
  double nonNegative(String name) {
    double value = number(name);
    if (value < 0) {
      throw error(name, name + " (" + text(name) + ") must be 0 or more");
    }
    return value;
  }

  /** Returns an optional part value: empty for {@code none}. */
  OptionalDouble optionalPositive(String name) {
    if (text(name).toLowerCase(Locale.ROOT).equals("none")) {
      return OptionalDouble.empty();
    }
    return OptionalDouble.of(positive(name));
  }

  /** Returns a whole number between {@code min} and {@code max}. */
  int count(String name, int min, int max) {
    String text = text(name);
    try {
      int value = Integer.parseInt(text);
      if (value >= min && value <= max) {
        return value;
      }
    } catch (NumberFormatException e) {
      // Reported below with the expected range.
    }
    throw error(name, name + " (" + text + ") must be a whole number from " + min + " to " + max);
  }

  /** Returns a zener voltage from its marking ({@code 5V1}, {@code 12V}, {@code 3.3V}). */
  double zener(String name) {
    try {
      return ZenerMarking.parse(text(name));
    } catch (InvalidInputException e) {
      throw error(name, e.getMessage());
    }
  }

  /** Returns a trimmer position, from 0 to 1. */
  double fraction(String name) {
    double value = number(name);
    if (!(value >= 0 && value <= 1)) {
      throw error(name, name + " (" + text(name) + ") must be between 0 and 1");
    }
    return value;
  }

  DiodeClass diodeClass(String name) {
    try {
      DiodeClass c = DiodeClass.of(text(name));
      if (c != DiodeClass.LED) {
        return c;
      }
    } catch (InvalidInputException e) {
      // Reported below with the expected words.
    }
    throw error(name, "\"" + text(name) + "\" is not a diode class (expected silicon or schottky)");
  }

  LedColour ledColour(String name) {
    try {
      return LedColour.of(text(name));
    } catch (InvalidInputException e) {
      throw error(name, e.getMessage());
    }
  }

  DeviceClass deviceClass(String name) {
    try {
      return DeviceClass.of(text(name));
    } catch (InvalidInputException e) {
      throw error(
          name,
          "\""
              + text(name)
              + "\" is not a device class (expected classic-bipolar, ground-sensing or rail-to-rail)");
    }
  }

  PackageType packageType(String name) {
    try {
      return PackageType.of(text(name));
    } catch (InvalidInputException e) {
      throw error(
          name,
          "\"" + text(name) + "\" is not a package type (expected single-8, dual-8 or quad-14)");
    }
  }
}
