package com.stagewise.history;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.time.Duration;
import java.time.Instant;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Checks a whole bundle before any store writes a record of it: the format version, every id (well
 * formed, unique in the bundle), text limits, fault ids, times, and that every reference points at
 * a record of the right kind in the bundle or in the local history. Every store runs it first
 * inside its import transaction; any problem throws before anything is written.
 *
 * <p>What the records' documents say (a stage sheet's circuit, a reading's value) is checked where
 * the documents are read, by the same readers as the files.
 */
public final class BundleCheck {
  public static final String BOARD_MODEL = "board model";
  public static final String STAGE_SHEET = "stage sheet";
  public static final String UNIT = "unit";
  public static final String CASE = "case";
  public static final String READING = "reading";
  public static final String SUSPECT_LIST = "suspect list";
  public static final String ACTION = "action";
  public static final String NOTE = "note";
  public static final String PHOTO = "photo";
  public static final String AFTER_REPAIR = "after-repair reading";

  /**
   * How far after the importing bench's clock a time in a bundle may lie. Benches' clocks differ by
   * minutes, and a clock set to the wrong time zone by up to 14 hours; a day covers both. A time
   * beyond it would win every later merge (the newer copy wins), so it is refused.
   */
  public static final Duration FUTURE_MARGIN = Duration.ofDays(1);

  /** The kinds of record that others refer to. */
  private static final List<String> PARENTS = List.of(BOARD_MODEL, STAGE_SHEET, UNIT, CASE);

  /** Looks up what kind of parent record an id is in the local history. */
  @FunctionalInterface
  public interface LocalKinds<E extends Exception> {
    /**
     * Returns the kind ({@link #BOARD_MODEL}, {@link #STAGE_SHEET}, {@link #UNIT} or {@link #CASE})
     * of the local record with this id, if there is one; {@code wanted} is the kind the caller
     * hopes for (looked up first).
     */
    Optional<String> kindOf(String id, String wanted) throws E;
  }

  private final String source;
  private final Instant latest;
  private final Map<String, String> bundleKinds = new HashMap<>();
  private final Map<String, String> bundleFields = new HashMap<>();

  /**
   * Creates a check of bundles from {@code source} (named in every message), imported at {@code
   * now}.
   */
  public BundleCheck(String source, Instant now) {
    this.source = source;
    this.latest = now.plus(FUTURE_MARGIN);
  }

  /**
   * Checks {@code b} against itself and the local history.
   *
   * @throws InvalidInputException naming the bundle, the field and what was expected
   * @throws E if the local lookup fails
   */
  public <E extends Exception> void check(HistoryBundle b, LocalKinds<E> local) throws E {
    if (b.version() > HistoryBundle.CURRENT_VERSION || b.version() < 1) {
      throw new InvalidInputException(
          source,
          "version",
          "bundle format version "
              + b.version()
              + " is not supported (this program reads versions 1 to "
              + HistoryBundle.CURRENT_VERSION
              + "); use a newer Stagewise");
    }
    records(b);
    references(b, local);
    for (Map.Entry<String, String> entry : bundleKinds.entrySet()) {
      if (!PARENTS.contains(entry.getValue())) {
        continue;
      }
      Optional<String> here = local.kindOf(entry.getKey(), entry.getValue());
      if (here.isPresent() && !here.get().equals(entry.getValue())) {
        throw new InvalidInputException(
            source,
            bundleFields.get(entry.getKey()) + ".id",
            "id "
                + entry.getKey()
                + " is a "
                + here.get()
                + " in this history, not a "
                + entry.getValue());
      }
    }
  }

  private void records(HistoryBundle b) {
    for (int i = 0; i < b.boardModels().size(); i++) {
      BoardModel m = b.boardModels().get(i);
      String at = "boardModels[" + i + "]";
      declare(at, m.id(), BOARD_MODEL);
      Checks.shortText(source, at + ".name", m.name(), true);
      Checks.shortText(source, at + ".maker", m.maker(), false);
      Checks.text(source, at + ".notes", m.notes(), Checks.MAX_TEXT);
      time(at + ".updatedAt", m.updatedAt());
    }
    for (int i = 0; i < b.units().size(); i++) {
      Unit u = b.units().get(i);
      String at = "units[" + i + "]";
      declare(at, u.id(), UNIT);
      Checks.shortText(source, at + ".serial", u.serial(), true);
      Checks.shortText(source, at + ".owner", u.owner(), false);
      time(at + ".updatedAt", u.updatedAt());
    }
    for (int i = 0; i < b.cases().size(); i++) {
      repairCase("cases[" + i + "]", b.cases().get(i));
    }
    for (int i = 0; i < b.stageSheets().size(); i++) {
      StageSheetRecord s = b.stageSheets().get(i);
      String at = "stageSheets[" + i + "]";
      declare(at, s.id(), STAGE_SHEET);
      Checks.shortText(source, at + ".title", s.title(), false);
      Checks.text(source, at + ".sheet", s.sheetJson(), Checks.MAX_SHEET);
      Checks.shortText(source, at + ".savedBy", s.savedBy(), false);
      time(at + ".updatedAt", s.updatedAt());
      time(at + ".savedAt", s.savedAt());
    }
    for (int i = 0; i < b.readings().size(); i++) {
      StoredReading r = b.readings().get(i);
      String at = "readings[" + i + "]";
      declare(at, r.id(), READING);
      Checks.reading(source, at, r);
      time(at + ".takenAt", r.takenAt());
      if (r.struckAt() != null) {
        time(at + ".struckAt", r.struckAt());
      }
      time(at + ".updatedAt", r.updatedAt());
      if (r.updatedAt().isBefore(r.takenAt())) {
        throw new InvalidInputException(
            source,
            at + ".updatedAt",
            "the reading was changed ("
                + r.updatedAt()
                + ") before it was taken ("
                + r.takenAt()
                + "); expected a time at or after takenAt");
      }
    }
    for (int i = 0; i < b.suspectLists().size(); i++) {
      SuspectListRecord s = b.suspectLists().get(i);
      String at = "suspectLists[" + i + "]";
      declare(at, s.id(), SUSPECT_LIST);
      Checks.suspectList(source, at, s);
      time(at + ".computedAt", s.computedAt());
    }
    for (int i = 0; i < b.actions().size(); i++) {
      RepairAction a = b.actions().get(i);
      String at = "actions[" + i + "]";
      declare(at, a.id(), ACTION);
      Checks.action(source, at + ".", a.part(), a.oldValue(), a.newValue(), a.text());
      time(at + ".at", a.at());
      time(at + ".updatedAt", a.updatedAt());
    }
    for (int i = 0; i < b.notes().size(); i++) {
      CaseNote n = b.notes().get(i);
      String at = "notes[" + i + "]";
      declare(at, n.id(), NOTE);
      Checks.text(source, at + ".text", n.text(), Checks.MAX_TEXT);
      time(at + ".at", n.at());
      time(at + ".updatedAt", n.updatedAt());
    }
    for (int i = 0; i < b.photos().size(); i++) {
      StoredPhoto p = b.photos().get(i);
      String at = "photos[" + i + "]";
      declare(at, p.photo().id(), PHOTO);
      Checks.photo(source, at, p);
      time(at + ".attachedAt", p.photo().attachedAt());
    }
    for (int i = 0; i < b.afterRepair().size(); i++) {
      AfterRepairReading r = b.afterRepair().get(i);
      String at = "afterRepair[" + i + "]";
      declare(at, r.id(), AFTER_REPAIR);
      Checks.afterRepair(source, at, r);
      time(at + ".takenAt", r.takenAt());
    }
  }

  private void repairCase(String at, RepairCase c) {
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
    time(at + ".openedAt", c.openedAt());
    if (c.closedAt() != null) {
      time(at + ".closedAt", c.closedAt());
    }
    time(at + ".updatedAt", c.updatedAt());
  }

  private void time(String field, Instant time) {
    if (time.isAfter(latest)) {
      throw new InvalidInputException(
          source,
          field,
          "the time "
              + time
              + " lies in the future (more than a day after this bench's clock, "
              + latest.minus(FUTURE_MARGIN)
              + "); check the clock of the bench that exported the bundle");
    }
  }

  private <E extends Exception> void references(HistoryBundle b, LocalKinds<E> local) throws E {
    for (int i = 0; i < b.stageSheets().size(); i++) {
      refer(
          local,
          "stageSheets[" + i + "].boardModelId",
          b.stageSheets().get(i).boardModelId(),
          BOARD_MODEL);
    }
    for (int i = 0; i < b.units().size(); i++) {
      refer(local, "units[" + i + "].boardModelId", b.units().get(i).boardModelId(), BOARD_MODEL);
    }
    for (int i = 0; i < b.cases().size(); i++) {
      refer(local, "cases[" + i + "].unitId", b.cases().get(i).unitId(), UNIT);
      if (b.cases().get(i).stageSheetId() != null) {
        refer(local, "cases[" + i + "].stageSheetId", b.cases().get(i).stageSheetId(), STAGE_SHEET);
      }
    }
    for (int i = 0; i < b.readings().size(); i++) {
      refer(local, "readings[" + i + "].caseId", b.readings().get(i).caseId(), CASE);
    }
    for (int i = 0; i < b.suspectLists().size(); i++) {
      refer(local, "suspectLists[" + i + "].caseId", b.suspectLists().get(i).caseId(), CASE);
    }
    for (int i = 0; i < b.actions().size(); i++) {
      refer(local, "actions[" + i + "].caseId", b.actions().get(i).caseId(), CASE);
    }
    for (int i = 0; i < b.notes().size(); i++) {
      refer(local, "notes[" + i + "].caseId", b.notes().get(i).caseId(), CASE);
    }
    for (int i = 0; i < b.photos().size(); i++) {
      refer(local, "photos[" + i + "].caseId", b.photos().get(i).photo().caseId(), CASE);
    }
    for (int i = 0; i < b.afterRepair().size(); i++) {
      refer(local, "afterRepair[" + i + "].caseId", b.afterRepair().get(i).caseId(), CASE);
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

  private <E extends Exception> void refer(
      LocalKinds<E> local, String field, String id, String kind) throws E {
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
    Optional<String> here = local.kindOf(id, kind);
    if (here.isPresent() && here.get().equals(kind)) {
      return;
    }
    throw new InvalidInputException(
        source,
        field,
        here.isPresent()
            ? "expected the id of a "
                + kind
                + ", but "
                + id
                + " is a "
                + here.get()
                + " in this history"
            : "no " + kind + " with id " + id + " in the bundle or in this history");
  }
}
