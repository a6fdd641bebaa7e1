package com.stagewise.history;

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
 */
public record CaseFile(
    RepairCase repairCase,
    List<StoredReading> readings,
    List<SuspectListRecord> suspectLists,
    List<RepairAction> actions,
    List<CaseNote> notes,
    List<CasePhoto> photos) {
  public CaseFile {
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
    this(repairCase, readings, suspectLists, actions, notes, List.of());
  }
}
