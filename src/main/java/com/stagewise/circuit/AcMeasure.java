package com.stagewise.circuit;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/**
 * How an AC amplitude is stated: the peak of the sine, its RMS value (what a meter's AC volts range
 * shows for a sine) or its peak-to-peak swing (what a scope's cursors give).
 *
 * <p>For a sine of peak {@code A}: RMS is {@code A/√2} (textbook fact: the mean of {@code sin²}
 * over a period is 1/2, so the root of the mean square is {@code A·√(1/2)}) and peak-to-peak is
 * {@code 2A} (the sine swings from {@code −A} to {@code +A}). Small-signal AC is a sine about the
 * DC point, so these hold exactly for the solver's answers. The solver works in peak; files and
 * screens use whichever measure the input or the reading names.
 */
public enum AcMeasure {
  /** The peak of the sine: the file default (stage sheet and readings contract, version 1). */
  PEAK("peak", 1.0, "peak"),
  /** The root-mean-square value of the sine, as a meter's AC volts range shows it. */
  RMS("rms", 1 / Math.sqrt(2), "RMS"),
  /** From the lowest to the highest point of the sine, as a scope's cursors give it. */
  PP("pp", 2.0, "peak-to-peak");

  private final String word;
  private final double perPeak;
  private final String words;

  AcMeasure(String word, double perPeak, String words) {
    this.word = word;
    this.perPeak = perPeak;
    this.words = words;
  }

  /** Returns the word used in files: {@code peak}, {@code rms} or {@code pp}. */
  public String word() {
    return word;
  }

  /** Returns the measure in words for people: {@code peak}, {@code RMS}, {@code peak-to-peak}. */
  public String words() {
    return words;
  }

  /** Returns the value in this measure of a sine of {@code peak} volts amplitude. */
  public double fromPeak(double peak) {
    return this == PEAK ? peak : peak * perPeak;
  }

  /** Returns the peak amplitude of a sine stated as {@code value} in this measure. */
  public double toPeak(double value) {
    return switch (this) {
      case PEAK -> value;
      case RMS -> value * Math.sqrt(2);
      case PP -> value / 2;
    };
  }

  /**
   * Returns the measure of a file's word ({@code rms}, {@code peak} or {@code pp}), if it is one.
   */
  public static Optional<AcMeasure> of(String word) {
    String w = word == null ? "" : word.strip().toLowerCase(Locale.ROOT);
    return Arrays.stream(values()).filter(m -> m.word.equals(w)).findFirst();
  }

  /** Returns the words a file may use, for messages: {@code "rms", "peak" or "pp"}. */
  public static String fileWords() {
    return "\"rms\", \"peak\" or \"pp\"";
  }
}
