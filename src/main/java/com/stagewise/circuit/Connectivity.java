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
    Map<String, String> parent = new HashMap<>();
    final String driven = "\u0000driven";
    parent.put(driven, driven);
    for (String net : stage.nets()) {
      parent.put(net, stage.isDriven(net) ? driven : net);
    }
    for (Part part : stage.parts()) {
      // Junctions conduct at DC too (forward, or through their leakage): a net that only a
      // reverse-biased diode holds still has a defined voltage, as in ngspice.
      if (part.kind() == PartKind.RESISTOR || part.kind().isJunction()) {
        union(parent, part.netA(), part.netB());
      } else if (part.kind().isTrimmer()) {
        union(parent, part.netA(), part.wiper());
        union(parent, part.wiper(), part.netB());
      }
    }
    for (Amplifier amp : stage.amplifiers()) {
      if (!deadSections.contains(amp.ref())) {
        union(parent, amp.out(), driven);
      }
    }
    List<String> floating = new ArrayList<>();
    for (String net : stage.nets()) {
      if (!find(parent, net).equals(find(parent, driven))) {
        floating.add(net);
      }
    }
    return floating;
  }

  private static String find(Map<String, String> parent, String net) {
    String root = net;
    while (!parent.get(root).equals(root)) {
      root = parent.get(root);
    }
    parent.put(net, root);
    return root;
  }

  private static void union(Map<String, String> parent, String a, String b) {
    String rootA = find(parent, a);
    String rootB = find(parent, b);
    if (!rootA.equals(rootB)) {
      // Keep the driven marker as the root so that the check above stays a plain comparison.
      if (rootA.startsWith("\u0000")) {
        parent.put(rootB, rootA);
      } else {
        parent.put(rootA, rootB);
      }
    }
  }
}
