package com.stagewise.history.jdbc;

import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Instant;
import java.util.Arrays;
import java.util.List;

/** The queries that select each kind of record, and the mapping of their rows to records. */
public final class Records {
  public static final String BOARD_MODEL =
      "SELECT id, name, maker, notes, updated_at FROM board_model";
  public static final String STAGE_SHEET =
      "SELECT id, board_model_id, title, sheet_json, updated_at, version, saved_by, saved_at"
          + " FROM stage_sheet";
  public static final String UNIT =
      "SELECT id, serial, board_model_id, owner, updated_at FROM unit";
  public static final String READING =
      "SELECT id, case_id, at, kind, value, hz, uncertainty, meter, taken_at, to_point,"
          + " struck_at, updated_at, measure FROM reading";
  public static final String SUSPECT_LIST =
      "SELECT id, case_id, computed_at, program_version, verdict, next_probes FROM suspect_list";
  public static final String ACTION =
      "SELECT id, case_id, at, kind, part, old_value, new_value, text, updated_at"
          + " FROM repair_action";
  public static final String NOTE = "SELECT id, case_id, at, text, updated_at FROM case_note";

  public static final String AFTER_REPAIR =
      "SELECT id, case_id, at, value, meter, taken_at, healthy_low, healthy_high, kind,"
          + " measure, hz, to_point FROM after_repair_reading";

  /** Selects photos without their pictures. */
  public static final String PHOTO =
      "SELECT id, case_id, file_name, media_type, width, height, bytes, attached_at, attached_by"
          + " FROM case_photo";

  /** Selects photos with their pictures (column 10). */
  public static final String PHOTO_WITH_IMAGE =
      "SELECT id, case_id, file_name, media_type, width, height, bytes, attached_at, attached_by,"
          + " image FROM case_photo";

  private Records() {}

  /** The query that selects cases (table alias {@code c}), with their confirmed faults. */
  public static String cases(SqlDialect dialect) {
    return "SELECT c.id, c.unit_id, c.opened_at, c.symptom, c.status, c.closed_at, c.outcome,"
        + " c.updated_at, c.stage_sheet_id, "
        + dialect.confirmedFaults()
        + " AS faults FROM repair_case c";
  }

  public static BoardModel boardModel(ResultSet rs) throws SQLException {
    return new BoardModel(
        rs.getString(1), rs.getString(2), rs.getString(3), rs.getString(4), time(rs, 5));
  }

  public static StageSheetRecord stageSheet(ResultSet rs) throws SQLException {
    return new StageSheetRecord(
        rs.getString(1),
        rs.getString(2),
        rs.getString(3),
        rs.getString(4),
        time(rs, 5),
        rs.getInt(6),
        rs.getString(7),
        time(rs, 8));
  }

  public static Unit unit(ResultSet rs) throws SQLException {
    return new Unit(
        rs.getString(1), rs.getString(2), rs.getString(3), rs.getString(4), time(rs, 5));
  }

  public static RepairCase repairCase(ResultSet rs) throws SQLException {
    String outcome = rs.getString(7);
    return new RepairCase(
        rs.getString(1),
        rs.getString(2),
        time(rs, 3),
        rs.getString(4),
        CaseStatus.fromWord(rs.getString(5)).orElseThrow(),
        time(rs, 6),
        outcome == null ? null : Outcome.fromWord(outcome).orElseThrow(),
        words(rs.getString(10)),
        time(rs, 8),
        rs.getString(9));
  }

  public static StoredReading reading(ResultSet rs) throws SQLException {
    return new StoredReading(
        rs.getString(1),
        rs.getString(2),
        rs.getString(3),
        ReadingKind.fromWord(rs.getString(4)).orElseThrow(),
        rs.getDouble(5),
        nullableDouble(rs, 6),
        nullableDouble(rs, 7),
        rs.getString(8),
        time(rs, 9),
        rs.getString(10),
        time(rs, 11),
        time(rs, 12),
        rs.getString(13));
  }

  public static RepairAction action(ResultSet rs) throws SQLException {
    return new RepairAction(
        rs.getString(1),
        rs.getString(2),
        time(rs, 3),
        ActionKind.fromWord(rs.getString(4)).orElseThrow(),
        rs.getString(5),
        rs.getString(6),
        rs.getString(7),
        rs.getString(8),
        time(rs, 9));
  }

  public static CaseNote note(ResultSet rs) throws SQLException {
    return new CaseNote(
        rs.getString(1), rs.getString(2), time(rs, 3), rs.getString(4), time(rs, 5));
  }

  public static CasePhoto photo(ResultSet rs) throws SQLException {
    return new CasePhoto(
        rs.getString(1),
        rs.getString(2),
        rs.getString(3),
        rs.getString(4),
        rs.getInt(5),
        rs.getInt(6),
        rs.getLong(7),
        time(rs, 8),
        rs.getString(9));
  }

  public static AfterRepairReading afterRepair(ResultSet rs) throws SQLException {
    return new AfterRepairReading(
        rs.getString(1),
        rs.getString(2),
        rs.getString(3),
        rs.getDouble(4),
        rs.getString(5),
        time(rs, 6),
        nullableDouble(rs, 7),
        nullableDouble(rs, 8),
        ReadingKind.fromWord(rs.getString(9)).orElseThrow(),
        rs.getString(10),
        nullableDouble(rs, 11),
        rs.getString(12));
  }

  public static StoredPhoto photoWithImage(ResultSet rs) throws SQLException {
    return new StoredPhoto(photo(rs), rs.getBytes(10));
  }

  public static Instant time(ResultSet rs, int column) throws SQLException {
    long millis = rs.getLong(column);
    return rs.wasNull() ? null : Instant.ofEpochMilli(millis);
  }

  public static Double nullableDouble(ResultSet rs, int column) throws SQLException {
    double value = rs.getDouble(column);
    return rs.wasNull() ? null : value;
  }

  public static List<String> words(String joined) {
    return joined == null || joined.isEmpty() ? List.of() : Arrays.asList(joined.split(" "));
  }
}
