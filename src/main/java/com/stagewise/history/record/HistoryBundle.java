package com.stagewise.history.record;

import java.time.Instant;
import java.util.List;
import java.util.Objects;

/**
 * A part or the whole of a shop's history, as carried between benches in one file.
 *
 * <p>Records refer to each other by id; a bundle holds every board model, unit and case that its
 * other records refer to, so that it can be imported on its own.
 *
 * @param version the bundle format version
 * @param exportedAt when it was exported
 * @param programVersion the Stagewise version that exported it
 * @param photos the photos of the board attached to its cases, with their pictures
 * @param afterRepair the readings taken again after the repair in its cases
 */
public record HistoryBundle(
    int version,
    Instant exportedAt,
    String programVersion,
    List<BoardModel> boardModels,
    List<StageSheetRecord> stageSheets,
    List<Unit> units,
    List<RepairCase> cases,
    List<StoredReading> readings,
    List<SuspectListRecord> suspectLists,
    List<RepairAction> actions,
    List<CaseNote> notes,
    List<StoredPhoto> photos,
    List<AfterRepairReading> afterRepair) {

  /** The {@code format} word of a history bundle file. */
  public static final String FORMAT = "stagewise-history";

  /**
   * The newest bundle format version this program reads and the one it writes (2: readings may be
   * ohms readings, with {@code "to"} and {@code "OL"}; 3: stage sheets carry their version number,
   * who saved them and when, and cases the stage version they are diagnosed with; 4: photos of the
   * board attached to cases; 5: readings taken again after the repair; 6: those readings of every
   * kind, AC with its measure and frequency and ohms with its second point). Bundles of earlier
   * versions are read as before.
   */
  public static final int CURRENT_VERSION = 6;

  /**
   * The first bundle format version whose stage sheets carry version numbers; a sheet of an earlier
   * bundle becomes the next version of its stage unless its text is kept already.
   */
  public static final int STAGE_VERSIONS = 3;

  /** Returns whether this bundle's stage sheets carry their version numbers. */
  public boolean numbersStageVersions() {
    return version >= STAGE_VERSIONS;
  }

  public HistoryBundle {
    exportedAt = Times.millis(Objects.requireNonNull(exportedAt, "exportedAt"));
    Times.text(programVersion, "programVersion");
    boardModels = List.copyOf(boardModels);
    stageSheets = List.copyOf(stageSheets);
    units = List.copyOf(units);
    cases = List.copyOf(cases);
    readings = List.copyOf(readings);
    suspectLists = List.copyOf(suspectLists);
    actions = List.copyOf(actions);
    notes = List.copyOf(notes);
    photos = List.copyOf(photos);
    afterRepair = List.copyOf(afterRepair);
  }

  /** A bundle without readings after the repair (every bundle before format 5). */
  public HistoryBundle(
      int version,
      Instant exportedAt,
      String programVersion,
      List<BoardModel> boardModels,
      List<StageSheetRecord> stageSheets,
      List<Unit> units,
      List<RepairCase> cases,
      List<StoredReading> readings,
      List<SuspectListRecord> suspectLists,
      List<RepairAction> actions,
      List<CaseNote> notes,
      List<StoredPhoto> photos) {
    this(
        version,
        exportedAt,
        programVersion,
        boardModels,
        stageSheets,
        units,
        cases,
        readings,
        suspectLists,
        actions,
        notes,
        photos,
        List.of());
  }

  /** A bundle without photos (every bundle before format 4). */
  public HistoryBundle(
      int version,
      Instant exportedAt,
      String programVersion,
      List<BoardModel> boardModels,
      List<StageSheetRecord> stageSheets,
      List<Unit> units,
      List<RepairCase> cases,
      List<StoredReading> readings,
      List<SuspectListRecord> suspectLists,
      List<RepairAction> actions,
      List<CaseNote> notes) {
    this(
        version,
        exportedAt,
        programVersion,
        boardModels,
        stageSheets,
        units,
        cases,
        readings,
        suspectLists,
        actions,
        notes,
        List.of(),
        List.of());
  }

  /** Returns the number of records of every kind together. */
  public int size() {
    return boardModels.size()
        + stageSheets.size()
        + units.size()
        + cases.size()
        + readings.size()
        + suspectLists.size()
        + actions.size()
        + notes.size()
        + photos.size()
        + afterRepair.size();
  }
}
