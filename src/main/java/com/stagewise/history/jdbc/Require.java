package com.stagewise.history.jdbc;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.Checks;
import com.stagewise.history.record.RepairCase;
import java.sql.SQLException;

/** Lookups that refuse a write whose record does not exist, naming what was missing. */
final class Require {
  /** Names the history in messages about what the user asked for. */
  static final String SOURCE = "history";

  private Require() {}

  static void exists(Rows rows, String table, String id, String what) throws SQLException {
    if (rows.first("SELECT 1 FROM " + table + " WHERE id = ?", rs -> 1, id).isEmpty()) {
      throw new InvalidInputException(
          SOURCE, what, "no " + what + " has the id " + Checks.quote(id));
    }
  }

  static RepairCase repairCase(Rows rows, String caseId) throws SQLException {
    return rows.first(
            Records.cases(rows.dialect()) + " WHERE c.id = ?", Records::repairCase, caseId)
        .orElseThrow(
            () ->
                new InvalidInputException(
                    SOURCE, "case", "no case has the id " + Checks.quote(caseId)));
  }
}
