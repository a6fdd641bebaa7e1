package com.stagewise.history.postgres;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.CaseFile;
import com.stagewise.history.ServerAddress;
import com.stagewise.history.record.StoredReading;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Clock;
import java.time.Instant;
import org.junit.jupiter.api.Test;

/**
 * A shop's schema of an earlier version on a real server (a throwaway cluster, {@link TestServer})
 * is brought up to date on connect and loses nothing.
 */
class PgMigrationTest {
  private static final long TAKEN = Instant.parse("2025-06-01T12:00:00Z").toEpochMilli();

  private final TestServer server = TestServer.get();

  @Test
  void version4Shop_migrates_andItsReadingsStandUnchanged_withoutNewChangeNumbers()
      throws SQLException {
    ServerAddress address = shopAtVersion(4);
    String s = address.schema();
    server.adminSql(
        // The triggers of version 3 on name the change-number sequence without its schema.
        "SET search_path TO " + s,
        unitWithCase(s, "crackles when cold"),
        "INSERT INTO "
            + s
            + ".reading (id, case_id, at, kind, value, hz, uncertainty, meter, taken_at)"
            + " VALUES ('r1', 'c1', 'U3.8', 'dc', 1.19, NULL, NULL, '6000-count meter', "
            + TAKEN
            + ")");
    long changeBefore = changeNumber(s);

    try (PgHistory shop = PgHistory.open(address, Clock.systemUTC(), server.adminEnvironment())) {
      assertThat(shop.schemaVersion()).isEqualTo(PgMigrations.LATEST);
      CaseFile file = shop.cases().caseFile("c1").orElseThrow();
      assertThat(file.repairCase().symptom()).isEqualTo("crackles when cold");
      assertThat(file.readings()).hasSize(1);
      StoredReading r = file.readings().get(0);
      assertThat(r.at()).isEqualTo("U3.8");
      assertThat(r.value()).isEqualTo(1.19);
      assertThat(r.takenAt()).isEqualTo(Instant.ofEpochMilli(TAKEN));
      assertThat(r.struck()).isFalse();
      assertThat(r.updatedAt()).isEqualTo(r.takenAt());
    }
    // Filling in the new column is no change for the benches to pull.
    assertThat(changeNumber(s)).isEqualTo(changeBefore);
  }

  @Test
  void version5Shop_migrates_sheetsOfOneTitleBecomeItsVersions_withoutNewChangeNumbers()
      throws SQLException {
    ServerAddress address = shopAtVersion(5);
    String s = address.schema();
    server.adminSql(
        "SET search_path TO " + s,
        "INSERT INTO " + s + ".board_model VALUES ('m1', 'MX-8', 'Northfield', '', " + TAKEN + ")",
        // Two sheets of one title (the second saved after an edit, letter case aside) and one of
        // another title, stored before versions were kept.
        "INSERT INTO "
            + s
            + ".stage_sheet (id, board_model_id, title, sheet_json, updated_at) VALUES"
            + " ('s2', 'm1', 'output driver', '{\"b\": 2}', "
            + (TAKEN + 1000)
            + "), ('s1', 'm1', 'Output driver', '{\"a\": 1}', "
            + TAKEN
            + "), ('s3', 'm1', 'Input buffer', '{\"c\": 3}', "
            + TAKEN
            + ")",
        unitAndCase(s, "crackles when cold"));
    long changeBefore = maxChange(s, "stage_sheet");

    try (PgHistory shop = PgHistory.open(address, Clock.systemUTC(), server.adminEnvironment())) {
      assertThat(shop.schemaVersion()).isEqualTo(PgMigrations.LATEST);
      assertThat(shop.library().versions("m1", "OUTPUT DRIVER"))
          .extracting(v -> v.id() + " " + v.version() + " " + v.sheetJson())
          .containsExactly("s2 2 {\"b\": 2}", "s1 1 {\"a\": 1}");
      assertThat(shop.library().versions("m1", "Input buffer"))
          .extracting(v -> v.version() + " " + v.savedAt().toEpochMilli())
          .containsExactly("1 " + TAKEN);
      assertThat(shop.cases().find("c1").orElseThrow().stageSheetId()).isNull();
      // The migrated schema takes the next version, and a case records it.
      assertThat(shop.library().useForCase("c1", "Output driver", "{}", "Ann").version())
          .isEqualTo(3);
      assertThat(shop.cases().find("c1").orElseThrow().stageSheetId()).isNotNull();
    }
    // Numbering the sheets already there is no change for the benches to pull.
    assertThat(
            scalar(
                "SELECT max(change_no) FROM " + s + ".stage_sheet WHERE id IN ('s1', 's2', 's3')"))
        .isEqualTo(changeBefore);
  }

  @Test
  void version6Shop_migrates_itsAcReadingStaysAPeak_andTakesAnRmsReading() throws SQLException {
    ServerAddress address = shopAtVersion(6);
    String s = address.schema();
    server.adminSql(
        "SET search_path TO " + s,
        unitWithCase(s, "no treble"),
        "INSERT INTO "
            + s
            + ".reading (id, case_id, at, kind, value, hz, uncertainty, meter, taken_at,"
            + " updated_at) VALUES ('r1', 'c1', 'OUT', 'ac', 0.47, 1000, NULL, 'scope', "
            + TAKEN
            + ", "
            + TAKEN
            + ")");
    long changeBefore = changeNumber(s);

    try (PgHistory shop = PgHistory.open(address, Clock.systemUTC(), server.adminEnvironment())) {
      assertThat(shop.schemaVersion()).isEqualTo(PgMigrations.LATEST);
      StoredReading old = shop.cases().caseFile("c1").orElseThrow().readings().get(0);
      assertThat(old.value()).isEqualTo(0.47);
      assertThat(old.hz()).isEqualTo(1000.0);
      assertThat(old.measureWord()).isEqualTo("peak");
      StoredReading rms =
          new StoredReading(
              "r2",
              "c1",
              "OUT",
              com.stagewise.history.record.ReadingKind.AC,
              0.332,
              1000.0,
              null,
              "meter",
              Instant.ofEpochMilli(TAKEN + 1000),
              "",
              null,
              null,
              "rms");
      shop.cases().addReadings("c1", java.util.List.of(rms), null);
      assertThat(shop.cases().caseFile("c1").orElseThrow().readings())
          .extracting(StoredReading::measureWord)
          .containsExactly("peak", "rms");
    }
    // Adding the column is no change for the benches to pull.
    assertThat(changeNumber(s)).isEqualTo(changeBefore);
  }

  @Test
  void version7Shop_migrates_casesHaveNoPhotos_aBenchRoleMayAddThem_withoutNewChangeNumbers()
      throws SQLException {
    ServerAddress address = shopAtVersion(7);
    String s = address.schema();
    String bench = "bench_" + s.replaceAll("[^a-z0-9_]", "_");
    server.adminSql(
        "SET search_path TO " + s,
        // The rights server-init gives a bench on the tables of version 7.
        benchRole(bench, s),
        unitWithCase(s, "crackles when cold"));
    long changeBefore = maxChange(s, "repair_case");

    try (PgHistory shop = PgHistory.open(address, Clock.systemUTC(), server.adminEnvironment())) {
      assertThat(shop.schemaVersion()).isEqualTo(PgMigrations.LATEST);
      assertThat(shop.cases().caseFile("c1").orElseThrow().photos()).isEmpty();
      assertThat(shop.cases().caseFile("c1").orElseThrow().repairCase().symptom())
          .isEqualTo("crackles when cold");
      assertThat(maxChange(s, "repair_case")).isEqualTo(changeBefore);
      byte[] png = com.stagewise.history.TestPictures.png(16, 12);
      var photo =
          shop.cases()
              .attachPhoto("c1", new com.stagewise.history.Cases.PhotoDraft("a.png", png, "Ann"));
      assertThat(shop.cases().photo(photo.id()).orElseThrow().image()).isEqualTo(png);
      // The photo takes a change number, so that the benches pull it.
      assertThat(maxChange(s, "case_photo")).isGreaterThan(changeBefore);
    }
    assertThat(benchMay(bench, s + ".case_photo", "INSERT"))
        .as("a bench role may add photos")
        .isTrue();
    assertThat(benchMay(bench, s + ".case_photo", "DELETE"))
        .as("and may not delete them")
        .isFalse();
  }

  @Test
  void version8Shop_migrates_casesHaveNoReadingsAfterRepair_aBenchRoleMayAddThem()
      throws SQLException {
    ServerAddress address = shopAtVersion(8);
    String s = address.schema();
    String bench = "bench8_" + s.replaceAll("[^a-z0-9_]", "_");
    server.adminSql(
        "SET search_path TO " + s, benchRole(bench, s), unitWithCase(s, "crackles when cold"));
    long changeBefore = maxChange(s, "repair_case");
    try (PgHistory shop = PgHistory.open(address, Clock.systemUTC(), server.adminEnvironment())) {
      assertThat(shop.schemaVersion()).isEqualTo(PgMigrations.LATEST);
      assertThat(shop.cases().caseFile("c1").orElseThrow().afterRepair()).isEmpty();
      assertThat(maxChange(s, "repair_case")).isEqualTo(changeBefore);
      var after =
          new com.stagewise.history.record.AfterRepairReading(
              com.stagewise.history.HistoryStore.newId(),
              "c1",
              "OUT",
              -4.7,
              "m",
              Instant.ofEpochMilli(TAKEN + 60_000),
              -4.8,
              -4.6);
      shop.cases().addAfterRepair("c1", java.util.List.of(after));
      assertThat(shop.cases().caseFile("c1").orElseThrow().afterRepair()).containsExactly(after);
      assertThat(shop.cases().caseFile("c1").orElseThrow().readings()).isEmpty();
      assertThat(maxChange(s, "after_repair_reading")).isGreaterThan(changeBefore);
    }
    assertThat(benchMay(bench, s + ".after_repair_reading", "INSERT"))
        .as("a bench role may add readings after a repair")
        .isTrue();
  }

  /** A fresh shop's schema, migrated as far as the given version and no further. */
  private ServerAddress shopAtVersion(int version) throws SQLException {
    ServerAddress address = server.freshShop();
    PgDatabase admin = PgDatabase.connect(address, server.adminEnvironment());
    try {
      PgMigrations.migrate(admin, 0L, version);
    } finally {
      admin.close();
    }
    return address;
  }

  /** SQL that stores a board model m1, its unit u1 and an open case c1 of it. */
  private static String unitWithCase(String schema, String symptom) {
    return "INSERT INTO "
        + schema
        + ".board_model VALUES ('m1', 'MX-8', 'Northfield', '', "
        + TAKEN
        + "); "
        + unitAndCase(schema, symptom);
  }

  /** SQL that stores the unit u1 of board model m1 and an open case c1 of it. */
  private static String unitAndCase(String schema, String symptom) {
    return "INSERT INTO "
        + schema
        + ".unit VALUES ('u1', 'NF-8-0100', 'm1', '', "
        + TAKEN
        + "); INSERT INTO "
        + schema
        + ".repair_case (id, unit_id, opened_at, symptom, status, updated_at) VALUES ('c1', 'u1', "
        + TAKEN
        + ", '"
        + symptom
        + "', 'open', "
        + TAKEN
        + ")";
  }

  /** SQL that makes a login role with the rights a bench had on the tables of version 7. */
  private static String benchRole(String bench, String schema) {
    return "CREATE ROLE "
        + bench
        + " LOGIN PASSWORD 'x'; GRANT SELECT, INSERT, UPDATE ON "
        + schema
        + ".reading, "
        + schema
        + ".repair_case TO "
        + bench;
  }

  private boolean benchMay(String bench, String table, String privilege) throws SQLException {
    try (Connection c = server.adminConnection(TestServer.DATABASE);
        Statement st = c.createStatement();
        ResultSet rs =
            st.executeQuery(
                "SELECT has_table_privilege('"
                    + bench
                    + "', '"
                    + table
                    + "', '"
                    + privilege
                    + "')")) {
      assertThat(rs.next()).isTrue();
      return rs.getBoolean(1);
    }
  }

  private long scalar(String sql) throws SQLException {
    try (Connection c = server.adminConnection(TestServer.DATABASE);
        Statement st = c.createStatement();
        ResultSet rs = st.executeQuery(sql)) {
      assertThat(rs.next()).isTrue();
      return rs.getLong(1);
    }
  }

  private long maxChange(String schema, String table) throws SQLException {
    return scalar("SELECT max(change_no) FROM " + schema + "." + table);
  }

  private long changeNumber(String schema) throws SQLException {
    return scalar("SELECT change_no FROM " + schema + ".reading");
  }
}
