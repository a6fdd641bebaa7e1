package com.stagewise.history.sync;

import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/** Splits a bundle into smaller ones that each stand on their own. */
final class Bundles {
  private Bundles() {}

  /** Returns how many records a bundle holds. */
  static int size(HistoryBundle b) {
    return b.boardModels().size()
        + b.stageSheets().size()
        + b.units().size()
        + b.cases().size()
        + b.readings().size()
        + b.suspectLists().size()
        + b.actions().size()
        + b.notes().size()
        + b.photos().size()
        + b.afterRepair().size();
  }

  /**
   * Returns the bundle as a first bundle of its board models, stage sheets and units, then bundles
   * of at most {@code casesPerBundle} cases with their records; each case bundle repeats the units
   * and board models its cases belong to, since the receiving side may know them under other ids.
   */
  static List<HistoryBundle> split(HistoryBundle b, int casesPerBundle) {
    List<HistoryBundle> out = new ArrayList<>();
    if (!b.boardModels().isEmpty() || !b.stageSheets().isEmpty() || !b.units().isEmpty()) {
      out.add(
          new HistoryBundle(
              b.version(),
              b.exportedAt(),
              b.programVersion(),
              b.boardModels(),
              b.stageSheets(),
              b.units(),
              List.of(),
              List.of(),
              List.of(),
              List.of(),
              List.of()));
    }
    Map<String, BoardModel> models = new HashMap<>();
    b.boardModels().forEach(m -> models.put(m.id(), m));
    Map<String, Unit> units = new HashMap<>();
    b.units().forEach(u -> units.put(u.id(), u));
    List<RepairCase> cases = b.cases();
    for (int from = 0; from < cases.size(); from += casesPerBundle) {
      List<RepairCase> part = cases.subList(from, Math.min(cases.size(), from + casesPerBundle));
      Set<String> caseIds = new LinkedHashSet<>();
      Set<Unit> partUnits = new LinkedHashSet<>();
      Set<BoardModel> partModels = new LinkedHashSet<>();
      for (RepairCase c : part) {
        caseIds.add(c.id());
        Unit u = units.get(c.unitId());
        if (u != null) {
          partUnits.add(u);
          BoardModel m = models.get(u.boardModelId());
          if (m != null) {
            partModels.add(m);
          }
        }
      }
      out.add(
          new HistoryBundle(
              b.version(),
              b.exportedAt(),
              b.programVersion(),
              List.copyOf(partModels),
              List.of(),
              List.copyOf(partUnits),
              part,
              b.readings().stream().filter(r -> caseIds.contains(r.caseId())).toList(),
              b.suspectLists().stream().filter(r -> caseIds.contains(r.caseId())).toList(),
              b.actions().stream().filter(r -> caseIds.contains(r.caseId())).toList(),
              b.notes().stream().filter(r -> caseIds.contains(r.caseId())).toList(),
              b.photos().stream().filter(r -> caseIds.contains(r.photo().caseId())).toList(),
              b.afterRepair().stream().filter(r -> caseIds.contains(r.caseId())).toList()));
    }
    return out;
  }
}
