package com.stagewise.ui.readings;

import com.stagewise.diagnosis.Suspect;
import com.stagewise.ui.Bench;
import com.stagewise.ui.words.Words;
import java.util.List;
import javafx.beans.binding.Bindings;
import javafx.collections.ListChangeListener;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ListView;
import javafx.scene.control.ProgressIndicator;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

/**
 * The readings screen's right-hand column: what the readings show (the verdict and the top
 * suspects, scrolling in their own part where the window is short), the cards of the readings with
 * what can be done to one, the undo, and the way to all suspects.
 */
final class ResultsColumn {
  private final ReadingsViewModel model;
  private final Bench bench;
  private final VBox suspectsBox = new VBox(6);
  private final VBox node;

  ResultsColumn(ReadingsViewModel model, Bench bench) {
    this.model = model;
    this.bench = bench;
    this.node = panel();
    model.topSuspects().addListener((ListChangeListener<Suspect>) c -> showSuspects());
    showSuspects();
  }

  VBox node() {
    return node;
  }

  private VBox panel() {
    VBox box = new VBox(8);
    box.getStyleClass().add("panel");
    Label heading = new Label("What the readings show");
    heading.getStyleClass().add("section-title");
    ProgressIndicator thinking = new ProgressIndicator();
    thinking.setPrefSize(28, 28);
    thinking.visibleProperty().bind(model.thinkingProperty());
    HBox head = new HBox(10, heading, thinking);
    head.setAlignment(Pos.CENTER_LEFT);
    Label verdict = new Label();
    verdict.setId("readings-verdict");
    verdict.getStyleClass().add("verdict");
    verdict.setWrapText(true);
    verdict.textProperty().bind(model.verdictProperty());
    Label chain = new Label();
    chain.setId("readings-chain");
    chain.setWrapText(true);
    chain.getStyleClass().add("hint");
    chain.textProperty().bind(model.chainProperty());
    chain.visibleProperty().bind(model.chainProperty().isNotEmpty());
    chain.managedProperty().bind(chain.visibleProperty());
    suspectsBox.setId("readings-suspects");
    ListView<ReadingRow> list = new ListView<>(model.rows());
    list.setId("readings-list");
    VBox.setVgrow(list, Priority.ALWAYS);
    // In a small window the cards give up their room first, down to about two rows (bound below).
    // Its preferred height small too: the verdict and the suspects above take what they need
    // first, the cards grow into what is left.
    list.setPrefHeight(120);
    list.setCellFactory(v -> new ReadingCard());
    // Another case or stage: nothing stays chosen from the last one.
    model
        .rows()
        .addListener(
            (ListChangeListener<ReadingRow>) c -> list.getSelectionModel().clearSelection());
    Label empty =
        new Label(
            "No readings yet. Probe the point on the left, type what the meter shows and tap Add"
                + " reading.");
    empty.setWrapText(true);
    empty.getStyleClass().add("hint");
    empty.setPadding(new javafx.geometry.Insets(12));
    list.setPlaceholder(empty);
    // While there are no cards, the list keeps the room its words need.
    list.minHeightProperty()
        .bind(
            Bindings.createDoubleBinding(
                () ->
                    model.rows().isEmpty()
                        ? Math.max(96, empty.prefHeight(Math.max(list.getWidth() - 4, 100)) + 4)
                        : 96,
                model.rows(),
                list.widthProperty(),
                empty.fontProperty()));
    Button all = new Button("See all suspects");
    all.setId("show-suspects");
    all.getStyleClass().add("primary");
    all.setMaxWidth(Double.MAX_VALUE);
    all.disableProperty().bind(Bindings.isEmpty(bench.readings()));
    all.setOnAction(e -> model.showSuspects());
    // The verdict and the top suspects scroll in their own part where a small window is short of
    // room (after the cards have given theirs), never the whole screen.
    VBox summary = new VBox(8, verdict, chain, suspectsBox);
    javafx.scene.control.ScrollPane summaryScroll = new javafx.scene.control.ScrollPane(summary);
    summaryScroll.setId("readings-summary");
    summaryScroll.setFitToWidth(true);
    summaryScroll.setHbarPolicy(javafx.scene.control.ScrollPane.ScrollBarPolicy.NEVER);
    summaryScroll.setVbarPolicy(javafx.scene.control.ScrollPane.ScrollBarPolicy.AS_NEEDED);
    summaryScroll.setMinHeight(60);
    // The pane would ask for the content's height with its labels on one line each; it asks for
    // the height the content has at the pane's width instead, so that the suspects show whole
    // where the column has room.
    summary
        .heightProperty()
        .addListener((o, was, now) -> summaryScroll.setPrefViewportHeight(now.doubleValue()));
    VBox.setVgrow(summaryScroll, Priority.SOMETIMES);
    box.getChildren().addAll(head, summaryScroll, list, cardActions(list), undoBar(), all);
    return box;
  }

  /** What can be done to the reading whose card was tapped: correct it or strike it out. */
  private Node cardActions(ListView<ReadingRow> list) {
    Label what = new Label();
    what.setId("reading-chosen");
    what.setWrapText(true);
    what.setMinHeight(Region.USE_PREF_SIZE);
    Button correct = new Button("Correct");
    correct.setId("reading-correct");
    Button strike = new Button("Strike out");
    strike.setId("reading-strike");
    Button restore = new Button("Restore");
    restore.setId("reading-restore");
    var chosen = list.getSelectionModel().selectedItemProperty();
    correct.setOnAction(e -> model.correct(chosen.get()));
    strike.setOnAction(e -> model.strike(chosen.get()));
    restore.setOnAction(e -> model.restore(chosen.get()));
    for (Button b : List.of(correct, strike, restore)) {
      b.setMinWidth(Region.USE_PREF_SIZE);
    }
    Region spring = new Region();
    HBox.setHgrow(spring, Priority.ALWAYS);
    HBox.setHgrow(what, Priority.SOMETIMES);
    HBox bar = new HBox(8, what, spring, correct, strike, restore);
    bar.setAlignment(Pos.CENTER_LEFT);
    bar.getStyleClass().add("card-actions");
    bar.visibleProperty().bind(chosen.isNotNull());
    bar.managedProperty().bind(bar.visibleProperty());
    chosen.addListener(
        (o, was, row) -> {
          boolean struck = row != null && row.struck();
          what.setText(
              row == null ? "" : row.title() + ":  " + ReadingCard.valueText(row.reading()));
          correct.setVisible(!struck);
          correct.setManaged(!struck);
          strike.setVisible(!struck);
          strike.setManaged(!struck);
          restore.setVisible(struck);
          restore.setManaged(struck);
        });
    return bar;
  }

  /** The last strike, restore or correction, with its undo. */
  private Node undoBar() {
    Label what = new Label();
    what.setId("reading-undo-text");
    what.setWrapText(true);
    what.setMinHeight(Region.USE_PREF_SIZE);
    what.textProperty().bind(model.undoTextProperty());
    Button undo = new Button("Undo");
    undo.setId("reading-undo");
    undo.setMinWidth(Region.USE_PREF_SIZE);
    undo.setOnAction(e -> model.undo());
    Region spring = new Region();
    HBox.setHgrow(spring, Priority.ALWAYS);
    HBox bar = new HBox(8, what, spring, undo);
    bar.setAlignment(Pos.CENTER_LEFT);
    bar.getStyleClass().add("undo-bar");
    bar.visibleProperty().bind(model.undoTextProperty().isNotEmpty());
    bar.managedProperty().bind(bar.visibleProperty());
    return bar;
  }

  private void showSuspects() {
    suspectsBox.getChildren().clear();
    int rank = 1;
    for (Suspect s : model.topSuspects()) {
      Label name = new Label(rank++ + ".  " + Words.fault(s.fault()));
      name.getStyleClass().add("strong");
      name.setMinWidth(0);
      // A long name wraps rather than losing its end ("U1 pin 1 lifted (open joint)").
      name.setWrapText(true);
      name.setMinHeight(Region.USE_PREF_SIZE);
      Region bar = new Region();
      bar.getStyleClass().add("suspect-bar");
      bar.setPrefWidth(Math.max(2, 90 * s.probability()));
      bar.setMinWidth(Region.USE_PREF_SIZE);
      Region track = new Region();
      track.getStyleClass().add("suspect-bar-track");
      track.setPrefWidth(90 * (1 - s.probability()));
      track.setMinWidth(Region.USE_PREF_SIZE);
      HBox barRow = new HBox(0, bar, track);
      barRow.setAlignment(Pos.CENTER_LEFT);
      Label pct = new Label(Words.percent(s.probability()));
      pct.getStyleClass().add("suspect-pct");
      pct.setWrapText(false);
      HBox gauge = new HBox(10, barRow, pct);
      gauge.setAlignment(Pos.CENTER_RIGHT);
      suspectsBox.getChildren().add(new SuspectLine(name, gauge));
    }
  }
}
