package com.stagewise.history.sqlite;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.Checks;
import com.stagewise.history.ImportReport;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Merges a bundle into the history inside the caller's write transaction.
 *
 * <p>First the whole bundle is checked (ids, text limits, fault ids, and that every reference
 * points at a record of the right kind in the bundle or here); any problem throws before anything
 * is written, and the caller's transaction rolls back whatever was written before a later failure.
 * Then records are merged by id, parents first.
 */
final class Importer {
  private static final String BOARD_MODEL = "board model";
  private static final String STAGE_SHEET = "stage sheet";
  private static final String UNIT = "unit";
  private static final String CASE = "case";
  private static final String READING = "reading";
  private static final String SUSPECT_LIST = "suspect list";
  private static final String ACTION = "action";
  private static final String NOTE = "note";

  /** The local table of each kind of record that others refer to. */
  private static final Map<String, String> PARENT_TABLES =
      Map.of(BOARD_MODEL, "board_model", UNIT, "unit", CASE, "repair_case");

  private final Connection connection;
  private final String source;
  private final Map<String, String> bundleKinds = new HashMap<>();
  private final Map<String, String> bundleFields = new HashMap<>();
  private final Map<String, String> remapped = new HashMap<>();
  private final Set<String> touchedCases = new LinkedHashSet<>();
  private final List<String> matched = new ArrayList<>();
  private final List<ImportReport.Conflict> conflicts = new ArrayList<>();
  private int added;
  private int updated;
  private int unchanged;

  Importer(Connection connection, String source) {
    this.connection = connection;
    this.source = source;
  }

  ImportReport run(HistoryBundle bundle) throws SQLException {
    if (bundle.version() > HistoryBundle.CURRENT_VERSION || bundle.version() < 1) {
      throw new InvalidInputException(
          source,
          "version",
          "bundle format version "
              + bundle.version()
              + " is not supported (this program reads versions 1 to "
              + HistoryBundle.CURRENT_VERSION
              + "); use a newer Stagewise");
    }
    try (Rows rows = new Rows(connection)) {
      check(bundle, rows);
      merge(bundle, rows);
    }
    return new ImportReport(added, updated, unchanged, matched, conflicts);
  }

  // ---- checks -----------------------------------------------------------------------------------

  private void check(HistoryBundle b, Rows rows) throws SQLException {
    for (int i = 0; i < b.boardModels().size(); i++) {
      BoardModel m = b.boardModels().get(i);
      String at = "boardModels[" + i + "]";
      declare(at, m.id(), BOARD_MODEL);
      Checks.shortText(source, at + ".name", m.name(), true);
      Checks.shortText(source, at + ".maker", m.maker(), false);
      Checks.text(source, at + ".notes", m.notes(), Checks.MAX_TEXT);
    }
    for (int i = 0; i < b.units().size(); i++) {
      Unit u = b.units().get(i);
      String at = "units[" + i + "]";
      declare(at, u.id(), UNIT);
      Checks.shortText(source, at + ".serial", u.serial(), true);
      Checks.shortText(source, at + ".owner", u.owner(), false);
    }
    for (int i = 0; i < b.cases().size(); i++) {
      RepairCase c = b.cases().get(i);
      String at = "cases[" + i + "]";
      declare(at, c.id(), CASE);
      Checks.text(source, at + ".symptom", c.symptom(), Checks.MAX_TEXT);
      Checks.list(source, at + ".confirmedFaults", c.confirmedFaults());
      for (String fault : c.confirmedFaults()) {
        Checks.faultId(source, at + ".confirmedFaults", fault);
      }
      boolean closed = c.status() == CaseStatus.CLOSED;
      if (closed != (c.closedAt() != null) || closed != (c.outcome() != null)) {
        throw new InvalidInputException(
            source, at, "a closed case needs closedAt and outcome, an open case has neither");
      }
    }
    for (int i = 0; i < b.stageSheets().size(); i++) {
      StageSheetRecord s = b.stageSheets().get(i);
      String at = "stageSheets[" + i + "]";
      declare(at, s.id(), STAGE_SHEET);
      Checks.shortText(source, at + ".title", s.title(), false);
      Checks.text(source, at + ".sheet", s.sheetJson(), Checks.MAX_SHEET);
    }
    for (int i = 0; i < b.readings().size(); i++) {
      StoredReading r = b.readings().get(i);
      String at = "readings[" + i + "]";
      declare(at, r.id(), READING);
      Checks.reading(source, at, r);
    }
    for (int i = 0; i < b.suspectLists().size(); i++) {
      SuspectListRecord s = b.suspectLists().get(i);
      String at = "suspectLists[" + i + "]";
      declare(at, s.id(), SUSPECT_LIST);
      Checks.suspectList(source, at, s);
    }
    for (int i = 0; i < b.actions().size(); i++) {
      RepairAction a = b.actions().get(i);
      String at = "actions[" + i + "]";
      declare(at, a.id(), ACTION);
      Checks.shortText(source, at + ".part", a.part(), false);
      Checks.shortText(source, at + ".oldValue", a.oldValue(), false);
      Checks.shortText(source, at + ".newValue", a.newValue(), false);
      Checks.text(source, at + ".text", a.text(), Checks.MAX_TEXT);
    }
    for (int i = 0; i < b.notes().size(); i++) {
      CaseNote n = b.notes().get(i);
      String at = "notes[" + i + "]";
      declare(at, n.id(), NOTE);
      Checks.text(source, at + ".text", n.text(), Checks.MAX_TEXT);
    }
    // References, once every id in the bundle is known.
    for (int i = 0; i < b.stageSheets().size(); i++) {
      refer(
          rows,
          "stageSheets[" + i + "].boardModelId",
          b.stageSheets().get(i).boardModelId(),
          BOARD_MODEL);
    }
    for (int i = 0; i < b.units().size(); i++) {
      refer(rows, "units[" + i + "].boardModelId", b.units().get(i).boardModelId(), BOARD_MODEL);
    }
    for (int i = 0; i < b.cases().size(); i++) {
      refer(rows, "cases[" + i + "].unitId", b.cases().get(i).unitId(), UNIT);
    }
    for (int i = 0; i < b.readings().size(); i++) {
      refer(rows, "readings[" + i + "].caseId", b.readings().get(i).caseId(), CASE);
    }
    for (int i = 0; i < b.suspectLists().size(); i++) {
      refer(rows, "suspectLists[" + i + "].caseId", b.suspectLists().get(i).caseId(), CASE);
    }
    for (int i = 0; i < b.actions().size(); i++) {
      refer(rows, "actions[" + i + "].caseId", b.actions().get(i).caseId(), CASE);
    }
    for (int i = 0; i < b.notes().size(); i++) {
      refer(rows, "notes[" + i + "].caseId", b.notes().get(i).caseId(), CASE);
    }
    // A parent record whose id is already used here by a record of another kind.
    for (String kind : PARENT_TABLES.keySet()) {
      for (Map.Entry<String, String> entry : bundleKinds.entrySet()) {
        if (!entry.getValue().equals(kind)) {
          continue;
        }
        Optional<String> other = localKind(rows, entry.getKey(), kind);
        if (other.isPresent()) {
          throw new InvalidInputException(
              source,
              bundleFields.get(entry.getKey()) + ".id",
              "id " + entry.getKey() + " is a " + other.get() + " in this history, not a " + kind);
        }
      }
    }
  }

  private void declare(String at, String id, String kind) {
    Checks.id(source, at + ".id", id);
    String earlier = bundleFields.putIfAbsent(id, at);
    if (earlier != null) {
      throw new InvalidInputException(
          source,
          at + ".id",
          "id " + id + " appears twice in the bundle (also at " + earlier + ")");
    }
    bundleKinds.put(id, kind);
  }

  private void refer(Rows rows, String field, String id, String kind) throws SQLException {
    Checks.id(source, field, id);
    String inBundle = bundleKinds.get(id);
    if (inBundle != null) {
      if (!inBundle.equals(kind)) {
        throw new InvalidInputException(
            source,
            field,
            "expected the id of a "
                + kind
                + ", but "
                + id
                + " is a "
                + inBundle
                + " in the bundle ("
                + bundleFields.get(id)
                + ")");
      }
      return;
    }
    if (rows.first("SELECT 1 FROM " + PARENT_TABLES.get(kind) + " WHERE id = ?", rs -> 1, id)
        .isPresent()) {
      return;
    }
    Optional<String> other = localKind(rows, id, kind);
    throw new InvalidInputException(
        source,
        field,
        other.isPresent()
            ? "expected the id of a "
                + kind
                + ", but "
                + id
                + " is a "
                + other.get()
                + " in this history"
            : "no " + kind + " with id " + id + " in the bundle or in this history");
  }

  private static Optional<String> localKind(Rows rows, String id, String except)
      throws SQLException {
    for (Map.Entry<String, String> table : PARENT_TABLES.entrySet()) {
      if (!table.getKey().equals(except)
          && rows.first("SELECT 1 FROM " + table.getValue() + " WHERE id = ?", rs -> 1, id)
              .isPresent()) {
        return Optional.of(table.getKey());
      }
    }
    return Optional.empty();
  }

  // ---- merge ------------------------------------------------------------------------------------

  private void merge(HistoryBundle b, Rows rows) throws SQLException {
    for (BoardModel m : b.boardModels()) {
      Optional<BoardModel> local =
          rows.first(Rows.BOARD_MODEL + " WHERE id = ?", Rows::boardModel, m.id());
      if (local.isEmpty()) {
        Optional<BoardModel> sameName =
            rows.first(
                Rows.BOARD_MODEL + " WHERE name = ? COLLATE NOCASE", Rows::boardModel, m.name());
        if (sameName.isPresent()) {
          remapped.put(m.id(), sameName.get().id());
          matched.add("board model '" + m.name() + "' matched the local one of that name");
          unchanged++;
          continue;
        }
        rows.insert(m);
        added++;
        continue;
      }
      Optional<BoardModel> clash =
          rows.first(
              Rows.BOARD_MODEL + " WHERE name = ? COLLATE NOCASE AND id <> ?",
              Rows::boardModel,
              m.name(),
              m.id());
      if (clash.isPresent()) {
        conflict(
            BOARD_MODEL,
            m.id(),
            "its new name '"
                + m.name()
                + "' is taken here by another board model; kept the local copy");
        continue;
      }
      settle(
          BOARD_MODEL,
          m.id(),
          m,
          local.get(),
          m.updatedAt(),
          local.get().updatedAt(),
          () -> rows.replace(m));
    }
    for (StageSheetRecord s0 : b.stageSheets()) {
      StageSheetRecord s =
          new StageSheetRecord(
              s0.id(), mapped(s0.boardModelId()), s0.title(), s0.sheetJson(), s0.updatedAt());
      // New records are the common case: try the insert first, and look at the local copy only
      // when there is one.
      if (rows.tryInsert(s)) {
        added++;
      } else {
        Optional<StageSheetRecord> local =
            rows.first(Rows.STAGE_SHEET + " WHERE id = ?", Rows::stageSheet, s.id());
        settle(
            STAGE_SHEET,
            s.id(),
            s,
            local.get(),
            s.updatedAt(),
            local.get().updatedAt(),
            () -> rows.replace(s));
      }
    }
    for (Unit u0 : b.units()) {
      Unit u =
          new Unit(u0.id(), u0.serial(), mapped(u0.boardModelId()), u0.owner(), u0.updatedAt());
      Optional<Unit> local = rows.first(Rows.UNIT + " WHERE id = ?", Rows::unit, u.id());
      Optional<Unit> sameSerial =
          rows.first(
              Rows.UNIT + " WHERE board_model_id = ? AND serial = ? AND id <> ?",
              Rows::unit,
              u.boardModelId(),
              u.serial(),
              u.id());
      if (local.isEmpty()) {
        if (sameSerial.isPresent()) {
          remapped.put(u.id(), sameSerial.get().id());
          matched.add("unit '" + u.serial() + "' matched the local unit with that serial");
          unchanged++;
          continue;
        }
        rows.insert(u);
        added++;
      } else if (sameSerial.isPresent()) {
        conflict(
            UNIT,
            u.id(),
            "its serial '" + u.serial() + "' is taken here by another unit; kept the local copy");
      } else {
        settle(
            UNIT,
            u.id(),
            u,
            local.get(),
            u.updatedAt(),
            local.get().updatedAt(),
            () -> rows.replace(u));
      }
    }
    for (RepairCase c0 : b.cases()) {
      RepairCase c =
          new RepairCase(
              c0.id(),
              mapped(c0.unitId()),
              c0.openedAt(),
              c0.symptom(),
              c0.status(),
              c0.closedAt(),
              c0.outcome(),
              c0.confirmedFaults(),
              c0.updatedAt());
      if (rows.tryInsert(c)) {
        added++;
        touchedCases.add(c.id());
        continue;
      }
      Optional<RepairCase> local =
          rows.first(Rows.CASE + " WHERE c.id = ?", Rows::repairCase, c.id());
      if (settle(
          CASE,
          c.id(),
          c,
          local.get(),
          c.updatedAt(),
          local.get().updatedAt(),
          () -> rows.replace(c))) {
        touchedCases.add(c.id());
      }
    }
    for (StoredReading r : b.readings()) {
      if (rows.tryInsert(r)) {
        added++;
      } else {
        settleFixed(
            READING,
            r.id(),
            r,
            rows.first(Rows.READING + " WHERE id = ?", Rows::reading, r.id()).orElseThrow());
      }
    }
    for (SuspectListRecord s : b.suspectLists()) {
      if (rows.tryInsert(s)) {
        added++;
      } else {
        settleFixed(SUSPECT_LIST, s.id(), s, rows.suspectLists("WHERE id = ?", s.id()).get(0));
      }
    }
    for (RepairAction a : b.actions()) {
      if (rows.tryInsert(a)) {
        added++;
        touchedCases.add(a.caseId());
        continue;
      }
      Optional<RepairAction> local =
          rows.first(Rows.ACTION + " WHERE id = ?", Rows::action, a.id());
      if (settle(
          ACTION,
          a.id(),
          a,
          local.get(),
          a.updatedAt(),
          local.get().updatedAt(),
          () -> rows.replace(a))) {
        touchedCases.add(a.caseId());
        touchedCases.add(local.get().caseId());
      }
    }
    for (CaseNote n : b.notes()) {
      if (rows.tryInsert(n)) {
        added++;
      } else {
        Optional<CaseNote> local = rows.first(Rows.NOTE + " WHERE id = ?", Rows::note, n.id());
        settle(
            NOTE,
            n.id(),
            n,
            local.get(),
            n.updatedAt(),
            local.get().updatedAt(),
            () -> rows.replace(n));
      }
    }
    for (String caseId : touchedCases) {
      rows.indexParts(caseId);
    }
  }

  private String mapped(String id) {
    return remapped.getOrDefault(id, id);
  }

  /** A write that may fail with an SQL error. */
  @FunctionalInterface
  private interface Write {
    void run() throws SQLException;
  }

  /** Settles a record that exists on both sides; returns whether the local copy was replaced. */
  private boolean settle(
      String kind,
      String id,
      Object incoming,
      Object local,
      Instant incomingAt,
      Instant localAt,
      Write replace)
      throws SQLException {
    if (incoming.equals(local)) {
      unchanged++;
      return false;
    }
    if (incomingAt.isAfter(localAt)) {
      replace.run();
      updated++;
      return true;
    }
    conflict(
        kind,
        id,
        "differs from the local copy, which was changed at "
            + localAt
            + (localAt.equals(incomingAt) ? ", as late as" : ", later than")
            + " the bundle's ("
            + incomingAt
            + "); kept the local copy");
    return false;
  }

  /** Settles a record that is never edited once written (readings, suspect lists). */
  private void settleFixed(String kind, String id, Object incoming, Object local) {
    if (incoming.equals(local)) {
      unchanged++;
    } else {
      conflict(
          kind,
          id,
          "differs from the local copy, which is never edited once stored; kept the local copy");
    }
  }

  private void conflict(String kind, String id, String reason) {
    conflicts.add(new ImportReport.Conflict(kind, id, reason));
  }
}
