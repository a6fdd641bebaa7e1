package com.stagewise.solver;

import com.stagewise.circuit.Amplifier;
import java.util.HashMap;
import java.util.Map;
import java.util.Optional;

/**
 * What the solver should assume beyond the stage's own nominal values: device parameters per
 * section, driven-net voltages that differ from the sheet (a low rail, a measured input), and
 * outputs forced by a fault (stuck high, stuck low, dead).
 *
 * @param devices parameters per section designator; a section not listed takes its class's nominal
 * @param driven voltages of driven nets (ground, rails, inputs) that replace the sheet's
 * @param forced sections whose output is forced to {@code HIGH}, {@code LOW} or {@code DEAD}
 */
public record Conditions(
    Map<String, DeviceParams> devices,
    Map<String, Double> driven,
    Map<String, SectionState> forced) {

  /** Nominal everything: the sheet's values and each class's nominal parameters. */
  public static final Conditions NOMINAL = new Conditions(Map.of(), Map.of(), Map.of());

  /** Copies the maps; a forced state must not be {@code LINEAR}. */
  public Conditions {
    devices = Map.copyOf(devices);
    driven = Map.copyOf(driven);
    forced = Map.copyOf(forced);
    if (forced.containsValue(SectionState.LINEAR)) {
      throw new IllegalArgumentException("a forced output must be high, low or dead, not linear");
    }
  }

  /** Returns the parameters of a section: the ones given, else its class's nominal. */
  public DeviceParams device(Amplifier amp) {
    DeviceParams given = devices.get(amp.ref());
    return given != null ? given : DeviceParams.nominal(amp.deviceClass());
  }

  /** Returns the forced state of a section, if a fault forces it. */
  public Optional<SectionState> forcedState(String sectionRef) {
    return Optional.ofNullable(forced.get(sectionRef));
  }

  /** Returns a copy with one section's parameters set. */
  public Conditions withDevice(String sectionRef, DeviceParams params) {
    Map<String, DeviceParams> more = new HashMap<>(devices);
    more.put(sectionRef, params);
    return new Conditions(more, driven, forced);
  }

  /** Returns a copy with one driven net held at {@code volts}. */
  public Conditions withDriven(String net, double volts) {
    Map<String, Double> more = new HashMap<>(driven);
    more.put(net, volts);
    return new Conditions(devices, more, forced);
  }

  /** Returns a copy with one section's output forced. */
  public Conditions withForced(String sectionRef, SectionState state) {
    Map<String, SectionState> more = new HashMap<>(forced);
    more.put(sectionRef, state);
    return new Conditions(devices, driven, more);
  }
}
