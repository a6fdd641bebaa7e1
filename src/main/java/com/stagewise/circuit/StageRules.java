package com.stagewise.circuit;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Checks a stage for mistakes that a well-formed sheet can still hold: sizes and values outside
 * {@link Limits}, duplicate designators, two sections on the same pins, sections of one package on
 * different supplies, a net that only one part end or section pin touches (usually a misspelt
 * name), an unconnected ground, and nets with no DC path.
 *
 * <p>These are the rules of every stage, wherever it comes from (a sheet, a template, the app): one
 * place, one message each.
 */
public final class StageRules {
  private StageRules() {}

  /**
   * One problem found in a stage.
   *
   * @param field the JSON path of the field to fix, e.g. {@code amplifiers[1].section}
   * @param message what is wrong and what was expected
   */
  public record Problem(String field, String message) {}

  /** Returns every problem found, in sheet order; an empty list when the stage is sound. */
  public static List<Problem> problems(Stage stage) {
    List<Problem> problems = new ArrayList<>();
    if (!checkSizes(stage, problems)) {
      // Too large to check further within bounded time: say what was too large and stop.
      return problems;
    }
    checkNames(stage, problems);
    checkValues(stage, problems);
    checkDrivenNets(stage, problems);
    checkDesignators(stage, problems);
    checkSections(stage, problems);
    checkNetUse(stage, problems);
    checkTerminalNets(stage, problems);
    for (String net : Connectivity.floatingNets(stage)) {
      problems.add(
          new Problem(
              "nets",
              "net "
                  + net
                  + " has no DC path to ground, a rail or an input"
                  + " (only capacitors or op-amp inputs touch it): add the missing resistor or fix the net name"));
    }
    return problems;
  }

  /**
   * Checks the stage and throws on the first problem.
   *
   * @param source the file or screen the stage came from, named in the message
   * @throws InvalidInputException naming the source, the field and the problem
   */
  public static void requireSound(Stage stage, String source) {
    List<Problem> problems = problems(stage);
    if (!problems.isEmpty()) {
      Problem first = problems.get(0);
      String more =
          problems.size() > 1 ? " (and " + (problems.size() - 1) + " more problem(s))" : "";
      throw new InvalidInputException(source, first.field(), first.message() + more);
    }
  }

  private static void checkDrivenNets(Stage stage, List<Problem> problems) {
    Set<String> seen = new HashSet<>();
    seen.add(stage.ground());
    for (int i = 0; i < stage.rails().size(); i++) {
      String net = stage.rails().get(i).net();
      if (!seen.add(net)) {
        problems.add(
            new Problem(
                "rails[" + i + "].net", "net " + net + " is already ground or another rail"));
      }
    }
    for (int i = 0; i < stage.inputs().size(); i++) {
      String net = stage.inputs().get(i).net();
      if (!seen.add(net)) {
        problems.add(
            new Problem(
                "inputs[" + i + "].net",
                "net " + net + " is already ground, a rail or another input"));
      }
    }
  }

  private static void checkDesignators(Stage stage, List<Problem> problems) {
    Set<String> refs = new HashSet<>();
    for (int i = 0; i < stage.parts().size(); i++) {
      Part part = stage.parts().get(i);
      if (!refs.add(part.ref())) {
        problems.add(
            new Problem("parts[" + i + "].ref", "designator " + part.ref() + " is used twice"));
      }
      if (part.kind().isTrimmer()
          && part.netA().equals(part.wiper())
          && part.netB().equals(part.wiper())) {
        problems.add(
            new Problem(
                "parts[" + i + "].nets",
                part.ref()
                    + " has all three leads on net "
                    + part.netA()
                    + " (expected [end, wiper, end] on at least two nets)"));
      } else if (part.netA().equals(part.netB()) && !part.kind().isTrimmer()) {
        problems.add(
            new Problem(
                "parts[" + i + "].nets",
                part.ref()
                    + " has both ends on net "
                    + part.netA()
                    + " (expected two different nets)"));
      }
    }
    for (int i = 0; i < stage.amplifiers().size(); i++) {
      Amplifier amp = stage.amplifiers().get(i);
      if (!refs.add(amp.ref())) {
        problems.add(
            new Problem("amplifiers[" + i + "].ref", "designator " + amp.ref() + " is used twice"));
      }
    }
  }

  private static void checkSections(Stage stage, List<Problem> problems) {
    Map<String, Amplifier> firstOfPackage = new HashMap<>();
    Set<String> claimed = new HashSet<>();
    for (int i = 0; i < stage.amplifiers().size(); i++) {
      Amplifier amp = stage.amplifiers().get(i);
      String at = "amplifiers[" + i + "]";
      if (!claimed.add(amp.packageRef() + "/" + amp.section())) {
        problems.add(
            new Problem(
                at + ".section",
                amp.ref()
                    + " claims section "
                    + amp.section()
                    + " of "
                    + amp.packageRef()
                    + ", whose pins another section already uses"));
      }
      Amplifier first = firstOfPackage.putIfAbsent(amp.packageRef(), amp);
      if (first == null) {
        continue;
      }
      if (first.packageType() != amp.packageType()) {
        problems.add(
            new Problem(
                at + ".packageType",
                amp.ref()
                    + " says "
                    + amp.packageRef()
                    + " is "
                    + amp.packageType().word()
                    + " but "
                    + first.ref()
                    + " says "
                    + first.packageType().word()));
      } else if (!first.vPlus().equals(amp.vPlus()) || !first.vMinus().equals(amp.vMinus())) {
        problems.add(
            new Problem(
                at + ".vPlus",
                amp.ref()
                    + " and "
                    + first.ref()
                    + " share the supply pins of "
                    + amp.packageRef()
                    + ", so their vPlus and vMinus nets must be the same"));
      }
      if (first.deviceClass() != amp.deviceClass() && first.packageType() == amp.packageType()) {
        problems.add(
            new Problem(
                at + ".class",
                amp.ref()
                    + " and "
                    + first.ref()
                    + " sit in one package, so their class must be the same"));
      }
    }
  }

  private static void checkNetUse(Stage stage, List<Problem> problems) {
    Map<String, Integer> uses = uses(stage);
    if (!uses.containsKey(stage.ground())) {
      problems.add(
          new Problem(
              "ground",
              "ground net "
                  + stage.ground()
                  + " touches no part or pin (expected the stage's reference net)"));
    }
    for (int i = 0; i < stage.parts().size(); i++) {
      Part part = stage.parts().get(i);
      for (String net : part.nets()) {
        if (!stage.isDriven(net) && uses.getOrDefault(net, 0) == 1) {
          problems.add(
              new Problem(
                  "parts[" + i + "].nets",
                  "net "
                      + net
                      + " of "
                      + part.ref()
                      + " touches nothing else (a misspelt net name, or a part end left open?)"));
        }
      }
    }
  }

  /** Adds a problem for every list beyond its limit; returns whether all sizes are within them. */
  private static boolean checkSizes(Stage stage, List<Problem> problems) {
    int before = problems.size();
    tooMany(problems, "rails", stage.rails().size(), Limits.MAX_RAILS, "rails");
    tooMany(problems, "inputs", stage.inputs().size(), Limits.MAX_INPUTS, "test inputs");
    tooMany(problems, "parts", stage.parts().size(), Limits.MAX_PARTS, "parts");
    tooMany(
        problems, "amplifiers", stage.amplifiers().size(), Limits.MAX_SECTIONS, "op-amp sections");
    if (problems.size() == before) {
      tooMany(problems, "nets", stage.nets().size(), Limits.MAX_NETS, "nets");
    }
    return problems.size() == before;
  }

  private static void tooMany(
      List<Problem> problems, String field, int found, int max, String things) {
    if (found > max) {
      problems.add(new Problem(field, Limits.tooMany(found, max, things)));
    }
  }

  private static void checkNames(Stage stage, List<Problem> problems) {
    text(problems, "title", stage.title(), "the title", Limits.MAX_TEXT_LENGTH);
    text(problems, "board", stage.board(), "the board", Limits.MAX_TEXT_LENGTH);
    name(problems, "ground", stage.ground(), "the ground net's name");
    for (int i = 0; i < stage.rails().size(); i++) {
      name(problems, "rails[" + i + "].net", stage.rails().get(i).net(), "a net name");
    }
    for (int i = 0; i < stage.inputs().size(); i++) {
      name(problems, "inputs[" + i + "].net", stage.inputs().get(i).net(), "a net name");
    }
    for (int i = 0; i < stage.parts().size(); i++) {
      Part part = stage.parts().get(i);
      String at = "parts[" + i + "]";
      name(problems, at + ".ref", part.ref(), "a designator");
      name(problems, at + ".nets[0]", part.netA(), "a net name");
      name(problems, at + ".nets[1]", part.netB(), "a net name");
    }
    for (int i = 0; i < stage.amplifiers().size(); i++) {
      Amplifier amp = stage.amplifiers().get(i);
      String at = "amplifiers[" + i + "]";
      name(problems, at + ".ref", amp.ref(), "a designator");
      name(problems, at + ".package", amp.packageRef(), "a package designator");
      for (Terminal terminal : Terminal.values()) {
        name(problems, at + "." + terminal.key(), amp.net(terminal), "a net name");
      }
    }
  }

  private static void name(List<Problem> problems, String field, String name, String role) {
    if (name.length() > Limits.MAX_NAME_LENGTH) {
      problems.add(new Problem(field, Limits.tooLong(role, name.length(), Limits.MAX_NAME_LENGTH)));
    } else if (Limits.hasControlCharacter(name)) {
      problems.add(
          new Problem(
              field, role + " holds a control character (expected letters, digits and signs)"));
    }
  }

  private static void text(
      List<Problem> problems, String field, String text, String role, int max) {
    if (text.length() > max) {
      problems.add(new Problem(field, Limits.tooLong(role, text.length(), max)));
    }
  }

  private static void checkValues(Stage stage, List<Problem> problems) {
    for (int i = 0; i < stage.rails().size(); i++) {
      Rail rail = stage.rails().get(i);
      String at = "rails[" + i + "]";
      span(problems, at + ".volts", Limits.RAIL_VOLTS, "rail " + rail.net(), rail.volts());
      span(
          problems,
          at + ".tolerance",
          Limits.TOLERANCE,
          "rail " + rail.net() + "'s tolerance",
          rail.tolerance());
    }
    for (int i = 0; i < stage.inputs().size(); i++) {
      TestInput input = stage.inputs().get(i);
      String at = "inputs[" + i + "]";
      span(problems, at + ".dc", Limits.INPUT_DC_VOLTS, "input " + input.net(), input.dc());
      span(problems, at + ".ac", Limits.INPUT_AC_VOLTS, "input " + input.net(), input.ac());
      if (input.hasAc() || input.hz() > 0) {
        span(problems, at + ".hz", Limits.FREQUENCY_HZ, "input " + input.net(), input.hz());
      }
    }
    for (int i = 0; i < stage.parts().size(); i++) {
      Part part = stage.parts().get(i);
      String at = "parts[" + i + "]";
      boolean link = part.kind() == PartKind.RESISTOR && part.value() == 0;
      Optional<Limits.Span> range = Limits.of(part.kind());
      if (!link && range.isPresent()) {
        span(problems, at + ".value", range.get(), part.ref(), part.value());
      }
      span(
          problems,
          at + ".tolerance",
          Limits.TOLERANCE,
          part.ref() + "'s tolerance",
          part.tolerance());
    }
  }

  private static void span(
      List<Problem> problems, String field, Limits.Span span, String subject, double value) {
    if (!span.contains(value)) {
      problems.add(new Problem(field, span.problem(subject, value)));
    }
  }

  /**
   * Adds a problem for a section's input or supply pin on a net that nothing else touches: a
   * misspelt net name leaves the pin on a net of its own.
   */
  private static void checkTerminalNets(Stage stage, List<Problem> problems) {
    Map<String, Integer> uses = uses(stage);
    for (int i = 0; i < stage.amplifiers().size(); i++) {
      Amplifier amp = stage.amplifiers().get(i);
      for (Terminal terminal :
          List.of(Terminal.IN_PLUS, Terminal.IN_MINUS, Terminal.V_PLUS, Terminal.V_MINUS)) {
        String net = amp.net(terminal);
        if (!stage.isDriven(net) && uses.getOrDefault(net, 0) == 1) {
          problems.add(
              new Problem(
                  "amplifiers[" + i + "]." + terminal.key(),
                  amp.ref()
                      + " "
                      + terminal.words()
                      + " is on net "
                      + net
                      + ", which no part, other pin, rail or input touches"
                      + " (expected the name of a net of the stage; misspelt?)"));
        }
      }
    }
  }

  private static Map<String, Integer> uses(Stage stage) {
    Map<String, Integer> uses = new HashMap<>();
    for (Part part : stage.parts()) {
      // A trimmer touches its end and wiper nets once each, even when two share a net.
      for (String net : new HashSet<>(part.nets())) {
        uses.put(net, uses.getOrDefault(net, 0) + 1);
      }
    }
    for (Amplifier amp : stage.amplifiers()) {
      for (Terminal terminal : Terminal.values()) {
        uses.put(amp.net(terminal), uses.getOrDefault(amp.net(terminal), 0) + 1);
      }
    }
    return uses;
  }
}
