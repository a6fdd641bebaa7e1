package com.stagewise.ui.editor;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.Terminal;
import com.stagewise.ui.editor.EditorProblem.Place;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.CopyOnWriteArrayList;

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
    return apply(SupplyEdits.renameNet(draft, old, now));
  }

  // ---------------------------------------------------------------------------------------------
  // Parts ({@link PartEdits} says what each edit does)

  /**
   * Adds a part of a kind with the next free designator ({@code R3}, {@code C2}), a usual value and
   * tolerance, and its leads not wired yet.
   *
   * @return the new part's designator
   */
  public String addPart(PartKind kind) {
    Edit edit = PartEdits.add(draft, kind);
    apply(edit);
    return edit.made();
  }

  /** Deletes a part (undo brings it back). */
  public boolean removePart(String ref) {
    return apply(PartEdits.remove(draft, ref));
  }

  /** Gives a part another designator; refused if it is empty or taken. */
  public boolean renamePart(String ref, String newRef) {
    return apply(PartEdits.rename(draft, ref, newRef));
  }

  /**
   * Connects one lead of a part (0 for the first) to a net: one of {@link #netChoices()} or a new
   * name; an empty name unwires it.
   */
  public boolean setPartNet(String ref, int lead, String net) {
    return apply(PartEdits.setNet(draft, ref, lead, net));
  }

  /** Chooses a diode's class or an LED's colour; kept as chosen even if not a word it takes. */
  public boolean setPartChoice(String ref, String word) {
    return apply(PartEdits.setChoice(draft, ref, word));
  }

  /** Sets a trimmer's wiper position as typed (0 to 1 from end 1) and whether it is sealed. */
  public boolean setPartPosition(String ref, String text, boolean sealed) {
    return apply(PartEdits.setPosition(draft, ref, text, sealed));
  }

  /** Sets a part's value as typed ({@code 4k7}, {@code 100n}); kept as typed even if not valid. */
  public boolean setPartValue(String ref, String text) {
    return apply(PartEdits.setValue(draft, ref, text));
  }

  /** Sets a part's tolerance as typed ({@code 1%}, {@code 0.01}). */
  public boolean setPartTolerance(String ref, String text) {
    return apply(PartEdits.setTolerance(draft, ref, text));
  }

  /** Sets a resistor's value (and tolerance) from its colour bands (IEC 60062). */
  public boolean setPartValueFromBands(String ref, List<String> bands) {
    return apply(PartEdits.fromBands(draft, ref, bands));
  }

  /** Sets a resistor's value from its SMD marking (3-digit, 4-digit or EIA-96 code). */
  public boolean setPartValueFromSmd(String ref, String code) {
    return apply(PartEdits.fromSmd(draft, ref, code));
  }

  // ---------------------------------------------------------------------------------------------
  // Op-amp sections ({@link SectionEdits} says what each edit does)

  /**
   * Adds an op-amp section: section {@code letter} of package {@code packageRef}, designator
   * package plus letter ({@code U1A}), pins by the package's pinout, supply pins shared with the
   * package's other sections (else the highest and the lowest rail or ground).
   *
   * @return the new section's designator, or empty when refused (see {@link #refusal()})
   */
  public Optional<String> addSection(
      PackageType type, String packageRef, String letter, DeviceClass deviceClass) {
    Edit edit = SectionEdits.add(draft, type, packageRef, letter, deviceClass);
    return apply(edit) ? Optional.of(edit.made()) : Optional.empty();
  }

  /** Returns the letters of a package still free (all of the type's when the package is new). */
  public List<String> freeSections(PackageType type, String packageRef) {
    return SectionEdits.free(draft, type, packageRef);
  }

  /** Returns the next package designator not used yet ({@code U1}, {@code U2}, …). */
  public String nextPackage() {
    return SectionEdits.nextPackage(draft);
  }

  /** Deletes a section (undo brings it back). */
  public boolean removeSection(String ref) {
    return apply(SectionEdits.remove(draft, ref));
  }

  /** Gives a section another designator; refused if it is empty or taken. */
  public boolean renameSection(String ref, String newRef) {
    return apply(SectionEdits.rename(draft, ref, newRef));
  }

  /** Wires a section's terminal to a net (a supply pin for every section of its package). */
  public boolean setSectionNet(String ref, Terminal terminal, String net) {
    return apply(SectionEdits.setNet(draft, ref, terminal, net));
  }

  /** Sets the device class of a section's package (one package has one class). */
  public boolean setSectionClass(String ref, DeviceClass deviceClass) {
    return apply(SectionEdits.setClass(draft, ref, deviceClass));
  }

  /** Moves a section to another letter of its package; refused if the package has no such one. */
  public boolean setSectionLetter(String ref, String letter) {
    return apply(SectionEdits.setLetter(draft, ref, letter));
  }

  // ---------------------------------------------------------------------------------------------
  // Rails and test inputs ({@link SupplyEdits})

  /** Adds a rail on a net with its volts ({@code 15}, {@code -15}) and tolerance ({@code 5%}). */
  public void addRail(String net, String volts) {
    apply(SupplyEdits.addRail(draft, net, volts));
  }

  /** Removes the rail at a position (0 first). */
  public boolean removeRail(int index) {
    return apply(SupplyEdits.removeRail(draft, index));
  }

  /** Sets a rail's net. */
  public boolean setRailNet(int index, String net) {
    return apply(SupplyEdits.railNet(draft, index, net));
  }

  /** Sets a rail's volts as typed. */
  public boolean setRailVolts(int index, String volts) {
    return apply(SupplyEdits.railVolts(draft, index, volts));
  }

  /** Sets a rail's tolerance as typed. */
  public boolean setRailTolerance(int index, String tolerance) {
    return apply(SupplyEdits.railTolerance(draft, index, tolerance));
  }

  /** Adds a test input on a net at a DC level, with no AC. */
  public void addInput(String net, String dc) {
    apply(SupplyEdits.addInput(draft, net, dc));
  }

  /** Removes the input at a position (0 first). */
  public boolean removeInput(int index) {
    return apply(SupplyEdits.removeInput(draft, index));
  }

  /** Sets an input's net. */
  public boolean setInputNet(int index, String net) {
    return apply(SupplyEdits.inputNet(draft, index, net));
  }

  /** Sets an input's DC level as typed. */
  public boolean setInputDc(int index, String dc) {
    return apply(SupplyEdits.inputDc(draft, index, dc));
  }

  /** Sets an input's AC amplitude and frequency as typed (empty or 0 amplitude: no AC). */
  public boolean setInputAc(int index, String ac, String hz) {
    return apply(SupplyEdits.inputAc(draft, index, ac, hz));
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

  /** Applies an edit of {@link PartEdits}, {@link SectionEdits} or {@link SupplyEdits}. */
  private boolean apply(Edit edit) {
    return edit.wasRefused() ? refuse(edit.refusal()) : apply(edit.label(), edit.next());
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

  private String titleOrUntitled() {
    return draft.title().isBlank() ? "untitled stage" : draft.title();
  }
}
