package com.stagewise.solver;

import com.stagewise.circuit.Stage;
import java.util.AbstractMap;
import java.util.AbstractSet;
import java.util.HashMap;
import java.util.Iterator;
import java.util.Map;
import java.util.NoSuchElementException;
import java.util.Set;

/**
 * The names of one compiled stage (nets, sections, used pins) and their positions, shared by every
 * point solved on it, so that a point's maps are views over arrays rather than copies.
 */
final class Layout {
  final Stage stage;
  final String[] nets;
  final Map<String, Integer> netIndex;
  final String[] sections;
  final Map<String, Integer> sectionIndex;
  private volatile Pins pins;

  Layout(Stage stage, String[] nets, String[] sections) {
    this.stage = stage;
    this.nets = nets;
    this.sections = sections;
    this.netIndex = new HashMap<>(nets.length * 2);
    for (int i = 0; i < nets.length; i++) {
      netIndex.put(nets[i], i);
    }
    this.sectionIndex = new HashMap<>(sections.length * 2);
    for (int k = 0; k < sections.length; k++) {
      sectionIndex.put(sections[k], k);
    }
  }

  /** Used pins and the net index each reads, worked out on first use. */
  private record Pins(String[] names, int[] net, Map<String, Integer> index) {}

  private Pins pins() {
    Pins p = pins;
    if (p == null) {
      Map<String, String> pinNets = stage.pinNets();
      String[] names = pinNets.keySet().toArray(new String[0]);
      int[] net = new int[names.length];
      Map<String, Integer> index = new HashMap<>(names.length * 2);
      for (int i = 0; i < names.length; i++) {
        net[i] = netIndex.get(pinNets.get(names[i]));
        index.put(names[i], i);
      }
      p = new Pins(names, net, index);
      pins = p;
    }
    return p;
  }

  /** Returns an operating point over the given arrays (kept, not copied). */
  OperatingPoint point(double[] volts, SectionState[] states) {
    return new OperatingPoint(
        new NetVolts(this, volts), new PinVolts(this, volts), new States(this, states));
  }

  /** Net voltages of a point: a map view over an array in the stage's net order. */
  static final class NetVolts extends ArrayMap<Double> {
    final double[] volts;

    NetVolts(Layout layout, double[] volts) {
      super(layout, layout.nets, layout.netIndex);
      this.volts = volts;
    }

    @Override
    Double value(int i) {
      return volts[i];
    }
  }

  /** Pin voltages of a point: a view over the nets' array. */
  static final class PinVolts extends AbstractMap<String, Double> {
    private final Layout layout;
    private final double[] volts;

    PinVolts(Layout layout, double[] volts) {
      this.layout = layout;
      this.volts = volts;
    }

    @Override
    public Double get(Object key) {
      Integer i = layout.pins().index.get(key);
      return i == null ? null : volts[layout.pins().net[i]];
    }

    @Override
    public boolean containsKey(Object key) {
      return layout.pins().index.containsKey(key);
    }

    @Override
    public Set<Entry<String, Double>> entrySet() {
      return new PinEntries(layout.pins(), volts);
    }
  }

  /** The entries of a {@link PinVolts}: each pin's name with its net's voltage. */
  private static final class PinEntries extends Entries<Double> {
    private final Pins pins;
    private final double[] volts;

    PinEntries(Pins pins, double[] volts) {
      super(pins.names.length);
      this.pins = pins;
      this.volts = volts;
    }

    @Override
    Map.Entry<String, Double> entry(int i) {
      return Map.entry(pins.names[i], volts[pins.net[i]]);
    }
  }

  /** Section states of a point: a view over an array in the stage's section order. */
  static final class States extends ArrayMap<SectionState> {
    final SectionState[] states;

    States(Layout layout, SectionState[] states) {
      super(layout, layout.sections, layout.sectionIndex);
      this.states = states;
    }

    @Override
    SectionState value(int i) {
      return states[i];
    }
  }

  /** AC phasors of a response: a view over amplitude and phase arrays in net order. */
  static final class Phasors extends ArrayMap<Phasor> {
    final double[] amplitude;
    final double[] phase;

    Phasors(Layout layout, double[] amplitude, double[] phase) {
      super(layout, layout.nets, layout.netIndex);
      this.amplitude = amplitude;
      this.phase = phase;
    }

    @Override
    Phasor value(int i) {
      return new Phasor(amplitude[i], phase[i]);
    }
  }

  /** An unmodifiable map over names in a fixed order, with values from an array. */
  abstract static class ArrayMap<V> extends AbstractMap<String, V> {
    final Layout layout;
    private final String[] names;
    private final Map<String, Integer> index;

    ArrayMap(Layout layout, String[] names, Map<String, Integer> index) {
      this.layout = layout;
      this.names = names;
      this.index = index;
    }

    abstract V value(int i);

    @Override
    public V get(Object key) {
      Integer i = index.get(key);
      return i == null ? null : value(i);
    }

    @Override
    public boolean containsKey(Object key) {
      return index.containsKey(key);
    }

    @Override
    public int size() {
      return names.length;
    }

    @Override
    public Set<Entry<String, V>> entrySet() {
      return new ArrayEntries<>(this);
    }
  }

  /** The entries of an {@link ArrayMap}: each name with its value. */
  private static final class ArrayEntries<V> extends Entries<V> {
    private final ArrayMap<V> map;

    ArrayEntries(ArrayMap<V> map) {
      super(map.names.length);
      this.map = map;
    }

    @Override
    Map.Entry<String, V> entry(int i) {
      return Map.entry(map.names[i], map.value(i));
    }
  }

  /**
   * The entries of a view, in order; a subclass makes the i-th (a class rather than a lambda: a
   * lambda's class is spun on its first call, which a fresh command-line JVM pays for).
   */
  private abstract static class Entries<V> extends AbstractSet<Map.Entry<String, V>> {
    private final int size;

    Entries(int size) {
      this.size = size;
    }

    abstract Map.Entry<String, V> entry(int i);

    @Override
    public int size() {
      return size;
    }

    @Override
    public Iterator<Map.Entry<String, V>> iterator() {
      return new Iterator<>() {
        private int next;

        @Override
        public boolean hasNext() {
          return next < size;
        }

        @Override
        public Map.Entry<String, V> next() {
          if (next >= size) {
            throw new NoSuchElementException();
          }
          return entry(next++);
        }
      };
    }
  }
}
