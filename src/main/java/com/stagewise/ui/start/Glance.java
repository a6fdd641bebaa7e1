package com.stagewise.ui.start;

import com.stagewise.history.CaseFile;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;

/** A unit's cases at a glance, newest first, as the unit screen lists them. */
final class Glance {
  private Glance() {}

  /** Returns one line for each case of the unit, newest first. */
  static List<StartViewModel.CaseLine> of(UnitHistory history) {
    List<StartViewModel.CaseLine> lines = new ArrayList<>();
    for (CaseFile file : history.cases()) {
      RepairCase rc = file.repairCase();
      List<String> replaced = new ArrayList<>();
      for (RepairAction action : file.actions()) {
        if (action.kind() == ActionKind.PART_REPLACED) {
          replaced.add(
              action.part() + (action.newValue().isEmpty() ? "" : " → " + action.newValue()));
        } else if (action.kind() == ActionKind.REFLOW) {
          replaced.add("reflow" + (action.part().isEmpty() ? "" : " " + action.part()));
        }
      }
      boolean open = rc.status() == CaseStatus.OPEN;
      lines.add(
          new StartViewModel.CaseLine(
              rc.id(),
              Words.date(rc.openedAt()),
              rc.symptom(),
              open ? "open" : Words.outcome(rc.outcome()),
              String.join(", ", rc.confirmedFaults().stream().map(Words::fault).toList()),
              String.join(", ", replaced),
              open));
    }
    // Newest first, as a technician reads a history.
    java.util.Collections.reverse(lines);
    return lines;
  }
}
