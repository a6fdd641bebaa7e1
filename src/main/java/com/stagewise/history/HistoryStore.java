package com.stagewise.history;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.SQLException;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import org.sqlite.SQLiteConnection;

/**
 * The shop's repair history in one SQLite file: board models, units, cases and everything measured,
 * suspected, done and noted in them.
 *
 * <p>Every write is one transaction (all of it or nothing). The file may be used by several
 * programs at once: a writer waits for another's write lock (up to a timeout, then retries) instead
 * of failing. One store may be used from several threads; its calls run one at a time. Bad input
 * (an unknown case, an empty serial, text over the limits) is an {@link InvalidInputException};
 * trouble with the file is a {@link StorageException}.
 */
public final class HistoryStore implements AutoCloseable {
  private static final String SOURCE = "history";

  private final Database database;
  private final Clock clock;

  private HistoryStore(Database database, Clock clock) {
    this.database = database;
    this.clock = clock;
  }

  /**
   * Opens the history file at {@code file}, creating it (and its folder) if missing, and brings its
   * schema up to date.
   *
   * @throws StorageException if the file is not a history database, is damaged, was made by a newer
   *     program, or cannot be written; the file is then left as it was
   */
  public static HistoryStore open(Path file) {
    return open(file, Clock.systemUTC());
  }

  /** Opens the history file as {@link #open(Path)} does, taking times from {@code clock}. */
  public static HistoryStore open(Path file, Clock clock) {
    return open(file, clock, Migrations.LATEST);
  }

  static HistoryStore open(Path file, Clock clock, int schemaVersion) {
    Database database = Database.open(file);
    try {
      Migrations.migrate(database, schemaVersion, clock.millis());
      return new HistoryStore(database, clock);
    } catch (RuntimeException e) {
      database.close();
      throw e;
    }
  }

  /** Returns a new stable id (a random UUID). */
  public static String newId() {
    return UUID.randomUUID().toString();
  }

  /** Returns the database file. */
  public Path file() {
    return database.path();
  }

  /** Returns the file's schema version (after opening, the newest this program knows). */
  public synchronized int schemaVersion() {
    return database.read("read the schema version", c -> Migrations.currentVersion(database));
  }

  /** Returns the schema version this program writes. */
  public static int latestSchemaVersion() {
    return Migrations.LATEST;
  }

  // ---- board models and stage sheets ---------------------------------------------------------

  /**
   * Returns the board model named {@code name} (ignoring letter case), adding it if there is none.
   */
  public synchronized BoardModel boardModel(String name, String maker) {
    Checks.shortText(SOURCE, "board model", name, true);
    Checks.shortText(SOURCE, "maker", maker, false);
    Instant now = clock.instant();
    return database.write(
        "add a board model",
        c -> {
          try (Rows rows = new Rows(c)) {
            Optional<BoardModel> existing =
                rows.first(
                    Rows.BOARD_MODEL + " WHERE name = ? COLLATE NOCASE",
                    Rows::boardModel,
                    name.strip());
            if (existing.isPresent()) {
              return existing.get();
            }
            BoardModel model = new BoardModel(newId(), name.strip(), maker.strip(), "", now);
            rows.insert(model);
            return model;
          }
        });
  }

  /** Returns the board model with this name (ignoring letter case) or id, if there is one. */
  public synchronized Optional<BoardModel> findBoardModel(String nameOrId) {
    return database.read(
        "find a board model",
        c -> {
          try (Rows rows = new Rows(c)) {
            return rows.first(
                Rows.BOARD_MODEL + " WHERE id = ? OR name = ? COLLATE NOCASE",
                Rows::boardModel,
                nameOrId,
                nameOrId.strip());
          }
        });
  }

  /** Returns every board model, by name. */
  public synchronized List<BoardModel> boardModels() {
    return database.read(
        "list board models",
        c -> {
          try (Rows rows = new Rows(c)) {
            return rows.query(Rows.BOARD_MODEL + " ORDER BY name COLLATE NOCASE", Rows::boardModel);
          }
        });
  }

  /** Adds a stage sheet (its JSON text, kept exactly) to a board model and returns it. */
  public synchronized StageSheetRecord addStageSheet(
      String boardModelId, String title, String sheetJson) {
    Checks.shortText(SOURCE, "title", title, false);
    Checks.text(SOURCE, "stage sheet", sheetJson, Checks.MAX_SHEET);
    Instant now = clock.instant();
    return database.write(
        "add a stage sheet",
        c -> {
          try (Rows rows = new Rows(c)) {
            requireExists(rows, "board_model", boardModelId, "board model");
            StageSheetRecord sheet =
                new StageSheetRecord(newId(), boardModelId, title, sheetJson, now);
            rows.insert(sheet);
            return sheet;
          }
        });
  }

  /** Returns the stage sheets of a board model, in the order they were added. */
  public synchronized List<StageSheetRecord> stageSheets(String boardModelId) {
    return database.read(
        "list stage sheets",
        c -> {
          try (Rows rows = new Rows(c)) {
            return rows.query(
                Rows.STAGE_SHEET + " WHERE board_model_id = ? ORDER BY updated_at, id",
                Rows::stageSheet,
                boardModelId);
          }
        });
  }

  // ---- units ----------------------------------------------------------------------------------

  /**
   * Adds a unit of a board model and returns it.
   *
   * @throws InvalidInputException if the serial is empty or the board model already has a unit with
   *     this serial
   */
  public synchronized Unit addUnit(String serial, String boardModelId, String owner) {
    Checks.shortText(SOURCE, "serial", serial, true);
    Checks.shortText(SOURCE, "owner", owner, false);
    Instant now = clock.instant();
    return database.write(
        "add a unit",
        c -> {
          try (Rows rows = new Rows(c)) {
            requireExists(rows, "board_model", boardModelId, "board model");
            if (rows.first(
                    Rows.UNIT + " WHERE board_model_id = ? AND serial = ?",
                    Rows::unit,
                    boardModelId,
                    serial)
                .isPresent()) {
              throw new InvalidInputException(
                  SOURCE, "serial", "this board model already has a unit " + Checks.quote(serial));
            }
            Unit unit = new Unit(newId(), serial, boardModelId, owner, now);
            rows.insert(unit);
            return unit;
          }
        });
  }

  /** Returns the unit with this id, if there is one. */
  public synchronized Optional<Unit> unit(String unitId) {
    return database.read(
        "find a unit",
        c -> {
          try (Rows rows = new Rows(c)) {
            return rows.first(Rows.UNIT + " WHERE id = ?", Rows::unit, unitId);
          }
        });
  }

  /** Returns the units with this serial (ignoring letter case), of any board model. */
  public synchronized List<Unit> unitsBySerial(String serial) {
    return database.read(
        "find units",
        c -> {
          try (Rows rows = new Rows(c)) {
            return rows.query(
                Rows.UNIT + " WHERE serial = ? COLLATE NOCASE ORDER BY serial", Rows::unit, serial);
          }
        });
  }

  /** Returns the units of a board model (or of every model, for null), by serial. */
  public synchronized List<Unit> units(String boardModelIdOrNull) {
    return database.read(
        "list units",
        c -> {
          try (Rows rows = new Rows(c)) {
            return boardModelIdOrNull == null
                ? rows.query(Rows.UNIT + " ORDER BY serial, id", Rows::unit)
                : rows.query(
                    Rows.UNIT + " WHERE board_model_id = ? ORDER BY serial, id",
                    Rows::unit,
                    boardModelIdOrNull);
          }
        });
  }

  // ---- cases ----------------------------------------------------------------------------------

  /** Opens a case for a unit with the symptom as reported, and returns it. */
  public synchronized RepairCase openCase(String unitId, String symptom) {
    Checks.text(SOURCE, "symptom", symptom, Checks.MAX_TEXT);
    Instant now = clock.instant();
    return database.write(
        "open a case",
        c -> {
          try (Rows rows = new Rows(c)) {
            requireExists(rows, "unit", unitId, "unit");
            RepairCase opened =
                new RepairCase(
                    newId(), unitId, now, symptom, CaseStatus.OPEN, null, null, List.of(), now);
            rows.insert(opened);
            return opened;
          }
        });
  }

  /**
   * Closes out a case: records its outcome and the faults found to be wrong, and returns it.
   *
   * @param confirmedFaults fault ids in the DESIGN.md grammar (may be empty, e.g. when returned)
   * @throws InvalidInputException if the case is unknown or already closed, or a fault id is bad
   */
  public synchronized RepairCase closeCase(
      String caseId, Outcome outcome, List<String> confirmedFaults) {
    Checks.list(SOURCE, "faults", confirmedFaults);
    for (String fault : confirmedFaults) {
      Checks.faultId(SOURCE, "fault", fault);
    }
    Instant now = clock.instant();
    return database.write(
        "close a case",
        c -> {
          try (Rows rows = new Rows(c)) {
            RepairCase open = requireCase(rows, caseId);
            if (open.status() == CaseStatus.CLOSED) {
              throw new InvalidInputException(
                  SOURCE, "case", "case " + caseId + " is already closed");
            }
            RepairCase closed =
                new RepairCase(
                    open.id(),
                    open.unitId(),
                    open.openedAt(),
                    open.symptom(),
                    CaseStatus.CLOSED,
                    now,
                    outcome,
                    confirmedFaults,
                    now);
            rows.replace(closed);
            rows.indexParts(caseId);
            return closed;
          }
        });
  }

  /** Returns the case with this id, if there is one. */
  public synchronized Optional<RepairCase> repairCase(String caseId) {
    return database.read(
        "find a case",
        c -> {
          try (Rows rows = new Rows(c)) {
            return rows.first(Rows.CASE + " WHERE c.id = ?", Rows::repairCase, caseId);
          }
        });
  }

  /**
   * Returns the id of the one case whose id starts with {@code prefix} (at least 4 characters), so
   * that people can type the short ids that listings show.
   *
   * @throws InvalidInputException if no case or more than one case matches
   */
  public synchronized String resolveCaseId(String prefix) {
    String clean = prefix == null ? "" : prefix.strip().toLowerCase(java.util.Locale.ROOT);
    if (clean.length() < 4 || !clean.matches("[0-9a-f-]+")) {
      throw new InvalidInputException(
          SOURCE,
          "case",
          "expected a case id (or its first 4 or more characters), got " + Checks.quote(prefix));
    }
    List<String> ids =
        database.read(
            "find a case",
            c -> {
              try (Rows rows = new Rows(c)) {
                return rows.query(
                    "SELECT id FROM repair_case WHERE id >= ? AND id < ? ORDER BY id LIMIT 2",
                    rs -> rs.getString(1),
                    clean,
                    clean + "\uffff");
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

  /**
   * Stores readings taken in a case together with the suspect list computed from them (if any), in
   * one transaction.
   *
   * @param suspectList the diagnosis at the time, or null if none was computed
   */
  public synchronized void addReadings(
      String caseId, List<StoredReading> readings, SuspectListRecord suspectList) {
    for (int i = 0; i < readings.size(); i++) {
      StoredReading r = readings.get(i);
      checkReading("readings[" + i + "]", r);
      if (!r.caseId().equals(caseId)) {
        throw new IllegalArgumentException("reading " + r.id() + " belongs to another case");
      }
    }
    if (suspectList != null) {
      checkSuspectList("suspects", suspectList);
      if (!suspectList.caseId().equals(caseId)) {
        throw new IllegalArgumentException("the suspect list belongs to another case");
      }
    }
    database.write(
        "store readings",
        c -> {
          try (Rows rows = new Rows(c)) {
            requireCase(rows, caseId);
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

  /** Adds a time-stamped note to a case and returns it. */
  public synchronized CaseNote addNote(String caseId, String text) {
    Checks.text(SOURCE, "note", text, Checks.MAX_TEXT);
    Instant now = clock.instant();
    return database.write(
        "add a note",
        c -> {
          try (Rows rows = new Rows(c)) {
            requireCase(rows, caseId);
            CaseNote note = new CaseNote(newId(), caseId, now, text, now);
            rows.insert(note);
            return note;
          }
        });
  }

  /** Records something done to the unit in a case and returns it. */
  public synchronized RepairAction addAction(
      String caseId, ActionKind kind, String part, String oldValue, String newValue, String text) {
    Checks.shortText(SOURCE, "part", part, false);
    Checks.shortText(SOURCE, "old value", oldValue, false);
    Checks.shortText(SOURCE, "new value", newValue, false);
    Checks.text(SOURCE, "text", text, Checks.MAX_TEXT);
    Instant now = clock.instant();
    return database.write(
        "add an action",
        c -> {
          try (Rows rows = new Rows(c)) {
            requireCase(rows, caseId);
            RepairAction action =
                new RepairAction(newId(), caseId, now, kind, part, oldValue, newValue, text, now);
            rows.insert(action);
            rows.indexParts(caseId);
            return action;
          }
        });
  }

  /** Returns everything about one case. */
  public synchronized Optional<CaseFile> caseFile(String caseId) {
    return database.read(
        "read a case",
        c -> {
          try (Rows rows = new Rows(c)) {
            Optional<RepairCase> found =
                rows.first(Rows.CASE + " WHERE c.id = ?", Rows::repairCase, caseId);
            return found.isEmpty()
                ? Optional.<CaseFile>empty()
                : Optional.of(caseFile(rows, found.get()));
          }
        });
  }

  /** Returns a unit's whole history, if the unit exists. */
  public synchronized Optional<UnitHistory> unitHistory(String unitId) {
    return database.read(
        "read a unit's history",
        c -> {
          try (Rows rows = new Rows(c)) {
            Optional<Unit> unit = rows.first(Rows.UNIT + " WHERE id = ?", Rows::unit, unitId);
            if (unit.isEmpty()) {
              return Optional.<UnitHistory>empty();
            }
            BoardModel model =
                rows.first(
                        Rows.BOARD_MODEL + " WHERE id = ?",
                        Rows::boardModel,
                        unit.get().boardModelId())
                    .orElseThrow();
            List<CaseFile> cases = new ArrayList<>();
            for (RepairCase rc :
                rows.query(
                    Rows.CASE + " WHERE c.unit_id = ? ORDER BY c.opened_at, c.row",
                    Rows::repairCase,
                    unitId)) {
              cases.add(caseFile(rows, rc));
            }
            return Optional.of(new UnitHistory(unit.get(), model, cases));
          }
        });
  }

  private static CaseFile caseFile(Rows rows, RepairCase rc) throws SQLException {
    String id = rc.id();
    return new CaseFile(
        rc,
        rows.query(Rows.READING + " WHERE case_id = ? ORDER BY taken_at, rowid", Rows::reading, id),
        rows.suspectLists("WHERE case_id = ? ORDER BY computed_at, rowid", id),
        rows.query(Rows.ACTION + " WHERE case_id = ? ORDER BY at, rowid", Rows::action, id),
        rows.query(Rows.NOTE + " WHERE case_id = ? ORDER BY at, row", Rows::note, id));
  }

  // ---- search and the shop's memory -----------------------------------------------------------

  /** Returns the cases that match {@code query}; see {@link SearchQuery} for the order. */
  public synchronized List<SearchHit> search(SearchQuery query) {
    return database.read("search", c -> Search.run(c, query));
  }

  /**
   * Returns, for a board model (name or id), how many closed cases with outcome {@code fixed}
   * confirmed each fault id; empty for an unknown model.
   */
  public synchronized Map<String, Integer> confirmedFaultCounts(String boardModel) {
    return database.read(
        "count confirmed faults",
        c -> {
          try (Rows rows = new Rows(c)) {
            Map<String, Integer> counts = new LinkedHashMap<>();
            for (Object[] row :
                rows.query(
                    "SELECT f.fault_id, count(DISTINCT f.case_id) FROM confirmed_fault f"
                        + " JOIN repair_case rc ON rc.id = f.case_id"
                        + " JOIN unit u ON u.id = rc.unit_id"
                        + " JOIN board_model m ON m.id = u.board_model_id"
                        + " WHERE (m.id = ? OR m.name = ? COLLATE NOCASE)"
                        + " AND rc.status = 'closed' AND rc.outcome = 'fixed'"
                        + " GROUP BY f.fault_id ORDER BY count(DISTINCT f.case_id) DESC, f.fault_id",
                    rs -> new Object[] {rs.getString(1), rs.getInt(2)},
                    boardModel,
                    boardModel.strip())) {
              counts.put((String) row[0], (Integer) row[1]);
            }
            return counts;
          }
        });
  }

  /** Returns whether the history holds no board model, unit or case at all. */
  public synchronized boolean isEmpty() {
    return database.read(
        "count records",
        c ->
            database.queryInt(
                    "SELECT (SELECT count(*) FROM board_model) + (SELECT count(*) FROM unit)"
                        + " + (SELECT count(*) FROM repair_case)")
                == 0);
  }

  // ---- between benches ------------------------------------------------------------------------

  /** Returns the selected part of the history as a bundle, in one consistent read. */
  public synchronized HistoryBundle export(ExportSelection selection, String programVersion) {
    Instant now = clock.instant();
    return database.read("export", c -> Exporter.export(c, selection, programVersion, now));
  }

  /**
   * Merges a bundle into this history in one transaction, by id: new records are added, records
   * whose bundle copy is newer replace the local one, and a local copy that is newer (or as new)
   * and differs is kept and reported as a conflict. Board models are matched by name and units by
   * board model and serial when their ids differ, so nothing is duplicated.
   *
   * @throws InvalidInputException if the bundle is malformed (bad ids, duplicate ids, references to
   *     missing records or to a record of the wrong kind, text over the limits, a newer format
   *     version): nothing is imported
   */
  public synchronized ImportReport importBundle(HistoryBundle bundle, String source) {
    return database.write("import", c -> new Importer(c, source).run(bundle));
  }

  /**
   * Writes a consistent copy of the history to {@code target} while the file stays in use ({@code
   * VACUUM INTO}); the copy is compact and complete.
   *
   * @throws InvalidInputException if {@code target} already exists
   */
  public synchronized void backupTo(Path target) {
    Path file = target.toAbsolutePath().normalize();
    if (Files.exists(file)) {
      throw new InvalidInputException(
          file.toString(), "", "already exists; choose a new file name for the backup");
    }
    database.outsideTransaction(
        "make a backup",
        c -> {
          try (var statement = c.prepareStatement("VACUUM INTO ?")) {
            statement.setString(1, file.toString());
            statement.execute();
          }
          return null;
        });
  }

  /**
   * Replaces the whole history with the backup in {@code backup}, after checking that it is a sound
   * history file; the current history is first saved beside the database as {@code
   * <name>.before-restore-<time>}, so a restore can be undone. Other programs using the file see
   * the restored history.
   *
   * @return the file the previous history was saved to
   * @throws StorageException if the backup is not a sound history file (nothing is changed then)
   */
  public synchronized Path restoreFrom(Path backup) {
    Path source = backup.toAbsolutePath().normalize();
    if (!Files.isRegularFile(source)) {
      throw new InvalidInputException(source.toString(), "", "no such backup file");
    }
    checkBackup(source);
    String stamp = clock.instant().toString().replace(":", "").replace(".", "");
    Path saved = file().resolveSibling(file().getFileName() + ".before-restore-" + stamp);
    backupTo(saved);
    database.outsideTransaction(
        "restore from a backup",
        c -> {
          // SQLite's online backup, run backwards: copies every page of the backup into this file
          // under its write lock, so other programs see either the old or the restored history.
          c.unwrap(SQLiteConnection.class).getDatabase().restore("main", source.toString(), null);
          return null;
        });
    Migrations.migrate(database, Migrations.LATEST, clock.millis());
    return saved;
  }

  private static void checkBackup(Path source) {
    try (Database candidate = Database.open(source)) {
      int version = candidate.read("read the backup", c -> Migrations.currentVersion(candidate));
      if (version == 0 || version > Migrations.LATEST) {
        throw new StorageException(
            "The file "
                + source
                + " is not a backup of a history this program can read (schema version "
                + version
                + ").");
      }
      String check =
          candidate.read(
              "check the backup",
              c -> {
                try (Rows rows = new Rows(c)) {
                  return String.join(
                      "; ", rows.query("PRAGMA integrity_check", rs -> rs.getString(1)));
                }
              });
      if (!check.equals("ok")) {
        throw new StorageException("The backup " + source + " is damaged: " + check);
      }
    }
  }

  /** Returns SQLite's own integrity check of the file: {@code ok}, or what is wrong. */
  public synchronized String integrityCheck() {
    return database.read(
        "check the file",
        c -> {
          try (Rows rows = new Rows(c)) {
            return String.join("; ", rows.query("PRAGMA integrity_check", rs -> rs.getString(1)));
          }
        });
  }

  @Override
  public synchronized void close() {
    database.close();
  }

  // ---- checks -----------------------------------------------------------------------------------

  static void checkReading(String field, StoredReading r) {
    Checks.shortText(SOURCE, field + ".at", r.at(), true);
    Checks.finite(SOURCE, field + ".value", r.value());
    if (r.hz() != null) {
      Checks.finite(SOURCE, field + ".hz", r.hz());
    }
    if (r.uncertainty() != null) {
      Checks.finite(SOURCE, field + ".uncertainty", r.uncertainty());
    }
    Checks.text(SOURCE, field + ".meter", r.meterText(), Checks.MAX_TEXT);
  }

  static void checkSuspectList(String field, SuspectListRecord list) {
    Checks.shortText(SOURCE, field + ".programVersion", list.programVersion(), false);
    Checks.shortText(SOURCE, field + ".verdict", list.verdict(), true);
    Checks.text(SOURCE, field + ".nextProbes", list.nextProbes(), Checks.MAX_TEXT);
    Checks.list(SOURCE, field + ".suspects", list.suspects());
    for (int i = 0; i < list.suspects().size(); i++) {
      StoredSuspect s = list.suspects().get(i);
      String at = field + ".suspects[" + i + "]";
      Checks.faultId(SOURCE, at + ".fault", s.fault());
      Checks.finite(SOURCE, at + ".probability", s.probability());
      Checks.list(SOURCE, at + ".group", s.group());
      for (String member : s.group()) {
        Checks.faultId(SOURCE, at + ".group", member);
      }
      Checks.text(SOURCE, at + ".why", s.why(), Checks.MAX_TEXT);
    }
  }

  private static void requireExists(Rows rows, String table, String id, String what)
      throws SQLException {
    if (rows.first("SELECT 1 FROM " + table + " WHERE id = ?", rs -> 1, id).isEmpty()) {
      throw new InvalidInputException(
          SOURCE, what, "no " + what + " has the id " + Checks.quote(id));
    }
  }

  private static RepairCase requireCase(Rows rows, String caseId) throws SQLException {
    return rows.first(Rows.CASE + " WHERE c.id = ?", Rows::repairCase, caseId)
        .orElseThrow(
            () ->
                new InvalidInputException(
                    SOURCE, "case", "no case has the id " + Checks.quote(caseId)));
  }
}
