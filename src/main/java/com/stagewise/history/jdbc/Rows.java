package com.stagewise.history.jdbc;

import com.stagewise.history.Checks;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Types;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Reads and writes the history's records as table rows, with prepared statements only.
 *
 * <p>An instance lives for one transaction and keeps each statement prepared once.
 */
public final class Rows implements AutoCloseable {
  private final Connection connection;
  private final SqlDialect dialect;
  private final Map<String, PreparedStatement> prepared = new HashMap<>();

  /** Reads and writes rows on {@code connection}, in the SQL of {@code dialect}. */
  public Rows(Connection connection, SqlDialect dialect) {
    this.connection = connection;
    this.dialect = dialect;
  }

  /** Returns the SQL dialect of the store these rows are in. */
  public SqlDialect dialect() {
    return dialect;
  }

  /** Returns the statement for {@code sql}, prepared once per transaction. */
  public PreparedStatement statement(String sql) throws SQLException {
    PreparedStatement statement = prepared.get(sql);
    if (statement == null) {
      statement = connection.prepareStatement(sql);
      prepared.put(sql, statement);
    }
    statement.clearParameters();
    return statement;
  }

  /** Runs a query with {@code parameters} and maps every row. */
  public <T> List<T> query(String sql, RowMapper<T> mapper, Object... parameters)
      throws SQLException {
    PreparedStatement statement = statement(sql);
    bind(statement, parameters);
    List<T> rows = new ArrayList<>();
    try (ResultSet rs = statement.executeQuery()) {
      while (rs.next()) {
        rows.add(mapper.map(rs));
      }
    }
    return rows;
  }

  public <T> Optional<T> first(String sql, RowMapper<T> mapper, Object... parameters)
      throws SQLException {
    List<T> rows = query(sql, mapper, parameters);
    return rows.isEmpty() ? Optional.empty() : Optional.of(rows.get(0));
  }

  public int update(String sql, Object... parameters) throws SQLException {
    PreparedStatement statement = statement(sql);
    bind(statement, parameters);
    return statement.executeUpdate();
  }

  public static void bind(PreparedStatement statement, Object... parameters) throws SQLException {
    for (int i = 0; i < parameters.length; i++) {
      Object value = parameters[i];
      if (value == null) {
        statement.setNull(i + 1, Types.NULL);
      } else if (value instanceof String s) {
        statement.setString(i + 1, s);
      } else if (value instanceof Instant t) {
        statement.setLong(i + 1, t.toEpochMilli());
      } else if (value instanceof Integer n) {
        statement.setInt(i + 1, n);
      } else if (value instanceof Long n) {
        statement.setLong(i + 1, n);
      } else if (value instanceof Double d) {
        statement.setDouble(i + 1, d);
      } else if (value instanceof byte[] bytes) {
        statement.setBytes(i + 1, bytes);
      } else {
        throw new IllegalArgumentException("cannot bind " + value.getClass());
      }
    }
  }

  /** Maps one result row to a value. */
  @FunctionalInterface
  public interface RowMapper<T> {
    T map(ResultSet rs) throws SQLException;
  }

  /** Returns the suspect lists selected by {@code where} (with its parameters), with suspects. */
  public List<SuspectListRecord> suspectLists(String where, Object... parameters)
      throws SQLException {
    record Head(
        String id, String caseId, Instant at, String version, String verdict, String next) {}
    List<Head> heads =
        query(
            Records.SUSPECT_LIST + " " + where,
            rs ->
                new Head(
                    rs.getString(1),
                    rs.getString(2),
                    Records.time(rs, 3),
                    rs.getString(4),
                    rs.getString(5),
                    rs.getString(6)),
            parameters);
    List<SuspectListRecord> lists = new ArrayList<>(heads.size());
    for (Head head : heads) {
      List<StoredSuspect> suspects =
          query(
              "SELECT fault_id, probability, fault_group, why, rank FROM suspect"
                  + " WHERE suspect_list_id = ? ORDER BY rank",
              rs ->
                  new StoredSuspect(
                      rs.getString(1),
                      rs.getDouble(2),
                      Records.words(rs.getString(3)),
                      rs.getString(4),
                      rs.getInt(5)),
              head.id());
      lists.add(
          new SuspectListRecord(
              head.id(),
              head.caseId(),
              head.at(),
              head.version(),
              head.verdict(),
              suspects,
              head.next()));
    }
    return lists;
  }

  // ---- writing records ------------------------------------------------------------------------
  // tryInsert adds a record unless one with its id is there already (then it returns false and
  // changes nothing); insert expects a new id.

  public <T> void insert(T record) throws SQLException {
    boolean inserted;
    if (record instanceof BoardModel m) {
      inserted = tryInsert(m);
    } else if (record instanceof StageSheetRecord s) {
      inserted = tryInsert(s);
    } else if (record instanceof Unit u) {
      inserted = tryInsert(u);
    } else if (record instanceof RepairCase c) {
      inserted = tryInsert(c);
    } else if (record instanceof StoredReading r) {
      inserted = tryInsert(r);
    } else if (record instanceof SuspectListRecord l) {
      inserted = tryInsert(l);
    } else if (record instanceof RepairAction a) {
      inserted = tryInsert(a);
    } else if (record instanceof CaseNote n) {
      inserted = tryInsert(n);
    } else if (record instanceof StoredPhoto p) {
      inserted = CaseExtraRows.tryInsert(this, p);
    } else if (record instanceof AfterRepairReading r) {
      inserted = CaseExtraRows.tryInsert(this, r);
    } else {
      throw new IllegalArgumentException("not a history record: " + record.getClass());
    }
    if (!inserted) {
      throw new IllegalStateException("a record with this id exists already");
    }
  }

  public boolean tryInsert(BoardModel m) throws SQLException {
    int inserted =
        update(
            "INSERT INTO board_model (id, name, maker, notes, updated_at) VALUES (?, ?, ?, ?, ?) ON CONFLICT (id) DO NOTHING",
            m.id(),
            m.name(),
            m.maker(),
            m.notes(),
            m.updatedAt());
    return inserted == 1;
  }

  public void replace(BoardModel m) throws SQLException {
    update(
        "UPDATE board_model SET name = ?, maker = ?, notes = ?, updated_at = ? WHERE id = ?",
        m.name(),
        m.maker(),
        m.notes(),
        m.updatedAt(),
        m.id());
  }

  public boolean tryInsert(StageSheetRecord s) throws SQLException {
    int inserted =
        update(
            "INSERT INTO stage_sheet (id, board_model_id, title, sheet_json, updated_at, version,"
                + " saved_by, saved_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?) ON CONFLICT (id) DO NOTHING",
            s.id(),
            s.boardModelId(),
            s.title(),
            s.sheetJson(),
            s.updatedAt(),
            s.version(),
            s.savedBy(),
            s.savedAt());
    return inserted == 1;
  }

  public void replace(StageSheetRecord s) throws SQLException {
    update(
        "UPDATE stage_sheet SET board_model_id = ?, title = ?, sheet_json = ?, updated_at = ?,"
            + " version = ?, saved_by = ?, saved_at = ? WHERE id = ?",
        s.boardModelId(),
        s.title(),
        s.sheetJson(),
        s.updatedAt(),
        s.version(),
        s.savedBy(),
        s.savedAt(),
        s.id());
  }

  public boolean tryInsert(Unit u) throws SQLException {
    int inserted =
        update(
            "INSERT INTO unit (id, serial, board_model_id, owner, updated_at) VALUES (?, ?, ?, ?, ?) ON CONFLICT (id) DO NOTHING",
            u.id(),
            u.serial(),
            u.boardModelId(),
            u.owner(),
            u.updatedAt());
    return inserted == 1;
  }

  public void replace(Unit u) throws SQLException {
    update(
        "UPDATE unit SET serial = ?, board_model_id = ?, owner = ?, updated_at = ? WHERE id = ?",
        u.serial(),
        u.boardModelId(),
        u.owner(),
        u.updatedAt(),
        u.id());
  }

  public boolean tryInsert(RepairCase c) throws SQLException {
    int inserted =
        update(
            "INSERT INTO repair_case (id, unit_id, opened_at, symptom, status, closed_at, outcome,"
                + " updated_at, stage_sheet_id) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)"
                + " ON CONFLICT (id) DO NOTHING",
            c.id(),
            c.unitId(),
            c.openedAt(),
            c.symptom(),
            c.status().word(),
            c.closedAt(),
            c.outcome() == null ? null : c.outcome().word(),
            c.updatedAt(),
            c.stageSheetId());
    if (inserted == 1) {
      writeFaults(c);
    }
    return inserted == 1;
  }

  public void replace(RepairCase c) throws SQLException {
    update(
        "UPDATE repair_case SET unit_id = ?, opened_at = ?, symptom = ?, status = ?,"
            + " closed_at = ?, outcome = ?, updated_at = ?, stage_sheet_id = ? WHERE id = ?",
        c.unitId(),
        c.openedAt(),
        c.symptom(),
        c.status().word(),
        c.closedAt(),
        c.outcome() == null ? null : c.outcome().word(),
        c.updatedAt(),
        c.stageSheetId(),
        c.id());
    update("DELETE FROM confirmed_fault WHERE case_id = ?", c.id());
    writeFaults(c);
  }

  private void writeFaults(RepairCase c) throws SQLException {
    int position = 0;
    for (String fault : new LinkedHashSet<>(c.confirmedFaults())) {
      update(
          "INSERT INTO confirmed_fault (case_id, position, fault_id) VALUES (?, ?, ?)",
          c.id(),
          position++,
          fault);
    }
  }

  public boolean tryInsert(StoredReading r) throws SQLException {
    int inserted =
        update(
            "INSERT INTO reading (id, case_id, at, kind, value, hz, uncertainty, meter, taken_at,"
                + " to_point, struck_at, updated_at, measure)"
                + " VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)"
                + " ON CONFLICT (id) DO NOTHING",
            r.id(),
            r.caseId(),
            r.at(),
            r.kind().word(),
            r.value(),
            r.hz(),
            r.uncertainty(),
            r.meterText(),
            r.takenAt(),
            r.to(),
            r.struckAt(),
            r.updatedAt(),
            r.measure());
    return inserted == 1;
  }

  /** Replaces whether a stored reading is struck out, and when that last changed. */
  public void replaceStrike(StoredReading r) throws SQLException {
    update(
        "UPDATE reading SET struck_at = ?, updated_at = ? WHERE id = ?",
        r.struckAt(),
        r.updatedAt(),
        r.id());
  }

  public boolean tryInsert(SuspectListRecord list) throws SQLException {
    int inserted =
        update(
            "INSERT INTO suspect_list (id, case_id, computed_at, program_version, verdict,"
                + " next_probes) VALUES (?, ?, ?, ?, ?, ?) ON CONFLICT (id) DO NOTHING",
            list.id(),
            list.caseId(),
            list.computedAt(),
            list.programVersion(),
            list.verdict(),
            list.nextProbes());
    if (inserted == 0) {
      return false;
    }
    for (StoredSuspect s : list.suspects()) {
      update(
          "INSERT INTO suspect (suspect_list_id, rank, fault_id, probability, fault_group, why)"
              + " VALUES (?, ?, ?, ?, ?, ?)",
          list.id(),
          s.rank(),
          s.fault(),
          s.probability(),
          String.join(" ", s.group()),
          s.why());
    }
    return true;
  }

  public boolean tryInsert(RepairAction a) throws SQLException {
    int inserted =
        update(
            "INSERT INTO repair_action (id, case_id, at, kind, part, old_value, new_value, text,"
                + " updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?) ON CONFLICT (id) DO NOTHING",
            a.id(),
            a.caseId(),
            a.at(),
            a.kind().word(),
            a.part(),
            a.oldValue(),
            a.newValue(),
            a.text(),
            a.updatedAt());
    return inserted == 1;
  }

  public void replace(RepairAction a) throws SQLException {
    update(
        "UPDATE repair_action SET case_id = ?, at = ?, kind = ?, part = ?, old_value = ?,"
            + " new_value = ?, text = ?, updated_at = ? WHERE id = ?",
        a.caseId(),
        a.at(),
        a.kind().word(),
        a.part(),
        a.oldValue(),
        a.newValue(),
        a.text(),
        a.updatedAt(),
        a.id());
  }

  public boolean tryInsert(CaseNote n) throws SQLException {
    int inserted =
        update(
            "INSERT INTO case_note (id, case_id, at, text, updated_at) VALUES (?, ?, ?, ?, ?) ON CONFLICT (id) DO NOTHING",
            n.id(),
            n.caseId(),
            n.at(),
            n.text(),
            n.updatedAt());
    return inserted == 1;
  }

  public void replace(CaseNote n) throws SQLException {
    update(
        "UPDATE case_note SET case_id = ?, at = ?, text = ?, updated_at = ? WHERE id = ?",
        n.caseId(),
        n.at(),
        n.text(),
        n.updatedAt(),
        n.id());
  }

  /**
   * Rebuilds the part designators that search finds case {@code caseId} by, from its confirmed
   * faults and its actions.
   */
  public void indexParts(String caseId) throws SQLException {
    update("DELETE FROM case_part WHERE case_id = ?", caseId);
    Set<String> parts = new LinkedHashSet<>();
    for (String fault :
        query(
            "SELECT fault_id FROM confirmed_fault WHERE case_id = ?",
            rs -> rs.getString(1),
            caseId)) {
      parts.addAll(Checks.parts(fault));
    }
    for (String part :
        query("SELECT part FROM repair_action WHERE case_id = ?", rs -> rs.getString(1), caseId)) {
      parts.addAll(Checks.parts(part));
    }
    for (String part : parts) {
      update(dialect.insertOrIgnore("case_part (case_id, part) VALUES (?, ?)"), caseId, part);
    }
  }

  @Override
  public void close() throws SQLException {
    SQLException first = null;
    for (PreparedStatement statement : prepared.values()) {
      try {
        statement.close();
      } catch (SQLException e) {
        first = first == null ? e : first;
      }
    }
    prepared.clear();
    if (first != null) {
      throw first;
    }
  }
}
