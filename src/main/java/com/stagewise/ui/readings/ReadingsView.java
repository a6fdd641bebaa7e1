package com.stagewise.ui.readings;

import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.ui.Bench;
import com.stagewise.ui.drawing.PackageDrawing;
import com.stagewise.ui.drawing.SchematicDrawing;
import com.stagewise.ui.widget.ValuePad;
import com.stagewise.ui.words.Words;
import java.util.List;
import java.util.Map;
import javafx.beans.binding.Bindings;
import javafx.collections.ListChangeListener;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.ComboBox;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.control.ProgressIndicator;
import javafx.scene.control.Toggle;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import org.controlsfx.control.SegmentedButton;

/**
 * The readings screen: the pin to probe on the package, the value pad, and what the readings show.
 */
public final class ReadingsView {
  private final ReadingsViewModel model;
  private final Bench bench;
  private final VBox root = new VBox(8);
  private final PackageDrawing drawing = new PackageDrawing();
  private final SchematicDrawing schematic = new SchematicDrawing();
  private final VBox suspectsBox = new VBox(6);
  private final javafx.scene.control.ScrollPane probeScroll = new javafx.scene.control.ScrollPane();
  private String shownPackage = "";
  private Stage schematicStage;

  /** Builds the screen bound to its model. */
  public ReadingsView(ReadingsViewModel model, Bench bench) {
    this.model = model;
    this.bench = bench;
    root.getStyleClass().add("screen");
    root.getStylesheets().add(ReadingsView.class.getResource("readings.css").toExternalForm());
    root.setId("screen-readings");
    VBox probe = probePanel();
    // At 1024 wide the three columns share the width: the probe and the pad narrow (keys to their
    // 48 px touch minimum) before the suspects do, so that no suspect's name is squeezed away. The
    // probe column's preferred width is in em (readings.css), so that with larger text its two
    // switches still sit side by side at 1280 wide.
    probe.getStyleClass().add("probe-column");
    probe.setMinWidth(330);
    // A wide window (1920) gives the probe column and its drawing their share of the room too, up
    // to a width in em (readings.css), instead of leaving them at 380 px beside a vast results
    // column.
    HBox.setHgrow(probe, Priority.ALWAYS);
    VBox pad = new VBox(6);
    pad.getStyleClass().add("panel");
    ValuePad valuePad = new ValuePad(model.pad(), "reading", "Add reading", model::addReading);
    // Add reading as a tall key beside the digits, the pad's notes below the keys: the keys and
    // Add reading stand whole in a 1024×600 window, larger text too.
    valuePad.enterInKeys();
    valuePad.addNote(AcViews.padTakes(model));
    valuePad.getStyleClass().add("reading-pad");
    VBox.setVgrow(valuePad, Priority.ALWAYS);
    pad.getChildren().addAll(AcViews.padBar(model), correctingBar(), valuePad);
    pad.setMinWidth(342);
    // Its keys need about 340 px; what is left over goes to the results.
    pad.setPrefWidth(360);
    pad.setMaxWidth(396);
    VBox results = resultsPanel();
    results.setMinWidth(276);
    // A set preferred width: a long text in the results must not take the probe column's room
    // (HBox shrinks every column alike from its preferred width); what is left over is shared
    // with the probe column.
    results.setPrefWidth(430);
    HBox.setHgrow(results, Priority.ALWAYS);
    HBox columns = new HBox(12, probe, pad, results);
    VBox.setVgrow(columns, Priority.ALWAYS);
    root.getChildren().add(columns);
    model.probeProperty().addListener((o, was, now) -> showProbe(now));
    PowerOffMode mode = model.powerOff();
    mode.fromProperty().addListener((o, was, now) -> showProbe(model.probeProperty().get()));
    mode.toProperty().addListener((o, was, now) -> showProbe(model.probeProperty().get()));
    mode.activeProperty().addListener((o, was, now) -> showProbe(model.probeProperty().get()));
    bench.readings().addListener((ListChangeListener<Reading>) c -> showPinTexts());
    model.topSuspects().addListener((ListChangeListener<Suspect>) c -> showSuspects());
    showProbe(model.probeProperty().get());
    showSuspects();
  }

  /** Returns the screen's root node. */
  public Node root() {
    return root;
  }

  private VBox probePanel() {
    VBox box = new VBox(8);
    box.getStyleClass().add("panel");
    Label call = new Label();
    call.setId("probe-call");
    call.getStyleClass().add("probe-call");
    call.setWrapText(true);
    call.textProperty()
        .bind(
            Bindings.createStringBinding(
                () ->
                    model.probeProperty().get() == null
                        ? (bench.readings().isEmpty()
                            ? "Choose a test point"
                            : "No further probe needed")
                        : model.probeProperty().get().call(),
                model.probeProperty()));
    // A call with its AC measure ("Probe U1 pin 1 (AC volts RMS at 1 kHz)") in a smaller size:
    // at the large size it took four lines of a 1024 px window's narrow column.
    call.textProperty()
        .addListener(
            (o, was, now) -> {
              call.getStyleClass().remove("long");
              if (now != null && now.contains(" (")) {
                call.getStyleClass().add("long");
              }
            });
    Label title = new Label();
    title.setId("probe-title");
    title.setWrapText(true);
    title.getStyleClass().add("strong");
    title.setMinHeight(Region.USE_PREF_SIZE);
    title
        .textProperty()
        .bind(
            Bindings.createStringBinding(
                () ->
                    model.probeProperty().get() == null ? "" : model.probeProperty().get().title(),
                model.probeProperty()));
    Label why = new Label();
    why.setId("probe-why");
    why.getStyleClass().add("probe-why");
    why.setMinHeight(Region.USE_PREF_SIZE);
    why.setWrapText(true);
    why.textProperty()
        .bind(
            Bindings.createStringBinding(
                () -> model.probeProperty().get() == null ? "" : model.probeProperty().get().why(),
                model.probeProperty()));
    drawing.setId("package-drawing");
    drawing.setOnPinChosen(pin -> model.choose(shownPackage + "." + pin));
    drawing.setMaxWidth(Double.MAX_VALUE);
    // The drawing keeps the height of its smallest layout with finger-sized pins (it scrolls in
    // the probe column instead of shrinking); only a column too narrow for it scales it a little.
    drawing.setMinSize(0, Region.USE_COMPUTED_SIZE);
    schematic.setId("readings-schematic");
    schematic.targets().setOnPointChosen(model::choose);
    schematic.setMaxWidth(Double.MAX_VALUE);
    schematic.setMinSize(0, 0);
    schematic.setVisible(false);
    StackPane drawingHolder = new StackPane(drawing, schematic);
    VBox.setVgrow(drawingHolder, Priority.ALWAYS);
    drawingHolder.setId("drawing-holder");
    javafx.scene.control.ToggleButton onPackage = new javafx.scene.control.ToggleButton("Package");
    onPackage.setId("show-package");
    javafx.scene.control.ToggleButton onSchematic =
        new javafx.scene.control.ToggleButton("Schematic");
    onSchematic.setId("show-schematic");
    // One control of two joined halves (ControlsFX): where the points are picked.
    SegmentedButton views = new SegmentedButton(onPackage, onSchematic);
    views.setId("readings-view");
    onPackage.setSelected(true);
    // Pins on the package; nets and part leads (R2.1, D1.a) on the schematic.
    onPackage.setOnAction(e -> showSchematic(false, onPackage, onSchematic));
    onSchematic.setOnAction(e -> showSchematic(true, onPackage, onSchematic));
    onPackage.setMinWidth(Region.USE_PREF_SIZE);
    onSchematic.setMinWidth(Region.USE_PREF_SIZE);
    Label tapHint = new Label("Tap a pin, a wire or a part's lead");
    tapHint.getStyleClass().add("hint");
    tapHint.setWrapText(true);
    VBox viewBar = new VBox(4, views);
    ComboBox<ProbePoint> other = new ComboBox<>(model.testPoints());
    other.setId("other-point");
    other.setMaxWidth(Double.MAX_VALUE);
    other.setCellFactory(
        v ->
            new ListCell<>() {
              @Override
              protected void updateItem(ProbePoint p, boolean empty) {
                super.updateItem(p, empty);
                setText(empty || p == null ? null : p.title());
              }
            });
    // A custom button cell shows nothing once the choice is cleared; it shows the prompt instead.
    other.setButtonCell(
        new ListCell<>() {
          @Override
          protected void updateItem(ProbePoint p, boolean empty) {
            super.updateItem(p, empty);
            setText(empty || p == null ? other.getPromptText() : p.title());
          }
        });
    // Another stage or case: the box shows its prompt again, never a point of the last one.
    model
        .testPoints()
        .addListener(
            (ListChangeListener<ProbePoint>) c -> other.getSelectionModel().clearSelection());
    other.setOnAction(
        e -> {
          ProbePoint p = other.getValue();
          if (p != null) {
            model.choose(p.at());
            other.getSelectionModel().clearSelection();
          }
        });
    Button suggested = new Button();
    suggested.setId("probe-suggested");
    suggested
        .textProperty()
        .bind(
            Bindings.when(model.powerOff().activeProperty())
                .then("Back to suggested pair")
                .otherwise("Back to suggested probe"));
    suggested.setOnAction(e -> model.followSuggestion());
    // Its words wrap onto a second line where larger text leaves the column too narrow.
    suggested.setWrapText(true);
    suggested.setMinHeight(Region.USE_PREF_SIZE);
    other.setPromptText("Choose a point");
    // The words above the list, where they wrap, rather than in the box, which would cut them.
    Label otherTitle = new Label();
    otherTitle.setId("other-point-title");
    otherTitle.setWrapText(true);
    otherTitle.setMinHeight(Region.USE_PREF_SIZE);
    otherTitle
        .textProperty()
        .bind(
            Bindings.when(model.powerOff().activeProperty())
                .then("Or pick a point from the list:")
                .otherwise("Or probe another point:"));
    // In sight whatever the window: where the probe goes, in words. What may scroll within the
    // column in a small window follows: the drawing (brought to the lit pin), the other ways to
    // choose a point, why this point, the test signal.
    VBox powered = new VBox(6, call, title);
    PowerOffViews.showWhen(powered, model.powerOff().activeProperty().not());
    VBox poweredMore = new VBox(8, why, AcViews.signalRow(model));
    PowerOffViews.showWhen(poweredMore, model.powerOff().activeProperty().not());
    VBox more =
        new VBox(
            8,
            tapHint,
            drawingHolder,
            viewBar,
            new VBox(4, otherTitle, other),
            suggested,
            poweredMore);
    more.getStyleClass().add("probe-more");
    probeScroll.setContent(more);
    probeScroll.setId("probe-scroll");
    probeScroll.setFitToWidth(true);
    probeScroll.setFitToHeight(true);
    probeScroll.setHbarPolicy(javafx.scene.control.ScrollPane.ScrollBarPolicy.NEVER);
    probeScroll.setVbarPolicy(javafx.scene.control.ScrollPane.ScrollBarPolicy.AS_NEEDED);
    probeScroll.setMinHeight(120);
    VBox.setVgrow(probeScroll, Priority.ALWAYS);
    probeScroll
        .viewportBoundsProperty()
        .addListener(
            (o, was, now) -> {
              if (was == null || was.getHeight() != now.getHeight()) {
                javafx.application.Platform.runLater(this::bringPinIntoView);
              }
            });
    box.getChildren()
        .addAll(
            PowerOffViews.modeBar(model), powered, PowerOffViews.pairHeader(model), probeScroll);
    return box;
  }

  /**
   * Scrolls the probe column's lower part, where it scrolls in a small window, so that the lit pin
   * of the drawing stands in sight.
   */
  private void bringPinIntoView() {
    javafx.geometry.Bounds pin = drawing.highlightedBounds();
    Node content = probeScroll.getContent();
    if (pin == null || !drawing.isVisible() || content == null) {
      return;
    }
    double view = probeScroll.getViewportBounds().getHeight();
    // The whole drawing where it fits the view (its line naming the pin at the top), else the pin.
    javafx.geometry.Bounds whole = drawing.getLayoutBounds();
    javafx.geometry.Bounds place =
        content.sceneToLocal(drawing.localToScene(whole.getHeight() <= view ? whole : pin));
    double room = content.getLayoutBounds().getHeight() - view;
    if (room <= 0 || place == null) {
      return;
    }
    double top = probeScroll.getVvalue() * room;
    if (place.getMinY() >= top && place.getMaxY() <= top + view) {
      return;
    }
    double wanted = place.getMinY() < top ? place.getMinY() - 8 : place.getMaxY() - view + 8;
    probeScroll.setVvalue(Math.max(0, Math.min(1, wanted / room)));
  }

  private void showProbe(ProbePoint volts) {
    Stage stage = bench.stageProperty().get();
    if (stage == null) {
      return;
    }
    PowerOffMode mode = model.powerOff();
    ProbePoint p = mode.activeProperty().get() ? mode.fromProperty().get() : volts;
    ProbePoint q = mode.activeProperty().get() ? mode.toProperty().get() : null;
    if ((p == null || !p.isPin()) && q != null && q.isPin()) {
      ProbePoint swap = p;
      p = q;
      q = swap;
    }
    String pkg =
        p != null && p.isPin()
            ? p.packageRef()
            : stage.packages().isEmpty() ? "" : stage.packages().get(0);
    if (!pkg.isEmpty()
        && (!pkg.equals(shownPackage) || drawing.highlighted() == 0 && p != null && p.isPin())) {
      drawing.show(stage.packageType(pkg).orElseThrow(), pkg, null);
      shownPackage = pkg;
      showPinTexts();
    }
    java.util.Set<String> lit = new java.util.HashSet<>();
    for (ProbePoint point : new ProbePoint[] {p, q}) {
      if (point != null && !point.isPin()) {
        lit.add(point.at());
      }
    }
    if (schematicStage != stage) {
      schematic.show(stage);
      schematicStage = stage;
    }
    schematic.targets().setChosen(lit);
    int second = q != null && q.isPin() && q.packageRef().equals(pkg) ? q.pin() : 0;
    drawing.highlight(p != null && p.isPin() ? p.pin() : 0, second);
    javafx.application.Platform.runLater(this::bringPinIntoView);
  }

  private void showSchematic(boolean on, Toggle onPackage, Toggle onSchematic) {
    schematic.setVisible(on);
    drawing.setVisible(!on);
    onPackage.setSelected(!on);
    onSchematic.setSelected(on);
  }

  private void showPinTexts() {
    Stage stage = bench.stageProperty().get();
    if (stage == null || shownPackage.isEmpty()) {
      return;
    }
    Map<String, String> pins = stage.pinNets();
    for (Map.Entry<String, String> pin : pins.entrySet()) {
      if (!pin.getKey().startsWith(shownPackage + ".")) {
        continue;
      }
      int number = Integer.parseInt(pin.getKey().substring(shownPackage.length() + 1));
      String text = pin.getValue();
      for (Reading r : bench.readings()) {
        if (r.at().equals(pin.getKey()) && r.kind() == Reading.Kind.DC) {
          // Only the value: the pin's role and net are already beside it, and the column is narrow.
          text = Words.measured(r.value());
        }
      }
      drawing.setPinText(number, text);
    }
  }

  private VBox resultsPanel() {
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
    // In a small window the cards give up their room first, down to about two rows.
    list.setMinHeight(96);
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
            "No readings yet. Put the probe where the left side says, type what the meter shows on"
                + " the pad and tap Add reading. The suspects and the next probe follow each"
                + " reading.");
    empty.setWrapText(true);
    empty.getStyleClass().add("hint");
    empty.setPadding(new javafx.geometry.Insets(12));
    list.setPlaceholder(empty);
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

  /** Says which reading the pad is correcting, with a way out. */
  private Node correctingBar() {
    Label what = new Label();
    what.setId("correcting");
    what.setWrapText(true);
    what.setMinHeight(Region.USE_PREF_SIZE);
    what.textProperty().bind(model.correctingTextProperty());
    Button cancel = new Button("Cancel");
    cancel.setId("correcting-cancel");
    cancel.setMinWidth(Region.USE_PREF_SIZE);
    cancel.setOnAction(e -> model.cancelCorrection());
    HBox.setHgrow(what, Priority.ALWAYS);
    HBox bar = new HBox(8, what, cancel);
    bar.setAlignment(Pos.CENTER_LEFT);
    bar.getStyleClass().add("correcting-bar");
    bar.visibleProperty().bind(model.correctingTextProperty().isNotEmpty());
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
