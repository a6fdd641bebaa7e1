package com.stagewise.ui.editor;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.value.BandedValue;
import com.stagewise.circuit.value.ColourCode;
import com.stagewise.circuit.value.SmdCode;
import com.stagewise.circuit.value.Tolerance;
import com.stagewise.ui.editor.DraftStage.DraftPart;
import java.util.ArrayList;
import java.util.List;
import java.util.function.UnaryOperator;

/**
 * The edits of a draft's parts, as plain functions of the draft: add one of any kind with a usual
 * value, delete, rename, wire a lead, set value, tolerance, class or colour, wiper; a resistor's
 * value from colour bands or an SMD code. A value is kept as typed even when it is not a value yet
 * (the check flags it); only an edit that cannot be represented is refused.
 */
final class PartEdits {
  /** Resistor tolerance offered for a new resistor: 1 % metal film (common practice). */
  static final String NEW_RESISTOR_TOLERANCE = "1%";

  /** Capacitor tolerance offered for a new capacitor: 10 % (common practice). */
  static final String NEW_CAPACITOR_TOLERANCE = "10%";

  /** A new zener's tolerance: 5 % (the usual grade of small zeners; common practice). */
  static final String NEW_ZENER_TOLERANCE = "5%";

  /** A new trimmer's track tolerance: 20 % (usual for cermet trimmers; common practice). */
  static final String NEW_TRIMMER_TOLERANCE = "20%";

  private PartEdits() {}

  /**
   * Adds a part of a kind with the next free designator ({@code R3}, {@code C2}, {@code D1}, {@code
   * ZD1}, {@code RV1}), a usual value and tolerance, and its leads not wired yet.
   */
  static Edit add(DraftStage draft, PartKind kind) {
    String ref = nextFree(draft, prefix(kind));
    DraftPart part =
        switch (kind) {
          case RESISTOR -> twoLeads(ref, kind, "10k", NEW_RESISTOR_TOLERANCE);
          case CAPACITOR -> twoLeads(ref, kind, "100n", NEW_CAPACITOR_TOLERANCE);
          case DIODE -> junction(ref, kind, "silicon");
          case LED -> junction(ref, kind, "red");
          case ZENER -> twoLeads(ref, kind, "5V1", NEW_ZENER_TOLERANCE);
          case TRIMMER, POTENTIOMETER ->
              new DraftPart(
                  ref,
                  kind,
                  Entry.typed("10k"),
                  Entry.typed(NEW_TRIMMER_TOLERANCE),
                  List.of("", "", ""),
                  "",
                  Entry.typed("0.5"),
                  false);
        };
    List<DraftPart> parts = new ArrayList<>(draft.parts());
    parts.add(part);
    return Edit.making(ref, "add " + ref, draft.withParts(parts));
  }

  private static DraftPart twoLeads(String ref, PartKind kind, String value, String tolerance) {
    return new DraftPart(ref, kind, Entry.typed(value), Entry.typed(tolerance), List.of("", ""));
  }

  private static DraftPart junction(String ref, PartKind kind, String choice) {
    return new DraftPart(
        ref,
        kind,
        Entry.typed(""),
        Entry.typed(""),
        List.of("", ""),
        choice,
        Entry.typed(""),
        false);
  }

  /** Deletes a part. */
  static Edit remove(DraftStage draft, String ref) {
    if (draft.part(ref) == null) {
      return Edit.refused("There is no part " + ref + ".");
    }
    return Edit.to(
        "delete " + ref,
        draft.withParts(draft.parts().stream().filter(p -> !p.ref().equals(ref)).toList()));
  }

  /** Gives a part another designator; refused if it is empty or taken. */
  static Edit rename(DraftStage draft, String ref, String newRef) {
    String name = newRef == null ? "" : newRef.strip();
    if (draft.part(ref) == null) {
      return Edit.refused("There is no part " + ref + ".");
    }
    if (name.equals(ref)) {
      return Edit.to("", draft);
    }
    if (name.isEmpty()) {
      return Edit.refused("A designator cannot be empty; " + ref + " keeps its name.");
    }
    if (taken(draft, name)) {
      return Edit.refused(name + " is already used on this stage; choose another designator.");
    }
    return change(draft, ref, "rename " + ref + " to " + name, p -> p.withRef(name));
  }

  /** Connects one lead (0 for the first) to a net, or unwires it with an empty name. */
  static Edit setNet(DraftStage draft, String ref, int lead, String net) {
    DraftPart part = draft.part(ref);
    if (part == null) {
      return Edit.refused("There is no part " + ref + ".");
    }
    if (lead < 0 || lead >= part.nets().size()) {
      return Edit.refused(ref + " has no lead " + (lead + 1) + ".");
    }
    String name = net == null ? "" : net.strip();
    return change(
        draft,
        ref,
        "connect "
            + ref
            + " "
            + DraftEntries.leadName(part, lead)
            + " to "
            + (name.isEmpty() ? "nothing" : name),
        p -> p.withNet(lead, name));
  }

  /**
   * Chooses a diode's class ({@code silicon}, {@code schottky}) or an LED's colour ({@code red},
   * {@code green} …); kept as chosen even if not a word the kind takes (then flagged).
   */
  static Edit setChoice(DraftStage draft, String ref, String word) {
    DraftPart part = draft.part(ref);
    if (part == null) {
      return Edit.refused("There is no part " + ref + ".");
    }
    if (part.kind() != PartKind.DIODE && part.kind() != PartKind.LED) {
      return Edit.refused(
          "A class or colour is chosen for a diode or LED; "
              + ref
              + " is a "
              + part.kind().word()
              + ".");
    }
    String what = part.kind() == PartKind.LED ? " colour to " : " class to ";
    return change(draft, ref, "set " + ref + what + word, p -> p.withChoice(word));
  }

  /**
   * Sets a trimmer's wiper position as typed (0 to 1, the share of the track from end 1) and
   * whether it is sealed; kept as typed even if not valid (then flagged).
   */
  static Edit setPosition(DraftStage draft, String ref, String text, boolean sealed) {
    DraftPart part = draft.part(ref);
    if (part == null) {
      return Edit.refused("There is no part " + ref + ".");
    }
    if (!part.kind().isTrimmer()) {
      return Edit.refused("A wiper position is set on a trimmer; " + ref + " has no wiper.");
    }
    return change(
        draft,
        ref,
        "set " + ref + " wiper to " + text + (sealed ? " (sealed)" : ""),
        p -> p.withPosition(Entry.typed(text), sealed));
  }

  /** Sets a part's value as typed ({@code 4k7}, {@code 100n}, {@code 5V1}). */
  static Edit setValue(DraftStage draft, String ref, String text) {
    return change(draft, ref, "set " + ref + " to " + text, p -> p.withValue(Entry.typed(text)));
  }

  /** Sets a part's tolerance as typed ({@code 1%}, {@code 0.01}). */
  static Edit setTolerance(DraftStage draft, String ref, String text) {
    return change(
        draft,
        ref,
        "set " + ref + " tolerance to " + text,
        p -> p.withTolerance(Entry.typed(text)));
  }

  /**
   * Sets a resistor's value (and tolerance band, if read) from its colour bands, read from the end
   * away from the tolerance band (IEC 60062).
   */
  static Edit fromBands(DraftStage draft, String ref, List<String> bands) {
    DraftPart part = draft.part(ref);
    if (part == null || part.kind() != PartKind.RESISTOR) {
      return Edit.refused("Colour bands give a resistor's value; " + ref + " is not a resistor.");
    }
    BandedValue value;
    try {
      value = ColourCode.decode(bands);
    } catch (InvalidInputException e) {
      return Edit.refused("Not a colour code: " + e.getMessage());
    }
    return change(
        draft,
        ref,
        "set " + ref + " from its colour bands",
        p ->
            p.withValue(
                    Entry.of(value.ohms(), DraftStage.valueText(PartKind.RESISTOR, value.ohms())))
                .withTolerance(Entry.of(value.tolerance(), Tolerance.format(value.tolerance()))));
  }

  /** Sets a resistor's value from its SMD marking (3-digit, 4-digit or EIA-96 code). */
  static Edit fromSmd(DraftStage draft, String ref, String code) {
    DraftPart part = draft.part(ref);
    if (part == null || part.kind() != PartKind.RESISTOR) {
      return Edit.refused("An SMD code gives a resistor's value; " + ref + " is not a resistor.");
    }
    double ohms;
    try {
      ohms = SmdCode.decode(code);
    } catch (InvalidInputException e) {
      return Edit.refused("Not an SMD code: " + e.getMessage());
    }
    return change(
        draft,
        ref,
        "set " + ref + " from SMD code " + code,
        p -> p.withValue(Entry.of(ohms, DraftStage.valueText(PartKind.RESISTOR, ohms))));
  }

  private static Edit change(
      DraftStage draft, String ref, String label, UnaryOperator<DraftPart> change) {
    if (draft.part(ref) == null) {
      return Edit.refused("There is no part " + ref + ".");
    }
    return Edit.to(
        label,
        draft.withParts(
            draft.parts().stream().map(p -> p.ref().equals(ref) ? change.apply(p) : p).toList()));
  }

  /** Whether a designator is used on the stage (a part, a section or a package). */
  static boolean taken(DraftStage draft, String ref) {
    return draft.part(ref) != null || draft.section(ref) != null || draft.packages().contains(ref);
  }

  private static String nextFree(DraftStage draft, String prefix) {
    int n = 1;
    while (taken(draft, prefix + n)) {
      n++;
    }
    return prefix + n;
  }

  private static String prefix(PartKind kind) {
    return switch (kind) {
      case CAPACITOR -> "C";
      case DIODE, LED -> "D";
      case ZENER -> "ZD";
      case TRIMMER, POTENTIOMETER -> "RV";
      default -> "R";
    };
  }
}
