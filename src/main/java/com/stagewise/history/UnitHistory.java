package com.stagewise.history;

import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Unit;
import java.util.List;

/**
 * A unit's whole history: the unit, its board model and every case, oldest first.
 *
 * @param unit the unit
 * @param boardModel its board model
 * @param cases its cases with everything in them, oldest first
 */
public record UnitHistory(Unit unit, BoardModel boardModel, List<CaseFile> cases) {
  public UnitHistory {
    cases = List.copyOf(cases);
  }
}
