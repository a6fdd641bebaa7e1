package com.stagewise.ui.readings;

import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
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
    // With the power off, the caution's key message stands above the pad it is read on; the
    // whole caution opens over the probe column beside it.
    javafx.scene.control.ToggleButton cautionKey = PowerOffViews.cautionKey(model);
    pad.getChildren()
        .addAll(
            PowerOffViews.banner(model, cautionKey),
            AcViews.padBar(model),
            correctingBar(),
            valuePad);
    pad.setMinWidth(342);
    // Its keys need about 340 px; what is left over goes to the results.
    pad.setPrefWidth(360);
    pad.setMaxWidth(396);
    VBox results = new ResultsColumn(model, bench).node();
    results.setMinWidth(276);
    // A set preferred width: a long text in the results must not take the probe column's room
    // (HBox shrinks every column alike from its preferred width); what is left over is shared
    // with the probe column.
    results.setPrefWidth(430);
    HBox.setHgrow(results, Priority.ALWAYS);
    StackPane probeSide = new StackPane(probe, PowerOffViews.wholeCaution(model, cautionKey));
    probeSide.setAlignment(Pos.TOP_CENTER);
    // As wide as the probe column may grow (readings.css), the rest going to the results.
    probeSide.maxWidthProperty().bind(probe.maxWidthProperty());
    HBox.setHgrow(probeSide, Priority.ALWAYS);
    HBox columns = new HBox(12, probeSide, pad, results);
    VBox.setVgrow(columns, Priority.ALWAYS);
    root.getChildren().add(columns);
    model.probeProperty().addListener((o, was, now) -> showProbe(now));
    PowerOffMode mode = model.powerOff();
    mode.fromProperty().addListener((o, was, now) -> showProbe(model.probeProperty().get()));
    mode.toProperty().addListener((o, was, now) -> showProbe(model.probeProperty().get()));
    mode.activeProperty().addListener((o, was, now) -> showProbe(model.probeProperty().get()));
    bench.readings().addListener((ListChangeListener<Reading>) c -> showPinTexts());
    showProbe(model.probeProperty().get());
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
    // Bound, not set: the theme's 48 px minimum width would win over a value set in code, and the
    // window's own pass over the buttons does not reach into the column's scrolling part.
    for (javafx.scene.control.ToggleButton b : List.of(onPackage, onSchematic)) {
      b.minWidthProperty()
          .bind(new javafx.beans.property.SimpleDoubleProperty(Region.USE_PREF_SIZE));
    }
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
            poweredMore,
            PowerOffViews.pairWhy(model));
    more.getStyleClass().add("probe-more");
    // Never squeezed below its words: where the column is short, it scrolls.
    more.setMinHeight(Region.USE_PREF_SIZE);
    probeScroll.setContent(more);
    probeScroll.setId("probe-scroll");
    probeScroll.setFitToWidth(true);
    probeScroll.setFitToHeight(true);
    probeScroll.setHbarPolicy(javafx.scene.control.ScrollPane.ScrollBarPolicy.NEVER);
    probeScroll.setVbarPolicy(javafx.scene.control.ScrollPane.ScrollBarPolicy.AS_NEEDED);
    // At least a finger's 48 px and the hint above the drawing; 88, not more, so that with larger
    // text
    // at 1024×600 the power-off columns fit the window and the screen needs no scroll bar.
    probeScroll.setMinHeight(88);
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
}
