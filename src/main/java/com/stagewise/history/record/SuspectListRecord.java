package com.stagewise.history.record;

import java.time.Instant;
import java.util.List;
import java.util.Objects;

/**
 * A suspect list as the diagnosis computed it for a case, kept so that it can be shown later
 * exactly as it was, with the program version that computed it.
 *
 * @param id stable id (UUID)
 * @param caseId the case it belongs to
 * @param computedAt when it was computed
 * @param programVersion the Stagewise version that computed it
 * @param verdict {@code healthy}, {@code fault} or {@code inconclusive}
 * @param suspects the suspects, ranked (the first is the most probable)
 * @param nextProbes the proposed next probes as text, one per line (may be empty)
 */
public record SuspectListRecord(
    String id,
    String caseId,
    Instant computedAt,
    String programVersion,
    String verdict,
    List<StoredSuspect> suspects,
    String nextProbes) {
  public SuspectListRecord {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(caseId, "caseId");
    computedAt = Times.millis(Objects.requireNonNull(computedAt, "computedAt"));
    Times.text(programVersion, "programVersion");
    Times.text(verdict, "verdict");
    suspects = List.copyOf(suspects);
    Times.text(nextProbes, "nextProbes");
  }
}
