package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import javafx.scene.Node;
import javafx.scene.input.KeyCode;
import org.junit.jupiter.api.Test;

/**
 * The value pad's sign key in a real (headless) window on the readings screen: an AC amplitude
 * (RMS, peak or peak-to-peak, as a meter's AC range or a scope shows it) is never negative (any
 * circuits textbook: an amplitude is a magnitude), so the ± key is off while the pad takes AC
 * volts, with a line that says why; a minus typed on the keyboard is refused with what to fix, and
 * what was typed stays. DC keeps its sign key.
 */
class AcSignFlowTest extends WindowFlow {

  @Test
  void signKey_isOffForAcVolts_andANegativeAmplitudeIsRefusedKeepingWhatWasTyped()
      throws Exception {
    openLineDriverCase("Channel 1 hums");
    assertThat(disabled("#reading-key-sign")).as("DC volts take a sign").isFalse();

    scrollToTop("#pad-kind");
    robot.clickOn("#pad-ac");
    settle();

    assertThat(disabled("#reading-key-sign")).as("an AC amplitude takes none").isTrue();
    assertThat(labelsContaining("± is off"))
        .containsExactly(
            "m = milli (350m = 0.35 V), µ = micro. ± is off: an AC amplitude (RMS, peak or"
                + " peak-to-peak) is never negative.");
    robot.clickOn("#reading-key-sign");
    assertThat(text("#reading-display")).isEmpty();

    robot.clickOn("#reading-display").write("-0.33");
    settle();
    assertThat(labelsContaining("cannot be negative"))
        .containsExactly(
            "An AC amplitude (RMS, peak or peak-to-peak) cannot be negative: type it without the"
                + " minus sign.");
    assertThat(disabled("#reading-enter")).isTrue();
    savePicture(Path.of("target", "screens", "readings-ac-no-sign.png"));
    robot.type(KeyCode.ENTER);
    settle();
    assertThat(visible("#problem")).isTrue();
    assertThat(labelsContaining("An AC amplitude has no sign")).hasSize(1);
    robot.clickOn("#problem-ok");
    settle();
    assertThat(text("#reading-display")).isEqualTo("-0.33");

    // Back to DC volts: the sign key works again and the same entry is a value.
    robot.clickOn("#pad-dc");
    settle();
    assertThat(disabled("#reading-key-sign")).isFalse();
    assertThat(disabled("#reading-enter")).isFalse();
  }

  private boolean disabled(String query) throws Exception {
    return fx(
        () -> {
          Node node = robot.lookup(query).query();
          return node.isDisabled();
        });
  }
}
