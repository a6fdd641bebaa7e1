package com.stagewise.ui.closeout;

import com.stagewise.casework.AfterRepair;
import com.stagewise.circuit.Reading;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.ui.words.Words;
import java.util.Objects;

/**
 * One point of the check after the repair, as the close-out lists it.
 *
 * @param point where, in which kind, with its healthy band
 * @param title the point in words ("U1 pin 1", "U1 pin 1 (AC volts RMS at 1 kHz)", "R15 (power
 *     off)")
 * @param value what was read after the repair (volts, AC volts in the point's measure, or ohms with
 *     +∞ for OL), or null while not read
 * @param saved whether that value is stored in the history
 */
public record CheckRow(AfterRepair.CheckPoint point, String title, Double value, boolean saved) {
  /**
   * Returns a point in words: "U1 pin 1"; "U1 pin 1 (AC volts RMS at 1 kHz)"; for ohms the resistor
   * the two points are across, "R15 (power off)", else "U1 pin 2 to OUT (power off)".
   */
  static String title(AfterRepair.CheckPoint p) {
    return switch (p.kind()) {
      case DC -> Words.pin(p.at());
      case AC -> Words.pin(p.at()) + " (" + Words.acVolts(p.measure().word(), p.hz()) + ")";
      case OHMS ->
          (p.across().isEmpty() ? Words.pin(p.at()) + " to " + Words.pin(p.to()) : p.across())
              + " (power off)";
    };
  }

  /** Returns whether a stored reading was taken at this point, in its kind. */
  static boolean samePoint(AfterRepair.CheckPoint p, AfterRepairReading r) {
    return switch (p.kind()) {
      case DC -> r.kind() == com.stagewise.history.record.ReadingKind.DC && r.at().equals(p.at());
      case AC ->
          r.kind() == com.stagewise.history.record.ReadingKind.AC
              && r.at().equals(p.at())
              && Objects.equals(r.measure(), p.measure().word())
              && r.hz() != null
              && r.hz() == p.hz();
      case OHMS ->
          r.kind() == com.stagewise.history.record.ReadingKind.OHMS
              && (r.at().equals(p.at()) && r.to().equals(p.to())
                  || r.at().equals(p.to()) && r.to().equals(p.at()));
    };
  }

  /** Returns the band's ends in words: "0.71 V to 0.76 V", "46.5 kΩ to 47.5 kΩ", "OL". */
  public String bandWords() {
    if (!point.hasBand()) {
      return "no healthy band known here";
    }
    return point.kind() == Reading.Kind.OHMS
        ? Words.ohmsBand(point.low(), point.high())
        : Words.band(point.low(), point.high());
  }

  /** Returns the band in words: "healthy −4.76 V to −4.64 V", or that none is known. */
  public String band() {
    return point.hasBand() ? "healthy " + bandWords() : bandWords();
  }

  /**
   * Returns the point with its band, as listed: "U1 pin 1 (AC volts RMS at 1 kHz): 0.71 V to 0.76
   * V", "R15 (power off): 46.5 kΩ to 47.5 kΩ".
   */
  public String label() {
    return title + ": " + bandWords();
  }

  /** Returns the value read in words with its unit: "−4.710 V", "333.0 mV RMS", "46.8 kΩ", "OL". */
  public String valueText() {
    if (value == null) {
      return "";
    }
    return switch (point.kind()) {
      case DC -> Words.measured(value);
      case AC -> Words.measured(value) + " " + point.measure().words();
      case OHMS -> Words.ohms(value);
    };
  }

  /** Returns the verdict in plain words, or empty while not read. */
  public String verdict() {
    if (value == null) {
      return "";
    }
    if (!point.hasBand()) {
      return valueText() + ": no band to compare with";
    }
    if (point.inside(value)) {
      return valueText() + ": inside the healthy band";
    }
    boolean above = value > point.high();
    double by = above ? value - point.high() : point.low() - value;
    String amount =
        !Double.isFinite(by)
            ? ""
            : (point.kind() == Reading.Kind.OHMS ? Words.ohms(by) : Words.volts(by)) + " ";
    return valueText()
        + ": OUTSIDE the healthy band, "
        + amount
        + (above ? "above its top end" : "below its bottom end");
  }

  /**
   * Returns the point read outside its band as one sentence, the same for every kind: "U1 pin 1:
   * reads −13.48 V, expected −4.76 V to −4.64 V", "U1 pin 1 (AC volts RMS at 1 kHz): reads 470.0 mV
   * RMS, expected 325 mV to 339 mV", "R15 (power off): reads OL, expected 46.5 kΩ to 47.5 kΩ".
   */
  public String outsideSentence() {
    return title + ": reads " + valueText() + ", expected " + bandWords();
  }

  /** Returns whether it was read and lies outside a known band. */
  public boolean outside() {
    return value != null && point.hasBand() && !point.inside(value);
  }
}
