package com.stagewise.ui;

import com.stagewise.history.record.StoredReading;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * Tells the technician about a case's stored readings that the stage on the bench has no point for
 * (they were taken on another stage): they stay in the history, left off the bench.
 */
public final class ReadingsLeftOff {
  private ReadingsLeftOff() {}

  /** Shows the problem for {@code leftOff}; nothing when it is empty. */
  public static void tell(Problems problems, List<StoredReading> leftOff) {
    if (leftOff.isEmpty()) {
      return;
    }
    Set<String> points = new LinkedHashSet<>();
    for (StoredReading r : leftOff) {
      points.add(r.to() == null || r.to().isEmpty() ? r.at() : r.at() + " to " + r.to());
    }
    int n = leftOff.size();
    problems.show(
        n == 1
            ? "1 reading of this case is not on this stage"
            : n + " readings of this case are not on this stage",
        (n == 1 ? "It was" : "They were")
            + " taken at "
            + String.join(", ", points)
            + ", which this stage does not have. "
            + (n == 1 ? "It stays" : "They stay")
            + " in the case's history (history show lists "
            + (n == 1 ? "it" : "them")
            + ") and "
            + (n == 1 ? "is" : "are")
            + " left out of the diagnosis here.",
        "If the readings were taken on another stage, choose that stage on the Stage screen.");
  }
}
