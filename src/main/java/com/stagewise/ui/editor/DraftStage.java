package com.stagewise.ui.editor;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.circuit.TestInput;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.Tolerance;
import com.stagewise.circuit.value.ZenerMarking;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * A stage as it stands in the editor: everything the technician entered, including what is not
 * complete or not valid yet (a part with one net, a value that is not a number). Immutable; every
 * edit makes a new one, which is what undo and redo keep.
 *
 * <p>A net left empty ({@code ""}) is not wired yet.
 *
 * @param title the stage's title
 * @param board the board model's name
 * @param ground the reference net's name
 * @param rails the supply rails
 * @param inputs the test inputs
 * @param parts the parts
 * @param sections the op-amp sections
 */
public record DraftStage(
    String title,
    String board,
    String ground,
    List<DraftRail> rails,
    List<DraftInput> inputs,
    List<DraftPart> parts,
    List<DraftSection> sections) {

  /** Copies the lists; see the record description. */
  public DraftStage {
    title = title == null ? "" : title;
    board = board == null ? "" : board;
    ground = ground == null ? "" : ground.strip();
    rails = List.copyOf(rails);
    inputs = List.copyOf(inputs);
    parts = List.copyOf(parts);
    sections = List.copyOf(sections);
  }

  /**
   * A rail as entered.
   *
   * @param net the rail's net
   * @param volts its nominal volts
   * @param tolerance its tolerance ({@code 5%} or {@code 0.05})
   */
  public record DraftRail(String net, Entry volts, Entry tolerance) {
    /** Keeps the fields; see the record description. */
    public DraftRail {
      net = net == null ? "" : net.strip();
      Objects.requireNonNull(volts, "volts");
      Objects.requireNonNull(tolerance, "tolerance");
    }
  }

  /**
   * A test input as entered.
   *
   * @param net the driven net
   * @param dc its DC level in volts
   * @param ac its AC amplitude in volts ({@code 0} or empty for none)
   * @param hz the AC frequency in hertz ({@code 0} or empty for none)
   */
  public record DraftInput(String net, Entry dc, Entry ac, Entry hz, AcMeasure measure) {
    /** Keeps the fields; see the record description. */
    public DraftInput {
      net = net == null ? "" : net.strip();
      Objects.requireNonNull(dc, "dc");
      Objects.requireNonNull(ac, "ac");
      Objects.requireNonNull(hz, "hz");
      Objects.requireNonNull(measure, "measure");
    }

    /** Returns an input whose AC amplitude is a peak (the stage sheet's default). */
    public DraftInput(String net, Entry dc, Entry ac, Entry hz) {
      this(net, dc, ac, hz, AcMeasure.PEAK);
    }
  }

  /**
   * A part as entered.
   *
   * @param ref its designator
   * @param kind its kind
   * @param value its value (ohms, farads; a zener's marking such as {@code 5V1}; empty for a diode
   *     or LED, which have none)
   * @param tolerance its tolerance
   * @param nets the nets on its leads, in sheet order ({@code [anode, cathode]} for a junction,
   *     {@code [end, wiper, end]} for a trimmer); {@code ""} where not wired yet
   * @param choice a diode's class ({@code silicon}, {@code schottky}) or an LED's colour ({@code
   *     red} …) as chosen; {@code ""} for other kinds or when not chosen yet
   * @param position a trimmer's wiper position (0 to 1) as entered; empty for other kinds
   * @param sealed whether a trimmer is factory-set and sealed
   */
  public record DraftPart(
      String ref,
      PartKind kind,
      Entry value,
      Entry tolerance,
      List<String> nets,
      String choice,
      Entry position,
      boolean sealed) {
    /** Copies the nets; see the record description. */
    public DraftPart {
      ref = ref == null ? "" : ref.strip();
      Objects.requireNonNull(kind, "kind");
      Objects.requireNonNull(value, "value");
      Objects.requireNonNull(tolerance, "tolerance");
      nets = nets.stream().map(n -> n == null ? "" : n.strip()).toList();
      choice = choice == null ? "" : choice.strip();
      position = position == null ? Entry.typed("") : position;
    }

    /** A resistor or capacitor (no choice, no wiper). */
    public DraftPart(String ref, PartKind kind, Entry value, Entry tolerance, List<String> nets) {
      this(ref, kind, value, tolerance, nets, "", Entry.typed(""), false);
    }

    DraftPart withRef(String newRef) {
      return new DraftPart(newRef, kind, value, tolerance, nets, choice, position, sealed);
    }

    DraftPart withValue(Entry newValue) {
      return new DraftPart(ref, kind, newValue, tolerance, nets, choice, position, sealed);
    }

    DraftPart withTolerance(Entry newTolerance) {
      return new DraftPart(ref, kind, value, newTolerance, nets, choice, position, sealed);
    }

    DraftPart withNet(int lead, String net) {
      List<String> changed = new ArrayList<>(nets);
      changed.set(lead, net == null ? "" : net.strip());
      return withNets(changed);
    }

    DraftPart withNets(List<String> changed) {
      return new DraftPart(ref, kind, value, tolerance, changed, choice, position, sealed);
    }

    DraftPart withChoice(String newChoice) {
      return new DraftPart(ref, kind, value, tolerance, nets, newChoice, position, sealed);
    }

    DraftPart withPosition(Entry newPosition, boolean newSealed) {
      return new DraftPart(ref, kind, value, tolerance, nets, choice, newPosition, newSealed);
    }

    /** Returns the names of the leads in the order of {@link #nets}, as in readings files. */
    public List<String> leads() {
      if (kind.isTrimmer()) {
        return List.of("1", "w", "2");
      }
      return kind.isJunction() ? List.of("a", "k") : List.of("1", "2");
    }
  }

  /**
   * An op-amp section as entered.
   *
   * @param ref its designator, e.g. {@code U1A}
   * @param packageRef its package's designator, e.g. {@code U1}
   * @param packageType the package and pinout
   * @param section its letter in the package
   * @param deviceClass the class of device
   * @param nets the net on each terminal; {@code ""} where not wired yet
   */
  public record DraftSection(
      String ref,
      String packageRef,
      PackageType packageType,
      String section,
      DeviceClass deviceClass,
      Map<Terminal, String> nets) {
    /** Copies the nets; see the record description. */
    public DraftSection {
      ref = ref == null ? "" : ref.strip();
      packageRef = packageRef == null ? "" : packageRef.strip();
      Objects.requireNonNull(packageType, "packageType");
      Objects.requireNonNull(section, "section");
      Objects.requireNonNull(deviceClass, "deviceClass");
      Map<Terminal, String> copy = new EnumMap<>(Terminal.class);
      for (Terminal terminal : Terminal.values()) {
        String net = nets.get(terminal);
        copy.put(terminal, net == null ? "" : net.strip());
      }
      nets = java.util.Collections.unmodifiableMap(copy);
    }

    /** Returns the net on a terminal, {@code ""} when not wired. */
    public String net(Terminal terminal) {
      return nets.get(terminal);
    }

    /** Returns the package pin of a terminal, by the pinout of DESIGN.md. */
    public int pin(Terminal terminal) {
      return packageType.pin(section, terminal);
    }

    DraftSection withNet(Terminal terminal, String net) {
      Map<Terminal, String> changed = new EnumMap<>(nets);
      changed.put(terminal, net == null ? "" : net.strip());
      return new DraftSection(ref, packageRef, packageType, section, deviceClass, changed);
    }

    DraftSection withRef(String newRef) {
      return new DraftSection(newRef, packageRef, packageType, section, deviceClass, nets);
    }

    DraftSection withClass(DeviceClass newClass) {
      return new DraftSection(ref, packageRef, packageType, section, newClass, nets);
    }

    DraftSection withSection(String letter) {
      return new DraftSection(ref, packageRef, packageType, letter, deviceClass, nets);
    }
  }

  /** Returns an empty stage: ground {@code GND}, nothing else. */
  public static DraftStage empty(String title, String board) {
    return new DraftStage(title, board, "GND", List.of(), List.of(), List.of(), List.of());
  }

  /** Returns the draft of a stage, every value kept exactly. */
  public static DraftStage of(Stage stage) {
    List<DraftRail> rails = new ArrayList<>();
    for (Rail rail : stage.rails()) {
      rails.add(
          new DraftRail(
              rail.net(),
              Entry.of(rail.volts(), plain(rail.volts())),
              Entry.of(rail.tolerance(), Tolerance.format(rail.tolerance()))));
    }
    List<DraftInput> inputs = new ArrayList<>();
    for (TestInput input : stage.inputs()) {
      inputs.add(
          new DraftInput(
              input.net(),
              Entry.of(input.dc(), plain(input.dc())),
              Entry.of(input.ac(), plain(input.ac())),
              Entry.of(input.hz(), plain(input.hz())),
              input.measure()));
    }
    List<DraftPart> parts = new ArrayList<>();
    for (Part part : stage.parts()) {
      String choice =
          switch (part.kind()) {
            case DIODE -> part.diodeClass().word();
            case LED -> part.colour().word();
            default -> "";
          };
      Entry position =
          part.kind().isTrimmer()
              ? Entry.of(part.position(), plain(part.position()))
              : Entry.typed("");
      parts.add(
          new DraftPart(
              part.ref(),
              part.kind(),
              Entry.of(part.value(), valueText(part.kind(), part.value())),
              Entry.of(part.tolerance(), Tolerance.format(part.tolerance())),
              part.nets(),
              choice,
              position,
              part.sealed()));
    }
    List<DraftSection> sections = new ArrayList<>();
    for (Amplifier amp : stage.amplifiers()) {
      Map<Terminal, String> nets = new EnumMap<>(Terminal.class);
      for (Terminal terminal : Terminal.values()) {
        nets.put(terminal, amp.net(terminal));
      }
      sections.add(
          new DraftSection(
              amp.ref(),
              amp.packageRef(),
              amp.packageType(),
              amp.section(),
              amp.deviceClass(),
              nets));
    }
    return new DraftStage(
        stage.title(), stage.board(), stage.ground(), rails, inputs, parts, sections);
  }

  /**
   * Returns a value as a technician writes it: {@code 4k7}, {@code 100n}, a zener's {@code 5V1};
   * empty for a diode or LED (no value).
   */
  static String valueText(PartKind kind, double value) {
    return switch (kind) {
      case CAPACITOR -> SiValue.rkmFarads(value);
      case ZENER -> ZenerMarking.format(value);
      case DIODE, LED -> "";
      default -> SiValue.rkm(value);
    };
  }

  /** Returns a number in plain decimal notation, whatever the machine's locale. */
  static String plain(double value) {
    return BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
  }

  /** Returns every net named on the stage, ground first, then in order of first mention. */
  public Set<String> nets() {
    Set<String> nets = new LinkedHashSet<>();
    if (!ground.isEmpty()) {
      nets.add(ground);
    }
    rails.forEach(r -> nets.add(r.net()));
    inputs.forEach(i -> nets.add(i.net()));
    parts.forEach(p -> nets.addAll(p.nets()));
    sections.forEach(s -> nets.addAll(s.nets().values()));
    nets.remove("");
    return nets;
  }

  /** Returns the part with this designator, or null. */
  public DraftPart part(String ref) {
    return parts.stream().filter(p -> p.ref().equals(ref)).findFirst().orElse(null);
  }

  /** Returns the section with this designator, or null. */
  public DraftSection section(String ref) {
    return sections.stream().filter(s -> s.ref().equals(ref)).findFirst().orElse(null);
  }

  /** Returns the package designators in order of first mention. */
  public List<String> packages() {
    List<String> refs = new ArrayList<>();
    for (DraftSection s : sections) {
      if (!refs.contains(s.packageRef())) {
        refs.add(s.packageRef());
      }
    }
    return refs;
  }

  DraftStage withTitle(String newTitle, String newBoard) {
    return new DraftStage(newTitle, newBoard, ground, rails, inputs, parts, sections);
  }

  DraftStage withGround(String net) {
    return new DraftStage(title, board, net, rails, inputs, parts, sections);
  }

  DraftStage withRails(List<DraftRail> changed) {
    return new DraftStage(title, board, ground, changed, inputs, parts, sections);
  }

  DraftStage withInputs(List<DraftInput> changed) {
    return new DraftStage(title, board, ground, rails, changed, parts, sections);
  }

  DraftStage withParts(List<DraftPart> changed) {
    return new DraftStage(title, board, ground, rails, inputs, changed, sections);
  }

  DraftStage withSections(List<DraftSection> changed) {
    return new DraftStage(title, board, ground, rails, inputs, parts, changed);
  }
}
