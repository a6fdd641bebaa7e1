package com.stagewise.history.postgres;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.CaseFile;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ServerAddress;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A shop schema of version 3 (before ohms readings) on a real server ({@link TestServer}) opens,
 * migrates to the latest version and loses nothing: every reading comes back with its values, in
 * the order it arrived; and the migrated schema then keeps ohms readings, OL included.
 */
class PgOhmsMigrationTest {
  private static final Clock CLOCK =
      Clock.fixed(Instant.parse("2026-05-04T10:00:00Z"), ZoneOffset.UTC);

  @Test
  void version3Schema_migratesAndKeepsEveryReading_thenTakesOhmsReadings() {
    TestServer server = TestServer.get();
    ServerAddress shop = server.freshShop();
    PgDatabase admin = PgDatabase.connect(shop, server.adminEnvironment());
    try {
      PgMigrations.migrate(admin, 0L, 3);
    } finally {
      admin.close();
    }
    String s = shop.schema();
    // Written the way a version-3 program wrote them (no to_point column yet).
    sql(
        shop,
        server,
        "INSERT INTO "
            + s
            + ".board_model VALUES ('b0000000-0000-4000-8000-000000000001',"
            + " 'SM-8', 'Larkspur (invented)', '', 1000)",
        "INSERT INTO "
            + s
            + ".unit VALUES ('a0000000-0000-4000-8000-000000000001', 'SM8-1',"
            + " 'b0000000-0000-4000-8000-000000000001', '', 1000)",
        "INSERT INTO "
            + s
            + ".repair_case (id, unit_id, opened_at, symptom, status, updated_at)"
            + " VALUES ('c0000000-0000-4000-8000-000000000001',"
            + " 'a0000000-0000-4000-8000-000000000001', 1000, 'no output', 'open', 1000)",
        "INSERT INTO "
            + s
            + ".reading (id, case_id, at, kind, value, hz, uncertainty, meter,"
            + " taken_at) VALUES ('d0000000-0000-4000-8000-000000000002',"
            + " 'c0000000-0000-4000-8000-000000000001', 'U3.1', 'dc', -13.46, NULL, NULL,"
            + " '6000-count meter', 2000)",
        "INSERT INTO "
            + s
            + ".reading (id, case_id, at, kind, value, hz, uncertainty, meter,"
            + " taken_at) VALUES ('d0000000-0000-4000-8000-000000000001',"
            + " 'c0000000-0000-4000-8000-000000000001', 'OUT', 'ac', 0.0021, 1000, 0.001, '',"
            + " 2000)");
    long changeBefore = changeNumberOfFirstReading(server, s);

    try (HistoryStore store = PgHistory.open(shop, CLOCK, server.adminEnvironment())) {
      assertThat(store.schemaVersion()).isEqualTo(PgHistory.latestSchemaVersion());
      String caseId = "c0000000-0000-4000-8000-000000000001";
      CaseFile file = caseFile(store, caseId);
      assertThat(file.readings())
          .containsExactly(
              new StoredReading(
                  "d0000000-0000-4000-8000-000000000002",
                  caseId,
                  "U3.1",
                  ReadingKind.DC,
                  -13.46,
                  null,
                  null,
                  "6000-count meter",
                  Instant.ofEpochMilli(2000)),
              new StoredReading(
                  "d0000000-0000-4000-8000-000000000001",
                  caseId,
                  "OUT",
                  ReadingKind.AC,
                  0.0021,
                  1000.0,
                  0.001,
                  "",
                  Instant.ofEpochMilli(2000)));
      // Migrating stamped no change: a bench that synced these readings need not fetch them again.
      assertThat(changeNumberOfFirstReading(server, s)).isEqualTo(changeBefore);

      StoredReading open =
          new StoredReading(
              HistoryStore.newId(),
              caseId,
              "SUM",
              ReadingKind.OHMS,
              Double.POSITIVE_INFINITY,
              null,
              null,
              "6000-count meter, ohms ±(0.8 % + 3 counts)",
              CLOCK.instant(),
              "OUT");
      StoredReading across =
          new StoredReading(
              HistoryStore.newId(),
              caseId,
              "R14.1",
              ReadingKind.OHMS,
              9987.5,
              null,
              null,
              "",
              CLOCK.instant(),
              "R14.2");
      store
          .cases()
          .addReadings(
              caseId,
              List.of(open, across),
              new SuspectListRecord(
                  HistoryStore.newId(), caseId, CLOCK.instant(), "test", "fault", List.of(), ""));
      List<StoredReading> now = caseFile(store, caseId).readings();
      assertThat(now).hasSize(4);
      assertThat(now.subList(2, 4)).containsExactly(open, across);
      assertThat(now.get(2).isOverRange()).isTrue();
    }
  }

  /** Runs statements in the shop's schema as the superuser, each committed. */
  private static void sql(ServerAddress shop, TestServer server, String... statements) {
    try (java.sql.Connection c = PgDatabase.open(shop, server.adminEnvironment());
        java.sql.Statement st = c.createStatement()) {
      for (String statement : statements) {
        st.execute(statement);
      }
      if (!c.getAutoCommit()) {
        c.commit();
      }
    } catch (java.sql.SQLException e) {
      throw new IllegalStateException(e.getMessage(), e);
    }
  }

  private static CaseFile caseFile(HistoryStore store, String caseId) {
    return store.cases().caseFile(caseId).orElseThrow();
  }

  private static long changeNumberOfFirstReading(TestServer server, String schema) {
    try (var c = server.adminConnection(TestServer.DATABASE);
        var q =
            c.prepareStatement("SELECT change_no FROM " + schema + ".reading WHERE at = 'U3.1'");
        var rs = q.executeQuery()) {
      rs.next();
      return rs.getLong(1);
    } catch (java.sql.SQLException e) {
      throw new IllegalStateException(e);
    }
  }
}
