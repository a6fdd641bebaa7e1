package com.stagewise.casework;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.sqlite.SQLiteConfig;

/**
 * A checksum of every row of every table of a history file, read without writing to it, so that a
 * test can show that a refused command left the database exactly as it was.
 */
public final class HistoryDigest {
  private HistoryDigest() {}

  /** Returns, per table (by name), a SHA-256 of all its rows in rowid order. */
  public static Map<String, String> of(Path file) {
    return of(file, List.of());
  }

  /**
   * Returns the checksums of {@link #of(Path)} for every table except those named in {@code skip}.
   */
  public static Map<String, String> of(Path file, List<String> skip) {
    if (!Files.isRegularFile(file)) {
      throw new IllegalArgumentException("no history file at " + file);
    }
    SQLiteConfig config = new SQLiteConfig();
    config.setReadOnly(true);
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + file, config.toProperties())) {
      List<String> tables = new ArrayList<>();
      try (PreparedStatement s =
              c.prepareStatement(
                  "SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name");
          ResultSet rs = s.executeQuery()) {
        while (rs.next()) {
          tables.add(rs.getString(1));
        }
      }
      Map<String, String> digests = new LinkedHashMap<>();
      for (String table : tables) {
        if (!skip.contains(table)) {
          digests.put(table, digest(c, table));
        }
      }
      return digests;
    } catch (SQLException e) {
      throw new IllegalStateException("cannot read " + file + ": " + e.getMessage(), e);
    }
  }

  private static String digest(Connection c, String table) throws SQLException {
    MessageDigest sha;
    try {
      sha = MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
    // FTS tables have no plain rowid order worth relying on; every table is read in full either
    // way.
    try (PreparedStatement s = c.prepareStatement("SELECT * FROM \"" + table + "\"");
        ResultSet rs = s.executeQuery()) {
      int columns = rs.getMetaData().getColumnCount();
      List<String> rows = new ArrayList<>();
      while (rs.next()) {
        StringBuilder row = new StringBuilder();
        for (int i = 1; i <= columns; i++) {
          Object value = rs.getObject(i);
          row.append(value instanceof byte[] b ? java.util.HexFormat.of().formatHex(b) : value)
              .append('\u001f');
        }
        rows.add(row.toString());
      }
      // Sorted, so that the checksum says which rows a table holds, not the order SQLite reads
      // them.
      rows.sort(null);
      rows.forEach(r -> sha.update((r + '\u001e').getBytes(StandardCharsets.UTF_8)));
    }
    return java.util.HexFormat.of().formatHex(sha.digest()) + " (" + table + ")";
  }
}
