package com.stagewise.ui.shell;

import com.stagewise.ui.Bench;
import com.stagewise.ui.Step;
import com.stagewise.ui.widget.CappedLines;
import java.util.EnumMap;
import java.util.Map;
import java.util.function.Supplier;
import javafx.beans.binding.Bindings;
import javafx.beans.property.BooleanProperty;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.Parent;
import javafx.scene.control.Label;
import javafx.scene.control.ProgressBar;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.ToggleButton;
import javafx.scene.control.ToggleGroup;
import javafx.scene.input.KeyCode;
import javafx.scene.input.KeyCodeCombination;
import javafx.scene.input.KeyCombination;
import javafx.scene.layout.BorderPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Pane;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import javafx.scene.text.Text;
import javafx.scene.text.TextFlow;

/**
 * The window's content: the steps of a repair on top, the unit and case in a line below, the screen
 * in the middle, a progress line at the bottom, and the overlays over all of it.
 *
 * <p>Shortcuts: Ctrl+1 … Ctrl+6 open the screens in order.
 */
public final class BenchWindow {
  private final Bench bench;
  private final StackPane root = new StackPane();
  private final StackPane content = new StackPane();
  private final Map<Step, Supplier<Node>> makers = new EnumMap<>(Step.class);
  private final Map<Step, Node> screens = new EnumMap<>(Step.class);
  private final Map<Step, ToggleButton> stepButtons = new EnumMap<>(Step.class);
  private final HBox statusBar;

  /**
   * The smallest side of a touch target, as bench.css sets it for every button (common practice).
   */
  private static final double TOUCH = 48;

  /**
   * Builds the window's content.
   *
   * @param bench what the bench works on
   * @param overlays the caution and problem layer
   * @param pending how many background tasks run (the progress line shows while above 0)
   * @param working what the current background task does
   */
  public BenchWindow(
      Bench bench,
      Overlays overlays,
      javafx.beans.value.ObservableIntegerValue pending,
      javafx.beans.value.ObservableStringValue working) {
    this.bench = bench;
    BorderPane frame = new BorderPane();
    frame.setTop(new VBox(topBar(), caseLine()));
    frame.setCenter(content);
    statusBar = statusBar(pending, working);
    frame.setBottom(statusBar);
    root.getChildren().addAll(frame, overlays.layer());
    root.getStylesheets().add(BenchWindow.class.getResource("bench.css").toExternalForm());
    root.getStylesheets().add(BenchWindow.class.getResource("large-text.css").toExternalForm());
    root.getStylesheets().add(BenchWindow.class.getResource("high-contrast.css").toExternalForm());
    showAs(bench.largeTextProperty(), "large-text");
    showAs(bench.highContrastProperty(), "high-contrast");
    // The drawings (schematic, package, band charts) paint in code: they follow the same switch.
    com.stagewise.ui.drawing.DrawingLook.highContrast().bind(bench.highContrastProperty());
    bench.stepProperty().addListener((o, was, now) -> show(now));
  }

  /** Registers the screen of a step; it is built the first time it is shown. */
  public void screen(Step step, Supplier<Node> maker) {
    makers.put(step, maker);
    if (bench.stepProperty().get() == step) {
      show(step);
    }
  }

  /** Returns the root node for the scene. */
  public Parent root() {
    return root;
  }

  /** Adds the Ctrl+1 … Ctrl+6 shortcuts to the scene. */
  public void addShortcuts(javafx.scene.Scene scene) {
    KeyCode[] digits = {
      KeyCode.DIGIT1, KeyCode.DIGIT2, KeyCode.DIGIT3, KeyCode.DIGIT4, KeyCode.DIGIT5, KeyCode.DIGIT6
    };
    for (Step step : Step.values()) {
      scene
          .getAccelerators()
          .put(
              new KeyCodeCombination(digits[step.ordinal()], KeyCombination.SHORTCUT_DOWN),
              () -> bench.go(step));
    }
  }

  private void show(Step step) {
    Node screen = screens.get(step);
    if (screen == null) {
      Supplier<Node> maker = makers.get(step);
      if (maker == null) {
        return;
      }
      screen = maker.get();
      screens.put(step, screen);
    }
    content.getChildren().setAll(scrollable(step, screen));
    ToggleButton button = stepButtons.get(step);
    if (button != null) {
      button.setSelected(true);
    }
  }

  /**
   * Puts a screen in a scroll pane that fits it to the window: from 1024×600 up the screen fills
   * the window, and where a screen needs more height than a small window has, it scrolls instead of
   * cutting anything off.
   */
  private final Map<Step, ScrollPane> scrollers = new EnumMap<>(Step.class);

  private ScrollPane scrollable(Step step, Node screen) {
    return scrollers.computeIfAbsent(
        step,
        s -> {
          keepButtonsWhole(screen);
          ScrollPane scroller = new ScrollPane(screen);
          scroller.setId("scroll-" + s.name().toLowerCase(java.util.Locale.ROOT).replace('_', '-'));
          scroller.getStyleClass().add("screen-scroller");
          scroller.setFitToWidth(true);
          scroller.setFitToHeight(true);
          scroller.setHbarPolicy(ScrollPane.ScrollBarPolicy.AS_NEEDED);
          scroller.setVbarPolicy(ScrollPane.ScrollBarPolicy.AS_NEEDED);
          return scroller;
        });
  }

  /**
   * Keeps every button at least as wide as its words and every label as tall as its lines: where a
   * small window cannot give a screen its size, the screen scrolls instead of shortening "Open
   * case" to "Open …".
   */
  private static void keepButtonsWhole(Node node) {
    if (node instanceof javafx.scene.control.ButtonBase button && button.isWrapText()) {
      // A button that wraps its words (a long one in a narrow column) keeps them whole on more
      // lines instead: as tall as its lines at its width, never below the 48 px touch minimum.
      // Bound, as below: a value set in code would lose to the theme's 48 px.
      button
          .minHeightProperty()
          .bind(
              Bindings.createDoubleBinding(
                  () ->
                      Math.max(
                          TOUCH, button.prefHeight(button.getWidth() > 0 ? button.getWidth() : -1)),
                  button.widthProperty(),
                  button.textProperty(),
                  button.fontProperty()));
    } else if (node instanceof javafx.scene.control.ButtonBase button
        && !button.getStyleClass().contains("key")) {
      // Keypad keys may narrow to the 48 px touch minimum instead (widgets.css). Bound, not set:
      // the theme's 48 px minimum width of every button (bench.css) would override a value set
      // in code, and larger text then shortened "Search" to "Se…" in a 1024 px window.
      button
          .minWidthProperty()
          .bind(new javafx.beans.property.SimpleDoubleProperty(Region.USE_PREF_SIZE));
    }
    if (node instanceof javafx.scene.control.Label label
        && !label.getStyleClass().contains(CappedLines.STYLE)) {
      // A wrapped label gets the lines it needs (unless its screen caps them on purpose).
      label.setMinHeight(Region.USE_PREF_SIZE);
    }
    if (node instanceof ScrollPane pane && pane.getContent() != null) {
      // A part of a screen that scrolls on its own (the readings screen's probe column): its
      // content is not among the pane's children until the pane is first shown.
      keepButtonsWhole(pane.getContent());
    }
    if (node instanceof Parent parent) {
      for (Node child : parent.getChildrenUnmodifiable()) {
        keepButtonsWhole(child);
      }
    }
  }

  private HBox topBar() {
    HBox bar = new HBox();
    bar.getStyleClass().add("top-bar");
    bar.setAlignment(Pos.CENTER_LEFT);
    Label name = new Label("Stagewise");
    name.getStyleClass().add("app-name");
    name.setMinWidth(Region.USE_PREF_SIZE);
    // The steps wrap onto a second row where one does not hold them (larger text at 1024 wide)
    // rather than losing their words.
    javafx.scene.layout.FlowPane steps = new javafx.scene.layout.FlowPane(8, 6);
    steps.setAlignment(Pos.CENTER_LEFT);
    steps.setPrefWrapLength(600);
    HBox.setHgrow(steps, Priority.ALWAYS);
    bar.getChildren().addAll(name, steps);
    ToggleGroup group = new ToggleGroup();
    for (Step step : Step.values()) {
      ToggleButton button = new ToggleButton((step.ordinal() + 1) + "  " + step.title());
      button.setId("step-" + step.name().toLowerCase(java.util.Locale.ROOT).replace('_', '-'));
      button.setToggleGroup(group);
      button.setSelected(bench.stepProperty().get() == step);
      button.setOnAction(
          e -> {
            if (!bench.go(step)) {
              bench
                  .problems()
                  .show(
                      step.title() + " needs an open case",
                      step == Step.READINGS || step == Step.SUSPECTS
                          ? "There is no case with a chosen stage on the bench."
                          : "There is no open case on the bench.",
                      step == Step.READINGS || step == Step.SUSPECTS
                          ? "Open or resume a case on the Unit screen, then choose its stage."
                          : "Open or resume a case on the Unit screen.");
            }
            button.setSelected(bench.stepProperty().get() == step);
            stepButtons.get(bench.stepProperty().get()).setSelected(true);
          });
      if (step.needsCase()) {
        button.disableProperty().bind(bench.hasCase().not());
      }
      if (step == Step.READINGS || step == Step.SUSPECTS) {
        button.disableProperty().unbind();
        button.disableProperty().bind(bench.hasStage().not());
      }
      button.setMinWidth(Region.USE_PREF_SIZE);
      stepButtons.put(step, button);
      steps.getChildren().add(button);
    }
    giveWay(bar, name, steps);
    return bar;
  }

  /**
   * Hides the app's name where the steps would not fit on one row beside it (larger text at 1024
   * wide): the steps then keep one row, and every screen the height of a second one (the window's
   * title still names the app).
   */
  private static void giveWay(HBox bar, Label name, javafx.scene.layout.FlowPane steps) {
    java.util.List<javafx.beans.Observable> depends = new java.util.ArrayList<>();
    depends.add(bar.widthProperty());
    steps.getChildren().forEach(step -> depends.add(((Region) step).widthProperty()));
    var room =
        Bindings.createBooleanBinding(
            () -> {
              double stepsWidth = 0;
              for (Node step : steps.getChildren()) {
                stepsWidth += step.prefWidth(-1) + steps.getHgap();
              }
              double inner = bar.getWidth() - bar.snappedLeftInset() - bar.snappedRightInset();
              return bar.getWidth() <= 0
                  || inner >= name.prefWidth(-1) + bar.getSpacing() + stepsWidth;
            },
            depends.toArray(javafx.beans.Observable[]::new));
    name.visibleProperty().bind(room);
    name.managedProperty().bind(room);
  }

  /**
   * The line under the steps: the unit, the case and the stage being worked on, and the mains
   * caution first where the unit is mains-powered. One flowing paragraph, so that with larger text
   * at 1024 wide it takes two rows where a text beside a caution of its own took three, and the
   * screens keep that row.
   */
  private HBox caseLine() {
    HBox line = new HBox();
    line.getStyleClass().add("case-line");
    line.setAlignment(Pos.CENTER_LEFT);
    Text what = new Text();
    what.setId("case-line");
    what.getStyleClass().add("case-text");
    what.textProperty()
        .bind(
            Bindings.createStringBinding(
                () -> {
                  if (bench.unitProperty().get() == null) {
                    return bench.stepProperty().get().purpose() + ".";
                  }
                  String text =
                      "Unit "
                          + bench.unitProperty().get().serial()
                          + " ("
                          + bench.boardModelProperty().get().name()
                          + ")";
                  if (bench.openCaseProperty().get() != null) {
                    text += "  ·  Case: " + bench.openCaseProperty().get().symptom();
                  }
                  if (bench.stageProperty().get() != null
                      && bench.openCaseProperty().get() != null) {
                    text += "  ·  Stage: " + bench.stageProperty().get().title();
                  }
                  return text;
                },
                bench.unitProperty(),
                bench.boardModelProperty(),
                bench.openCaseProperty(),
                bench.stageProperty(),
                bench.stepProperty()));
    Text mains = new Text("Mains-powered: lethal voltages   ");
    mains.setId("case-mains");
    mains.getStyleClass().addAll("case-text", "mains");
    mains
        .visibleProperty()
        .bind(bench.mainsPoweredProperty().and(bench.unitProperty().isNotNull()));
    mains.managedProperty().bind(mains.visibleProperty());
    TextFlow words = new TextFlow(mains, what);
    words.setMinWidth(0);
    HBox.setHgrow(words, Priority.ALWAYS);
    line.getChildren().add(words);
    return line;
  }

  /**
   * Shows the shop server's sync state (last sync time, a sync's progress, or that the server is
   * away) in the status bar, beside the keys hint.
   */
  public void showShopServer(javafx.beans.value.ObservableStringValue words) {
    Label server = new Label();
    server.setId("shop-server");
    server.getStyleClass().add("hint");
    server.textProperty().bind(words);
    statusBar.getChildren().add(statusBar.getChildren().size() - 1, server);
  }

  private void showAs(BooleanProperty setting, String styleClass) {
    setting.addListener(
        (o, was, now) -> {
          root.getStyleClass().remove(styleClass);
          if (now) {
            root.getStyleClass().add(styleClass);
          }
        });
  }

  private HBox statusBar(
      javafx.beans.value.ObservableIntegerValue pending,
      javafx.beans.value.ObservableStringValue working) {
    HBox bar = new HBox();
    bar.getStyleClass().add("status-bar");
    bar.setAlignment(Pos.CENTER_LEFT);
    ProgressBar progress = new ProgressBar(ProgressBar.INDETERMINATE_PROGRESS);
    progress.setPrefWidth(160);
    Label text = new Label();
    text.setId("working");
    var busy = Bindings.createBooleanBinding(() -> pending.get() > 0, pending);
    progress.visibleProperty().bind(busy);
    progress.managedProperty().bind(busy);
    text.textProperty()
        .bind(
            Bindings.createStringBinding(
                () -> pending.get() > 0 ? working.get() + " …" : "Ready.", pending, working));
    Pane spring = new Pane();
    HBox.setHgrow(spring, Priority.ALWAYS);
    Label keys = new Label("Keys: Ctrl+1 … Ctrl+6 switch screens, Enter confirms");
    keys.getStyleClass().add("hint");
    bar.getChildren().addAll(progress, text, spring, keys);
    return bar;
  }
}
