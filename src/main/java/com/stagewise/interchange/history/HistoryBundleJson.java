package com.stagewise.interchange.history;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadConstraints;
import com.fasterxml.jackson.core.exc.StreamConstraintsException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
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
import java.util.Set;

/**
 * Reads and writes a history bundle ({@code {"format": "stagewise-history", "version": 1, …}}), the
 * file that carries a shop's history between benches.
 *
 * <p>Reading is strict: unknown keys, wrong types, duplicate keys, trailing data, strings longer
 * than a stage sheet may be, non-finite numbers and a newer format version are errors that name the
 * field. Whether ids are well formed, unique and point at the right kind of record is checked when
 * the bundle is imported ({@code HistoryStore.importBundle}), against the bundle and the local
 * history together.
 */
public final class HistoryBundleJson {
  /** The longest string accepted anywhere in a bundle (a stage sheet's JSON text, with margin). */
  static final int MAX_STRING = 2_100_000;

  /** The deepest nesting accepted (a bundle needs five levels). */
  static final int MAX_DEPTH = 16;

  private static final Set<String> TOP =
      Set.of(
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
          "notes");
  private static final Set<String> BOARD_MODEL =
      Set.of("id", "name", "maker", "notes", "updatedAt");
  private static final Set<String> STAGE_SHEET =
      Set.of("id", "boardModelId", "title", "sheet", "updatedAt");
  private static final Set<String> UNIT =
      Set.of("id", "serial", "boardModelId", "owner", "updatedAt");
  private static final Set<String> CASE =
      Set.of(
          "id",
          "unitId",
          "openedAt",
          "symptom",
          "status",
          "closedAt",
          "outcome",
          "confirmedFaults",
          "updatedAt");
  private static final Set<String> READING =
      Set.of("id", "caseId", "at", "kind", "value", "hz", "uncertainty", "meter", "takenAt");
  private static final Set<String> SUSPECT_LIST =
      Set.of("id", "caseId", "computedAt", "programVersion", "verdict", "suspects", "nextProbes");
  private static final Set<String> SUSPECT = Set.of("fault", "probability", "group", "why");
  private static final Set<String> ACTION =
      Set.of("id", "caseId", "at", "kind", "part", "oldValue", "newValue", "text", "updatedAt");
  private static final Set<String> NOTE = Set.of("id", "caseId", "at", "text", "updatedAt");

  private static final ObjectMapper MAPPER = mapper();
  private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

  private HistoryBundleJson() {}

  private static ObjectMapper mapper() {
    JsonFactory factory =
        JsonFactory.builder()
            .streamReadConstraints(
                StreamReadConstraints.builder()
                    .maxStringLength(MAX_STRING)
                    .maxNestingDepth(MAX_DEPTH)
                    .build())
            .enable(com.fasterxml.jackson.core.StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .build();
    ObjectMapper mapper = new ObjectMapper(factory);
    mapper.enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS);
    mapper.enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION);
    return mapper;
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
    JsonNode root;
    try {
      root = MAPPER.readTree(in);
    } catch (StreamConstraintsException e) {
      throw new InvalidInputException(
          source, "", "the bundle is outside the accepted limits: " + e.getOriginalMessage());
    } catch (JsonProcessingException e) {
      String where =
          e.getLocation() == null
              ? ""
              : " (line "
                  + e.getLocation().getLineNr()
                  + ", column "
                  + e.getLocation().getColumnNr()
                  + ")";
      throw new InvalidInputException(
          source, "", "not valid JSON" + where + ": " + e.getOriginalMessage());
    } catch (IOException e) {
      throw new InvalidInputException(source, "", "cannot read: " + e.getMessage());
    }
    if (root == null || root.isMissingNode()) {
      throw new InvalidInputException(source, "", "the file is empty (expected a history bundle)");
    }
    return fromTree(root, source);
  }

  static HistoryBundle fromTree(JsonNode root, String source) {
    JsonFields top = JsonFields.object(source, "", root, TOP);
    String format = top.text("format");
    if (!format.equals(HistoryBundle.FORMAT)) {
      throw new InvalidInputException(
          source,
          "format",
          "expected \""
              + HistoryBundle.FORMAT
              + "\", got \""
              + format
              + "\" (not a history bundle)");
    }
    int version = top.integer("version");
    if (version > HistoryBundle.CURRENT_VERSION) {
      throw new InvalidInputException(
          source,
          "version",
          "bundle format version "
              + version
              + " is newer than this program reads (up to "
              + HistoryBundle.CURRENT_VERSION
              + "); use a newer Stagewise");
    }
    if (version < 1) {
      throw new InvalidInputException(source, "version", "expected 1 or more, got " + version);
    }
    List<BoardModel> models = new ArrayList<>();
    List<JsonNode> items = top.array("boardModels");
    for (int i = 0; i < items.size(); i++) {
      JsonFields f = JsonFields.object(source, "boardModels[" + i + "]", items.get(i), BOARD_MODEL);
      models.add(
          new BoardModel(
              f.text("id"),
              f.text("name"),
              f.text("maker", ""),
              f.text("notes", ""),
              f.time("updatedAt")));
    }
    List<StageSheetRecord> sheets = new ArrayList<>();
    items = top.array("stageSheets");
    for (int i = 0; i < items.size(); i++) {
      JsonFields f = JsonFields.object(source, "stageSheets[" + i + "]", items.get(i), STAGE_SHEET);
      sheets.add(
          new StageSheetRecord(
              f.text("id"),
              f.text("boardModelId"),
              f.text("title", ""),
              f.text("sheet"),
              f.time("updatedAt")));
    }
    List<Unit> units = new ArrayList<>();
    items = top.array("units");
    for (int i = 0; i < items.size(); i++) {
      JsonFields f = JsonFields.object(source, "units[" + i + "]", items.get(i), UNIT);
      units.add(
          new Unit(
              f.text("id"),
              f.text("serial"),
              f.text("boardModelId"),
              f.text("owner", ""),
              f.time("updatedAt")));
    }
    List<RepairCase> cases = new ArrayList<>();
    items = top.array("cases");
    for (int i = 0; i < items.size(); i++) {
      JsonFields f = JsonFields.object(source, "cases[" + i + "]", items.get(i), CASE);
      String outcome = f.text("outcome", null);
      cases.add(
          new RepairCase(
              f.text("id"),
              f.text("unitId"),
              f.time("openedAt"),
              f.text("symptom", ""),
              f.word("status", CaseStatus::fromWord, "open or closed"),
              f.time("closedAt", null),
              outcome == null
                  ? null
                  : f.word("outcome", Outcome::fromWord, "fixed, not-fixed or returned"),
              f.texts("confirmedFaults"),
              f.time("updatedAt")));
    }
    List<StoredReading> readings = new ArrayList<>();
    items = top.array("readings");
    for (int i = 0; i < items.size(); i++) {
      JsonFields f = JsonFields.object(source, "readings[" + i + "]", items.get(i), READING);
      readings.add(
          new StoredReading(
              f.text("id"),
              f.text("caseId"),
              f.text("at"),
              f.word("kind", ReadingKind::fromWord, "dc or ac"),
              f.number("value"),
              f.number("hz", null),
              f.number("uncertainty", null),
              f.text("meter", ""),
              f.time("takenAt")));
    }
    List<SuspectListRecord> lists = new ArrayList<>();
    items = top.array("suspectLists");
    for (int i = 0; i < items.size(); i++) {
      String at = "suspectLists[" + i + "]";
      JsonFields f = JsonFields.object(source, at, items.get(i), SUSPECT_LIST);
      List<StoredSuspect> suspects = new ArrayList<>();
      List<JsonNode> suspectNodes = f.array("suspects");
      for (int j = 0; j < suspectNodes.size(); j++) {
        JsonFields s =
            JsonFields.object(source, at + ".suspects[" + j + "]", suspectNodes.get(j), SUSPECT);
        suspects.add(
            new StoredSuspect(
                s.text("fault"),
                s.number("probability"),
                s.texts("group"),
                s.text("why", ""),
                j + 1));
      }
      lists.add(
          new SuspectListRecord(
              f.text("id"),
              f.text("caseId"),
              f.time("computedAt"),
              f.text("programVersion", ""),
              f.text("verdict"),
              suspects,
              f.text("nextProbes", "")));
    }
    List<RepairAction> actions = new ArrayList<>();
    items = top.array("actions");
    for (int i = 0; i < items.size(); i++) {
      JsonFields f = JsonFields.object(source, "actions[" + i + "]", items.get(i), ACTION);
      actions.add(
          new RepairAction(
              f.text("id"),
              f.text("caseId"),
              f.time("at"),
              f.word("kind", ActionKind::fromWord, "part-replaced, reflow, adjustment or other"),
              f.text("part", ""),
              f.text("oldValue", ""),
              f.text("newValue", ""),
              f.text("text", ""),
              f.time("updatedAt")));
    }
    List<CaseNote> notes = new ArrayList<>();
    items = top.array("notes");
    for (int i = 0; i < items.size(); i++) {
      JsonFields f = JsonFields.object(source, "notes[" + i + "]", items.get(i), NOTE);
      notes.add(
          new CaseNote(
              f.text("id"), f.text("caseId"), f.time("at"), f.text("text"), f.time("updatedAt")));
    }
    return new HistoryBundle(
        version,
        top.time("exportedAt", Instant.EPOCH),
        top.text("programVersion", ""),
        models,
        sheets,
        units,
        cases,
        readings,
        lists,
        actions,
        notes);
  }

  // ---- writing ----------------------------------------------------------------------------------

  /** Writes {@code bundle} to {@code file} (replacing it), through a temporary file beside it. */
  public static void write(HistoryBundle bundle, Path file) {
    Path folder = file.toAbsolutePath().getParent();
    try {
      Path temporary = Files.createTempFile(folder, ".stagewise-export", ".tmp");
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
      writeArray(json, "boardModels", bundle.boardModels(), HistoryBundleJson::tree);
      writeArray(json, "stageSheets", bundle.stageSheets(), HistoryBundleJson::tree);
      writeArray(json, "units", bundle.units(), HistoryBundleJson::tree);
      writeArray(json, "cases", bundle.cases(), HistoryBundleJson::tree);
      writeArray(json, "readings", bundle.readings(), HistoryBundleJson::tree);
      writeArray(json, "suspectLists", bundle.suspectLists(), HistoryBundleJson::tree);
      writeArray(json, "actions", bundle.actions(), HistoryBundleJson::tree);
      writeArray(json, "notes", bundle.notes(), HistoryBundleJson::tree);
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

  static ObjectNode tree(BoardModel m) {
    ObjectNode o = NODES.objectNode();
    o.put("id", m.id()).put("name", m.name()).put("maker", m.maker()).put("notes", m.notes());
    return o.put("updatedAt", m.updatedAt().toString());
  }

  static ObjectNode tree(StageSheetRecord s) {
    ObjectNode o = NODES.objectNode();
    o.put("id", s.id())
        .put("boardModelId", s.boardModelId())
        .put("title", s.title())
        .put("sheet", s.sheetJson());
    return o.put("updatedAt", s.updatedAt().toString());
  }

  static ObjectNode tree(Unit u) {
    ObjectNode o = NODES.objectNode();
    o.put("id", u.id())
        .put("serial", u.serial())
        .put("boardModelId", u.boardModelId())
        .put("owner", u.owner());
    return o.put("updatedAt", u.updatedAt().toString());
  }

  static ObjectNode tree(RepairCase c) {
    ObjectNode o = NODES.objectNode();
    o.put("id", c.id()).put("unitId", c.unitId()).put("openedAt", c.openedAt().toString());
    o.put("symptom", c.symptom()).put("status", c.status().word());
    if (c.closedAt() != null) {
      o.put("closedAt", c.closedAt().toString());
    }
    if (c.outcome() != null) {
      o.put("outcome", c.outcome().word());
    }
    ArrayNode faults = o.putArray("confirmedFaults");
    c.confirmedFaults().forEach(faults::add);
    return o.put("updatedAt", c.updatedAt().toString());
  }

  static ObjectNode tree(StoredReading r) {
    ObjectNode o = NODES.objectNode();
    o.put("id", r.id()).put("caseId", r.caseId()).put("at", r.at()).put("kind", r.kind().word());
    o.put("value", r.value());
    if (r.hz() != null) {
      o.put("hz", r.hz());
    }
    if (r.uncertainty() != null) {
      o.put("uncertainty", r.uncertainty());
    }
    return o.put("meter", r.meterText()).put("takenAt", r.takenAt().toString());
  }

  static ObjectNode tree(SuspectListRecord s) {
    ObjectNode o = NODES.objectNode();
    o.put("id", s.id()).put("caseId", s.caseId()).put("computedAt", s.computedAt().toString());
    o.put("programVersion", s.programVersion()).put("verdict", s.verdict());
    ArrayNode suspects = o.putArray("suspects");
    for (StoredSuspect suspect : s.suspects()) {
      ObjectNode n = suspects.addObject();
      n.put("fault", suspect.fault()).put("probability", suspect.probability());
      ArrayNode group = n.putArray("group");
      suspect.group().forEach(group::add);
      n.put("why", suspect.why());
    }
    return o.put("nextProbes", s.nextProbes());
  }

  static ObjectNode tree(RepairAction a) {
    ObjectNode o = NODES.objectNode();
    o.put("id", a.id())
        .put("caseId", a.caseId())
        .put("at", a.at().toString())
        .put("kind", a.kind().word());
    o.put("part", a.part())
        .put("oldValue", a.oldValue())
        .put("newValue", a.newValue())
        .put("text", a.text());
    return o.put("updatedAt", a.updatedAt().toString());
  }

  static ObjectNode tree(CaseNote n) {
    ObjectNode o = NODES.objectNode();
    o.put("id", n.id())
        .put("caseId", n.caseId())
        .put("at", n.at().toString())
        .put("text", n.text());
    return o.put("updatedAt", n.updatedAt().toString());
  }

  static ObjectMapper mapperForOutput() {
    return MAPPER;
  }
}
