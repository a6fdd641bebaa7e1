package com.stagewise.ui.editor;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.PartKind;
import com.stagewise.ui.drawing.SchematicDrawing;
import com.stagewise.ui.editor.DraftStage.DraftInput;
import com.stagewise.ui.editor.DraftStage.DraftPart;
import com.stagewise.ui.editor.DraftStage.DraftRail;
import com.stagewise.ui.editor.DraftStage.DraftSection;
import com.stagewise.ui.editor.EditorProblem.Place;
import com.stagewise.ui.widget.SwipePanel;
import java.util.List;
import java.util.function.Consumer;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.ToggleButton;
import javafx.scene.input.KeyCode;
import javafx.scene.input.KeyCombination;
import javafx.scene.input.KeyEvent;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.FlowPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;

/**
 * The stage editor's screen, touch first: the stage's sections, parts, rails and inputs as large
 * rows on the left (each with its problems beside it), the schematic redrawn after every edit in
 * the middle with the list of problems below it, and the chosen item's details on the right, where
 * nets are tapped from the stage's nets or typed new. Every target is at least 48 px; nothing needs
 * hover; Ctrl+Z and Ctrl+Y undo and redo, Enter confirms a field.
 */
public final class StageEditorView {
  private final StageEditorModel model;
  private final BorderPane root = new BorderPane();
  private final VBox items = new VBox(6);
  private final VBox details = new VBox(10);
  private final VBox problemList = new VBox(4);
  private final SchematicDrawing schematic = new SchematicDrawing();
  private final Label refusal = new Label();
  private final StackPane layers;
  private final VBox questionPane = new VBox(14);
  private final Button undo = new Button("Undo");
  private final Button redo = new Button("Redo");
  private final Label title = new Label();
  private final EditorDetails detailPanel;
  private Place selectedPlace = Place.STAGE;
  private String selectedKey = "";

  /**
   * Builds the editor bound to its model.
   *
   * @param model the editor's model
   * @param onSave what to do with the stage after a save (e.g. take it to the stage screen)
   * @param onClose what closes the editor (asked first when edits are unsaved)
   */
  public StageEditorView(
      StageEditorModel model, Consumer<com.stagewise.circuit.Stage> onSave, Runnable onClose) {
    this.model = model;
    this.detailPanel = new EditorDetails(model, details, this::select);
    root.getStyleClass().add("screen");
    root.setId("screen-stage-editor");
    root.getStylesheets().add(StageEditorView.class.getResource("editor.css").toExternalForm());
    root.setTop(topBar(onSave, onClose));
    ScrollPane itemScroll = new ScrollPane(items);
    itemScroll.setFitToWidth(true);
    // A finger drags a long panel along, as on a phone, besides the wheel and the scroll bar.
    SwipePanel.of(itemScroll);
    itemScroll.setPrefWidth(300);
    itemScroll.setMinWidth(260);
    items.setId("editor-items");
    VBox left = new VBox(8, addBar(), itemScroll);
    VBox.setVgrow(itemScroll, Priority.ALWAYS);
    root.setLeft(left);
    schematic.setId("editor-schematic");
    VBox.setVgrow(schematic, Priority.ALWAYS);
    ScrollPane problemScroll = new ScrollPane(problemList);
    problemScroll.setFitToWidth(true);
    SwipePanel.of(problemScroll);
    problemScroll.setPrefHeight(150);
    problemList.setId("editor-problems");
    VBox middle = new VBox(8, schematic, problemScroll);
    middle.setPadding(new javafx.geometry.Insets(0, 10, 0, 10));
    root.setCenter(middle);
    ScrollPane detailScroll = new ScrollPane(details);
    detailScroll.setFitToWidth(true);
    SwipePanel.of(detailScroll);
    detailScroll.setPrefWidth(400);
    detailScroll.setMinWidth(360);
    details.getStyleClass().add("panel");
    details.setId("editor-details");
    root.setRight(detailScroll);
    questionPane.getStyleClass().add("problem");
    questionPane.setMaxSize(560, 260);
    questionPane.setId("editor-question");
    StackPane overlay = new StackPane(questionPane);
    overlay.getStyleClass().add("overlay");
    overlay.visibleProperty().bind(questionPane.visibleProperty());
    layers = new StackPane(root, overlay);
    layers.addEventFilter(KeyEvent.KEY_PRESSED, this::keys);
    model.addListener(this::refresh);
    refresh();
  }

  /** Returns the screen's root node. */
  public Node root() {
    return layers;
  }

  private void keys(KeyEvent event) {
    if (KeyCombination.valueOf("Shortcut+Z").match(event)) {
      model.undo();
      event.consume();
    } else if (KeyCombination.valueOf("Shortcut+Y").match(event)) {
      model.redo();
      event.consume();
    } else if (event.getCode() == KeyCode.ESCAPE && questionPane.isVisible()) {
      model.answer(false);
      event.consume();
    }
  }

  private Node topBar(Consumer<com.stagewise.circuit.Stage> onSave, Runnable onClose) {
    title.getStyleClass().add("screen-title");
    undo.setId("editor-undo");
    undo.setOnAction(e -> model.undo());
    redo.setId("editor-redo");
    redo.setOnAction(e -> model.redo());
    Button save = new Button("Save stage");
    save.setId("editor-save");
    save.getStyleClass().add("primary");
    save.setOnAction(e -> model.save().ifPresent(onSave));
    Button close = new Button("Close");
    close.setId("editor-close");
    close.setOnAction(e -> model.close(onClose));
    Button empty = new Button("Start empty");
    empty.setId("editor-start-empty");
    empty.setOnAction(e -> model.startEmpty("New stage", model.draft().board()));
    refusal.getStyleClass().add("editor-refusal");
    refusal.setWrapText(true);
    refusal.setId("editor-refusal");
    // The buttons flow beside the title where they fit and onto rows of their own where they do
    // not (larger text in a 1024 px window), rather than squeezing the title or passing the edge.
    title.setWrapText(true);
    javafx.scene.layout.FlowPane bar =
        new javafx.scene.layout.FlowPane(8, 6, title, empty, undo, redo, save, close);
    bar.setAlignment(Pos.CENTER_LEFT);
    bar.prefWrapLengthProperty().bind(root.widthProperty().subtract(24));
    return new VBox(6, bar, refusal);
  }

  private void refresh() {
    DraftStage draft = model.draft();
    title.setText("Stage editor — " + (draft.title().isBlank() ? "untitled stage" : draft.title()));
    undo.setDisable(!model.canUndo());
    redo.setDisable(!model.canRedo());
    undo.setText(model.canUndo() ? "Undo: " + model.undoLabel() : "Undo");
    refusal.setText(model.refusal());
    refusal.setVisible(!model.refusal().isEmpty());
    refusal.setManaged(!model.refusal().isEmpty());
    refreshItems(draft);
    refreshProblems();
    detailPanel.show(draft, selectedPlace, selectedKey);
    schematic.show(model.drawable());
    refreshQuestion();
  }

  private void refreshQuestion() {
    questionPane.getChildren().clear();
    questionPane.setVisible(model.question().isPresent());
    model
        .question()
        .ifPresent(
            q -> {
              Label text = new Label(q.text());
              text.setWrapText(true);
              text.getStyleClass().add("editor-question-text");
              Button yes = new Button(q.yes());
              yes.setId("editor-question-yes");
              yes.setOnAction(e -> model.answer(true));
              Button no = new Button("Keep editing");
              no.setId("editor-question-no");
              no.getStyleClass().add("primary");
              no.setOnAction(e -> model.answer(false));
              questionPane.getChildren().addAll(text, new HBox(10, no, yes));
            });
  }

  // ---------------------------------------------------------------------------------------------
  // Left: the stage's items

  private void refreshItems(DraftStage draft) {
    items.getChildren().clear();
    items.getChildren().add(heading("Stage"));
    items.getChildren().add(row("editor-item-stage", stageSummary(draft), Place.STAGE, ""));
    items.getChildren().add(heading("Op-amp sections"));
    for (DraftSection s : draft.sections()) {
      items
          .getChildren()
          .add(
              row(
                  "editor-item-" + s.ref(),
                  s.ref() + "  " + s.packageType().word() + ", " + s.deviceClass().word(),
                  Place.SECTION,
                  s.ref()));
    }
    items.getChildren().add(heading("Parts"));
    for (DraftPart p : draft.parts()) {
      items.getChildren().add(row("editor-item-" + p.ref(), PartWords.row(p), Place.PART, p.ref()));
    }
    items.getChildren().add(heading("Rails"));
    for (int i = 0; i < draft.rails().size(); i++) {
      DraftRail r = draft.rails().get(i);
      items
          .getChildren()
          .add(
              row(
                  "editor-item-rail-" + i,
                  (r.net().isEmpty() ? "(no net)" : r.net()) + "  " + r.volts().text() + " V",
                  Place.RAIL,
                  String.valueOf(i)));
    }
    items.getChildren().add(heading("Test inputs"));
    for (int i = 0; i < draft.inputs().size(); i++) {
      DraftInput in = draft.inputs().get(i);
      items
          .getChildren()
          .add(
              row(
                  "editor-item-input-" + i,
                  (in.net().isEmpty() ? "(no net)" : in.net()) + "  " + in.dc().text() + " V",
                  Place.INPUT,
                  String.valueOf(i)));
    }
  }

  /** The add buttons, always in view above the list (no scrolling to reach them). */
  private Node addBar() {
    FlowPane bar = new FlowPane(6, 6);
    bar.setId("editor-add-bar");
    bar.setPrefWrapLength(300);
    for (PackageType type : PackageType.values()) {
      bar.getChildren()
          .add(addButton("editor-add-" + type.word(), "+ " + type.word(), () -> addSection(type)));
    }
    bar.getChildren()
        .add(
            addButton(
                "editor-add-resistor",
                "+ Resistor",
                () -> select(Place.PART, model.addPart(PartKind.RESISTOR))));
    bar.getChildren()
        .add(
            addButton(
                "editor-add-capacitor",
                "+ Capacitor",
                () -> select(Place.PART, model.addPart(PartKind.CAPACITOR))));
    for (PartKind kind :
        List.of(
            PartKind.DIODE,
            PartKind.ZENER,
            PartKind.LED,
            PartKind.TRIMMER,
            PartKind.POTENTIOMETER)) {
      String word = kind == PartKind.LED ? "LED" : kind.word();
      bar.getChildren()
          .add(
              addButton(
                  "editor-add-" + kind.word(),
                  "+ " + Character.toUpperCase(word.charAt(0)) + word.substring(1),
                  () -> select(Place.PART, model.addPart(kind))));
    }
    bar.getChildren()
        .add(
            addButton(
                "editor-add-rail",
                "+ Rail",
                () -> {
                  // The usual split supply first (common practice): +15 V, then -15 V.
                  DraftStage draft = model.draft();
                  int n = draft.rails().size();
                  String net = n == 0 ? "VCC" : n == 1 ? "VEE" : nextName("V", draft);
                  model.addRail(
                      draft.nets().contains(net) ? nextName("V", draft) : net,
                      n == 0 ? "15" : n == 1 ? "-15" : "0");
                  select(Place.RAIL, String.valueOf(model.draft().rails().size() - 1));
                }));
    bar.getChildren()
        .add(
            addButton(
                "editor-add-input",
                "+ Input",
                () -> {
                  model.addInput(nextName("IN", model.draft()), "0");
                  select(Place.INPUT, String.valueOf(model.draft().inputs().size() - 1));
                }));
    return bar;
  }

  private static String nextName(String prefix, DraftStage draft) {
    if (!draft.nets().contains(prefix)) {
      return prefix;
    }
    int n = 2;
    while (draft.nets().contains(prefix + n)) {
      n++;
    }
    return prefix + n;
  }

  private static String stageSummary(DraftStage draft) {
    return (draft.title().isBlank() ? "untitled" : draft.title())
        + "  (ground "
        + draft.ground()
        + ")";
  }

  private Node heading(String text) {
    Label label = new Label(text);
    label.getStyleClass().add("section-title");
    return label;
  }

  private Node row(String id, String text, Place place, String key) {
    ToggleButton button = new ToggleButton(text);
    button.setId(id);
    button.setMaxWidth(Double.MAX_VALUE);
    button.setAlignment(Pos.CENTER_LEFT);
    // A long row (a section's package and class, a part's nets) wraps rather than being cut.
    button.setWrapText(true);
    button.setMinHeight(Region.USE_PREF_SIZE);
    button.setSelected(place == selectedPlace && key.equals(selectedKey));
    button.setOnAction(e -> select(place, key));
    button.getStyleClass().add("editor-item");
    if (!model.problemsOf(place, key).isEmpty()) {
      button.getStyleClass().add("has-problem");
    }
    VBox box = new VBox(2, button);
    for (EditorProblem problem : model.problemsOf(place, key)) {
      Label why = new Label(problem.message());
      why.setWrapText(true);
      why.getStyleClass().add("editor-problem");
      box.getChildren().add(why);
    }
    return box;
  }

  private Button addButton(String id, String text, Runnable action) {
    Button button = new Button(text);
    button.setId(id);
    button.getStyleClass().add("editor-add");
    button.setOnAction(e -> action.run());
    return button;
  }

  private void select(Place place, String key) {
    selectedPlace = place;
    selectedKey = key;
    refresh();
  }

  /** Adds the next free section of the last package of that type, else of a new package. */
  private void addSection(PackageType type) {
    DraftStage draft = model.draft();
    String pkg = model.nextPackage();
    DeviceClass cls = DeviceClass.CLASSIC_BIPOLAR;
    for (DraftSection s : draft.sections()) {
      if (s.packageType() == type && !model.freeSections(type, s.packageRef()).isEmpty()) {
        pkg = s.packageRef();
        cls = s.deviceClass();
      }
    }
    String letter = model.freeSections(type, pkg).get(0);
    model.addSection(type, pkg, letter, cls).ifPresent(ref -> select(Place.SECTION, ref));
  }

  // ---------------------------------------------------------------------------------------------
  // Middle: problems

  private void refreshProblems() {
    problemList.getChildren().clear();
    List<EditorProblem> problems = model.problems();
    Label head =
        new Label(
            problems.isEmpty()
                ? "No problems: the stage is ready to save."
                : problems.size() + " problem(s) — tap one to go to it");
    head.getStyleClass().add(problems.isEmpty() ? "hint" : "editor-problem-count");
    head.setId("editor-problem-count");
    problemList.getChildren().add(head);
    for (EditorProblem problem : problems) {
      Button go = new Button(problem.message());
      go.setWrapText(true);
      go.setMaxWidth(Double.MAX_VALUE);
      go.setAlignment(Pos.CENTER_LEFT);
      go.getStyleClass().add("editor-problem-row");
      go.setOnAction(e -> select(problem.place(), problem.key()));
      problemList.getChildren().add(go);
    }
  }
}
