package com.stagewise.interchange.history;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import com.stagewise.history.sqlite.SqliteHistory;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.util.List;

/** What the history exchange tests share: a sheet, awkward texts, a filled history, a clock. */
final class HistoryFixtures {
  private HistoryFixtures() {}

  /** A sound stage sheet (a unity-gain buffer), with a character outside ASCII in its title. */
  static final String SHEET =
      "{\"format\": \"stagewise-stage\", \"version\": 1, \"title\": \"Buffer Ω\","
          + " \"rails\": [{\"net\": \"VCC\", \"volts\": 15}, {\"net\": \"VEE\", \"volts\": -15}],"
          + " \"inputs\": [{\"net\": \"IN\", \"dc\": 1}],"
          + " \"parts\": [{\"ref\": \"R1\", \"kind\": \"resistor\", \"value\": \"10k\","
          + " \"nets\": [\"OUT\", \"GND\"]}],"
          + " \"amplifiers\": [{\"ref\": \"U1A\", \"package\": \"U1\", \"packageType\": \"dual-8\","
          + " \"section\": \"A\", \"class\": \"classic-bipolar\", \"inPlus\": \"IN\","
          + " \"inMinus\": \"OUT\", \"out\": \"OUT\", \"vPlus\": \"VCC\", \"vMinus\": \"VEE\"}]}";

  /** Text that tends to break storage, escaping or search: quotes, SQL, unicode, line breaks. */
  static final String AWKWARD =
      "It's \"dead\"; '); DROP TABLE unit;-- 100 % \\ back\\slash\ttab\nnew line — Ω µ ü ß 中文 עברית"
          + " 🔧 e\u0301 (combining) \u200b zero-width";

  static final String AWKWARD_LINE = AWKWARD.replace('\n', ' ');
  static final String AWKWARD_SERIAL = "SN \"42\"; x'y' — Ω";

  /** Opens (or makes) a history file in a folder, on a clock. */
  static HistoryStore open(Path folder, String name, Clock clock) {
    return SqliteHistory.open(folder.resolve(name), clock);
  }

  /** Fills a history with two board models, three units, one closed and two open cases. */
  static void fill(HistoryStore store, Clock clock) {
    BoardModel mixer = store.units().boardModel("MX-8 main board", "Northfield Audio (invented)");
    store.library().add(mixer.id(), "Input buffer", SHEET);
    BoardModel psu = store.units().boardModel("PSU-30", "Harbour Instruments (invented)");
    Unit m1 = store.units().add("NF-8-0001", mixer.id(), "");
    Unit m2 = store.units().add("NF-8-0002", mixer.id(), "job 17");
    Unit p1 = store.units().add(AWKWARD_SERIAL, psu.id(), AWKWARD_LINE);
    RepairCase closed = store.cases().open(m1.id(), "Hum, left channel");
    store
        .cases()
        .addReadings(
            closed.id(),
            List.of(
                new StoredReading(
                    HistoryStore.newId(),
                    closed.id(),
                    "U1.1",
                    ReadingKind.DC,
                    13.41,
                    null,
                    null,
                    "6000-count",
                    clock.instant()),
                new StoredReading(
                    HistoryStore.newId(),
                    closed.id(),
                    "OUT",
                    ReadingKind.AC,
                    0.0,
                    1000.0,
                    0.001,
                    "",
                    clock.instant())),
            new SuspectListRecord(
                HistoryStore.newId(),
                closed.id(),
                clock.instant(),
                "0.1.0",
                "fault",
                List.of(
                    new StoredSuspect("R2:open", 0.7, List.of("R2:open", "R1:high"), AWKWARD, 1),
                    new StoredSuspect("U1A:stuck-high", 0.3, List.of("U1A:stuck-high"), "", 2)),
                "U1.2 dc\nOUT ac 1000 Hz"));
    store.cases().addAction(closed.id(), ActionKind.PART_REPLACED, "R2", "47k", "47k 1%", AWKWARD);
    store.cases().addNote(closed.id(), AWKWARD);
    store.cases().close(closed.id(), Outcome.FIXED, List.of("R2:open"));
    store.cases().open(m2.id(), "No output");
    store.cases().open(p1.id(), AWKWARD);
  }

  static HistoryBundle withoutExportTime(HistoryBundle b) {
    return new HistoryBundle(
        b.version(),
        Instant.EPOCH,
        "",
        b.boardModels(),
        b.stageSheets(),
        b.units(),
        b.cases(),
        b.readings(),
        b.suspectLists(),
        b.actions(),
        b.notes());
  }
}
