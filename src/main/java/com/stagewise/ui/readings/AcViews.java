package com.stagewise.ui.readings;

import com.stagewise.circuit.AcMeasure;
import javafx.beans.binding.Bindings;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.scene.control.ToggleButton;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;
import org.controlsfx.control.SegmentedButton;

/**
 * The AC parts of the readings screen: above the pad, DC or AC volts and, for AC, the measure (RMS,
 * peak, peak-to-peak) with what the pad takes in words; in the probe column, the test signal and a
 * field to change its frequency.
 */
final class AcViews {
  private AcViews() {}

  /**
   * The pad's heading with DC or AC beside it, the measure, and for AC what the pad takes in words
   * ("AC volts RMS at 1 kHz"). Kept short: the pad's Add reading stays in sight on a small screen.
   */
  static Node padBar(ReadingsViewModel model) {
    AcChoice ac = model.ac();
    ToggleButton dc = toggle("pad-dc", "DC volts");
    ToggleButton acVolts = toggle("pad-ac", "AC volts");
    SegmentedButton kind = new SegmentedButton(dc, acVolts);
    kind.setId("pad-kind");
    acVolts.disableProperty().bind(ac.availableProperty().not());
    Runnable showKind =
        () -> {
          dc.setSelected(!ac.acProperty().get());
          acVolts.setSelected(ac.acProperty().get());
        };
    // The choice is the model's: a tap on the chosen button leaves it chosen.
    dc.setOnAction(
        e -> {
          model.setAc(false);
          showKind.run();
        });
    acVolts.setOnAction(
        e -> {
          model.setAc(true);
          showKind.run();
        });
    ac.acProperty().addListener((o, was, now) -> showKind.run());
    showKind.run();

    ToggleButton rms = toggle("measure-rms", "RMS");
    ToggleButton peak = toggle("measure-peak", "Peak");
    ToggleButton pp = toggle("measure-pp", "Peak-to-peak");
    SegmentedButton measure = new SegmentedButton(rms, peak, pp);
    measure.setId("pad-measure");
    Runnable showMeasure =
        () -> {
          AcMeasure m = ac.measureProperty().get();
          rms.setSelected(m == AcMeasure.RMS);
          peak.setSelected(m == AcMeasure.PEAK);
          pp.setSelected(m == AcMeasure.PP);
        };
    for (Object[] choice :
        new Object[][] {{rms, AcMeasure.RMS}, {peak, AcMeasure.PEAK}, {pp, AcMeasure.PP}}) {
      ((ToggleButton) choice[0])
          .setOnAction(
              e -> {
                model.setMeasure((AcMeasure) choice[1]);
                showMeasure.run();
              });
    }
    ac.measureProperty().addListener((o, was, now) -> showMeasure.run());
    showMeasure.run();

    // While a reading is corrected the pad takes what that reading was (its kind stays; an AC
    // reading's measure may still be put right), and the pad keeps its Add reading in sight.
    PowerOffViews.showWhen(
        kind,
        model.powerOff().activeProperty().not().and(model.correctingTextProperty().isEmpty()));
    PowerOffViews.showWhen(measure, ac.acProperty().and(model.powerOff().activeProperty().not()));
    // No heading of its own: the switch says what the pad takes, and a heading's row is one the
    // keys need in a 1024×600 window.
    // No row at all where neither shows (power-off mode): its spacing is a row the keys need.
    // Three px between the two switches (and five between the keys' rows, ValuePad): on AC at
    // 1024×600 the readings screen fitted its window but for 6 px, which put a scroll bar on it.
    VBox bar = new VBox(3, kind, measure);
    PowerOffViews.showWhen(bar, kind.visibleProperty().or(measure.visibleProperty()));
    return bar;
  }

  /**
   * What the pad takes in words ("AC volts RMS at 1 kHz"), shown while the pad is on AC: the first
   * of the pad's notes below the keys (the probe call above says it too).
   */
  static Node padTakes(ReadingsViewModel model) {
    AcChoice ac = model.ac();
    Label takes = new Label();
    takes.setId("pad-takes");
    takes.getStyleClass().add("pad-takes");
    takes.setWrapText(true);
    takes.setMinHeight(Region.USE_PREF_SIZE);
    takes.textProperty().bind(ac.padTitle());
    PowerOffViews.showWhen(takes, ac.acProperty().and(model.powerOff().activeProperty().not()));
    return takes;
  }

  /** The test signal in words, and a field to turn it to another frequency. */
  static Node signalRow(ReadingsViewModel model) {
    AcChoice ac = model.ac();
    Label signal = new Label();
    signal.setId("test-signal");
    signal.getStyleClass().add("test-signal");
    signal.setWrapText(true);
    signal.setMinHeight(Region.USE_PREF_SIZE);
    signal.textProperty().bind(ac.signalProperty());
    TextField hz = new TextField();
    hz.setId("test-frequency");
    hz.setPromptText("New frequency");
    hz.setPrefColumnCount(7);
    hz.textProperty().bindBidirectional(ac.frequencyTextProperty());
    hz.setOnAction(e -> model.setTestFrequency());
    HBox.setHgrow(hz, Priority.ALWAYS);
    Button set = new Button("Set");
    set.setId("test-frequency-set");
    set.setMinWidth(Region.USE_PREF_SIZE);
    set.setOnAction(e -> model.setTestFrequency());
    set.disableProperty()
        .bind(
            Bindings.createBooleanBinding(
                () ->
                    ac.frequencyTextProperty().get() == null
                        || ac.frequencyTextProperty().get().isBlank(),
                ac.frequencyTextProperty()));
    HBox change = new HBox(6, hz, set);
    change.setAlignment(Pos.CENTER_LEFT);
    PowerOffViews.showWhen(change, ac.availableProperty());
    Label problem = new Label();
    problem.setId("test-frequency-problem");
    problem.getStyleClass().add("bad");
    problem.setWrapText(true);
    problem.setMinHeight(Region.USE_PREF_SIZE);
    problem.textProperty().bind(ac.frequencyProblemProperty());
    PowerOffViews.showWhen(problem, ac.frequencyProblemProperty().isNotEmpty());
    VBox box = new VBox(4, signal, change, problem);
    box.getStyleClass().add("signal-row");
    PowerOffViews.showWhen(box, model.powerOff().activeProperty().not());
    return box;
  }

  private static ToggleButton toggle(String id, String text) {
    ToggleButton b = new ToggleButton(text);
    b.setId(id);
    b.getStyleClass().add("pad-switch");
    b.setMinWidth(Region.USE_PREF_SIZE);
    return b;
  }
}
