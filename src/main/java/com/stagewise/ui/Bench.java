package com.stagewise.ui;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import java.time.Instant;
import java.util.ArrayList;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import javafx.beans.binding.Bindings;
import javafx.beans.binding.BooleanBinding;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * What the bench is working on right now: the unit, its open case, the stage, the readings taken
 * and the latest diagnosis, and the screen shown. Every screen's view model shares one bench.
 *
 * <p>Plain Java with JavaFX properties (no nodes); it changes only on the screen's thread.
 */
public final class Bench {
  private final HistoryStore store;
  private final Casework casework;
  private final Tasks tasks;
  private final Problems problems;
  private final Caution caution;
  private final java.util.Set<String> cautionedCases = new java.util.HashSet<>();
  private final BoardFlags boardFlags;
  private final CaseResume resume;
  private FilePicker files = FilePicker.NONE;
  private final BooleanProperty largeText = new SimpleBooleanProperty(false);
  private final BooleanProperty highContrast = new SimpleBooleanProperty(false);

  private final ObjectProperty<Step> step = new SimpleObjectProperty<>(Step.UNIT);
  private final ObjectProperty<Unit> unit = new SimpleObjectProperty<>();
  private final ObjectProperty<BoardModel> boardModel = new SimpleObjectProperty<>();
  private final BooleanProperty mainsPowered = new SimpleBooleanProperty();
  private final ObjectProperty<RepairCase> openCase = new SimpleObjectProperty<>();
  private final ObjectProperty<Stage> stage = new SimpleObjectProperty<>();
  private final ObservableList<Reading> readings = FXCollections.observableArrayList();
  private final ObservableList<StruckReading> struckReadings = FXCollections.observableArrayList();
  // By identity: two readings of the same value at the same point are still two readings.
  private final Map<Reading, String> readingIds = new IdentityHashMap<>();
  private final ObjectProperty<Diagnosis> diagnosis = new SimpleObjectProperty<>();

  /**
   * Creates a bench.
   *
   * @param store the shop's history
   * @param tasks runs slow work off the screen's thread
   * @param problems shows problems to the technician
   * @param caution shows the safety caution
   * @param boardFlags which board models are mains-powered
   * @param resume keeps where an open case was left
   */
  public Bench(
      HistoryStore store,
      Tasks tasks,
      Problems problems,
      Caution caution,
      BoardFlags boardFlags,
      CaseResume resume) {
    this.store = Objects.requireNonNull(store, "store");
    this.casework = new Casework(store);
    this.tasks = Objects.requireNonNull(tasks, "tasks");
    this.problems = Objects.requireNonNull(problems, "problems");
    this.caution = Objects.requireNonNull(caution, "caution");
    this.boardFlags = Objects.requireNonNull(boardFlags, "boardFlags");
    this.resume = Objects.requireNonNull(resume, "resume");
  }

  /** Returns the shop's history, for reading; changes to a case go through {@link #casework()}. */
  public HistoryStore store() {
    return store;
  }

  /** Returns the case workflow: every change to a unit or a case goes through it. */
  public Casework casework() {
    return casework;
  }

  /** Whether the screens show larger text (a setting the app keeps between starts). */
  public BooleanProperty largeTextProperty() {
    return largeText;
  }

  /** Whether the screens show high contrast (a setting the app keeps between starts). */
  public BooleanProperty highContrastProperty() {
    return highContrast;
  }

  /** Returns where the technician chooses files to save. */
  public FilePicker files() {
    return files;
  }

  /** Sets where the technician chooses files to save (the app's chooser; a fixed one in tests). */
  public void setFiles(FilePicker picker) {
    this.files = Objects.requireNonNull(picker, "picker");
  }

  public Tasks tasks() {
    return tasks;
  }

  public Problems problems() {
    return problems;
  }

  /**
   * Returns whether the mains caution has been shown for this case since the app started, and marks
   * it shown. The caution comes once per case and session: opening the case brings it, going back
   * to the case later the same day does not; the next start of the app brings it again.
   */
  public boolean firstCautionFor(String caseId) {
    return cautionedCases.add(caseId);
  }

  public Caution caution() {
    return caution;
  }

  public BoardFlags boardFlags() {
    return boardFlags;
  }

  public CaseResume resume() {
    return resume;
  }

  public ObjectProperty<Step> stepProperty() {
    return step;
  }

  public ObjectProperty<Unit> unitProperty() {
    return unit;
  }

  public ObjectProperty<BoardModel> boardModelProperty() {
    return boardModel;
  }

  public BooleanProperty mainsPoweredProperty() {
    return mainsPowered;
  }

  public ObjectProperty<RepairCase> openCaseProperty() {
    return openCase;
  }

  public ObjectProperty<Stage> stageProperty() {
    return stage;
  }

  /** Returns the readings of the case that stand (the diagnosis uses exactly these). */
  public ObservableList<Reading> readings() {
    return readings;
  }

  /**
   * A reading struck out: it is kept in the history, marked, and left out of the diagnosis.
   *
   * @param reading the reading as taken
   * @param id its id in the history
   * @param struckAt when it was struck out, or null while the strike is being stored
   */
  public record StruckReading(Reading reading, String id, Instant struckAt) {}

  /** Returns the case's readings that were struck out, in the order they were struck. */
  public ObservableList<StruckReading> struckReadings() {
    return struckReadings;
  }

  /** Returns the history's id of a reading on the bench (the very object), once it is stored. */
  public Optional<String> readingId(Reading reading) {
    return Optional.ofNullable(readingIds.get(reading));
  }

  /** Records the history's id of a reading on the bench. */
  public void rememberId(Reading reading, String id) {
    readingIds.put(reading, Objects.requireNonNull(id, "id"));
  }

  public ObjectProperty<Diagnosis> diagnosisProperty() {
    return diagnosis;
  }

  /** Returns true while a case is open on the bench. */
  public BooleanBinding hasCase() {
    return Bindings.isNotNull(openCase);
  }

  /** Returns true once a stage is chosen for the open case. */
  public BooleanBinding hasStage() {
    return Bindings.isNotNull(openCase).and(Bindings.isNotNull(stage));
  }

  /**
   * Moves to a screen. A screen of a case is refused while no case is open (the step stays), and
   * readings and suspects need a stage.
   *
   * @return whether the screen changed
   */
  public boolean go(Step target) {
    if (target.needsCase() && openCase.get() == null) {
      return false;
    }
    if ((target == Step.READINGS || target == Step.SUSPECTS) && stage.get() == null) {
      return false;
    }
    step.set(target);
    if (openCase.get() != null && target.needsCase()) {
      resume.saveStep(openCase.get().id(), target);
    }
    return true;
  }

  /** Puts a unit and its board model on the bench, without a case. */
  public void showUnit(Unit newUnit, BoardModel model) {
    if (unit.get() == null || !unit.get().id().equals(newUnit.id())) {
      clearCase();
    }
    boardModel.set(model);
    mainsPowered.set(boardFlags.isMainsPowered(model.id()));
    unit.set(newUnit);
  }

  /** Starts working on a case of the unit on the bench, with no stage and no readings yet. */
  public void startCase(RepairCase repairCase) {
    clearCase();
    openCase.set(repairCase);
  }

  /**
   * Puts a case's readings as the history holds them on the bench, in place of the readings it
   * held: standing ones for the diagnosis, struck ones marked, each with its id. A reading at a
   * point that {@code stage} does not have (taken on another stage, say) is left off the bench and
   * returned, so that the technician can be told; it stays in the history.
   *
   * <p>Call it before the stage arrives on the bench: the stage's arrival starts the diagnosis of
   * the readings on it.
   *
   * @param stored the case's readings, in the order taken
   * @param stage the stage they are read on
   * @return the readings left off, in the order taken (empty when all fit)
   */
  public List<StoredReading> takeReadings(List<StoredReading> stored, Stage stage) {
    readings.clear();
    struckReadings.clear();
    readingIds.clear();
    diagnosis.set(null);
    List<StoredReading> leftOff = new ArrayList<>();
    List<Reading> standing = new ArrayList<>();
    for (StoredReading s : stored) {
      Reading reading = s.reading();
      if (!Casework.fits(stage, reading)) {
        leftOff.add(s);
        continue;
      }
      readingIds.put(reading, s.id());
      if (s.struck()) {
        struckReadings.add(new StruckReading(reading, s.id(), s.struckAt()));
      } else {
        standing.add(reading);
      }
    }
    readings.setAll(standing);
    return leftOff;
  }

  /** Clears the case, stage, readings and diagnosis from the bench (the unit stays). */
  public void clearCase() {
    openCase.set(null);
    stage.set(null);
    readings.clear();
    struckReadings.clear();
    readingIds.clear();
    diagnosis.set(null);
  }
}
