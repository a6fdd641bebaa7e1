package com.stagewise.ui.start;

import com.stagewise.ui.widget.Keypad;
import javafx.animation.PauseTransition;
import javafx.beans.binding.Bindings;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.CheckBox;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.control.TextField;
import javafx.scene.control.ToggleButton;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import javafx.util.Duration;
import org.controlsfx.control.textfield.TextFields;

/** The unit screen: the serial search with its keypad, the unit's history and the case buttons. */
public final class StartView {
  private final StartViewModel model;
  private final HBox root = new HBox(16);
  // With a clear button (ControlsFX) that empties it in one tap; the list then shows open cases.
  private final TextField serialField = TextFields.createClearableTextField();
  private Keypad keypad;

  /** Builds the screen bound to its model. */
  public StartView(StartViewModel model) {
    this.model = model;
    root.getStyleClass().add("screen");
    root.getStylesheets().add(StartView.class.getResource("start.css").toExternalForm());
    root.setId("screen-unit");
    VBox left = findPanel();
    StackPane right = new StackPane();
    VBox glance = glancePanel();
    VBox add = addPanel();
    add.setVisible(false);
    // Only the panel shown counts for the column's width: the hidden one must not widen the
    // screen past a 1024 px window.
    add.managedProperty().bind(add.visibleProperty());
    glance.managedProperty().bind(glance.visibleProperty());
    right.getChildren().addAll(glance, add);
    Button addButton = new Button("Add a new unit…");
    addButton.setId("add-unit-show");
    addButton.setOnAction(
        e -> {
          add.setVisible(true);
          glance.setVisible(false);
          model.loadBoardModels();
        });
    Button back = (Button) add.lookup("#add-unit-cancel");
    back.setOnAction(
        e -> {
          add.setVisible(false);
          glance.setVisible(true);
        });
    Button save = (Button) add.lookup("#add-unit-save");
    save.setOnAction(
        e -> {
          model.addUnit();
          add.setVisible(false);
          glance.setVisible(true);
        });
    left.getChildren().add(addButton);
    HBox.setHgrow(right, Priority.ALWAYS);
    left.setPrefWidth(640);
    // Room for the keypad at the 48 px touch minimum per key, so that a 1024 px window keeps the
    // case column beside it.
    left.setMinWidth(540);
    root.getChildren().addAll(left, right);
  }

  /** Returns the screen's root node. */
  public Node root() {
    return root;
  }

  /** Puts the caret in the serial field (Ctrl+F). */
  public void focusSearch() {
    serialField.requestFocus();
  }

  private VBox findPanel() {
    VBox box = new VBox(10);
    box.getStyleClass().add("panel");
    Label title = new Label("Find the unit by its serial number");
    title.getStyleClass().add("section-title");
    serialField.setId("serial");
    serialField.getStyleClass().add("big-field");
    serialField.setPromptText("e.g. AM-2041");
    serialField.textProperty().bindBidirectional(model.serialProperty());
    serialField.setOnAction(e -> model.search());
    // Live search: the list follows the typing (on-screen keypad or keyboard) after a short pause,
    // so a burst of keys runs one query.
    PauseTransition typing = new PauseTransition(Duration.millis(250));
    typing.setOnFinished(e -> model.searchAsTyped());
    model.serialProperty().addListener((o, was, now) -> typing.playFromStart());
    HBox.setHgrow(serialField, Priority.ALWAYS);
    Button search = new Button("Search");
    search.setId("serial-search");
    search.getStyleClass().add("primary");
    search.setMinHeight(60);
    search.setMinWidth(Region.USE_PREF_SIZE);
    search.setOnAction(e -> model.search());
    keypad = new Keypad(model.serialProperty(), "serial");
    keypad.follow(serialField);
    ListView<StartViewModel.UnitRow> list = new ListView<>(model.matches());
    list.setId("unit-matches");
    list.setPrefHeight(170);
    // A tall window shows more of the units found instead of leaving the panel empty below them.
    VBox.setVgrow(list, Priority.ALWAYS);
    // Never squeezed below its first two rows (start.css): in a short window the screen scrolls.
    list.getStyleClass().add("unit-matches");
    list.setCellFactory(
        v ->
            new ListCell<>() {
              {
                // No wider than the list: a long board name wraps instead of scrolling sideways.
                setPrefWidth(0);
                setWrapText(true);
              }

              @Override
              protected void updateItem(StartViewModel.UnitRow row, boolean empty) {
                super.updateItem(row, empty);
                setText(empty || row == null ? null : row.line());
              }
            });
    list.getSelectionModel()
        .selectedItemProperty()
        .addListener(
            (o, was, row) -> {
              if (row != null) {
                model.select(row);
              }
            });
    Label note = new Label();
    note.setId("unit-matches-note");
    note.getStyleClass().add("hint");
    note.textProperty().bind(model.matchesNoteProperty());
    // One unit found as the serial is typed: one big tap (or Enter) shows it; nothing moves by
    // itself while the technician is still typing. It sits right under the keys, above the list,
    // so that it stays in sight in a short window (1024×600), where the list's end is below the
    // fold.
    Button openOnly = new Button();
    openOnly.setId("open-only-match");
    openOnly.getStyleClass().add("primary");
    openOnly.setMaxWidth(Double.MAX_VALUE);
    openOnly.setMinHeight(60);
    openOnly.textProperty().bind(model.onlyMatchTextProperty());
    openOnly.visibleProperty().bind(model.onlyMatchProperty().isNotNull());
    openOnly.managedProperty().bind(openOnly.visibleProperty());
    openOnly.setOnAction(e -> model.openOnlyMatch());
    // A tap leaves the focus where it was: the button hides once the unit shows, and the focus
    // must not fall on the next button (Enter in the serial field does the same from the keys).
    openOnly.setFocusTraversable(false);
    box.getChildren().addAll(title, new HBox(8, serialField, search), keypad, openOnly, list, note);
    return box;
  }

  /** The screens' look for a dim or a bright bench: larger text, high contrast (kept). */
  private javafx.scene.layout.FlowPane viewRow() {
    ToggleButton larger = new ToggleButton("Larger text");
    larger.setId("view-large-text");
    larger.selectedProperty().bindBidirectional(model.largeTextProperty());
    ToggleButton contrast = new ToggleButton("High contrast");
    contrast.setId("view-high-contrast");
    contrast.selectedProperty().bindBidirectional(model.highContrastProperty());
    Label screen = new Label("Screen:");
    screen.getStyleClass().add("hint");
    screen.setMinWidth(Region.USE_PREF_SIZE);
    // Beside each other, or wrapped onto a second row in a narrow column (1024 wide).
    javafx.scene.layout.FlowPane row =
        new javafx.scene.layout.FlowPane(8, 6, screen, larger, contrast);
    row.setAlignment(javafx.geometry.Pos.CENTER_LEFT);
    return row;
  }

  private VBox glancePanel() {
    VBox box = new VBox(10);
    box.getStyleClass().add("panel");
    Label title = new Label();
    title.setId("unit-title");
    title.getStyleClass().add("section-title");
    title.setWrapText(true);
    title
        .textProperty()
        .bind(
            Bindings.createStringBinding(
                () ->
                    model.selectedProperty().get() == null
                        ? "No unit chosen yet"
                        : "Unit "
                            + model.selectedProperty().get().unit().serial()
                            + " — "
                            + model.selectedProperty().get().boardModel().name(),
                model.selectedProperty()));
    Label owner = new Label();
    owner.getStyleClass().add("hint");
    owner
        .textProperty()
        .bind(
            Bindings.createStringBinding(
                () -> {
                  var unit = model.selectedProperty().get();
                  if (unit == null) {
                    return "Search for a serial on the left, or add a new unit.";
                  }
                  String who =
                      unit.unit().owner().isEmpty() ? "" : "Owner: " + unit.unit().owner() + ".  ";
                  int cases = unit.cases().size();
                  return who
                      + (cases == 0
                          ? "No earlier cases."
                          : cases == 1 ? "1 case so far." : cases + " cases so far.");
                },
                model.selectedProperty()));
    // One line in the case column of a 1024 px window with larger text; the resume button says
    // how to resume until an open case is tapped.
    Label earlier = new Label("Earlier cases, newest first");
    earlier.getStyleClass().add("strong");
    earlier.visibleProperty().bind(model.selectedProperty().isNotNull());
    ListView<StartViewModel.CaseLine> cases = new ListView<>(model.glance());
    cases.setId("unit-cases");
    VBox.setVgrow(cases, Priority.ALWAYS);
    cases.setCellFactory(
        v ->
            new ListCell<>() {
              {
                // A cell no wider than the list, so long symptoms wrap instead of scrolling
                // sideways.
                setPrefWidth(0);
              }

              @Override
              protected void updateItem(StartViewModel.CaseLine line, boolean empty) {
                super.updateItem(line, empty);
                if (empty || line == null) {
                  setText(null);
                  return;
                }
                StringBuilder text = new StringBuilder(line.opened() + "   " + line.symptom());
                text.append("\n").append(line.open() ? "Still open" : "Outcome: " + line.outcome());
                if (!line.faults().isEmpty()) {
                  text.append("   Found: ").append(line.faults());
                }
                if (!line.replaced().isEmpty()) {
                  text.append("\nDone: ").append(line.replaced());
                }
                setText(text.toString());
                setWrapText(true);
              }
            });
    Button resume = new Button();
    resume.setId("resume-case");
    resume
        .disableProperty()
        .bind(
            Bindings.createBooleanBinding(
                () -> {
                  var line = cases.getSelectionModel().getSelectedItem();
                  return line == null || !line.open();
                },
                cases.getSelectionModel().selectedItemProperty()));
    resume
        .textProperty()
        .bind(
            Bindings.when(resume.disableProperty())
                .then("Tap an open case to resume")
                .otherwise("Resume this open case"));
    // Its words wrap rather than widen the column past a 1024 px window with larger text.
    resume.setWrapText(true);
    resume.setOnAction(e -> model.resumeCase(cases.getSelectionModel().getSelectedItem().caseId()));
    // Short enough for one line in the case column of a 1024 px window with larger text.
    Label symptomTitle = new Label("New case: what is wrong?");
    symptomTitle.getStyleClass().add("section-title");
    TextField symptom = new TextField();
    symptom.setId("symptom");
    symptom.setPromptText("e.g. no sound");
    symptom.textProperty().bindBidirectional(model.symptomProperty());
    symptom.setOnAction(e -> model.openCase());
    HBox.setHgrow(symptom, Priority.ALWAYS);
    Button open = new Button("Open case");
    open.setId("open-case");
    open.getStyleClass().add("primary");
    open.disableProperty().bind(model.selectedProperty().isNull());
    open.setOnAction(e -> model.openCase());
    symptom.disableProperty().bind(model.selectedProperty().isNull());
    HBox openRow = new HBox(8, symptom, open);
    openRow.setAlignment(Pos.CENTER_LEFT);
    keypad.follow(symptom);
    // The next action of a chosen unit first: a new case, or the resume of an open one (its
    // button above the list it acts on). The cases' list takes what is left, so that both stand in
    // sight at the screen's top in a small window (1024×600), where the serial keypad on the left
    // makes the screen taller than the window.
    box.getChildren()
        .addAll(title, owner, symptomTitle, openRow, earlier, resume, cases, viewRow());
    return box;
  }

  private VBox addPanel() {
    VBox box = new VBox(10);
    box.getStyleClass().add("panel");
    Label title = new Label("Add a new unit");
    title.getStyleClass().add("section-title");
    TextField serial = new TextField();
    serial.setId("new-serial");
    serial.setPromptText("Serial as written on the unit");
    serial.textProperty().bindBidirectional(model.newSerialProperty());
    ComboBox<String> boardModel = new ComboBox<>(model.boardModelNames());
    boardModel.setId("new-board-model");
    boardModel.setEditable(true);
    boardModel.setPromptText("Board model (choose or type a new one)");
    boardModel.setMaxWidth(Double.MAX_VALUE);
    boardModel.valueProperty().bindBidirectional(model.newBoardModelProperty());
    TextField owner = new TextField();
    owner.setId("new-owner");
    owner.setPromptText("Owner or job reference (may be left empty)");
    owner.textProperty().bindBidirectional(model.newOwnerProperty());
    CheckBox mains = new CheckBox("Units of this board model are mains-powered");
    mains.setId("new-mains");
    mains.selectedProperty().bindBidirectional(model.newMainsProperty());
    Button save = new Button("Add unit");
    save.setId("add-unit-save");
    save.getStyleClass().add("primary");
    Button cancel = new Button("Back");
    cancel.setId("add-unit-cancel");
    Label help = new Label("The keypad on the left types into the serial and owner fields too.");
    help.getStyleClass().add("hint");
    help.setWrapText(true);
    keypad.follow(serial);
    keypad.follow(owner);
    keypad.follow(boardModel.getEditor());
    box.getChildren()
        .addAll(title, serial, boardModel, owner, mains, new HBox(8, save, cancel), help);
    return box;
  }
}
