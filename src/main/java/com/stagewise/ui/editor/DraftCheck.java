package com.stagewise.ui.editor;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Connectivity;
import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.LedColour;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.StageRules;
import com.stagewise.circuit.Terminal;
import com.stagewise.circuit.TestInput;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.Tolerance;
import com.stagewise.circuit.value.ZenerMarking;
import com.stagewise.ui.editor.DraftStage.DraftInput;
import com.stagewise.ui.editor.DraftStage.DraftPart;
import com.stagewise.ui.editor.DraftStage.DraftRail;
import com.stagewise.ui.editor.DraftStage.DraftSection;
import com.stagewise.ui.editor.EditorProblem.Place;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Checks a draft stage: what was entered (values that are not values, leads not wired yet), the
 * rules every stage keeps ({@link StageRules}, the floating-net check of {@link Connectivity}) and
 * what a stage needs before it can be diagnosed (a supply for every section); each problem goes
 * beside the part, section, rail or input that causes it.
 *
 * <p>While entries are incomplete the rules are still checked, on a stand-in stage: a value that is
 * not a number stands in as a plain 1 k (or 1 nF, 0 V), an unwired lead as a net of its own;
 * problems that only the stand-ins cause are left out, since the entry problem already says it.
 */
final class DraftCheck {
  /** Net names of the stand-ins for unwired leads start with this; no sheet can name one so. */
  static final String UNWIRED = "\u2205unwired:";

  private static final Pattern INDEXED =
      Pattern.compile("^(parts|amplifiers|rails|inputs)\\[(\\d+)]");

  private DraftCheck() {}

  /**
   * The outcome of a check.
   *
   * @param stage the stage entered, with stand-ins where entries are not complete (for drawing)
   * @param problems every problem, in order of the draft
   * @param complete whether every entry is complete and valid (then {@code stage} is exactly the
   *     stage entered)
   */
  record Checked(Stage stage, List<EditorProblem> problems, boolean complete) {}

  static Checked check(DraftStage draft) {
    List<EditorProblem> problems = new ArrayList<>();
    String ground = draft.ground();
    if (ground.isEmpty()) {
      problems.add(new EditorProblem(Place.STAGE, "", "the ground net needs a name (usually GND)"));
      ground = UNWIRED + "ground";
    }
    List<Rail> rails = new ArrayList<>();
    for (int i = 0; i < draft.rails().size(); i++) {
      rails.add(rail(draft.rails().get(i), i, problems));
    }
    List<TestInput> inputs = new ArrayList<>();
    for (int i = 0; i < draft.inputs().size(); i++) {
      inputs.add(input(draft.inputs().get(i), i, problems));
    }
    List<Part> parts = new ArrayList<>();
    for (int i = 0; i < draft.parts().size(); i++) {
      parts.add(part(draft.parts().get(i), i, problems));
    }
    List<Amplifier> amps = new ArrayList<>();
    for (int i = 0; i < draft.sections().size(); i++) {
      amps.add(section(draft.sections().get(i), i, problems));
    }
    boolean complete = problems.isEmpty();
    Stage stage = new Stage(draft.title(), draft.board(), ground, rails, inputs, parts, amps);
    if (amps.isEmpty()) {
      problems.add(
          new EditorProblem(
              Place.STAGE,
              "",
              "the stage has no op-amp section yet: add one (package, designator, section letter)"));
    }
    rules(draft, stage, problems);
    floating(draft, stage, problems);
    supplies(draft, stage, problems);
    loneTerminals(draft, stage, problems);
    return new Checked(stage, List.copyOf(problems), complete);
  }

  private static Rail rail(DraftRail rail, int index, List<EditorProblem> problems) {
    String key = String.valueOf(index);
    String net = rail.net();
    String name = net.isEmpty() ? "rail " + (index + 1) : "rail " + net;
    if (net.isEmpty()) {
      problems.add(new EditorProblem(Place.RAIL, key, name + " needs its net's name, e.g. VCC"));
      net = UNWIRED + "rail" + index;
    }
    double volts = 0;
    String voltsProblem = rail.volts().problem(SiValue::parse);
    if (voltsProblem != null) {
      problems.add(new EditorProblem(Place.RAIL, key, name + " volts: " + voltsProblem));
    } else {
      volts = rail.volts().value(SiValue::parse);
    }
    double tolerance = 0.05;
    String tolProblem = rail.tolerance().problem(Tolerance::parse);
    if (tolProblem != null) {
      problems.add(new EditorProblem(Place.RAIL, key, name + ": " + tolProblem));
    } else {
      tolerance = rail.tolerance().value(Tolerance::parse);
    }
    return new Rail(net, volts, tolerance);
  }

  private static TestInput input(DraftInput input, int index, List<EditorProblem> problems) {
    String key = String.valueOf(index);
    String net = input.net();
    String name = net.isEmpty() ? "input " + (index + 1) : "input " + net;
    if (net.isEmpty()) {
      problems.add(new EditorProblem(Place.INPUT, key, name + " needs the net it drives, e.g. IN"));
      net = UNWIRED + "input" + index;
    }
    double dc = number(input.dc(), name + " DC level", Place.INPUT, key, problems, false);
    double ac = number(input.ac(), name + " AC amplitude", Place.INPUT, key, problems, true);
    double hz = number(input.hz(), name + " frequency", Place.INPUT, key, problems, true);
    if (ac < 0) {
      problems.add(
          new EditorProblem(Place.INPUT, key, name + " AC amplitude must be 0 or more volts"));
      ac = 0;
    }
    if (hz < 0) {
      problems.add(
          new EditorProblem(Place.INPUT, key, name + " frequency must be 0 or more hertz"));
      hz = 0;
    }
    if (ac > 0 && hz <= 0) {
      problems.add(
          new EditorProblem(
              Place.INPUT,
              key,
              name + " has an AC amplitude, so it needs a frequency above 0 Hz (e.g. 1k)"));
      ac = 0;
    }
    return new TestInput(net, dc, ac, hz);
  }

  private static double number(
      Entry entry,
      String role,
      Place place,
      String key,
      List<EditorProblem> problems,
      boolean emptyIsZero) {
    if (emptyIsZero && entry.text().isBlank() && Double.isNaN(entry.exact())) {
      return 0;
    }
    String problem = entry.problem(SiValue::parse);
    if (problem != null) {
      problems.add(new EditorProblem(place, key, role + ": " + problem));
      return 0;
    }
    return entry.value(SiValue::parse);
  }

  private static Part part(DraftPart part, int index, List<EditorProblem> problems) {
    String ref = part.ref();
    String key = ref;
    if (ref.isEmpty()) {
      ref = UNWIRED + "part" + index;
      key = ref;
      problems.add(new EditorProblem(Place.PART, key, "a part needs its designator, e.g. R7"));
    }
    PartKind kind = part.kind();
    double value = kind == PartKind.CAPACITOR ? 1e-9 : kind == PartKind.ZENER ? 5.1 : 1000;
    if (kind == PartKind.ZENER) {
      String zenerProblem = part.value().problem(ZenerMarking::parse);
      if (zenerProblem != null) {
        problems.add(
            new EditorProblem(
                Place.PART,
                key,
                part.ref()
                    + " is a zener and needs its voltage: "
                    + (part.value().text().isBlank() ? "type its marking" : zenerProblem)
                    + " (e.g. 5V1, 12V or 3.3V)"));
      } else {
        value = part.value().value(ZenerMarking::parse);
      }
    } else if (kind == PartKind.DIODE || kind == PartKind.LED) {
      value = 0;
    } else {
      boolean farads = kind == PartKind.CAPACITOR;
      String valueProblem = part.value().problem(SiValue::parse);
      if (valueProblem != null) {
        problems.add(
            new EditorProblem(
                Place.PART,
                key,
                part.ref()
                    + " value: "
                    + valueProblem
                    + (farads ? " (farads, e.g. 100n or 2u2)" : " (ohms, e.g. 4k7 or 470R)")));
      } else if (part.value().value(SiValue::parse) < 0) {
        problems.add(new EditorProblem(Place.PART, key, part.ref() + " value must not be below 0"));
      } else {
        value = part.value().value(SiValue::parse);
      }
    }
    double tolerance = kind == PartKind.CAPACITOR || kind.isTrimmer() ? 0.1 : 0.01;
    if (kind == PartKind.DIODE || kind == PartKind.LED) {
      tolerance = 0;
    } else {
      String tolProblem = part.tolerance().problem(Tolerance::parse);
      if (tolProblem != null) {
        problems.add(new EditorProblem(Place.PART, key, part.ref() + ": " + tolProblem));
      } else {
        tolerance = part.tolerance().value(Tolerance::parse);
      }
    }
    DiodeClass diodeClass = null;
    LedColour colour = null;
    if (kind == PartKind.DIODE) {
      diodeClass = DiodeClass.SILICON;
      try {
        diodeClass = DiodeClass.of(part.choice());
        if (diodeClass == DiodeClass.LED) {
          throw new InvalidInputException("", "class", "led is a kind of its own");
        }
      } catch (InvalidInputException e) {
        diodeClass = DiodeClass.SILICON;
        problems.add(
            new EditorProblem(
                Place.PART, key, part.ref() + " needs its diode class: silicon or schottky"));
      }
    } else if (kind == PartKind.LED) {
      colour = LedColour.RED;
      try {
        colour = LedColour.of(part.choice());
      } catch (InvalidInputException e) {
        problems.add(
            new EditorProblem(
                Place.PART,
                key,
                part.ref() + " is an LED and needs its colour: " + LedColour.words()));
      }
    }
    double position = Double.NaN;
    if (kind.isTrimmer()) {
      position = 0.5;
      String positionProblem = part.position().problem(SiValue::parse);
      double typed = positionProblem == null ? part.position().value(SiValue::parse) : Double.NaN;
      if (part.position().text().isBlank() && Double.isNaN(part.position().exact())) {
        position = 0.5; // the stage sheet's default
      } else if (!(typed >= 0 && typed <= 1)) {
        problems.add(
            new EditorProblem(
                Place.PART,
                key,
                part.ref()
                    + " position ("
                    + part.position().text()
                    + ") must be between 0 and 1: the wiper's share of the track from end 1"));
      } else {
        position = typed;
      }
    }
    List<String> nets = new ArrayList<>();
    List<Integer> unwired = new ArrayList<>();
    List<String> leads = part.leads();
    for (int lead = 0; lead < part.nets().size(); lead++) {
      String net = part.nets().get(lead);
      if (net.isEmpty()) {
        unwired.add(lead);
        net = UNWIRED + ref + "." + leads.get(lead);
      }
      nets.add(net);
    }
    if (!unwired.isEmpty()) {
      problems.add(
          new EditorProblem(
              Place.PART,
              key,
              part.ref()
                  + (unwired.size() == part.nets().size()
                      ? " is not connected yet: choose the nets of "
                          + (part.nets().size() == 3 ? "both ends and the wiper" : "both ends")
                      : " "
                          + leadName(part, unwired.get(0))
                          + " is not connected yet: choose its net")));
    }
    if (kind.isTrimmer()) {
      return new Part(
          ref,
          kind,
          value,
          tolerance,
          nets.get(0),
          nets.get(2),
          nets.get(1),
          position,
          part.sealed(),
          null,
          null);
    }
    return new Part(
        ref,
        kind,
        value,
        tolerance,
        nets.get(0),
        nets.get(1),
        null,
        Double.NaN,
        false,
        diodeClass,
        colour);
  }

  /** The lead in words: "end 2", "anode", "cathode", "wiper". */
  static String leadName(DraftPart part, int lead) {
    return switch (part.leads().get(lead)) {
      case "a" -> "anode";
      case "k" -> "cathode";
      case "w" -> "wiper";
      default -> "end " + part.leads().get(lead);
    };
  }

  private static Amplifier section(DraftSection s, int index, List<EditorProblem> problems) {
    String ref = s.ref();
    if (ref.isEmpty()) {
      ref = UNWIRED + "section" + index;
      problems.add(
          new EditorProblem(Place.SECTION, ref, "a section needs its designator, e.g. U1A"));
    }
    String pkg = s.packageRef();
    if (pkg.isEmpty()) {
      problems.add(
          new EditorProblem(
              Place.SECTION, ref, s.ref() + " needs its package's designator, e.g. U1"));
      pkg = UNWIRED + "package" + index;
    }
    Map<Terminal, String> nets = new HashMap<>();
    List<String> unwired = new ArrayList<>();
    for (Terminal terminal : Terminal.values()) {
      String net = s.net(terminal);
      if (net.isEmpty()) {
        unwired.add(terminal.words() + " (pin " + s.pin(terminal) + ")");
        net = UNWIRED + ref + "." + terminal.symbol();
      }
      nets.put(terminal, net);
    }
    if (!unwired.isEmpty()) {
      problems.add(
          new EditorProblem(
              Place.SECTION,
              ref,
              s.ref()
                  + " is not wired yet at its "
                  + String.join(", ", unwired)
                  + ": choose nets"));
    }
    return new Amplifier(
        ref,
        pkg,
        s.packageType(),
        s.section(),
        s.deviceClass(),
        nets.get(Terminal.IN_PLUS),
        nets.get(Terminal.IN_MINUS),
        nets.get(Terminal.OUT),
        nets.get(Terminal.V_PLUS),
        nets.get(Terminal.V_MINUS));
  }

  /** The rules of {@link StageRules}, each placed beside the part, section, rail or input. */
  private static void rules(DraftStage draft, Stage stage, List<EditorProblem> problems) {
    for (StageRules.Problem problem : StageRules.problems(stage)) {
      if (problem.message().contains(UNWIRED)
          || problem.field().equals("nets")
          || problem.message().contains("no DC path")) {
        continue;
      }
      problems.add(place(draft, stage, problem));
    }
  }

  private static EditorProblem place(DraftStage draft, Stage stage, StageRules.Problem problem) {
    Matcher m = INDEXED.matcher(problem.field());
    if (m.find()) {
      int i = Integer.parseInt(m.group(2));
      switch (m.group(1)) {
        case "parts":
          if (i < stage.parts().size()) {
            return new EditorProblem(Place.PART, stage.parts().get(i).ref(), problem.message());
          }
          break;
        case "amplifiers":
          if (i < stage.amplifiers().size()) {
            return new EditorProblem(
                Place.SECTION, stage.amplifiers().get(i).ref(), problem.message());
          }
          break;
        case "rails":
          return new EditorProblem(Place.RAIL, String.valueOf(i), problem.message());
        default:
          return new EditorProblem(Place.INPUT, String.valueOf(i), problem.message());
      }
    }
    return new EditorProblem(Place.STAGE, "", problem.message());
  }

  /** Each net with no DC path, beside the first part or section that touches it. */
  private static void floating(DraftStage draft, Stage stage, List<EditorProblem> problems) {
    for (String net : Connectivity.floatingNets(stage)) {
      if (net.startsWith(UNWIRED)) {
        continue;
      }
      List<String> touching = new ArrayList<>();
      EditorProblem.Place place = Place.STAGE;
      String key = "";
      for (Part part : stage.parts()) {
        if (part.touches(net)) {
          touching.add(part.ref());
          if (key.isEmpty()) {
            place = Place.PART;
            key = part.ref();
          }
        }
      }
      for (Amplifier amp : stage.amplifiers()) {
        for (Terminal terminal : Terminal.values()) {
          if (amp.net(terminal).equals(net)) {
            touching.add(amp.pinName(terminal));
            if (key.isEmpty()) {
              place = Place.SECTION;
              key = amp.ref();
            }
          }
        }
      }
      problems.add(
          new EditorProblem(
              place,
              key,
              "net "
                  + net
                  + " has no DC path to ground, a rail or an input: only "
                  + String.join(", ", touching)
                  + " touch it (capacitors and op-amp inputs pass no DC); add the missing"
                  + " resistor or fix the net"));
    }
  }

  /** A section needs a supply: at least one supply pin reaching a rail, the two pins apart. */
  private static void supplies(DraftStage draft, Stage stage, List<EditorProblem> problems) {
    Set<String> reachRail = railReach(stage);
    Set<String> reported = new HashSet<>();
    for (Amplifier amp : stage.amplifiers()) {
      if (amp.vPlus().startsWith(UNWIRED) || amp.vMinus().startsWith(UNWIRED)) {
        continue;
      }
      if (!reported.add(amp.packageRef())) {
        continue;
      }
      if (amp.vPlus().equals(amp.vMinus())) {
        problems.add(
            new EditorProblem(
                Place.SECTION,
                amp.ref(),
                amp.ref()
                    + " has no supply: its positive and negative supply pins (pins "
                    + amp.pin(Terminal.V_PLUS)
                    + " and "
                    + amp.pin(Terminal.V_MINUS)
                    + ") are both on net "
                    + amp.vPlus()));
      } else if (!reachRail.contains(amp.vPlus()) && !reachRail.contains(amp.vMinus())) {
        problems.add(
            new EditorProblem(
                Place.SECTION,
                amp.ref(),
                amp.ref()
                    + " has no supply: neither supply pin (net "
                    + amp.vPlus()
                    + " at pin "
                    + amp.pin(Terminal.V_PLUS)
                    + ", net "
                    + amp.vMinus()
                    + " at pin "
                    + amp.pin(Terminal.V_MINUS)
                    + ") reaches a rail; add the rail or wire the pin to it"));
      }
    }
  }

  /** Returns the nets joined to a rail directly or through resistors. */
  private static Set<String> railReach(Stage stage) {
    Set<String> reach = new HashSet<>();
    stage.rails().forEach(r -> reach.add(r.net()));
    boolean grew = true;
    while (grew) {
      grew = false;
      for (Part part : stage.parts()) {
        if (part.kind() == PartKind.RESISTOR
            && reach.contains(part.netA()) != reach.contains(part.netB())
            && !stage.isDriven(reach.contains(part.netA()) ? part.netB() : part.netA())) {
          reach.add(part.netA());
          reach.add(part.netB());
          grew = true;
        }
      }
    }
    return reach;
  }

  /**
   * A section's input or supply pin on a net that nothing else touches (a misspelt name): the stage
   * sheet refuses it, so the editor says it beside the section.
   */
  private static void loneTerminals(DraftStage draft, Stage stage, List<EditorProblem> problems) {
    Map<String, Integer> uses = new HashMap<>();
    for (Part part : stage.parts()) {
      uses.merge(part.netA(), 1, Integer::sum);
      uses.merge(part.netB(), 1, Integer::sum);
    }
    for (Amplifier amp : stage.amplifiers()) {
      for (Terminal terminal : Terminal.values()) {
        uses.merge(amp.net(terminal), 1, Integer::sum);
      }
    }
    for (Amplifier amp : stage.amplifiers()) {
      for (Terminal terminal :
          List.of(Terminal.IN_PLUS, Terminal.IN_MINUS, Terminal.V_PLUS, Terminal.V_MINUS)) {
        String net = amp.net(terminal);
        if (net.startsWith(UNWIRED) || stage.isDriven(net) || uses.getOrDefault(net, 0) != 1) {
          continue;
        }
        String message =
            "net "
                + net
                + " at "
                + amp.pinName(terminal)
                + " ("
                + amp.ref()
                + " "
                + terminal.words()
                + ") touches nothing else: a misspelt net name, or a part not added yet?";
        boolean said =
            problems.stream()
                .anyMatch(
                    p ->
                        p.isAbout(Place.SECTION, amp.ref())
                            && p.message().contains("net " + net + " "));
        if (!said) {
          problems.add(new EditorProblem(Place.SECTION, amp.ref(), message));
        }
      }
    }
  }
}
