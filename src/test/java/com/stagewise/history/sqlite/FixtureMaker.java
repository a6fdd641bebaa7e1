package com.stagewise.history.sqlite;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;

/**
 * Makes the fixture database of an earlier schema version, kept under {@code
 * src/test/resources/com/stagewise/history/sqlite/fixtures/schema-v<n>.db} for the migration test.
 *
 * <p>Run once when a new schema version is added, for the version it replaces (see DEVELOPERS.md):
 * {@code java -cp target/test-classes:target/classes:<deps>
 * com.stagewise.history.sqlite.FixtureMaker 1}.
 */
public final class FixtureMaker {
  /** The symptom of the fixture's closed case, which the migration test searches for. */
  static final String CLOSED_SYMPTOM = "Right channel distorts above half volume";

  /** The note of the fixture's closed case. */
  static final String NOTE = "Replaced the output op-amp; the distortion went away";

  /**
   * The readings of the fixture's closed case (from schema version 3 on), which the migration test
   * finds again, in order, after every later migration.
   */
  static final List<String> READINGS = List.of("U3.7 dc 13.4", "OUT ac 0.0021 at 1000 Hz");

  private FixtureMaker() {}

  public static void main(String[] args) throws Exception {
    int version = Integer.parseInt(args[0]);
    Path target =
        Path.of(
            "src/test/resources/com/stagewise/history/sqlite/fixtures/schema-v" + version + ".db");
    Files.createDirectories(target.getParent());
    Files.deleteIfExists(target);
    make(target, version);
  }

  static void make(Path target, int version) throws SQLException {
    Clock clock = Clock.fixed(Instant.parse("2025-06-01T12:00:00Z"), ZoneOffset.UTC);
    String closedCaseId = null;
    try (HistoryStore store = SqliteHistory.open(target, clock, version)) {
      BoardModel model = store.units().boardModel("MX-8 main board", "Northfield Audio (invented)");
      store
          .library()
          .add(model.id(), "Output driver", "{\"format\": \"stagewise-stage\", \"version\": 1}");
      Unit unit = store.units().add("NF-8-0100", model.id(), "job 2025-117");
      RepairCase closed = store.cases().open(unit.id(), CLOSED_SYMPTOM);
      store.cases().addNote(closed.id(), NOTE);
      if (version >= 3) {
        Instant at = clock.instant();
        store
            .cases()
            .addReadings(
                closed.id(),
                List.of(),
                new SuspectListRecord(
                    HistoryStore.newId(),
                    closed.id(),
                    at,
                    "0.1.0",
                    "fault",
                    List.of(new StoredSuspect("U3B:dead", 0.8, List.of("U3B:dead"), "", 1)),
                    ""));
        closedCaseId = closed.id();
      }
      store
          .cases()
          .addAction(closed.id(), ActionKind.PART_REPLACED, "U3", "dual op-amp", "dual op-amp", "");
      store.cases().close(closed.id(), Outcome.FIXED, List.of("U3B:dead"));
      store.cases().open(unit.id(), "Crackles when cold");
    }
    if (closedCaseId != null) {
      // The readings go in with the columns every version from 3 on has: the program's own writes
      // follow the newest schema, which an older file does not have.
      try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + target);
          PreparedStatement insert =
              c.prepareStatement(
                  "INSERT INTO reading (id, case_id, at, kind, value, hz, uncertainty, meter,"
                      + " taken_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)")) {
        Object[][] rows = {
          {"U3.7", "dc", 13.4, null, null, "6000-count meter, ±(0.5 % + 2 counts)"},
          {"OUT", "ac", 0.0021, 1000.0, 0.001, ""}
        };
        for (Object[] row : rows) {
          insert.setString(1, HistoryStore.newId());
          insert.setString(2, closedCaseId);
          insert.setString(3, (String) row[0]);
          insert.setString(4, (String) row[1]);
          insert.setDouble(5, (Double) row[2]);
          insert.setObject(6, row[3]);
          insert.setObject(7, row[4]);
          insert.setString(8, (String) row[5]);
          insert.setLong(9, clock.millis());
          insert.executeUpdate();
        }
      }
    }
  }
}
