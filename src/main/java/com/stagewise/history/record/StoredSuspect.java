package com.stagewise.history.record;

import java.util.List;
import java.util.Objects;

/**
 * One suspect of a stored suspect list, as the diagnosis gave it at the time.
 *
 * @param fault the fault id (DESIGN.md grammar), e.g. {@code R2:open}
 * @param probability its probability (0 to 1)
 * @param group the fault ids the readings could not tell apart from it (its ambiguity group)
 * @param why the explanation shown to the technician
 * @param rank its place in the list, 1 for the first
 */
public record StoredSuspect(
    String fault, double probability, List<String> group, String why, int rank) {
  public StoredSuspect {
    Times.text(fault, "fault");
    group = List.copyOf(Objects.requireNonNull(group, "group"));
    Times.text(why, "why");
  }
}
