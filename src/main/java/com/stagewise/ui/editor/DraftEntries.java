package com.stagewise.ui.editor;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.LedColour;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
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
import java.util.List;
import java.util.Map;

/**
 * Reads each entry of a draft (rail, test input, part, op-amp section) into the stage model, noting
 * beside it what is not complete or not a value: a value that is not a number stands in as a plain
 * 1 k (or 1 nF, 0 V), an unwired lead as a net of its own ({@link DraftCheck#UNWIRED}), so that the
 * stage-wide rules can still be checked on the rest.
 */
final class DraftEntries {
  private DraftEntries() {}

  static Rail rail(DraftRail rail, int index, List<EditorProblem> problems) {
    String key = String.valueOf(index);
    String net = rail.net();
    String name = net.isEmpty() ? "rail " + (index + 1) : "rail " + net;
    if (net.isEmpty()) {
      problems.add(new EditorProblem(Place.RAIL, key, name + " needs its net's name, e.g. VCC"));
      net = DraftCheck.UNWIRED + "rail" + index;
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

  static TestInput input(DraftInput input, int index, List<EditorProblem> problems) {
    String key = String.valueOf(index);
    String net = input.net();
    String name = net.isEmpty() ? "input " + (index + 1) : "input " + net;
    if (net.isEmpty()) {
      problems.add(new EditorProblem(Place.INPUT, key, name + " needs the net it drives, e.g. IN"));
      net = DraftCheck.UNWIRED + "input" + index;
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
    return new TestInput(net, dc, ac, hz, input.measure());
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

  static Part part(DraftPart part, int index, List<EditorProblem> problems) {
    String ref = part.ref();
    String key = ref;
    if (ref.isEmpty()) {
      ref = DraftCheck.UNWIRED + "part" + index;
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
        net = DraftCheck.UNWIRED + ref + "." + leads.get(lead);
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

  static Amplifier section(DraftSection s, int index, List<EditorProblem> problems) {
    String ref = s.ref();
    if (ref.isEmpty()) {
      ref = DraftCheck.UNWIRED + "section" + index;
      problems.add(
          new EditorProblem(Place.SECTION, ref, "a section needs its designator, e.g. U1A"));
    }
    String pkg = s.packageRef();
    if (pkg.isEmpty()) {
      problems.add(
          new EditorProblem(
              Place.SECTION, ref, s.ref() + " needs its package's designator, e.g. U1"));
      pkg = DraftCheck.UNWIRED + "package" + index;
    }
    Map<Terminal, String> nets = new HashMap<>();
    List<String> unwired = new ArrayList<>();
    for (Terminal terminal : Terminal.values()) {
      String net = s.net(terminal);
      if (net.isEmpty()) {
        unwired.add(terminal.words() + " (pin " + s.pin(terminal) + ")");
        net = DraftCheck.UNWIRED + ref + "." + terminal.symbol();
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
}
