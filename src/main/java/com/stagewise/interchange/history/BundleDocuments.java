package com.stagewise.interchange.history;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Limits;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingRules;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.StageRules;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.StageSheet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;

/**
 * Checks the documents a bundle carries with the same rules as the files they came from, before
 * anything of the bundle is written: every stage sheet through the stage sheet reader, every
 * reading with {@link ReadingRules} (its value within the plausible range of the rails of its board
 * model's sheets in the bundle, or of any rail when the bundle carries none), and every reading
 * taken after the repair, its value and its band's ends, by the same rules. A problem is named by
 * the bundle's file, the record's path and the path inside the document, e.g. {@code shop.json:
 * stageSheets[2].sheet.parts[1].value: …}.
 */
final class BundleDocuments {
  private BundleDocuments() {}

  /**
   * Checks every document in {@code bundle}.
   *
   * @param source the bundle's file, named in messages
   * @throws InvalidInputException for the first document that its reader refuses
   */
  static void check(HistoryBundle bundle, String source) {
    // The largest rail or input of each board model's sheets, to judge its readings by.
    Map<String, Double> largestByModel = new HashMap<>();
    for (int i = 0; i < bundle.stageSheets().size(); i++) {
      StageSheetRecord sheet = bundle.stageSheets().get(i);
      String at = "stageSheets[" + i + "].sheet";
      Stage stage;
      try {
        stage = StageSheet.read(sheet.sheetJson(), "");
      } catch (InvalidInputException e) {
        throw inside(source, at, e);
      }
      largestByModel.merge(sheet.boardModelId(), Limits.largestDrivenVolts(stage), Math::max);
    }
    Map<String, String> modelOfUnit = new HashMap<>();
    for (Unit unit : bundle.units()) {
      modelOfUnit.put(unit.id(), unit.boardModelId());
    }
    Map<String, String> modelOfCase = new HashMap<>();
    for (RepairCase c : bundle.cases()) {
      modelOfCase.put(c.id(), modelOfUnit.getOrDefault(c.unitId(), ""));
    }
    List<StoredReading> readings = bundle.readings();
    for (int i = 0; i < readings.size(); i++) {
      StoredReading stored = readings.get(i);
      String at = "readings[" + i + "]";
      if (stored.at().isBlank()) {
        // The bundle check of every record says so, in its words (BundleCheck).
        continue;
      }
      double largest =
          largestByModel.getOrDefault(
              modelOfCase.getOrDefault(stored.caseId(), ""), Limits.RAIL_VOLTS.max());
      Reading reading;
      try {
        reading = reading(stored);
      } catch (InvalidInputException e) {
        String key =
            e.field().equals("hz") || e.field().equals("uncertainty") || e.field().equals("to")
                ? e.field()
                : "value";
        throw new InvalidInputException(source, at + "." + key, problemOf(e));
      }
      List<StageRules.Problem> problems = ReadingRules.storedProblems(reading, largest);
      if (!problems.isEmpty()) {
        StageRules.Problem first = problems.get(0);
        throw new InvalidInputException(source, at + "." + first.field(), first.message());
      }
    }
    List<AfterRepairReading> after = bundle.afterRepair();
    for (int i = 0; i < after.size(); i++) {
      AfterRepairReading r = after.get(i);
      if (r.at().isBlank() || r.kind() == ReadingKind.OHMS && r.to().isBlank()) {
        continue; // BundleCheck names the empty point.
      }
      double largest =
          largestByModel.getOrDefault(
              modelOfCase.getOrDefault(r.caseId(), ""), Limits.RAIL_VOLTS.max());
      checkAfterRepair(source, "afterRepair[" + i + "]", r, "value", r.value(), largest);
      if (r.hasBand()) {
        checkAfterRepair(
            source, "afterRepair[" + i + "]", r, "healthyLow", r.healthyLow(), largest);
        checkAfterRepair(
            source, "afterRepair[" + i + "]", r, "healthyHigh", r.healthyHigh(), largest);
      }
    }
  }

  /**
   * Checks one number of a reading after the repair (its value or an end of its band) as a reading
   * of its kind at its point would be checked ({@link ReadingRules#storedProblems}): volts within
   * the plausible range of its board model's rails, an AC frequency in range, ohms within the range
   * of a resistor or OL. {@code key} names the number in the message.
   */
  private static void checkAfterRepair(
      String source, String at, AfterRepairReading r, String key, double value, double largest) {
    Reading reading;
    try {
      reading =
          new Reading(
              r.at(),
              switch (r.kind()) {
                case AC -> Reading.Kind.AC;
                case DC -> Reading.Kind.DC;
                case OHMS -> Reading.Kind.OHMS;
              },
              value,
              r.hz() == null ? 0 : r.hz(),
              OptionalDouble.empty(),
              r.to(),
              r.kind() == ReadingKind.AC ? AcMeasure.of(r.measure()) : java.util.Optional.empty());
    } catch (InvalidInputException e) {
      String field =
          e.field().equals("hz") || e.field().equals("to") || e.field().equals("at")
              ? e.field()
              : key;
      throw new InvalidInputException(source, at + "." + field, problemOf(e));
    }
    for (StageRules.Problem p : ReadingRules.storedProblems(reading, largest)) {
      String field = p.field().equals("value") ? key : p.field();
      throw new InvalidInputException(source, at + "." + field, p.message());
    }
  }

  /** Returns a stored reading as the domain's reading, with the checks of its record. */
  private static Reading reading(StoredReading stored) {
    Reading.Kind kind =
        switch (stored.kind()) {
          case AC -> Reading.Kind.AC;
          case DC -> Reading.Kind.DC;
          case OHMS -> Reading.Kind.OHMS;
        };
    return new Reading(
        stored.at(),
        kind,
        stored.value(),
        stored.hz() == null ? 0 : stored.hz(),
        stored.uncertainty() == null
            ? OptionalDouble.empty()
            : OptionalDouble.of(stored.uncertainty()),
        stored.to(),
        measure(stored));
  }

  /** Returns the reader's complaint, placed at {@code at} inside the bundle {@code source}. */
  static InvalidInputException inside(String source, String at, InvalidInputException e) {
    String field = e.field().isEmpty() ? at : at + "." + e.field();
    return new InvalidInputException(source, field, problemOf(e));
  }

  /** Returns what an exception says is wrong, without its source and field. */
  static String problemOf(InvalidInputException e) {
    String problem = e.getMessage() == null ? "" : e.getMessage();
    String sourcePrefix = e.source().isEmpty() ? "" : e.source() + ": ";
    if (!sourcePrefix.isEmpty() && problem.startsWith(sourcePrefix)) {
      problem = problem.substring(sourcePrefix.length());
    }
    String fieldPrefix = e.field().isEmpty() ? "" : e.field() + ": ";
    if (!fieldPrefix.isEmpty() && problem.startsWith(fieldPrefix)) {
      problem = problem.substring(fieldPrefix.length());
    }
    return problem;
  }

  /** Returns the measure an AC reading was stored with (peak when the history says none). */
  private static java.util.Optional<AcMeasure> measure(StoredReading stored) {
    return stored.kind() == ReadingKind.AC
        ? AcMeasure.of(stored.measureWord())
        : java.util.Optional.empty();
  }
}
