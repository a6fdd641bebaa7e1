package com.stagewise.ui.start;

import com.stagewise.history.CaseFile;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.UnitMatch;
import com.stagewise.history.UnitQuery;
import com.stagewise.history.Units;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import com.stagewise.ui.Bench;
import com.stagewise.ui.CaseResume;
import com.stagewise.ui.ReadingsLeftOff;
import com.stagewise.ui.SafetyCaution;
import com.stagewise.ui.Step;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The unit screen: find a unit by its serial (or add one), see its history at a glance, and open a
 * case with the reported symptom or resume an open one.
 */
public final class StartViewModel {
  /** The most units listed for one search. */
  static final int MAX_MATCHES = 30;

  /** The serial (normalised) of the last search, explicit or as typed. */
  private String lastWanted;

  /** Whether the list of matches is being replaced (its selection then means nothing). */
  private boolean refreshing;

  private final Bench bench;
  private final StringProperty serial = new SimpleStringProperty("");
  private final ObservableList<UnitRow> matches = FXCollections.observableArrayList();
  private final StringProperty matchesNote = new SimpleStringProperty("");
  private final ObjectProperty<UnitHistory> selected = new SimpleObjectProperty<>();
  private final ObjectProperty<UnitRow> onlyMatch = new SimpleObjectProperty<>();
  private final StringProperty onlyMatchText = new SimpleStringProperty("");
  private final ObservableList<CaseLine> glance = FXCollections.observableArrayList();
  private final StringProperty symptom = new SimpleStringProperty("");
  private final ObservableList<String> boardModelNames = FXCollections.observableArrayList();
  private final StringProperty newSerial = new SimpleStringProperty("");
  private final StringProperty newBoardModel = new SimpleStringProperty("");
  private final StringProperty newOwner = new SimpleStringProperty("");
  private final BooleanProperty newMains = new SimpleBooleanProperty(false);

  /** Whether the screens show larger text (kept between starts). */
  public BooleanProperty largeTextProperty() {
    return bench.largeTextProperty();
  }

  /** Whether the screens show high contrast (kept between starts). */
  public BooleanProperty highContrastProperty() {
    return bench.highContrastProperty();
  }

  /** Creates the unit screen's model on a bench. */
  public StartViewModel(Bench bench) {
    this.bench = bench;
    // The command line or another bench may have changed the unit's cases meanwhile.
    bench
        .stepProperty()
        .addListener(
            (o, was, now) -> {
              if (now == Step.UNIT && was != Step.UNIT) {
                refreshSelected();
              }
            });
  }

  /**
   * A unit found by a search.
   *
   * @param unit the unit
   * @param boardModel its board model's name
   * @param openCases how many of its cases are open
   */
  public record UnitRow(Unit unit, String boardModel, int openCases) {
    /** Returns the row as one line of text. */
    public String line() {
      return unit.serial() + "  —  " + boardModel + (openCases > 0 ? "  (case open)" : "");
    }
  }

  /**
   * One earlier case of the selected unit, for the glance.
   *
   * @param caseId the case's id
   * @param opened when it was opened, as a date
   * @param symptom the reported symptom
   * @param outcome "open", or how it ended
   * @param faults the faults found, comma-separated (may be empty)
   * @param replaced the parts replaced with their new values, comma-separated (may be empty)
   * @param open whether the case is still open
   */
  public record CaseLine(
      String caseId,
      String opened,
      String symptom,
      String outcome,
      String faults,
      String replaced,
      boolean open) {}

  public StringProperty serialProperty() {
    return serial;
  }

  public ObservableList<UnitRow> matches() {
    return matches;
  }

  public StringProperty matchesNoteProperty() {
    return matchesNote;
  }

  public ObjectProperty<UnitHistory> selectedProperty() {
    return selected;
  }

  /**
   * Returns the one unit the last search found while it is not yet the unit shown (null otherwise):
   * the screen offers it to open with one tap. A search as typed never opens it by itself, so
   * nothing moves while the technician is still typing.
   */
  public ObjectProperty<UnitRow> onlyMatchProperty() {
    return onlyMatch;
  }

  /** Returns the words of the button that opens the one unit found ("Open TA-1001"), or empty. */
  public StringProperty onlyMatchTextProperty() {
    return onlyMatchText;
  }

  /** Shows the one unit the last search found (the big button, or Enter in the serial field). */
  public void openOnlyMatch() {
    UnitRow row = onlyMatch.get();
    if (row != null) {
      select(row);
    }
  }

  private void offer(UnitRow row) {
    UnitHistory shown = selected.get();
    boolean isShown = row != null && shown != null && shown.unit().id().equals(row.unit().id());
    onlyMatch.set(isShown ? null : row);
    onlyMatchText.set(onlyMatch.get() == null ? "" : "Open " + row.unit().serial());
  }

  public ObservableList<CaseLine> glance() {
    return glance;
  }

  public StringProperty symptomProperty() {
    return symptom;
  }

  public ObservableList<String> boardModelNames() {
    return boardModelNames;
  }

  public StringProperty newSerialProperty() {
    return newSerial;
  }

  public StringProperty newBoardModelProperty() {
    return newBoardModel;
  }

  public StringProperty newOwnerProperty() {
    return newOwner;
  }

  public BooleanProperty newMainsProperty() {
    return newMains;
  }

  /** Loads the board model names for the "add a unit" form. */
  public void loadBoardModels() {
    bench
        .tasks()
        .run(
            "Reading the board models",
            () -> bench.store().units().boardModels().stream().map(BoardModel::name).toList(),
            boardModelNames::setAll,
            e ->
                bench
                    .problems()
                    .failed("Could not read the board models", e, Words.CHECK_DATABASE));
  }

  /**
   * Lists the units whose serial contains what is typed (letter case, blanks and dashes ignored);
   * an empty search lists the units with open cases first, then the rest. A single match is put on
   * the bench.
   */
  public void search() {
    search(true);
  }

  /**
   * Lists the matches while the serial is being typed, without putting any unit on the bench: the
   * technician picks from the list, or presses Search.
   */
  public void searchAsTyped() {
    if (!normal(serial.get()).equals(lastWanted)) {
      search(false);
    }
  }

  private void search(boolean takeSingleMatch) {
    String wanted = normal(serial.get());
    lastWanted = wanted;
    bench
        .tasks()
        .run(
            "Looking for the unit",
            () -> findUnits(bench.store(), wanted),
            rows -> {
              // A list refreshed under the technician's finger selects nothing by itself.
              refreshing = true;
              try {
                matches.setAll(rows.size() > MAX_MATCHES ? rows.subList(0, MAX_MATCHES) : rows);
              } finally {
                refreshing = false;
              }
              if (rows.isEmpty()) {
                matchesNote.set(
                    wanted.isEmpty()
                        ? "No units yet. Add the first one below."
                        : "No unit has a serial like \""
                            + serial.get().strip()
                            + "\". Check it, or add the unit.");
              } else if (rows.size() > MAX_MATCHES) {
                matchesNote.set(
                    rows.size()
                        + " units match; the first "
                        + MAX_MATCHES
                        + " are shown. Type more of the serial.");
              } else {
                matchesNote.set(rows.size() == 1 ? "1 unit found." : rows.size() + " units found.");
              }
              offer(rows.size() == 1 ? rows.get(0) : null);
              if (rows.size() == 1 && takeSingleMatch) {
                select(rows.get(0));
              }
            },
            e -> bench.problems().failed("Could not search the units", e, Words.CHECK_DATABASE));
  }

  private static List<UnitRow> findUnits(HistoryStore store, String wanted) {
    // One query: exact serials first, then units with a case open, then by serial.
    List<UnitRow> rows = new ArrayList<>();
    for (UnitMatch match : store.units().search(UnitQuery.serialLike(wanted))) {
      rows.add(new UnitRow(match.unit(), match.boardModel(), match.openCases()));
    }
    return rows;
  }

  static String normal(String text) {
    return UnitQuery.normal(text);
  }

  /** Shows one unit's history at a glance and puts it on the bench. */
  public void select(UnitRow row) {
    if (refreshing) {
      return;
    }
    bench
        .tasks()
        .run(
            "Reading the unit's history",
            () -> bench.store().cases().unitHistory(row.unit().id()).orElseThrow(),
            history -> {
              selected.set(history);
              glance.setAll(Glance.of(history));
              bench.showUnit(history.unit(), history.boardModel());
              offer(onlyMatch.get());
            },
            e ->
                bench
                    .problems()
                    .failed("Could not read the unit's history", e, Words.CHECK_DATABASE));
  }

  /**
   * Adds a unit (and its board model if new) and selects it.
   *
   * <p>The serial and the board model are needed; a problem says so when they are missing.
   */
  public void addUnit() {
    String serialText = newSerial.get() == null ? "" : newSerial.get().strip();
    String modelText = newBoardModel.get() == null ? "" : newBoardModel.get().strip();
    if (serialText.isEmpty() || modelText.isEmpty()) {
      bench
          .problems()
          .show(
              "The unit needs a serial and a board model",
              "A unit is known by its serial number and the board model it is built to.",
              "Type the serial as written on the unit, and choose or type the board model.");
      return;
    }
    String owner = newOwner.get() == null ? "" : newOwner.get().strip();
    boolean mains = newMains.get();
    bench
        .tasks()
        .run(
            "Adding the unit",
            () -> {
              Units.AddedUnit added = bench.casework().addUnit(serialText, modelText, owner);
              if (mains) {
                bench.boardFlags().setMainsPowered(added.boardModel().id(), true);
              }
              return new UnitRow(added.unit(), added.boardModel().name(), 0);
            },
            row -> {
              newSerial.set("");
              newOwner.set("");
              newMains.set(false);
              serial.set(row.unit().serial());
              matches.setAll(List.of(row));
              matchesNote.set("Unit added.");
              select(row);
              loadBoardModels();
            },
            e ->
                bench
                    .problems()
                    .failed(
                        "Could not add the unit",
                        e,
                        "Check the serial and the board model, then try again."));
  }

  /** Opens a case for the selected unit with the typed symptom and moves on to the stage. */
  public void openCase() {
    UnitHistory history = selected.get();
    if (history == null) {
      bench
          .problems()
          .show(
              "Choose a unit first",
              "No unit is chosen.",
              "Find the unit by its serial, or add it.");
      return;
    }
    String text = symptom.get() == null ? "" : symptom.get().strip();
    if (text.isEmpty()) {
      bench
          .problems()
          .show(
              "Say what is wrong",
              "A case starts with the symptom as the owner reported it.",
              "Type the symptom, e.g. \"no sound from left channel\".");
      return;
    }
    bench
        .tasks()
        .run(
            "Opening the case",
            () -> bench.casework().openCase(history.unit().id(), text),
            opened -> {
              symptom.set("");
              bench.showUnit(history.unit(), history.boardModel());
              bench.startCase(opened);
              afterCaution(opened.id(), () -> bench.go(Step.STAGE));
            },
            e -> bench.problems().failed("Could not open the case", e, Words.CHECK_DATABASE));
  }

  /**
   * Resumes an open case of the selected unit where it was left. The case, its readings (struck
   * ones marked) and its stage are read from the history as it is now, whoever wrote them (this
   * bench, the command line, another bench through the shop server): the stage as it was left on
   * this bench if it was, else the stage version the case is diagnosed with. Readings taken at
   * points that stage lacks stay in the history and are named in a problem.
   */
  public void resumeCase(String caseId) {
    UnitHistory history = selected.get();
    if (history == null) {
      return;
    }
    CaseResume resume = bench.resume();
    bench
        .tasks()
        .run(
            "Resuming the case",
            () -> Resumed.read(bench, history.unit().id(), caseId, resume),
            resumed -> {
              selected.set(resumed.history());
              glance.setAll(Glance.of(resumed.history()));
              Optional<CaseFile> file = resumed.file();
              if (file.isEmpty() || file.get().repairCase().status() != CaseStatus.OPEN) {
                bench
                    .problems()
                    .show(
                        "This case is closed",
                        "Only an open case can be resumed.",
                        "Open a new case for the unit.");
                return;
              }
              bench.showUnit(resumed.history().unit(), resumed.history().boardModel());
              bench.startCase(file.get().repairCase());
              List<StoredReading> leftOff = List.of();
              if (resumed.stage().isPresent()) {
                // Readings first: the stage's arrival starts the diagnosis of what is on the bench.
                leftOff = bench.takeReadings(file.get().readings(), resumed.stage().get());
                bench.stageProperty().set(resumed.stage().get());
              }
              Step target = resumed.step();
              List<StoredReading> notShown = leftOff;
              afterCaution(
                  caseId,
                  () -> {
                    if (!bench.go(target)) {
                      bench.go(Step.STAGE);
                    }
                    ReadingsLeftOff.tell(bench.problems(), notShown);
                  });
            },
            e -> bench.problems().failed("Could not resume the case", e, Words.CHECK_DATABASE));
  }

  /** Reads the unit's history again when the unit screen comes back, so that it shows the store. */
  private void refreshSelected() {
    UnitHistory history = selected.get();
    if (history == null) {
      return;
    }
    String unitId = history.unit().id();
    bench
        .tasks()
        .run(
            "Reading the unit's history",
            () -> bench.store().cases().unitHistory(unitId),
            fresh -> {
              if (fresh.isPresent()
                  && selected.get() != null
                  && selected.get().unit().id().equals(unitId)) {
                selected.set(fresh.get());
                glance.setAll(Glance.of(fresh.get()));
              }
            },
            e ->
                bench
                    .problems()
                    .failed("Could not read the unit's history", e, Words.CHECK_DATABASE));
  }

  private void afterCaution(String caseId, Runnable then) {
    if (bench.mainsPoweredProperty().get() && bench.firstCautionFor(caseId)) {
      bench.caution().show(SafetyCaution.Reason.MAINS, then);
    } else {
      then.run();
    }
  }
}
