package com.stagewise.history.jdbc;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.ExportSelection;
import com.stagewise.history.record.HistoryBundle;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Instant;

/** Reads the selected part of the history into a bundle (inside one read transaction). */
public final class Exporter {
  private Exporter() {}

  /** Reads what {@code selection} names, in the SQL of {@code dialect}. */
  public static HistoryBundle export(
      Connection connection,
      SqlDialect dialect,
      ExportSelection selection,
      String programVersion,
      Instant now)
      throws SQLException {
    // Each selection is three conditions (on cases, units and board models) with one parameter.
    String cases;
    String units;
    String models;
    Object[] p;
    if (selection instanceof ExportSelection.OneUnit one) {
      cases = "c.unit_id = ?";
      units = "id = ?";
      models = "id IN (SELECT board_model_id FROM unit WHERE id = ?)";
      p = new Object[] {one.unitId()};
    } else if (selection instanceof ExportSelection.OneBoardModel one) {
      cases = "c.unit_id IN (SELECT id FROM unit WHERE board_model_id = ?)";
      units = "board_model_id = ?";
      models = "id = ?";
      p = new Object[] {one.boardModelId()};
    } else if (selection instanceof ExportSelection.OpenedBetween range) {
      cases = "c.opened_at >= ? AND c.opened_at < ?";
      units = "id IN (SELECT unit_id FROM repair_case c WHERE " + cases + ")";
      models =
          "id IN (SELECT board_model_id FROM unit WHERE id IN"
              + " (SELECT unit_id FROM repair_case c WHERE "
              + cases
              + "))";
      p = new Object[] {range.from(), range.before()};
    } else {
      cases = "1 = 1";
      units = "1 = 1";
      models = "1 = 1";
      p = new Object[0];
    }
    String caseIds = "case_id IN (SELECT c.id FROM repair_case c WHERE " + cases + ")";
    SqlDialect d = dialect;
    String byCase = " ORDER BY " + d.binaryOrder("case_id") + ", ";
    try (Rows rows = new Rows(connection, dialect)) {
      var boardModels =
          rows.query(
              Records.BOARD_MODEL + " WHERE " + models + " ORDER BY " + d.binaryOrder("name"),
              Records::boardModel,
              p);
      if (boardModels.isEmpty()
          && !(selection instanceof ExportSelection.All)
          && !(selection instanceof ExportSelection.OpenedBetween)) {
        throw new InvalidInputException(
            "history", "export", "nothing to export: no such unit or board model");
      }
      return new HistoryBundle(
          HistoryBundle.CURRENT_VERSION,
          now,
          programVersion,
          boardModels,
          rows.query(
              Records.STAGE_SHEET
                  + " WHERE board_model_id IN (SELECT id FROM board_model WHERE "
                  + models
                  + ") ORDER BY version, saved_at, "
                  + d.binaryOrder("id"),
              Records::stageSheet,
              p),
          rows.query(
              Records.UNIT + " WHERE " + units + " ORDER BY " + d.binaryOrder("serial") + ", id",
              Records::unit,
              p),
          rows.query(
              Records.cases(d)
                  + " WHERE "
                  + cases
                  + " ORDER BY c.opened_at, "
                  + d.insertionOrder("c.row"),
              Records::repairCase,
              p),
          rows.query(
              Records.READING
                  + " WHERE "
                  + caseIds
                  + byCase
                  + "taken_at, "
                  + d.insertionOrder("rowid"),
              Records::reading,
              p),
          rows.suspectLists(
              "WHERE " + caseIds + byCase + "computed_at, " + d.insertionOrder("rowid"), p),
          rows.query(
              Records.ACTION + " WHERE " + caseIds + byCase + "at, " + d.insertionOrder("rowid"),
              Records::action,
              p),
          rows.query(
              Records.NOTE + " WHERE " + caseIds + byCase + "at, " + d.insertionOrder("row"),
              Records::note,
              p),
          rows.query(
              Records.PHOTO_WITH_IMAGE
                  + " WHERE "
                  + caseIds
                  + byCase
                  + "attached_at, "
                  + d.insertionOrder("row"),
              Records::photoWithImage,
              p),
          rows.query(
              Records.AFTER_REPAIR
                  + " WHERE "
                  + caseIds
                  + byCase
                  + "taken_at, "
                  + d.insertionOrder("row"),
              Records::afterRepair,
              p));
    }
  }
}
