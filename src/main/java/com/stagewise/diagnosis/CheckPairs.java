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
  private final List<String[]> all;
  private final List<String> keys;

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
    this.all = every();
    List<String> allKeys = new ArrayList<>(all.size());
    for (String[] pair : all) {
      allKeys.add(key(pair[0], pair[1]));
    }
    this.keys = List.copyOf(allKeys);
  }

  /** Returns one key for a pair of points whichever way round they are named. */
  static String key(String a, String b) {
    return a.compareTo(b) < 0 ? a + "|" + b : b + "|" + a;
  }

  /**
   * Returns the pairs less those already read, as indices into {@link #all()} in its order.
   *
   * @param taken the pairs already read, each as its two points on the faulted stage
   */
  int[] indices(List<String[]> taken) {
    Set<String> done = new HashSet<>();
    for (String[] r : taken) {
      done.add(key(r[0], r[1]));
    }
    int[] out = new int[all.size()];
    int n = 0;
    for (int k = 0; k < out.length; k++) {
      if (!done.contains(keys.get(k))) {
        out[n++] = k;
      }
    }
    return java.util.Arrays.copyOf(out, n);
  }

  /** Returns every pair when nothing has been read yet (do not change the arrays). */
  List<String[]> all() {
    return all;
  }

  /** Every pair before any reading is taken, found once (a pair of one key is listed once). */
  private List<String[]> every() {
    List<String[]> pairs = new ArrayList<>();
    Set<String> seenNets = new HashSet<>();
    for (int i = 0; i < candidates.size(); i++) {
      String a = candidates.get(i);
      String netA = healthy.node(a).orElseThrow();
      for (int j = i + 1; j < candidates.size(); j++) {
        String b = candidates.get(j);
        String netB = healthy.node(b).orElseThrow();
        boolean pinCheck = !a.equals(netA) || !b.equals(netB);
        if (netA.equals(netB) && !pinCheck) {
          continue;
        }
        // Between two nets one pair is enough; a pin against its own net checks its joint.
        if (pinCheck && !netA.equals(netB)) {
          continue;
        }
        if (!seenNets.add(key(a, b))) {
          continue;
        }
        pairs.add(new String[] {a, b});
      }
    }
    pairs.addAll(adjacentPins);
    return List.copyOf(pairs);
  }
}
