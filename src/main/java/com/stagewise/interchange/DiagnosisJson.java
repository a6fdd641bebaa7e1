package com.stagewise.interchange;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.Reading;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.Observation;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.diagnosis.Suspect;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Writes a diagnosis as the {@code stagewise-diagnosis} document of the design notes.
 *
 * <p>Besides the contract's fields it adds, compatibly: {@code estimatedValue} on a suspect whose
 * value was estimated (a drifted part in ohms or farads, a low rail in volts), {@code measure} on a
 * next probe of kind {@code ac} (how to state the AC reading: {@code rms}, {@code peak} or {@code
 * pp}), and at the top level {@code confirmingCheck} and {@code notes}.
 */
public final class DiagnosisJson {
  /** The document's format name. */
  public static final String FORMAT = "stagewise-diagnosis";

  /** The document's format version. */
  public static final int VERSION = 1;

  private DiagnosisJson() {}

  /** Returns the JSON text of a diagnosis. */
  public static String write(Diagnosis diagnosis) {
    JsonNodeFactory f = JsonNodeFactory.instance;
    Map<String, Object> fields = new LinkedHashMap<>();
    fields.put("format", f.textNode(FORMAT));
    fields.put("version", f.numberNode(VERSION));
    fields.put("verdict", f.textNode(diagnosis.verdict().word()));
    List<Object> observations = new ArrayList<>();
    for (Observation o : diagnosis.observations()) {
      ObjectNode node = JsonText.object();
      node.put("at", o.at());
      node.put("text", o.text());
      observations.add(node);
    }
    fields.put("observations", observations);
    List<Object> suspects = new ArrayList<>();
    for (Suspect s : diagnosis.suspects()) {
      ObjectNode node = JsonText.object();
      node.put("fault", s.fault());
      node.set("probability", JsonText.number(round(s.probability(), 6)));
      node.put("consistent", s.consistent());
      ArrayNode group = node.putArray("group");
      for (String member : s.group()) {
        group.add(member);
      }
      node.put("why", s.why());
      if (s.estimatedValue().isPresent()) {
        node.set("estimatedValue", JsonText.number(round(s.estimatedValue().getAsDouble(), 4)));
      }
      suspects.add(node);
    }
    fields.put("suspects", suspects);
    List<Object> probes = new ArrayList<>();
    for (ProbeAdvice p : diagnosis.nextProbes()) {
      ObjectNode node = JsonText.object();
      node.put("at", p.at());
      node.put("kind", p.kind().word());
      if (p.kind() == Reading.Kind.OHMS) {
        node.put("to", p.to());
      }
      if (p.kind() == Reading.Kind.AC) {
        node.set("hz", JsonText.number(p.hz()));
        // An extension of version 1: how the AC reading should be stated (rms, peak or pp).
        node.put("measure", p.measure().word());
      }
      node.set("bits", JsonText.number(round(p.bits(), 4)));
      node.put("why", p.why());
      probes.add(node);
    }
    fields.put("nextProbes", probes);
    fields.put("confirmingCheck", f.textNode(diagnosis.confirmingCheck()));
    List<Object> noteList = new ArrayList<>();
    for (String note : diagnosis.notes()) {
      noteList.add(f.textNode(note));
    }
    fields.put("notes", noteList);
    return JsonText.document(fields);
  }

  /** Returns the JSON text of a diagnosis on one line, for a line of a batch's output. */
  public static String writeLine(Diagnosis diagnosis) {
    return JsonText.compact(write(diagnosis));
  }

  /** Returns {@code {"error": message}} on one line, for a bad line of a batch. */
  public static String errorLine(String message) {
    com.fasterxml.jackson.databind.node.ObjectNode node = JsonText.object();
    node.put("error", message);
    return JsonText.compact(node.toString());
  }

  /** Rounds to {@code digits} significant digits, so files do not carry noise digits. */
  private static double round(double value, int digits) {
    if (value == 0 || !Double.isFinite(value)) {
      return value;
    }
    return new java.math.BigDecimal(value).round(new java.math.MathContext(digits)).doubleValue();
  }
}
