package com.stagewise.ui.editor;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Connectivity;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.StageRules;
import com.stagewise.circuit.Terminal;
import com.stagewise.circuit.TestInput;
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
      rails.add(DraftEntries.rail(draft.rails().get(i), i, problems));
    }
    List<TestInput> inputs = new ArrayList<>();
    for (int i = 0; i < draft.inputs().size(); i++) {
      inputs.add(DraftEntries.input(draft.inputs().get(i), i, problems));
    }
    List<Part> parts = new ArrayList<>();
    for (int i = 0; i < draft.parts().size(); i++) {
      parts.add(DraftEntries.part(draft.parts().get(i), i, problems));
    }
    List<Amplifier> amps = new ArrayList<>();
    for (int i = 0; i < draft.sections().size(); i++) {
      amps.add(DraftEntries.section(draft.sections().get(i), i, problems));
    }
    boolean complete = problems.isEmpty();
    Stage stage = new Stage(draft.title(), draft.board(), ground, rails, inputs, parts, amps);
    if (amps.isEmpty()) {
      problems.add(
          new EditorProblem(
              Place.STAGE,
              "",
              "the stage has no op-amp section yet: add one (package, designator, section"
                  + " letter)"));
    }
    rules(draft, stage, problems);
    floating(draft, stage, problems);
    supplies(draft, stage, problems);
    loneTerminals(draft, stage, problems);
    return new Checked(stage, List.copyOf(problems), complete);
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
      // Every lead, a trimmer's wiper too (a section input on a wiper is wired), each net once per
      // part as StageRules counts it.
      for (String net : new HashSet<>(part.nets())) {
        uses.merge(net, 1, Integer::sum);
      }
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
