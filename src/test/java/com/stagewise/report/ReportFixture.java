package com.stagewise.report;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.SteppingClock;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Builds a history with one invented case through the history API (for the report tests only): the
 * readings of an inverting stage whose feedback resistor is open, a suspect list as the diagnosis
 * would store it, an action, notes with characters the standard fonts lack, and a close-out.
 */
final class ReportFixture {
  static final Instant GENERATED = Instant.parse("2026-03-04T05:06:00Z");
  static final String SERIAL = "NF8-21037";
  static final String SYMPTOM =
      "Channel 2 output stuck near −13 V after a power surge; 10 kΩ input path looks fine";
  static final String FIRST_SUSPECT = "R2:open";
  static final String NOTE =
      "Discharged the 4700 µF reservoir capacitors (“about 35 V”) before ohms checks → 0.2 V. Label in Japanese: 日本. 🔌";

  private ReportFixture() {}

  /** A clock that moves on one minute each time it is read, from 1 March 2026, 09:00 UTC. */
  static SteppingClock steppingClock() {
    return new SteppingClock(Instant.parse("2026-03-01T09:00:00Z"), Duration.ofMinutes(1));
  }

  /**
   * Stores the case with {@code readings} readings at test points TP-001, TP-002, … and returns its
   * id.
   */
  static String storeCase(HistoryStore store, Clock clock, int readings) {
    BoardModel model =
        store
            .units()
            .boardModel("Northfield MX-8 channel board", "Northfield Audio (invented maker)");
    Unit unit = store.units().add(SERIAL, model.id(), "job 1184 — Riverside Hall");
    RepairCase opened = store.cases().open(unit.id(), SYMPTOM);
    String id = opened.id();
    List<StoredReading> stored = new ArrayList<>();
    for (int i = 1; i <= readings; i++) {
      boolean ac = i % 10 == 0;
      stored.add(
          new StoredReading(
              HistoryStore.newId(),
              id,
              String.format(Locale.ROOT, "TP-%03d", i),
              ac ? ReadingKind.AC : ReadingKind.DC,
              -13.48 + i / 100.0,
              ac ? 1000.0 : null,
              ac ? 0.003 : null,
              i % 2 == 0 ? "6000-count handheld, ±(0.5 % + 2 counts)" : "scope, ±(3 % + 1 mV)",
              clock.instant()));
    }
    SuspectListRecord suspects =
        new SuspectListRecord(
            HistoryStore.newId(),
            id,
            clock.instant(),
            "0.1.0",
            "fault",
            List.of(
                new StoredSuspect(
                    FIRST_SUSPECT,
                    0.781,
                    List.of("R2:open", "R2:high"),
                    "R2 open (marked 47 kΩ). Explains −13.48 V at U1.1 (this fault gives −13.50 V).",
                    1),
                new StoredSuspect(
                    "R2:high",
                    0.138,
                    List.of("R2:open", "R2:high"),
                    "R2 drifted high: reads as about 14 MΩ.",
                    2),
                new StoredSuspect(
                    "U1A:stuck-low",
                    0.081,
                    List.of("U1A:stuck-low"),
                    "Output stuck at its lower limit.",
                    3)),
            "SUM dc (0.37 bits): confirms the first suspect");
    store.cases().addReadings(id, stored, suspects);
    store
        .cases()
        .addAction(
            id,
            ActionKind.PART_REPLACED,
            "R2",
            "47k 1% (cracked)",
            "47k 1% metal film",
            "Hairline crack across the body.");
    store.cases().addAction(id, ActionKind.REFLOW, "U1", "", "", "Reflowed pins 1–4.");
    store.cases().addNote(id, NOTE);
    store.cases().close(id, Outcome.FIXED, List.of(FIRST_SUSPECT));
    return id;
  }

  /** Opens a new history in {@code folder}, stores the case and returns its report. */
  static CaseReport report(Path folder, int readings) {
    SteppingClock clock = steppingClock();
    try (HistoryStore store = SqliteHistory.open(folder.resolve("history.db"), clock)) {
      String id = storeCase(store, clock, readings);
      return CaseReport.read(store, id, GENERATED, "test build");
    }
  }

  /** Returns the report as PDF bytes. */
  static byte[] pdf(CaseReport report) throws IOException {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    PdfReport.write(report, bytes);
    return bytes.toByteArray();
  }
}
