package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Stage;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * The sections of a stage in signal order (a section fed by another's output comes after it), and
 * where along that chain each fault sits: so that a technician sees whether the suspects are before
 * or after the point that looks wrong.
 *
 * <p>A part belongs to the section whose input network it is in (reached from the section's inputs
 * through parts, without crossing a driven net or another section's output); a part that no input
 * network holds (a load, a series output resistor) belongs to the section whose output reaches it.
 * A pin fault belongs to the pin's section; a supply pin, a rail or a package-wide fault to none
 * (it touches every section of the package or the stage).
 */
public final class SignalChain {
  private final List<Amplifier> order;
  private final Map<String, Integer> partPosition = new HashMap<>();
  private final Map<String, Integer> sectionPosition = new HashMap<>();
  private final Stage stage;

  private SignalChain(Stage stage) {
    this.stage = stage;
    this.order = signalOrder(stage);
    for (int i = 0; i < order.size(); i++) {
      sectionPosition.put(order.get(i).ref(), i);
    }
    Set<String> outputs = new HashSet<>();
    stage.amplifiers().forEach(a -> outputs.add(a.out()));
    for (int i = 0; i < order.size(); i++) {
      Amplifier amp = order.get(i);
      for (Part part : reach(List.of(amp.inPlus(), amp.inMinus()), outputs)) {
        partPosition.putIfAbsent(part.ref(), i);
      }
    }
    for (int i = 0; i < order.size(); i++) {
      for (Part part : reach(List.of(order.get(i).out()), Set.of())) {
        partPosition.putIfAbsent(part.ref(), i);
      }
    }
  }

  /** Returns the chain of a stage. */
  public static SignalChain of(Stage stage) {
    return new SignalChain(stage);
  }

  /** Returns the sections' designators in signal order. */
  public List<String> sections() {
    return order.stream().map(Amplifier::ref).toList();
  }

  /**
   * Returns where a fault sits along the chain: the position (0 first) of its section, or empty
   * when it belongs to no one section (healthy, a rail, a supply pin, a part outside every
   * section's network).
   */
  public Optional<Integer> position(Fault fault) {
    return switch (fault.kind()) {
      case HEALTHY, RAIL_MISSING, RAIL_LOW -> Optional.empty();
      case STUCK_HIGH, STUCK_LOW, DEAD -> Optional.ofNullable(sectionPosition.get(fault.subject()));
      case LIFTED, BRIDGE -> pinPosition(fault.subject(), fault.pin());
      default -> Optional.ofNullable(partPosition.get(fault.subject()));
    };
  }

  /** Returns the section a fault sits at, by designator, or empty (see {@link #position}). */
  public Optional<String> section(Fault fault) {
    return position(fault).map(i -> order.get(i).ref());
  }

  private Optional<Integer> pinPosition(String packageRef, int pin) {
    Optional<PackageType> type = stage.packageType(packageRef);
    if (type.isEmpty()) {
      return Optional.empty();
    }
    Optional<PackageType.PinRole> role = type.get().role(pin);
    if (role.isEmpty() || role.get().section().isEmpty()) {
      return Optional.empty();
    }
    for (Amplifier amp : stage.sectionsOf(packageRef)) {
      if (amp.section().equals(role.get().section())) {
        return Optional.ofNullable(sectionPosition.get(amp.ref()));
      }
    }
    return Optional.empty();
  }

  /**
   * Returns the parts reached from {@code start} through parts, stopping at driven and stop nets.
   */
  private List<Part> reach(List<String> start, Set<String> stop) {
    List<Part> found = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    Deque<String> queue = new ArrayDeque<>();
    for (String net : start) {
      if (!stage.isDriven(net) && seen.add(net)) {
        queue.add(net);
      }
    }
    while (!queue.isEmpty()) {
      String net = queue.poll();
      for (Part part : stage.parts()) {
        if (!part.touches(net) || found.contains(part)) {
          continue;
        }
        found.add(part);
        String other = part.netA().equals(net) ? part.netB() : part.netA();
        if (!stage.isDriven(other) && !stop.contains(other) && seen.add(other)) {
          queue.add(other);
        }
      }
    }
    return found;
  }

  /** Sections ranked by how many sections feed them in turn; sheet order among equals. */
  private static List<Amplifier> signalOrder(Stage stage) {
    Map<Amplifier, Set<Amplifier>> feeders = new LinkedHashMap<>();
    Set<String> outputs = new HashSet<>();
    stage.amplifiers().forEach(a -> outputs.add(a.out()));
    for (Amplifier amp : stage.amplifiers()) {
      Set<String> inputNets = inputNets(stage, amp, outputs);
      Set<Amplifier> feeding = new HashSet<>();
      for (Amplifier other : stage.amplifiers()) {
        if (other != amp && inputNets.contains(other.out())) {
          feeding.add(other);
        }
      }
      feeders.put(amp, feeding);
    }
    // Two sections that feed each other (the gain resistor between the inputs of an
    // instrumentation amplifier's buffers) stand side by side: neither comes first.
    Map<Amplifier, Set<Amplifier>> before = new HashMap<>();
    feeders.forEach((amp, set) -> before.put(amp, Set.copyOf(set)));
    for (Amplifier amp : stage.amplifiers()) {
      feeders.get(amp).removeIf(other -> before.get(other).contains(amp));
    }
    Map<Amplifier, Integer> rank = new HashMap<>();
    for (Amplifier amp : stage.amplifiers()) {
      rank(amp, feeders, rank, new HashSet<>());
    }
    List<Amplifier> order = new ArrayList<>(stage.amplifiers());
    order.sort((a, b) -> Integer.compare(rank.get(a), rank.get(b)));
    return order;
  }

  private static int rank(
      Amplifier amp,
      Map<Amplifier, Set<Amplifier>> feeders,
      Map<Amplifier, Integer> rank,
      Set<Amplifier> visiting) {
    Integer known = rank.get(amp);
    if (known != null) {
      return known;
    }
    if (!visiting.add(amp)) {
      return 0; // a loop through several sections: cut it here
    }
    int r = 0;
    for (Amplifier feeder : feeders.get(amp)) {
      r = Math.max(r, rank(feeder, feeders, rank, visiting) + 1);
    }
    visiting.remove(amp);
    rank.put(amp, r);
    return r;
  }

  /** The nets of a section's input networks, up to and including the outputs they reach. */
  private static Set<String> inputNets(Stage stage, Amplifier amp, Set<String> outputs) {
    Set<String> seen = new HashSet<>();
    Deque<String> queue = new ArrayDeque<>();
    for (String net : List.of(amp.inPlus(), amp.inMinus())) {
      if (seen.add(net)) {
        queue.add(net);
      }
    }
    while (!queue.isEmpty()) {
      String net = queue.poll();
      if (stage.isDriven(net) || outputs.contains(net)) {
        continue;
      }
      for (Part part : stage.parts()) {
        if (part.touches(net)) {
          String other = part.netA().equals(net) ? part.netB() : part.netA();
          if (seen.add(other)) {
            queue.add(other);
          }
        }
      }
    }
    return seen;
  }
}
