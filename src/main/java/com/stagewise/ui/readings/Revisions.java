package com.stagewise.ui.readings;

import com.stagewise.casework.Casework;
import com.stagewise.casework.RevisedReadings;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.StoredReading;
import com.stagewise.ui.Bench;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import java.util.function.Function;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;

/**
 * Striking out, restoring and correcting the readings of the case on the bench, each with an undo.
 *
 * <p>Nothing is deleted: a struck reading moves from the bench's standing readings to its struck
 * ones at once (so the screen answers the tap), the history marks it struck with the time, and the
 * suspect list of the readings that stand is computed and stored in the same transaction. When the
 * store refuses, the bench is put back as it was and the technician is told why.
 */
final class Revisions {
  private final Bench bench;
  private final Function<Stage, Diagnoser> readyDiagnoser;
  private final Runnable refreshed;
  private final StringProperty undoText = new SimpleStringProperty("");
  private final ObjectProperty<Reading> correcting = new SimpleObjectProperty<>();
  private final StringProperty correctingText = new SimpleStringProperty("");
  private final BooleanHolder busy = new BooleanHolder();
  private Runnable undo;
  // The readings the last undo would make stand again.
  private List<Reading> undoBrings = List.of();

  /**
   * Creates the revisions of a bench.
   *
   * @param readyDiagnoser the diagnoser already prepared for a stage, or null
   * @param refreshed called after the bench's readings or diagnosis changed
   */
  Revisions(Bench bench, Function<Stage, Diagnoser> readyDiagnoser, Runnable refreshed) {
    this.bench = bench;
    this.readyDiagnoser = readyDiagnoser;
    this.refreshed = refreshed;
    correcting.addListener(
        (o, was, now) ->
            correctingText.set(
                now == null
                    ? ""
                    : "Correcting "
                        + describe(now)
                        + ": type the right value and tap Add reading. The wrong one stays in"
                        + " the history, struck out."));
  }

  /** The line that says which reading is being corrected; empty when none is. */
  StringProperty correctingTextProperty() {
    return correctingText;
  }

  /**
   * What the last strike, restore or correction did, in words; empty when there is none to undo.
   */
  StringProperty undoTextProperty() {
    return undoText;
  }

  /** The reading being corrected: the next reading added takes its place. Null when none is. */
  ObjectProperty<Reading> correctingProperty() {
    return correcting;
  }

  /** Forgets the last undo (a new reading was added, or the case changed). */
  void forgetUndo() {
    undo = null;
    undoBrings = List.of();
    undoText.set("");
  }

  /**
   * Forgets the last undo when the bench's stage changed, but keeps it when the stage is the same
   * at another test frequency {@code hz} (the same case, retuned): unless undoing would bring back
   * an AC reading taken at another frequency (the diagnosis judges every AC reading at the stage's
   * one test frequency); then the reading stays struck and the undo is forgotten.
   */
  void stageChanged(boolean retuned, double hz) {
    if (!retuned
        || undoBrings.stream().anyMatch(r -> r.kind() == Reading.Kind.AC && r.hz() != hz)) {
      forgetUndo();
    }
  }

  /** Strikes out a standing reading: the diagnosis leaves it out from now on. */
  void strike(Reading reading) {
    if (!knownOrSay(reading)) {
      return;
    }
    String what = describe(reading);
    revise(
        List.of(reading),
        List.of(),
        null,
        "Struck out " + what + ".",
        () -> revise(List.of(), List.of(reading), null, "", null, null),
        null);
  }

  /** Makes a struck reading stand again. */
  void restore(Reading reading) {
    if (!knownOrSay(reading)) {
      return;
    }
    String what = describe(reading);
    revise(
        List.of(),
        List.of(reading),
        null,
        "Restored " + what + ".",
        () -> revise(List.of(reading), List.of(), null, "", null, null),
        null);
  }

  /** Starts correcting a standing reading: the next reading added replaces it. */
  void startCorrection(Reading reading) {
    if (knownOrSay(reading)) {
      correcting.set(reading);
    }
  }

  /** Stops correcting without changing anything. */
  void cancelCorrection() {
    correcting.set(null);
  }

  /**
   * Replaces the reading being corrected by {@code right}: the old one is struck out and the right
   * one added, in one transaction.
   *
   * @param onFailure called with nothing when the store refused (the caller gives the typed text
   *     back to the pad)
   */
  void finishCorrection(Reading right, Consumer<Void> onFailure) {
    Reading wrong = correcting.get();
    correcting.set(null);
    String what =
        describe(wrong)
            + " → "
            + (right.kind() == Reading.Kind.OHMS
                ? Words.ohms(right.value())
                : Words.measured(right.value()));
    revise(
        List.of(wrong),
        List.of(),
        right,
        "Corrected " + what + ".",
        () -> revise(List.of(right), List.of(wrong), null, "", null, null),
        onFailure);
  }

  /**
   * Stores a reading just added to the bench with the suspect list of every reading that stands, in
   * the background; on refusal takes it off the bench again and says why.
   *
   * @param done called when the work ends, either way
   * @param refused called after a refusal (the caller gives the typed text back to the pad)
   */
  void add(Stage stage, Reading added, Runnable done, Runnable refused) {
    List<Reading> taken = List.copyOf(bench.readings());
    String caseId = bench.openCaseProperty().get().id();
    Diagnoser ready = readyDiagnoser.apply(stage);
    BoardModel boardModel = bench.boardModelProperty().get();
    Casework casework = bench.casework();
    boolean mains = bench.mainsPoweredProperty().get();
    bench
        .tasks()
        .run(
            "Ranking the suspects",
            () -> {
              Diagnoser d =
                  ready != null ? ready : casework.diagnoser(stage, boardModel).mainsPowered(mains);
              return casework.addReadings(
                  caseId,
                  d,
                  new ReadingSet(MeterSpec.DEFAULT, taken),
                  List.of(added),
                  Diagnoser.DEFAULT_TOP);
            },
            stored -> {
              done.run();
              bench.rememberId(added, stored.readings().get(0).id());
              if (bench.stageProperty().get() == stage) {
                bench.diagnosisProperty().set(stored.diagnosis());
                refreshed.run();
              }
            },
            e -> {
              done.run();
              removeByIdentity(bench.readings(), added);
              refused.run();
              refreshed.run();
              bench
                  .problems()
                  .failed(
                      "Could not take this reading",
                      e,
                      "Check that the probe point belongs to this stage and the value is what the"
                          + " meter shows, then add it again.");
            });
  }

  /** Undoes the last strike, restore or correction. */
  void undo() {
    Runnable last = undo;
    forgetUndo();
    if (last != null) {
      last.run();
    }
  }

  private boolean knownOrSay(Reading reading) {
    if (busy.value || bench.readingId(reading).isEmpty()) {
      bench
          .problems()
          .show(
              "Still storing",
              "This reading is still being stored in the history.",
              "Wait a moment and tap it again.");
      return false;
    }
    return true;
  }

  /** Returns a reading in a few words: "U1 pin 8 1.190 V", "SUM to OUT 46.8 kΩ (power off)". */
  static String describe(Reading r) {
    if (r.kind() == Reading.Kind.OHMS) {
      return Words.pin(r.at()) + " to " + Words.pin(r.to()) + " " + Words.ohms(r.value());
    }
    return Words.pin(r.at())
        + " "
        + Words.measured(r.value())
        + (r.kind() == Reading.Kind.AC ? " AC" : "");
  }

  /**
   * Moves readings between the bench's standing and struck lists at once, then stores the change
   * and the diagnosis of what stands in the background; on refusal moves them back.
   */
  private void revise(
      List<Reading> strike,
      List<Reading> restore,
      Reading added,
      String doneText,
      Runnable undoIt,
      Consumer<Void> onFailure) {
    Stage stage = bench.stageProperty().get();
    if (bench.openCaseProperty().get() == null || stage == null) {
      return;
    }
    String caseId = bench.openCaseProperty().get().id();
    List<Reading> standingBefore = List.copyOf(bench.readings());
    List<Bench.StruckReading> struckBefore = List.copyOf(bench.struckReadings());
    List<String> strikeIds = new ArrayList<>();
    for (Reading r : strike) {
      String id = bench.readingId(r).orElseThrow();
      strikeIds.add(id);
      removeByIdentity(bench.readings(), r);
      bench.struckReadings().add(new Bench.StruckReading(r, id, null));
    }
    List<String> restoreIds = new ArrayList<>();
    for (Reading r : restore) {
      restoreIds.add(bench.readingId(r).orElseThrow());
      bench.struckReadings().removeIf(s -> s.reading() == r);
      bench.readings().add(r);
    }
    if (added != null) {
      bench.readings().add(added);
    }
    List<Reading> standing = List.copyOf(bench.readings());
    Diagnoser ready = readyDiagnoser.apply(stage);
    BoardModel boardModel = bench.boardModelProperty().get();
    Casework casework = bench.casework();
    boolean mains = bench.mainsPoweredProperty().get();
    busy.value = true;
    refreshed.run();
    bench
        .tasks()
        .run(
            added == null ? "Striking out the reading" : "Correcting the reading",
            () -> {
              Diagnoser d =
                  ready != null ? ready : casework.diagnoser(stage, boardModel).mainsPowered(mains);
              return casework.reviseReadings(
                  caseId,
                  d,
                  new ReadingSet(MeterSpec.DEFAULT, standing),
                  strikeIds,
                  restoreIds,
                  added == null ? List.of() : List.of(added),
                  Diagnoser.DEFAULT_TOP);
            },
            (RevisedReadings done) -> {
              busy.value = false;
              for (StoredReading changed : done.changed()) {
                if (changed.struck()) {
                  bench
                      .struckReadings()
                      .replaceAll(
                          s ->
                              s.id().equals(changed.id())
                                  ? new Bench.StruckReading(s.reading(), s.id(), changed.struckAt())
                                  : s);
                }
              }
              if (added != null) {
                bench.rememberId(added, done.added().get(0).id());
              }
              if (bench.stageProperty().get() == stage) {
                bench.diagnosisProperty().set(done.diagnosis());
              }
              if (undoIt != null) {
                undo = undoIt;
                undoBrings = List.copyOf(strike);
                undoText.set(doneText);
              }
              refreshed.run();
            },
            e -> {
              busy.value = false;
              // Put the bench back as it was: nothing the technician did is half done.
              bench.readings().setAll(standingBefore);
              bench.struckReadings().setAll(struckBefore);
              if (added != null && onFailure != null) {
                onFailure.accept(null);
              }
              refreshed.run();
              bench
                  .problems()
                  .failed(
                      "Could not change the readings",
                      e,
                      "Nothing was changed. Check the history file, then try again.");
            });
  }

  private static void removeByIdentity(List<Reading> list, Reading r) {
    for (int i = 0; i < list.size(); i++) {
      if (list.get(i) == r) {
        list.remove(i);
        return;
      }
    }
  }

  /** A flag the background work's completion clears (always on the screen's thread). */
  private static final class BooleanHolder {
    boolean value;
  }
}
