package com.stagewise.history;

import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import java.time.Instant;
import java.util.List;

/**
 * One case found by a search, with what is needed to show it in a list.
 *
 * @param caseId the case's id
 * @param unitId the unit's id
 * @param serial the unit's serial number
 * @param boardModel the board model's name
 * @param status open or closed
 * @param outcome the outcome, or null while open
 * @param openedAt when the case was opened
 * @param symptom the reported symptom
 * @param confirmedFaults the confirmed fault ids (empty while open)
 * @param snippet the matching words in context, with the matches in [brackets], for a text search;
 *     else the start of the symptom
 * @param score relevance for a text search (higher is better); 0 otherwise
 */
public record SearchHit(
    String caseId,
    String unitId,
    String serial,
    String boardModel,
    CaseStatus status,
    Outcome outcome,
    Instant openedAt,
    String symptom,
    List<String> confirmedFaults,
    String snippet,
    double score) {
  public SearchHit {
    confirmedFaults = List.copyOf(confirmedFaults);
  }
}
