package com.stagewise.history;

import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.StageSheetRecord;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The stage sheets of each board model, kept as their JSON text exactly, in versions.
 *
 * <p>A library stage is known by its board model and its title (letter case aside). Saving a stage
 * whose text differs from every version of it adds the next version (numbered one above the
 * highest, with who saved it and when); the earlier versions stay as they were. See {@link
 * StageVersions} for the rules.
 *
 * <p>The store checks the text's limits only; whether a sheet is a valid stage is the stage sheet
 * reader's job, which callers run before adding it.
 */
public interface StageLibrary {

  /**
   * Adds a stage sheet (its JSON text, kept exactly) to a board model as a version of its stage,
   * saved by nobody named, and returns it ({@link #save} with an empty name).
   */
  StageSheetRecord add(String boardModelId, String title, String sheetJson);

  /**
   * Saves a stage sheet as a version of the board model's stage titled {@code title}: the version
   * with exactly this text if the stage has one (nothing is written then), else a new version
   * numbered one above the highest, saved by {@code savedBy} now.
   *
   * @throws com.stagewise.circuit.InvalidInputException if the board model is unknown or a text is
   *     over its limits
   */
  StageSheetRecord save(String boardModelId, String title, String sheetJson, String savedBy);

  /**
   * Saves a stage sheet as {@link #save} does for the case's board model and records that the case
   * is diagnosed with that version, in one transaction.
   *
   * @return the version the case now uses
   * @throws com.stagewise.circuit.InvalidInputException if the case is unknown or a text is over
   *     its limits
   */
  StageSheetRecord useForCase(String caseId, String title, String sheetJson, String savedBy);

  /** Returns the stage sheets of a board model, every version, in the order they were added. */
  List<StageSheetRecord> sheets(String boardModelId);

  /** Returns the versions of the board model's stage titled {@code title}, latest first. */
  List<StageSheetRecord> versions(String boardModelId, String title);

  /**
   * Returns the latest version of each stage of a board model, the stage saved most recently first
   * (the one the next unit of the model is offered first).
   */
  default List<StageSheetRecord> latest(String boardModelId) {
    return StageVersions.latestOfEach(sheets(boardModelId));
  }

  /** Returns the stage sheet (one version) with this id. */
  Optional<StageSheetRecord> find(String sheetId);

  /**
   * Returns the board model named {@code name} (adding it if there is none) after adding {@code
   * sheets} to it, in one transaction: every sheet is checked first, and if any is refused neither
   * the model nor any sheet is written.
   *
   * @throws com.stagewise.circuit.InvalidInputException naming the sheet that was refused
   */
  BoardModel addBoardModel(String name, String maker, List<SheetDraft> sheets);

  /**
   * A stage sheet to be added.
   *
   * @param title its title (may be empty)
   * @param sheetJson the sheet's JSON text
   */
  record SheetDraft(String title, String sheetJson) {
    public SheetDraft {
      Objects.requireNonNull(title, "title");
      Objects.requireNonNull(sheetJson, "sheetJson");
    }
  }
}
