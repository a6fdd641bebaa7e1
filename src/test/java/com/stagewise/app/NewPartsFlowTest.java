package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.ui.stage.LibraryEntry;
import com.stagewise.ui.stage.PartRow;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;
import javafx.application.Platform;
import javafx.embed.swing.SwingFXUtils;
import javafx.scene.image.WritableImage;
import javafx.stage.Stage;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.testfx.api.FxRobot;
import org.testfx.api.FxToolkit;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The stage screen with a diode and a trimmer, in a real window (headless on Monocle; under Xvfb
 * with {@code -Dgui}): a demo case of the mixer picks a stage sheet with a non-inverting stage, a
 * gain trimmer wired as a variable resistor and a diode rectifier; the part list names the diode's
 * class and leads and the trimmer's wiper; the diode has no value to type; the trimmer's wiper is
 * set on the value pad. With {@code -Dscreenshots=true} the picture goes to {@code
 * src/site/screens}.
 */
class NewPartsFlowTest {
  private static final String SERIAL = "NF8-22019";
  private static final String SHEET = "channel-level-meter.stage.json";

  @TempDir Path temp;

  private Workshop workshop;
  private BenchApp app;
  private Stage window;
  private final FxRobot robot = new FxRobot();

  @BeforeAll
  static void toolkit() throws Exception {
    java.util.logging.Logger.getLogger("javafx").setLevel(java.util.logging.Level.SEVERE);
    try {
      Platform.startup(() -> {});
    } catch (IllegalStateException alreadyRunning) {
      // Another test class started the toolkit first.
    }
    Platform.setImplicitExit(false);
    FxToolkit.toolkitContext().setSetupTimeoutInMillis(180_000);
  }

  @BeforeEach
  void open() throws Exception {
    Path stages = Files.createDirectories(temp.resolve("stages"));
    Files.copy(Path.of("src", "test", "resources", "stages", SHEET), stages.resolve(SHEET));
    DataFolder folder =
        new DataFolder(temp.resolve("data"), temp.resolve("data").resolve("stagewise.db"));
    workshop = Workshop.open(folder, true, stages);
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

  @Test
  void stageWithDiodeAndTrimmer_isShownWithLeadsAndTheWiperIsSetOnThePad() throws Exception {
    robot.clickOn("#caution-ok");
    settle();
    for (char c : SERIAL.toCharArray()) {
      robot.clickOn("#serial-key-" + c);
    }
    robot.clickOn("#serial-search");
    settle();
    robot.clickOn("#symptom").write("Level meter reads low on every channel");
    robot.clickOn("#open-case");
    settle();
    robot.clickOn("#caution-ok");
    settle();
    clickCell("#stage-library", "Channel level meter");
    settle();

    // The diode: its class and its leads by name (DESIGN.md: nets are [anode, cathode]).
    clickCell("#stage-parts", "D1 ");
    settle();
    assertThat(cellStarting("#stage-parts", "D1 "))
        .contains("silicon diode")
        .contains("anode OUT – cathode RECT");
    assertThat(cellStarting("#stage-parts", "RV1 "))
        .contains("wiper at 0.5")
        .contains("FOOT – wiper GND – GND");

    // The trimmer: the pad sets its wiper (a share of the travel from end 1, DESIGN.md).
    clickCell("#stage-parts", "RV1 ");
    settle();
    robot.clickOn("#part-wiper");
    settle();
    robot.clickOn("#part-key-clear");
    for (String key : new String[] {"0", "point", "3"}) {
      robot.clickOn("#part-key-" + key);
    }
    robot.clickOn("#part-enter");
    settle();
    assertThat(cellStarting("#stage-parts", "RV1 ")).contains("wiper at 0.3");
    // The pad stays on the wiper after the edit, showing the position as set.
    assertThat(
            fx(
                () ->
                    robot
                        .lookup("#part-wiper")
                        .queryAs(javafx.scene.control.ToggleButton.class)
                        .isSelected()))
        .isTrue();
    save("12-stage-diode-and-trimmer");

    // The stage taken to the readings is the one with the wiper as set.
    // The pad's wiper row makes the panel taller: the screen scrolls to the button, as a finger
    // would.
    fx(
        () -> {
          javafx.scene.Node node = robot.lookup("#use-stage").query();
          while (node != null && !(node instanceof javafx.scene.control.ScrollPane)) {
            node = node.getParent();
          }
          if (node != null) {
            ((javafx.scene.control.ScrollPane) node).setVvalue(1.0);
          }
          return null;
        });
    WaitForAsyncUtils.waitForFxEvents();
    robot.clickOn("#use-stage");
    settle();
    Part trimmer = fx(() -> app.bench().stageProperty().get().part("RV1").orElseThrow());
    assertThat(trimmer.kind()).isEqualTo(PartKind.TRIMMER);
    assertThat(trimmer.position()).isEqualTo(0.3);
    assertThat(fx(() -> app.bench().stageProperty().get().part("D1").orElseThrow().kind()))
        .isEqualTo(PartKind.DIODE);
  }

  private String cellStarting(String list, String start) throws Exception {
    return visibleCell(list, start).getText();
  }

  private void clickCell(String list, String startOfText) throws Exception {
    robot.clickOn(visibleCell(list, startOfText));
  }

  /**
   * Returns the list's cell whose text starts so, after scrolling the list to that row (a list
   * shows only the rows that fit, so a row further down has no cell until it is scrolled to).
   */
  private javafx.scene.control.ListCell<?> visibleCell(String list, String start) throws Exception {
    fx(
        () -> {
          javafx.scene.control.ListView<?> view =
              robot.lookup(list).queryAs(javafx.scene.control.ListView.class);
          for (int i = 0; i < view.getItems().size(); i++) {
            if (shownText(view.getItems().get(i)).startsWith(start)) {
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
                    (javafx.scene.control.ListCell<?> cell) ->
                        cell.getText() != null && cell.getText().startsWith(start))
                .<javafx.scene.control.ListCell<?>>query());
  }

  /** The text a row shows: a part's line, a library entry's title. */
  private static String shownText(Object item) {
    if (item instanceof PartRow row) {
      return row.line();
    }
    if (item instanceof LibraryEntry entry) {
      return entry.title();
    }
    return String.valueOf(item);
  }

  private static <T> T fx(Callable<T> work) throws Exception {
    return WaitForAsyncUtils.asyncFx(work).get(30, TimeUnit.SECONDS);
  }

  private void settle() throws Exception {
    WaitForAsyncUtils.waitFor(
        90,
        TimeUnit.SECONDS,
        () -> {
          WaitForAsyncUtils.waitForFxEvents();
          return fx(() -> app.idle());
        });
    WaitForAsyncUtils.waitForFxEvents();
  }

  private void save(String name) throws Exception {
    WritableImage image = fx(() -> window.getScene().snapshot(null));
    BufferedImage picture = SwingFXUtils.fromFXImage(image, null);
    Path folder =
        Boolean.getBoolean("screenshots")
            ? Path.of("src", "site", "screens")
            : Path.of("target", "screens");
    Files.createDirectories(folder);
    ImageIO.write(picture, "png", folder.resolve(name + ".png").toFile());
  }
}
