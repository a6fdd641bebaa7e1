package com.stagewise.ui.editor;

import com.stagewise.circuit.Terminal;
import com.stagewise.ui.editor.DraftStage.DraftInput;
import com.stagewise.ui.editor.DraftStage.DraftRail;
import com.stagewise.ui.editor.DraftStage.DraftSection;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.function.UnaryOperator;

/**
 * The edits of what drives a draft, as plain functions of the draft: rails and test inputs (add,
 * remove, net, volts, tolerance, DC, AC), and renaming a net everywhere it appears.
 */
final class SupplyEdits {
  /** Rail tolerance offered for a new rail: 5 %, a regulated supply (common practice). */
  static final String NEW_RAIL_TOLERANCE = "5%";

  private SupplyEdits() {}

  /**
   * Renames a net everywhere it appears (ground, rails, inputs, part ends, section pins); refused
   * if the old net is not on the stage or the new name is empty or already a net.
   */
  static Edit renameNet(DraftStage draft, String old, String now) {
    String name = now == null ? "" : now.strip();
    if (!draft.nets().contains(old)) {
      return Edit.refused("There is no net " + old + " on the stage.");
    }
    if (name.isEmpty()) {
      return Edit.refused("The new name for net " + old + " is empty.");
    }
    if (draft.nets().contains(name)) {
      return Edit.refused(
          "Net "
              + name
              + " is already on the stage; to join the two, choose "
              + name
              + " for each lead instead.");
    }
    UnaryOperator<String> rename = n -> n.equals(old) ? name : n;
    DraftStage renamed =
        new DraftStage(
            draft.title(),
            draft.board(),
            rename.apply(draft.ground()),
            draft.rails().stream()
                .map(r -> new DraftRail(rename.apply(r.net()), r.volts(), r.tolerance()))
                .toList(),
            draft.inputs().stream()
                .map(
                    i -> new DraftInput(rename.apply(i.net()), i.dc(), i.ac(), i.hz(), i.measure()))
                .toList(),
            draft.parts().stream()
                .map(p -> p.withNets(p.nets().stream().map(rename).toList()))
                .toList(),
            draft.sections().stream().map(s -> renamed(s, rename)).toList());
    return Edit.to("rename net " + old + " to " + name, renamed);
  }

  private static DraftSection renamed(DraftSection s, UnaryOperator<String> rename) {
    Map<Terminal, String> nets = new EnumMap<>(Terminal.class);
    s.nets().forEach((t, n) -> nets.put(t, rename.apply(n)));
    return new DraftSection(
        s.ref(), s.packageRef(), s.packageType(), s.section(), s.deviceClass(), nets);
  }

  /** Adds a rail on a net with its volts ({@code 15}, {@code -15}) and the usual tolerance. */
  static Edit addRail(DraftStage draft, String net, String volts) {
    List<DraftRail> rails = new ArrayList<>(draft.rails());
    rails.add(new DraftRail(net, Entry.typed(volts), Entry.typed(NEW_RAIL_TOLERANCE)));
    return Edit.to("add rail " + net, draft.withRails(rails));
  }

  /** Removes the rail at a position (0 first). */
  static Edit removeRail(DraftStage draft, int index) {
    if (index < 0 || index >= draft.rails().size()) {
      return Edit.refused("There is no rail " + (index + 1) + ".");
    }
    List<DraftRail> rails = new ArrayList<>(draft.rails());
    DraftRail gone = rails.remove(index);
    return Edit.to("remove rail " + gone.net(), draft.withRails(rails));
  }

  private static Edit changeRail(
      DraftStage draft, int index, String label, UnaryOperator<DraftRail> change) {
    if (index < 0 || index >= draft.rails().size()) {
      return Edit.refused("There is no rail " + (index + 1) + ".");
    }
    List<DraftRail> rails = new ArrayList<>(draft.rails());
    rails.set(index, change.apply(rails.get(index)));
    return Edit.to(label, draft.withRails(rails));
  }

  /** Adds a test input on a net at a DC level, with no AC. */
  static Edit addInput(DraftStage draft, String net, String dc) {
    List<DraftInput> inputs = new ArrayList<>(draft.inputs());
    inputs.add(new DraftInput(net, Entry.typed(dc), Entry.typed(""), Entry.typed("")));
    return Edit.to("add input " + net, draft.withInputs(inputs));
  }

  /** Removes the input at a position (0 first). */
  static Edit removeInput(DraftStage draft, int index) {
    if (index < 0 || index >= draft.inputs().size()) {
      return Edit.refused("There is no input " + (index + 1) + ".");
    }
    List<DraftInput> inputs = new ArrayList<>(draft.inputs());
    DraftInput gone = inputs.remove(index);
    return Edit.to("remove input " + gone.net(), draft.withInputs(inputs));
  }

  private static Edit changeInput(
      DraftStage draft, int index, String label, UnaryOperator<DraftInput> change) {
    if (index < 0 || index >= draft.inputs().size()) {
      return Edit.refused("There is no input " + (index + 1) + ".");
    }
    List<DraftInput> inputs = new ArrayList<>(draft.inputs());
    inputs.set(index, change.apply(inputs.get(index)));
    return Edit.to(label, draft.withInputs(inputs));
  }

  /** Sets a rail's net. */
  static Edit railNet(DraftStage draft, int index, String net) {
    return changeRail(
        draft, index, "set rail net to " + net, r -> new DraftRail(net, r.volts(), r.tolerance()));
  }

  /** Sets a rail's volts as typed. */
  static Edit railVolts(DraftStage draft, int index, String volts) {
    return changeRail(
        draft,
        index,
        "set rail volts to " + volts,
        r -> new DraftRail(r.net(), Entry.typed(volts), r.tolerance()));
  }

  /** Sets a rail's tolerance as typed. */
  static Edit railTolerance(DraftStage draft, int index, String tolerance) {
    return changeRail(
        draft,
        index,
        "set rail tolerance to " + tolerance,
        r -> new DraftRail(r.net(), r.volts(), Entry.typed(tolerance)));
  }

  /** Sets an input's net. */
  static Edit inputNet(DraftStage draft, int index, String net) {
    return changeInput(
        draft,
        index,
        "set input net to " + net,
        i -> new DraftInput(net, i.dc(), i.ac(), i.hz(), i.measure()));
  }

  /** Sets an input's DC level as typed. */
  static Edit inputDc(DraftStage draft, int index, String dc) {
    return changeInput(
        draft,
        index,
        "set input DC to " + dc,
        i -> new DraftInput(i.net(), Entry.typed(dc), i.ac(), i.hz(), i.measure()));
  }

  /** Sets an input's AC amplitude and frequency as typed (empty or 0 amplitude: no AC). */
  static Edit inputAc(DraftStage draft, int index, String ac, String hz) {
    return changeInput(
        draft,
        index,
        "set input AC to " + ac + " at " + hz + " Hz",
        i -> new DraftInput(i.net(), i.dc(), Entry.typed(ac), Entry.typed(hz), i.measure()));
  }
}
