package com.stagewise.circuit;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.function.UnaryOperator;

/**
 * One op-amp circuit with its parts, rails and test inputs: what a stage sheet holds.
 *
 * <p>Nets are named strings. The ground net is the reference at 0 V; rails and inputs are driven
 * nets; every other net is solved for. The record is immutable; the {@code with…} methods return
 * modified copies (the diagnosis uses them to apply a fault).
 *
 * @param title a short description, e.g. "Input buffer, left channel"
 * @param board the board model the stage belongs to (may be empty)
 * @param ground the reference net
 * @param rails the supply rails
 * @param inputs the test inputs
 * @param parts resistors, capacitors, diodes, zeners, LEDs, trimmers
 * @param amplifiers op-amp sections
 */
public record Stage(
    String title,
    String board,
    String ground,
    List<Rail> rails,
    List<TestInput> inputs,
    List<Part> parts,
    List<Amplifier> amplifiers) {

  /** Copies the lists; see the record description. */
  public Stage {
    title = title == null ? "" : title;
    board = board == null ? "" : board;
    Part.requireName(ground, "ground");
    rails = List.copyOf(Objects.requireNonNull(rails, "rails"));
    inputs = List.copyOf(Objects.requireNonNull(inputs, "inputs"));
    parts = List.copyOf(Objects.requireNonNull(parts, "parts"));
    amplifiers = List.copyOf(Objects.requireNonNull(amplifiers, "amplifiers"));
  }

  /** Returns every net of the stage, ground first, then in order of first mention. */
  public Set<String> nets() {
    Set<String> nets = new LinkedHashSet<>();
    nets.add(ground);
    for (Rail rail : rails) {
      nets.add(rail.net());
    }
    for (TestInput input : inputs) {
      nets.add(input.net());
    }
    for (Part part : parts) {
      nets.addAll(part.nets());
    }
    for (Amplifier amp : amplifiers) {
      for (Terminal terminal : Terminal.values()) {
        nets.add(amp.net(terminal));
      }
    }
    return nets;
  }

  /**
   * Returns whether {@code point} is one of the stage's nets, as {@code nets().contains(point)}
   * says, without building the set (readings are checked against it one by one).
   */
  public boolean hasNet(String point) {
    if (point.equals(ground) || rail(point).isPresent() || input(point).isPresent()) {
      return true;
    }
    for (Part part : parts) {
      if (part.nets().contains(point)) {
        return true;
      }
    }
    for (Amplifier amp : amplifiers) {
      for (Terminal terminal : Terminal.values()) {
        if (amp.net(terminal).equals(point)) {
          return true;
        }
      }
    }
    return false;
  }

  /**
   * Returns whether {@code point} is a used package pin ({@code U1.6}), as {@code
   * pinNets().containsKey(point)} says, without building the map.
   */
  public boolean hasUsedPin(String point) {
    int dot = point.lastIndexOf('.');
    if (dot <= 0 || dot == point.length() - 1 || point.length() - dot > 4) {
      return false;
    }
    String digits = point.substring(dot + 1);
    for (int i = 0; i < digits.length(); i++) {
      if (digits.charAt(i) < '0' || digits.charAt(i) > '9') {
        return false;
      }
    }
    int pin = Integer.parseInt(digits);
    if (!Integer.toString(pin).equals(digits)) {
      return false;
    }
    String pkg = point.substring(0, dot);
    for (Amplifier amp : amplifiers) {
      if (amp.packageRef().equals(pkg)) {
        for (Terminal terminal : Terminal.values()) {
          if (amp.pin(terminal) == pin) {
            return true;
          }
        }
      }
    }
    return false;
  }

  /** Returns whether the net is ground, a rail or a test input. */
  public boolean isDriven(String net) {
    return net.equals(ground) || rail(net).isPresent() || input(net).isPresent();
  }

  /** Returns the rail on a net, if the net is a rail. */
  public Optional<Rail> rail(String net) {
    for (Rail rail : rails) {
      if (rail.net().equals(net)) {
        return Optional.of(rail);
      }
    }
    return Optional.empty();
  }

  /** Returns the test input on a net, if any. */
  public Optional<TestInput> input(String net) {
    for (TestInput input : inputs) {
      if (input.net().equals(net)) {
        return Optional.of(input);
      }
    }
    return Optional.empty();
  }

  /** Returns the part with this designator, if any. */
  public Optional<Part> part(String ref) {
    for (Part part : parts) {
      if (part.ref().equals(ref)) {
        return Optional.of(part);
      }
    }
    return Optional.empty();
  }

  /** Returns the section with this designator, if any. */
  public Optional<Amplifier> amplifier(String ref) {
    for (Amplifier amp : amplifiers) {
      if (amp.ref().equals(ref)) {
        return Optional.of(amp);
      }
    }
    return Optional.empty();
  }

  /**
   * Returns the nominal voltage of every driven net: ground at 0, rails at their volts, inputs at
   * their DC level.
   */
  public Map<String, Double> drivenVolts() {
    Map<String, Double> volts = new LinkedHashMap<>();
    volts.put(ground, 0.0);
    for (Rail rail : rails) {
      volts.put(rail.net(), rail.volts());
    }
    for (TestInput input : inputs) {
      volts.put(input.net(), input.dc());
    }
    return volts;
  }

  /** Returns the package designators in order of first mention, e.g. {@code [U1, U2]}. */
  public List<String> packages() {
    List<String> refs = new ArrayList<>();
    for (Amplifier amp : amplifiers) {
      if (!refs.contains(amp.packageRef())) {
        refs.add(amp.packageRef());
      }
    }
    return refs;
  }

  /** Returns the package type of a package designator, if the stage has that package. */
  public Optional<PackageType> packageType(String packageRef) {
    for (Amplifier amp : amplifiers) {
      if (amp.packageRef().equals(packageRef)) {
        return Optional.of(amp.packageType());
      }
    }
    return Optional.empty();
  }

  /**
   * Returns the net on every used package pin, keyed {@code PACKAGE.PIN} (e.g. {@code U1.6}), in
   * package then pin order. A pin is used when a section of the stage has a terminal on it.
   */
  public Map<String, String> pinNets() {
    Map<String, String> pins = new LinkedHashMap<>();
    for (String pkg : packages()) {
      Map<Integer, String> byPin = new TreeMap<>();
      for (Amplifier amp : amplifiers) {
        if (amp.packageRef().equals(pkg)) {
          for (Terminal terminal : Terminal.values()) {
            byPin.putIfAbsent(amp.pin(terminal), amp.net(terminal));
          }
        }
      }
      for (Map.Entry<Integer, String> pin : byPin.entrySet()) {
        pins.put(pkg + "." + pin.getKey(), pin.getValue());
      }
    }
    return pins;
  }

  /** Returns the sections that sit in one package. */
  public List<Amplifier> sectionsOf(String packageRef) {
    List<Amplifier> sections = new ArrayList<>();
    for (Amplifier amp : amplifiers) {
      if (amp.packageRef().equals(packageRef)) {
        sections.add(amp);
      }
    }
    return List.copyOf(sections);
  }

  /** Returns a copy with the parts replaced. */
  public Stage withParts(List<Part> newParts) {
    return new Stage(title, board, ground, rails, inputs, newParts, amplifiers);
  }

  /** Returns a copy with the sections replaced. */
  public Stage withAmplifiers(List<Amplifier> newAmplifiers) {
    return new Stage(title, board, ground, rails, inputs, parts, newAmplifiers);
  }

  /** Returns a copy with the rails replaced. */
  public Stage withRails(List<Rail> newRails) {
    return new Stage(title, board, ground, newRails, inputs, parts, amplifiers);
  }

  /** Returns a copy with the inputs replaced. */
  public Stage withInputs(List<TestInput> newInputs) {
    return new Stage(title, board, ground, rails, newInputs, parts, amplifiers);
  }

  /** Returns a copy with the part of this designator changed by {@code change}. */
  public Stage withPart(String ref, UnaryOperator<Part> change) {
    List<Part> changed = new ArrayList<>(parts.size());
    for (Part part : parts) {
      changed.add(part.ref().equals(ref) ? change.apply(part) : part);
    }
    return withParts(changed);
  }

  /** Returns a copy with the part of the same designator replaced by {@code part}. */
  public Stage withPart(Part part) {
    List<Part> changed = new ArrayList<>(parts.size());
    for (Part p : parts) {
      changed.add(p.ref().equals(part.ref()) ? part : p);
    }
    return withParts(changed);
  }

  /** Returns a copy with one more part. */
  public Stage plusPart(Part part) {
    List<Part> more = new ArrayList<>(parts);
    more.add(part);
    return withParts(more);
  }

  /** Returns a copy without the part of this designator. */
  public Stage minusPart(String ref) {
    List<Part> kept = new ArrayList<>(parts.size());
    for (Part part : parts) {
      if (!part.ref().equals(ref)) {
        kept.add(part);
      }
    }
    return withParts(kept);
  }

  /** Returns a copy with the section of this designator changed by {@code change}. */
  public Stage withAmplifier(String ref, UnaryOperator<Amplifier> change) {
    List<Amplifier> changed = new ArrayList<>(amplifiers.size());
    for (Amplifier amp : amplifiers) {
      changed.add(amp.ref().equals(ref) ? change.apply(amp) : amp);
    }
    return withAmplifiers(changed);
  }

  /** Returns a copy with the section of the same designator replaced by {@code amp}. */
  public Stage withAmplifier(Amplifier amp) {
    List<Amplifier> changed = new ArrayList<>(amplifiers.size());
    for (Amplifier a : amplifiers) {
      changed.add(a.ref().equals(amp.ref()) ? amp : a);
    }
    return withAmplifiers(changed);
  }
}
