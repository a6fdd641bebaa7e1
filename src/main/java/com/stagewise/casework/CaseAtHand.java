package com.stagewise.casework;

import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import java.util.Objects;

/**
 * A case with the unit it is about and that unit's board model.
 *
 * @param repairCase the case
 * @param unit its unit
 * @param boardModel the unit's board model
 */
public record CaseAtHand(RepairCase repairCase, Unit unit, BoardModel boardModel) {
  public CaseAtHand {
    Objects.requireNonNull(repairCase, "repairCase");
    Objects.requireNonNull(unit, "unit");
    Objects.requireNonNull(boardModel, "boardModel");
  }

  /** Returns the case's id. */
  public String id() {
    return repairCase.id();
  }
}
