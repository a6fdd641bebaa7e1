package com.stagewise.history.jdbc;

import com.stagewise.history.BundleCheck;
import com.stagewise.history.ImportReport;
import com.stagewise.history.StageVersions;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredPhoto;
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
public final class Importer {

  /** The local table of each kind of record that others refer to. */
  private static final Map<String, String> PARENT_TABLES =
      Map.of(
          BundleCheck.BOARD_MODEL,
          "board_model",
          BundleCheck.STAGE_SHEET,
          "stage_sheet",
          BundleCheck.UNIT,
          "unit",
          BundleCheck.CASE,
          "repair_case");

  private final Connection connection;
  private final SqlDialect dialect;
  private final String source;
  private final Map<String, String> remapped = new HashMap<>();
  private final Set<String> touchedCases = new LinkedHashSet<>();
  private final List<String> matched = new ArrayList<>();
  private final List<ImportReport.Conflict> conflicts = new ArrayList<>();
  private int added;
  private int updated;
  private int unchanged;

  private final Instant now;

  /** An import into {@code connection}'s store (of {@code dialect}) from {@code source}. */
  public Importer(Connection connection, SqlDialect dialect, String source, Instant now) {
    this.connection = connection;
    this.dialect = dialect;
    this.source = source;
    this.now = now;
  }

  /** Merges {@code bundle} into the store, inside the caller's transaction. */
  public ImportReport run(HistoryBundle bundle) throws SQLException {
    try (Rows rows = new Rows(connection, dialect)) {
      new BundleCheck(source, now).check(bundle, (id, kind) -> localKind(rows, id, kind));
      merge(bundle, rows);
    }
    return new ImportReport(added, updated, unchanged, matched, conflicts);
  }

  /** Returns what kind of parent record {@code id} is in this history, if it is one. */
  private static Optional<String> localKind(Rows rows, String id, String wanted)
      throws SQLException {
    if (wanted != null
        && rows.first("SELECT 1 FROM " + PARENT_TABLES.get(wanted) + " WHERE id = ?", rs -> 1, id)
            .isPresent()) {
      return Optional.of(wanted);
    }
    for (Map.Entry<String, String> table : PARENT_TABLES.entrySet()) {
      if (!table.getKey().equals(wanted)
          && rows.first("SELECT 1 FROM " + table.getValue() + " WHERE id = ?", rs -> 1, id)
              .isPresent()) {
        return Optional.of(table.getKey());
      }
    }
    return Optional.empty();
  }

  // ---- merge ------------------------------------------------------------------------------------

  private void merge(HistoryBundle b, Rows rows) throws SQLException {
    // Parents first, so that every reference points at a record already merged.
    for (BoardModel m : b.boardModels()) {
      mergeBoardModel(m, rows);
    }
    for (StageSheetRecord s : b.stageSheets()) {
      mergeStageSheet(s, b.numbersStageVersions(), rows);
    }
    for (Unit u : b.units()) {
      mergeUnit(u, rows);
    }
    for (RepairCase c : b.cases()) {
      mergeCase(c, rows);
    }
    for (StoredReading r : b.readings()) {
      mergeReading(r, rows);
    }
    for (SuspectListRecord s : b.suspectLists()) {
      if (rows.tryInsert(s)) {
        added++;
      } else {
        settleFixed(
            BundleCheck.SUSPECT_LIST, s.id(), s, rows.suspectLists("WHERE id = ?", s.id()).get(0));
      }
    }
    for (RepairAction a : b.actions()) {
      mergeAction(a, rows);
    }
    for (CaseNote n : b.notes()) {
      mergeNote(n, rows);
    }
    for (StoredPhoto p : b.photos()) {
      // A photo is never edited once attached: a known id with the same picture is unchanged.
      StoredPhoto here = new StoredPhoto(p.photo().withCase(mapped(p.photo().caseId())), p.image());
      if (CaseExtraRows.tryInsert(rows, here)) {
        added++;
      } else {
        settleFixed(
            BundleCheck.PHOTO,
            here.photo().id(),
            here,
            rows.first(
                    Records.PHOTO_WITH_IMAGE + " WHERE id = ?",
                    Records::photoWithImage,
                    here.photo().id())
                .orElseThrow());
      }
    }
    for (AfterRepairReading r0 : b.afterRepair()) {
      // Never edited once stored: a known id with the same reading is unchanged.
      AfterRepairReading r = r0.withCase(mapped(r0.caseId()));
      if (CaseExtraRows.tryInsert(rows, r)) {
        added++;
      } else {
        settleFixed(
            BundleCheck.AFTER_REPAIR,
            r.id(),
            r,
            rows.first(Records.AFTER_REPAIR + " WHERE id = ?", Records::afterRepair, r.id())
                .orElseThrow());
      }
    }
    for (String caseId : touchedCases) {
      rows.indexParts(caseId);
    }
  }

  /**
   * Merges a board model: a new id with a name known here is matched to the local model (no
   * duplicate); a known id whose new name another local model has is a conflict.
   */
  private void mergeBoardModel(BoardModel m, Rows rows) throws SQLException {
    Optional<BoardModel> local =
        rows.first(Records.BOARD_MODEL + " WHERE id = ?", Records::boardModel, m.id());
    if (local.isEmpty()) {
      Optional<BoardModel> sameName =
          rows.first(
              Records.BOARD_MODEL + " WHERE " + rows.dialect().caselessEquals("name"),
              Records::boardModel,
              m.name());
      if (sameName.isPresent()) {
        remapped.put(m.id(), sameName.get().id());
        matched.add("board model '" + m.name() + "' matched the local one of that name");
        unchanged++;
      } else {
        rows.insert(m);
        added++;
      }
      return;
    }
    Optional<BoardModel> clash =
        rows.first(
            Records.BOARD_MODEL
                + " WHERE "
                + rows.dialect().caselessEquals("name")
                + " AND id <> ?",
            Records::boardModel,
            m.name(),
            m.id());
    if (clash.isPresent()) {
      conflict(
          BundleCheck.BOARD_MODEL,
          m.id(),
          "its new name '"
              + m.name()
              + "' is taken here by another board model; kept the local copy");
      return;
    }
    settle(
        BundleCheck.BOARD_MODEL,
        m.id(),
        m,
        local.get(),
        m.updatedAt(),
        local.get().updatedAt(),
        () -> rows.replace(m));
  }

  /**
   * Merges a version of a library stage by {@link StageVersions}: a text kept here already is that
   * version (no duplicate, the bundle's id matched to it); a different text under a number taken
   * here goes to the next free number, whichever of the two was saved later.
   */
  private void mergeStageSheet(StageSheetRecord s0, boolean numbered, Rows rows)
      throws SQLException {
    StageSheetRecord s = s0.withBoardModel(mapped(s0.boardModelId()));
    Optional<StageSheetRecord> local =
        rows.first(Records.STAGE_SHEET + " WHERE id = ?", Records::stageSheet, s.id());
    List<StageSheetRecord> versions =
        rows.query(
            Records.STAGE_SHEET
                + " WHERE board_model_id = ? AND "
                + rows.dialect().caselessEquals("title"),
            Records::stageSheet,
            s.boardModelId(),
            s.title());
    StageVersions.Placement placement =
        local.isEmpty()
            ? StageVersions.placeNew(s, versions, numbered, now)
            : StageVersions.placeKnown(s, local.get(), versions, numbered, now);
    if (placement instanceof StageVersions.Placement.Same same) {
      if (!same.local().id().equals(s.id())) {
        remapped.put(s.id(), same.local().id());
        matched.add(
            "stage '"
                + s.title()
                + "' version "
                + same.local().version()
                + " matched the local version with the same sheet");
      }
      unchanged++;
    } else if (placement instanceof StageVersions.Placement.Write write) {
      if (write.moved().isPresent()) {
        rows.replace(write.moved().get());
        matched.add(
            "stage '"
                + s.title()
                + "': the local version saved later moved to version "
                + write.moved().get().version());
      }
      if (local.isEmpty()) {
        rows.insert(write.record());
        added++;
      } else {
        rows.replace(write.record());
        updated++;
      }
    } else {
      settle(
          BundleCheck.STAGE_SHEET,
          s.id(),
          s,
          local.get(),
          s.updatedAt(),
          local.get().updatedAt(),
          () -> rows.replace(s));
    }
  }

  /**
   * Merges a unit: a new id with a serial its board model has here is matched to the local unit; a
   * known id whose serial another local unit has is a conflict.
   */
  private void mergeUnit(Unit u0, Rows rows) throws SQLException {
    Unit u = new Unit(u0.id(), u0.serial(), mapped(u0.boardModelId()), u0.owner(), u0.updatedAt());
    Optional<Unit> local = rows.first(Records.UNIT + " WHERE id = ?", Records::unit, u.id());
    Optional<Unit> sameSerial =
        rows.first(
            Records.UNIT + " WHERE board_model_id = ? AND serial = ? AND id <> ?",
            Records::unit,
            u.boardModelId(),
            u.serial(),
            u.id());
    if (local.isEmpty()) {
      if (sameSerial.isPresent()) {
        remapped.put(u.id(), sameSerial.get().id());
        matched.add("unit '" + u.serial() + "' matched the local unit with that serial");
        unchanged++;
      } else {
        rows.insert(u);
        added++;
      }
    } else if (sameSerial.isPresent()) {
      conflict(
          BundleCheck.UNIT,
          u.id(),
          "its serial '" + u.serial() + "' is taken here by another unit; kept the local copy");
    } else {
      settle(
          BundleCheck.UNIT,
          u.id(),
          u,
          local.get(),
          u.updatedAt(),
          local.get().updatedAt(),
          () -> rows.replace(u));
    }
  }

  private void mergeCase(RepairCase c0, Rows rows) throws SQLException {
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
            c0.updatedAt(),
            c0.stageSheetId() == null ? null : mapped(c0.stageSheetId()));
    if (rows.tryInsert(c)) {
      added++;
      touchedCases.add(c.id());
      return;
    }
    RepairCase local =
        rows.first(Records.cases(rows.dialect()) + " WHERE c.id = ?", Records::repairCase, c.id())
            .orElseThrow();
    if (settle(
        BundleCheck.CASE,
        c.id(),
        c,
        local,
        c.updatedAt(),
        local.updatedAt(),
        () -> rows.replace(c))) {
      touchedCases.add(c.id());
    }
  }

  /**
   * Merges a reading: what was taken is never edited, but whether it is struck out may change, and
   * the later change of the two copies wins.
   */
  private void mergeReading(StoredReading r, Rows rows) throws SQLException {
    if (rows.tryInsert(r)) {
      added++;
      return;
    }
    StoredReading local =
        rows.first(Records.READING + " WHERE id = ?", Records::reading, r.id()).orElseThrow();
    if (r.sameTaking(local)) {
      settle(
          BundleCheck.READING,
          r.id(),
          r,
          local,
          r.updatedAt(),
          local.updatedAt(),
          () -> rows.replaceStrike(r));
    } else {
      settleFixed(BundleCheck.READING, r.id(), r, local);
    }
  }

  private void mergeAction(RepairAction a, Rows rows) throws SQLException {
    if (rows.tryInsert(a)) {
      added++;
      touchedCases.add(a.caseId());
      return;
    }
    RepairAction local =
        rows.first(Records.ACTION + " WHERE id = ?", Records::action, a.id()).orElseThrow();
    if (settle(
        BundleCheck.ACTION,
        a.id(),
        a,
        local,
        a.updatedAt(),
        local.updatedAt(),
        () -> rows.replace(a))) {
      touchedCases.add(a.caseId());
      touchedCases.add(local.caseId());
    }
  }

  private void mergeNote(CaseNote n, Rows rows) throws SQLException {
    if (rows.tryInsert(n)) {
      added++;
      return;
    }
    CaseNote local =
        rows.first(Records.NOTE + " WHERE id = ?", Records::note, n.id()).orElseThrow();
    settle(
        BundleCheck.NOTE,
        n.id(),
        n,
        local,
        n.updatedAt(),
        local.updatedAt(),
        () -> rows.replace(n));
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

  /** Settles a record that is never edited once written (suspect lists, what a reading read). */
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
