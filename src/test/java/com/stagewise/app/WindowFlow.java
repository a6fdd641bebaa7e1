package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.ui.Step;
import com.stagewise.ui.stage.LibraryEntry;
import com.stagewise.ui.stage.PartRow;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import javafx.application.Platform;
import javafx.scene.Node;
import javafx.scene.control.Label;
import javafx.scene.control.Labeled;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TextInputControl;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.io.TempDir;
import org.testfx.api.FxToolkit;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The bench app in a real (headless) window on the demo shop, as the app flow tests drive it: the
 * window opened on a fresh data folder before each test and closed after it, and what a technician
 * does with it — tap, type on a pad, pick a row — with the waits those tests share. The window
 * sizes, the looks, the checks of what is cut or out of sight and the pictures are {@link
 * WindowChecks}'.
 */
abstract class WindowFlow extends WindowChecks {
  /** The demo unit the flows work on: a mixing-desk channel board with a line driver stage. */
  static final String SERIAL = "NF8-22019";

  /** The demo's mixing desk's rails as the flows read them on its supply pins. */
  static final double VCC = 14.96;

  static final double VEE = -14.97;

  /**
   * Volts from a rail to the clamped output of a classic-bipolar op-amp (DESIGN.md, common
   * practice).
   */
  static final double HEADROOM = 1.5;

  @TempDir Path temp;

  Workshop workshop;

  @BeforeAll
  static void toolkit() throws Exception {
    java.util.logging.Logger.getLogger("javafx").setLevel(java.util.logging.Level.SEVERE);
    try {
      Platform.startup(() -> {});
    } catch (IllegalStateException alreadyRunning) {
      // Another test class started the toolkit first.
    }
    Platform.setImplicitExit(false);
    // Building the window on a build machine shared by many jobs can take well over TestFX's
    // default 30 s; the flow's own waits are longer too.
    FxToolkit.toolkitContext().setSetupTimeoutInMillis(180_000);
  }

  /** The folder of stage sheets the demo fill adds to the library (the demo's own by default). */
  Path stages() throws Exception {
    return Path.of("data", "stages");
  }

  @BeforeEach
  void open() throws Exception {
    DataFolder folder =
        new DataFolder(temp.resolve("data"), temp.resolve("data").resolve("stagewise.db"));
    workshop = Workshop.open(folder, true, stages());
    window =
        FxToolkit.registerStage(
            () -> {
              Stage stage = new Stage();
              app = BenchApp.build(workshop);
              stage.setScene(app.scene());
              stage.setTitle("Stagewise — bench");
              stage.setWidth(BenchApp.WIDTH);
              stage.setHeight(BenchApp.HEIGHT);
              stage.show();
              app.cautionOnFirstRun();
              return stage;
            });
    settle();
  }

  @AfterEach
  void close() throws Exception {
    FxToolkit.cleanupStages();
    app.close();
    workshop.close();
  }

  /** Waits until the background work is done and the screen has caught up. */
  void settle() throws Exception {
    WaitForAsyncUtils.waitFor(
        90,
        TimeUnit.SECONDS,
        () -> {
          WaitForAsyncUtils.waitForFxEvents();
          return fx(() -> app.idle());
        });
    WaitForAsyncUtils.waitForFxEvents();
  }

  /** Finds the demo unit by its serial typed on the unit screen's keypad, as a technician would. */
  void findDemoUnit() throws Exception {
    findUnit(SERIAL);
  }

  /** Finds a unit by its serial typed on the unit screen's keypad and searched for. */
  void findUnit(String serial) throws Exception {
    for (char c : serial.toCharArray()) {
      robot.clickOn("#serial-key-" + c);
    }
    robot.clickOn("#serial-search");
    settle();
  }

  /**
   * From the first start's caution to the stage screen of a new case on the demo unit (the mixing
   * desk is mains-powered: its caution comes again as the case opens).
   */
  void openDemoCase(String symptom) throws Exception {
    robot.clickOn("#caution-ok");
    settle();
    findDemoUnit();
    robot.clickOn("#symptom").write(symptom);
    robot.clickOn("#open-case");
    settle();
    robot.clickOn("#caution-ok");
    settle();
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.STAGE);
  }

  /**
   * From the first start's caution to the readings screen of a new case on the demo unit's channel
   * line driver.
   */
  void openLineDriverCase(String symptom) throws Exception {
    openDemoCase(symptom);
    // The mixer's library holds one stage, and the new case keeps none: it is chosen already,
    // selected in the list with its parts listed, so Use this stage needs no tap before it.
    assertThat(
            fx(
                () ->
                    rowText(
                        robot
                            .lookup("#stage-library")
                            .queryAs(ListView.class)
                            .getSelectionModel()
                            .getSelectedItem())))
        .isEqualTo("Channel line driver");
    assertThat(fx(() -> robot.lookup("#stage-parts").queryAs(ListView.class).getItems().size()))
        .isPositive();
    robot.clickOn("#use-stage");
    settle();
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.READINGS);
  }

  /**
   * Returns what a stage with its feedback resistor R2 open reads at a test point of the demo's
   * line driver, or of the same stage built in the editor with its own net names for the inverting
   * input ({@code sum}) and the output ({@code out}). Textbook inverting amplifier with the loop
   * broken: no current flows in R1, so the inverting input follows IN (+1 V); the op-amp compares 0
   * V with +1 V and its output clamps 1.5 V above the negative rail.
   */
  static double openFeedbackResistor(String at, String sum, String out) {
    Map<String, Double> dc =
        Map.ofEntries(
            Map.entry("U1.8", VCC),
            Map.entry("VCC", VCC),
            Map.entry("U1.4", VEE),
            Map.entry("VEE", VEE),
            Map.entry("U1.1", VEE + HEADROOM),
            Map.entry(out, VEE + HEADROOM),
            Map.entry("U1.2", 1.0),
            Map.entry(sum, 1.0),
            Map.entry("IN", 1.0),
            Map.entry("U1.3", 0.0),
            Map.entry("GND", 0.0));
    Double volts = dc.get(at);
    if (volts == null) {
      throw new AssertionError("the flow asked for an unexpected test point: " + at);
    }
    return volts;
  }

  /** Taps a control after scrolling the screen so that it stands in sight, as a finger would. */
  void tap(String query) throws Exception {
    ScreenScroll.intoView(robot.lookup(query).query());
    robot.clickOn(query);
  }

  /** Returns the text a label, button or field shows; fails for any other node. */
  String text(String query) throws Exception {
    return fx(
        () -> {
          Node node = robot.lookup(query).query();
          if (node instanceof Labeled labeled) {
            return labeled.getText();
          }
          if (node instanceof TextInputControl input) {
            return input.getText();
          }
          throw new AssertionError(query + " is not a text node");
        });
  }

  /** Whether the node is there and shown: it and every node it sits in are visible. */
  boolean visible(String query) throws Exception {
    return fx(
        () -> {
          Node node = robot.lookup(query).tryQuery().orElse(null);
          boolean shown = node != null;
          for (; node != null; node = node.getParent()) {
            shown &= node.isVisible();
          }
          return shown;
        });
  }

  /** Returns the visible labels on the screen whose text contains {@code words}. */
  List<String> labelsContaining(String words) {
    return robot.lookup(".label").queryAllAs(Label.class).stream()
        .filter(l -> l.isVisible() && l.getText() != null && l.getText().contains(words))
        .map(Label::getText)
        .toList();
  }

  /** Taps the row of a list whose text starts so, after scrolling the list to it. */
  void clickCell(String list, String startOfText) throws Exception {
    robot.clickOn(visibleCell(list, startOfText));
  }

  /**
   * Returns the list's cell whose text starts so, after scrolling the list to that row (a list
   * shows only the rows that fit, so a row further down has no cell until it is scrolled to).
   */
  ListCell<?> visibleCell(String list, String start) throws Exception {
    fx(
        () -> {
          ListView<?> view = robot.lookup(list).queryAs(ListView.class);
          for (int i = 0; i < view.getItems().size(); i++) {
            if (rowText(view.getItems().get(i)).startsWith(start)) {
              view.scrollTo(i);
              break;
            }
          }
          return null;
        });
    WaitForAsyncUtils.waitForFxEvents();
    return fx(
        () ->
            robot
                .lookup(list + " .list-cell")
                .match(
                    (ListCell<?> cell) ->
                        cell.getText() != null && cell.getText().startsWith(start))
                .<ListCell<?>>query());
  }

  /**
   * The text a list's row shows (a part's line, a library entry's title), before its cell exists.
   */
  static String rowText(Object item) {
    if (item instanceof PartRow row) {
      return row.line();
    }
    if (item instanceof LibraryEntry entry) {
      return entry.title();
    }
    return String.valueOf(item);
  }

  /** Types a reading on the readings screen's value pad and adds it. */
  void typeReading(double volts) throws Exception {
    typeOnPad("reading", volts);
  }

  /**
   * Types volts on the pad whose keys are named {@code pad-key-…} (the sign key first for a
   * negative value, two decimals) and taps its enter key.
   */
  void typeOnPad(String pad, double volts) throws Exception {
    String text = String.format(Locale.ROOT, "%.2f", Math.abs(volts));
    if (volts < 0) {
      tap("#" + pad + "-key-sign");
    }
    for (char c : text.toCharArray()) {
      tap("#" + pad + "-key-" + (c == '.' ? "point" : String.valueOf(c)));
    }
    tap("#" + pad + "-enter");
    settle();
  }

  /**
   * Scrolls the screen that holds {@code query} back to its top, so that a picture starts there.
   */
  void scrollToTop(String query) throws Exception {
    fx(
        () -> {
          Node node = robot.lookup(query).query();
          while (node != null && !(node instanceof ScrollPane)) {
            node = node.getParent();
          }
          if (node != null) {
            ((ScrollPane) node).setVvalue(0);
          }
          return null;
        });
    WaitForAsyncUtils.waitForFxEvents();
  }
}
