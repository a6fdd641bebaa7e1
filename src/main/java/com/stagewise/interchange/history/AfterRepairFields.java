package com.stagewise.interchange.history;

import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.StoredReading;
import com.stagewise.interchange.JsonField;
import com.stagewise.interchange.ReadingsSheet;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The readings taken again after the repair in a history bundle: format version 5 brought them as
 * DC levels, each with the healthy band it was checked against; version 6 adds their kind ({@code
 * "kind"}: {@code dc}, {@code ac} or {@code ohms}), an AC reading's {@code "measure"} ({@code rms},
 * {@code peak} or {@code pp}) and {@code "hz"}, and an ohms reading's second point {@code "to"},
 * with {@code "OL"} for the meter's over-range in its value and band. An entry without {@code
 * "kind"} is a DC level, as every entry of version 5 is; a version-5 bundle carrying the newer keys
 * is refused, naming the key, as any unknown key is.
 */
final class AfterRepairFields {
  /** The keys of an entry in format version 5. */
  static final List<String> VERSION_5 =
      List.of("id", "caseId", "at", "value", "meter", "takenAt", "healthyLow", "healthyHigh");

  /** The keys of an entry from format version 6 on. */
  static final List<String> VERSION_6 = keys6();

  /** The first bundle format version whose readings after the repair carry their kind. */
  static final int KINDS = 6;

  private AfterRepairFields() {}

  private static List<String> keys6() {
    List<String> keys = new ArrayList<>(VERSION_5);
    keys.addAll(List.of("kind", "measure", "hz", "to"));
    return List.copyOf(keys);
  }

  /** Reads one entry of {@code afterRepair} of a bundle of format {@code version}. */
  static AfterRepairReading read(JsonField f, int version) {
    f.object("a reading after the repair", version >= KINDS ? VERSION_6 : VERSION_5);
    ReadingKind kind =
        f.optional("kind")
            .map(k -> k.word(ReadingKind::fromWord, "dc, ac or ohms"))
            .orElse(ReadingKind.DC);
    boolean ac = kind == ReadingKind.AC;
    boolean ohms = kind == ReadingKind.OHMS;
    String measure = null;
    Double hz = null;
    if (ac) {
      measure =
          f.require("measure", "rms, peak or pp (how the AC reading is stated)")
              .word(
                  w -> StoredReading.MEASURES.contains(w) ? Optional.of(w) : Optional.empty(),
                  "rms, peak or pp");
      JsonField hzField = f.require("hz", "the test frequency in Hz");
      hz = hzField.finite("a frequency in Hz");
      if (hz <= 0) {
        throw hzField.error("expected a frequency above 0 Hz, found " + hz);
      }
    } else {
      refuse(f, "measure", "only an ac reading has a measure (expected none here)");
      refuse(f, "hz", "only an ac reading has a frequency (expected none here)");
    }
    String to = "";
    if (ohms) {
      to = f.require("to", "the second point of the ohms reading").text();
      if (to.isBlank()) {
        throw f.require("to", "").error("expected the second point of the ohms reading");
      }
    } else {
      refuse(f, "to", "only an ohms reading has a second point (expected none here)");
    }
    JsonField valueField = f.require("value", ohms ? "ohms, or \"OL\"" : "a number in volts");
    return new AfterRepairReading(
        f.require("id", "a string").text(),
        f.require("caseId", "a string").text(),
        f.require("at", "a test point").text(),
        value(valueField, kind),
        f.optionalText("meter", ""),
        f.require("takenAt", "a UTC time such as 2026-03-04T10:15:30Z").time(),
        f.optional("healthyLow").map(v -> value(v, kind)).orElse(null),
        f.optional("healthyHigh").map(v -> value(v, kind)).orElse(null),
        kind,
        measure,
        hz,
        to);
  }

  private static void refuse(JsonField f, String key, String why) {
    Optional<JsonField> field = f.optional(key);
    if (field.isPresent()) {
      throw field.get().error(why);
    }
  }

  /** Returns volts, or ohms (a number, or "OL" for the meter's over-range, +∞). */
  private static double value(JsonField value, ReadingKind kind) {
    return HistoryBundleJson.readingValue(value, kind, kind == ReadingKind.OHMS ? "ohms" : "volts");
  }

  /** Writes one entry of {@code afterRepair}; a DC level is written as format 5 wrote it. */
  static ObjectNode tree(AfterRepairReading r) {
    ObjectNode o = JsonNodeFactory.instance.objectNode();
    o.put("id", r.id()).put("caseId", r.caseId()).put("at", r.at());
    if (r.kind() != ReadingKind.DC) {
      o.put("kind", r.kind().word());
    }
    if (!r.to().isEmpty()) {
      o.put("to", r.to());
    }
    put(o, "value", r.value());
    if (r.measure() != null) {
      o.put("measure", r.measure());
    }
    if (r.hz() != null) {
      o.put("hz", r.hz());
    }
    o.put("meter", r.meterText()).put("takenAt", r.takenAt().toString());
    if (r.hasBand()) {
      put(o, "healthyLow", r.healthyLow());
      put(o, "healthyHigh", r.healthyHigh());
    }
    return o;
  }

  private static void put(ObjectNode o, String key, double value) {
    if (value == Double.POSITIVE_INFINITY) {
      o.put(key, ReadingsSheet.OVER_RANGE);
    } else {
      o.put(key, value);
    }
  }
}
