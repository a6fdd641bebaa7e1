package com.stagewise.history;

import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import java.util.List;

/**
 * Everything about one case, each list in time order.
 *
 * @param repairCase the case itself
 * @param readings the readings taken
 * @param suspectLists the suspect lists as computed at the time
 * @param actions what was done
 * @param notes the notes
 * @param photos the photos of the board attached to it, in the order attached (without their
 *     pictures: {@link Cases#photo} reads one)
 * @param afterRepair the readings taken again after the repair, in the order taken (never part of a
 *     diagnosis)
 */
public record CaseFile(
    RepairCase repairCase,
    List<StoredReading> readings,
    List<SuspectListRecord> suspectLists,
    List<RepairAction> actions,
    List<CaseNote> notes,
    List<CasePhoto> photos,
    List<AfterRepairReading> afterRepair) {
  public CaseFile {
    afterRepair = List.copyOf(afterRepair);
    readings = List.copyOf(readings);
    suspectLists = List.copyOf(suspectLists);
    actions = List.copyOf(actions);
    notes = List.copyOf(notes);
    photos = List.copyOf(photos);
  }

  /** A case with no photos. */
  public CaseFile(
      RepairCase repairCase,
      List<StoredReading> readings,
      List<SuspectListRecord> suspectLists,
      List<RepairAction> actions,
      List<CaseNote> notes) {
    this(repairCase, readings, suspectLists, actions, notes, List.of(), List.of());
  }

  /** A case with no readings after the repair. */
  public CaseFile(
      RepairCase repairCase,
      List<StoredReading> readings,
      List<SuspectListRecord> suspectLists,
      List<RepairAction> actions,
      List<CaseNote> notes,
      List<CasePhoto> photos) {
    this(repairCase, readings, suspectLists, actions, notes, photos, List.of());
  }
}
