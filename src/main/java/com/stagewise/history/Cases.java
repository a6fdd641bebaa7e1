package com.stagewise.history;

import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/** Repair cases and everything recorded in them: readings, suspect lists, notes and actions. */
public interface Cases {

  /**
   * Opens a case for a unit with the symptom as reported, and returns it.
   *
   * @throws com.stagewise.circuit.InvalidInputException if the unit is unknown or the symptom too
   *     long
   */
  RepairCase open(String unitId, String symptom);

  /**
   * Closes out a case: records its outcome and the faults found to be wrong, and returns it.
   *
   * @param confirmedFaults fault ids in the DESIGN.md grammar (may be empty, e.g. when returned)
   * @throws com.stagewise.circuit.InvalidInputException if the case is unknown or already closed,
   *     or a fault id is bad
   */
  RepairCase close(String caseId, Outcome outcome, List<String> confirmedFaults);

  /**
   * Closes out a case together with its closing note and the actions taken, in one transaction:
   * everything is checked first (the case, the fault ids, the note's and every action's text), and
   * on any problem nothing is written and the case stays open.
   *
   * @throws com.stagewise.circuit.InvalidInputException as {@link #close}, {@link #addNote} and
   *     {@link #addAction} do
   */
  RepairCase close(String caseId, CloseOut closeOut);

  /** Returns the case with this id, if there is one. */
  Optional<RepairCase> find(String caseId);

  /**
   * Returns the id of the one case whose id starts with {@code prefix} (at least 4 characters), so
   * that people can type the short ids that listings show.
   *
   * @throws com.stagewise.circuit.InvalidInputException if no case or more than one case matches
   */
  String resolveId(String prefix);

  /**
   * Stores readings taken in a case together with the suspect list computed from them (if any), in
   * one transaction.
   *
   * @param suspectList the diagnosis at the time, or null if none was computed
   */
  void addReadings(String caseId, List<StoredReading> readings, SuspectListRecord suspectList);

  /**
   * Strikes out readings of a case and restores struck ones, adds the readings that replace them,
   * and stores the suspect list of the readings that then stand, in one transaction. Nothing is
   * deleted: a struck reading stays in the history, marked with when it was struck, and is left out
   * of later diagnoses; a correction is a strike plus a new reading.
   *
   * @param revision what to strike, restore and add
   * @param suspectList the diagnosis of the readings that stand afterwards, or null if none was
   *     computed
   * @return the struck and restored readings as now stored, strikes first, each in the order given
   * @throws com.stagewise.circuit.InvalidInputException if the case is unknown, a reading id is not
   *     one of the case's readings, or an added reading is bad; nothing is then written
   */
  List<StoredReading> reviseReadings(
      String caseId, Revision revision, SuspectListRecord suspectList);

  /** Adds a time-stamped note to a case and returns it. */
  CaseNote addNote(String caseId, String text);

  /** Records something done to the unit in a case and returns it. */
  RepairAction addAction(
      String caseId, ActionKind kind, String part, String oldValue, String newValue, String text);

  /**
   * Attaches a photo of the board to a case and returns what is now listed with the case: the
   * picture is stored exactly as given, with its file name, when and by whom it was attached.
   *
   * @throws com.stagewise.circuit.InvalidInputException if the case is unknown, the picture is not
   *     a PNG or JPEG or larger than {@link Checks#MAX_PHOTO_BYTES}, or the file name is empty or
   *     too long; nothing is then written
   */
  CasePhoto attachPhoto(String caseId, PhotoDraft draft);

  /**
   * Stores readings taken again after the repair, each with the healthy band it was checked
   * against, in one transaction. They are kept apart from the readings of the fault: no diagnosis
   * counts them.
   *
   * @throws com.stagewise.circuit.InvalidInputException if the case is unknown, or a reading's
   *     point, value, band or meter text is bad; nothing is then written
   */
  void addAfterRepair(String caseId, List<AfterRepairReading> readings);

  /** Returns a photo with its picture, if there is one with this id. */
  Optional<StoredPhoto> photo(String photoId);

  /** Returns everything about one case. */
  Optional<CaseFile> caseFile(String caseId);

  /** Returns a unit's whole history, if the unit exists. */
  Optional<UnitHistory> unitHistory(String unitId);

  /** Returns the cases that match {@code query}; see {@link SearchQuery} for the order. */
  List<SearchHit> search(SearchQuery query);

  /**
   * Returns, for a board model (name or id), how many closed cases with outcome {@code fixed}
   * confirmed each fault id, most often first; empty for an unknown model.
   */
  Map<String, Integer> confirmedFaultCounts(String boardModel);

  /**
   * A change to a case's readings: readings struck out, struck ones standing again, new ones.
   *
   * @param strike ids of readings to strike out (one already struck keeps its time)
   * @param restore ids of struck readings to stand again (one that stands is left as it is)
   * @param added new readings, e.g. the right value in place of a mistyped one
   */
  record Revision(List<String> strike, List<String> restore, List<StoredReading> added) {
    public Revision {
      strike = List.copyOf(strike);
      restore = List.copyOf(restore);
      added = List.copyOf(added);
    }
  }

  /**
   * Everything a close-out records.
   *
   * @param outcome how the case ended
   * @param confirmedFaults the faults found to be wrong (fault ids)
   * @param note the closing note, or empty for none
   * @param actions what was done, in order
   */
  record CloseOut(
      Outcome outcome, List<String> confirmedFaults, String note, List<ActionDraft> actions) {
    public CloseOut {
      Objects.requireNonNull(outcome, "outcome");
      confirmedFaults = List.copyOf(confirmedFaults);
      note = note == null ? "" : note;
      actions = List.copyOf(actions);
    }
  }

  /**
   * A photo to be attached, before it has an id and a time.
   *
   * @param fileName the name of the file it came from, without its folder
   * @param image the picture file's bytes
   * @param attachedBy who attaches it (may be empty)
   */
  record PhotoDraft(String fileName, byte[] image, String attachedBy) {
    public PhotoDraft {
      Objects.requireNonNull(fileName, "fileName");
      Objects.requireNonNull(image, "image");
      attachedBy = attachedBy == null ? "" : attachedBy;
    }
  }

  /**
   * An action to be recorded, before it has an id and a time.
   *
   * @param kind what kind of action
   * @param part the part it concerns (may be empty)
   * @param oldValue the value taken out (may be empty)
   * @param newValue the value put in (may be empty)
   * @param text what was done, in words (may be empty)
   */
  record ActionDraft(ActionKind kind, String part, String oldValue, String newValue, String text) {
    public ActionDraft {
      Objects.requireNonNull(kind, "kind");
    }
  }
}
