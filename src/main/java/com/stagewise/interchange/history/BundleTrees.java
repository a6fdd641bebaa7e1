package com.stagewise.interchange.history;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.ReadingsSheet;

/**
 * Each history record as the JSON object a bundle (and {@code history … --json}) holds: the writing
 * side of {@link HistoryBundleJson}.
 */
final class BundleTrees {
  private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

  private BundleTrees() {}

  static ObjectNode tree(BoardModel m) {
    ObjectNode o = NODES.objectNode();
    o.put("id", m.id()).put("name", m.name()).put("maker", m.maker()).put("notes", m.notes());
    return o.put("updatedAt", m.updatedAt().toString());
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
    o.put("updatedAt", c.updatedAt().toString());
    LibraryFields.caseStage(c, o);
    return o;
  }

  static ObjectNode tree(StoredReading r) {
    ObjectNode o = NODES.objectNode();
    o.put("id", r.id()).put("caseId", r.caseId()).put("at", r.at());
    if (!r.to().isEmpty()) {
      o.put("to", r.to());
    }
    o.put("kind", r.kind().word());
    if (r.isOverRange()) {
      o.put("value", ReadingsSheet.OVER_RANGE);
    } else {
      o.put("value", r.value());
    }
    if (r.hz() != null) {
      o.put("hz", r.hz());
    }
    if (r.uncertainty() != null) {
      o.put("uncertainty", r.uncertainty());
    }
    o.put("meter", r.meterText()).put("takenAt", r.takenAt().toString());
    // A reading never struck out is written as before, so that older programs still read it.
    if (r.struckAt() != null) {
      o.put("struckAt", r.struckAt().toString());
    }
    if (!r.updatedAt().equals(r.takenAt())) {
      o.put("updatedAt", r.updatedAt().toString());
    }
    // Peak (null) is left out, so that a peak reading is written as before.
    if (r.measure() != null) {
      o.put("measure", r.measure());
    }
    return o;
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
}
