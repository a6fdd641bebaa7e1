package com.stagewise.casework;

import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import java.util.List;
import java.util.Objects;

/**
 * What adding readings to a case stored: the readings, the suspect list computed from every reading
 * of the case, and the diagnosis it came from.
 *
 * @param readings the readings added, as the history keeps them
 * @param suspectList the suspect list, as the history keeps it
 * @param diagnosis the diagnosis of every reading taken (for the screen or the printout)
 */
public record StoredReadings(
    List<StoredReading> readings, SuspectListRecord suspectList, Diagnosis diagnosis) {
  public StoredReadings {
    readings = List.copyOf(readings);
    Objects.requireNonNull(suspectList, "suspectList");
    Objects.requireNonNull(diagnosis, "diagnosis");
  }
}
