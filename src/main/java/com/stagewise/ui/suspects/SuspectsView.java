package com.stagewise.ui.suspects;

import com.stagewise.ui.drawing.SchematicDrawing;
import com.stagewise.ui.widget.ListSelection;
import com.stagewise.ui.words.Words;
import java.util.LinkedHashMap;
import java.util.Map;
import javafx.beans.binding.Bindings;
import javafx.collections.ListChangeListener;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.ToggleButton;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import org.controlsfx.control.SegmentedButton;

/**
 * The suspects screen: the ranked list, and the chosen suspect's voltages beside the measured ones.
 */
public final class SuspectsView {
  /** Width in pixels of a suspect's probability bar at 100 %. */
  private static final double BAR = 140;

  private final SuspectsViewModel model;
  private final HBox root = new HBox(12);
  private final GridPane table = new GridPane();
  private final SchematicDrawing schematic = new SchematicDrawing();

  /** Builds the screen bound to its model. */
  public SuspectsView(SuspectsViewModel model) {
    this.model = model;
    root.getStyleClass().add("screen");
    root.getStylesheets().add(SuspectsView.class.getResource("suspects.css").toExternalForm());
    root.setId("screen-suspects");
    VBox left = listPanel();
    left.setPrefWidth(640);
    HBox.setHgrow(left, Priority.ALWAYS);
    VBox right = detailPanel();
    right.setPrefWidth(560);
    right.setMinWidth(500);
    root.getChildren().addAll(left, right);
    model
        .comparison()
        .addListener((ListChangeListener<SuspectsViewModel.PointRow>) c -> showTable());
    model.selectedProperty().addListener((o, was, now) -> showTable());
    showTable();
  }

  /** Returns the screen's root node. */
  public Node root() {
    return root;
  }

  private VBox listPanel() {
    VBox box = new VBox(8);
    box.getStyleClass().add("panel");
    Label title = new Label("Suspects, most likely first");
    title.getStyleClass().add("section-title");
    Label verdict = new Label();
    verdict.setId("suspects-verdict");
    verdict.getStyleClass().add("verdict");
    verdict.setWrapText(true);
    verdict.textProperty().bind(model.verdictProperty());
    ListView<SuspectsViewModel.SuspectRow> list = new ListView<>(model.suspects());
    list.setId("suspect-list");
    VBox.setVgrow(list, Priority.ALWAYS);
    list.setCellFactory(v -> new SuspectCell());
    ListSelection.bind(list, model.selectedProperty());
    // A new suspect list opens at its first suspect, not where the last one was scrolled to.
    model
        .suspects()
        .addListener(
            (ListChangeListener<SuspectsViewModel.SuspectRow>)
                c -> javafx.application.Platform.runLater(() -> list.scrollTo(0)));
    if (model.selectedProperty().get() != null) {
      list.getSelectionModel().select(model.selectedProperty().get());
    }
    Label findings = new Label();
    findings.setId("suspects-findings");
    findings.setWrapText(true);
    findings.getStyleClass().add("hint");
    findings.textProperty().bind(model.findingsProperty());
    box.getChildren().addAll(title, verdict, list, findings);
    return box;
  }

  private VBox detailPanel() {
    VBox box = new VBox(10);
    box.getStyleClass().add("panel");
    Label title = new Label();
    title.setId("suspect-chosen");
    title.getStyleClass().add("section-title");
    title.setWrapText(true);
    title
        .textProperty()
        .bind(
            Bindings.createStringBinding(
                () ->
                    model.selectedProperty().get() == null
                        ? "Volts at each test point"
                        : "If it is " + model.selectedProperty().get().title() + ":",
                model.selectedProperty()));
    table.setId("suspect-volts");
    table.setHgap(18);
    table.setVgap(4);
    ScrollPane scroll = new ScrollPane(table);
    scroll.setFitToWidth(true);
    schematic.setId("suspect-schematic");
    ToggleButton asDrawing = new ToggleButton("Schematic");
    asDrawing.setId("suspect-as-schematic");
    ToggleButton asTable = new ToggleButton("Table");
    asTable.setId("suspect-as-table");
    // One control of two joined halves (ControlsFX): the suspect shown as a drawing or a table.
    SegmentedButton viewRow = new SegmentedButton(asDrawing, asTable);
    viewRow.setId("suspect-view");
    asDrawing.setSelected(true);
    viewRow
        .getToggleGroup()
        .selectedToggleProperty()
        .addListener(
            (o, was, now) -> {
              if (now == null) {
                was.setSelected(true);
              }
            });
    schematic.visibleProperty().bind(asDrawing.selectedProperty());
    scroll.visibleProperty().bind(asTable.selectedProperty());
    StackPane shown = new StackPane(schematic, scroll);
    VBox.setVgrow(shown, Priority.ALWAYS);
    Label checkTitle = new Label("To confirm the first suspect");
    checkTitle.getStyleClass().add("section-title");
    Label check = new Label();
    check.setId("confirming-check");
    check.setWrapText(true);
    check.textProperty().bind(model.confirmingCheckProperty());
    check.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
    Label caution =
        new Label("Unplug the unit and discharge the capacitors before any ohms check.");
    caution.setWrapText(true);
    caution.getStyleClass().add("ohms-caution");
    caution.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
    Button back = new Button("More readings");
    back.setId("suspects-more");
    back.setOnAction(e -> model.moreReadings());
    Button close = new Button("Close out with this fault");
    close.setId("suspects-close-out");
    close.getStyleClass().add("primary");
    close.disableProperty().bind(model.selectedProperty().isNull());
    close.setOnAction(e -> model.closeOutWithSelected());
    box.getChildren()
        .addAll(
            title,
            viewRow,
            shown,
            checkTitle,
            check,
            caution,
            // Side by side, or one under the other where larger text leaves no room for both.
            new javafx.scene.layout.FlowPane(10, 8, back, close));
    return box;
  }

  private void showDrawing() {
    var stage = model.stageProperty().get();
    if (stage == null) {
      return;
    }
    if (stage != shownStage) {
      schematic.show(stage);
      shownStage = stage;
    }
    Map<String, String> pins = stage.pinNets();
    Map<String, String> healthy = new LinkedHashMap<>();
    Map<String, String> predicted = new LinkedHashMap<>();
    Map<String, String> measured = new LinkedHashMap<>();
    var selected = model.selectedProperty().get();
    var expected = model.expectedProperty().get();
    for (String net : stage.nets()) {
      if (expected != null && expected.solved() && expected.nominal().containsKey(net)) {
        healthy.put(net, Words.volts(expected.at(net)));
      }
      if (selected != null && selected.suspect().predicted().containsKey(net)) {
        predicted.put(net, Words.volts(selected.suspect().predicted().get(net)));
      }
    }
    for (SuspectsViewModel.PointRow p : model.comparison()) {
      if (!Double.isNaN(p.measured()) && p.ac().isEmpty()) {
        measured.put(pins.getOrDefault(p.at(), p.at()), Words.measured(p.measured()));
      }
    }
    schematic.setNetLabels(healthy);
    schematic.setSecondLabels(predicted, selected == null ? "" : "if " + selected.title());
    schematic.setMeasured(measured);
  }

  private com.stagewise.circuit.Stage shownStage;

  private void showTable() {
    showDrawing();
    table.getChildren().clear();
    String[] heads = {
      "Test point",
      "Healthy",
      "Measured",
      model.selectedProperty().get() == null ? "Suspect" : "If this suspect"
    };
    for (int c = 0; c < heads.length; c++) {
      Label head = new Label(heads[c]);
      head.getStyleClass().add("strong");
      table.add(head, c, 0);
    }
    int row = 1;
    for (SuspectsViewModel.PointRow p : model.comparison()) {
      // An AC row names its measure: the figures beside it are amplitudes in that measure.
      table.add(new Label(Words.pin(p.at()) + (p.ac().isEmpty() ? "" : ", " + p.ac())), 0, row);
      table.add(mono(Words.volts(p.healthy())), 1, row);
      Label measured = mono(Double.isNaN(p.measured()) ? "not read" : Words.measured(p.measured()));
      if (!Double.isNaN(p.measured())) {
        measured.getStyleClass().add("strong");
      }
      table.add(measured, 2, row);
      Label predicted = mono(Words.volts(p.predicted()));
      predicted.getStyleClass().add("predicted");
      table.add(predicted, 3, row);
      row++;
    }
  }

  private static Label mono(String text) {
    Label label = new Label(text);
    label.getStyleClass().add("mono");
    return label;
  }

  /** One suspect: rank, name, probability bar, why, group, estimate. */
  private static final class SuspectCell extends ListCell<SuspectsViewModel.SuspectRow> {
    SuspectCell() {
      setPrefWidth(0);
    }

    @Override
    protected void updateItem(SuspectsViewModel.SuspectRow row, boolean empty) {
      super.updateItem(row, empty);
      if (empty || row == null) {
        setGraphic(null);
        setText(null);
        return;
      }
      Label name = new Label(row.rank() + ".  " + row.title());
      name.getStyleClass().add("suspect-name");
      Region bar = new Region();
      bar.getStyleClass().add("suspect-bar");
      bar.setPrefWidth(Math.max(2, BAR * row.suspect().probability()));
      bar.setMinWidth(Region.USE_PREF_SIZE);
      Region track = new Region();
      track.getStyleClass().add("suspect-bar-track");
      track.setPrefWidth(BAR * (1 - row.suspect().probability()));
      track.setMinWidth(Region.USE_PREF_SIZE);
      Label pct = new Label(Words.percent(row.suspect().probability()));
      pct.getStyleClass().add("strong");
      // The figure stays on one line ("96 %", never "96" over "%"); the bar and the name give way.
      pct.setWrapText(false);
      pct.setMinWidth(Region.USE_PREF_SIZE);
      Region spring = new Region();
      HBox.setHgrow(spring, Priority.ALWAYS);
      HBox head = new HBox(8, name, spring, new HBox(0, bar, track), pct);
      head.setAlignment(Pos.CENTER_LEFT);
      VBox box = new VBox(3, head);
      Label why = new Label(row.suspect().why());
      why.setWrapText(true);
      box.getChildren().add(why);
      if (!row.group().isEmpty()) {
        Label group = new Label("Cannot yet be told apart from: " + row.group());
        group.setWrapText(true);
        group.getStyleClass().add("group-note");
        box.getChildren().add(group);
      }
      if (!row.estimate().isEmpty()) {
        Label estimate = new Label(row.estimate());
        estimate.getStyleClass().add("strong");
        box.getChildren().add(estimate);
      }
      if (!row.suspect().consistent()) {
        Label off = new Label("Does not explain every reading.");
        off.getStyleClass().add("hint");
        box.getChildren().add(off);
      }
      setText(null);
      setGraphic(box);
    }
  }
}
