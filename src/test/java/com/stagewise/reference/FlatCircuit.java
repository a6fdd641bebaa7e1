package com.stagewise.reference;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.JunctionFigures;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.circuit.TestInput;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.DeviceParams;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * A stage flattened to the elements a circuit simulator sees: driven nodes, two-terminal branches
 * and op-amp sections with their own parameters, each terminal on a named node.
 *
 * <p>Faults are applied here, to the elements, by the truth generator itself (not by the diagnosis
 * code): a part removed or changed, a pin's terminal moved to its own node, a bridge added, a rail
 * source changed, an output forced or disconnected. Mutable on purpose: it is built and edited step
 * by step, then written once.
 */
final class FlatCircuit {
  /** Resistance of a short (a shorted part or a solder bridge): the solver's own floor, 1 mΩ. */
  static final double SHORT_OHMS = 1e-3;

  /** Resistance that ties a floating node to where its leakage or bias current pulls it. */
  static final double TIE_OHMS = 1e9;

  /** What drives an op-amp section's output. */
  enum Mode {
    /** The clamped internal source follows the inputs. */
    LIVE,
    /** The internal source sits at its upper limit. */
    STUCK_HIGH,
    /** The internal source sits at its lower limit. */
    STUCK_LOW,
    /** No source and no output resistance: the output pin drives nothing. */
    DEAD
  }

  /**
   * A resistor or capacitor between two nodes, or a junction from anode {@code a} to cathode {@code
   * b} with its figures.
   *
   * @param label what the branch is, for the netlist's comments (a designator, "bridge", "tie")
   * @param junction a junction's figures (Shockley, series resistance, breakdown); else null
   */
  record Branch(
      String label, PartKind kind, String a, String b, double value, JunctionFigures junction) {
    Branch(String label, PartKind kind, String a, String b, double value) {
      this(label, kind, a, b, value, null);
    }
  }

  /** The label of a trimmer's track section from its first end to the wiper. */
  static String upperTrack(String ref) {
    return ref + " (1-w)";
  }

  /** The label of a trimmer's track section from the wiper to its second end. */
  static String lowerTrack(String ref) {
    return ref + " (w-2)";
  }

  /** One op-amp section with the nodes on its terminals. */
  record Section(
      String ref,
      String packageRef,
      Map<Terminal, String> nodes,
      Map<Terminal, String> pins,
      DeviceParams params,
      Mode mode) {
    Section {
      nodes = Map.copyOf(nodes);
      pins = Map.copyOf(pins);
    }

    String node(Terminal terminal) {
      return nodes.get(terminal);
    }

    Section withNode(Terminal terminal, String node) {
      Map<Terminal, String> moved = new HashMap<>(nodes);
      moved.put(terminal, node);
      return new Section(ref, packageRef, moved, pins, params, mode);
    }

    Section withMode(Mode newMode) {
      return new Section(ref, packageRef, nodes, pins, params, newMode);
    }

    Section withParams(DeviceParams newParams) {
      return new Section(ref, packageRef, nodes, pins, newParams, mode);
    }
  }

  final String ground;

  /** DC volts of every driven node except ground (rails and inputs). */
  final Map<String, Double> driven = new LinkedHashMap<>();

  /** AC amplitude of the driven nodes that carry the analysis frequency. */
  final Map<String, Double> acDrive = new LinkedHashMap<>();

  /** The AC analysis frequency in hertz, or 0 for DC only. */
  double hz;

  final List<Branch> branches = new ArrayList<>();
  final List<Section> sections = new ArrayList<>();

  /** The node each used package pin sits on, keyed {@code PACKAGE.PIN}. */
  final Map<String, String> pinNodes = new LinkedHashMap<>();

  /** The stage's nets, in the stage's order (test points that are nets). */
  final List<String> nets;

  private FlatCircuit(String ground, List<String> nets) {
    this.ground = ground;
    this.nets = List.copyOf(nets);
  }

  /**
   * Returns the stage flattened under the given conditions: driven-net overrides, per-section
   * device parameters and forced outputs are all carried over, so the result models exactly what
   * {@code StageSolver.solve(stage, conditions)} solves.
   */
  static FlatCircuit of(Stage stage, Conditions conditions) {
    FlatCircuit flat = new FlatCircuit(stage.ground(), List.copyOf(stage.nets()));
    for (Rail rail : stage.rails()) {
      flat.driven.put(rail.net(), rail.volts());
    }
    for (TestInput input : stage.inputs()) {
      flat.driven.put(input.net(), input.dc());
    }
    conditions
        .driven()
        .forEach(
            (net, volts) -> {
              if (flat.driven.containsKey(net)) {
                flat.driven.put(net, volts);
              }
            });
    Optional<TestInput> acSource = stage.inputs().stream().filter(TestInput::hasAc).findFirst();
    if (acSource.isPresent()) {
      flat.hz = acSource.get().hz();
      for (TestInput input : stage.inputs()) {
        if (input.hasAc() && input.hz() == flat.hz) {
          // ngspice's AC source magnitude is a peak; a stage stated otherwise would be misread.
          if (input.measure() != com.stagewise.circuit.AcMeasure.PEAK) {
            throw new IllegalArgumentException(
                "state input " + input.net() + " as a peak amplitude before flattening");
          }
          flat.acDrive.put(input.net(), input.ac());
        }
      }
    }
    for (Part part : stage.parts()) {
      if (part.kind().isJunction()) {
        flat.branches.add(
            new Branch(
                part.ref(), part.kind(), part.netA(), part.netB(), part.value(), part.junction()));
      } else if (part.kind().isTrimmer()) {
        // A trimmer is its track in two sections, split at the wiper.
        flat.branches.add(
            new Branch(
                upperTrack(part.ref()),
                PartKind.RESISTOR,
                part.netA(),
                part.wiper(),
                part.value() * part.position()));
        flat.branches.add(
            new Branch(
                lowerTrack(part.ref()),
                PartKind.RESISTOR,
                part.wiper(),
                part.netB(),
                part.value() * (1 - part.position())));
      } else {
        flat.branches.add(
            new Branch(part.ref(), part.kind(), part.netA(), part.netB(), part.value()));
      }
    }
    for (Amplifier amp : stage.amplifiers()) {
      Map<Terminal, String> nodes = new HashMap<>();
      Map<Terminal, String> pins = new HashMap<>();
      for (Terminal terminal : Terminal.values()) {
        nodes.put(terminal, amp.net(terminal));
        pins.put(terminal, amp.pinName(terminal));
      }
      Mode mode =
          conditions
              .forcedState(amp.ref())
              .map(
                  state ->
                      switch (state) {
                        case HIGH -> Mode.STUCK_HIGH;
                        case LOW -> Mode.STUCK_LOW;
                        case DEAD -> Mode.DEAD;
                        case LINEAR -> Mode.LIVE;
                      })
              .orElse(Mode.LIVE);
      flat.sections.add(
          new Section(amp.ref(), amp.packageRef(), nodes, pins, conditions.device(amp), mode));
    }
    flat.pinNodes.putAll(stage.pinNets());
    return flat;
  }

  /** Returns an independent copy (the lists and maps are copied; their elements are immutable). */
  FlatCircuit copy() {
    FlatCircuit copy = new FlatCircuit(ground, nets);
    copy.driven.putAll(driven);
    copy.acDrive.putAll(acDrive);
    copy.hz = hz;
    copy.branches.addAll(branches);
    copy.sections.addAll(sections);
    copy.pinNodes.putAll(pinNodes);
    return copy;
  }

  /** Returns whether a node is held by a source (ground included). */
  boolean isDriven(String node) {
    return node.equals(ground) || driven.containsKey(node);
  }

  /** Returns the DC volts of a driven node (ground is 0). */
  double drivenVolts(String node) {
    return node.equals(ground) ? 0 : driven.get(node);
  }

  /** Returns every node in order of first mention, ground first. */
  Set<String> nodes() {
    Set<String> nodes = new LinkedHashSet<>();
    nodes.add(ground);
    nodes.addAll(nets);
    nodes.addAll(driven.keySet());
    for (Branch branch : branches) {
      nodes.add(branch.a());
      nodes.add(branch.b());
    }
    for (Section section : sections) {
      for (Terminal terminal : Terminal.values()) {
        nodes.add(section.node(terminal));
      }
    }
    nodes.addAll(pinNodes.values());
    return nodes;
  }

  /** Returns the index of a section by designator. */
  int sectionIndex(String ref) {
    for (int k = 0; k < sections.size(); k++) {
      if (sections.get(k).ref().equals(ref)) {
        return k;
      }
    }
    throw new IllegalArgumentException("no section " + ref);
  }

  /** Returns the index of a branch by label. */
  int branchIndex(String label) {
    for (int k = 0; k < branches.size(); k++) {
      if (branches.get(k).label().equals(label)) {
        return k;
      }
    }
    throw new IllegalArgumentException("no part " + label);
  }

  /**
   * Returns the groups of nodes with no DC path to a driven node. DC paths run through resistors
   * and from each live or stuck output (a source behind its output resistance); capacitors are open
   * and op-amp inputs and supply pins draw no current except bias.
   */
  List<Set<String>> floatingGroups() {
    Map<String, String> parent = new HashMap<>();
    String drivenRoot = "\u0000driven";
    parent.put(drivenRoot, drivenRoot);
    for (String node : nodes()) {
      parent.put(node, isDriven(node) ? drivenRoot : node);
    }
    for (Branch branch : branches) {
      if (branch.kind() == PartKind.RESISTOR || branch.junction() != null) {
        union(parent, branch.a(), branch.b());
      }
    }
    for (Section section : sections) {
      if (section.mode() != Mode.DEAD) {
        union(parent, section.node(Terminal.OUT), drivenRoot);
      }
    }
    Map<String, Set<String>> groups = new LinkedHashMap<>();
    String drivenTop = find(parent, drivenRoot);
    for (String node : nodes()) {
      String root = find(parent, node);
      if (!root.equals(drivenTop)) {
        groups.computeIfAbsent(root, r -> new LinkedHashSet<>()).add(node);
      }
    }
    return new ArrayList<>(groups.values());
  }

  private static String find(Map<String, String> parent, String node) {
    String root = node;
    while (!parent.get(root).equals(root)) {
      root = parent.get(root);
    }
    parent.put(node, root);
    return root;
  }

  private static void union(Map<String, String> parent, String a, String b) {
    String rootA = find(parent, a);
    String rootB = find(parent, b);
    if (!rootA.equals(rootB)) {
      if (rootA.startsWith("\u0000")) {
        parent.put(rootB, rootA);
      } else {
        parent.put(rootA, rootB);
      }
    }
  }
}
