package com.stagewise.history.sqlite;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.StorageException;
import com.stagewise.history.UnitQuery;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Unit;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.time.Duration;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Database files that are not what they should be: each refusal is bad input (a {@link
 * StorageException}, exit 2 on the command line), comes at once, and leaves the file as it was. One
 * test per finding of the outside probe, named for what broke.
 */
class DatabaseFileTest {
  @TempDir Path folder;

  @Test
  void fifoAsDatabase_isRefusedAtOnceInsteadOfHanging() throws Exception {
    Path fifo = folder.resolve("pipe.db");
    Process mkfifo = new ProcessBuilder("mkfifo", fifo.toString()).start();
    assertThat(mkfifo.waitFor()).isZero();
    assertTimeoutPreemptively(
        Duration.ofSeconds(10),
        () ->
            assertThatThrownBy(() -> SqliteHistory.open(fifo))
                .isInstanceOf(StorageException.class)
                .hasMessageContaining("not a regular file"));
    assertTimeoutPreemptively(
        Duration.ofSeconds(10),
        () ->
            assertThatThrownBy(() -> SqliteHistory.openReadOnly(fifo))
                .isInstanceOf(StorageException.class)
                .hasMessageContaining("not a regular file"));
  }

  @Test
  void devNullAsDatabase_isRefusedAndLeavesNoStrayFile() throws Exception {
    Path link = folder.resolve("history.db");
    Files.createSymbolicLink(link, Path.of("/dev/null"));
    assertThatThrownBy(() -> SqliteHistory.open(link))
        .isInstanceOf(StorageException.class)
        .hasMessageContaining("not a regular file");
    assertThatThrownBy(() -> SqliteHistory.open(Path.of("/dev/null")))
        .isInstanceOf(StorageException.class);
    try (Stream<Path> files = Files.list(folder)) {
      assertThat(files.toList()).containsExactly(link);
    }
    for (String suffix : List.of("-wal", "-shm", "-journal")) {
      assertThat(Path.of("/dev/null" + suffix)).doesNotExist();
    }
  }

  @Test
  void newerSchemaInRollbackJournalMode_keepsItsHeaderByteForByte() throws Exception {
    Path file = folder.resolve("newer.db");
    SqliteHistory.open(file).close();
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + file)) {
      execute(c, "INSERT INTO schema_version VALUES (99, 0, 'V99__future.sql')");
      execute(c, "PRAGMA journal_mode = DELETE");
    }
    byte[] before = Files.readAllBytes(file);
    assertThat(before[18]).as("file format write version 1 = rollback journal").isEqualTo((byte) 1);
    assertThatThrownBy(() -> SqliteHistory.open(file))
        .isInstanceOf(StorageException.class)
        .hasMessageContaining("newer Stagewise")
        .hasMessageContaining("left as it is");
    assertThat(Files.readAllBytes(file)).isEqualTo(before);
    assertThat(folder.resolve("newer.db-wal")).doesNotExist();
  }

  @Test
  void damagedFile_refusesWritesAndStaysAsItIs() throws Exception {
    Path file = folder.resolve("damaged.db");
    try (HistoryStore store = SqliteHistory.open(file)) {
      BoardModel model = store.units().boardModel("PSU-30", "");
      for (int i = 0; i < 300; i++) {
        Unit unit = store.units().add("U-" + i, model.id(), "");
        store.cases().open(unit.id(), "fault number " + i + " ".repeat(50));
      }
    }
    byte[] bytes = Files.readAllBytes(file);
    int page = 4096;
    // Garbage over a few pages in the last third of the file (indexes and case rows), the kind
    // of damage a failing disk leaves: the first pages, and with them adding a unit, still work.
    // (The schema of version 9 fills more of the first pages than earlier versions did.)
    Random random = new Random(11);
    for (int p = bytes.length / page * 2 / 3; p < bytes.length / page; p += 3) {
      byte[] garbage = new byte[page];
      random.nextBytes(garbage);
      System.arraycopy(garbage, 0, bytes, p * page, page);
    }
    Files.write(file, bytes);
    assertThatThrownBy(
            () -> {
              try (HistoryStore store = SqliteHistory.open(file)) {
                store.units().boardModel("Another board", "");
              }
            })
        .isInstanceOf(StorageException.class)
        .hasMessageContaining("damaged")
        .hasMessageContaining("nothing is written");
    assertThat(Files.readAllBytes(file)).isEqualTo(bytes);
  }

  @Test
  void restoreFromAnEmptyFile_isRefusedAndChangesNothing() throws Exception {
    Path file = folder.resolve("live.db");
    Path empty = Files.createFile(folder.resolve("empty.db"));
    try (HistoryStore store = SqliteHistory.open(file)) {
      store.units().add("KEPT", store.units().boardModel("M", "").id(), "");
      assertThatThrownBy(() -> store.transfer().restoreFrom(empty))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("empty.db")
          .hasMessageContaining("empty");
      assertThat(store.units().bySerial("KEPT")).hasSize(1);
    }
    assertThat(Files.size(empty)).isZero();
    try (Stream<Path> files = Files.list(folder)) {
      assertThat(files.map(p -> p.getFileName().toString()).toList())
          .noneMatch(name -> name.contains("before-restore"));
    }
  }

  @Test
  void readOnlyHistory_canBeListedAndSearchedButNotWritten() throws Exception {
    Path file = folder.resolve("shop.db");
    try (HistoryStore store = SqliteHistory.open(file)) {
      Unit unit = store.units().add("NF-1", store.units().boardModel("MX-8", "").id(), "");
      store.cases().open(unit.id(), "hum on the left channel");
    }
    byte[] before = Files.readAllBytes(file);
    try (HistoryStore store = SqliteHistory.openReadOnly(file)) {
      assertThat(store.units().search(UnitQuery.serialLike("nf1"))).hasSize(1);
      assertThat(store.cases().search(SearchQuery.all().withText("hum"))).hasSize(1);
      assertThatThrownBy(() -> store.units().boardModel("Other", ""))
          .isInstanceOf(StorageException.class)
          .hasMessageContaining("reading only");
    }
    assertThat(Files.readAllBytes(file)).isEqualTo(before);
  }

  @Test
  void openReadOnly_missingFile_isRefusedAndCreatesNothing() {
    Path file = folder.resolve("missing.db");
    assertThatThrownBy(() -> SqliteHistory.openReadOnly(file))
        .isInstanceOf(StorageException.class)
        .hasMessageContaining("does not exist");
    assertThat(file).doesNotExist();
  }

  private static void execute(Connection c, String sql) throws Exception {
    try (PreparedStatement s = c.prepareStatement(sql)) {
      if (s.execute()) {
        try (ResultSet rs = s.getResultSet()) {
          rs.next();
        }
      }
    }
  }
}
