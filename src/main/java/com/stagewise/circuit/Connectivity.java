package com.stagewise.circuit;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** Answers which nets of a stage have a DC path to a driven net. */
public final class Connectivity {
  private Connectivity() {}

  /**
   * Returns the nets with no DC path to a driven net, in the stage's net order.
   *
   * <p>DC paths run through resistors, trimmers, junctions and from each section's output (a source
   * behind its output resistance). Capacitors are open at DC, and op-amp inputs draw no current, so
   * a net that only capacitors and inputs touch floats.
   */
  public static List<String> floatingNets(Stage stage) {
    return floatingNets(stage, java.util.Set.of());
  }

  /**
   * As {@link #floatingNets(Stage)}, with the outputs of the {@code deadSections} (designators)
   * driving nothing: a dead output no longer ties its net to anything.
   */
  public static List<String> floatingNets(Stage stage, java.util.Set<String> deadSections) {
    // Union-find over the nets' indices; index n stands for every driven net at once.
    List<String> nets = new ArrayList<>(stage.nets());
    int n = nets.size();
    Map<String, Integer> index = new HashMap<>(2 * n);
    for (int i = 0; i < n; i++) {
      index.put(nets.get(i), i);
    }
    int[] parent = new int[n + 1];
    for (int i = 0; i <= n; i++) {
      parent[i] = i;
    }
    parent[index.get(stage.ground())] = n;
    for (Rail rail : stage.rails()) {
      parent[index.get(rail.net())] = n;
    }
    for (TestInput input : stage.inputs()) {
      parent[index.get(input.net())] = n;
    }
    for (Part part : stage.parts()) {
      // Junctions conduct at DC too (forward, or through their leakage): a net that only a
      // reverse-biased diode holds still has a defined voltage, as in ngspice.
      if (part.kind() == PartKind.RESISTOR || part.kind().isJunction()) {
        union(parent, index.get(part.netA()), index.get(part.netB()));
      } else if (part.kind().isTrimmer()) {
        union(parent, index.get(part.netA()), index.get(part.wiper()));
        union(parent, index.get(part.wiper()), index.get(part.netB()));
      }
    }
    for (Amplifier amp : stage.amplifiers()) {
      if (!deadSections.contains(amp.ref())) {
        union(parent, index.get(amp.out()), n);
      }
    }
    List<String> floating = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      if (find(parent, i) != n) {
        floating.add(nets.get(i));
      }
    }
    return floating;
  }

  private static int find(int[] parent, int net) {
    int root = net;
    while (parent[root] != root) {
      root = parent[root];
    }
    parent[net] = root;
    return root;
  }

  private static void union(int[] parent, int a, int b) {
    int rootA = find(parent, a);
    int rootB = find(parent, b);
    if (rootA != rootB) {
      // Keep the driven marker (the largest index) as the root, so that the check is a comparison.
      if (rootA > rootB) {
        parent[rootB] = rootA;
      } else {
        parent[rootA] = rootB;
      }
    }
  }
}
