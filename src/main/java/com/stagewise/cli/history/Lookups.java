package com.stagewise.cli.history;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Unit;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** Finding what the command line names (a board model, a unit by serial, a date). */
final class Lookups {
  private Lookups() {}

  static BoardModel requireModel(HistoryStore store, String name) {
    return store
        .units()
        .findBoardModel(name)
        .orElseThrow(
            () ->
                new InvalidInputException(
                    "command line",
                    "--model",
                    "no board model named '" + name + "' (see 'history models')"));
  }

  static Unit requireUnit(HistoryStore store, String serial, String model) {
    List<Unit> units = store.units().bySerial(serial);
    if (model != null) {
      String modelId = requireModel(store, model).id();
      units = units.stream().filter(u -> u.boardModelId().equals(modelId)).toList();
    }
    if (units.isEmpty()) {
      throw new InvalidInputException(
          "command line",
          "--serial",
          "no unit with serial '"
              + serial
              + "'"
              + (model == null ? "" : " of " + model)
              + " (add it with 'history add-unit')");
    }
    if (units.size() > 1) {
      throw new InvalidInputException(
          "command line",
          "--model",
          "several board models have a unit with serial '"
              + serial
              + "'; name the model with --model");
    }
    return units.get(0);
  }

  static Map<String, BoardModel> modelsById(HistoryStore store) {
    Map<String, BoardModel> models = new LinkedHashMap<>();
    store.units().boardModels().forEach(m -> models.put(m.id(), m));
    return models;
  }

  /**
   * Returns a date (UTC; as an upper bound, the end of that day) or a UTC time given on the command
   * line.
   */
  static Instant time(String option, String text, boolean endOfDay) {
    try {
      LocalDate date = LocalDate.parse(text.strip());
      return (endOfDay ? date.plusDays(1) : date).atStartOfDay(ZoneOffset.UTC).toInstant();
    } catch (DateTimeParseException notADate) {
      try {
        return Instant.parse(text.strip());
      } catch (DateTimeParseException e) {
        throw new InvalidInputException(
            "command line",
            option,
            "expected a date such as 2026-03-01 or a UTC time such as 2026-03-01T14:30:00Z, got '"
                + text
                + "'");
      }
    }
  }
}
