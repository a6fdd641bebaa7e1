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

  /**
   * The reading taken again after the repair in the fixture's closed case (from schema version 9
   * on, when such readings were DC levels only): point, volts and its healthy band, which the
   * migration test finds again as a DC reading with that band.
   */
  static final String AFTER_REPAIR = "U3.7 13.38 12.9 13.9";

  /** The title of the fixture's stage sheets. */
  static final String SHEET_TITLE = "Output driver";

  /** The texts of the fixture's stage sheets, in the order they were saved. */
  static final List<String> SHEETS =
      List.of(
          "{\"format\": \"stagewise-stage\", \"version\": 1}",
          "{\"format\": \"stagewise-stage\", \"version\": 1, \"title\": \"Output driver\"}");

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
    String modelId;
    try (HistoryStore store = SqliteHistory.open(target, clock, version)) {
      BoardModel model = store.units().boardModel("MX-8 main board", "Northfield Audio (invented)");
      modelId = model.id();
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
    // Stage sheets go in with the columns of version 1, which every version has. From version 5 on
    // the model has two sheets of one title (a stage saved again after an edit), which version 6
    // numbers as versions 1 and 2 of one library stage (a version-6 file has them numbered).
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + target);
        PreparedStatement insert =
            c.prepareStatement(
                "INSERT INTO stage_sheet (id, board_model_id, title, sheet_json, updated_at"
                    // From version 6 on each sheet is a numbered version of its stage (the
                    // unique index of model, title and number refuses a second version 1).
                    + (version >= 6 ? ", version, saved_by, saved_at" : "")
                    + ") VALUES (?, ?, ?, ?, ?"
                    + (version >= 6 ? ", ?, '', ?" : "")
                    + ")")) {
      List<String> sheets =
          version >= 5 ? List.of(SHEETS.get(0), SHEETS.get(1)) : List.of(SHEETS.get(0));
      for (int i = 0; i < sheets.size(); i++) {
        insert.setString(1, HistoryStore.newId());
        insert.setString(2, modelId);
        insert.setString(3, SHEET_TITLE);
        insert.setString(4, sheets.get(i));
        insert.setLong(5, clock.millis() + i);
        if (version >= 6) {
          insert.setInt(6, i + 1);
          insert.setLong(7, clock.millis() + i);
        }
        insert.executeUpdate();
      }
    }
    if (closedCaseId != null) {
      // The readings go in with the columns every version from 3 on has: the program's own writes
      // follow the newest schema, which an older file does not have.
      try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + target);
          PreparedStatement insert =
              c.prepareStatement(
                  "INSERT INTO reading (id, case_id, at, kind, value, hz, uncertainty, meter,"
                      + " taken_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)");
          java.sql.Statement changed = c.createStatement()) {
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
        if (version >= 9) {
          // A reading after the repair with the columns of version 9: a DC level and its band.
          String[] after = AFTER_REPAIR.split(" ");
          try (PreparedStatement afterRepair =
              c.prepareStatement(
                  "INSERT INTO after_repair_reading (id, case_id, at, value, meter, taken_at,"
                      + " healthy_low, healthy_high) VALUES (?, ?, ?, ?, ?, ?, ?, ?)")) {
            afterRepair.setString(1, HistoryStore.newId());
            afterRepair.setString(2, closedCaseId);
            afterRepair.setString(3, after[0]);
            afterRepair.setDouble(4, Double.parseDouble(after[1]));
            afterRepair.setString(5, "6000-count meter, ±(0.5 % + 2 counts)");
            afterRepair.setLong(6, clock.millis());
            afterRepair.setDouble(7, Double.parseDouble(after[2]));
            afterRepair.setDouble(8, Double.parseDouble(after[3]));
            afterRepair.executeUpdate();
          }
        }
        if (version >= 5) {
          // From version 5 on a reading was last changed when it was taken; the outbox trigger is
          // set aside for it, as the version 5 script does.
          changed.execute("DROP TRIGGER reading_outbox_update");
          changed.execute("UPDATE reading SET updated_at = taken_at");
          changed.execute(
              "CREATE TRIGGER reading_outbox_update AFTER UPDATE ON reading BEGIN"
                  + " INSERT OR REPLACE INTO outbox (kind, id, version) VALUES ('reading',"
                  + " new.id, coalesce((SELECT version FROM outbox WHERE kind = 'reading' AND"
                  + " id = new.id), 0) + 1); END");
        }
      }
    }
  }
}
