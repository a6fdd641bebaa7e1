package com.stagewise.diagnosis;

import com.stagewise.circuit.Stage;
import com.stagewise.solver.PowerOff;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The pairs of points an ohms check may be taken between: every two nets once, every used pin
 * against its own net (which checks its joint), and every two adjacent used pins of a package on
 * different nets (one check across two neighbouring legs tests both joints and the gap between
 * them: OL if either joint is open, about 0 Ω if they are bridged).
 */
final class CheckPairs {
  private final PowerOff healthy;
  private final List<String> candidates;
  private final List<String[]> adjacentPins;

  CheckPairs(Stage stage, PowerOff healthy) {
    this.healthy = healthy;
    Set<String> points = new LinkedHashSet<>(stage.nets());
    points.addAll(stage.pinNets().keySet());
    this.candidates = List.copyOf(points);
    List<String[]> adjacent = new ArrayList<>();
    Map<String, String> pinNets = stage.pinNets();
    for (String pkg : stage.packages()) {
      for (int[] pair : stage.packageType(pkg).orElseThrow().adjacentPairs()) {
        String a = pkg + "." + pair[0];
        String b = pkg + "." + pair[1];
        if (pinNets.containsKey(a)
            && pinNets.containsKey(b)
            && !pinNets.get(a).equals(pinNets.get(b))) {
          adjacent.add(new String[] {a, b});
        }
      }
    }
    this.adjacentPins = List.copyOf(adjacent);
  }

  /** Returns one key for a pair of points whichever way round they are named. */
  static String key(String a, String b) {
    return a.compareTo(b) < 0 ? a + "|" + b : b + "|" + a;
  }

  /**
   * Returns the pairs, less those already read.
   *
   * @param taken the pairs already read, each as its two points on the faulted stage
   */
  List<String[]> pairs(List<String[]> taken) {
    Set<String> done = new HashSet<>();
    for (String[] r : taken) {
      done.add(key(r[0], r[1]));
    }
    List<String[]> pairs = new ArrayList<>();
    Set<String> seenNets = new HashSet<>();
    for (int i = 0; i < candidates.size(); i++) {
      for (int j = i + 1; j < candidates.size(); j++) {
        String a = candidates.get(i);
        String b = candidates.get(j);
        String netA = healthy.node(a).orElseThrow();
        String netB = healthy.node(b).orElseThrow();
        boolean pinCheck = !a.equals(netA) || !b.equals(netB);
        if (netA.equals(netB) && !pinCheck) {
          continue;
        }
        // Between two nets one pair is enough; a pin against its own net checks its joint.
        if (pinCheck && !netA.equals(netB)) {
          continue;
        }
        if (done.contains(key(a, b)) || !seenNets.add(key(a, b))) {
          continue;
        }
        pairs.add(new String[] {a, b});
      }
    }
    for (String[] pins : adjacentPins) {
      if (!done.contains(key(pins[0], pins[1]))) {
        pairs.add(pins);
      }
    }
    return pairs;
  }
}
