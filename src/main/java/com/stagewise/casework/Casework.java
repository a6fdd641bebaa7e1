package com.stagewise.casework;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingRules;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.history.Cases;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.ShopMemory;
import com.stagewise.history.StageLibrary;
import com.stagewise.history.Units;
import com.stagewise.history.demo.DemoHistory;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import com.stagewise.interchange.StageSheet;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * What a technician does to a case, for the app and the command line alike: each method checks all
 * it is given, then writes in one transaction of the shop's history (all of it or nothing).
 *
 * <p>Bad input (an empty serial, a bad stage sheet, a note over the limits, an unknown case) is an
 * {@link InvalidInputException} that names the source, the field and what was expected; trouble
 * with the file is a {@code StorageException}. Either way the history is left as it was.
 *
 * <p>Safe to use from several threads as far as the history is (its calls run one at a time); the
 * diagnosis runs in the caller's thread, so a screen calls these methods off its own thread.
 */
public final class Casework {
  private final HistoryStore store;
  private final Clock clock;
  private final ModelStages stages;

  /** Creates the workflow on a shop's history, taking times from the system clock (UTC). */
  public Casework(HistoryStore store) {
    this(store, Clock.systemUTC());
  }

  /** Creates the workflow on a shop's history, taking times from {@code clock}. */
  public Casework(HistoryStore store, Clock clock) {
    this(store, clock, defaultWho());
  }

  /**
   * Creates the workflow on a shop's history, taking times from {@code clock} and naming {@code
   * who} as the one who saved the stage versions it saves.
   */
  public Casework(HistoryStore store, Clock clock, String who) {
    this.store = Objects.requireNonNull(store, "store");
    this.clock = Objects.requireNonNull(clock, "clock");
    this.stages = new ModelStages(store, who);
  }

  /**
   * Returns who saves stage versions when nobody is named: the {@code stagewise.technician} system
   * property, else the name the computer's user logged in with.
   */
  public static String defaultWho() {
    String named = System.getProperty("stagewise.technician", "").strip();
    String who = named.isEmpty() ? System.getProperty("user.name", "").strip() : named;
    return who.length() > 40 ? who.substring(0, 40) : who;
  }

  /** Returns the board models' library stages, in versions. */
  public ModelStages library() {
    return stages;
  }

  /** Returns the history this workflow writes to (for reading). */
  public HistoryStore history() {
    return store;
  }

  /**
   * Returns the version of this program as stored with every suspect list and printed on reports:
   * the jar's version, or {@code development build} when run from the classes.
   */
  public static String version() {
    String version = Casework.class.getPackage().getImplementationVersion();
    return version == null || version.isBlank() ? "development build" : version;
  }

  // ---- board models and units -------------------------------------------------------------------

  /**
   * Returns the board model named {@code name} (adding it if new) with the stage sheets in {@code
   * stageFiles} added to its library. Every sheet is read and checked first: one bad sheet adds
   * nothing at all.
   *
   * @throws InvalidInputException if a file cannot be read or is not a valid stage sheet (the
   *     message names the file), or the name is empty
   */
  public BoardModel addBoardModel(String name, String maker, List<Path> stageFiles) {
    List<StageLibrary.SheetDraft> sheets = new ArrayList<>();
    for (Path file : stageFiles) {
      String text = readText(file);
      Stage stage = StageSheet.read(text, file.toString());
      String title =
          stage.title().isBlank() ? String.valueOf(file.getFileName()) : stage.title().strip();
      sheets.add(new StageLibrary.SheetDraft(title, text));
    }
    return store.library().addBoardModel(name, maker, sheets);
  }

  /**
   * Adds a unit of the board model {@code boardModel} (its name or id; a new name adds the board
   * model too, in the same transaction).
   *
   * @throws InvalidInputException if the serial or the board model is empty, or the board model
   *     already has a unit with this serial: nothing is added then
   */
  public Units.AddedUnit addUnit(String serial, String boardModel, String owner) {
    return store.units().addWithModel(serial, boardModel, owner);
  }

  // ---- opening a case and finding it again ------------------------------------------------------

  /** Opens a case for a unit with the symptom as reported, and returns it. */
  public RepairCase openCase(String unitId, String symptom) {
    return store.cases().open(unitId, symptom);
  }

  /**
   * Returns the case whose id is or starts with {@code idOrPrefix} (4 or more characters), with its
   * unit and board model.
   *
   * @throws InvalidInputException if no case or more than one case matches
   */
  public CaseAtHand caseAtHand(String idOrPrefix) {
    String id = store.cases().resolveId(idOrPrefix);
    RepairCase repairCase = store.cases().find(id).orElseThrow();
    Unit unit = store.units().find(repairCase.unitId()).orElseThrow();
    BoardModel model = store.units().findBoardModel(unit.boardModelId()).orElseThrow();
    return new CaseAtHand(repairCase, unit, model);
  }

  // ---- the stage --------------------------------------------------------------------------------

  /**
   * Returns the latest version of each stage of a board model's library, the one saved most
   * recently first (see {@link ModelStages#latest}).
   *
   * @throws InvalidInputException if a stored sheet is no longer a valid stage sheet (the message
   *     names its title and the board model)
   */
  public List<LibraryStage> stageLibrary(BoardModel model) {
    return stages.latest(model);
  }

  /**
   * Returns the stage of the board model's library to use for a case, its latest version: the one
   * titled {@code title} (ignoring letter case), or for a null title the only one the library has.
   *
   * @throws InvalidInputException if the library has no such stage, or several and no title says
   *     which (the message lists the titles)
   */
  public LibraryStage storedStage(BoardModel model, String title) {
    List<LibraryStage> latest = stages.latest(model);
    List<LibraryStage> chosen =
        title == null
            ? latest
            : latest.stream()
                .filter(s -> s.sheet().title().equalsIgnoreCase(title.strip()))
                .toList();
    if (chosen.size() == 1) {
      return chosen.get(0);
    }
    String library = "stage library of " + model.name();
    if (chosen.isEmpty()) {
      throw new InvalidInputException(
          library,
          "stage",
          latest.isEmpty()
              ? "board model " + model.name() + " has no stored stage sheet"
              : "no stage sheet is titled '" + title + "'; the titles are " + titles(latest));
    }
    throw new InvalidInputException(
        library,
        "stage",
        "board model "
            + model.name()
            + " has several stage sheets; name one by its title: "
            + titles(chosen));
  }

  /**
   * Adds a stage (built on the bench, e.g. from a template) to the board model's library as a
   * version of its stage, so that the next unit of the model finds it (nothing is added when a
   * version with the same parts, nets and values is kept already).
   */
  public StageSheetRecord addToLibrary(BoardModel model, Stage stage) {
    return stages.save(model, stage).sheet();
  }

  // ---- readings and the diagnosis ---------------------------------------------------------------

  /**
   * Returns the shop's counts for a board model: how many of its fixed cases confirmed each fault
   * (empty for none, or a null model).
   */
  public Map<String, Integer> shopCounts(BoardModel model) {
    return model == null ? Map.of() : new ShopMemory(store).faultCounts(model.id());
  }

  /** Returns the diagnosis of a stage with the shop's counts for the board model in its priors. */
  public Diagnoser diagnoser(Stage stage, BoardModel model) {
    return Diagnoser.of(stage, shopCounts(model));
  }

  /**
   * Returns the readings of a case that still stand (not struck out) and that {@code stage} has
   * points for, in the order they were taken, whoever took them (the app, the command line, another
   * bench): what a further reading is diagnosed together with.
   */
  public List<Reading> standingReadings(String caseId, Stage stage) {
    List<Reading> standing = new ArrayList<>();
    for (StoredReading s :
        store.cases().caseFile(caseId).map(f -> f.readings()).orElse(List.of())) {
      Reading r = s.reading();
      if (!s.struck() && fits(stage, r)) {
        standing.add(r);
      }
    }
    return standing;
  }

  /**
   * Tells whether {@code stage} has the point (and the second point of an ohms reading) that a
   * stored reading was taken at; a reading it lacks stays in the history but joins no diagnosis on
   * this stage.
   */
  public static boolean fits(Stage stage, Reading reading) {
    return ReadingRules.testPointProblem(stage, reading.at()).isEmpty()
        && (reading.to().isEmpty() || ReadingRules.testPointProblem(stage, reading.to()).isEmpty());
  }

  /**
   * Adds every reading of {@code set} to a case, with the suspect list they give, in one
   * transaction.
   *
   * @param top the most suspects to keep, 1 or more
   * @throws InvalidInputException if a reading does not fit the stage, or the case is unknown:
   *     nothing is stored then
   */
  public StoredReadings addReadings(String caseId, Diagnoser diagnoser, ReadingSet set, int top) {
    return addReadings(caseId, diagnoser, set, set.readings(), top);
  }

  /**
   * Adds the readings {@code added} to a case and stores the suspect list that all readings taken
   * so far ({@code taken}, which holds the added ones too) give, in one transaction. The readings
   * are stored with the meter of {@code taken}.
   *
   * @param top the most suspects to keep, 1 or more
   * @throws InvalidInputException if a reading does not fit the stage, or the case is unknown:
   *     nothing is stored then
   */
  public StoredReadings addReadings(
      String caseId, Diagnoser diagnoser, ReadingSet taken, List<Reading> added, int top) {
    Diagnosis diagnosis = diagnoser.diagnose(taken, top);
    Instant now = clock.instant();
    List<StoredReading> readings =
        StoredText.readings(added, taken.meter(), caseId, now, diagnoser.stage());
    SuspectListRecord list = StoredText.suspectList(diagnosis, caseId, now, version());
    store.cases().addReadings(caseId, readings, list);
    return new StoredReadings(readings, list, diagnosis);
  }

  // ---- notes, actions, close-out ----------------------------------------------------------------

  /**
   * Strikes out one reading of a case, or restores it, without a new diagnosis (the command line,
   * where diagnoses come from readings files). The reading is named by its number in the case (1
   * for the first taken, as {@code history show} lists them) or by its id or the id's first
   * characters (at least 4).
   *
   * @return the reading as now stored
   * @throws InvalidInputException if the case has no such reading, or several match
   */
  public StoredReading strikeReading(String caseId, String reading, boolean restore) {
    List<StoredReading> readings =
        store.cases().caseFile(caseId).map(f -> f.readings()).orElse(List.of());
    String id = readingId(readings, reading);
    List<String> one = List.of(id);
    return store
        .cases()
        .reviseReadings(
            caseId,
            new Cases.Revision(restore ? List.of() : one, restore ? one : List.of(), List.of()),
            null)
        .get(0);
  }

  private static String readingId(List<StoredReading> readings, String reading) {
    String given = reading == null ? "" : reading.strip();
    if (given.matches("[0-9]{1,4}")) {
      int number = Integer.parseInt(given);
      if (number < 1 || number > readings.size()) {
        throw new InvalidInputException(
            "history",
            "reading",
            "the case has "
                + readings.size()
                + (readings.size() == 1 ? " reading" : " readings")
                + "; expected a number from 1 to "
                + readings.size()
                + " (as 'history show' lists them) or a reading id, not "
                + given);
      }
      return readings.get(number - 1).id();
    }
    if (given.length() < 4) {
      throw new InvalidInputException(
          "history",
          "reading",
          "expected the reading's number in the case (1, 2, …) or at least 4 characters of its"
              + " id, not '"
              + given
              + "'");
    }
    List<String> ids =
        readings.stream().map(StoredReading::id).filter(i -> i.startsWith(given)).toList();
    if (ids.size() != 1) {
      throw new InvalidInputException(
          "history",
          "reading",
          ids.isEmpty()
              ? "the case has no reading whose id starts with '" + given + "'"
              : "more than one reading's id starts with '" + given + "'; give more of the id");
    }
    return ids.get(0);
  }

  /**
   * Strikes out readings of a case, restores struck ones and adds the readings that replace them,
   * then stores the suspect list of the readings that stand, all in one transaction. Nothing is
   * deleted: a struck reading stays in the history marked with when it was struck. A correction is
   * a strike plus the right reading.
   *
   * @param standing every reading of the case that stands after the change, the added ones
   *     included; the diagnosis uses only these (none standing: no suspect list is stored)
   * @param strike ids of the readings to strike out
   * @param restore ids of struck readings to stand again
   * @param added the readings to add (the right values)
   * @throws InvalidInputException if a reading id is not one of the case's readings, or an added
   *     reading is bad; nothing is then written
   */
  public RevisedReadings reviseReadings(
      String caseId,
      Diagnoser diagnoser,
      ReadingSet standing,
      List<String> strike,
      List<String> restore,
      List<Reading> added,
      int top) {
    Diagnosis diagnosis = standing.readings().isEmpty() ? null : diagnoser.diagnose(standing, top);
    Instant now = clock.instant();
    List<StoredReading> stored =
        StoredText.readings(added, standing.meter(), caseId, now, diagnoser.stage());
    SuspectListRecord list =
        diagnosis == null ? null : StoredText.suspectList(diagnosis, caseId, now, version());
    List<StoredReading> changed =
        store.cases().reviseReadings(caseId, new Cases.Revision(strike, restore, stored), list);
    return new RevisedReadings(changed, stored, list, diagnosis);
  }

  /** Adds a time-stamped note to a case and returns it. */
  public CaseNote addNote(String caseId, String text) {
    return store.cases().addNote(caseId, text);
  }

  /** Records something done to the unit in a case (a part replaced, a reflow…) and returns it. */
  public RepairAction addAction(
      String caseId, ActionKind kind, String part, String oldValue, String newValue, String text) {
    return store.cases().addAction(caseId, kind, part, oldValue, newValue, text);
  }

  /**
   * Closes out a case with its outcome, the faults found and a closing note (none when blank or
   * null), in one transaction: if anything is refused, the case stays open and no note is added.
   */
  public RepairCase closeCase(String caseId, Outcome outcome, List<String> faults, String note) {
    return store.cases().close(caseId, new Cases.CloseOut(outcome, faults, note, List.of()));
  }

  /**
   * Attaches a photo of the board (a PNG or JPEG file of at most 20 MB) to a case, named as the one
   * who attaches it the technician of this workflow, in one transaction.
   *
   * @throws InvalidInputException naming the file when it is missing, too large or not a PNG or
   *     JPEG picture, or when the case is unknown: nothing is stored then
   */
  public CasePhoto attachPhoto(String caseId, Path file) {
    return CasePhotos.attach(store, caseId, file, stages.who());
  }

  /**
   * Stores the readings taken again after the repair, each with the healthy band of its point (see
   * {@link AfterRepair}), read with {@code meter}, in one transaction; they never enter a
   * diagnosis.
   *
   * @return the readings as stored, in the order given
   * @throws InvalidInputException if the case is unknown, or a value is not one its kind may be (a
   *     finite number of volts, an AC amplitude of 0 V or more, ohms of 0 or more or OL): nothing
   *     is stored then
   */
  public List<AfterRepairReading> addAfterRepair(
      String caseId, List<AfterRepair.Taken> taken, MeterSpec meter) {
    List<AfterRepairReading> records = AfterRepair.records(caseId, taken, meter, clock.instant());
    store.cases().addAfterRepair(caseId, records);
    return records;
  }

  // ---- the history as a whole -------------------------------------------------------------------

  /** Merges a bundle into the history, all of it or nothing (see {@code Transfer}). */
  public ImportReport importBundle(HistoryBundle bundle, String source) {
    return store.transfer().importBundle(bundle, source);
  }

  /**
   * Replaces the whole history with a backup, after saving the current one beside it.
   *
   * @return the file the previous history was saved to
   */
  public Path restoreFrom(Path backup) {
    return store.transfer().restoreFrom(backup);
  }

  /**
   * Fills an empty history with the invented demo units and cases.
   *
   * @throws InvalidInputException if the history is not empty (nothing is added then)
   */
  public ImportReport fillWithDemo() {
    if (!store.isEmpty()) {
      throw new InvalidInputException(
          store.location(),
          "",
          "the demo data goes into an empty history only; choose a new database file");
    }
    return DemoHistory.fill(store);
  }

  private static String titles(List<LibraryStage> stages) {
    return String.join(", ", stages.stream().map(s -> "'" + s.sheet().title() + "'").toList());
  }

  private static String readText(Path file) {
    try {
      return Files.readString(file, StandardCharsets.UTF_8);
    } catch (IOException | RuntimeException e) {
      throw new InvalidInputException(
          file.toString(), "", "cannot read the file as UTF-8 text: " + e.getMessage());
    }
  }
}
