package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The stage screen with a diode and a trimmer, in a real window (headless on Monocle; under Xvfb
 * with {@code -Dgui}): a demo case of the mixer picks a stage sheet with a non-inverting stage, a
 * gain trimmer wired as a variable resistor and a diode rectifier; the part list names the diode's
 * class and leads and the trimmer's wiper; the diode has no value to type; the trimmer's wiper is
 * set on the value pad. With {@code -Dscreenshots=true} the picture goes to {@code
 * src/site/screens}.
 */
class NewPartsFlowTest extends WindowFlow {
  private static final String SHEET = "channel-level-meter.stage.json";

  /** Only the sheet with the diode and the trimmer is added to the demo's library. */
  @Override
  Path stages() throws Exception {
    Path stages = Files.createDirectories(temp.resolve("stages"));
    Files.copy(Path.of("src", "test", "resources", "stages", SHEET), stages.resolve(SHEET));
    return stages;
  }

  @Test
  void stageWithDiodeAndTrimmer_isShownWithLeadsAndTheWiperIsSetOnThePad() throws Exception {
    openDemoCase("Level meter reads low on every channel");
    // Two stages in the mixer's library: none is chosen for the technician.
    assertThat(
            fx(
                () ->
                    robot
                        .lookup("#stage-library")
                        .queryAs(javafx.scene.control.ListView.class)
                        .getSelectionModel()
                        .isEmpty()))
        .isTrue();
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
    savePicture(screensFolder().resolve("12-stage-diode-and-trimmer.png"));
    // No text cut, nothing past its panel, no sideways scroll bar on the stage screen with the
    // diode's and the trimmer's rows and the wiper pad, at 1024×600 and 1280×800 in every look.
    assertWholeInFourLooks("12-stage-diode-and-trimmer", new int[][] {SMALL, LAPTOP});

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
}
