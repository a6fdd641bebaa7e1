package com.stagewise.history.jdbc;

import static com.stagewise.history.jdbc.Require.SOURCE;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.CaseFile;
import com.stagewise.history.Cases;
import com.stagewise.history.Checks;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.PhotoFormat;
import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.sql.SQLException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/** Cases and their records in a store reached through JDBC. */
public final class JdbcCases implements Cases {
  private final JdbcAccess history;

  /** Serves the cases of the store behind {@code history}. */
  public JdbcCases(JdbcAccess history) {
    this.history = history;
  }

  @Override
  public RepairCase open(String unitId, String symptom) {
    Checks.text(SOURCE, "symptom", symptom, Checks.MAX_TEXT);
    Instant now = history.clock().instant();
    return history.write(
        "open a case",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.exists(rows, "unit", unitId, "unit");
            RepairCase opened =
                new RepairCase(
                    HistoryStore.newId(),
                    unitId,
                    now,
                    symptom,
                    CaseStatus.OPEN,
                    null,
                    null,
                    List.of(),
                    now);
            rows.insert(opened);
            return opened;
          }
        });
  }

  @Override
  public RepairCase close(String caseId, Outcome outcome, List<String> confirmedFaults) {
    return close(caseId, new CloseOut(outcome, confirmedFaults, "", List.of()));
  }

  @Override
  public RepairCase close(String caseId, CloseOut closeOut) {
    Checks.list(SOURCE, "faults", closeOut.confirmedFaults());
    for (String fault : closeOut.confirmedFaults()) {
      Checks.faultId(SOURCE, "fault", fault);
    }
    if (!closeOut.note().isEmpty()) {
      Checks.text(SOURCE, "note", closeOut.note(), Checks.MAX_TEXT);
    }
    Checks.list(SOURCE, "actions", closeOut.actions());
    for (int i = 0; i < closeOut.actions().size(); i++) {
      ActionDraft a = closeOut.actions().get(i);
      Checks.action(SOURCE, "actions[" + i + "].", a.part(), a.oldValue(), a.newValue(), a.text());
    }
    Instant now = history.clock().instant();
    return history.write(
        "close a case",
        c -> {
          try (Rows rows = history.rows(c)) {
            RepairCase open = Require.repairCase(rows, caseId);
            if (open.status() == CaseStatus.CLOSED) {
              throw new InvalidInputException(
                  SOURCE, "case", "case " + caseId + " is already closed");
            }
            for (ActionDraft a : closeOut.actions()) {
              rows.insert(
                  new RepairAction(
                      HistoryStore.newId(),
                      caseId,
                      now,
                      a.kind(),
                      a.part(),
                      a.oldValue(),
                      a.newValue(),
                      a.text(),
                      now));
            }
            if (!closeOut.note().isEmpty()) {
              rows.insert(new CaseNote(HistoryStore.newId(), caseId, now, closeOut.note(), now));
            }
            RepairCase closed =
                new RepairCase(
                    open.id(),
                    open.unitId(),
                    open.openedAt(),
                    open.symptom(),
                    CaseStatus.CLOSED,
                    now,
                    closeOut.outcome(),
                    closeOut.confirmedFaults(),
                    now,
                    open.stageSheetId());
            rows.replace(closed);
            rows.indexParts(caseId);
            return closed;
          }
        });
  }

  @Override
  public Optional<RepairCase> find(String caseId) {
    return history.read(
        "find a case",
        c -> {
          try (Rows rows = history.rows(c)) {
            return rows.first(
                Records.cases(history.dialect()) + " WHERE c.id = ?", Records::repairCase, caseId);
          }
        });
  }

  @Override
  public String resolveId(String prefix) {
    String clean = prefix == null ? "" : prefix.strip().toLowerCase(Locale.ROOT);
    if (clean.length() < 4 || !clean.matches("[0-9a-f-]+")) {
      throw new InvalidInputException(
          SOURCE,
          "case",
          "expected a case id (or its first 4 or more characters), got " + Checks.quote(prefix));
    }
    List<String> ids =
        history.read(
            "find a case",
            c -> {
              try (Rows rows = history.rows(c)) {
                // A prefix of hex digits and dashes: LIKE has nothing in it to escape.
                return rows.query(
                    "SELECT id FROM repair_case WHERE id LIKE ? ORDER BY "
                        + history.dialect().binaryOrder("id")
                        + " LIMIT 2",
                    rs -> rs.getString(1),
                    clean + "%");
              }
            });
    if (ids.isEmpty()) {
      throw new InvalidInputException(SOURCE, "case", "no case has the id " + Checks.quote(prefix));
    }
    if (ids.size() > 1) {
      throw new InvalidInputException(
          SOURCE,
          "case",
          "more than one case starts with " + Checks.quote(prefix) + "; give more of the id");
    }
    return ids.get(0);
  }

  @Override
  public void addReadings(
      String caseId, List<StoredReading> readings, SuspectListRecord suspectList) {
    checkAdded(caseId, readings, suspectList);
    history.write(
        "store readings",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.repairCase(rows, caseId);
            for (StoredReading r : readings) {
              rows.insert(r);
            }
            if (suspectList != null) {
              rows.insert(suspectList);
            }
            return null;
          }
        });
  }

  private static void checkAdded(
      String caseId, List<StoredReading> readings, SuspectListRecord suspectList) {
    for (int i = 0; i < readings.size(); i++) {
      StoredReading r = readings.get(i);
      Checks.reading(SOURCE, "readings[" + i + "]", r);
      if (!r.caseId().equals(caseId)) {
        throw new IllegalArgumentException("reading " + r.id() + " belongs to another case");
      }
    }
    if (suspectList != null) {
      Checks.suspectList(SOURCE, "suspects", suspectList);
      if (!suspectList.caseId().equals(caseId)) {
        throw new IllegalArgumentException("the suspect list belongs to another case");
      }
    }
  }

  @Override
  public List<StoredReading> reviseReadings(
      String caseId, Revision revision, SuspectListRecord suspectList) {
    Objects.requireNonNull(revision, "revision");
    checkAdded(caseId, revision.added(), suspectList);
    Instant now = history.clock().instant();
    return history.write(
        "strike out readings",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.repairCase(rows, caseId);
            List<StoredReading> changed = new ArrayList<>();
            for (String id : revision.strike()) {
              changed.add(strike(rows, caseId, id, true, now));
            }
            for (String id : revision.restore()) {
              changed.add(strike(rows, caseId, id, false, now));
            }
            for (StoredReading r : revision.added()) {
              rows.insert(r);
            }
            if (suspectList != null) {
              rows.insert(suspectList);
            }
            return changed;
          }
        });
  }

  /** Strikes out (or restores) one reading of the case and returns it as now stored. */
  private static StoredReading strike(
      Rows rows, String caseId, String readingId, boolean struck, Instant now) throws SQLException {
    StoredReading r =
        rows.first(Records.READING + " WHERE id = ?", Records::reading, readingId)
            .filter(found -> found.caseId().equals(caseId))
            .orElseThrow(
                () ->
                    new InvalidInputException(
                        SOURCE,
                        "reading",
                        "the case has no reading with the id " + Checks.quote(readingId)));
    if (r.struck() == struck) {
      return r;
    }
    StoredReading changed = struck ? r.struckOut(now) : r.restored(now);
    rows.replaceStrike(changed);
    return changed;
  }

  @Override
  public CaseNote addNote(String caseId, String text) {
    Checks.text(SOURCE, "note", text, Checks.MAX_TEXT);
    Instant now = history.clock().instant();
    return history.write(
        "add a note",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.repairCase(rows, caseId);
            CaseNote note = new CaseNote(HistoryStore.newId(), caseId, now, text, now);
            rows.insert(note);
            return note;
          }
        });
  }

  @Override
  public RepairAction addAction(
      String caseId, ActionKind kind, String part, String oldValue, String newValue, String text) {
    Objects.requireNonNull(kind, "kind");
    Checks.action(SOURCE, "", part, oldValue, newValue, text);
    Instant now = history.clock().instant();
    return history.write(
        "add an action",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.repairCase(rows, caseId);
            RepairAction action =
                new RepairAction(
                    HistoryStore.newId(), caseId, now, kind, part, oldValue, newValue, text, now);
            rows.insert(action);
            rows.indexParts(caseId);
            return action;
          }
        });
  }

  @Override
  public CasePhoto attachPhoto(String caseId, PhotoDraft draft) {
    Objects.requireNonNull(draft, "draft");
    String fileName = draft.fileName().strip();
    Instant now = history.clock().instant();
    // The picture's kind and size are read from its own header, so the record cannot disagree.
    PhotoFormat.Picture picture =
        PhotoFormat.of(draft.image()).orElse(new PhotoFormat.Picture("", 0, 0));
    StoredPhoto photo =
        new StoredPhoto(
            new CasePhoto(
                HistoryStore.newId(),
                caseId,
                fileName,
                picture.mediaType(),
                picture.width(),
                picture.height(),
                draft.image().length,
                now,
                draft.attachedBy().strip()),
            draft.image());
    Checks.photo(SOURCE, "photo", photo);
    return history.write(
        "attach a photo",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.repairCase(rows, caseId);
            rows.insert(photo);
            return photo.photo();
          }
        });
  }

  @Override
  public void addAfterRepair(String caseId, List<AfterRepairReading> readings) {
    Checks.list(SOURCE, "afterRepair", readings);
    for (int i = 0; i < readings.size(); i++) {
      AfterRepairReading r = readings.get(i);
      Checks.afterRepair(SOURCE, "afterRepair[" + i + "]", r);
      if (!r.caseId().equals(caseId)) {
        throw new IllegalArgumentException("reading " + r.id() + " belongs to another case");
      }
    }
    history.write(
        "store the readings after the repair",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.repairCase(rows, caseId);
            for (AfterRepairReading r : readings) {
              rows.insert(r);
            }
            return null;
          }
        });
  }

  @Override
  public Optional<StoredPhoto> photo(String photoId) {
    return history.read(
        "read a photo",
        c -> {
          try (Rows rows = history.rows(c)) {
            return rows.first(
                Records.PHOTO_WITH_IMAGE + " WHERE id = ?", Records::photoWithImage, photoId);
          }
        });
  }

  @Override
  public Optional<CaseFile> caseFile(String caseId) {
    return history.read(
        "read a case",
        c -> {
          try (Rows rows = history.rows(c)) {
            Optional<RepairCase> found =
                rows.first(
                    Records.cases(history.dialect()) + " WHERE c.id = ?",
                    Records::repairCase,
                    caseId);
            return found.isEmpty()
                ? Optional.<CaseFile>empty()
                : Optional.of(caseFile(rows, found.get()));
          }
        });
  }

  @Override
  public Optional<UnitHistory> unitHistory(String unitId) {
    return history.read(
        "read a unit's history",
        c -> {
          try (Rows rows = history.rows(c)) {
            Optional<Unit> unit = rows.first(Records.UNIT + " WHERE id = ?", Records::unit, unitId);
            if (unit.isEmpty()) {
              return Optional.<UnitHistory>empty();
            }
            BoardModel model =
                rows.first(
                        Records.BOARD_MODEL + " WHERE id = ?",
                        Records::boardModel,
                        unit.get().boardModelId())
                    .orElseThrow();
            List<CaseFile> cases = new ArrayList<>();
            for (RepairCase rc :
                rows.query(
                    Records.cases(history.dialect())
                        + " WHERE c.unit_id = ? ORDER BY c.opened_at, "
                        + history.dialect().insertionOrder("c.row"),
                    Records::repairCase,
                    unitId)) {
              cases.add(caseFile(rows, rc));
            }
            return Optional.of(new UnitHistory(unit.get(), model, cases));
          }
        });
  }

  private static CaseFile caseFile(Rows rows, RepairCase rc) throws SQLException {
    String id = rc.id();
    SqlDialect d = rows.dialect();
    return new CaseFile(
        rc,
        rows.query(
            Records.READING + " WHERE case_id = ? ORDER BY taken_at, " + d.insertionOrder("rowid"),
            Records::reading,
            id),
        rows.suspectLists(
            "WHERE case_id = ? ORDER BY computed_at, " + d.insertionOrder("rowid"), id),
        rows.query(
            Records.ACTION + " WHERE case_id = ? ORDER BY at, " + d.insertionOrder("rowid"),
            Records::action,
            id),
        rows.query(
            Records.NOTE + " WHERE case_id = ? ORDER BY at, " + d.insertionOrder("row"),
            Records::note,
            id),
        rows.query(
            Records.PHOTO + " WHERE case_id = ? ORDER BY attached_at, " + d.insertionOrder("row"),
            Records::photo,
            id),
        rows.query(
            Records.AFTER_REPAIR
                + " WHERE case_id = ? ORDER BY taken_at, "
                + d.insertionOrder("row"),
            Records::afterRepair,
            id));
  }

  @Override
  public List<SearchHit> search(SearchQuery query) {
    return history.read("search", c -> history.search(c, query));
  }

  @Override
  public Map<String, Integer> confirmedFaultCounts(String boardModel) {
    return history.read(
        "count confirmed faults",
        c -> {
          try (Rows rows = history.rows(c)) {
            Map<String, Integer> counts = new LinkedHashMap<>();
            for (Object[] row :
                rows.query(
                    "SELECT f.fault_id, count(DISTINCT f.case_id) FROM confirmed_fault f"
                        + " JOIN repair_case rc ON rc.id = f.case_id"
                        + " JOIN unit u ON u.id = rc.unit_id"
                        + " JOIN board_model m ON m.id = u.board_model_id"
                        + " WHERE (m.id = ? OR "
                        + history.dialect().caselessEquals("m.name")
                        + ")"
                        + " AND rc.status = 'closed' AND rc.outcome = 'fixed'"
                        + " GROUP BY f.fault_id ORDER BY count(DISTINCT f.case_id) DESC, "
                        + history.dialect().binaryOrder("f.fault_id"),
                    rs -> new Object[] {rs.getString(1), rs.getInt(2)},
                    boardModel,
                    boardModel.strip())) {
              counts.put((String) row[0], (Integer) row[1]);
            }
            return counts;
          }
        });
  }
}
