package com.stagewise.ui.editor;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.circuit.value.BandedValue;
import com.stagewise.circuit.value.ColourCode;
import com.stagewise.circuit.value.SmdCode;
import com.stagewise.ui.editor.DraftStage.DraftInput;
import com.stagewise.ui.editor.DraftStage.DraftPart;
import com.stagewise.ui.editor.DraftStage.DraftRail;
import com.stagewise.ui.editor.DraftStage.DraftSection;
import com.stagewise.ui.editor.EditorProblem.Place;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.function.UnaryOperator;

/**
 * The stage editor's model, in plain Java: the stage being entered, every edit a technician can
 * make on it, the problems of the stage after each edit (placed beside what causes them), undo and
 * redo, and a question before anything that would throw work away.
 *
 * <p>Edits never lose what was entered: a value that is not a value is kept as typed and flagged;
 * an edit that cannot be represented at all (a section letter the package does not have, a
 * designator already taken) is refused with a message in {@link #refusal()} and changes nothing.
 * Listeners are told after every change (edit, undo, redo, start, save).
 */
public final class StageEditorModel {
  /** Resistor tolerance offered for a new resistor: 1 % metal film (common practice). */
  static final String NEW_RESISTOR_TOLERANCE = "1%";

  /** Capacitor tolerance offered for a new capacitor: 10 % (common practice). */
  static final String NEW_CAPACITOR_TOLERANCE = "10%";

  /** A new zener's tolerance: 5 % (the usual grade of small zeners; common practice). */
  static final String NEW_ZENER_TOLERANCE = "5%";

  /** A new trimmer's track tolerance: 20 % (usual for cermet trimmers; common practice). */
  static final String NEW_TRIMMER_TOLERANCE = "20%";

  /** Rail tolerance offered for a new rail: 5 %, a regulated supply (common practice). */
  static final String NEW_RAIL_TOLERANCE = "5%";

  private DraftStage draft = DraftStage.empty("", "");
  private DraftStage saved = draft;
  private DraftCheck.Checked checked = DraftCheck.check(draft);
  private final Deque<Step> undo = new ArrayDeque<>();
  private final Deque<Step> redo = new ArrayDeque<>();
  private final List<Runnable> listeners = new CopyOnWriteArrayList<>();
  private String refusal = "";
  private Question question;

  /** One edit as undo and redo keep it: the stage before, and what the edit did. */
  private record Step(DraftStage before, String label) {}

  /**
   * A question the technician must answer before an edit that would throw work away.
   *
   * @param text the question, in plain words
   * @param yes what happens on yes
   */
  public record Question(String text, String yes, Runnable action) {}

  /** Creates an editor on an empty stage. */
  public StageEditorModel() {}

  /** Adds a listener told after every change. */
  public void addListener(Runnable listener) {
    listeners.add(listener);
  }

  /** Returns the stage as entered. */
  public DraftStage draft() {
    return draft;
  }

  /** Returns every problem of the stage as entered, in order of the stage. */
  public List<EditorProblem> problems() {
    return checked.problems();
  }

  /** Returns the problems beside one part, section, rail or input. */
  public List<EditorProblem> problemsOf(Place place, String key) {
    return checked.problems().stream().filter(p -> p.isAbout(place, key)).toList();
  }

  /**
   * Returns the stage entered, for the schematic: exactly the stage when every entry is complete;
   * otherwise with stand-ins for the unfinished entries (an unwired lead on a net of its own).
   */
  public Stage drawable() {
    return checked.stage();
  }

  /** Returns the stage if it is complete and has no problem, ready to save and diagnose. */
  public Optional<Stage> stage() {
    return checked.complete() && checked.problems().isEmpty()
        ? Optional.of(checked.stage())
        : Optional.empty();
  }

  /** Returns why the last edit was refused, or {@code ""} if it was made. */
  public String refusal() {
    return refusal;
  }

  /** Returns the question waiting for an answer, if any. */
  public Optional<Question> question() {
    return Optional.ofNullable(question);
  }

  /** Answers the waiting question: yes carries the edit out, no leaves everything as it was. */
  public void answer(boolean yes) {
    Question asked = question;
    question = null;
    if (asked != null && yes) {
      asked.action().run();
    }
    changed();
  }

  /** Returns whether the stage differs from what was last started or saved. */
  public boolean hasUnsavedEdits() {
    return !draft.equals(saved);
  }

  /** Returns the nets to choose from: ground first, then rails, inputs and the rest. */
  public List<String> netChoices() {
    return List.copyOf(draft.nets());
  }

  // ---------------------------------------------------------------------------------------------
  // Starting and saving

  /**
   * Starts again from a stage (a template's, or one of the library). If the stage being edited has
   * unsaved edits, this asks first (see {@link #question()}) and starts only on yes.
   *
   * @param what what the stage is, for the question, e.g. "the inverting amplifier template"
   */
  public void startFrom(Stage stage, String what) {
    startWith(DraftStage.of(stage), what);
  }

  /** Starts again from an empty stage (asking first, as {@link #startFrom} does). */
  public void startEmpty(String title, String board) {
    startWith(DraftStage.empty(title, board), "an empty stage");
  }

  private void startWith(DraftStage fresh, String what) {
    refusal = "";
    Runnable start =
        () -> {
          draft = fresh;
          saved = fresh;
          undo.clear();
          redo.clear();
          checked = DraftCheck.check(draft);
        };
    if (hasUnsavedEdits()) {
      question =
          new Question(
              "Start again from "
                  + what
                  + "? The "
                  + undo.size()
                  + " change(s) made to \""
                  + titleOrUntitled()
                  + "\" since it was last saved would be lost.",
              "Start again",
              start);
    } else {
      start.run();
    }
    changed();
  }

  /**
   * Returns the stage to save and marks it saved, or empty when it still has problems (then {@link
   * #refusal()} says how many and where; the stage stays as entered).
   */
  public Optional<Stage> save() {
    Optional<Stage> stage = stage();
    if (stage.isEmpty()) {
      refusal =
          "The stage cannot be saved yet: "
              + problems().size()
              + " problem(s) to fix first, shown beside what causes them.";
    } else {
      refusal = "";
      saved = draft;
    }
    changed();
    return stage;
  }

  /**
   * Asks before closing the editor when there are unsaved edits; runs {@code close} at once
   * otherwise, or on yes.
   */
  public void close(Runnable close) {
    if (hasUnsavedEdits()) {
      question =
          new Question(
              "Leave the editor? The changes to \""
                  + titleOrUntitled()
                  + "\" since it was last saved would be lost.",
              "Leave without saving",
              close);
      changed();
    } else {
      close.run();
    }
  }

  // ---------------------------------------------------------------------------------------------
  // Undo and redo

  /** Returns whether there is an edit to undo. */
  public boolean canUndo() {
    return !undo.isEmpty();
  }

  /** Returns whether there is an undone edit to redo. */
  public boolean canRedo() {
    return !redo.isEmpty();
  }

  /** Returns what undo would take back, e.g. "add R3", or {@code ""}. */
  public String undoLabel() {
    return undo.isEmpty() ? "" : undo.peek().label();
  }

  /** Returns what redo would do again, or {@code ""}. */
  public String redoLabel() {
    return redo.isEmpty() ? "" : redo.peek().label();
  }

  /** Takes the last edit back. */
  public void undo() {
    if (!undo.isEmpty()) {
      Step step = undo.pop();
      redo.push(new Step(draft, step.label()));
      draft = step.before();
      checked = DraftCheck.check(draft);
      refusal = "";
      changed();
    }
  }

  /** Does the last undone edit again. */
  public void redo() {
    if (!redo.isEmpty()) {
      Step step = redo.pop();
      undo.push(new Step(draft, step.label()));
      draft = step.before();
      checked = DraftCheck.check(draft);
      refusal = "";
      changed();
    }
  }

  // ---------------------------------------------------------------------------------------------
  // The stage as a whole

  /** Sets the title and the board model's name. */
  public void setTitle(String title, String board) {
    apply("rename the stage", draft.withTitle(title, board));
  }

  /** Sets the ground net's name (the reference at 0 V). */
  public void setGround(String net) {
    apply("set ground to " + net, draft.withGround(net));
  }

  /**
   * Renames a net everywhere it appears (ground, rails, inputs, part ends, section pins).
   *
   * @return whether it was renamed (refused if the old net is not on the stage or the new name is
   *     empty or already a net)
   */
  public boolean renameNet(String old, String now) {
    String name = now == null ? "" : now.strip();
    if (!draft.nets().contains(old)) {
      return refuse("There is no net " + old + " on the stage.");
    }
    if (name.isEmpty()) {
      return refuse("The new name for net " + old + " is empty.");
    }
    if (draft.nets().contains(name)) {
      return refuse(
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
                .map(i -> new DraftInput(rename.apply(i.net()), i.dc(), i.ac(), i.hz()))
                .toList(),
            draft.parts().stream()
                .map(p -> p.withNets(p.nets().stream().map(rename).toList()))
                .toList(),
            draft.sections().stream()
                .map(
                    s -> {
                      Map<Terminal, String> nets = new EnumMap<>(Terminal.class);
                      s.nets().forEach((t, n) -> nets.put(t, rename.apply(n)));
                      return new DraftSection(
                          s.ref(),
                          s.packageRef(),
                          s.packageType(),
                          s.section(),
                          s.deviceClass(),
                          nets);
                    })
                .toList());
    return apply("rename net " + old + " to " + name, renamed);
  }

  // ---------------------------------------------------------------------------------------------
  // Parts

  /**
   * Adds a part of a kind with the next free designator ({@code R3}, {@code C2}), a usual value and
   * tolerance, and its leads not wired yet.
   *
   * @return the new part's designator
   */
  public String addPart(PartKind kind) {
    String ref = nextFree(prefix(kind));
    DraftPart part =
        switch (kind) {
          case RESISTOR ->
              new DraftPart(
                  ref,
                  kind,
                  Entry.typed("10k"),
                  Entry.typed(NEW_RESISTOR_TOLERANCE),
                  List.of("", ""));
          case CAPACITOR ->
              new DraftPart(
                  ref,
                  kind,
                  Entry.typed("100n"),
                  Entry.typed(NEW_CAPACITOR_TOLERANCE),
                  List.of("", ""));
          case DIODE ->
              new DraftPart(
                  ref,
                  kind,
                  Entry.typed(""),
                  Entry.typed(""),
                  List.of("", ""),
                  "silicon",
                  Entry.typed(""),
                  false);
          case LED ->
              new DraftPart(
                  ref,
                  kind,
                  Entry.typed(""),
                  Entry.typed(""),
                  List.of("", ""),
                  "red",
                  Entry.typed(""),
                  false);
          case ZENER ->
              new DraftPart(
                  ref, kind, Entry.typed("5V1"), Entry.typed(NEW_ZENER_TOLERANCE), List.of("", ""));
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
    apply("add " + ref, draft.withParts(parts));
    return ref;
  }

  /** Deletes a part (undo brings it back). */
  public boolean removePart(String ref) {
    if (draft.part(ref) == null) {
      return refuse("There is no part " + ref + ".");
    }
    return apply(
        "delete " + ref,
        draft.withParts(draft.parts().stream().filter(p -> !p.ref().equals(ref)).toList()));
  }

  /** Gives a part another designator; refused if it is empty or taken. */
  public boolean renamePart(String ref, String newRef) {
    String name = newRef == null ? "" : newRef.strip();
    if (draft.part(ref) == null) {
      return refuse("There is no part " + ref + ".");
    }
    if (name.equals(ref)) {
      return true;
    }
    if (name.isEmpty()) {
      return refuse("A designator cannot be empty; " + ref + " keeps its name.");
    }
    if (taken(name)) {
      return refuse(name + " is already used on this stage; choose another designator.");
    }
    return changePart(ref, "rename " + ref + " to " + name, p -> p.withRef(name));
  }

  /**
   * Connects one lead of a part (0 for the first) to a net: one of {@link #netChoices()} or a new
   * name; an empty name unwires it.
   */
  public boolean setPartNet(String ref, int lead, String net) {
    DraftPart part = draft.part(ref);
    if (part == null) {
      return refuse("There is no part " + ref + ".");
    }
    if (lead < 0 || lead >= part.nets().size()) {
      return refuse(ref + " has no lead " + (lead + 1) + ".");
    }
    String name = net == null ? "" : net.strip();
    return changePart(
        ref,
        "connect "
            + ref
            + " "
            + DraftCheck.leadName(part, lead)
            + " to "
            + (name.isEmpty() ? "nothing" : name),
        p -> p.withNet(lead, name));
  }

  /**
   * Chooses a diode's class ({@code silicon}, {@code schottky}) or an LED's colour ({@code red},
   * {@code green} …); kept as chosen even if not a word the kind takes (then flagged).
   */
  public boolean setPartChoice(String ref, String word) {
    DraftPart part = draft.part(ref);
    if (part == null) {
      return refuse("There is no part " + ref + ".");
    }
    if (part.kind() != PartKind.DIODE && part.kind() != PartKind.LED) {
      return refuse(
          "A class or colour is chosen for a diode or LED; "
              + ref
              + " is a "
              + part.kind().word()
              + ".");
    }
    String what = part.kind() == PartKind.LED ? " colour to " : " class to ";
    return changePart(ref, "set " + ref + what + word, p -> p.withChoice(word));
  }

  /**
   * Sets a trimmer's wiper position as typed (0 to 1, the share of the track from end 1) and
   * whether it is sealed; kept as typed even if not valid (then flagged).
   */
  public boolean setPartPosition(String ref, String text, boolean sealed) {
    DraftPart part = draft.part(ref);
    if (part == null) {
      return refuse("There is no part " + ref + ".");
    }
    if (!part.kind().isTrimmer()) {
      return refuse("A wiper position is set on a trimmer; " + ref + " has no wiper.");
    }
    return changePart(
        ref,
        "set " + ref + " wiper to " + text + (sealed ? " (sealed)" : ""),
        p -> p.withPosition(Entry.typed(text), sealed));
  }

  /** Sets a part's value as typed ({@code 4k7}, {@code 100n}); kept as typed even if not valid. */
  public boolean setPartValue(String ref, String text) {
    return changePart(ref, "set " + ref + " to " + text, p -> p.withValue(Entry.typed(text)));
  }

  /** Sets a part's tolerance as typed ({@code 1%}, {@code 0.01}). */
  public boolean setPartTolerance(String ref, String text) {
    return changePart(
        ref, "set " + ref + " tolerance to " + text, p -> p.withTolerance(Entry.typed(text)));
  }

  /**
   * Sets a resistor's value (and tolerance band, if read) from its colour bands, read from the end
   * away from the tolerance band (IEC 60062).
   */
  public boolean setPartValueFromBands(String ref, List<String> bands) {
    DraftPart part = draft.part(ref);
    if (part == null || part.kind() != PartKind.RESISTOR) {
      return refuse("Colour bands give a resistor's value; " + ref + " is not a resistor.");
    }
    BandedValue value;
    try {
      value = ColourCode.decode(bands);
    } catch (InvalidInputException e) {
      return refuse("Not a colour code: " + e.getMessage());
    }
    return changePart(
        ref,
        "set " + ref + " from its colour bands",
        p ->
            p.withValue(
                    Entry.of(value.ohms(), DraftStage.valueText(PartKind.RESISTOR, value.ohms())))
                .withTolerance(
                    Entry.of(
                        value.tolerance(),
                        com.stagewise.circuit.value.Tolerance.format(value.tolerance()))));
  }

  /** Sets a resistor's value from its SMD marking (3-digit, 4-digit or EIA-96 code). */
  public boolean setPartValueFromSmd(String ref, String code) {
    DraftPart part = draft.part(ref);
    if (part == null || part.kind() != PartKind.RESISTOR) {
      return refuse("An SMD code gives a resistor's value; " + ref + " is not a resistor.");
    }
    double ohms;
    try {
      ohms = SmdCode.decode(code);
    } catch (InvalidInputException e) {
      return refuse("Not an SMD code: " + e.getMessage());
    }
    return changePart(
        ref,
        "set " + ref + " from SMD code " + code,
        p -> p.withValue(Entry.of(ohms, DraftStage.valueText(PartKind.RESISTOR, ohms))));
  }

  private boolean changePart(String ref, String label, UnaryOperator<DraftPart> change) {
    if (draft.part(ref) == null) {
      return refuse("There is no part " + ref + ".");
    }
    return apply(
        label,
        draft.withParts(
            draft.parts().stream().map(p -> p.ref().equals(ref) ? change.apply(p) : p).toList()));
  }

  // ---------------------------------------------------------------------------------------------
  // Op-amp sections

  /**
   * Adds an op-amp section: section {@code letter} of package {@code packageRef}, designator
   * package plus letter ({@code U1A}). Its pins follow the package's pinout; its supply pins take
   * the nets of the package's other sections (they are the same pins), else the highest rail and
   * the lowest rail (or ground); inputs and output are not wired yet.
   *
   * @return the new section's designator, or empty when refused (see {@link #refusal()})
   */
  public Optional<String> addSection(
      PackageType type, String packageRef, String letter, DeviceClass deviceClass) {
    String pkg = packageRef == null ? "" : packageRef.strip();
    if (pkg.isEmpty()) {
      refuse("A section needs its package's designator, e.g. U1.");
      return Optional.empty();
    }
    if (!type.hasSection(letter)) {
      refuse(
          "A "
              + type.word()
              + " package has no section "
              + letter
              + " (it has "
              + String.join(", ", type.sections())
              + ").");
      return Optional.empty();
    }
    List<DraftSection> mates =
        draft.sections().stream().filter(s -> s.packageRef().equals(pkg)).toList();
    if (!mates.isEmpty() && mates.get(0).packageType() != type) {
      refuse(
          pkg + " is already a " + mates.get(0).packageType().word() + " package on this stage.");
      return Optional.empty();
    }
    String ref = pkg + letter;
    if (taken(ref)) {
      refuse(ref + " is already on the stage.");
      return Optional.empty();
    }
    Map<Terminal, String> nets = new EnumMap<>(Terminal.class);
    DeviceClass cls = deviceClass;
    if (!mates.isEmpty()) {
      nets.put(Terminal.V_PLUS, mates.get(0).net(Terminal.V_PLUS));
      nets.put(Terminal.V_MINUS, mates.get(0).net(Terminal.V_MINUS));
      cls = mates.get(0).deviceClass();
    } else {
      nets.put(Terminal.V_PLUS, highestRail());
      nets.put(Terminal.V_MINUS, lowestRailOrGround());
    }
    List<DraftSection> sections = new ArrayList<>(draft.sections());
    sections.add(new DraftSection(ref, pkg, type, letter, cls, nets));
    apply("add " + ref, draft.withSections(sections));
    return Optional.of(ref);
  }

  /** Returns the letters of a package still free (all of the type's when the package is new). */
  public List<String> freeSections(PackageType type, String packageRef) {
    List<String> used =
        draft.sections().stream()
            .filter(s -> s.packageRef().equals(packageRef))
            .map(DraftSection::section)
            .toList();
    return type.sections().stream().filter(l -> !used.contains(l)).toList();
  }

  /** Returns the next package designator not used yet ({@code U1}, {@code U2}, …). */
  public String nextPackage() {
    int n = 1;
    while (draft.packages().contains("U" + n) || taken("U" + n)) {
      n++;
    }
    return "U" + n;
  }

  /** Deletes a section (undo brings it back). */
  public boolean removeSection(String ref) {
    if (draft.section(ref) == null) {
      return refuse("There is no section " + ref + ".");
    }
    return apply(
        "delete " + ref,
        draft.withSections(draft.sections().stream().filter(s -> !s.ref().equals(ref)).toList()));
  }

  /** Gives a section another designator; refused if it is empty or taken. */
  public boolean renameSection(String ref, String newRef) {
    String name = newRef == null ? "" : newRef.strip();
    if (draft.section(ref) == null) {
      return refuse("There is no section " + ref + ".");
    }
    if (name.equals(ref)) {
      return true;
    }
    if (name.isEmpty()) {
      return refuse("A designator cannot be empty; " + ref + " keeps its name.");
    }
    if (taken(name)) {
      return refuse(name + " is already used on this stage; choose another designator.");
    }
    return changeSections(
        "rename " + ref + " to " + name, s -> s.ref().equals(ref) ? s.withRef(name) : s);
  }

  /**
   * Wires a section's terminal to a net. The supply pins are shared by every section of a package,
   * so a supply pin's net changes for all of them.
   */
  public boolean setSectionNet(String ref, Terminal terminal, String net) {
    DraftSection section = draft.section(ref);
    if (section == null) {
      return refuse("There is no section " + ref + ".");
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
    return changeSections(
        label,
        s ->
            s.ref().equals(ref)
                    || (terminal.isSupply() && s.packageRef().equals(section.packageRef()))
                ? s.withNet(terminal, name)
                : s);
  }

  /** Sets the device class of a section's package (one package has one class). */
  public boolean setSectionClass(String ref, DeviceClass deviceClass) {
    DraftSection section = draft.section(ref);
    if (section == null) {
      return refuse("There is no section " + ref + ".");
    }
    return changeSections(
        "make " + section.packageRef() + " " + deviceClass.word(),
        s -> s.packageRef().equals(section.packageRef()) ? s.withClass(deviceClass) : s);
  }

  /**
   * Moves a section to another letter of its package (its pins change with it); refused if the
   * package type has no such letter. Two sections on one letter are flagged, not refused.
   */
  public boolean setSectionLetter(String ref, String letter) {
    DraftSection section = draft.section(ref);
    if (section == null) {
      return refuse("There is no section " + ref + ".");
    }
    if (!section.packageType().hasSection(letter)) {
      return refuse(
          "A "
              + section.packageType().word()
              + " package has no section "
              + letter
              + " (it has "
              + String.join(", ", section.packageType().sections())
              + ").");
    }
    return changeSections(
        "move " + ref + " to section " + letter,
        s -> s.ref().equals(ref) ? s.withSection(letter) : s);
  }

  private boolean changeSections(String label, UnaryOperator<DraftSection> change) {
    return apply(label, draft.withSections(draft.sections().stream().map(change).toList()));
  }

  // ---------------------------------------------------------------------------------------------
  // Rails and test inputs

  /** Adds a rail on a net with its volts ({@code 15}, {@code -15}) and tolerance ({@code 5%}). */
  public void addRail(String net, String volts) {
    List<DraftRail> rails = new ArrayList<>(draft.rails());
    rails.add(new DraftRail(net, Entry.typed(volts), Entry.typed(NEW_RAIL_TOLERANCE)));
    apply("add rail " + net, draft.withRails(rails));
  }

  /** Removes the rail at a position (0 first). */
  public boolean removeRail(int index) {
    if (index < 0 || index >= draft.rails().size()) {
      return refuse("There is no rail " + (index + 1) + ".");
    }
    List<DraftRail> rails = new ArrayList<>(draft.rails());
    DraftRail gone = rails.remove(index);
    return apply("remove rail " + gone.net(), draft.withRails(rails));
  }

  /** Sets a rail's net. */
  public boolean setRailNet(int index, String net) {
    return changeRail(
        index, "set rail net to " + net, r -> new DraftRail(net, r.volts(), r.tolerance()));
  }

  /** Sets a rail's volts as typed. */
  public boolean setRailVolts(int index, String volts) {
    return changeRail(
        index,
        "set rail volts to " + volts,
        r -> new DraftRail(r.net(), Entry.typed(volts), r.tolerance()));
  }

  /** Sets a rail's tolerance as typed. */
  public boolean setRailTolerance(int index, String tolerance) {
    return changeRail(
        index,
        "set rail tolerance to " + tolerance,
        r -> new DraftRail(r.net(), r.volts(), Entry.typed(tolerance)));
  }

  private boolean changeRail(int index, String label, UnaryOperator<DraftRail> change) {
    if (index < 0 || index >= draft.rails().size()) {
      return refuse("There is no rail " + (index + 1) + ".");
    }
    List<DraftRail> rails = new ArrayList<>(draft.rails());
    rails.set(index, change.apply(rails.get(index)));
    return apply(label, draft.withRails(rails));
  }

  /** Adds a test input on a net at a DC level, with no AC. */
  public void addInput(String net, String dc) {
    List<DraftInput> inputs = new ArrayList<>(draft.inputs());
    inputs.add(new DraftInput(net, Entry.typed(dc), Entry.typed(""), Entry.typed("")));
    apply("add input " + net, draft.withInputs(inputs));
  }

  /** Removes the input at a position (0 first). */
  public boolean removeInput(int index) {
    if (index < 0 || index >= draft.inputs().size()) {
      return refuse("There is no input " + (index + 1) + ".");
    }
    List<DraftInput> inputs = new ArrayList<>(draft.inputs());
    DraftInput gone = inputs.remove(index);
    return apply("remove input " + gone.net(), draft.withInputs(inputs));
  }

  /** Sets an input's net. */
  public boolean setInputNet(int index, String net) {
    return changeInput(
        index, "set input net to " + net, i -> new DraftInput(net, i.dc(), i.ac(), i.hz()));
  }

  /** Sets an input's DC level as typed. */
  public boolean setInputDc(int index, String dc) {
    return changeInput(
        index,
        "set input DC to " + dc,
        i -> new DraftInput(i.net(), Entry.typed(dc), i.ac(), i.hz()));
  }

  /** Sets an input's AC amplitude and frequency as typed (empty or 0 amplitude: no AC). */
  public boolean setInputAc(int index, String ac, String hz) {
    return changeInput(
        index,
        "set input AC to " + ac + " at " + hz + " Hz",
        i -> new DraftInput(i.net(), i.dc(), Entry.typed(ac), Entry.typed(hz)));
  }

  private boolean changeInput(int index, String label, UnaryOperator<DraftInput> change) {
    if (index < 0 || index >= draft.inputs().size()) {
      return refuse("There is no input " + (index + 1) + ".");
    }
    List<DraftInput> inputs = new ArrayList<>(draft.inputs());
    inputs.set(index, change.apply(inputs.get(index)));
    return apply(label, draft.withInputs(inputs));
  }

  // ---------------------------------------------------------------------------------------------

  private boolean apply(String label, DraftStage next) {
    refusal = "";
    if (!next.equals(draft)) {
      undo.push(new Step(draft, label));
      redo.clear();
      draft = next;
      checked = DraftCheck.check(draft);
    }
    changed();
    return true;
  }

  private boolean refuse(String why) {
    refusal = why;
    changed();
    return false;
  }

  private void changed() {
    for (Runnable listener : listeners) {
      listener.run();
    }
  }

  private boolean taken(String ref) {
    return draft.part(ref) != null || draft.section(ref) != null || draft.packages().contains(ref);
  }

  private String nextFree(String prefix) {
    int n = 1;
    while (taken(prefix + n)) {
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

  private String highestRail() {
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

  private String lowestRailOrGround() {
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
    return rail.volts().problem(com.stagewise.circuit.value.SiValue::parse) == null
        ? rail.volts().value(com.stagewise.circuit.value.SiValue::parse)
        : 0;
  }

  private String titleOrUntitled() {
    return draft.title().isBlank() ? "untitled stage" : draft.title();
  }
}
