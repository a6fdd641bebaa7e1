package com.stagewise.ui.closeout;

import com.stagewise.casework.AfterRepair;
import com.stagewise.circuit.AcMeasure;
import com.stagewise.ui.widget.ValuePad;
import com.stagewise.ui.words.Words;
import javafx.collections.ListChangeListener;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

/**
 * The close-out's check after the repair: the points to read again with their healthy bands and
 * verdicts, the value pad, and the way back to the close-out.
 */
final class AfterRepairPanel extends VBox {
  AfterRepairPanel(AfterRepairViewModel model, Runnable done) {
    super(8);
    getStyleClass().add("panel");
    setId("after-repair");
    Label title = new Label("Check after repair");
    title.getStyleClass().add("section-title");
    Label summary = new Label();
    summary.setId("after-repair-summary");
    summary.setWrapText(true);
    summary.setMinHeight(Region.USE_PREF_SIZE);
    summary.textProperty().bind(model.summaryProperty());
    ListView<CheckRow> list = new ListView<>(model.rows());
    list.setId("after-repair-points");
    list.setMinHeight(150);
    // About four points in sight at once (two lines each, touch rows of common practice).
    list.setPrefHeight(240);
    VBox.setVgrow(list, Priority.ALWAYS);
    list.setCellFactory(
        v ->
            new ListCell<>() {
              {
                setPrefWidth(0);
                setWrapText(true);
              }

              @Override
              protected void updateItem(CheckRow row, boolean empty) {
                super.updateItem(row, empty);
                getStyleClass().removeAll("outside", "inside");
                if (empty || row == null) {
                  setText(null);
                  return;
                }
                String verdict = row.verdict();
                setText(
                    row.label()
                        + "\n"
                        + (verdict.isEmpty() ? "not read yet" : verdict)
                        + (row.value() != null && !row.saved() ? " (not stored yet)" : ""));
                if (row.outside()) {
                  getStyleClass().add("outside");
                } else if (row.value() != null) {
                  getStyleClass().add("inside");
                }
              }
            });
    list.getSelectionModel()
        .selectedIndexProperty()
        .addListener(
            (o, was, now) -> {
              if (now.intValue() >= 0 && now.intValue() != model.currentProperty().get()) {
                model.select(now.intValue());
              }
            });
    model
        .currentProperty()
        .addListener(
            (o, was, now) -> {
              list.getSelectionModel().select(now.intValue());
              // The point to read next stays in sight in the list.
              if (now.intValue() >= 0) {
                list.scrollTo(now.intValue());
              }
            });
    model
        .rows()
        .addListener(
            (ListChangeListener<CheckRow>)
                c -> list.getSelectionModel().select(model.currentProperty().get()));
    Label reading = new Label();
    reading.setId("after-repair-point");
    reading.setWrapText(true);
    reading.getStyleClass().add("strong");
    Runnable showPoint =
        () -> {
          int i = model.currentProperty().get();
          reading.setText(
              i < 0 || i >= model.rows().size()
                  ? "Every point is read. Store the check, or tap a point to read it again."
                  : call(model.rows().get(i)));
        };
    model.currentProperty().addListener((o, was, now) -> showPoint.run());
    model.rows().addListener((ListChangeListener<CheckRow>) c -> showPoint.run());
    showPoint.run();
    // What the pad takes for this point (its kind, and an AC point's measure and frequency).
    Label padLine = new Label();
    padLine.setId("after-repair-pad-line");
    padLine.setWrapText(true);
    padLine.getStyleClass().add("section-title");
    padLine.textProperty().bind(model.padLineProperty());
    // While an ohms point is read: unplug, discharge, wait (the readings screen's caution).
    Label caution = new Label(AfterRepairViewModel.POWER_OFF_CAUTION);
    caution.setId("after-repair-caution");
    caution.setWrapText(true);
    caution.setMinHeight(Region.USE_PREF_SIZE);
    caution.getStyleClass().add("question");
    caution.visibleProperty().bind(model.powerOffProperty());
    caution.managedProperty().bind(model.powerOffProperty());
    ValuePad pad = new ValuePad(model.pad(), "after-repair", "Record", model::enter);
    Button back = new Button("Store the check and go back");
    back.setId("after-repair-done");
    back.getStyleClass().add("primary");
    back.setOnAction(e -> model.store(done));
    getChildren().addAll(title, summary, list, reading, caution, padLine, pad, back);
  }

  /**
   * Returns what to do at the point: "Read U1 pin 8 with the meter:", "Read U1 pin 1 (AC volts
   * peak-to-peak at 1 kHz) with the scope:", "With the power off, read ohms across R2:".
   */
  private static String call(CheckRow row) {
    AfterRepair.CheckPoint p = row.point();
    return switch (p.kind()) {
      case DC -> "Read " + row.title() + " with the meter:";
      case AC ->
          "Read "
              + row.title()
              + (p.measure() == AcMeasure.RMS ? " with the meter:" : " with the scope:");
      case OHMS ->
          "With the power off, read ohms "
              + (p.across().isEmpty()
                  ? "from " + Words.pin(p.at()) + " to " + Words.pin(p.to())
                  : "across " + p.across())
              + ":";
    };
  }
}
