package com.stagewise.history.jdbc;

import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.StoredPhoto;
import java.sql.SQLException;

/**
 * Writes the records a case gathers beside its readings: photos of the board and readings taken
 * after the repair. Each is added unless one with its id is there already (then it returns false
 * and changes nothing); neither is ever edited.
 */
final class CaseExtraRows {
  private CaseExtraRows() {}

  static boolean tryInsert(Rows rows, AfterRepairReading r) throws SQLException {
    int inserted =
        rows.update(
            "INSERT INTO after_repair_reading (id, case_id, at, value, meter, taken_at,"
                + " healthy_low, healthy_high, kind, measure, hz, to_point)"
                + " VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)"
                + " ON CONFLICT (id) DO NOTHING",
            r.id(),
            r.caseId(),
            r.at(),
            r.value(),
            r.meterText(),
            r.takenAt(),
            r.healthyLow(),
            r.healthyHigh(),
            r.kind().word(),
            r.measure(),
            r.hz(),
            r.to());
    return inserted == 1;
  }

  static boolean tryInsert(Rows rows, StoredPhoto p) throws SQLException {
    CasePhoto about = p.photo();
    int inserted =
        rows.update(
            "INSERT INTO case_photo (id, case_id, file_name, media_type, width, height, bytes,"
                + " attached_at, attached_by, image) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)"
                + " ON CONFLICT (id) DO NOTHING",
            about.id(),
            about.caseId(),
            about.fileName(),
            about.mediaType(),
            about.width(),
            about.height(),
            about.bytes(),
            about.attachedAt(),
            about.attachedBy(),
            p.image());
    return inserted == 1;
  }
}
