package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * The faults a stage can have: every part open, short, high and low (diodes, zeners, LEDs and
 * trimmers their own, see {@link #partFaults}); every section stuck high, stuck low and dead; every
 * used package pin lifted; every pair of adjacent used pins bridged (unless both sit on one net);
 * every rail missing and low; and healthy.
 */
public final class FaultCatalogue {
  private FaultCatalogue() {}

  /**
   * The faults of a stage, and the notes about faults that cannot be seen.
   *
   * @param faults every fault hypothesis, healthy first
   * @param notes plain sentences about faults left out because no reading can show them
   */
  public record Entries(List<Fault> faults, List<String> notes) {}

  /**
   * Returns the faults a part of a kind can have (DESIGN.md fault ids): a resistor or capacitor
   * open, short, high, low; a diode or LED open, short, leaky; a zener also high and low (its
   * voltage); a trimmer's wiper open, its track open, or misset.
   */
  public static List<FaultKind> partFaults(PartKind kind) {
    return switch (kind) {
      case RESISTOR, CAPACITOR ->
          List.of(FaultKind.OPEN, FaultKind.SHORT, FaultKind.HIGH, FaultKind.LOW);
      case DIODE, LED -> List.of(FaultKind.OPEN, FaultKind.SHORT, FaultKind.LEAKY);
      case ZENER ->
          List.of(FaultKind.OPEN, FaultKind.SHORT, FaultKind.LEAKY, FaultKind.HIGH, FaultKind.LOW);
      case TRIMMER, POTENTIOMETER ->
          List.of(FaultKind.WIPER_OPEN, FaultKind.OPEN, FaultKind.MISSET);
    };
  }

  /** Returns the catalogue of a stage. */
  public static Entries of(Stage stage) {
    List<Fault> faults = new ArrayList<>();
    List<String> notes = new ArrayList<>();
    faults.add(Fault.HEALTHY);
    for (Part part : stage.parts()) {
      for (FaultKind kind : partFaults(part.kind())) {
        faults.add(Fault.of(part.ref(), kind));
      }
    }
    for (Amplifier amp : stage.amplifiers()) {
      for (FaultKind kind : List.of(FaultKind.STUCK_HIGH, FaultKind.STUCK_LOW, FaultKind.DEAD)) {
        faults.add(Fault.of(amp.ref(), kind));
      }
    }
    Map<String, String> pinNets = stage.pinNets();
    for (String pin : pinNets.keySet()) {
      int dot = pin.lastIndexOf('.');
      faults.add(Fault.lifted(pin.substring(0, dot), Integer.parseInt(pin.substring(dot + 1))));
    }
    for (String pkg : stage.packages()) {
      PackageType type = stage.packageType(pkg).orElseThrow();
      for (int[] pair : type.adjacentPairs()) {
        String netA = pinNets.get(pkg + "." + pair[0]);
        String netB = pinNets.get(pkg + "." + pair[1]);
        if (netA == null || netB == null) {
          continue;
        }
        if (netA.equals(netB)) {
          notes.add(
              "A solder bridge between pins "
                  + pair[0]
                  + " and "
                  + pair[1]
                  + " of "
                  + pkg
                  + " cannot be seen: both pins sit on net "
                  + netA
                  + ". Look at the joints instead.");
        } else {
          faults.add(Fault.bridge(pkg, pair[0], pair[1]));
        }
      }
    }
    for (Rail rail : stage.rails()) {
      faults.add(Fault.of(rail.net(), FaultKind.RAIL_MISSING));
      faults.add(Fault.of(rail.net(), FaultKind.RAIL_LOW));
    }
    return new Entries(faults, notes);
  }
}
