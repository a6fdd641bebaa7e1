package com.stagewise.ui.closeout;

import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairAction;
import com.stagewise.ui.widget.Keypad;
import com.stagewise.ui.words.Words;
import java.util.Locale;
import javafx.collections.ListChangeListener;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.control.TextArea;
import javafx.scene.control.TextField;
import javafx.scene.control.ToggleButton;
import javafx.scene.control.ToggleGroup;
import javafx.scene.layout.FlowPane;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

/** The close-out screen: actions, faults found, outcome, notes. */
public final class CloseOutView {
  private final CloseOutViewModel model;
  private final HBox root = new HBox(12);
  private final VBox faultsBox = new VBox(4);

  /**
   * The faults to tick, side by side where they fit, so that the outcome and the close button stay
   * in a 1280×800 window.
   */
  private final FlowPane faultTicks = new FlowPane(14, 0);

  /** Builds the screen bound to its model. */
  public CloseOutView(CloseOutViewModel model) {
    this.model = model;
    root.getStyleClass().add("screen");
    root.getStylesheets().add(CloseOutView.class.getResource("closeout.css").toExternalForm());
    root.setId("screen-close-out");
    VBox left = actionsPanel();
    left.setPrefWidth(620);
    HBox.setHgrow(left, Priority.ALWAYS);
    AfterRepairPanel check = new AfterRepairPanel(model.afterRepair(), model::endCheck);
    check.setPrefWidth(620);
    HBox.setHgrow(check, Priority.ALWAYS);
    // The check after the repair takes the place of the actions while it is on screen.
    check.visibleProperty().bind(model.checkingProperty());
    check.managedProperty().bind(model.checkingProperty());
    left.visibleProperty().bind(model.checkingProperty().not());
    left.managedProperty().bind(model.checkingProperty().not());
    VBox right = endPanel();
    right.setPrefWidth(560);
    root.getChildren().addAll(left, check, right);
    model.faultChoices().addListener((ListChangeListener<String>) c -> showFaults());
    model.confirmedFaults().addListener((ListChangeListener<String>) c -> showFaults());
    showFaults();
  }

  /** Returns the screen's root node. */
  public Node root() {
    return root;
  }

  private VBox actionsPanel() {
    VBox box = new VBox(8);
    box.getStyleClass().add("panel");
    Label title = new Label("What was done");
    title.getStyleClass().add("section-title");
    ToggleGroup kinds = new ToggleGroup();
    // Rows of choices wrap in a narrow window rather than cutting their words.
    FlowPane kindRow = new FlowPane(6, 6);
    kindRow.setPrefWrapLength(300);
    for (ActionKind kind : ActionKind.values()) {
      ToggleButton button = new ToggleButton(Words.actionKind(kind));
      button.setId("action-" + kind.word());
      button.setToggleGroup(kinds);
      button.setUserData(kind);
      button.setSelected(model.actionKindProperty().get() == kind);
      kindRow.getChildren().add(button);
    }
    kinds
        .selectedToggleProperty()
        .addListener(
            (o, was, now) -> {
              if (now == null) {
                was.setSelected(true);
              } else {
                model.actionKindProperty().set((ActionKind) now.getUserData());
              }
            });
    model
        .actionKindProperty()
        .addListener(
            (o, was, now) ->
                kinds.getToggles().stream()
                    .filter(t -> t.getUserData() == now)
                    .findFirst()
                    .ifPresent(t -> t.setSelected(true)));
    TextField part = field("action-part", "e.g. R2 or U1", model.actionPartProperty());
    TextField oldValue =
        field("action-old", "e.g. open, or measured 18 kΩ", model.actionOldProperty());
    TextField newValue =
        field("action-new", "e.g. 4.7 kΩ 1 %, or TL072", model.actionNewProperty());
    TextField text =
        field("action-text", "e.g. reflowed all pins of U1", model.actionTextProperty());
    GridPane form = new GridPane();
    form.setHgap(8);
    form.setVgap(6);
    form.addRow(0, new Label("Part"), part);
    form.addRow(1, new Label("Old value"), oldValue);
    form.addRow(2, new Label("New value"), newValue);
    form.addRow(3, new Label("Details"), text);
    GridPane.setHgrow(part, Priority.ALWAYS);
    Button add = new Button("Add to the case");
    add.setId("action-add");
    add.getStyleClass().add("primary");
    add.setOnAction(e -> model.addAction());
    Keypad keypad = new Keypad(model.actionPartProperty(), "action");
    ToggleButton showKeys = new ToggleButton("Keypad");
    showKeys.setId("action-keypad");
    keypad.visibleProperty().bind(showKeys.selectedProperty());
    keypad.managedProperty().bind(showKeys.selectedProperty());
    keypad.follow(part);
    keypad.follow(oldValue);
    keypad.follow(newValue);
    keypad.follow(text);
    ListView<RepairAction> list = new ListView<>(model.actions());
    list.setId("action-list");
    list.setPrefHeight(120);
    // Never squeezed below its first two rows (closeout.css): with a photo and the check's summary
    // on the left, a short window scrolls instead.
    list.getStyleClass().add("recorded-actions");
    VBox.setVgrow(list, Priority.ALWAYS);
    list.setCellFactory(
        v ->
            new ListCell<>() {
              {
                // No wider than the list: a long action wraps instead of being clipped at the
                // list's edge.
                setPrefWidth(0);
                setWrapText(true);
              }

              @Override
              protected void updateItem(RepairAction a, boolean empty) {
                super.updateItem(a, empty);
                setText(empty || a == null ? null : Words.actionLine(a));
              }
            });
    Label recorded = new Label("Recorded in this case");
    recorded.getStyleClass().add("strong");
    HBox addRow = new HBox(8, add, showKeys);
    box.getChildren()
        .addAll(title, kindRow, form, addRow, keypad, recorded, list, photosBox(), checkBox());
    return box;
  }

  /** The check after the repair: its button, and what the check found. */
  private VBox checkBox() {
    Label checkTitle = new Label("Check after repair");
    checkTitle.getStyleClass().add("strong");
    Label checkHint =
        new Label(
            "Before closing as fixed, read the same points again: each is shown against its"
                + " healthy band.");
    checkHint.setWrapText(true);
    checkHint.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
    checkHint.getStyleClass().add("hint");
    Label checkSummary = new Label();
    checkSummary.setId("close-check-summary");
    checkSummary.setWrapText(true);
    checkSummary.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
    checkSummary.textProperty().bind(model.afterRepair().summaryProperty());
    Button check = new Button("Check after repair…");
    check.setId("close-check-after-repair");
    check.setOnAction(e -> model.checkAfterRepair());
    checkSummary.managedProperty().bind(checkSummary.textProperty().isNotEmpty());
    return new VBox(4, checkTitle, checkHint, checkSummary, check);
  }

  /** The photos of the board attached to the case, and the button that attaches one. */
  private VBox photosBox() {
    Label title = new Label("Photos of the board");
    title.getStyleClass().add("strong");
    VBox lines = new VBox(2);
    lines.setId("close-photos");
    Runnable show =
        () -> {
          lines.getChildren().clear();
          if (model.photos().isEmpty()) {
            Label none = new Label("None attached yet.");
            none.getStyleClass().add("hint");
            lines.getChildren().add(none);
          }
          for (String line : model.photos()) {
            Label l = new Label(line);
            l.setWrapText(true);
            // Wraps onto more lines rather than being cut when the window is short.
            l.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
            lines.getChildren().add(l);
          }
        };
    model.photos().addListener((ListChangeListener<String>) c -> show.run());
    show.run();
    Button attach = new Button("Attach photo…");
    attach.setId("close-attach-photo");
    attach.setOnAction(e -> model.attachPhoto());
    return new VBox(4, title, lines, attach);
  }

  private static TextField field(
      String id, String prompt, javafx.beans.property.StringProperty property) {
    TextField field = new TextField();
    field.setId(id);
    field.setPromptText(prompt);
    field.textProperty().bindBidirectional(property);
    return field;
  }

  private VBox endPanel() {
    VBox box = new VBox(8);
    box.getStyleClass().add("panel");
    Label faultsTitle = new Label("Faults found (tick what was really wrong)");
    faultsTitle.getStyleClass().add("section-title");
    faultsBox.setId("close-faults");
    faultTicks.setPrefWrapLength(400);
    Label outcomeTitle = new Label("Outcome");
    outcomeTitle.getStyleClass().add("section-title");
    ToggleGroup outcomes = new ToggleGroup();
    // Wraps onto a second line in a narrow window rather than cutting "Returned unrepaired".
    FlowPane outcomeRow = new FlowPane(6, 6);
    outcomeRow.setPrefWrapLength(300);
    for (Outcome o : Outcome.values()) {
      ToggleButton button =
          new ToggleButton(
              Words.outcome(o).substring(0, 1).toUpperCase(Locale.ROOT)
                  + Words.outcome(o).substring(1));
      button.setId("outcome-" + o.word());
      button.setToggleGroup(outcomes);
      button.setUserData(o);
      outcomeRow.getChildren().add(button);
    }
    outcomes
        .selectedToggleProperty()
        .addListener(
            (o, was, now) ->
                model.outcomeProperty().set(now == null ? null : (Outcome) now.getUserData()));
    model
        .outcomeProperty()
        .addListener(
            (o, was, now) -> {
              if (now == null) {
                outcomes.selectToggle(null);
              }
            });
    Label notesTitle = new Label("Notes");
    notesTitle.getStyleClass().add("section-title");
    TextArea notes = new TextArea();
    notes.setId("close-notes");
    notes.setPromptText("Anything the next technician should know");
    notes.setWrapText(true);
    notes.setPrefRowCount(4);
    notes.textProperty().bindBidirectional(model.notesProperty());
    // The notes keep their four rows rather than growing with a tall left column, so that the
    // close button stays under them, in sight, in a 1280×800 window.
    Button close = new Button("Close the case");
    close.setId("close-case");
    close.getStyleClass().add("primary");
    close.disableProperty().bind(model.outcomeProperty().isNull());
    close.setOnAction(e -> model.closeCase());
    Button leave = new Button("Leave open for later");
    leave.setId("leave-open");
    leave.setOnAction(e -> model.leaveOpen());
    // Side by side, or one under the other where larger text leaves no room for both.
    FlowPane buttons = new FlowPane(10, 8, close, leave);
    buttons.setAlignment(Pos.CENTER_LEFT);
    Label questionText = new Label();
    questionText.setId("close-question");
    questionText.setWrapText(true);
    questionText.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
    questionText.getStyleClass().add("strong");
    questionText.textProperty().bind(model.questionProperty());
    Button anyway = new Button("Close as fixed anyway");
    anyway.setId("close-anyway");
    anyway.setOnAction(e -> model.closeAnyway());
    Button goBack = new Button("Go back");
    goBack.setId("close-go-back");
    goBack.getStyleClass().add("primary");
    goBack.setOnAction(e -> model.dontClose());
    FlowPane answers = new FlowPane(8, 8, goBack, anyway);
    VBox question = new VBox(6, questionText, answers);
    question.getStyleClass().add("question");
    question.visibleProperty().bind(model.questionProperty().isNotEmpty());
    question.managedProperty().bind(model.questionProperty().isNotEmpty());
    CheckBox report = new CheckBox("Save the repair report (PDF) when the case is closed");
    report.setId("close-save-report");
    report.setWrapText(true);
    report.selectedProperty().bindBidirectional(model.saveReportProperty());
    box.getChildren()
        .addAll(
            faultsTitle,
            faultsBox,
            outcomeTitle,
            outcomeRow,
            notesTitle,
            notes,
            report,
            question,
            buttons);
    return box;
  }

  private void showFaults() {
    faultsBox.getChildren().clear();
    faultTicks.getChildren().clear();
    if (model.faultChoices().isEmpty()) {
      Label none = new Label("No suspects yet: take readings, or describe the repair on the left.");
      none.getStyleClass().add("hint");
      none.setWrapText(true);
      faultsBox.getChildren().add(none);
      return;
    }
    int shown = 0;
    for (String id : model.faultChoices()) {
      if (shown++ >= 6 && !model.confirmedFaults().contains(id)) {
        continue;
      }
      CheckBox box = new CheckBox(Words.fault(id));
      box.setId("fault-" + id.replaceAll("[^A-Za-z0-9]", "_"));
      box.setSelected(model.confirmedFaults().contains(id));
      box.selectedProperty().addListener((o, was, now) -> model.toggleFault(id, now));
      faultTicks.getChildren().add(box);
    }
    faultsBox.getChildren().add(faultTicks);
  }
}
