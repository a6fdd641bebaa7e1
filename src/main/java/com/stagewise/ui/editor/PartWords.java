package com.stagewise.ui.editor;

import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.ZenerMarking;
import com.stagewise.ui.editor.DraftStage.DraftPart;

/**
 * A draft part as its row in the editor's list reads: the value in engineering units ("47 kΩ", "100
 * nF", not the "47K" typed on the pad), a zener's marking ("5V1"), a diode's class, an LED's
 * colour, a trimmer's value with its wiper; a text that is not a value yet is shown as typed (its
 * problem is listed under the row).
 */
final class PartWords {
  private PartWords() {}

  /** Returns the row's text: designator, value and nets ("?" for a lead not wired yet). */
  static String row(DraftPart p) {
    return p.ref()
        + "  "
        + value(p)
        + "  "
        + String.join(" – ", p.nets().stream().map(n -> n.isEmpty() ? "?" : n).toList());
  }

  /** Returns the part's value in words; see the class description. */
  static String value(DraftPart p) {
    return switch (p.kind()) {
      case DIODE -> (p.choice().isEmpty() ? "?" : p.choice()) + " diode";
      case LED -> (p.choice().isEmpty() ? "?" : p.choice()) + " LED";
      case ZENER -> {
        String problem = p.value().problem(ZenerMarking::parse);
        yield (problem == null
                ? ZenerMarking.format(p.value().value(ZenerMarking::parse))
                : typed(p.value()))
            + " zener";
      }
      case TRIMMER, POTENTIOMETER ->
          number(p.value(), p.kind().unit())
              + ", wiper at "
              + (p.position().text().isEmpty() ? "0.5" : p.position().text());
      default -> number(p.value(), p.kind().unit());
    };
  }

  private static String number(Entry entry, String unit) {
    if (entry.problem(SiValue::parse) != null) {
      return typed(entry);
    }
    return SiValue.format(entry.value(SiValue::parse), unit);
  }

  private static String typed(Entry entry) {
    return entry.text().isEmpty() ? "(no value)" : "\"" + entry.text() + "\"";
  }
}
