package com.stagewise.history.sqlite;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * A separate program that writes cases into a history file, for the tests that kill it or run two
 * of it at once. Each case is written in one transaction (an import of a small bundle) together
 * with {@value #READINGS} readings, a suspect list of {@value #SUSPECTS} suspects and {@value
 * #NOTES} notes; after each commit it prints {@code committed <case id>}.
 *
 * <p>Arguments: the database file, a label for the unit's serial, and how many cases to write (0:
 * until killed).
 */
public final class WriterProcess {
  static final int READINGS = 5;
  static final int SUSPECTS = 3;
  static final int NOTES = 2;

  private WriterProcess() {}

  public static void main(String[] args) {
    PrintStream out = new PrintStream(System.out, true, StandardCharsets.UTF_8);
    Path file = Path.of(args[0]);
    String label = args[1];
    int count = Integer.parseInt(args[2]);
    try (HistoryStore store = SqliteHistory.open(file)) {
      BoardModel model = store.units().boardModel("Writer test board", "");
      List<Unit> existing = store.units().bySerial(label);
      Unit unit = existing.isEmpty() ? store.units().add(label, model.id(), "") : existing.get(0);
      out.println("ready");
      for (int i = 0; count == 0 || i < count; i++) {
        HistoryBundle bundle = oneCase(unit.id(), label + " case " + i);
        store.transfer().importBundle(bundle, "writer");
        out.println("committed " + bundle.cases().get(0).id());
      }
    }
  }

  static HistoryBundle oneCase(String unitId, String symptom) {
    Instant now = Instant.now();
    String caseId = HistoryStore.newId();
    RepairCase repairCase =
        new RepairCase(caseId, unitId, now, symptom, CaseStatus.OPEN, null, null, List.of(), now);
    List<StoredReading> readings = new ArrayList<>();
    for (int r = 0; r < READINGS; r++) {
      readings.add(
          new StoredReading(
              HistoryStore.newId(),
              caseId,
              "U1." + (r + 1),
              ReadingKind.DC,
              r * 1.5,
              null,
              null,
              "",
              now));
    }
    List<StoredSuspect> suspects = new ArrayList<>();
    for (int s = 0; s < SUSPECTS; s++) {
      suspects.add(
          new StoredSuspect("R" + (s + 1) + ":open", 1.0 / SUSPECTS, List.of(), "test", s + 1));
    }
    List<CaseNote> notes = new ArrayList<>();
    for (int n = 0; n < NOTES; n++) {
      notes.add(
          new CaseNote(HistoryStore.newId(), caseId, now, "note " + n + " of " + symptom, now));
    }
    return new HistoryBundle(
        HistoryBundle.CURRENT_VERSION,
        now,
        "test",
        List.of(),
        List.of(),
        List.of(),
        List.of(repairCase),
        readings,
        List.of(
            new SuspectListRecord(
                HistoryStore.newId(), caseId, now, "test", "fault", suspects, "")),
        List.of(),
        notes);
  }
}
