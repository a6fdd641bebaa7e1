package com.stagewise.casework;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Stage;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.StageSheet;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The stages of each board model's library, in versions: what the stage screen and the command line
 * offer for a case, and how the stage a case is diagnosed with is kept.
 *
 * <p>A library stage is known by its board model and its title. A stage used for a case or saved to
 * the library whose parts, nets or values differ from every version of its stage becomes the next
 * version (with who saved it and when); the earlier versions stay. The case keeps the version it is
 * diagnosed with, so that an old case shows and uses that version after later edits.
 */
public final class ModelStages {
  private final HistoryStore store;
  private final String who;

  ModelStages(HistoryStore store, String who) {
    this.store = Objects.requireNonNull(store, "store");
    this.who = Objects.requireNonNull(who, "who");
  }

  /** Returns who is named as having saved the versions this workflow saves. */
  public String who() {
    return who;
  }

  /**
   * Returns the latest version of each stage of the board model, the stage saved most recently
   * first (the one the next unit of the model is offered first).
   *
   * @throws InvalidInputException if a stored sheet is no longer a valid stage sheet (the message
   *     names its title, version and the board model)
   */
  public List<LibraryStage> latest(BoardModel model) {
    return read(store.library().latest(model.id()), model);
  }

  /** Returns every version of the board model's stage titled {@code title}, latest first. */
  public List<LibraryStage> versions(BoardModel model, String title) {
    return read(store.library().versions(model.id(), title), model);
  }

  /**
   * Keeps {@code stage} for the case: the version of its stage (the case's board model, the stage's
   * title) with the same parts, nets and values if there is one, else a new version saved now. The
   * case then records that version, in the same transaction.
   *
   * @return the version the case now uses
   */
  public LibraryStage useForCase(String caseId, Stage stage) {
    CaseAtHand at = caseAtHand(caseId);
    String title = title(stage);
    StageSheetRecord used =
        store.library().useForCase(caseId, title, textFor(at.boardModel(), title, stage), who);
    return new LibraryStage(used, stage);
  }

  /**
   * Saves {@code stage} to the board model's library: the version with the same parts, nets and
   * values if its stage has one, else a new version.
   */
  public LibraryStage save(BoardModel model, Stage stage) {
    String title = title(stage);
    StageSheetRecord saved =
        store.library().save(model.id(), title, textFor(model, title, stage), who);
    return new LibraryStage(saved, stage);
  }

  /**
   * Returns the stage version a case is diagnosed with and how it stands against the latest version
   * of its stage; empty when the case has not recorded one.
   *
   * @throws InvalidInputException if the case is unknown
   */
  public Optional<CaseStage> ofCase(String caseId) {
    CaseAtHand at = caseAtHand(caseId);
    String sheetId = at.repairCase().stageSheetId();
    if (sheetId == null) {
      return Optional.empty();
    }
    Optional<StageSheetRecord> sheet = store.library().find(sheetId);
    if (sheet.isEmpty()) {
      return Optional.empty();
    }
    LibraryStage used = read(List.of(sheet.get()), at.boardModel()).get(0);
    List<StageSheetRecord> versions =
        store.library().versions(at.boardModel().id(), sheet.get().title());
    StageSheetRecord latest = versions.isEmpty() ? sheet.get() : versions.get(0);
    return Optional.of(new CaseStage(used, latest));
  }

  /** The text to store for a stage: the kept version's own text when the stage is the same. */
  private String textFor(BoardModel model, String title, Stage stage) {
    for (StageSheetRecord version : store.library().versions(model.id(), title)) {
      try {
        if (StageSheet.read(version.sheetJson(), source(version, model)).equals(stage)) {
          return version.sheetJson();
        }
      } catch (InvalidInputException e) {
        // A stored version that no longer reads is not the same stage; the new one is saved.
      }
    }
    return StageSheet.write(stage);
  }

  private CaseAtHand caseAtHand(String caseId) {
    RepairCase rc =
        store
            .cases()
            .find(caseId)
            .orElseThrow(
                () -> new InvalidInputException("history", "case", "no case has the id " + caseId));
    Unit unit = store.units().find(rc.unitId()).orElseThrow();
    BoardModel model = store.units().findBoardModel(unit.boardModelId()).orElseThrow();
    return new CaseAtHand(rc, unit, model);
  }

  private static String title(Stage stage) {
    return stage.title().strip();
  }

  private static List<LibraryStage> read(List<StageSheetRecord> sheets, BoardModel model) {
    List<LibraryStage> stages = new ArrayList<>();
    for (StageSheetRecord sheet : sheets) {
      stages.add(new LibraryStage(sheet, StageSheet.read(sheet.sheetJson(), source(sheet, model))));
    }
    return stages;
  }

  static String source(StageSheetRecord sheet, BoardModel model) {
    return "stage sheet '" + sheet.title() + "' version " + sheet.version() + " of " + model.name();
  }
}
