package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.ui.Step;
import java.nio.file.Files;
import java.nio.file.Path;
import javafx.scene.control.ListView;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInfo;

/**
 * The stage screen's next action in a real (headless) window on the demo shop: once the stage is
 * chosen, "Use this stage" stands wholly in the window with the screen scrolled to its top, at
 * 1024×600 (a small touch laptop) and 1280×800, in the ordinary look, with larger text, with high
 * contrast and with both, and gives a finger at least {@link Reach#FINGER} px each way (about 48
 * px, 9 mm, is common practice for a touch target; from memory). The stage is chosen by itself
 * where the board model's library holds one (the demo's mixing desk), and tapped in the list where
 * it holds two (the same desk with the level meter's sheet added).
 */
class StageReachFlowTest extends WindowFlow {
  private static final String SHEET = "channel-level-meter.stage.json";

  /**
   * A title near the longest a sheet may have (200 characters; three lines at 1024×600 if it
   * wrapped freely), for the test of a long title.
   */
  static final String LONG_TITLE =
      "Channel level meter with calibration trimmer, rev C board of the early production"
          + " run, with the service bulletin's modified gain resistor and extra decoupling on"
          + " the meter driver's supply";

  private final boolean twoStages;
  private final boolean longTitle;

  StageReachFlowTest(TestInfo test) {
    String name = test.getTestMethod().orElseThrow().getName();
    twoStages = name.contains("TwoStages");
    longTitle = name.contains("LongTitle");
  }

  /**
   * The demo's own sheets; for the test with two stages, the level meter's sheet alone; for the
   * long title, that sheet with {@link #LONG_TITLE}.
   */
  @Override
  Path stages() throws Exception {
    if (!twoStages && !longTitle) {
      return super.stages();
    }
    Path stages = Files.createDirectories(temp.resolve("stages"));
    String sheet = Files.readString(Path.of("src", "test", "resources", "stages", SHEET));
    if (longTitle) {
      sheet =
          sheet.replace(
              "\"title\": \"Channel level meter with calibration trimmer\"",
              "\"title\": \"" + LONG_TITLE + "\"");
      assertThat(sheet).contains(LONG_TITLE);
    }
    Files.writeString(stages.resolve(SHEET), sheet);
    return stages;
  }

  @Test
  void useThisStage_oneStageChosenByItself_standsInSightAtTheTopInEveryLook() throws Exception {
    openDemoCase("Channel 1 output pinned negative, no audio");
    assertThat(libraryRows()).isEqualTo(1);
    assertThat(fx(() -> robot.lookup("#use-stage").query().isDisabled())).isFalse();

    assertUseThisStageInSight("one stage");

    robot.clickOn("#use-stage");
    settle();
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.READINGS);
  }

  @Test
  void useThisStage_oneOfTwoStagesTapped_standsInSightAtTheTopInEveryLook() throws Exception {
    openDemoCase("Level meter reads low on every channel");
    // Two stages: none is chosen for the technician, and the button waits for a choice.
    assertThat(libraryRows()).isEqualTo(2);
    assertThat(fx(() -> robot.lookup("#use-stage").query().isDisabled())).isTrue();
    clickCell("#stage-library", "Channel level meter");
    settle();
    assertThat(fx(() -> robot.lookup("#use-stage").query().isDisabled())).isFalse();

    assertUseThisStageInSight("two stages");

    robot.clickOn("#use-stage");
    settle();
    assertThat(fx(() -> app.bench().stageProperty().get().title()))
        .isEqualTo("Channel level meter with calibration trimmer");
  }

  @Test
  void useThisStage_aStageWithALongTitle_standsInSightAtTheTopInEveryLook() throws Exception {
    openDemoCase("Level meter reads low on every channel");
    clickCell("#stage-library", "Channel level meter");
    settle();
    // The title keeps to four lines (the rest in its tooltip), so the button stays in sight.
    assertUseThisStageInSight("long title");
    javafx.scene.control.Label title =
        robot.lookup("#stage-title").queryAs(javafx.scene.control.Label.class);
    assertThat(fx(() -> title.getText())).isEqualTo(LONG_TITLE);
    assertThat(fx(() -> title.getTooltip().getText())).isEqualTo(LONG_TITLE);
    robot.clickOn("#use-stage");
    settle();
    assertThat(fx(() -> app.bench().stageProperty().get().title())).isEqualTo(LONG_TITLE);
  }

  /**
   * At 1024×600 and 1280×800 in the four looks: the stage's title and Use this stage in sight with
   * the screen at its top, the button a finger's size; a picture of each under
   * target/screens/stage-reach.
   */
  private void assertUseThisStageInSight(String library) throws Exception {
    inFourLooks(
        "stage-reach-" + library.replace(' ', '-'),
        new int[][] {SMALL, LAPTOP},
        (size, where, look) -> {
          String what = "the stage screen with " + library + " at " + where + ", " + look;
          assertInSightAtTop("#scroll-stage", what, "#stage-title", "#use-stage");
          savePicture(
              Path.of(
                  "target",
                  "screens",
                  "stage-reach",
                  where,
                  (library + " " + look).replaceAll("[^a-zA-Z]+", "-") + ".png"));
          assertFingerSized(what, "#use-stage");
        });
  }

  private int libraryRows() throws Exception {
    return fx(() -> robot.lookup("#stage-library").queryAs(ListView.class).getItems().size());
  }
}
