package com.stagewise.circuit;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Checks a stage for mistakes that a well-formed sheet can still hold: duplicate designators, two
 * sections on the same pins, sections of one package on different supplies, a net that only one
 * part end touches (usually a misspelt name), an unconnected ground, and nets with no DC path.
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
    checkDrivenNets(stage, problems);
    checkDesignators(stage, problems);
    checkSections(stage, problems);
    checkNetUse(stage, problems);
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
    Map<String, Integer> uses = new HashMap<>();
    for (Part part : stage.parts()) {
      for (String net : new java.util.HashSet<>(part.nets())) {
        uses.merge(net, 1, Integer::sum);
      }
    }
    for (Amplifier amp : stage.amplifiers()) {
      for (Terminal terminal : Terminal.values()) {
        uses.merge(amp.net(terminal), 1, Integer::sum);
      }
    }
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
}
