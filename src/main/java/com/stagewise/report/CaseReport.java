package com.stagewise.report;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.CaseFile;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.Unit;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * What a repair report shows: one case with its unit and board model, when the report was made and
 * by which program version.
 *
 * @param unit the unit repaired
 * @param boardModel the unit's board model
 * @param caseFile the case with its readings, suspect lists, actions and notes
 * @param generatedAt when the report was made (printed in UTC)
 * @param programVersion the Stagewise version that made it
 * @param photos the case's photos of the board with their pictures, in the order attached
 */
public record CaseReport(
    Unit unit,
    BoardModel boardModel,
    CaseFile caseFile,
    Instant generatedAt,
    String programVersion,
    List<StoredPhoto> photos) {
  public CaseReport {
    photos = List.copyOf(photos);
    Objects.requireNonNull(unit, "unit");
    Objects.requireNonNull(boardModel, "boardModel");
    Objects.requireNonNull(caseFile, "caseFile");
    Objects.requireNonNull(generatedAt, "generatedAt");
    Objects.requireNonNull(programVersion, "programVersion");
    if (!caseFile.repairCase().unitId().equals(unit.id())
        || !unit.boardModelId().equals(boardModel.id())) {
      throw new IllegalArgumentException(
          "the case, the unit and the board model do not belong together");
    }
  }

  /** A report of a case without photos. */
  public CaseReport(
      Unit unit,
      BoardModel boardModel,
      CaseFile caseFile,
      Instant generatedAt,
      String programVersion) {
    this(unit, boardModel, caseFile, generatedAt, programVersion, List.of());
  }

  /**
   * Returns the report of the case with id {@code caseId} (the whole id; see {@link
   * HistoryStore#resolveCaseId}) as the history holds it now.
   *
   * @throws InvalidInputException if there is no such case
   */
  public static CaseReport read(
      HistoryStore store, String caseId, Instant generatedAt, String programVersion) {
    CaseFile file =
        store
            .cases()
            .caseFile(caseId)
            .orElseThrow(
                () ->
                    new InvalidInputException(
                        "history", "case", "no case has the id '" + caseId + "'"));
    Unit unit = store.units().find(file.repairCase().unitId()).orElseThrow();
    BoardModel model = store.units().findBoardModel(unit.boardModelId()).orElseThrow();
    List<StoredPhoto> photos = new ArrayList<>();
    for (CasePhoto photo : file.photos()) {
      store.cases().photo(photo.id()).ifPresent(photos::add);
    }
    return new CaseReport(unit, model, file, generatedAt, programVersion, photos);
  }
}
