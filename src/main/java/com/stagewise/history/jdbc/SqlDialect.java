package com.stagewise.history.jdbc;

/**
 * The few phrases in which the two stores' SQL differs: the bench's SQLite file and the shop's
 * PostgreSQL server run the same queries otherwise.
 */
public enum SqlDialect {
  /** The bench's embedded file (SQLite). */
  SQLITE,
  /** The shop server (PostgreSQL). */
  POSTGRES;

  /** A condition that {@code column} equals the next parameter, ignoring ASCII case. */
  public String caselessEquals(String column) {
    return this == SQLITE ? column + " = ? COLLATE NOCASE" : "lower(" + column + ") = lower(?)";
  }

  /** An ORDER BY term that sorts {@code column} ignoring case, the same on every machine. */
  public String caselessOrder(String column) {
    return this == SQLITE ? column + " COLLATE NOCASE" : "lower(" + column + ") COLLATE \"C\"";
  }

  /**
   * An ORDER BY term that sorts {@code column} by its characters' codes, not by the server's locale
   * (SQLite always does; PostgreSQL needs the C collation).
   */
  public String binaryOrder(String column) {
    return this == SQLITE ? column : column + " COLLATE \"C\"";
  }

  /**
   * The column that keeps the order in which rows were added: SQLite's {@code rowid} or a table's
   * own {@code row} column (name it as SQLite spells it, with its table alias if any); the server's
   * {@code row_no} in both cases.
   */
  public String insertionOrder(String sqliteColumn) {
    int dot = sqliteColumn.lastIndexOf('.');
    return this == SQLITE ? sqliteColumn : sqliteColumn.substring(0, dot + 1) + "row_no";
  }

  /** An insert that does nothing when the row's key is there already. */
  public String insertOrIgnore(String intoTableColumnsAndValues) {
    return this == SQLITE
        ? "INSERT OR IGNORE INTO " + intoTableColumnsAndValues
        : "INSERT INTO " + intoTableColumnsAndValues + " ON CONFLICT DO NOTHING";
  }

  /** The confirmed faults of case {@code c}, in their order, joined by single spaces. */
  String confirmedFaults() {
    return this == SQLITE
        ? "(SELECT group_concat(fault_id, ' ') FROM (SELECT fault_id FROM confirmed_fault f"
            + " WHERE f.case_id = c.id ORDER BY position))"
        : "(SELECT string_agg(fault_id, ' ' ORDER BY position) FROM confirmed_fault f"
            + " WHERE f.case_id = c.id)";
  }

  /**
   * {@code column} (a text) without blanks, tabs, dashes, underscores or slashes, in ASCII upper
   * case: a unit's serial as {@code UnitQuery.normal} compares it.
   */
  String normalSerial(String column) {
    return this == SQLITE
        ? "upper(replace(replace(replace(replace(replace("
            + column
            + ", ' ', ''), char(9), ''), '-', ''), '_', ''), '/', ''))"
        : "upper(translate(" + column + ", ' ' || chr(9) || '-_/', ''))";
  }

  /** A condition that the text {@code haystack} holds the next parameter. */
  String contains(String haystack) {
    return this == SQLITE ? "instr(" + haystack + ", ?) > 0" : "strpos(" + haystack + ", ?) > 0";
  }
}
