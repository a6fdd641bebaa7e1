package com.stagewise.circuit.template;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.StageRules;
import com.stagewise.circuit.TestInput;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Edits that fit a template's stage to a real board: its own designators, net names, title and
 * board model.
 */
public final class StageEdits {
  private StageEdits() {}

  /**
   * Returns a copy with designators renamed, {@code old -> new}.
   *
   * <p>A key may name a part ({@code R1}), a section ({@code U1A}) or a package ({@code U1}).
   * Renaming a package also renames the sections whose designator is the package's plus their
   * section letter ({@code U1 -> U7} makes {@code U1A} into {@code U7A}), unless they are renamed
   * themselves. Pins and section letters do not change.
   *
   * @throws InvalidInputException naming the designator, if it is not on the stage, the new name is
   *     blank, or two designators would be the same
   */
  public static Stage rename(Stage stage, Map<String, String> renames) {
    for (Map.Entry<String, String> rename : renames.entrySet()) {
      String old = rename.getKey();
      if (stage.part(old).isEmpty()
          && stage.amplifier(old).isEmpty()
          && !stage.packages().contains(old)) {
        throw new InvalidInputException(
            "",
            old,
            "no part, section or package "
                + old
                + " on the stage (expected one of "
                + designators(stage)
                + ")");
      }
      if (rename.getValue() == null || rename.getValue().isBlank()) {
        throw new InvalidInputException("", old, "the new designator for " + old + " is empty");
      }
    }
    List<Part> parts = new ArrayList<>();
    for (Part part : stage.parts()) {
      String ref = renames.getOrDefault(part.ref(), part.ref()).strip();
      parts.add(part.withRef(ref));
    }
    List<Amplifier> amplifiers = new ArrayList<>();
    for (Amplifier amp : stage.amplifiers()) {
      String pkg = renames.getOrDefault(amp.packageRef(), amp.packageRef()).strip();
      String ref = amp.ref();
      if (renames.containsKey(ref)) {
        ref = renames.get(ref).strip();
      } else if (ref.equals(amp.packageRef() + amp.section())) {
        ref = pkg + amp.section();
      }
      amplifiers.add(
          new Amplifier(
              ref,
              pkg,
              amp.packageType(),
              amp.section(),
              amp.deviceClass(),
              amp.inPlus(),
              amp.inMinus(),
              amp.out(),
              amp.vPlus(),
              amp.vMinus()));
    }
    Stage renamed =
        new Stage(
            stage.title(),
            stage.board(),
            stage.ground(),
            stage.rails(),
            stage.inputs(),
            parts,
            amplifiers);
    for (StageRules.Problem problem : StageRules.problems(renamed)) {
      if (problem.message().contains("used twice")
          || problem.message().contains("claims section")) {
        throw new InvalidInputException(
            "", problem.field(), "after renaming: " + problem.message());
      }
    }
    return renamed;
  }

  /**
   * Returns a copy with nets renamed, {@code old -> new}, everywhere: ground, rails, inputs, part
   * ends and section terminals.
   *
   * @throws InvalidInputException naming the net, if it is not on the stage or the new name is
   *     blank or already a net of the stage
   */
  public static Stage renameNets(Stage stage, Map<String, String> renames) {
    for (Map.Entry<String, String> rename : renames.entrySet()) {
      if (!stage.nets().contains(rename.getKey())) {
        throw new InvalidInputException(
            "",
            rename.getKey(),
            "no net "
                + rename.getKey()
                + " on the stage (expected one of "
                + String.join(", ", stage.nets())
                + ")");
      }
      String target = rename.getValue() == null ? "" : rename.getValue().strip();
      if (target.isEmpty()) {
        throw new InvalidInputException(
            "", rename.getKey(), "the new name for net " + rename.getKey() + " is empty");
      }
      if (stage.nets().contains(target) && !renames.containsKey(target)) {
        throw new InvalidInputException(
            "",
            rename.getKey(),
            "net "
                + target
                + " is already on the stage (expected a new name for "
                + rename.getKey()
                + ")");
      }
    }
    java.util.function.UnaryOperator<String> net = n -> renames.getOrDefault(n, n).strip();
    List<Rail> rails =
        stage.rails().stream()
            .map(r -> new Rail(net.apply(r.net()), r.volts(), r.tolerance()))
            .toList();
    List<TestInput> inputs =
        stage.inputs().stream()
            .map(i -> new TestInput(net.apply(i.net()), i.dc(), i.ac(), i.hz(), i.measure()))
            .toList();
    List<Part> parts =
        stage.parts().stream()
            .map(
                p ->
                    new Part(
                        p.ref(),
                        p.kind(),
                        p.value(),
                        p.tolerance(),
                        net.apply(p.netA()),
                        net.apply(p.netB()),
                        p.wiper() == null ? null : net.apply(p.wiper()),
                        p.position(),
                        p.sealed(),
                        p.diodeClass(),
                        p.colour()))
            .toList();
    List<Amplifier> amplifiers =
        stage.amplifiers().stream()
            .map(
                a ->
                    new Amplifier(
                        a.ref(),
                        a.packageRef(),
                        a.packageType(),
                        a.section(),
                        a.deviceClass(),
                        net.apply(a.inPlus()),
                        net.apply(a.inMinus()),
                        net.apply(a.out()),
                        net.apply(a.vPlus()),
                        net.apply(a.vMinus())))
            .toList();
    return new Stage(
        stage.title(), stage.board(), net.apply(stage.ground()), rails, inputs, parts, amplifiers);
  }

  /** Returns a copy with another title and board model. */
  public static Stage titled(Stage stage, String title, String board) {
    return new Stage(
        title,
        board,
        stage.ground(),
        stage.rails(),
        stage.inputs(),
        stage.parts(),
        stage.amplifiers());
  }

  private static String designators(Stage stage) {
    List<String> refs = new ArrayList<>();
    stage.parts().forEach(p -> refs.add(p.ref()));
    stage.amplifiers().forEach(a -> refs.add(a.ref()));
    refs.addAll(stage.packages());
    return String.join(", ", refs);
  }
}
