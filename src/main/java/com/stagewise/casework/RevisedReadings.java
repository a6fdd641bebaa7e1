package com.stagewise.casework;

import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import java.util.List;

/**
 * What striking out, restoring or correcting readings stored.
 *
 * @param changed the readings struck out or restored, as the history now keeps them
 * @param added the readings added in their place, as the history keeps them
 * @param suspectList the suspect list of the readings that stand, or null when none stands
 * @param diagnosis the diagnosis of the readings that stand, or null when none stands
 */
public record RevisedReadings(
    List<StoredReading> changed,
    List<StoredReading> added,
    SuspectListRecord suspectList,
    Diagnosis diagnosis) {
  public RevisedReadings {
    changed = List.copyOf(changed);
    added = List.copyOf(added);
  }
}
