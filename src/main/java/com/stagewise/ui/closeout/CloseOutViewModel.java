package com.stagewise.ui.closeout;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.ui.Bench;
import com.stagewise.ui.PhotoAttaching;
import com.stagewise.ui.ReportSaving;
import com.stagewise.ui.Step;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The close-out: what was done (parts replaced with their values, reflow, other), which faults were
 * found, the outcome and notes; saved to the history, where the shop's memory learns from it. A
 * case can also be left open and resumed later.
 */
public final class CloseOutViewModel {
  private final Bench bench;
  private final ObservableList<RepairAction> actions = FXCollections.observableArrayList();
  private final ObjectProperty<ActionKind> actionKind =
      new SimpleObjectProperty<>(ActionKind.PART_REPLACED);
  private final StringProperty actionPart = new SimpleStringProperty("");
  private final StringProperty actionOld = new SimpleStringProperty("");
  private final StringProperty actionNew = new SimpleStringProperty("");
  private final StringProperty actionText = new SimpleStringProperty("");
  private final ObservableList<String> faultChoices = FXCollections.observableArrayList();
  private final ObservableList<String> confirmedFaults = FXCollections.observableArrayList();
  private final ObjectProperty<Outcome> outcome = new SimpleObjectProperty<>();
  private final StringProperty notes = new SimpleStringProperty("");
  private Consumer<String> afterClose = caseId -> {};
  private final BooleanProperty saveReport = new SimpleBooleanProperty(false);
  private final ObservableList<String> photos = FXCollections.observableArrayList();
  private final AfterRepairViewModel afterRepair;
  private final BooleanProperty checking = new SimpleBooleanProperty(false);
  private final StringProperty question = new SimpleStringProperty("");

  /** Creates the close-out's model on a bench. */
  public CloseOutViewModel(Bench bench) {
    this.bench = bench;
    this.afterRepair = new AfterRepairViewModel(bench);
    bench.openCaseProperty().addListener((o, was, now) -> reset());
    // What was done and the photos may have been added from the command line meanwhile: the
    // screen shows the history as it is each time it comes up.
    bench
        .stepProperty()
        .addListener(
            (o, was, now) -> {
              if (now == Step.CLOSE_OUT && was != Step.CLOSE_OUT) {
                readStored();
              }
            });
    bench.diagnosisProperty().addListener((o, was, now) -> choices(now));
  }

  public ObservableList<RepairAction> actions() {
    return actions;
  }

  public ObjectProperty<ActionKind> actionKindProperty() {
    return actionKind;
  }

  public StringProperty actionPartProperty() {
    return actionPart;
  }

  public StringProperty actionOldProperty() {
    return actionOld;
  }

  public StringProperty actionNewProperty() {
    return actionNew;
  }

  public StringProperty actionTextProperty() {
    return actionText;
  }

  /** Returns the fault ids offered (the current suspects), first suspect first. */
  public ObservableList<String> faultChoices() {
    return faultChoices;
  }

  /** Returns the fault ids ticked as found. */
  public ObservableList<String> confirmedFaults() {
    return confirmedFaults;
  }

  public ObjectProperty<Outcome> outcomeProperty() {
    return outcome;
  }

  public StringProperty notesProperty() {
    return notes;
  }

  /** Whether the repair report (PDF) is saved as soon as the case is closed. */
  public BooleanProperty saveReportProperty() {
    return saveReport;
  }

  /** Returns the check after the repair. */
  public AfterRepairViewModel afterRepair() {
    return afterRepair;
  }

  /** Whether the check after the repair is on screen (in place of the actions). */
  public BooleanProperty checkingProperty() {
    return checking;
  }

  /**
   * The question asked before closing as fixed when a reading after the repair is outside its
   * healthy band; empty when none is asked.
   */
  public StringProperty questionProperty() {
    return question;
  }

  /** Starts the check after the repair: the points to read again, with their healthy bands. */
  public void checkAfterRepair() {
    if (bench.openCaseProperty().get() == null) {
      return;
    }
    checking.set(true);
    afterRepair.start();
  }

  /** Leaves the check (what was read is stored by the check's own button). */
  public void endCheck() {
    checking.set(false);
  }

  /** Closes as fixed although a reading after the repair is outside its band (asked first). */
  public void closeAnyway() {
    question.set("");
    close(true);
  }

  /** Goes back from the question without closing. */
  public void dontClose() {
    question.set("");
  }

  /** Returns a line for each photo of the board attached to the case, in the order attached. */
  public ObservableList<String> photos() {
    return photos;
  }

  /**
   * Asks which photo of the board to attach to the case (PNG or JPEG) and stores it at once, so it
   * is kept if the case is left open.
   */
  public void attachPhoto() {
    RepairCase rc = bench.openCaseProperty().get();
    if (rc == null) {
      return;
    }
    PhotoAttaching.attach(
        bench,
        rc.id(),
        photo -> {
          if (bench.openCaseProperty().get() == rc) {
            photos.add(Words.photoLine(photo));
          }
        });
  }

  /** Sets what happens after a case is closed (the app shows it in the history). */
  public void setAfterClose(Consumer<String> action) {
    afterClose = action;
  }

  private void reset() {
    actions.clear();
    confirmedFaults.clear();
    outcome.set(null);
    notes.set("");
    photos.clear();
    checking.set(false);
    question.set("");
    clearForm();
    readStored();
    choices(bench.diagnosisProperty().get());
  }

  /** Reads the open case's actions and photos from the history. */
  private void readStored() {
    RepairCase rc = bench.openCaseProperty().get();
    if (rc != null) {
      bench
          .tasks()
          .run(
              "Reading the case",
              () -> bench.store().cases().caseFile(rc.id()),
              stored -> {
                if (bench.openCaseProperty().get() == rc && stored.isPresent()) {
                  actions.setAll(stored.get().actions());
                  photos.setAll(stored.get().photos().stream().map(Words::photoLine).toList());
                }
              },
              e -> bench.problems().failed("Could not read the case", e, Words.CHECK_DATABASE));
    }
  }

  private void choices(Diagnosis diagnosis) {
    List<String> ids = new ArrayList<>();
    if (diagnosis != null) {
      for (Suspect s : diagnosis.suspects()) {
        if (!s.fault().equals("healthy")) {
          ids.add(s.fault());
        }
      }
    }
    for (String ticked : confirmedFaults) {
      if (!ids.contains(ticked)) {
        ids.add(ticked);
      }
    }
    faultChoices.setAll(ids);
  }

  /**
   * Prepares the close-out for the suspect the technician settled on: ticks its fault and fills the
   * action form with the likely repair (replace the part with its marked value, or reflow the
   * joint).
   */
  public void prepareFor(Suspect suspect) {
    if (suspect == null || suspect.fault().equals("healthy")) {
      return;
    }
    if (!faultChoices.contains(suspect.fault())) {
      faultChoices.add(0, suspect.fault());
    }
    if (!confirmedFaults.contains(suspect.fault())) {
      confirmedFaults.add(suspect.fault());
    }
    String what = suspect.fault().substring(0, suspect.fault().lastIndexOf(':'));
    String kind = suspect.fault().substring(suspect.fault().lastIndexOf(':') + 1);
    Stage stage = bench.stageProperty().get();
    Optional<Part> part = stage == null ? Optional.empty() : stage.part(what);
    clearForm();
    if (part.isPresent()) {
      String unit = part.get().kind() == PartKind.CAPACITOR ? "F" : "Ω";
      actionKind.set(ActionKind.PART_REPLACED);
      actionPart.set(part.get().ref());
      actionOld.set(
          suspect.estimatedValue().isPresent()
              ? "measured " + SiValue.format(suspect.estimatedValue().getAsDouble(), unit, 2)
              : kind.equals("open") ? "open" : kind.equals("short") ? "shorted" : "");
      actionNew.set(SiValue.format(part.get().value(), unit));
    } else if (kind.equals("lifted") || kind.equals("bridge")) {
      actionKind.set(ActionKind.REFLOW);
      actionPart.set(what.contains(".") ? what.substring(0, what.indexOf('.')) : what);
      actionText.set(
          kind.equals("bridge")
              ? "Removed the solder bridge at " + Words.pin(what)
              : "Reflowed " + Words.pin(what));
    } else if (stage != null && stage.amplifier(what).isPresent()) {
      actionKind.set(ActionKind.PART_REPLACED);
      actionPart.set(stage.amplifier(what).get().packageRef());
    } else {
      actionKind.set(ActionKind.OTHER);
      actionText.set(Words.fault(suspect.fault()));
    }
  }

  private void clearForm() {
    actionPart.set("");
    actionOld.set("");
    actionNew.set("");
    actionText.set("");
  }

  /** Ticks or unticks a fault as found. */
  public void toggleFault(String faultId, boolean found) {
    if (found && !confirmedFaults.contains(faultId)) {
      confirmedFaults.add(faultId);
    } else if (!found) {
      confirmedFaults.remove(faultId);
    }
  }

  /**
   * Records the action in the form in the case at once (so it is kept if the case is left open).
   */
  public void addAction() {
    RepairCase rc = bench.openCaseProperty().get();
    if (rc == null) {
      return;
    }
    ActionKind kind = actionKind.get();
    String part = text(actionPart);
    if (kind == ActionKind.PART_REPLACED && part.isEmpty()) {
      bench
          .problems()
          .show(
              "Which part was replaced?",
              "A replaced part needs its designator.",
              "Type the designator, e.g. R2 or U1.");
      return;
    }
    if (kind == ActionKind.OTHER && text(actionText).isEmpty()) {
      bench
          .problems()
          .show(
              "Say what was done",
              "An \"other\" action needs a few words.",
              "Type what was done, e.g. \"cleaned the edge connector\".");
      return;
    }
    String oldValue = text(actionOld);
    String newValue = text(actionNew);
    String words = text(actionText);
    bench
        .tasks()
        .run(
            "Recording the action",
            () -> bench.casework().addAction(rc.id(), kind, part, oldValue, newValue, words),
            stored -> {
              actions.add(stored);
              clearForm();
            },
            e -> bench.problems().failed("Could not record the action", e, Words.CHECK_DATABASE));
  }

  /**
   * Closes the case with the outcome, the faults found and the notes, and shows it in the history.
   */
  public void closeCase() {
    close(false);
  }

  private void close(boolean outsideConfirmed) {
    RepairCase rc = bench.openCaseProperty().get();
    Outcome chosen = outcome.get();
    if (rc == null) {
      return;
    }
    if (chosen == null) {
      bench
          .problems()
          .show(
              "How did it end?",
              "A case closes with an outcome.",
              "Tap Fixed, Not fixed or Returned unrepaired.");
      return;
    }
    if (chosen == Outcome.FIXED && confirmedFaults.isEmpty() && actions.isEmpty()) {
      bench
          .problems()
          .show(
              "What fixed it?",
              "A fixed case needs the fault found or the action taken, so the shop can learn from"
                  + " it.",
              "Tick the fault that was found, or add what was done.");
      return;
    }
    if (chosen == Outcome.FIXED && !outsideConfirmed && !afterRepair.outside().isEmpty()) {
      question.set(
          "After the repair, "
              + String.join("; ", afterRepair.outside())
              + ". Close the case as fixed anyway?");
      return;
    }
    if (afterRepair.hasUnsaved()) {
      // What was read after the repair is kept with the case before it closes.
      afterRepair.store(() -> close(true));
      return;
    }
    List<String> faults =
        chosen == Outcome.FIXED || chosen == Outcome.NOT_FIXED
            ? List.copyOf(confirmedFaults)
            : List.of();
    String note = text(notes);
    String serial = bench.unitProperty().get() == null ? "" : bench.unitProperty().get().serial();
    bench
        .tasks()
        .run(
            "Closing the case",
            () -> {
              RepairCase closed = bench.casework().closeCase(rc.id(), chosen, faults, note);
              bench.resume().forget(rc.id());
              return closed;
            },
            closed -> {
              bench.clearCase();
              afterClose.accept(closed.id());
              if (saveReport.get()) {
                ReportSaving.save(
                    bench,
                    closed.id(),
                    serial,
                    saved ->
                        bench
                            .problems()
                            .show(
                                "Report saved",
                                saved,
                                "Print it from there, or pass it on with the unit."));
              }
            },
            e -> bench.problems().failed("Could not close the case", e, Words.CHECK_DATABASE));
  }

  /** Keeps the case open (with its notes) to resume later, and goes back to the unit screen. */
  public void leaveOpen() {
    RepairCase rc = bench.openCaseProperty().get();
    if (rc == null) {
      return;
    }
    String note = text(notes);
    bench.resume().saveStep(rc.id(), Step.CLOSE_OUT);
    bench
        .tasks()
        .run(
            "Keeping the case open",
            () -> {
              if (!note.isEmpty()) {
                bench.casework().addNote(rc.id(), note);
              }
              return null;
            },
            ok -> {
              notes.set("");
              bench.clearCase();
              bench.go(Step.UNIT);
            },
            e -> bench.problems().failed("Could not save the note", e, Words.CHECK_DATABASE));
  }

  private static String text(StringProperty p) {
    return p.get() == null ? "" : p.get().strip();
  }
}
