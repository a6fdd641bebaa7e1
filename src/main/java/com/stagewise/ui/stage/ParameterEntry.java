package com.stagewise.ui.stage;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.LedColour;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.template.Parameter;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.ZenerMarking;
import java.util.Arrays;
import java.util.List;
import javafx.beans.property.StringProperty;

/**
 * One parameter of the chosen template with the value typed for it.
 *
 * @param parameter the parameter
 * @param value the value text, as in stage sheets ({@code 4k7}); starts at the default
 */
public record ParameterEntry(Parameter parameter, StringProperty value) {
  /**
   * Returns the label shown beside the field in plain words, e.g. "Feedback resistor R2 (Ω)" or
   * "Test signal amplitude (V, 0 for none)"; the template's short names (r2, vac) stay in files.
   */
  public String label() {
    String words =
        switch (parameter.name()) {
          case "vin" -> "Test signal DC level";
          case "vac" -> "Test signal amplitude (peak; 0 for none)";
          case "hz" -> "Test signal frequency";
          case "vcc" -> "Positive rail VCC";
          case "vee" -> "Negative rail VEE";
          case "class" -> "Op-amp class";
          case "package" -> "Package of U1 (section A is used)";
          case "diode" -> "Diode class";
          case "colour" -> "LED colour";
          default ->
              Character.toUpperCase(parameter.meaning().charAt(0))
                  + parameter.meaning().substring(1);
        };
    return words + (parameter.unit().isEmpty() ? "" : " (" + parameter.unit() + ")");
  }

  /**
   * Returns the words the field takes, when it is a choice (op-amp class, package, diode class, LED
   * colour); else empty.
   */
  public List<String> choices() {
    return switch (parameter.name()) {
      case "class" -> Arrays.stream(DeviceClass.values()).map(DeviceClass::word).toList();
      case "package" -> Arrays.stream(PackageType.values()).map(PackageType::word).toList();
      case "diode" ->
          Arrays.stream(DiodeClass.values())
              .filter(c -> c != DiodeClass.LED)
              .map(DiodeClass::word)
              .toList();
      case "colour" -> Arrays.stream(LedColour.values()).map(LedColour::word).toList();
      default -> List.of();
    };
  }

  /** Whether the field takes a zener's marked voltage ({@code 5V1}). */
  private boolean isZenerMarking() {
    return parameter.meaning().startsWith("zener ");
  }

  /** Whether the field takes a trimmer's wiper position (0 to 1). */
  private boolean isPosition() {
    return parameter.meaning().contains("wiper position");
  }

  /**
   * Returns what is wrong with {@code text} for this field, in plain words, or the empty string
   * when it is a value the field takes (checked as the technician types).
   */
  public String problem(String text) {
    String typed = text == null ? "" : text.strip();
    if (!choices().isEmpty()) {
      return choices().contains(typed) ? "" : "Choose one of " + String.join(", ", choices());
    }
    if (typed.isEmpty()) {
      return "Type a value, e.g. " + parameter.defaultValue();
    }
    if (typed.equals("none") && parameter.meaning().contains("none")) {
      return "";
    }
    if (isZenerMarking()) {
      try {
        ZenerMarking.parse(typed);
        return "";
      } catch (InvalidInputException e) {
        return "Not a zener voltage: write its marking, e.g. 5V1, 12V or 3.3V";
      }
    }
    if (isPosition()) {
      try {
        double v = SiValue.parse(typed);
        return v >= 0 && v <= 1 ? "" : "A wiper position is from 0 (first end) to 1 (other end)";
      } catch (InvalidInputException e) {
        return "Not a position: write a share of the travel from 0 to 1, e.g. 0.5";
      }
    }
    try {
      double v = SiValue.parse(typed);
      if (!parameter.unit().equals("V") && v < 0) {
        return "A part value or frequency cannot be negative";
      }
      return "";
    } catch (InvalidInputException e) {
      return "Not a value: write it as 4k7, 100n, 15 or -15"
          + (parameter.meaning().contains("none") ? ", or none" : "");
    }
  }
}
