package com.stagewise.reference;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Every fault of the design notes' catalogue for one stage, as fault ids, built here from the stage
 * itself (not from the diagnosis code): {@code healthy}; each part open, short, high, low; each
 * section stuck high, stuck low, dead; each used package pin lifted; each pair of adjacent used
 * pins bridged (when the two pins sit on different nets); each rail missing and low.
 */
final class FaultList {
  private FaultList() {}

  /**
   * A fault that is left out of the truth set.
   *
   * @param fault the fault id
   * @param reason why, in plain words
   */
  record Skipped(String fault, String reason) {}

  /** Returns the fault ids in a fixed order, {@code healthy} first. */
  static List<String> of(Stage stage) {
    List<String> faults = new ArrayList<>();
    faults.add("healthy");
    for (Part part : stage.parts()) {
      // DESIGN.md fault ids: diodes and LEDs open|short|leaky, zeners also high|low (their
      // voltage), trimmers wiper-open|open|misset; resistors and capacitors open|short|high|low.
      List<String> kinds =
          switch (part.kind()) {
            case DIODE, LED -> List.of("open", "short", "leaky");
            case ZENER -> List.of("open", "short", "leaky", "high", "low");
            case TRIMMER, POTENTIOMETER -> List.of("wiper-open", "open", "misset");
            default -> List.of("open", "short", "high", "low");
          };
      for (String kind : kinds) {
        faults.add(part.ref() + ":" + kind);
      }
    }
    for (Amplifier amp : stage.amplifiers()) {
      for (String kind : List.of("stuck-high", "stuck-low", "dead")) {
        faults.add(amp.ref() + ":" + kind);
      }
    }
    Map<String, String> pins = stage.pinNets();
    for (String pin : pins.keySet()) {
      faults.add(pin + ":lifted");
    }
    for (String pkg : stage.packages()) {
      for (int[] pair : adjacentPairs(stage, pkg)) {
        String a = pkg + "." + pair[0];
        String b = pkg + "." + pair[1];
        if (pins.containsKey(a) && pins.containsKey(b) && !pins.get(a).equals(pins.get(b))) {
          faults.add(pkg + "." + pair[0] + "-" + pair[1] + ":bridge");
        }
      }
    }
    for (Rail rail : stage.rails()) {
      faults.add(rail.net() + ":missing");
      faults.add(rail.net() + ":low");
    }
    return faults;
  }

  /** Returns the adjacent pairs that are not simulated, with the reason. */
  static List<Skipped> skipped(Stage stage) {
    List<Skipped> skipped = new ArrayList<>();
    Map<String, String> pins = stage.pinNets();
    for (String pkg : stage.packages()) {
      for (int[] pair : adjacentPairs(stage, pkg)) {
        String a = pkg + "." + pair[0];
        String b = pkg + "." + pair[1];
        String id = pkg + "." + pair[0] + "-" + pair[1] + ":bridge";
        if (!pins.containsKey(a) || !pins.containsKey(b)) {
          skipped.add(new Skipped(id, "a pin of the pair is not used by the stage"));
        } else if (pins.get(a).equals(pins.get(b))) {
          skipped.add(
              new Skipped(
                  id, "both pins sit on net " + pins.get(a) + ": a bridge changes nothing"));
        }
      }
    }
    return skipped;
  }

  private static List<int[]> adjacentPairs(Stage stage, String pkg) {
    PackageType type = stage.packageType(pkg).orElseThrow();
    return type.adjacentPairs();
  }
}
