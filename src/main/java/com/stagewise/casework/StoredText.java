package com.stagewise.casework;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import java.math.BigDecimal;
import java.math.MathContext;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * Turns readings and a diagnosis into the records the history keeps, with one wording for the meter
 * and the next probes, whichever front end took them. Numbers are written without the machine's
 * locale.
 */
final class StoredText {
  private StoredText() {}

  /**
   * Returns the readings as history records of a case, taken at {@code now} with the set's meter. A
   * reading with its own uncertainty keeps it (and no meter line); an AC reading without one was
   * taken with a scope (DESIGN.md, Readings); an ohms reading keeps its second point and the
   * meter's ohms accuracy, OL as {@link Double#POSITIVE_INFINITY}.
   */
  static List<StoredReading> readings(
      List<Reading> added, MeterSpec meter, String caseId, Instant now, Stage stage) {
    List<StoredReading> stored = new ArrayList<>();
    for (Reading r : added) {
      boolean ac = r.kind() == Reading.Kind.AC;
      Double uncertainty = r.uncertainty().isPresent() ? r.uncertainty().getAsDouble() : null;
      String meterLine =
          uncertainty != null
              ? ""
              : switch (r.kind()) {
                case AC -> scopeLine();
                case DC -> meterLine(meter);
                case OHMS -> ohmsLine(meter);
              };
      stored.add(
          new StoredReading(
              HistoryStore.newId(),
              caseId,
              r.at(),
              kind(r.kind()),
              r.value(),
              ac ? r.hz() : null,
              uncertainty,
              meterLine,
              now,
              r.to(),
              null,
              now,
              ac ? r.measureIn(stage).word() : null));
    }
    return stored;
  }

  /** Returns the suspect list of a diagnosis as the history keeps it, ranked from 1. */
  static SuspectListRecord suspectList(
      Diagnosis diagnosis, String caseId, Instant now, String version) {
    List<StoredSuspect> suspects = new ArrayList<>();
    for (int i = 0; i < diagnosis.suspects().size(); i++) {
      Suspect s = diagnosis.suspects().get(i);
      suspects.add(new StoredSuspect(s.fault(), s.probability(), s.group(), s.why(), i + 1));
    }
    List<String> probes = new ArrayList<>();
    for (ProbeAdvice probe : diagnosis.nextProbes()) {
      probes.add(probeLine(probe));
    }
    return new SuspectListRecord(
        HistoryStore.newId(),
        caseId,
        now,
        version,
        diagnosis.verdict().word(),
        suspects,
        String.join("\n", probes));
  }

  /** Returns a next probe as one line: {@code OUT ac 1000 Hz (0.61 bits): why}. */
  static String probeLine(ProbeAdvice probe) {
    StringBuilder line = new StringBuilder();
    line.append(probe.at()).append(' ').append(probe.kind().word());
    if (!probe.to().isEmpty()) {
      line.append(" to ").append(probe.to());
    }
    if (probe.kind() == Reading.Kind.AC) {
      // Peak, the version-1 measure, is left unsaid so that earlier lines keep their wording.
      if (probe.measure() != AcMeasure.PEAK) {
        line.append(' ').append(probe.measure().word());
      }
      line.append(' ').append(number(probe.hz())).append(" Hz");
    }
    line.append(" (")
        .append(new BigDecimal(probe.bits()).setScale(2, java.math.RoundingMode.HALF_EVEN))
        .append(" bits): ")
        .append(probe.why().replace('\n', ' '));
    return line.toString();
  }

  /** Returns the meter as one line: {@code 6000-count meter, ±(0.5 % + 2 counts)}. */
  static String meterLine(MeterSpec meter) {
    return meter.displayCounts()
        + "-count meter, ±("
        + number(meter.percent())
        + " % + "
        + meter.counts()
        + " counts)";
  }

  /** Returns the kind a reading is stored as. */
  static ReadingKind kind(Reading.Kind kind) {
    return switch (kind) {
      case DC -> ReadingKind.DC;
      case AC -> ReadingKind.AC;
      case OHMS -> ReadingKind.OHMS;
    };
  }

  /**
   * Returns the meter's resistance function as one line: {@code 6000-count meter, ohms ±(0.8 % + 3
   * counts)}.
   */
  static String ohmsLine(MeterSpec meter) {
    return meter.displayCounts()
        + "-count meter, ohms ±("
        + number(meter.ohms().percent())
        + " % + "
        + meter.ohms().counts()
        + " counts)";
  }

  /** Returns the scope's accuracy as one line: {@code scope, ±(3 % + 1 mV)}. */
  static String scopeLine() {
    return "scope, ±("
        + number(ReadingSet.SCOPE_PERCENT)
        + " % + "
        + number(ReadingSet.SCOPE_FLOOR_VOLTS * 1000)
        + " mV)";
  }

  /** Returns a number with at most six significant digits and no trailing zeros, as 1000 or 0.5. */
  static String number(double value) {
    return new BigDecimal(value).round(new MathContext(6)).stripTrailingZeros().toPlainString();
  }
}
