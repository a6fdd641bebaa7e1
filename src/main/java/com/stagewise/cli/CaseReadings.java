package com.stagewise.cli;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ShopMemory;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Turns a readings file into what the history keeps: the readings as taken, and the suspect list
 * the diagnosis computes from them (with the shop's memory of the board model in its priors).
 */
final class CaseReadings {
  private CaseReadings() {}

  /** Returns the readings as history records of case {@code caseId}, taken at {@code now}. */
  static List<StoredReading> toStored(ReadingSet set, String caseId, Instant now) {
    List<StoredReading> stored = new ArrayList<>();
    for (Reading r : set.readings()) {
      boolean ac = r.kind() == Reading.Kind.AC;
      Double uncertainty = r.uncertainty().isPresent() ? r.uncertainty().getAsDouble() : null;
      String meter = uncertainty != null ? "" : ac ? scope() : meter(set.meter());
      stored.add(
          new StoredReading(
              HistoryStore.newId(),
              caseId,
              r.at(),
              ac ? ReadingKind.AC : ReadingKind.DC,
              r.value(),
              ac ? r.hz() : null,
              uncertainty,
              meter,
              now));
    }
    return stored;
  }

  /**
   * Returns the suspect list for the readings, computed now with the board model's confirmed fault
   * counts blended into the priors.
   */
  static SuspectListRecord diagnose(
      Stage stage,
      ReadingSet set,
      Map<String, Integer> shopCounts,
      int top,
      String caseId,
      Instant now,
      String version) {
    Diagnosis diagnosis = Diagnoser.of(stage, shopCounts).diagnose(set, top);
    List<StoredSuspect> suspects = new ArrayList<>();
    for (int i = 0; i < diagnosis.suspects().size(); i++) {
      Suspect s = diagnosis.suspects().get(i);
      suspects.add(new StoredSuspect(s.fault(), s.probability(), s.group(), s.why(), i + 1));
    }
    StringBuilder probes = new StringBuilder();
    for (ProbeAdvice probe : diagnosis.nextProbes()) {
      if (probes.length() > 0) {
        probes.append('\n');
      }
      probes.append(probe.at()).append(' ').append(probe.kind().word());
      if (probe.kind() == Reading.Kind.AC) {
        probes.append(String.format(Locale.ROOT, " %.6g Hz", probe.hz()));
      }
      probes
          .append(String.format(Locale.ROOT, " (%.2f bits): ", probe.bits()))
          .append(probe.why().replace('\n', ' '));
    }
    return new SuspectListRecord(
        HistoryStore.newId(),
        caseId,
        now,
        version,
        diagnosis.verdict().word(),
        suspects,
        probes.toString());
  }

  /** Returns one suspect as a line of text, with the shop's hint ("seen 3 times on this model"). */
  static String suspectLine(StoredSuspect s, Map<String, Integer> shopCounts) {
    String hint = ShopMemory.hint(s.fault(), shopCounts).map(h -> "  [" + h + "]").orElse("");
    String group =
        s.group().size() > 1
            ? "  (cannot yet be told from " + String.join(", ", others(s)) + ")"
            : "";
    return String.format(
        Locale.ROOT,
        "  %2d. %-18s %5.1f %%%s%s",
        s.rank(),
        s.fault(),
        100 * s.probability(),
        group,
        hint);
  }

  private static List<String> others(StoredSuspect s) {
    return s.group().stream().filter(f -> !f.equals(s.fault())).toList();
  }

  private static String meter(MeterSpec meter) {
    return String.format(
        Locale.ROOT,
        "%d-count meter, ±(%s %% + %d counts)",
        meter.displayCounts(),
        trim(meter.percent()),
        meter.counts());
  }

  private static String scope() {
    return String.format(
        Locale.ROOT,
        "scope, ±(%s %% + %s mV)",
        trim(ReadingSet.SCOPE_PERCENT),
        trim(ReadingSet.SCOPE_FLOOR_VOLTS * 1000));
  }

  private static String trim(double value) {
    return value == Math.rint(value) ? Long.toString((long) value) : Double.toString(value);
  }
}
