package com.stagewise.history.postgres;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.ServerAddress;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.ReadingKind;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Clock;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A shop schema of version 9 (readings after the repair were DC levels only) on a real server
 * ({@link TestServer}) migrates to version 10 and loses nothing: its reading after the repair comes
 * back as the DC level it was, with its band, taking no new change number; the migrated schema
 * keeps AC and ohms readings with their kind, measure, frequency and second point; a row written
 * with the columns of version 9 only (as a program of that version writes it) reads as DC volts;
 * and a bench role of version 9 may still add them. Values: the textbook inverting amplifier (−4.7
 * V out; 0.332 V RMS for 0.1 V peak in; R2 = 47 kΩ ± 1 % between SUM and OUT with the power off).
 */
class PgAfterRepairMigrationTest {
  private static final long TAKEN = Instant.parse("2025-06-01T12:00:00Z").toEpochMilli();

  private final TestServer server = TestServer.get();

  @Test
  void version9Shop_migrates_itsReadingAfterRepairStaysDc_andTakesAcAndOhmsOnes()
      throws SQLException {
    ServerAddress address = server.freshShop();
    PgDatabase admin = PgDatabase.connect(address, server.adminEnvironment());
    try {
      PgMigrations.migrate(admin, 0L, 9);
    } finally {
      admin.close();
    }
    String s = address.schema();
    String bench = "bench9_" + s.replaceAll("[^a-z0-9_]", "_");
    server.adminSql(
        "SET search_path TO " + s,
        "INSERT INTO " + s + ".board_model VALUES ('m1', 'MX-8', 'Northfield', '', " + TAKEN + ")",
        "INSERT INTO " + s + ".unit VALUES ('u1', 'NF-8-0100', 'm1', '', " + TAKEN + ")",
        "INSERT INTO "
            + s
            + ".repair_case (id, unit_id, opened_at, symptom, status, updated_at) VALUES ('c1',"
            + " 'u1', "
            + TAKEN
            + ", 'output pinned low', 'open', "
            + TAKEN
            + ")",
        v9Row(s, "a1", -4.71),
        "CREATE ROLE "
            + bench
            + " LOGIN PASSWORD 'x'; GRANT SELECT, INSERT, UPDATE ON "
            + s
            + ".after_repair_reading, "
            + s
            + ".repair_case TO "
            + bench);
    long changeBefore = scalar("SELECT max(change_no) FROM " + s + ".after_repair_reading");

    AfterRepairReading ac =
        new AfterRepairReading(
            HistoryStore.newId(),
            "c1",
            "OUT",
            0.333,
            "scope",
            Instant.ofEpochMilli(TAKEN + 60_000),
            0.329,
            0.336,
            ReadingKind.AC,
            "rms",
            1000.0,
            "");
    AfterRepairReading ohms =
        new AfterRepairReading(
            HistoryStore.newId(),
            "c1",
            "SUM",
            Double.POSITIVE_INFINITY,
            "meter, ohms",
            Instant.ofEpochMilli(TAKEN + 120_000),
            46_530.0,
            47_470.0,
            ReadingKind.OHMS,
            null,
            null,
            "OUT");
    try (PgHistory shop = PgHistory.open(address, Clock.systemUTC(), server.adminEnvironment())) {
      assertThat(shop.schemaVersion()).isEqualTo(PgMigrations.LATEST);
      List<AfterRepairReading> kept = shop.cases().caseFile("c1").orElseThrow().afterRepair();
      assertThat(kept)
          .containsExactly(
              new AfterRepairReading(
                  "a1",
                  "c1",
                  "OUT",
                  -4.71,
                  "6000-count meter",
                  Instant.ofEpochMilli(TAKEN),
                  -4.8,
                  -4.6));
      assertThat(kept.get(0).kind()).isEqualTo(ReadingKind.DC);
      assertThat(kept.get(0).inside()).isTrue();
      // Adding the columns is no change for the benches to pull.
      assertThat(scalar("SELECT max(change_no) FROM " + s + ".after_repair_reading"))
          .isEqualTo(changeBefore);

      shop.cases().addAfterRepair("c1", List.of(ac, ohms));
      // A row written with the columns of version 9 only reads as the DC level it is.
      server.adminSql("SET search_path TO " + s, v9Row(s, "a2", -4.69));
      List<AfterRepairReading> all = shop.cases().caseFile("c1").orElseThrow().afterRepair();
      assertThat(all).hasSize(4);
      assertThat(all.subList(1, 3)).containsExactly(ac, ohms);
      assertThat(all.get(3).kind()).isEqualTo(ReadingKind.DC);
      assertThat(all.get(3).measure()).isNull();
      assertThat(all.get(3).to()).isEmpty();
      assertThat(all)
          .extracting(AfterRepairReading::inside)
          .containsExactly(true, true, false, true);
      assertThat(scalar("SELECT max(change_no) FROM " + s + ".after_repair_reading"))
          .isGreaterThan(changeBefore);
      assertThat(shop.cases().caseFile("c1").orElseThrow().readings()).isEmpty();
    }
    assertThat(
            scalar(
                "SELECT count(*) FROM "
                    + s
                    + ".after_repair_reading WHERE kind = 'ohms' AND value = 'Infinity'"))
        .isEqualTo(1);
    assertThat(
            scalar(
                "SELECT CASE WHEN has_table_privilege('"
                    + bench
                    + "', '"
                    + s
                    + ".after_repair_reading', 'INSERT') THEN 1 ELSE 0 END"))
        .as("a bench role of version 9 may still add readings after a repair")
        .isEqualTo(1);
  }

  /** SQL that adds a reading after the repair of case c1 with the columns of version 9. */
  private static String v9Row(String schema, String id, double volts) {
    return "INSERT INTO "
        + schema
        + ".after_repair_reading (id, case_id, at, value, meter, taken_at, healthy_low,"
        + " healthy_high) VALUES ('"
        + id
        + "', 'c1', 'OUT', "
        + volts
        + ", '6000-count meter', "
        + TAKEN
        + (id.equals("a1") ? "" : " + 180000")
        + ", -4.8, -4.6)";
  }

  private long scalar(String sql) throws SQLException {
    try (Connection c = server.adminConnection(TestServer.DATABASE);
        Statement st = c.createStatement();
        ResultSet rs = st.executeQuery(sql)) {
      assertThat(rs.next()).isTrue();
      return rs.getLong(1);
    }
  }
}
