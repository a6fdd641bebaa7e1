package com.stagewise.interchange.history;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.JsonField;
import com.stagewise.interchange.ReadingsSheet;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * Reads and writes a history bundle ({@code {"format": "stagewise-history", "version": 1, …}}), the
 * file that carries a shop's history between benches.
 *
 * <p>Reading is strict: unknown keys, wrong types, duplicate keys, trailing data, strings longer
 * than a stage sheet may be, non-finite numbers and a newer format version are errors that name the
 * field, and every document the bundle carries (its stage sheets) is checked by the reader of its
 * own files. Whether ids are well formed, unique and point at the right kind of record is checked
 * when the bundle is imported ({@code Transfer.importBundle}), against the bundle and the local
 * history together.
 */
public final class HistoryBundleJson {
  /** The longest string accepted anywhere in a bundle (a stage sheet's JSON text, with margin). */
  static final int MAX_STRING = 2_100_000;

  /** The deepest nesting accepted (a bundle needs five levels). */
  static final int MAX_DEPTH = 16;

  private static final List<String> TOP =
      List.of(
          "format",
          "version",
          "exportedAt",
          "programVersion",
          "boardModels",
          "stageSheets",
          "units",
          "cases",
          "readings",
          "suspectLists",
          "actions",
          "notes",
          "photos",
          "afterRepair");
  private static final List<String> BOARD_MODEL =
      List.of("id", "name", "maker", "notes", "updatedAt");
  private static final List<String> UNIT =
      List.of("id", "serial", "boardModelId", "owner", "updatedAt");
  private static final List<String> CASE =
      List.of(
          "id",
          "unitId",
          "openedAt",
          "symptom",
          "status",
          "closedAt",
          "outcome",
          "confirmedFaults",
          "updatedAt",
          LibraryFields.CASE_STAGE);
  private static final List<String> READING =
      List.of(
          "id",
          "caseId",
          "at",
          "to",
          "kind",
          "value",
          "hz",
          "uncertainty",
          "meter",
          "takenAt",
          "struckAt",
          "updatedAt",
          "measure");
  private static final List<String> SUSPECT_LIST =
      List.of("id", "caseId", "computedAt", "programVersion", "verdict", "suspects", "nextProbes");
  private static final List<String> SUSPECT = List.of("fault", "probability", "group", "why");
  private static final List<String> ACTION =
      List.of("id", "caseId", "at", "kind", "part", "oldValue", "newValue", "text", "updatedAt");
  private static final List<String> NOTE = List.of("id", "caseId", "at", "text", "updatedAt");

  private static final ObjectMapper MAPPER = mapper();
  private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

  private HistoryBundleJson() {}

  private static ObjectMapper mapper() {
    return new ObjectMapper();
  }

  // ---- reading ----------------------------------------------------------------------------------

  /**
   * Reads the bundle in {@code file}.
   *
   * @throws InvalidInputException naming the file and the field, for anything malformed
   */
  public static HistoryBundle read(Path file) {
    try (InputStream in = Files.newInputStream(file)) {
      return read(in, file.toString());
    } catch (NoSuchFileException e) {
      throw new InvalidInputException(file.toString(), "", "no such file");
    } catch (IOException e) {
      throw new InvalidInputException(
          file.toString(), "", "cannot read the file: " + e.getMessage());
    }
  }

  /** Reads a bundle from {@code in}; {@code source} names it in messages. */
  public static HistoryBundle read(InputStream in, String source) {
    HistoryBundle bundle =
        fromTree(JsonField.parseRoot(in, source, "a history bundle", MAX_STRING, MAX_DEPTH));
    BundleDocuments.check(bundle, source);
    return bundle;
  }

  static HistoryBundle fromTree(JsonField top) {
    top.object("a history bundle", TOP);
    String format = top.require("format", "\"" + HistoryBundle.FORMAT + "\"").text();
    if (!format.equals(HistoryBundle.FORMAT)) {
      throw top.require("format", "")
          .error(
              "expected \""
                  + HistoryBundle.FORMAT
                  + "\", found \""
                  + format
                  + "\" (not a history bundle)");
    }
    JsonField versionField = top.require("version", "the bundle format version");
    int version = versionField.integer("the bundle format version");
    if (version > HistoryBundle.CURRENT_VERSION) {
      throw versionField.error(
          "bundle format version "
              + version
              + " is newer than this program reads (up to "
              + HistoryBundle.CURRENT_VERSION
              + "); use a newer Stagewise");
    }
    if (version < 1) {
      throw versionField.error("expected 1 or more, found " + version);
    }
    List<BoardModel> models = new ArrayList<>();
    for (JsonField f : top.optionalElements("boardModels", "board models")) {
      f.object("a board model", BOARD_MODEL);
      models.add(
          new BoardModel(
              text(f, "id"),
              text(f, "name"),
              f.optionalText("maker", ""),
              f.optionalText("notes", ""),
              time(f, "updatedAt")));
    }
    List<StageSheetRecord> sheets = new ArrayList<>();
    for (JsonField f : top.optionalElements("stageSheets", "stage sheets")) {
      sheets.add(LibraryFields.sheet(f));
    }
    List<Unit> units = new ArrayList<>();
    for (JsonField f : top.optionalElements("units", "units")) {
      f.object("a unit", UNIT);
      units.add(
          new Unit(
              text(f, "id"),
              text(f, "serial"),
              text(f, "boardModelId"),
              f.optionalText("owner", ""),
              time(f, "updatedAt")));
    }
    List<RepairCase> cases = new ArrayList<>();
    for (JsonField f : top.optionalElements("cases", "cases")) {
      f.object("a case", CASE);
      cases.add(
          new RepairCase(
              text(f, "id"),
              text(f, "unitId"),
              time(f, "openedAt"),
              f.optionalText("symptom", ""),
              f.require("status", "open or closed").word(CaseStatus::fromWord, "open or closed"),
              f.optional("closedAt").map(JsonField::time).orElse(null),
              f.optional("outcome")
                  .map(o -> o.word(Outcome::fromWord, "fixed, not-fixed or returned"))
                  .orElse(null),
              f.optional("confirmedFaults").map(g -> g.texts("fault ids")).orElse(List.of()),
              time(f, "updatedAt"),
              LibraryFields.caseStage(f)));
    }
    List<StoredReading> readings = new ArrayList<>();
    for (JsonField f : top.optionalElements("readings", "readings")) {
      f.object("a reading", READING);
      ReadingKind kind =
          f.require("kind", "dc, ac or ohms").word(ReadingKind::fromWord, "dc, ac or ohms");
      readings.add(
          new StoredReading(
              text(f, "id"),
              text(f, "caseId"),
              text(f, "at"),
              kind,
              readingValue(f.require("value", "a number"), kind, "the reading's value"),
              f.optional("hz").map(h -> h.finite("a frequency in Hz")).orElse(null),
              f.optional("uncertainty").map(u -> u.finite("an uncertainty in volts")).orElse(null),
              f.optionalText("meter", ""),
              time(f, "takenAt"),
              f.optionalText("to", ""),
              f.optional("struckAt").map(JsonField::time).orElse(null),
              f.optional("updatedAt").map(JsonField::time).orElse(null),
              measure(f, kind)));
    }
    List<SuspectListRecord> lists = new ArrayList<>();
    for (JsonField f : top.optionalElements("suspectLists", "suspect lists")) {
      f.object("a suspect list", SUSPECT_LIST);
      List<StoredSuspect> suspects = new ArrayList<>();
      List<JsonField> suspectFields = f.optionalElements("suspects", "suspects");
      for (int j = 0; j < suspectFields.size(); j++) {
        JsonField s = suspectFields.get(j).object("a suspect", SUSPECT);
        suspects.add(
            new StoredSuspect(
                text(s, "fault"),
                s.require("probability", "a number").finite("a probability"),
                s.optional("group").map(g -> g.texts("fault ids")).orElse(List.of()),
                s.optionalText("why", ""),
                j + 1));
      }
      lists.add(
          new SuspectListRecord(
              text(f, "id"),
              text(f, "caseId"),
              time(f, "computedAt"),
              f.optionalText("programVersion", ""),
              text(f, "verdict"),
              suspects,
              f.optionalText("nextProbes", "")));
    }
    List<RepairAction> actions = new ArrayList<>();
    for (JsonField f : top.optionalElements("actions", "actions")) {
      f.object("an action", ACTION);
      actions.add(
          new RepairAction(
              text(f, "id"),
              text(f, "caseId"),
              time(f, "at"),
              f.require("kind", ACTION_KINDS).word(ActionKind::fromWord, ACTION_KINDS),
              f.optionalText("part", ""),
              f.optionalText("oldValue", ""),
              f.optionalText("newValue", ""),
              f.optionalText("text", ""),
              time(f, "updatedAt")));
    }
    List<CaseNote> notes = new ArrayList<>();
    for (JsonField f : top.optionalElements("notes", "notes")) {
      f.object("a note", NOTE);
      notes.add(
          new CaseNote(
              text(f, "id"),
              text(f, "caseId"),
              time(f, "at"),
              text(f, "text"),
              time(f, "updatedAt")));
    }
    return new HistoryBundle(
        version,
        top.optional("exportedAt").map(JsonField::time).orElse(Instant.EPOCH),
        top.optionalText("programVersion", ""),
        models,
        sheets,
        units,
        cases,
        readings,
        lists,
        actions,
        notes,
        top.optionalElements("photos", "photos").stream().map(PhotoFields::photo).toList(),
        top.optionalElements("afterRepair", "readings after the repair").stream()
            .map(f -> AfterRepairFields.read(f, version))
            .toList());
  }

  private static final String ACTION_KINDS = "part-replaced, reflow, adjustment or other";

  private static String text(JsonField object, String key) {
    return object.require(key, "a string").text();
  }

  private static Instant time(JsonField object, String key) {
    return object.require(key, "a UTC time such as 2026-03-04T10:15:30Z").time();
  }

  // ---- writing ----------------------------------------------------------------------------------

  /** Writes {@code bundle} to {@code file} (replacing it), through a temporary file beside it. */
  public static void write(HistoryBundle bundle, Path file) {
    Path folder = file.toAbsolutePath().getParent();
    try {
      // Files.createTempFile would make the file readable by its owner only (0600); a bundle is
      // made to be carried to other benches, so it gets the user's normal permissions (umask).
      Path temporary =
          Files.createFile(
              folder.resolve(".stagewise-export-" + java.util.UUID.randomUUID() + ".tmp"));
      try {
        try (OutputStream out = Files.newOutputStream(temporary)) {
          write(bundle, out);
        }
        Files.move(
            temporary,
            file,
            java.nio.file.StandardCopyOption.REPLACE_EXISTING,
            java.nio.file.StandardCopyOption.ATOMIC_MOVE);
      } finally {
        Files.deleteIfExists(temporary);
      }
    } catch (IOException e) {
      throw new InvalidInputException(
          file.toString(), "", "cannot write the bundle: " + e.getMessage());
    }
  }

  /** Writes {@code bundle} as JSON to {@code out} (UTF-8, indented), record by record. */
  public static void write(HistoryBundle bundle, OutputStream out) throws IOException {
    try (JsonGenerator json = MAPPER.getFactory().createGenerator(out)) {
      json.disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET);
      json.useDefaultPrettyPrinter();
      json.writeStartObject();
      json.writeStringField("format", HistoryBundle.FORMAT);
      json.writeNumberField("version", HistoryBundle.CURRENT_VERSION);
      json.writeStringField("exportedAt", bundle.exportedAt().toString());
      json.writeStringField("programVersion", bundle.programVersion());
      writeArray(json, "boardModels", bundle.boardModels(), BundleTrees::tree);
      writeArray(json, "stageSheets", bundle.stageSheets(), LibraryFields::tree);
      writeArray(json, "units", bundle.units(), BundleTrees::tree);
      writeArray(json, "cases", bundle.cases(), BundleTrees::tree);
      writeArray(json, "readings", bundle.readings(), BundleTrees::tree);
      writeArray(json, "suspectLists", bundle.suspectLists(), BundleTrees::tree);
      writeArray(json, "actions", bundle.actions(), BundleTrees::tree);
      writeArray(json, "notes", bundle.notes(), BundleTrees::tree);
      writeArray(json, "photos", bundle.photos(), PhotoFields::tree);
      writeArray(json, "afterRepair", bundle.afterRepair(), AfterRepairFields::tree);
      json.writeEndObject();
    }
  }

  private static <T> void writeArray(
      JsonGenerator json,
      String name,
      List<T> records,
      java.util.function.Function<T, ObjectNode> tree)
      throws IOException {
    json.writeArrayFieldStart(name);
    for (T record : records) {
      MAPPER.writeTree(json, tree.apply(record));
    }
    json.writeEndArray();
  }

  /** Returns the bundle's JSON as a string (for tests and small bundles). */
  public static String toJson(HistoryBundle bundle) {
    java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
    try {
      write(bundle, out);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toString(java.nio.charset.StandardCharsets.UTF_8);
  }

  /**
   * Returns the measure of an AC reading ({@code rms} or {@code pp}; null for peak, also when the
   * bundle says none, as bundles written before measures do).
   */
  private static String measure(JsonField reading, ReadingKind kind) {
    java.util.Optional<JsonField> field = reading.optional("measure");
    if (field.isEmpty()) {
      return null;
    }
    if (kind != ReadingKind.AC) {
      throw field.get().error("only an ac reading has a measure (expected no \"measure\" here)");
    }
    return field
        .get()
        .word(
            w ->
                StoredReading.MEASURES.contains(w)
                    ? java.util.Optional.of(w)
                    : java.util.Optional.empty(),
            "rms, peak or pp");
  }

  /**
   * Returns a reading's value: a finite number, or for an ohms reading also {@code "OL"}, the
   * meter's over-range ({@link Double#POSITIVE_INFINITY}); {@code what} names a number that is not
   * finite in the message.
   */
  static double readingValue(JsonField value, ReadingKind kind, String what) {
    if (kind == ReadingKind.OHMS && value.isText()) {
      if (!value.text().equals(ReadingsSheet.OVER_RANGE)) {
        throw value.error(
            "expected ohms as a number or \"OL\" (the meter's over-range), found \""
                + value.text()
                + "\"");
      }
      return Double.POSITIVE_INFINITY;
    }
    return value.finite(what);
  }

  static ObjectMapper mapperForOutput() {
    return MAPPER;
  }
}
