package com.stagewise.history;

import java.time.Instant;
import java.util.Objects;

/** Which part of the history to export: all of it, one unit, one board model, or a date range. */
public sealed interface ExportSelection {

  /** The whole history, including board models and units without cases. */
  record All() implements ExportSelection {}

  /** One unit with its board model (and its stage sheets) and all its cases. */
  record OneUnit(String unitId) implements ExportSelection {
    public OneUnit {
      Objects.requireNonNull(unitId, "unitId");
    }
  }

  /** One board model with its stage sheets, all its units and all their cases. */
  record OneBoardModel(String boardModelId) implements ExportSelection {
    public OneBoardModel {
      Objects.requireNonNull(boardModelId, "boardModelId");
    }
  }

  /** The cases opened in {@code [from, before)}, with their units and board models. */
  record OpenedBetween(Instant from, Instant before) implements ExportSelection {
    public OpenedBetween {
      Objects.requireNonNull(from, "from");
      Objects.requireNonNull(before, "before");
    }
  }
}
