package com.stagewise.ui.editor;

import com.stagewise.circuit.InvalidInputException;
import java.util.function.ToDoubleFunction;

/**
 * A number as the technician entered it: the text kept exactly as typed (so that nothing entered is
 * lost, even when it is not a number yet), and the exact value when it came from a stage rather
 * than from typing (so that a stage opened and saved unchanged keeps every digit).
 *
 * @param text the text shown and edited, e.g. {@code 4k7}
 * @param exact the value the text stands for when it came from a stage; NaN when the text must be
 *     read
 */
public record Entry(String text, double exact) {

  /** Keeps the text; see the record description. */
  public Entry {
    text = text == null ? "" : text;
  }

  /** Returns an entry typed by the technician. */
  public static Entry typed(String text) {
    return new Entry(text == null ? "" : text.strip(), Double.NaN);
  }

  /** Returns an entry for a value taken from a stage, shown as {@code text}. */
  public static Entry of(double value, String text) {
    return new Entry(text, value);
  }

  /**
   * Returns the value: the exact one if the entry came from a stage, else the text read by {@code
   * reader}.
   *
   * @throws InvalidInputException from the reader when the text is not a value
   */
  public double value(ToDoubleFunction<String> reader) {
    return Double.isNaN(exact) ? reader.applyAsDouble(text) : exact;
  }

  /** Returns the problem with the text in plain words, or null when the reader accepts it. */
  public String problem(ToDoubleFunction<String> reader) {
    try {
      double value = value(reader);
      return Double.isFinite(value) ? null : "\"" + text + "\" is not a finite number";
    } catch (InvalidInputException e) {
      return e.getMessage();
    }
  }
}
