package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.TimeUnit;
import javafx.scene.Node;
import javafx.scene.control.ListView;
import org.junit.jupiter.api.Test;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The unit screen's serial field in a real (headless) window: its clear button (ControlsFX's
 * clearable field) empties it in one tap, and the live search then lists the shop's units again.
 */
class SerialFieldFlowTest extends WindowFlow {

  @Test
  void clearButton_emptiesTheSerial_andTheListShowsTheUnitsAgain() throws Exception {
    robot.clickOn("#caution-ok");
    settle();
    findDemoUnit();
    assertThat(text("#serial")).isEqualTo(SERIAL);
    assertThat(units()).isEqualTo(1);

    Node clear = fx(() -> window.getScene().lookup("#serial .clear-button"));
    assertThat(clear).as("the serial field's clear button").isNotNull();
    // The button fades in once the field holds text; wait until it takes a tap.
    WaitForAsyncUtils.waitFor(10, TimeUnit.SECONDS, () -> fx(() -> clear.getOpacity() > 0.9));
    robot.clickOn(clear);
    settle();

    assertThat(text("#serial")).isEmpty();
    // The live search runs after a short pause in the typing; the demo shop has several units.
    WaitForAsyncUtils.waitFor(
        30,
        TimeUnit.SECONDS,
        () -> {
          settle();
          return units() > 1;
        });
    assertThat(text("#unit-matches-note")).doesNotContain("1 unit found");
  }

  @Test
  void oneUnitFoundAsTyped_isOfferedOnOneBigButton_andOpensWithOneTap() throws Exception {
    robot.clickOn("#caution-ok");
    settle();
    for (char c : SERIAL.toCharArray()) {
      robot.clickOn("#serial-key-" + c);
    }
    // The live search runs after a short pause in the typing; nothing is opened by itself.
    WaitForAsyncUtils.waitFor(
        30,
        TimeUnit.SECONDS,
        () -> {
          settle();
          return visible("#open-only-match");
        });
    assertThat(units()).isEqualTo(1);
    assertThat(text("#open-only-match")).isEqualTo("Open " + SERIAL);
    assertThat(fx(() -> robot.lookup("#open-case").query().isDisabled())).isTrue();
    assertNothingCut("unit", "one unit found", "#screen-unit");
    savePicture(java.nio.file.Path.of("target", "screens", "unit-one-found.png"));
    // In a small touch laptop's window the button is in sight with the screen scrolled to its top
    // (it sits under the keys; the list's end is below the fold there).
    atSizes(
        new int[][] {{1024, 600}, {1280, 800}},
        (size, where) ->
            assertThat(
                    fx(
                        () ->
                            Reach.outOfSight(
                                window.getScene().lookup("#open-only-match"),
                                window.getScene().getWidth(),
                                window.getScene().getHeight())))
                .as("the one-unit button at %s", where)
                .isEmpty());

    tap("#open-only-match");
    settle();

    assertThat(visible("#open-only-match")).isFalse();
    assertThat(fx(() -> robot.lookup("#open-case").query().isDisabled())).isFalse();
    assertThat(labelsContaining("Unit " + SERIAL)).isNotEmpty();
  }

  private int units() throws Exception {
    return fx(() -> ((ListView<?>) window.getScene().lookup("#unit-matches")).getItems().size());
  }
}
