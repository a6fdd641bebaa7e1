package com.stagewise.ui.stage;

import com.stagewise.solver.ExpectedVolts;
import com.stagewise.ui.drawing.SchematicDrawing;
import com.stagewise.ui.editor.StageEditorView;
import com.stagewise.ui.widget.CappedLines;
import com.stagewise.ui.widget.ListSelection;
import com.stagewise.ui.widget.ValuePad;
import com.stagewise.ui.words.Words;
import java.util.Map;
import javafx.beans.binding.Bindings;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.collections.FXCollections;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Control;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TextField;
import javafx.scene.control.ToggleButton;
import javafx.scene.control.ToggleGroup;
import javafx.scene.layout.FlowPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import org.controlsfx.validation.ValidationResult;
import org.controlsfx.validation.ValidationSupport;

/** The stage screen: library, expected voltages, parts, and the value pad with the decoders. */
public final class StageView {
  private ValidationSupport validation;
  private final BooleanProperty formInvalid = new SimpleBooleanProperty();

  private void recheck() {
    formInvalid.set(
        model.parameters().stream().anyMatch(p -> !p.problem(p.value().get()).isEmpty()));
  }

  private final StageViewModel model;
  private final HBox root = new HBox(12);
  private final StackPane layers = new StackPane();
  private final VBox expectedBox = new VBox(4);
  private final SchematicDrawing schematic = new SchematicDrawing();

  /** Builds the screen bound to its model. */
  public StageView(StageViewModel model) {
    this.model = model;
    root.getStyleClass().add("screen");
    root.getStylesheets().add(StageView.class.getResource("stage.css").toExternalForm());
    root.setId("screen-stage");
    VBox library = new LibraryPanel(model, root).build(templatePanel());
    library.setPrefWidth(250);
    library.setMinWidth(250);
    VBox middle = middlePanel();
    HBox.setHgrow(middle, Priority.ALWAYS);
    VBox editor = editorPanel();
    editor.setPrefWidth(430);
    editor.setMinWidth(430);
    root.getChildren().addAll(library, middle, editor);
    model.expectedProperty().addListener((o, was, now) -> showExpected(now));
    StageEditorView stageEditor =
        new StageEditorView(model.editor(), model::useEdited, model::closeEditor);
    Node editorRoot = stageEditor.root();
    editorRoot.visibleProperty().bind(model.editingProperty());
    root.visibleProperty().bind(model.editingProperty().not());
    layers.getChildren().addAll(root, editorRoot);
  }

  /** Returns the screen's root node: the screen, with the stage editor over it when open. */
  public Node root() {
    return layers;
  }

  /** Reloads the library (when the screen is shown again for another unit). */
  public void refresh() {
    model.loadLibrary();
  }

  private VBox templatePanel() {
    ListView<com.stagewise.circuit.template.StageTemplate> templates =
        new ListView<>(model.templates());
    templates.setId("stage-templates");
    templates.setPrefHeight(220);
    templates.setCellFactory(
        v ->
            new ListCell<>() {
              {
                setPrefWidth(0);
              }

              @Override
              protected void updateItem(
                  com.stagewise.circuit.template.StageTemplate t, boolean empty) {
                super.updateItem(t, empty);
                setText(empty || t == null ? null : t.title());
                setWrapText(true);
              }
            });
    templates
        .getSelectionModel()
        .selectedItemProperty()
        .addListener((o, was, t) -> model.templateProperty().set(t));
    VBox form = new VBox(4);
    form.setId("template-form");
    model
        .parameters()
        .addListener(
            (javafx.collections.ListChangeListener<ParameterEntry>)
                c -> {
                  form.getChildren().clear();
                  var t = model.templateProperty().get();
                  if (t != null) {
                    Label about = new Label(t.description());
                    about.getStyleClass().add("hint");
                    about.setWrapText(true);
                    form.getChildren().add(about);
                  }
                  validation = new ValidationSupport();
                  for (ParameterEntry entry : model.parameters()) {
                    Label label = new Label(entry.label());
                    label.setWrapText(true);
                    label.getStyleClass().add("parameter-label");
                    Control field;
                    if (entry.choices().isEmpty()) {
                      TextField text = new TextField();
                      text.textProperty().bindBidirectional(entry.value());
                      field = text;
                    } else {
                      // A list, not free text to be spelt exactly.
                      ComboBox<String> choice =
                          new ComboBox<>(FXCollections.observableArrayList(entry.choices()));
                      choice.valueProperty().bindBidirectional(entry.value());
                      choice.setMaxWidth(Double.MAX_VALUE);
                      field = choice;
                    }
                    field.setId("template-" + entry.parameter().name());
                    // Checked as it is typed, the message beside the field (ControlsFX).
                    validation.registerValidator(
                        field,
                        false,
                        (Control control, Object value) ->
                            ValidationResult.fromErrorIf(
                                control,
                                entry.problem(value == null ? "" : value.toString()),
                                !entry.problem(value == null ? "" : value.toString()).isEmpty()));
                    Label problem = new Label();
                    problem.getStyleClass().add("field-problem");
                    problem.setWrapText(true);
                    problem
                        .textProperty()
                        .bind(
                            Bindings.createStringBinding(
                                () -> entry.problem(entry.value().get()), entry.value()));
                    problem.visibleProperty().bind(problem.textProperty().isNotEmpty());
                    problem.managedProperty().bind(problem.visibleProperty());
                    form.getChildren().addAll(label, field, problem);
                    entry.value().addListener((ov, was, now) -> recheck());
                  }
                  recheck();
                });
    ScrollPane scroll = new ScrollPane(form);
    scroll.setFitToWidth(true);
    VBox.setVgrow(scroll, Priority.ALWAYS);
    // The list keeps about four rows after a pick; the form scrolls below it.
    templates.setMinHeight(4 * 48 + 4);
    templates.setPrefHeight(5 * 48 + 4);
    Button build = new Button("Build the stage");
    build.setId("template-build");
    build.getStyleClass().add("primary");
    build.setMaxWidth(Double.MAX_VALUE);
    build.disableProperty().bind(model.templateProperty().isNull().or(formInvalid));
    build.setOnAction(e -> model.buildFromTemplate());
    return new VBox(8, templates, scroll, build);
  }

  private VBox middlePanel() {
    VBox box = new VBox(10);
    Label title = new Label();
    title.setId("stage-title");
    title.getStyleClass().add("screen-title");
    title.setWrapText(true);
    title
        .textProperty()
        .bind(
            Bindings.createStringBinding(
                () ->
                    model.stageProperty().get() == null
                        ? "Choose the stage you are working on"
                        : model.stageProperty().get().title(),
                model.stageProperty()));
    // At most four lines, the rest in the tooltip: a long title (a sheet's may have 200
    // characters) must not push Use this stage out of a small window.
    CappedLines.cap(title, 4);
    VBox drawing = new VBox(4);
    drawing.getStyleClass().add("panel");
    drawing.setId("stage-drawing");
    schematic.setId("stage-schematic");
    VBox.setVgrow(schematic, Priority.ALWAYS);
    Label drawingTitle = new Label("Blue: what a healthy stage reads at each net");
    drawingTitle.getStyleClass().add("hint");
    drawing.getChildren().addAll(drawingTitle, schematic, expectedBox);
    VBox.setVgrow(drawing, Priority.ALWAYS);
    model
        .stageProperty()
        .addListener(
            (o, was, now) -> {
              // A new case starts with no stage: the last case's drawing must not stay behind.
              schematic.setVisible(now != null);
              if (now != null) {
                schematic.show(now);
              }
            });
    Label partsTitle = new Label("Parts — tap one to check or change its value");
    partsTitle.getStyleClass().add("section-title");
    ListView<PartRow> parts = new ListView<>(model.parts());
    parts.setId("stage-parts");
    parts.setPrefHeight(200);
    parts.setCellFactory(
        v ->
            new ListCell<>() {
              {
                // No wider than the list: a long part line wraps instead of scrolling sideways.
                setPrefWidth(0);
                setWrapText(true);
              }

              @Override
              protected void updateItem(PartRow row, boolean empty) {
                super.updateItem(row, empty);
                setText(empty || row == null ? null : row.line());
              }
            });
    ListSelection.bind(parts, model.selectedPartProperty());
    Button use = new Button("Use this stage");
    use.setTooltip(
        new javafx.scene.control.Tooltip("Diagnose with this stage: go on to the readings"));
    use.setId("use-stage");
    use.getStyleClass().add("primary");
    use.setMaxWidth(Double.MAX_VALUE);
    use.disableProperty().bind(model.stageProperty().isNull());
    use.setOnAction(e -> model.useStage());
    // The next action under the stage's name, at the top of the screen: in sight without
    // scrolling in a small window (1024×600), where the value pad makes the screen taller than it.
    box.getChildren().addAll(title, use, drawing, partsTitle, parts);
    return box;
  }

  private void showExpected(ExpectedVolts expected) {
    expectedBox.getChildren().clear();
    if (expected == null) {
      return;
    }
    if (!expected.solved()) {
      schematic.setNetLabels(Map.of());
      Label problem = new Label("Cannot work out this stage: " + expected.problem());
      problem.setWrapText(true);
      problem.setMinHeight(Region.USE_PREF_SIZE);
      expectedBox.getChildren().add(problem);
      return;
    }
    Map<String, String> labels = new java.util.LinkedHashMap<>();
    StringBuilder ranges = new StringBuilder();
    for (Map.Entry<String, Double> net : expected.nominal().entrySet()) {
      if (net.getKey().contains(".")) {
        continue;
      }
      labels.put(net.getKey(), Words.volts(net.getValue()));
      double low = expected.low().getOrDefault(net.getKey(), net.getValue());
      double high = expected.high().getOrDefault(net.getKey(), net.getValue());
      if (high - low >= 0.0105 && !model.stageProperty().get().isDriven(net.getKey())) {
        ranges
            .append(ranges.length() == 0 ? "Healthy range: " : ",  ")
            .append(net.getKey())
            .append(' ')
            .append(Words.band(low, high));
      }
    }
    schematic.setNetLabels(labels);
    Label nets = new Label(ranges.toString());
    nets.setWrapText(true);
    // Made after the screen was put in the window: it needs its lines' height set here.
    nets.setMinHeight(Region.USE_PREF_SIZE);
    StringBuilder states = new StringBuilder();
    expected
        .states()
        .forEach(
            (ref, state) ->
                states
                    .append(ref)
                    .append(": ")
                    .append(
                        state.equals("linear")
                            ? "working normally (linear)"
                            : "output at its "
                                + (state.equals("high") ? "upper" : "lower")
                                + " limit")
                    .append("   "));
    Label stateLine = new Label(states.toString().strip());
    stateLine.getStyleClass().add("hint");
    stateLine.setWrapText(true);
    stateLine.setMinHeight(Region.USE_PREF_SIZE);
    expectedBox.getChildren().addAll(nets, stateLine);
  }

  private VBox editorPanel() {
    VBox box = new VBox(10);
    box.getStyleClass().add("panel");
    Label title = new Label();
    title.getStyleClass().add("section-title");
    title
        .textProperty()
        .bind(
            Bindings.createStringBinding(
                () ->
                    model.selectedPartProperty().get() == null
                        ? "No part chosen"
                        : "Part " + model.selectedPartProperty().get().part().ref(),
                model.selectedPartProperty()));
    TextField designator = new TextField();
    designator.setId("part-designator");
    designator.setPrefColumnCount(6);
    designator.textProperty().bindBidirectional(model.designatorProperty());
    designator.setOnAction(e -> model.applyDesignator());
    Button rename = new Button("Rename");
    rename.setId("part-rename");
    rename.setOnAction(e -> model.applyDesignator());
    Label designatorLabel = new Label("Designator");
    designatorLabel.setMinWidth(Region.USE_PREF_SIZE);
    // Rows of controls wrap onto a second line where larger text leaves them no room.
    FlowPane renameRow = new FlowPane(8, 6, designatorLabel, designator, rename);
    renameRow.setAlignment(Pos.CENTER_LEFT);
    ToggleGroup mode = new ToggleGroup();
    ToggleButton padTab = new ToggleButton("Value pad");
    padTab.setId("tab-pad");
    ToggleButton bandsTab = new ToggleButton("Colour bands / SMD");
    bandsTab.setId("tab-decoder");
    padTab.setToggleGroup(mode);
    bandsTab.setToggleGroup(mode);
    padTab.setSelected(true);
    ValuePad pad = new ValuePad(model.pad(), "part", "Set value", model::applyValue);
    // A trimmer's pad sets its end-to-end value or, with this on, its wiper position (0 to 1).
    ToggleButton wiperTab = new ToggleButton("Wiper position");
    wiperTab.setId("part-wiper");
    wiperTab.selectedProperty().bindBidirectional(model.wiperProperty());
    wiperTab
        .visibleProperty()
        .bind(
            Bindings.createBooleanBinding(
                () ->
                    model.selectedPartProperty().get() != null
                        && model.selectedPartProperty().get().part().kind().isTrimmer(),
                model.selectedPartProperty()));
    wiperTab.managedProperty().bind(wiperTab.visibleProperty());
    VBox decoder = decoderPanel(() -> padTab.setSelected(true));
    decoder.visibleProperty().bind(bandsTab.selectedProperty());
    pad.visibleProperty().bind(bandsTab.selectedProperty().not());
    StackPane modes = new StackPane(pad, decoder);
    modes.setAlignment(Pos.TOP_LEFT);
    // Keep one tab selected: a second tap on the selected tab would otherwise clear both.
    mode.selectedToggleProperty()
        .addListener(
            (o, was, now) -> {
              if (now == null) {
                was.setSelected(true);
              }
            });
    VBox editing = new VBox(10, renameRow, new FlowPane(8, 6, padTab, bandsTab), wiperTab, modes);
    editing.disableProperty().bind(model.selectedPartProperty().isNull());
    box.getChildren().addAll(title, editing);
    return box;
  }

  private VBox decoderPanel(Runnable backToPad) {
    DecoderModel decoder = model.decoder();
    VBox box = new VBox(8);
    FlowPane colours = new FlowPane(5, 5);
    for (String colour : DecoderModel.COLOURS) {
      Button band = new Button(colour);
      band.setId("band-" + colour);
      band.setFocusTraversable(false);
      band.getStyleClass().addAll("colour-band", "band-" + colour);
      band.setOnAction(e -> decoder.addBand(colour));
      colours.getChildren().add(band);
    }
    Button undo = new Button("Remove last band");
    undo.setOnAction(e -> decoder.removeBand());
    TextField smd = new TextField();
    smd.setId("smd-code");
    smd.setPromptText("SMD code, e.g. 472 or 01C");
    smd.textProperty().bindBidirectional(decoder.smdProperty());
    Label result = new Label();
    result.setId("decoder-result");
    result.setWrapText(true);
    result.textProperty().bind(decoder.resultProperty());
    Button use = new Button("Use this value");
    use.setId("decoder-use");
    use.getStyleClass().add("primary");
    use.disableProperty().bind(decoder.ohmsProperty().isNull());
    use.setOnAction(
        e -> {
          model.pad().setValue(decoder.ohmsProperty().get());
          decoder.clear();
          backToPad.run();
        });
    Button clear = new Button("Clear");
    clear.setOnAction(e -> decoder.clear());
    box.getChildren().addAll(colours, new FlowPane(8, 6, undo, clear), smd, result, use);
    return box;
  }
}
