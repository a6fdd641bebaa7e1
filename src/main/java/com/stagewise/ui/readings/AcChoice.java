package com.stagewise.ui.readings;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Limits;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.ui.Bench;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import javafx.beans.binding.Bindings;
import javafx.beans.binding.StringBinding;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.DoubleProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleDoubleProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;

/**
 * What the value pad takes on the readings screen while the unit is powered: DC volts, or AC volts
 * of the test signal in a measure the technician chooses (RMS as a meter's AC range shows a sine,
 * peak or peak-to-peak as read off a scope), and the test signal's frequency, which the technician
 * may change (the generator turned to another frequency; the expectation and the diagnosis then
 * work at that frequency).
 *
 * <p>Plain Java with JavaFX properties, no nodes.
 */
public final class AcChoice {
  private final BooleanProperty available = new SimpleBooleanProperty(false);
  private final BooleanProperty ac = new SimpleBooleanProperty(false);
  private final ObjectProperty<AcMeasure> measure = new SimpleObjectProperty<>(AcMeasure.PEAK);
  private final DoubleProperty hz = new SimpleDoubleProperty(0);
  private final StringProperty signal = new SimpleStringProperty("");
  private final StringProperty frequencyText = new SimpleStringProperty("");
  private final StringProperty frequencyProblem = new SimpleStringProperty("");
  private boolean measureChosenByHand;

  /**
   * Returns whether the stage has an AC test signal, so that AC readings can be judged (DESIGN.md:
   * AC is the small-signal response to the stage's AC input).
   */
  public BooleanProperty availableProperty() {
    return available;
  }

  /** Returns whether the pad takes AC volts (else DC volts). */
  public BooleanProperty acProperty() {
    return ac;
  }

  /** Returns the measure AC readings are typed in. */
  public ObjectProperty<AcMeasure> measureProperty() {
    return measure;
  }

  /** Returns the test signal's frequency in hertz (0 when the stage has no AC input). */
  public DoubleProperty hzProperty() {
    return hz;
  }

  /** Returns the test signal in words, e.g. "Test signal into IN: 100 mV peak at 1 kHz". */
  public StringProperty signalProperty() {
    return signal;
  }

  /** Returns the frequency being typed for the test signal (kept until it is taken). */
  public StringProperty frequencyTextProperty() {
    return frequencyText;
  }

  /** Returns why the frequency typed cannot be taken, naming what to fix; empty when it can. */
  public StringProperty frequencyProblemProperty() {
    return frequencyProblem;
  }

  /**
   * Returns what the pad takes, e.g. "DC volts" or "AC volts RMS at 1 kHz": shown above the pad.
   */
  public StringBinding padTitle() {
    return Bindings.createStringBinding(
        () ->
            ac.get()
                ? "AC volts " + measure.get().words() + " at " + Words.hertz(hz.get())
                : "DC volts",
        ac,
        measure,
        hz);
  }

  /** Chooses the measure AC readings are typed in; it stays chosen for the case. */
  public void choose(AcMeasure m) {
    measureChosenByHand = true;
    measure.set(m);
  }

  /**
   * Takes a stage's test signal: whether there is one, its frequency and, unless the technician
   * chose one, the measure its amplitude is stated in.
   *
   * @param keepChoices whether the technician's choices stay (the same case, e.g. after a change of
   *     frequency)
   */
  void follow(Stage stage, boolean keepChoices) {
    if (!keepChoices) {
      measureChosenByHand = false;
      frequencyText.set("");
      frequencyProblem.set("");
    }
    Optional<TestInput> input =
        stage == null
            ? Optional.empty()
            : stage.inputs().stream().filter(TestInput::hasAc).findFirst();
    available.set(input.isPresent());
    hz.set(input.map(TestInput::hz).orElse(0.0));
    if (!measureChosenByHand) {
      measure.set(input.map(TestInput::measure).orElse(AcMeasure.PEAK));
    }
    if (input.isEmpty()) {
      ac.set(false);
    }
    signal.set(
        input
            .map(
                i ->
                    "Test signal into "
                        + i.net()
                        + ": "
                        + Words.volts(i.ac())
                        + " "
                        + i.measure().words()
                        + " at "
                        + Words.hertz(i.hz()))
            .orElse("No AC test signal in this stage: add one on the Stage screen to take AC."));
  }

  /**
   * Returns the stage with its test signal at the frequency typed, or empty with {@link
   * #frequencyProblemProperty()} saying what to fix (the text typed is kept).
   *
   * @param readings the readings that stand: an AC reading taken at the present frequency keeps it,
   *     as the diagnosis judges every AC reading at one test frequency
   */
  Optional<Stage> retuned(Stage stage, List<Reading> readings) {
    String typed = frequencyText.get() == null ? "" : frequencyText.get().strip();
    if (stage == null || !available.get()) {
      frequencyProblem.set("This stage has no AC test signal; add one on the Stage screen.");
      return Optional.empty();
    }
    double newHz;
    try {
      newHz = SiValue.parse(typed.replaceAll("(?i)\\s*hz$", ""));
    } catch (InvalidInputException e) {
      frequencyProblem.set(
          "Frequency \"" + typed + "\" is not a value: type it in hertz, e.g. 1k or 10k.");
      return Optional.empty();
    }
    if (!Limits.FREQUENCY_HZ.contains(newHz)) {
      frequencyProblem.set(
          "Frequency "
              + typed
              + " is out of range: type one from "
              + Words.hertz(Limits.FREQUENCY_HZ.min())
              + " to "
              + Words.hertz(Limits.FREQUENCY_HZ.max())
              + ".");
      return Optional.empty();
    }
    double now = hz.get();
    Optional<Reading> taken =
        readings.stream().filter(r -> r.kind() == Reading.Kind.AC && r.hz() == now).findFirst();
    if (taken.isPresent() && newHz != now) {
      frequencyProblem.set(
          "AC readings taken at "
              + Words.hertz(now)
              + " stand (e.g. at "
              + Words.pin(taken.get().at())
              + "): the diagnosis compares AC readings at one test frequency. Strike them out"
              + " first (they stay in the history), or keep "
              + Words.hertz(now)
              + ".");
      return Optional.empty();
    }
    List<TestInput> inputs = new ArrayList<>();
    for (TestInput i : stage.inputs()) {
      inputs.add(i.hasAc() && i.hz() == now ? i.withHz(newHz) : i);
    }
    frequencyProblem.set("");
    frequencyText.set("");
    return Optional.of(stage.withInputs(inputs));
  }

  /**
   * Keeps the stage at its new test frequency with the open case, so that the case resumes with it
   * (its AC readings are at that frequency).
   */
  static void keepWithCase(Bench bench, Stage retuned) {
    if (bench.openCaseProperty().get() == null) {
      return;
    }
    String caseId = bench.openCaseProperty().get().id();
    bench
        .tasks()
        .run(
            "Keeping the test frequency with the case",
            () -> {
              bench.resume().saveStage(caseId, retuned);
              return retuned;
            },
            kept -> {},
            e ->
                bench
                    .problems()
                    .failed(
                        "Could not keep the test frequency with the case",
                        e,
                        "The readings are kept; set the frequency again after resuming."));
  }
}
