package com.stagewise.casework;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.RandomAccessFile;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/** Damages a history file as a disk fault would, for tests of what a write does then. */
public final class DamagedHistory {
  private DamagedHistory() {}

  /**
   * Overwrites the b-tree pages of the unit table and its indexes with bytes that are no b-tree
   * page, as a disk fault would; every other table stays readable.
   */
  public static void damageTheUnitTable(Path file) throws Exception {
    assertThat(file.resolveSibling(file.getFileName() + "-wal"))
        .as("the log is merged into the file when the last connection closes")
        .doesNotExist();
    List<Integer> pages = new ArrayList<>();
    int pageSize;
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + file);
        Statement s = c.createStatement()) {
      try (ResultSet rs = s.executeQuery("PRAGMA page_size")) {
        rs.next();
        pageSize = rs.getInt(1);
      }
      try (ResultSet rs =
          // Triggers on the table have no page of their own (root page 0).
          s.executeQuery(
              "SELECT rootpage FROM sqlite_master WHERE tbl_name = 'unit' AND rootpage > 0")) {
        while (rs.next()) {
          pages.add(rs.getInt(1));
        }
      }
    }
    assertThat(pages).isNotEmpty();
    byte[] garbage = new byte[pageSize];
    Arrays.fill(garbage, (byte) 0x5a);
    try (RandomAccessFile raf = new RandomAccessFile(file.toFile(), "rw")) {
      for (int page : pages) {
        raf.seek((long) (page - 1) * pageSize);
        raf.write(garbage);
      }
    }
  }
}
