package com.stagewise.ui.readings;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.Fault;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.diagnosis.SignalChain;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.history.record.BoardModel;
import com.stagewise.solver.ExpectedVolts;
import com.stagewise.ui.Bench;
import com.stagewise.ui.Step;
import com.stagewise.ui.widget.ValuePadModel;
import com.stagewise.ui.words.Words;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
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
 * The readings screen: which pin to probe next (rails first, then where the diagnosis learns most),
 * the value pad for what the meter shows, and after each reading the suspect list and the next
 * probe, computed in the background.
 */
public final class ReadingsViewModel {
  /** Suspects shown on this screen and marked on the band charts. */
  public static final int TOP = 3;

  private final Bench bench;
  private final ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.VOLTS);
  private final ObjectProperty<ProbePoint> probe = new SimpleObjectProperty<>();
  private final ObservableList<ProbePoint> testPoints = FXCollections.observableArrayList();
  private final ObservableList<ReadingRow> rows = FXCollections.observableArrayList();
  private final ObservableList<Suspect> topSuspects = FXCollections.observableArrayList();
  private final StringProperty verdict = new SimpleStringProperty("");
  private final StringProperty chain = new SimpleStringProperty("");
  private final ObjectProperty<ExpectedVolts> expected = new SimpleObjectProperty<>();
  private final BooleanProperty thinking = new SimpleBooleanProperty(false);
  private final Revisions revisions;
  private final StringProperty correctingText = new SimpleStringProperty("");
  private Diagnoser diagnoser;
  private Stage diagnoserStage;
  private boolean probeChosenByHand;

  /** Creates the readings screen's model on a bench. */
  public ReadingsViewModel(Bench bench) {
    this.bench = bench;
    this.revisions =
        new Revisions(bench, s -> diagnoserStage == s ? diagnoser : null, this::refresh);
    revisions
        .correctingProperty()
        .addListener(
            (o, was, now) ->
                correctingText.set(
                    now == null
                        ? ""
                        : "Correcting "
                            + Words.pin(now.at())
                            + " "
                            + Words.measured(now.value())
                            + ": type the right value and tap Add reading. The wrong one stays in"
                            + " the history, struck out."));
    bench.stageProperty().addListener((o, was, now) -> stageChanged(now));
    if (bench.stageProperty().get() != null) {
      stageChanged(bench.stageProperty().get());
    }
  }

  /**
   * One reading as listed, with what a healthy stage and the top suspects would read there.
   *
   * @param reading the reading
   * @param title the test point in words
   * @param healthyLow the low end of the healthy range (NaN when unknown)
   * @param healthyHigh the high end of the healthy range (NaN when unknown)
   * @param predictions where the top suspects put this reading: label to volts
   * @param struckAt when the reading was struck out (null while it stands, and while its strike is
   *     being stored: see {@link #struck()})
   * @param struck whether the reading is struck out (left out of the diagnosis)
   */
  public record ReadingRow(
      Reading reading,
      String title,
      double healthyLow,
      double healthyHigh,
      Map<String, Double> predictions,
      Instant struckAt,
      boolean struck) {
    /** Returns whether the reading lies in the healthy range (false when the range is unknown). */
    public boolean healthy() {
      return reading.value() >= healthyLow && reading.value() <= healthyHigh;
    }
  }

  public ValuePadModel pad() {
    return pad;
  }

  public ObjectProperty<ProbePoint> probeProperty() {
    return probe;
  }

  public ObservableList<ProbePoint> testPoints() {
    return testPoints;
  }

  public ObservableList<ReadingRow> rows() {
    return rows;
  }

  public ObservableList<Suspect> topSuspects() {
    return topSuspects;
  }

  /**
   * Returns what the last strike, restore or correction did ("Struck out U1 pin 8 1.190 V."), while
   * it can be undone; empty otherwise.
   */
  public StringProperty undoTextProperty() {
    return revisions.undoTextProperty();
  }

  /** Returns the line that says which reading is being corrected; empty when none is. */
  public StringProperty correctingTextProperty() {
    return correctingText;
  }

  /**
   * Strikes out a reading (a card tapped, then Strike out): it stays in the history, marked struck
   * with the time, and the diagnosis leaves it out.
   */
  public void strike(ReadingRow row) {
    if (row != null && !row.struck()) {
      revisions.strike(row.reading());
    }
  }

  /** Makes a struck reading stand again. */
  public void restore(ReadingRow row) {
    if (row != null && row.struck()) {
      revisions.restore(row.reading());
    }
  }

  /**
   * Starts correcting a reading: its point becomes the probe and its value goes on the pad; the
   * next Add reading strikes it out and adds the right value in one step.
   */
  public void correct(ReadingRow row) {
    Stage stage = bench.stageProperty().get();
    if (row == null || row.struck() || stage == null) {
      return;
    }
    Reading r = row.reading();
    revisions.startCorrection(r);
    if (revisions.correctingProperty().get() != r) {
      return;
    }
    ProbePoint.of(stage, r.at(), r.kind(), r.hz())
        .ifPresent(
            p -> {
              probeChosenByHand = true;
              probe.set(p.because("Correcting the reading taken here."));
            });
    pad.textProperty()
        .set(java.math.BigDecimal.valueOf(r.value()).stripTrailingZeros().toPlainString());
  }

  /** Stops correcting; the reading stays as it was. */
  public void cancelCorrection() {
    revisions.cancelCorrection();
    pad.textProperty().set("");
    followSuggestion();
  }

  /** Undoes the last strike, restore or correction. */
  public void undo() {
    revisions.undo();
  }

  public StringProperty verdictProperty() {
    return verdict;
  }

  /**
   * Returns where along the signal chain the top suspects sit, for a stage of several sections
   * (empty otherwise), e.g. "Along the chain: U1A › U1B › U1C ◀ R6 open › U1D › U2A".
   */
  public StringProperty chainProperty() {
    return chain;
  }

  /** Returns the chain line for a stage and its top suspects; empty for a single section. */
  static String chainLine(Stage stage, List<Suspect> suspects) {
    if (stage == null || stage.amplifiers().size() < 2 || suspects.isEmpty()) {
      return "";
    }
    SignalChain order = SignalChain.of(stage);
    java.util.Set<String> rails = new java.util.HashSet<>();
    stage.rails().forEach(r -> rails.add(r.net()));
    List<List<String>> at = new ArrayList<>();
    order.sections().forEach(s -> at.add(new ArrayList<>()));
    List<String> nowhere = new ArrayList<>();
    for (Suspect s : suspects) {
      if (s.fault().equals("healthy")) {
        continue;
      }
      Optional<Integer> position;
      try {
        position = order.position(Fault.parse(s.fault(), rails));
      } catch (InvalidInputException e) {
        position = Optional.empty();
      }
      String words = Words.fault(s.fault());
      if (position.isPresent()) {
        at.get(position.get()).add(words);
      } else {
        nowhere.add(words);
      }
    }
    StringBuilder line = new StringBuilder("Along the chain: ");
    for (int i = 0; i < order.sections().size(); i++) {
      line.append(i == 0 ? "" : " › ").append(order.sections().get(i));
      if (!at.get(i).isEmpty()) {
        line.append(" ◀ ").append(String.join(", ", at.get(i)));
      }
    }
    if (!nowhere.isEmpty()) {
      line.append(".  Not in one section: ").append(String.join(", ", nowhere));
    }
    return line.toString();
  }

  public ObjectProperty<ExpectedVolts> expectedProperty() {
    return expected;
  }

  /** Returns true while the diagnosis runs. */
  public BooleanProperty thinkingProperty() {
    return thinking;
  }

  private void stageChanged(Stage stage) {
    pad.textProperty().set("");
    revisions.forgetUndo();
    revisions.cancelCorrection();
    diagnoser = null;
    diagnoserStage = null;
    probeChosenByHand = false;
    rows.clear();
    topSuspects.clear();
    verdict.set("");
    expected.set(null);
    if (stage == null) {
      testPoints.clear();
      probe.set(null);
      return;
    }
    testPoints.setAll(ProbePoint.all(stage));
    probe.set(nextProbe(stage, bench.diagnosisProperty().get()));
    BoardModel boardModel = bench.boardModelProperty().get();
    Casework casework = bench.casework();
    boolean mains = bench.mainsPoweredProperty().get();
    List<Reading> taken = List.copyOf(bench.readings());
    bench
        .tasks()
        .run(
            "Working out the expected voltages and the fault list",
            () -> {
              ExpectedVolts volts = ExpectedVolts.of(stage);
              Diagnoser d = casework.diagnoser(stage, boardModel).mainsPowered(mains);
              Diagnosis diagnosis =
                  taken.isEmpty() ? null : d.diagnose(new ReadingSet(MeterSpec.DEFAULT, taken));
              return new Prepared(stage, volts, d, diagnosis);
            },
            prepared -> {
              if (prepared.stage() != bench.stageProperty().get()) {
                return;
              }
              expected.set(prepared.volts());
              diagnoser = prepared.diagnoser();
              diagnoserStage = prepared.stage();
              if (prepared.diagnosis() != null) {
                bench.diagnosisProperty().set(prepared.diagnosis());
              }
              refresh();
            },
            e ->
                bench
                    .problems()
                    .failed(
                        "Could not prepare the diagnosis",
                        e,
                        "Check the stage's parts and rails on the Stage screen."));
  }

  private record Prepared(
      Stage stage, ExpectedVolts volts, Diagnoser diagnoser, Diagnosis diagnosis) {}

  /**
   * Makes the technician's choice the point to probe (a pin tapped on the drawing, or from the
   * list).
   */
  public void choose(String at) {
    Stage stage = bench.stageProperty().get();
    if (stage == null) {
      return;
    }
    ProbePoint.of(stage, at, Reading.Kind.DC, 0)
        .ifPresent(
            p -> {
              probeChosenByHand = true;
              probe.set(p.because("Chosen by you."));
            });
  }

  /** Returns to the suggested probe after a hand-picked one. */
  public void followSuggestion() {
    probeChosenByHand = false;
    Stage stage = bench.stageProperty().get();
    if (stage != null) {
      probe.set(nextProbe(stage, bench.diagnosisProperty().get()));
    }
  }

  /**
   * Adds what the pad shows as a reading at the probe point, then re-ranks the suspects and picks
   * the next probe in the background, and stores both in the case.
   */
  public void addReading() {
    ProbePoint at = probe.get();
    Double value = pad.valueProperty().get();
    Stage stage = bench.stageProperty().get();
    if (at == null || stage == null) {
      bench
          .problems()
          .show(
              "Nothing to probe",
              "There is no test point chosen.",
              "Tap a pin on the package, or choose a test point from the list.");
      return;
    }
    if (value == null) {
      bench
          .problems()
          .show(
              "Type the reading first",
              "The pad shows no value.",
              "Type what the meter shows, e.g. 14.96 or -0.62, then tap Add reading.");
      return;
    }
    Reading reading;
    try {
      reading =
          at.kind() == Reading.Kind.AC
              ? Reading.ac(at.at(), Math.abs(value), at.hz())
              : Reading.dc(at.at(), value);
    } catch (InvalidInputException e) {
      bench
          .problems()
          .show("Not a reading", e.getMessage(), "Check the value on the meter and type it again.");
      return;
    }
    String typed = pad.textProperty().get();
    pad.press(ValuePadModel.CLEAR);
    probeChosenByHand = false;
    if (revisions.correctingProperty().get() != null) {
      revisions.finishCorrection(
          reading,
          failed -> {
            if (pad.textProperty().get().isEmpty()) {
              pad.textProperty().set(typed); // what was typed is not lost
            }
          });
      return;
    }
    revisions.forgetUndo();
    bench.readings().add(reading);
    diagnoseAndStore(stage, reading, typed);
  }

  private void diagnoseAndStore(Stage stage, Reading added, String typed) {
    List<Reading> taken = List.copyOf(bench.readings());
    String caseId = bench.openCaseProperty().get().id();
    Diagnoser ready = diagnoserStage == stage ? diagnoser : null;
    BoardModel boardModel = bench.boardModelProperty().get();
    Casework casework = bench.casework();
    boolean mains = bench.mainsPoweredProperty().get();
    thinking.set(true);
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
              thinking.set(false);
              bench.rememberId(added, stored.readings().get(0).id());
              if (bench.stageProperty().get() == stage) {
                bench.diagnosisProperty().set(stored.diagnosis());
                refresh();
              }
            },
            e -> {
              thinking.set(false);
              bench.readings().remove(added);
              if (pad.textProperty().get().isEmpty()) {
                pad.textProperty().set(typed); // what was typed is not lost
              }
              refresh();
              bench
                  .problems()
                  .failed(
                      "Could not take this reading",
                      e,
                      "Check that the probe point belongs to this stage and the value is what the meter shows, then add it again.");
            });
  }

  /** Rebuilds the rows, the top suspects and the next probe from the bench. */
  void refresh() {
    Stage stage = bench.stageProperty().get();
    Diagnosis diagnosis = bench.diagnosisProperty().get();
    ExpectedVolts volts = expected.get();
    List<Suspect> top =
        diagnosis == null ? List.of() : diagnosis.suspects().stream().limit(TOP).toList();
    topSuspects.setAll(top);
    verdict.set(diagnosis == null || bench.readings().isEmpty() ? "" : verdictLine(diagnosis));
    chain.set(bench.readings().isEmpty() ? "" : chainLine(stage, top));
    List<ReadingRow> list = new ArrayList<>();
    for (Reading r : bench.readings()) {
      double low = Double.NaN;
      double high = Double.NaN;
      if (volts != null
          && volts.solved()
          && r.kind() == Reading.Kind.DC
          && volts.nominal().containsKey(r.at())) {
        low = volts.low().get(r.at());
        high = volts.high().get(r.at());
      }
      Map<String, Double> predictions = new java.util.LinkedHashMap<>();
      for (Suspect s : top) {
        Double v = s.predicted().get(r.at());
        if (v != null && !s.fault().equals("healthy")) {
          predictions.put(Words.fault(s.fault()), v);
        }
      }
      String title =
          stage == null
              ? r.at()
              : ProbePoint.of(stage, r.at(), r.kind(), r.hz())
                  .map(ProbePoint::title)
                  .orElse(r.at());
      list.add(new ReadingRow(r, title, low, high, predictions, null, false));
    }
    // Newest first: the reading just taken is where the eye goes.
    java.util.Collections.reverse(list);
    // Struck readings last, greyed, newest strike first: kept in sight, left out of the diagnosis.
    List<Bench.StruckReading> struck = new ArrayList<>(bench.struckReadings());
    java.util.Collections.reverse(struck);
    for (Bench.StruckReading s : struck) {
      Reading r = s.reading();
      String title =
          stage == null
              ? r.at()
              : ProbePoint.of(stage, r.at(), r.kind(), r.hz())
                  .map(ProbePoint::title)
                  .orElse(r.at());
      list.add(new ReadingRow(r, title, Double.NaN, Double.NaN, Map.of(), s.struckAt(), true));
    }
    rows.setAll(list);
    if (stage != null && !probeChosenByHand) {
      probe.set(nextProbe(stage, diagnosis));
    }
  }

  static String verdictLine(Diagnosis diagnosis) {
    return switch (diagnosis.verdict()) {
      case HEALTHY -> "The readings fit a healthy stage.";
      case FAULT ->
          diagnosis.suspects().isEmpty()
              ? "The readings show a fault."
              : "Most likely: "
                  + Words.fault(diagnosis.suspects().get(0).fault())
                  + " ("
                  + Words.percent(diagnosis.suspects().get(0).probability())
                  + ")";
      case INCONCLUSIVE -> "Not clear yet: take the next probe.";
    };
  }

  /**
   * Returns the point to probe next: the first supply pin not yet read, then the diagnosis's best
   * probe, else null when there is nothing more worth probing.
   */
  ProbePoint nextProbe(Stage stage, Diagnosis diagnosis) {
    for (ProbePoint rail : ProbePoint.rails(stage)) {
      if (!isRead(rail.at(), Reading.Kind.DC)) {
        return rail;
      }
    }
    if (diagnosis == null || bench.readings().isEmpty()) {
      return null;
    }
    for (ProbeAdvice advice : diagnosis.nextProbes()) {
      if (advice.kind() == Reading.Kind.OHMS) {
        // A power-off check has two points and needs the screen's power-off mode (not built yet);
        // the suspects screen lists it in words.
        continue;
      }
      Optional<ProbePoint> point = ProbePoint.of(stage, advice.at(), advice.kind(), advice.hz());
      if (point.isPresent()) {
        return point.get().because(advice.why());
      }
    }
    return null;
  }

  private boolean isRead(String at, Reading.Kind kind) {
    return bench.readings().stream().anyMatch(r -> r.at().equals(at) && r.kind() == kind);
  }

  /** Goes on to the suspects screen. */
  public void showSuspects() {
    bench.go(Step.SUSPECTS);
  }
}
