package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Reading;
import com.stagewise.history.record.StoredReading;
import com.stagewise.ui.readings.ReadingRow;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import javafx.scene.Node;
import javafx.scene.text.Text;
import org.junit.jupiter.api.Test;

/**
 * An AC check in a real (headless) window, on the demo shop's mixing desk and its channel line
 * driver: an inverting stage, R2/R1 = 47 kΩ/10 kΩ (1 %), fed 0.1 V peak at 1 kHz into IN.
 *
 * <p>Outside facts: the inverting amplifier's gain is −R2/R1 = −4.7, so a healthy output carries
 * 0.47 V peak (any op-amp textbook); a sine's RMS value is its peak over √2 (any circuits
 * textbook), so a meter on AC volts reads about 0.332 V there. The reading is taken in RMS, as a
 * meter gives it, and compared with the AC expectation in RMS.
 *
 * <p>With {@code -Dscreenshots=true} the picture goes to src/site/screens.
 */
class AcFlowTest extends WindowFlow {
  private static final double ROOT2 = Math.sqrt(2);

  @Test
  void acRmsReading_atTheOutput_isComparedWithTheAcExpectationInRms() throws Exception {
    openLineDriverCase("Channel 1 sounds dull and quiet");
    // The test signal and its frequency are on the screen; the pad says what it takes.
    assertThat(text("#test-signal")).contains("IN").contains("1\u00a0kHz");
    assertThat(selected("#pad-dc")).isTrue();
    assertThat(visible("#pad-measure")).isFalse();

    // Rails first (common practice), then the output pin tapped on the package drawing (dual-8:
    // pin 1 is out A; DESIGN.md), read in AC on the meter's AC volts range: RMS.
    typeValue(String.valueOf(VCC));
    typeValue(String.valueOf(VEE));
    tap("#package-drawing #pin-1");
    settle();
    // The screen is taller than the window: back to its top, as a finger scrolls, to the pad's
    // switch.
    scrollToTop("#pad-kind");
    robot.clickOn("#pad-ac");
    robot.clickOn("#measure-rms");
    settle();
    assertThat(text("#probe-call")).isEqualTo("Probe U1 pin 1 (AC volts RMS at 1\u00a0kHz)");
    assertThat(text("#pad-takes")).isEqualTo("AC volts RMS at 1\u00a0kHz");
    assertThat(selected("#pad-ac")).isTrue();
    assertThat(selected("#measure-rms")).isTrue();
    shoot("14-readings-ac-pad");
    typeValue("0.332");

    ReadingRow card = fx(this::acCard);
    assertThat(card.reading().kind()).isEqualTo(Reading.Kind.AC);
    assertThat(card.reading().measure()).contains(AcMeasure.RMS);
    // The healthy band in RMS: 0.47 V peak × 0.99 … ÷ 0.99 (1 % resistors, one at a time), over √2.
    assertThat(card.healthyLow()).isCloseTo(0.47 * 0.99 / ROOT2, within(1e-4));
    assertThat(card.healthyHigh()).isCloseTo(0.47 / 0.99 / ROOT2, within(1e-4));
    assertThat(card.healthy()).isTrue();
    assertThat(fx(() -> labelsContaining("332.0\u00a0mV AC RMS")))
        .anyMatch(l -> l.contains("in the healthy range"));
    // The card's chart is an AC chart in RMS, with its band known.
    List<String> charted = fx(this::acChartTexts);
    assertThat(charted).contains("332.0\u00a0mV RMS");
    assertThat(charted).anyMatch(t -> t.startsWith("healthy ") && t.endsWith(" RMS"));
    assertThat(charted).doesNotContain("healthy band unknown");
    shoot("14-readings-ac");

    // The test frequency cannot move under an AC reading taken at 1 kHz; what was typed stays.
    tap("#test-frequency");
    robot.write("2k");
    tap("#test-frequency-set");
    settle();
    assertThat(text("#test-frequency-problem")).contains("Strike them out");
    assertThat(text("#test-frequency")).isEqualTo("2k");

    // Stored with its measure; the suspects' table lists the AC reading in RMS.
    String caseId = fx(() -> app.bench().openCaseProperty().get().id());
    StoredReading stored =
        workshop.store().cases().caseFile(caseId).orElseThrow().readings().get(2);
    assertThat(stored.measureWord()).isEqualTo("rms");
    assertThat(stored.hz()).isEqualTo(1000.0);
    // The column is taller than the window now: the button is tapped as a finger would after
    // scrolling to it.
    fx(
        () -> {
          robot.lookup("#show-suspects").queryButton().fire();
          return null;
        });
    settle();
    assertThat(fx(() -> labelsContaining("U1 pin 1, AC RMS at 1\u00a0kHz"))).hasSize(1);
  }

  /** Returns the row behind the card of the AC reading on the readings screen. */
  @SuppressWarnings("unchecked")
  private ReadingRow acCard() {
    return robot.lookup("#readings-list .list-cell").queryAll().stream()
        .map(n -> ((javafx.scene.control.ListCell<ReadingRow>) n).getItem())
        .filter(r -> r != null && r.reading().kind() == Reading.Kind.AC)
        .findFirst()
        .orElseThrow();
  }

  /** Returns every text drawn on the band charts of AC readings' cards. */
  private List<String> acChartTexts() {
    List<String> texts = new ArrayList<>();
    for (Node chart : robot.lookup("#readings-list .band-chart").queryAll()) {
      if (chart instanceof com.stagewise.ui.drawing.BandChart band && !band.acMeasure().isEmpty()) {
        for (Node n : band.getChildrenUnmodifiable()) {
          if (n instanceof Text t) {
            texts.add(t.getText());
          }
        }
      }
    }
    return texts;
  }

  /** Types a value on the pad's keys (a leading minus on the sign key) and adds the reading. */
  private void typeValue(String value) throws Exception {
    String digits = value;
    if (value.startsWith("-")) {
      robot.clickOn("#reading-key-sign");
      digits = value.substring(1);
    }
    for (char c : digits.toCharArray()) {
      robot.clickOn("#reading-key-" + (c == '.' ? "point" : String.valueOf(c)));
    }
    robot.clickOn("#reading-enter");
    settle();
  }

  private boolean selected(String query) throws Exception {
    return fx(
        () -> robot.lookup(query).queryAs(javafx.scene.control.ToggleButton.class).isSelected());
  }

  /**
   * Shows the readings screen at 1280×800 and 1024×600, in the ordinary look, with larger text and
   * with high contrast; fails when a text of its AC parts or of a reading's card is cut short
   * (drawn with an ellipsis) or the screen needs a sideways scroll bar, and saves a picture of
   * each.
   */
  private void shoot(String name) throws Exception {
    scrollToTop("#pad-kind");
    atSizes(
        new int[][] {LAPTOP, SMALL},
        (size, where) -> {
          boolean site = Boolean.getBoolean("screenshots") && size == LAPTOP;
          savePicture(
              site
                  ? Path.of("src", "site", "screens", name + ".png")
                  : Path.of("target", "screens", where, name + ".png"));
          String[] parts = {
            "#mode-volts",
            "#mode-ohms",
            "#pad-kind",
            "#pad-measure",
            "#pad-takes",
            "#test-signal",
            "#probe-call",
            "#readings-list"
          };
          assertNothingCut(name, where, parts);
          assertNoSidewaysScroll(name, where);
          inEveryLook(
              name,
              where,
              look -> {
                assertNothingCut(name + " with " + look, where, parts);
                assertNoSidewaysScroll(name + " with " + look, where);
              });
        });
  }
}
