package com.stagewise.history.postgres;

import com.stagewise.history.ShopServer;
import com.stagewise.history.jdbc.Records;
import com.stagewise.history.jdbc.Rows;
import com.stagewise.history.jdbc.SqlDialect;
import com.stagewise.history.record.HistoryBundle;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Instant;

/**
 * Reads what changed on the server since a change number, inside one read transaction (one
 * snapshot): the changed records, and the case, unit and board model each of them belongs to, so
 * that the bundle can be merged on its own.
 */
final class ChangeFeed {
  private static final String[] TABLES = {
    "board_model",
    "stage_sheet",
    "unit",
    "repair_case",
    "reading",
    "suspect_list",
    "repair_action",
    "case_note",
    "case_photo",
    "after_repair_reading"
  };

  private ChangeFeed() {}

  static ShopServer.Changes since(
      Connection connection, long after, String programVersion, Instant now) throws SQLException {
    try (Rows rows = new Rows(connection, SqlDialect.POSTGRES)) {
      long through = after;
      for (String table : TABLES) {
        long max =
            rows.first("SELECT coalesce(max(change_no), 0) FROM " + table, rs -> rs.getLong(1))
                .orElse(0L);
        through = Math.max(through, max);
      }
      String children =
          "SELECT case_id FROM reading WHERE change_no > ?1"
              + " UNION SELECT case_id FROM suspect_list WHERE change_no > ?1"
              + " UNION SELECT case_id FROM repair_action WHERE change_no > ?1"
              + " UNION SELECT case_id FROM case_note WHERE change_no > ?1"
              + " UNION SELECT case_id FROM case_photo WHERE change_no > ?1"
              + " UNION SELECT case_id FROM after_repair_reading WHERE change_no > ?1";
      String cases = "c.change_no > ?1 OR c.id IN (" + children + ")";
      String units =
          "change_no > ?1 OR id IN (SELECT c.unit_id FROM repair_case c WHERE " + cases + ")";
      String models =
          "change_no > ?1 OR id IN (SELECT board_model_id FROM unit WHERE "
              + units
              + ") OR id IN (SELECT board_model_id FROM stage_sheet WHERE change_no > ?1)";
      HistoryBundle bundle =
          new HistoryBundle(
              HistoryBundle.CURRENT_VERSION,
              now,
              programVersion,
              rows.query(
                  SINCE
                      + Records.BOARD_MODEL
                      + " WHERE "
                      + numbered(models)
                      + " ORDER BY change_no",
                  Records::boardModel,
                  after),
              // With the versions the changed cases are diagnosed with, so the bundle stands alone.
              rows.query(
                  SINCE
                      + Records.STAGE_SHEET
                      + " WHERE "
                      + numbered(
                          "change_no > ?1 OR id IN (SELECT c.stage_sheet_id FROM repair_case c"
                              + " WHERE "
                              + cases
                              + ")")
                      + " ORDER BY change_no",
                  Records::stageSheet,
                  after),
              rows.query(
                  SINCE + Records.UNIT + " WHERE " + numbered(units) + " ORDER BY change_no",
                  Records::unit,
                  after),
              rows.query(
                  SINCE
                      + Records.cases(SqlDialect.POSTGRES)
                      + " WHERE "
                      + numbered(cases)
                      + " ORDER BY c.change_no",
                  Records::repairCase,
                  after),
              rows.query(
                  Records.READING + " WHERE change_no > ? ORDER BY change_no",
                  Records::reading,
                  after),
              rows.suspectLists("WHERE change_no > ? ORDER BY change_no", after),
              rows.query(
                  Records.ACTION + " WHERE change_no > ? ORDER BY change_no",
                  Records::action,
                  after),
              rows.query(
                  Records.NOTE + " WHERE change_no > ? ORDER BY change_no", Records::note, after),
              rows.query(
                  Records.PHOTO_WITH_IMAGE + " WHERE change_no > ? ORDER BY change_no",
                  Records::photoWithImage,
                  after),
              rows.query(
                  Records.AFTER_REPAIR + " WHERE change_no > ? ORDER BY change_no",
                  Records::afterRepair,
                  after));
      return new ShopServer.Changes(bundle, through);
    }
  }

  /** Binds the one change number that a query with {@link #numbered} conditions uses. */
  private static final String SINCE = "WITH since AS (SELECT CAST(? AS BIGINT) AS n) ";

  /** Makes every {@code ?1} in a condition refer to the change number bound in {@link #SINCE}. */
  private static String numbered(String sql) {
    return sql.replace("?1", "(SELECT n FROM since)");
  }
}
