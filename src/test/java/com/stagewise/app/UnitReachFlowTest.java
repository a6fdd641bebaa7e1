package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import javafx.scene.Node;
import javafx.scene.control.ListCell;
import org.junit.jupiter.api.Test;

/**
 * The unit screen's next action in a real (headless) window on the demo shop: once a unit is
 * chosen, what a technician does next stands wholly in the window with the screen scrolled to its
 * top, at 1024×600 (a small touch laptop, where the serial keypad takes the left column's height)
 * and 1280×800, in the ordinary look, with larger text, with high contrast and with both, each
 * control giving a finger at least {@link Reach#FINGER} px each way (about 48 px, 9 mm, is common
 * practice for a touch target; from memory): the symptom field and Open case for any unit, and for
 * a unit with a case still open, that case's row and "Resume this open case" too.
 */
class UnitReachFlowTest extends WindowFlow {
  /** A demo unit with a case still open (the demo history's Riverside Community Hall desk). */
  private static final String WITH_OPEN_CASE = "NF8-21037";

  @Test
  void openNewCase_unitWithClosedCasesOnly_standsInSightAtTheTopInEveryLook() throws Exception {
    robot.clickOn("#caution-ok");
    settle();
    findDemoUnit();
    assertThat(text("#unit-title")).contains(SERIAL);
    assertThat(fx(() -> robot.lookup("#open-case").query().isDisabled())).isFalse();

    inFourLooks(
        "unit-reach-closed",
        new int[][] {SMALL, LAPTOP},
        (size, where, look) -> {
          String what = "the unit screen, unit " + SERIAL + ", at " + where + ", " + look;
          assertInSightAtTop("#scroll-unit", what, "#unit-title", "#symptom", "#open-case");
          picture("closed", where, look);
          assertFingerSized(what, "#symptom", "#open-case");
        });
  }

  @Test
  void resumeOrOpenNewCase_unitWithAnOpenCase_standsInSightAtTheTopInEveryLook() throws Exception {
    robot.clickOn("#caution-ok");
    settle();
    findUnit(WITH_OPEN_CASE);
    assertThat(text("#unit-title")).contains(WITH_OPEN_CASE);
    ListCell<?> open = fx(this::openRow);
    ScreenScroll.intoView(open);
    robot.clickOn(open);
    settle();
    assertThat(fx(() -> robot.lookup("#resume-case").query().isDisabled())).isFalse();

    inFourLooks(
        "unit-reach-open",
        new int[][] {SMALL, LAPTOP},
        (size, where, look) -> {
          String what = "the unit screen, unit " + WITH_OPEN_CASE + ", at " + where + ", " + look;
          assertInSightAtTop(
              "#scroll-unit", what, "#unit-title", "#resume-case", "#symptom", "#open-case");
          Node row = fx(this::openRow);
          assertThat(
                  fx(
                      () ->
                          Reach.outOfSight(
                              row, window.getScene().getWidth(), window.getScene().getHeight())))
              .as("the open case's row on %s", what)
              .isEmpty();
          picture("open", where, look);
          assertFingerSized(what, "#resume-case", "#symptom", "#open-case");
          assertThat(fx(() -> Reach.fingerSized(row))).as("the open case's row").isTrue();
        });
  }

  /** The row of the unit's case that is still open. */
  private ListCell<?> openRow() {
    return robot
        .lookup("#unit-cases .list-cell")
        .match((ListCell<?> c) -> c.getText() != null && c.getText().contains("Still open"))
        .<ListCell<?>>query();
  }

  private void picture(String unit, String where, String look) throws Exception {
    savePicture(
        Path.of(
            "target",
            "screens",
            "unit-reach",
            where,
            (unit + " " + look).replaceAll("[^a-zA-Z]+", "-") + ".png"));
  }
}
