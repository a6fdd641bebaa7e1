package com.stagewise.cli.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import com.stagewise.cli.ExitCode;
import com.stagewise.cli.history.HistorySubcommandsTest.Run;
import com.stagewise.history.sqlite.SqliteHistory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.time.Duration;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Database files that are not what they should be, through the command line: each is bad input
 * (exit 2 with a message, no stack trace), answered at once, and the file is left as it was.
 */
class DatabaseFileCommandTest {
  @TempDir Path folder;

  @Test
  void fifoAsDatabase_exitsTwoAtOnceInsteadOfHanging() throws Exception {
    Path fifo = folder.resolve("pipe.db");
    assertThat(new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor()).isZero();
    Run run =
        assertTimeoutPreemptively(
            Duration.ofSeconds(20), () -> HistorySubcommandsTest.history(fifo, "units"));
    assertBadInput(run, "not a regular file");
    Run write =
        assertTimeoutPreemptively(
            Duration.ofSeconds(20),
            () ->
                HistorySubcommandsTest.history(fifo, "add-unit", "--serial", "A1", "--model", "M"));
    assertBadInput(write, "not a regular file");
  }

  @Test
  void devNullAsDatabase_exitsTwoAndLeavesNoStrayFile() throws Exception {
    Path link = Files.createSymbolicLink(folder.resolve("h.db"), Path.of("/dev/null"));
    assertBadInput(
        HistorySubcommandsTest.history(link, "add-unit", "--serial", "A1", "--model", "M"),
        "not a regular file");
    try (Stream<Path> files = Files.list(folder)) {
      assertThat(files.toList()).containsExactly(link);
    }
  }

  @Test
  void newerSchemaFile_exitsTwoAndKeepsItsHeader() throws Exception {
    Path file = folder.resolve("newer.db");
    SqliteHistory.open(file).close();
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + file)) {
      try (PreparedStatement s =
          c.prepareStatement("INSERT INTO schema_version VALUES (99, 0, 'V99__future.sql')")) {
        s.execute();
      }
      try (PreparedStatement s = c.prepareStatement("PRAGMA journal_mode = DELETE")) {
        s.execute();
      }
    }
    byte[] before = Files.readAllBytes(file);
    assertBadInput(
        HistorySubcommandsTest.history(file, "add-unit", "--serial", "A1", "--model", "M"),
        "newer Stagewise");
    assertBadInput(HistorySubcommandsTest.history(file, "units"), "newer Stagewise");
    assertThat(Files.readAllBytes(file)).isEqualTo(before);
  }

  @Test
  void restoreFromAnEmptyFile_exitsTwoAndChangesNothing() throws Exception {
    Path file = folder.resolve("live.db");
    Path empty = Files.createFile(folder.resolve("empty.db"));
    assertThat(
            HistorySubcommandsTest.history(file, "add-unit", "--serial", "A1", "--model", "M")
                .code())
        .isEqualTo(ExitCode.OK);
    assertBadInput(
        HistorySubcommandsTest.history(file, "restore", "--from", empty.toString()), "empty");
    assertThat(Files.size(empty)).isZero();
    assertThat(HistorySubcommandsTest.history(file, "units").out()).contains("A1");
  }

  @Test
  void readOnlyHistory_canBeListedAndSearched() throws Exception {
    Path file = folder.resolve("shop.db");
    assertThat(
            HistorySubcommandsTest.history(file, "add-unit", "--serial", "NF-1", "--model", "MX-8")
                .code())
        .isEqualTo(ExitCode.OK);
    Files.setPosixFilePermissions(file, PosixFilePermissions.fromString("r--r--r--"));
    byte[] before = Files.readAllBytes(file);
    Run units = HistorySubcommandsTest.history(file, "units");
    assertThat(units.code()).as(units.err()).isEqualTo(ExitCode.OK);
    assertThat(units.out()).contains("NF-1");
    Run search = HistorySubcommandsTest.history(file, "search", "--serial", "NF-1");
    assertThat(search.code()).as(search.err()).isEqualTo(ExitCode.OK);
    assertThat(Files.readAllBytes(file)).isEqualTo(before);
  }

  @Test
  void listingAMissingHistory_exitsTwoAndCreatesNoFile() {
    Path file = folder.resolve("missing.db");
    assertBadInput(HistorySubcommandsTest.history(file, "units"), "does not exist");
    assertThat(file).doesNotExist();
  }

  private static void assertBadInput(Run run, String expected) {
    assertThat(run.code()).as(run.out() + run.err()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.err()).contains(expected).doesNotContain("Exception", "\tat ");
  }
}
