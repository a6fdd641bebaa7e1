package com.stagewise.history.sqlite;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.Checks;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.StorageException;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Files that are not what they should be are refused clearly and never overwritten. */
class FileSafetyTest {
  @TempDir Path folder;

  @Test
  void open_newFile_isAtLatestSchemaAndEmpty() {
    try (HistoryStore store = SqliteHistory.open(folder.resolve("new.db"))) {
      assertThat(store.schemaVersion()).isEqualTo(SqliteHistory.latestSchemaVersion());
      assertThat(store.isEmpty()).isTrue();
      assertThat(store.transfer().integrityCheck()).isEqualTo("ok");
    }
  }

  @Test
  void notADatabase_isRefusedAndLeftAsItIs() throws Exception {
    Path file = folder.resolve("notes.db");
    byte[] text = "Bench notes, not a database.\n".repeat(200).getBytes(StandardCharsets.UTF_8);
    Files.write(file, text);
    assertThatThrownBy(() -> SqliteHistory.open(file))
        .isInstanceOf(StorageException.class)
        .hasMessageContaining("is not a Stagewise history database")
        .hasMessageContaining(file.getFileName().toString());
    assertThat(Files.readAllBytes(file)).isEqualTo(text);
  }

  @Test
  void anotherProgramsSqliteFile_isRefusedAndLeftAsItIs() throws Exception {
    Path file = folder.resolve("other.db");
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + file);
        PreparedStatement s = c.prepareStatement("CREATE TABLE parts (ref TEXT)")) {
      s.execute();
    }
    byte[] before = Files.readAllBytes(file);
    assertThatThrownBy(() -> SqliteHistory.open(file))
        .isInstanceOf(StorageException.class)
        .hasMessageContaining("not a Stagewise history database");
    assertThat(Files.readAllBytes(file)).isEqualTo(before);
  }

  @Test
  void damagedFile_givesAClearMessageAndIsNotOverwritten() throws Exception {
    Path file = folder.resolve("damaged.db");
    try (HistoryStore store = SqliteHistory.open(file)) {
      BoardModel model = store.units().boardModel("PSU-30", "");
      for (int i = 0; i < 200; i++) {
        Unit unit = store.units().add("U-" + i, model.id(), "");
        store.cases().open(unit.id(), "fault number " + i + " ".repeat(50));
      }
    }
    byte[] bytes = Files.readAllBytes(file);
    int page = 4096;
    assertThat(bytes.length).isGreaterThan(8 * page);
    // Garbage over every page but the first (which holds the header and the schema).
    Random random = new Random(7);
    byte[] garbage = new byte[bytes.length - page];
    random.nextBytes(garbage);
    System.arraycopy(garbage, 0, bytes, page, garbage.length);
    Files.write(file, bytes);

    assertThatThrownBy(
            () -> {
              try (HistoryStore store = SqliteHistory.open(file)) {
                store.cases().search(SearchQuery.all());
              }
            })
        .isInstanceOf(StorageException.class)
        .hasMessageContaining("damaged")
        .hasMessageContaining("restore a backup");
    assertThat(Files.readAllBytes(file)).isEqualTo(bytes);
  }

  @Test
  void newerSchema_isRefusedAndLeftAsItIs() throws Exception {
    Path file = folder.resolve("newer.db");
    SqliteHistory.open(file).close();
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + file);
        PreparedStatement s =
            c.prepareStatement("INSERT INTO schema_version VALUES (99, 0, 'V99__future.sql')")) {
      s.execute();
    }
    byte[] before = Files.readAllBytes(file);
    assertThatThrownBy(() -> SqliteHistory.open(file))
        .isInstanceOf(StorageException.class)
        .hasMessageContaining("newer Stagewise")
        .hasMessageContaining("99");
    assertThat(Files.readAllBytes(file)).isEqualTo(before);
  }

  @Test
  void unwritableFolder_givesAClearMessageAndCreatesNothing() throws Exception {
    Path locked = folder.resolve("locked");
    Files.createDirectory(locked);
    Files.setPosixFilePermissions(locked, PosixFilePermissions.fromString("r-xr-xr-x"));
    Path where = locked;
    if (canCreate(locked)) {
      // Running as root, which ignores folder permissions: use a folder of a file system that
      // takes no new files at all.
      where = Path.of("/proc/self");
    }
    Path file = where.resolve("history.db");
    try {
      assertThatThrownBy(() -> SqliteHistory.open(file))
          .isInstanceOf(StorageException.class)
          .hasMessageContaining("Cannot create the history database in " + where)
          .hasMessageContaining("not writable");
      assertThat(Files.exists(file)).isFalse();
    } finally {
      Files.setPosixFilePermissions(locked, PosixFilePermissions.fromString("rwxr-xr-x"));
    }
  }

  @Test
  void folderGivenAsTheFile_isRefused() {
    assertThatThrownBy(() -> SqliteHistory.open(folder))
        .isInstanceOf(StorageException.class)
        .hasMessageContaining("is a folder");
  }

  @Test
  void userText_roundTripsExactly() {
    List<String> texts =
        List.of(
            "It's \"quoted\"; and semi;colons; '); DROP TABLE repair_case; --",
            "Unicode: Ω µ ° ± ü ß 中文 עברית 🔧 e\u0301 \u200b",
            "Lines\nand\r\nbreaks\tand tabs \\ backslashes % _ wildcards",
            "  leading and trailing spaces  ",
            "");
    try (HistoryStore store = SqliteHistory.open(folder.resolve("text.db"))) {
      BoardModel model = store.units().boardModel("Model \"X\"; 'quoted' — Ω", "Maker; 'Ltd'");
      Unit unit = store.units().add("SN\"1\";'2' — µ", model.id(), "owner 'O\"Brien'; 🔧");
      for (String text : texts) {
        RepairCase c = store.cases().open(unit.id(), text);
        CaseNote note = store.cases().addNote(c.id(), text);
        assertThat(store.cases().find(c.id()).orElseThrow().symptom()).isEqualTo(text);
        assertThat(store.cases().caseFile(c.id()).orElseThrow().notes()).containsExactly(note);
        assertThat(note.text()).isEqualTo(text);
      }
      assertThat(store.units().findBoardModel("model \"x\"; 'QUOTED' — Ω")).contains(model);
      assertThat(store.units().bySerial("SN\"1\";'2' — µ")).containsExactly(unit);
      assertThat(
              store
                  .cases()
                  .search(SearchQuery.all().withStatus(CaseStatus.OPEN).withSerial(unit.serial())))
          .hasSize(texts.size());
    }
  }

  @Test
  void overlongText_isRefusedWithTheField() {
    try (HistoryStore store = SqliteHistory.open(folder.resolve("long.db"))) {
      BoardModel model = store.units().boardModel("M", "");
      assertThatThrownBy(() -> store.units().add("x".repeat(Checks.MAX_SHORT + 1), model.id(), ""))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("serial")
          .hasMessageContaining("too long");
    }
  }

  @Test
  void backupAndRestore_bringBackTheSavedHistory() throws Exception {
    Path file = folder.resolve("live.db");
    Path backup = folder.resolve("backup.db");
    try (HistoryStore store = SqliteHistory.open(file)) {
      BoardModel model = store.units().boardModel("PSU-30", "");
      Unit kept = store.units().add("KEPT", model.id(), "");
      store.cases().open(kept.id(), "before the backup");
      store.transfer().backupTo(backup);
      Unit later = store.units().add("LATER", model.id(), "");
      store.cases().open(later.id(), "after the backup");
      assertThatThrownBy(() -> store.transfer().backupTo(backup))
          .isInstanceOf(InvalidInputException.class);

      Path saved = store.transfer().restoreFrom(backup);
      assertThat(store.units().bySerial("LATER")).isEmpty();
      assertThat(store.units().bySerial("KEPT")).containsExactly(kept);
      assertThat(store.cases().search(SearchQuery.all().withText("backup")))
          .extracting(SearchHit::symptom)
          .containsExactly("before the backup");
      assertThat(store.transfer().integrityCheck()).isEqualTo("ok");
      // The history as it was before the restore is kept beside the file.
      try (HistoryStore before = SqliteHistory.open(saved)) {
        assertThat(before.units().bySerial("LATER")).hasSize(1);
      }
    }
  }

  @Test
  void restore_fromAFileThatIsNoHistory_changesNothing() throws Exception {
    Path file = folder.resolve("live.db");
    Path junk = folder.resolve("junk.db");
    Files.write(junk, "not a backup".getBytes(StandardCharsets.UTF_8));
    try (HistoryStore store = SqliteHistory.open(file)) {
      store.units().add("KEPT", store.units().boardModel("M", "").id(), "");
      assertThatThrownBy(() -> store.transfer().restoreFrom(junk))
          .isInstanceOf(StorageException.class);
      assertThat(store.units().bySerial("KEPT")).hasSize(1);
    }
  }

  @Test
  void everyEarlierSchemaVersion_hasAFixtureThatMigratesForward() throws Exception {
    for (int version = 1; version < SqliteHistory.latestSchemaVersion(); version++) {
      String name = "fixtures/schema-v" + version + ".db";
      Path copy = folder.resolve("schema-v" + version + ".db");
      try (InputStream in = FileSafetyTest.class.getResourceAsStream(name)) {
        assertThat(in).as("fixture %s (make it with FixtureMaker)", name).isNotNull();
        Files.copy(in, copy, StandardCopyOption.REPLACE_EXISTING);
      }
      try (HistoryStore store = SqliteHistory.open(copy)) {
        assertThat(store.schemaVersion()).isEqualTo(SqliteHistory.latestSchemaVersion());
        assertThat(store.transfer().integrityCheck()).isEqualTo("ok");
        Unit unit = store.units().bySerial("NF-8-0100").get(0);
        UnitHistory history = store.cases().unitHistory(unit.id()).orElseThrow();
        assertThat(history.cases()).hasSize(2);
        assertThat(history.cases().get(0).repairCase().confirmedFaults())
            .containsExactly("U3B:dead");
        assertThat(history.cases().get(0).notes())
            .extracting(CaseNote::text)
            .containsExactly(FixtureMaker.NOTE);
        if (version >= 3) {
          // Schema 4 rebuilt the reading table: every reading is still there, in arrival order,
          // with its values.
          assertThat(history.cases().get(0).readings())
              .extracting(
                  r ->
                      r.at()
                          + " "
                          + r.kind().word()
                          + " "
                          + r.value()
                          + (r.hz() == null ? "" : " at " + r.hz().intValue() + " Hz"))
              .containsExactlyElementsOf(FixtureMaker.READINGS);
          assertThat(history.cases().get(0).readings().get(1).uncertainty()).isEqualTo(0.001);
          assertThat(history.cases().get(0).readings()).allMatch(r -> r.to().isEmpty());
        }
        // Text search works on what was written before the index existed.
        assertThat(store.cases().search(SearchQuery.all().withText("distorts")))
            .extracting(SearchHit::symptom)
            .containsExactly(FixtureMaker.CLOSED_SYMPTOM);
        assertThat(store.cases().search(SearchQuery.all().withText("op-amp went"))).hasSize(1);
        assertThat(store.cases().search(SearchQuery.all().withPart("U3"))).hasSize(1);
        if (version >= 3) {
          // Readings stored before they could be struck out stand, last changed when taken.
          assertThat(history.cases().get(0).readings())
              .hasSize(2)
              .noneMatch(StoredReading::struck)
              .allMatch(r -> r.updatedAt().equals(r.takenAt()));
        }
        // Schema 6: the sheets stored before are the versions of their stage in the order they
        // were stored, saved when they were stored, by nobody named; each case names none.
        List<StageSheetRecord> versions =
            store.library().versions(unit.boardModelId(), FixtureMaker.SHEET_TITLE);
        List<String> texts = new java.util.ArrayList<>(FixtureMaker.SHEETS);
        if (version < 5) {
          texts = texts.subList(0, 1);
        }
        java.util.Collections.reverse(texts);
        assertThat(versions)
            .extracting(StageSheetRecord::sheetJson)
            .containsExactlyElementsOf(texts);
        assertThat(versions)
            .extracting(StageSheetRecord::version)
            .containsExactlyElementsOf(version < 5 ? List.of(1) : List.of(2, 1));
        assertThat(versions)
            .allMatch(v -> v.savedAt().equals(v.updatedAt()) && v.savedBy().isEmpty());
        assertThat(history.cases()).allMatch(c -> c.repairCase().stageSheetId() == null);
        if (version >= 3) {
          // Schema 7 added the AC measure: a reading stored before it is what it was then, a peak
          // (the only measure earlier versions had), and DC readings have none.
          assertThat(history.cases().get(0).readings())
              .extracting(StoredReading::measureWord)
              .containsExactly("", "peak");
        }
        // And the migrated file takes new writes, a new version of the stage among them.
        RepairCase opened = store.cases().open(unit.id(), "new after migration");
        StageSheetRecord next =
            store.library().useForCase(opened.id(), FixtureMaker.SHEET_TITLE, "{}", "Ann");
        assertThat(next.version()).isEqualTo(versions.size() + 1);
        // Schema 7: the cases of before have no photos, and the migrated file takes one, which
        // goes to the outbox for the shop server like any new record.
        assertThat(history.cases()).allMatch(c -> c.photos().isEmpty());
        byte[] png = com.stagewise.history.TestPictures.png(32, 24);
        com.stagewise.history.record.CasePhoto photo =
            store
                .cases()
                .attachPhoto(
                    opened.id(), new com.stagewise.history.Cases.PhotoDraft("top.png", png, "Ann"));
        assertThat(store.cases().photo(photo.id()).orElseThrow().image()).isEqualTo(png);
        assertThat(store.cases().caseFile(opened.id()).orElseThrow().photos())
            .containsExactly(photo);
        // Schema 8: no case of before has readings after a repair; the migrated file takes them,
        // apart from the readings of the fault.
        // (From the version-9 fixture on, its closed case has one: see schema 10 below.)
        assertThat(history.cases().subList(version >= 9 ? 1 : 0, 2))
            .allMatch(c -> c.afterRepair().isEmpty());
        var after =
            new com.stagewise.history.record.AfterRepairReading(
                com.stagewise.history.HistoryStore.newId(),
                opened.id(),
                "OUT",
                -4.7,
                "m",
                java.time.Instant.parse("2026-01-01T00:00:00Z"),
                -4.8,
                -4.6);
        store.cases().addAfterRepair(opened.id(), List.of(after));
        assertThat(store.cases().caseFile(opened.id()).orElseThrow().afterRepair())
            .containsExactly(after);
        assertThat(store.cases().caseFile(opened.id()).orElseThrow().readings()).isEmpty();
        // Schema 10: a reading after the repair stored by version 9 is what it was then, a DC
        // level with its band and nothing else; the migrated file takes AC and ohms ones.
        if (version >= 9) {
          String[] kept = FixtureMaker.AFTER_REPAIR.split(" ");
          assertThat(history.cases().get(0).afterRepair())
              .singleElement()
              .satisfies(
                  r -> {
                    assertThat(r.kind()).isEqualTo(ReadingKind.DC);
                    assertThat(r.at()).isEqualTo(kept[0]);
                    assertThat(r.value()).isEqualTo(Double.parseDouble(kept[1]));
                    assertThat(r.healthyLow()).isEqualTo(Double.parseDouble(kept[2]));
                    assertThat(r.healthyHigh()).isEqualTo(Double.parseDouble(kept[3]));
                    assertThat(r.measure()).isNull();
                    assertThat(r.hz()).isNull();
                    assertThat(r.to()).isEmpty();
                    assertThat(r.inside()).isTrue();
                  });
        }
        var acAfter =
            new com.stagewise.history.record.AfterRepairReading(
                com.stagewise.history.HistoryStore.newId(),
                opened.id(),
                "OUT",
                0.331,
                "scope",
                java.time.Instant.parse("2026-01-01T00:01:00Z"),
                0.32,
                0.345,
                ReadingKind.AC,
                "rms",
                1000.0,
                "");
        var ohmsAfter =
            new com.stagewise.history.record.AfterRepairReading(
                com.stagewise.history.HistoryStore.newId(),
                opened.id(),
                "SUM",
                Double.POSITIVE_INFINITY,
                "meter",
                java.time.Instant.parse("2026-01-01T00:02:00Z"),
                46_530.0,
                47_470.0,
                ReadingKind.OHMS,
                null,
                null,
                "OUT");
        store.cases().addAfterRepair(opened.id(), List.of(acAfter, ohmsAfter));
        assertThat(store.cases().caseFile(opened.id()).orElseThrow().afterRepair())
            .containsExactly(after, acAfter, ohmsAfter);
      }
      try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + copy);
          PreparedStatement q =
              c.prepareStatement("SELECT count(*) FROM outbox WHERE kind = 'photo'");
          java.sql.ResultSet rs = q.executeQuery()) {
        assertThat(rs.next()).isTrue();
        assertThat(rs.getInt(1)).isEqualTo(1);
      }
      try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + copy);
          PreparedStatement q =
              c.prepareStatement(
                  "SELECT count(*) FROM outbox WHERE kind = 'after-repair reading'");
          java.sql.ResultSet rs = q.executeQuery()) {
        assertThat(rs.next()).isTrue();
        // Each added once (the fixture's own of version 9, and the three added here); adding the
        // columns of version 10 sent nothing again.
        assertThat(rs.getInt(1)).isEqualTo(version >= 9 ? 4 : 3);
      }
      if (version >= 3) {
        // Numbering the stored sheets is no change to send to the shop server: each is in the
        // outbox once, as it was added.
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + copy);
            PreparedStatement q =
                c.prepareStatement(
                    "SELECT max(version) FROM outbox WHERE kind = 'stage sheet'"
                        + " AND id IN (SELECT id FROM stage_sheet WHERE saved_by = '')");
            java.sql.ResultSet rs = q.executeQuery()) {
          assertThat(rs.next()).isTrue();
          assertThat(rs.getInt(1)).isEqualTo(1);
        }
      }
      if (version >= 3) {
        // Filling in the new columns is no change to send to the shop server.
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + copy);
            PreparedStatement q =
                c.prepareStatement(
                    "SELECT count(*), max(version) FROM outbox WHERE kind = 'reading'");
            java.sql.ResultSet rs = q.executeQuery()) {
          assertThat(rs.next()).isTrue();
          assertThat(rs.getInt(1)).isEqualTo(2);
          assertThat(rs.getInt(2)).isEqualTo(1);
        }
      }
    }
  }

  private static boolean canCreate(Path folder) {
    try {
      Files.delete(Files.createTempFile(folder, "probe", ".tmp"));
      return true;
    } catch (Exception e) {
      return false;
    }
  }
}
