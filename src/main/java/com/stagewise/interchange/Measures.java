package com.stagewise.interchange;

import com.stagewise.circuit.AcMeasure;
import java.util.Optional;

/**
 * Reads the {@code "measure"} of an AC amplitude ({@code "rms"}, {@code "peak"} or {@code "pp"}),
 * beside {@code "ac"} in a stage sheet's input or a reading.
 */
final class Measures {
  private static final String EXPECTED =
      AcMeasure.fileWords() + " (RMS as a meter's AC volts show it, peak, or peak to peak)";

  private Measures() {}

  /**
   * Returns the measure an object states for its {@code ac}, or empty when it states none.
   *
   * @throws com.stagewise.circuit.InvalidInputException if the measure is not one of the three
   *     words, or the object has a measure but no {@code ac}
   */
  static Optional<AcMeasure> optional(JsonField object) {
    Optional<JsonField> field = object.optional("measure");
    if (field.isEmpty()) {
      return Optional.empty();
    }
    if (object.optional("ac").isEmpty()) {
      throw field
          .get()
          .error(
              "\"measure\" says how an AC amplitude is stated (expected it only beside \"ac\";"
                  + " remove it here)");
    }
    if (!field.get().isText()) {
      throw field
          .get()
          .error("expected " + EXPECTED + ", found " + JsonField.describe(field.get().node()));
    }
    return Optional.of(field.get().word(AcMeasure::of, EXPECTED));
  }

  /** Returns the measure an input states for its {@code ac}, peak when it states none. */
  static AcMeasure of(JsonField object) {
    return optional(object).orElse(AcMeasure.PEAK);
  }
}
