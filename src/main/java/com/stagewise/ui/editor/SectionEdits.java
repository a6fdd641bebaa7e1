package com.stagewise.ui.editor;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Terminal;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.ui.editor.DraftStage.DraftRail;
import com.stagewise.ui.editor.DraftStage.DraftSection;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.function.UnaryOperator;

/**
 * The edits of a draft's op-amp sections, as plain functions of the draft: add one on a package's
 * free letter (pins by the DESIGN.md pinouts, supply pins shared with the package's other
 * sections), delete, rename, wire a terminal, set the package's device class, move to another
 * letter.
 */
final class SectionEdits {
  private SectionEdits() {}

  /**
   * Adds section {@code letter} of package {@code packageRef}, designator package plus letter
   * ({@code U1A}). Its supply pins take the nets of the package's other sections (they are the same
   * pins), else the highest rail and the lowest rail (or ground); inputs and output are not wired.
   */
  static Edit add(
      DraftStage draft,
      PackageType type,
      String packageRef,
      String letter,
      DeviceClass deviceClass) {
    String pkg = packageRef == null ? "" : packageRef.strip();
    if (pkg.isEmpty()) {
      return Edit.refused("A section needs its package's designator, e.g. U1.");
    }
    if (!type.hasSection(letter)) {
      return Edit.refused(noSuchLetter(type, letter));
    }
    List<DraftSection> mates =
        draft.sections().stream().filter(s -> s.packageRef().equals(pkg)).toList();
    if (!mates.isEmpty() && mates.get(0).packageType() != type) {
      return Edit.refused(
          pkg + " is already a " + mates.get(0).packageType().word() + " package on this stage.");
    }
    String ref = pkg + letter;
    if (PartEdits.taken(draft, ref)) {
      return Edit.refused(ref + " is already on the stage.");
    }
    Map<Terminal, String> nets = new EnumMap<>(Terminal.class);
    DeviceClass cls = deviceClass;
    if (!mates.isEmpty()) {
      nets.put(Terminal.V_PLUS, mates.get(0).net(Terminal.V_PLUS));
      nets.put(Terminal.V_MINUS, mates.get(0).net(Terminal.V_MINUS));
      cls = mates.get(0).deviceClass();
    } else {
      nets.put(Terminal.V_PLUS, highestRail(draft));
      nets.put(Terminal.V_MINUS, lowestRailOrGround(draft));
    }
    List<DraftSection> sections = new ArrayList<>(draft.sections());
    sections.add(new DraftSection(ref, pkg, type, letter, cls, nets));
    return Edit.making(ref, "add " + ref, draft.withSections(sections));
  }

  private static String noSuchLetter(PackageType type, String letter) {
    return "A "
        + type.word()
        + " package has no section "
        + letter
        + " (it has "
        + String.join(", ", type.sections())
        + ").";
  }

  /** Returns the letters of a package still free (all of the type's when the package is new). */
  static List<String> free(DraftStage draft, PackageType type, String packageRef) {
    List<String> used =
        draft.sections().stream()
            .filter(s -> s.packageRef().equals(packageRef))
            .map(DraftSection::section)
            .toList();
    return type.sections().stream().filter(l -> !used.contains(l)).toList();
  }

  /** Returns the next package designator not used yet ({@code U1}, {@code U2}, …). */
  static String nextPackage(DraftStage draft) {
    int n = 1;
    while (draft.packages().contains("U" + n) || PartEdits.taken(draft, "U" + n)) {
      n++;
    }
    return "U" + n;
  }

  /** Deletes a section. */
  static Edit remove(DraftStage draft, String ref) {
    if (draft.section(ref) == null) {
      return Edit.refused("There is no section " + ref + ".");
    }
    return Edit.to(
        "delete " + ref,
        draft.withSections(draft.sections().stream().filter(s -> !s.ref().equals(ref)).toList()));
  }

  /** Gives a section another designator; refused if it is empty or taken. */
  static Edit rename(DraftStage draft, String ref, String newRef) {
    String name = newRef == null ? "" : newRef.strip();
    if (draft.section(ref) == null) {
      return Edit.refused("There is no section " + ref + ".");
    }
    if (name.equals(ref)) {
      return Edit.to("", draft);
    }
    if (name.isEmpty()) {
      return Edit.refused("A designator cannot be empty; " + ref + " keeps its name.");
    }
    if (PartEdits.taken(draft, name)) {
      return Edit.refused(name + " is already used on this stage; choose another designator.");
    }
    return change(
        draft, "rename " + ref + " to " + name, s -> s.ref().equals(ref) ? s.withRef(name) : s);
  }

  /**
   * Wires a section's terminal to a net. The supply pins are shared by every section of a package,
   * so a supply pin's net changes for all of them.
   */
  static Edit setNet(DraftStage draft, String ref, Terminal terminal, String net) {
    DraftSection section = draft.section(ref);
    if (section == null) {
      return Edit.refused("There is no section " + ref + ".");
    }
    String name = net == null ? "" : net.strip();
    String label =
        "wire "
            + section.packageRef()
            + "."
            + section.pin(terminal)
            + " ("
            + ref
            + " "
            + terminal.words()
            + ") to "
            + (name.isEmpty() ? "nothing" : name);
    return change(
        draft,
        label,
        s ->
            s.ref().equals(ref)
                    || (terminal.isSupply() && s.packageRef().equals(section.packageRef()))
                ? s.withNet(terminal, name)
                : s);
  }

  /** Sets the device class of a section's package (one package has one class). */
  static Edit setClass(DraftStage draft, String ref, DeviceClass deviceClass) {
    DraftSection section = draft.section(ref);
    if (section == null) {
      return Edit.refused("There is no section " + ref + ".");
    }
    return change(
        draft,
        "make " + section.packageRef() + " " + deviceClass.word(),
        s -> s.packageRef().equals(section.packageRef()) ? s.withClass(deviceClass) : s);
  }

  /**
   * Moves a section to another letter of its package (its pins change with it); refused if the
   * package type has no such letter. Two sections on one letter are flagged, not refused.
   */
  static Edit setLetter(DraftStage draft, String ref, String letter) {
    DraftSection section = draft.section(ref);
    if (section == null) {
      return Edit.refused("There is no section " + ref + ".");
    }
    if (!section.packageType().hasSection(letter)) {
      return Edit.refused(noSuchLetter(section.packageType(), letter));
    }
    return change(
        draft,
        "move " + ref + " to section " + letter,
        s -> s.ref().equals(ref) ? s.withSection(letter) : s);
  }

  private static Edit change(DraftStage draft, String label, UnaryOperator<DraftSection> change) {
    return Edit.to(label, draft.withSections(draft.sections().stream().map(change).toList()));
  }

  private static String highestRail(DraftStage draft) {
    DraftRail best = null;
    double bestVolts = 0;
    for (DraftRail rail : draft.rails()) {
      double volts = voltsOf(rail);
      if (volts > 0 && (best == null || volts > bestVolts)) {
        best = rail;
        bestVolts = volts;
      }
    }
    return best == null ? "" : best.net();
  }

  private static String lowestRailOrGround(DraftStage draft) {
    DraftRail best = null;
    double bestVolts = 0;
    for (DraftRail rail : draft.rails()) {
      double volts = voltsOf(rail);
      if (volts < 0 && (best == null || volts < bestVolts)) {
        best = rail;
        bestVolts = volts;
      }
    }
    return best == null ? draft.ground() : best.net();
  }

  private static double voltsOf(DraftRail rail) {
    return rail.volts().problem(SiValue::parse) == null ? rail.volts().value(SiValue::parse) : 0;
  }
}
