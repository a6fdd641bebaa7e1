package com.stagewise.interchange.history;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.history.CaseFile;
import com.stagewise.history.ImportReport;
import com.stagewise.history.SearchHit;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import java.io.UncheckedIOException;
import java.util.List;
import java.util.Map;

/**
 * The JSON the {@code history} commands print with {@code --json}: the same field names as the
 * history bundle, so that scripts learn one vocabulary.
 */
public final class HistoryJson {
  private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

  private HistoryJson() {}

  /** Returns {@code {"boardModels": [...]}}. */
  public static String boardModels(List<BoardModel> models) {
    ObjectNode root = NODES.objectNode();
    ArrayNode array = root.putArray("boardModels");
    models.forEach(m -> array.add(BundleTrees.tree(m)));
    return text(root);
  }

  /**
   * Returns {@code {"units": [...]}}, each unit with its board model's name as {@code boardModel}.
   */
  public static String units(List<Unit> units, Map<String, BoardModel> modelsById) {
    ObjectNode root = NODES.objectNode();
    ArrayNode array = root.putArray("units");
    for (Unit unit : units) {
      ObjectNode node = BundleTrees.tree(unit);
      BoardModel model = modelsById.get(unit.boardModelId());
      node.put("boardModel", model == null ? "" : model.name());
      array.add(node);
    }
    return text(root);
  }

  /** Returns one unit (with {@code boardModel} named) as a JSON object. */
  public static String unit(Unit unit, BoardModel model) {
    ObjectNode node = BundleTrees.tree(unit);
    node.put("boardModel", model.name());
    return text(node);
  }

  /** Returns one case as a JSON object. */
  public static String repairCase(RepairCase repairCase) {
    return text(BundleTrees.tree(repairCase));
  }

  /** Returns one note as a JSON object. */
  public static String note(CaseNote note) {
    return text(BundleTrees.tree(note));
  }

  /** Returns one action as a JSON object. */
  public static String action(RepairAction action) {
    return text(BundleTrees.tree(action));
  }

  /** Returns readings and the suspect list stored with them. */
  public static String storedReadings(
      List<StoredReading> readings, SuspectListRecord suspectListOrNull) {
    ObjectNode root = NODES.objectNode();
    ArrayNode array = root.putArray("readings");
    readings.forEach(r -> array.add(BundleTrees.tree(r)));
    if (suspectListOrNull != null) {
      root.set("suspectList", BundleTrees.tree(suspectListOrNull));
    }
    return text(root);
  }

  /** Returns a unit's history: the unit, its board model and its cases with everything in them. */
  public static String unitHistory(UnitHistory history) {
    ObjectNode root = NODES.objectNode();
    root.set("unit", BundleTrees.tree(history.unit()));
    root.set("boardModel", BundleTrees.tree(history.boardModel()));
    ArrayNode cases = root.putArray("cases");
    history.cases().forEach(c -> cases.add(caseTree(c)));
    return text(root);
  }

  /** Returns one case with everything in it. */
  public static String caseFile(CaseFile file) {
    return text(caseTree(file));
  }

  private static ObjectNode caseTree(CaseFile file) {
    ObjectNode node = BundleTrees.tree(file.repairCase());
    ArrayNode readings = node.putArray("readings");
    file.readings().forEach(r -> readings.add(BundleTrees.tree(r)));
    ArrayNode lists = node.putArray("suspectLists");
    file.suspectLists().forEach(s -> lists.add(BundleTrees.tree(s)));
    ArrayNode actions = node.putArray("actions");
    file.actions().forEach(a -> actions.add(BundleTrees.tree(a)));
    ArrayNode notes = node.putArray("notes");
    file.notes().forEach(n -> notes.add(BundleTrees.tree(n)));
    ArrayNode photos = node.putArray("photos");
    file.photos().forEach(p -> photos.add(photoTree(p)));
    ArrayNode afterRepair = node.putArray("afterRepair");
    file.afterRepair().forEach(r -> afterRepair.add(AfterRepairFields.tree(r)));
    return node;
  }

  /**
   * Returns a photo as listed with its case: {@code {"id", "caseId", "fileName", "mediaType",
   * "width", "height", "bytes", "attachedAt", "attachedBy"}} (the picture itself is left out).
   */
  public static String photo(CasePhoto photo) {
    return text(photoTree(photo));
  }

  private static ObjectNode photoTree(CasePhoto photo) {
    return NODES
        .objectNode()
        .put("id", photo.id())
        .put("caseId", photo.caseId())
        .put("fileName", photo.fileName())
        .put("mediaType", photo.mediaType())
        .put("width", photo.width())
        .put("height", photo.height())
        .put("bytes", photo.bytes())
        .put("attachedAt", photo.attachedAt().toString())
        .put("attachedBy", photo.attachedBy());
  }

  /** Returns {@code {"hits": [...]}}. */
  public static String hits(List<SearchHit> hits) {
    ObjectNode root = NODES.objectNode();
    ArrayNode array = root.putArray("hits");
    for (SearchHit hit : hits) {
      ObjectNode node = array.addObject();
      node.put("caseId", hit.caseId()).put("unitId", hit.unitId()).put("serial", hit.serial());
      node.put("boardModel", hit.boardModel()).put("status", hit.status().word());
      if (hit.outcome() != null) {
        node.put("outcome", hit.outcome().word());
      }
      node.put("openedAt", hit.openedAt().toString()).put("symptom", hit.symptom());
      ArrayNode faults = node.putArray("confirmedFaults");
      hit.confirmedFaults().forEach(faults::add);
      node.put("snippet", hit.snippet()).put("score", hit.score());
    }
    return text(root);
  }

  /** Returns what an import did. */
  public static String importReport(ImportReport report) {
    ObjectNode root = NODES.objectNode();
    root.put("added", report.added())
        .put("updated", report.updated())
        .put("unchanged", report.unchanged());
    ArrayNode matched = root.putArray("matched");
    report.matched().forEach(matched::add);
    ArrayNode conflicts = root.putArray("conflicts");
    for (ImportReport.Conflict conflict : report.conflicts()) {
      conflicts
          .addObject()
          .put("kind", conflict.kind())
          .put("id", conflict.id())
          .put("reason", conflict.reason());
    }
    return text(root);
  }

  /**
   * Returns {@code {"server": …, "down": n, "downUnchanged": n, "up": n, "conflicts": […],
   * "endedAt": "…"}}, the summary of {@code history sync --json}.
   */
  public static String syncReport(com.stagewise.history.sync.SyncReport report) {
    ObjectNode root = NODES.objectNode();
    root.put("server", report.server())
        .put("down", report.down())
        .put("downUnchanged", report.downUnchanged())
        .put("up", report.up());
    ArrayNode conflicts = root.putArray("conflicts");
    for (ImportReport.Conflict conflict : report.conflicts()) {
      conflicts
          .addObject()
          .put("kind", conflict.kind())
          .put("id", conflict.id())
          .put("reason", conflict.reason());
    }
    root.put("endedAt", report.endedAt().toString());
    return text(root);
  }

  /** Returns {@code {"boardModel": …, "faultCounts": {fault: n, …}}}. */
  public static String faultCounts(String boardModel, Map<String, Integer> counts) {
    ObjectNode root = NODES.objectNode();
    root.put("boardModel", boardModel);
    ObjectNode map = root.putObject("faultCounts");
    counts.forEach(map::put);
    return text(root);
  }

  /** Returns a flat object of string fields, e.g. {@code {"backup": "/path"}}. */
  public static String fields(Map<String, String> fields) {
    ObjectNode root = NODES.objectNode();
    fields.forEach(root::put);
    return text(root);
  }

  private static String text(ObjectNode node) {
    try {
      return HistoryBundleJson.mapperForOutput()
          .writerWithDefaultPrettyPrinter()
          .writeValueAsString(node);
    } catch (JsonProcessingException e) {
      throw new UncheckedIOException(e);
    }
  }
}
