package com.stagewise.ui.readings;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.history.record.BoardModel;
import com.stagewise.solver.ExpectedAc;
import com.stagewise.solver.ExpectedVolts;
import com.stagewise.ui.Bench;
import com.stagewise.ui.Step;
import com.stagewise.ui.widget.ValuePadModel;
import java.util.List;
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
  private final ObservableList<ProbePoint> testPoints = FXCollections.observableArrayList();
  private final ObservableList<ReadingRow> rows = FXCollections.observableArrayList();
  private final ObservableList<Suspect> topSuspects = FXCollections.observableArrayList();
  private final StringProperty verdict = new SimpleStringProperty("");
  private final StringProperty chain = new SimpleStringProperty("");
  private final ObjectProperty<ExpectedVolts> expected = new SimpleObjectProperty<>();
  private final BooleanProperty thinking = new SimpleBooleanProperty(false);
  private final Revisions revisions;
  private final PowerOffMode powerOff = new PowerOffMode();
  private final ReadingCards cards = new ReadingCards();
  private final AcChoice ac = new AcChoice();
  private final PoweredProbe probe = new PoweredProbe(ac, powerOff);
  private final ObjectProperty<ExpectedAc> expectedAc = new SimpleObjectProperty<>();
  // True while the stage is replaced by itself at another test frequency: choices stay.
  private boolean retuning;
  // What was typed in the other mode: switching modes loses nothing.
  private String otherModeText = "";
  private Diagnoser diagnoser;
  private Stage diagnoserStage;

  /** Creates the readings screen's model on a bench. */
  public ReadingsViewModel(Bench bench) {
    this.bench = bench;
    this.revisions =
        new Revisions(bench, s -> diagnoserStage == s ? diagnoser : null, this::refresh);
    probe.unsignWhileAc(pad);
    bench.stageProperty().addListener((o, was, now) -> stageChanged(now));
    if (bench.stageProperty().get() != null) {
      stageChanged(bench.stageProperty().get());
    }
  }

  public ValuePadModel pad() {
    return pad;
  }

  /** Returns the power-off mode: its caution, its pair of points and the suggested pair. */
  public PowerOffMode powerOff() {
    return powerOff;
  }

  /**
   * Switches between powered readings (volts) and power-off readings (ohms between two points). The
   * pad keeps what was typed in each mode; entering power-off mode brings up its caution and the
   * suggested pair.
   */
  public void setPowerOff(boolean on) {
    if (on == powerOff.activeProperty().get()) {
      return;
    }
    if (revisions.correctingProperty().get() != null) {
      revisions.cancelCorrection();
    }
    String typed = pad.textProperty().get();
    pad.textProperty().set(otherModeText);
    otherModeText = typed == null ? "" : typed;
    pad.quantityProperty()
        .set(on ? ValuePadModel.Quantity.METER_OHMS : ValuePadModel.Quantity.VOLTS);
    if (on) {
      if (!powerOff.chosenByHand()) {
        powerOff.followSuggestion(bench.stageProperty().get());
      }
      powerOff.enter();
    } else {
      powerOff.leave();
    }
  }

  /** Goes into power-off mode with the suggested pair of points chosen: one tap takes it. */
  public void takeSuggestedOhmsCheck() {
    powerOff.followSuggestion(bench.stageProperty().get());
    setPowerOff(true);
  }

  /** Returns what the pad takes while powered: DC or AC volts, the measure, the test frequency. */
  public AcChoice ac() {
    return ac;
  }

  /** Returns what a healthy stage reads in AC at each point (null until worked out, or none). */
  public ObjectProperty<ExpectedAc> expectedAcProperty() {
    return expectedAc;
  }

  /** Switches the pad between DC and AC volts; the point to probe stays, read the other way. */
  public void setAc(boolean on) {
    probe.setAc(on);
  }

  /** Chooses the measure AC readings are typed in (RMS, peak, peak-to-peak). */
  public void setMeasure(AcMeasure measure) {
    probe.setMeasure(measure);
  }

  /**
   * Takes the test frequency typed: the stage is the same with its test signal at that frequency,
   * so the expected AC, the diagnosis and the next probes follow it. What was typed on the pad and
   * the point chosen stay.
   */
  public void setTestFrequency() {
    Stage stage = bench.stageProperty().get();
    ac.retuned(stage, bench.readings()).ifPresent(this::retune);
  }

  private void retune(Stage retuned) {
    String typed = pad.textProperty().get();
    ProbePoint chosen = probe.chosenByHand() ? probe.property().get() : null;
    retuning = true;
    try {
      bench.stageProperty().set(retuned);
    } finally {
      retuning = false;
    }
    pad.textProperty().set(typed);
    if (chosen != null) {
      probe.choose(chosen.readAs(chosen.kind(), ac.hzProperty().get()));
    }
    AcChoice.keepWithCase(bench, retuned);
  }

  public ObjectProperty<ProbePoint> probeProperty() {
    return probe.property();
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
    return revisions.correctingTextProperty();
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
    setPowerOff(r.kind() == Reading.Kind.OHMS);
    revisions.startCorrection(r);
    if (revisions.correctingProperty().get() != r) {
      return;
    }
    if (r.kind() == Reading.Kind.OHMS) {
      powerOff.set(
          ProbePoint.of(stage, r.at(), r.kind(), 0).orElse(null),
          ProbePoint.of(stage, r.to(), r.kind(), 0).orElse(null),
          "Correcting the reading taken between these points.",
          true);
      pad.setValue(r.value());
      return;
    }
    ProbePoint.of(stage, r.at(), r.kind(), r.hz())
        .ifPresent(
            p -> {
              if (r.kind() == Reading.Kind.AC) {
                r.measure().ifPresent(ac::choose);
              }
              probe.choose(p.because("Correcting the reading taken here."));
            });
    pad.textProperty()
        .set(java.math.BigDecimal.valueOf(r.value()).stripTrailingZeros().toPlainString());
  }

  /** Stops correcting; the reading stays as it was. */
  public void cancelCorrection() {
    revisions.cancelCorrection();
    pad.textProperty().set("");
    followSuggestion();
    if (powerOff.activeProperty().get()) {
      powerOff.followSuggestion(bench.stageProperty().get());
    }
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

  public ObjectProperty<ExpectedVolts> expectedProperty() {
    return expected;
  }

  /** Returns true while the diagnosis runs. */
  public BooleanProperty thinkingProperty() {
    return thinking;
  }

  private void stageChanged(Stage stage) {
    ac.follow(stage, retuning);
    expectedAc.set(null);
    pad.textProperty().set("");
    revisions.stageChanged(retuning, ac.hzProperty().get());
    revisions.cancelCorrection();
    diagnoser = null;
    diagnoserStage = null;
    probe.release();
    powerOff.reset();
    setPowerOff(false);
    otherModeText = "";
    rows.clear();
    topSuspects.clear();
    verdict.set("");
    expected.set(null);
    if (stage == null) {
      testPoints.clear();
      probe.show(null);
      return;
    }
    testPoints.setAll(ProbePoint.allForOhms(stage));
    probe.show(ProbePoint.next(stage, bench.diagnosisProperty().get(), bench.readings()));
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
              ExpectedAc signal = ExpectedAc.of(stage);
              Diagnoser d = casework.diagnoser(stage, boardModel).mainsPowered(mains);
              Diagnosis diagnosis =
                  taken.isEmpty() ? null : d.diagnose(new ReadingSet(MeterSpec.DEFAULT, taken));
              return new PreparedStage(stage, volts, signal, d, diagnosis);
            },
            prepared -> {
              if (prepared.stage() != bench.stageProperty().get()) {
                return;
              }
              expected.set(prepared.volts());
              expectedAc.set(prepared.signal());
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

  /**
   * Makes the technician's choice the point to probe (a pin tapped on the drawing, or from the
   * list).
   */
  public void choose(String at) {
    Stage stage = bench.stageProperty().get();
    if (stage == null) {
      return;
    }
    if (powerOff.activeProperty().get()) {
      ProbePoint.of(stage, at, Reading.Kind.OHMS, 0).ifPresent(powerOff::choose);
      return;
    }
    if (at.equals(stage.ground())) {
      return; // ground is the meter's reference for volts
    }
    Reading.Kind kind = probe.kindForPicks();
    ProbePoint.of(stage, at, kind, kind == Reading.Kind.AC ? ac.hzProperty().get() : 0)
        .ifPresent(p -> probe.choose(p.because("Chosen by you.")));
  }

  /** Returns to the suggested probe after a hand-picked one. */
  public void followSuggestion() {
    if (powerOff.activeProperty().get()) {
      powerOff.followSuggestion(bench.stageProperty().get());
      return;
    }
    probe.release();
    Stage stage = bench.stageProperty().get();
    if (stage != null) {
      probe.show(ProbePoint.next(stage, bench.diagnosisProperty().get(), bench.readings()));
    }
  }

  /**
   * Adds what the pad shows as a reading at the probe point, then re-ranks the suspects and picks
   * the next probe in the background, and stores both in the case.
   */
  public void addReading() {
    boolean ohms = powerOff.activeProperty().get();
    ProbePoint at = ohms ? powerOff.fromProperty().get() : probe.property().get();
    ProbePoint to = ohms ? powerOff.toProperty().get() : null;
    Double value = pad.valueProperty().get();
    Stage stage = bench.stageProperty().get();
    if (ohms && stage != null && (at == null || to == null || at.at().equals(to.at()))) {
      bench
          .problems()
          .show(
              "Choose two points",
              "An ohms reading is taken between two different points.",
              "Tap the first point and then the second, on the drawing or from the list.");
      return;
    }
    if (at == null || stage == null) {
      bench
          .problems()
          .show(
              "Nothing to probe",
              "There is no test point chosen.",
              "Tap a pin on the package, or choose a test point from the list.");
      return;
    }
    if (pad.refusedNegative().isPresent()) {
      // A negative AC amplitude is refused with what to fix; what was typed stays on the pad.
      bench.problems().negativeAmplitude(pad.refusedNegative().getAsDouble());
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
      if (ohms) {
        reading = Reading.ohms(at.at(), to.at(), value);
      } else {
        reading =
            at.kind() == Reading.Kind.AC
                ? Reading.ac(at.at(), value, at.hz(), at.measure())
                : Reading.dc(at.at(), value);
      }
    } catch (InvalidInputException e) {
      bench
          .problems()
          .show("Not a reading", e.getMessage(), "Check the value on the meter and type it again.");
      return;
    }
    String typed = pad.textProperty().get();
    pad.press(ValuePadModel.CLEAR);
    probe.release();
    if (ohms) {
      powerOff.clear();
    }
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
    thinking.set(true);
    revisions.add(
        stage,
        reading,
        () -> thinking.set(false),
        () -> {
          if (pad.textProperty().get().isEmpty()) {
            pad.textProperty().set(typed); // what was typed is not lost
          }
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
    verdict.set(
        diagnosis == null || bench.readings().isEmpty() ? "" : ReadingsText.verdictLine(diagnosis));
    chain.set(bench.readings().isEmpty() ? "" : ReadingsText.chainLine(stage, top));
    List<ReadingRow> list = cards.rows(stage, bench, volts, expectedAc.get(), top);
    rows.setAll(list);
    if (stage != null) {
      probe.suggest(ProbePoint.next(stage, diagnosis, bench.readings()));
    }
    ProbeAdvice ohms = null;
    if (diagnosis != null && !bench.readings().isEmpty()) {
      ohms =
          diagnosis.nextProbes().stream()
              .filter(a -> a.kind() == Reading.Kind.OHMS)
              .findFirst()
              .orElse(null);
    }
    boolean leads = ohms != null && diagnosis.nextProbes().get(0) == ohms;
    if (revisions.correctingProperty().get() == null) {
      powerOff.suggest(stage, ohms, leads);
    }
  }

  /** Goes on to the suspects screen. */
  public void showSuspects() {
    bench.go(Step.SUSPECTS);
  }
}
