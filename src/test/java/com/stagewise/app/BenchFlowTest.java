package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.ui.Step;
import java.nio.file.Path;
import javafx.scene.control.Label;
import org.junit.jupiter.api.Test;

/**
 * Walks the whole bench flow on the demo shop in a real (headless) window: find a unit, open a
 * case, pick the stage, enter the rails and pin readings, see the first suspect and the next probe,
 * close out, and find the case in the history.
 *
 * <p>With {@code -Dscreenshots=true} it also writes a picture of every screen to src/site/screens.
 */
class BenchFlowTest extends WindowFlow {

  @Test
  void wholeFlow_onDemoCase_findsOpenFeedbackResistorAndKeepsTheCase() throws Exception {
    shoot("01-safety-caution");
    robot.clickOn("#caution-ok");
    settle();
    assertThat(workshop.settings().cautionAcknowledged()).isTrue();

    // Unit: the serial typed on the on-screen keypad.
    findDemoUnit();
    assertThat(text("#unit-title")).contains(SERIAL).contains("Northfield MX-8");
    robot.clickOn("#symptom").write("Channel 1 output pinned negative, no audio");
    shoot("02-unit");
    robot.clickOn("#open-case");
    settle();
    // The desk is mains-powered: the caution comes up again before the stage.
    assertThat(robot.lookup("#caution").tryQuery()).isPresent();
    assertThat(text("#caution .caution-reason")).contains("mains-powered");
    robot.clickOn("#caution-ok");
    settle();
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.STAGE);

    // Stage: the board model's library; one part's value checked on the value pad.
    clickCell("#stage-library", "Channel line driver");
    settle();
    clickCell("#stage-parts", "R2 ");
    settle();
    assertThat(text("#part-display")).isEqualTo("47K");
    shoot("03-stage");
    robot.clickOn("#tab-decoder");
    for (String band : new String[] {"yellow", "violet", "orange", "gold"}) {
      robot.clickOn("#band-" + band);
    }
    assertThat(text("#decoder-result")).contains("47 kΩ").contains("±5%");
    shoot("04-stage-colour-code");
    robot.clickOn("#tab-pad");
    robot.clickOn("#use-stage");
    settle();
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.READINGS);

    // Readings: rails first, as a technician checks them (common practice).
    assertThat(text("#probe-call")).isEqualTo("Probe U1 pin 8");
    shoot("05-readings-first-probe");
    // A slip of the finger: 1.50 V typed for the 14.96 V on the supply pin. A rail that low is the
    // first suspect; the card is tapped and corrected, and the rail is no longer suspected.
    typeReading(1.50);
    assertThat(fx(() -> app.bench().diagnosisProperty().get().suspects().get(0).fault()))
        .startsWith("VCC:");
    tapReadingCard(1.50);
    robot.clickOn("#reading-correct");
    assertThat(text("#correcting")).contains("U1 pin 8");
    assertThat(text("#reading-display")).isEqualTo("1.5");
    robot.clickOn("#reading-key-clear");
    typeReading(VCC);
    assertThat(text("#reading-undo-text")).startsWith("Corrected U1 pin 8");
    assertThat(fx(() -> app.bench().diagnosisProperty().get().suspects().get(0).fault()))
        .doesNotStartWith("VCC:");
    assertThat(fx(() -> app.bench().readings().size())).isEqualTo(1);
    assertThat(text("#probe-call")).isEqualTo("Probe U1 pin 4");
    typeReading(VEE);
    // A reading taken at the wrong point is struck out: the diagnosis is again that of the rails.
    String beforeStray = fx(() -> app.bench().diagnosisProperty().get().suspects().get(0).fault());
    typeReading(9.99);
    tapReadingCard(9.99);
    robot.clickOn("#reading-strike");
    settle();
    assertThat(fx(() -> app.bench().readings().size())).isEqualTo(2);
    assertThat(fx(() -> app.bench().struckReadings().size())).isEqualTo(2);
    assertThat(fx(() -> app.bench().diagnosisProperty().get().suspects().get(0).fault()))
        .isEqualTo(beforeStray);
    assertThat(text("#reading-undo-text")).startsWith("Struck out");
    // Then where the diagnosis learns most; we read what an open R2 gives at each point.
    String firstSignalProbe = text("#probe-call");
    Diagnosis afterRails = fx(() -> app.bench().diagnosisProperty().get());
    assertThat(firstSignalProbe).startsWith("Probe").isNotEqualTo("Probe U1 pin 4");
    assertThat(afterRails.nextProbes()).isNotEmpty();
    for (int probe = 0; probe < 4 && !text("#probe-call").startsWith("No further"); probe++) {
      String at = fx(() -> app.bench().readings().isEmpty() ? "" : currentProbeAt());
      typeReading(openFeedbackResistor(at, "SUM", "OUT"));
      Diagnosis now = fx(() -> app.bench().diagnosisProperty().get());
      if (now.suspects().get(0).probability() > 0.8
          && now.suspects().get(0).group().contains("R2:open")) {
        break;
      }
    }
    shoot("06-readings");
    Diagnosis diagnosis = fx(() -> app.bench().diagnosisProperty().get());
    Suspect first = diagnosis.suspects().get(0);
    // Textbook: with the feedback resistor open the inverting stage runs open-loop, so the output
    // sits at the negative limit while the inverting input follows the input through R1. An R1
    // short reads the same at every pin, so R2:open may share its group with R1:short.
    assertThat(first.group()).contains("R2:open");
    assertThat(text("#readings-verdict")).contains("Most likely");

    // Suspects, then close-out with the first suspect.
    robot.clickOn("#show-suspects");
    settle();
    assertThat(text("#confirming-check")).isNotBlank();
    shoot("07-suspects");
    robot.clickOn("#suspects-close-out");
    settle();
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.CLOSE_OUT);
    assertThat(text("#action-part"))
        .isEqualTo(first.fault().substring(0, first.fault().indexOf(':')));
    tap("#action-add");
    settle();
    tap("#outcome-fixed");
    tap("#close-notes");
    robot.write("Replaced and checked the output swings both ways.");
    shoot("08-close-out");
    tap("#close-case");
    settle();

    // History: the closed case as it was, and found again by its serial.
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.HISTORY);
    assertThat(text("#history-case-status")).contains("fixed");
    robot.clickOn("#history-field-serial");
    robot.clickOn("#history-query").write(SERIAL);
    robot.clickOn("#history-search");
    settle();
    shoot("09-history");
    var hits =
        workshop
            .store()
            .cases()
            .search(SearchQuery.all().withSerial(SERIAL).withStatus(CaseStatus.CLOSED));
    assertThat(hits)
        .anySatisfy(
            hit -> {
              assertThat(hit.symptom()).startsWith("Channel 1 output pinned negative");
              assertThat(hit.outcome()).isEqualTo(Outcome.FIXED);
              assertThat(hit.confirmedFaults()).contains(first.fault());
            });
    assertThat(fx(() -> app.bench().openCaseProperty().get())).isNull();
    var file =
        workshop
            .store()
            .cases()
            .caseFile(
                hits.stream()
                    .filter(h -> h.symptom().startsWith("Channel 1 output pinned"))
                    .findFirst()
                    .orElseThrow()
                    .caseId())
            .orElseThrow();
    assertThat(file.readings()).hasSizeGreaterThanOrEqualTo(5);
    // Nothing deleted: the mistyped and the stray readings are kept, struck out, with when.
    assertThat(file.readings())
        .filteredOn(r -> r.struck())
        .extracting(r -> r.value())
        .containsExactlyInAnyOrder(1.50, 9.99);
    assertThat(fx(() -> labelsContaining("struck out"))).hasSize(2);
    assertThat(file.suspectLists()).isNotEmpty();
    assertThat(file.actions()).isNotEmpty();
    assertThat(file.notes())
        .extracting(n -> n.text())
        .contains("Replaced and checked the output swings both ways.");
  }

  /** Taps the card of the reading with this value on the readings screen. */
  private void tapReadingCard(double value) throws Exception {
    javafx.scene.control.ListCell<?> card =
        robot
            .lookup("#readings-list .list-cell")
            .match(
                (javafx.scene.control.ListCell<com.stagewise.ui.readings.ReadingRow> cell) ->
                    cell.getItem() != null && cell.getItem().reading().value() == value)
            .<javafx.scene.control.ListCell<?>>query();
    ScreenScroll.intoView(card);
    robot.clickOn(card);
    settle();
    // The card's choices (correct, strike out) open below it: bring them into sight too.
    ScreenScroll.intoView(robot.lookup("#reading-strike").query());
  }

  private String currentProbeAt() {
    var readings = app.bench().readings();
    // The probe shown is the view model's; read it from the label's words instead of guessing.
    String call = ((Label) robot.lookup("#probe-call").query()).getText();
    return call.replace("Probe ", "")
            .replace(" pin ", ".")
            .replace("net ", "")
            .replaceAll(" \\(AC.*", "")
        + (readings.isEmpty() ? "" : "");
  }

  /**
   * Shows the screen at each window size, fails when any text on it is cut short (shown with an
   * ellipsis, a label narrower than a word, a drawing's value shortened) or when it needs a
   * sideways scroll bar, and saves a picture at each size: 1280×800 under the screen's name, the
   * others in a folder named for their size. At every size the same checks run with larger text,
   * with high contrast (the settings' switches for a dim bench) and with both at once, their
   * pictures in folders named for the look.
   */
  private void shoot(String name) throws Exception {
    assertWholeInFourLooks(
        name,
        new int[][] {SMALL, LAPTOP, DESK},
        (size, where) -> {
          if (size == LAPTOP) {
            savePicture(screensFolder().resolve(name + ".png"));
          } else {
            savePicture(Path.of("target", "screens", where, name + ".png"));
          }
          if (size == SMALL && name.equals("06-readings") && Boolean.getBoolean("screenshots")) {
            savePicture(screensFolder().resolve("10-readings-1024x600.png"));
          }
        });
    if (name.equals("02-unit") && Boolean.getBoolean("screenshots")) {
      // README's picture of the unit screen with larger text and high contrast, as the looks'
      // check above has just shown it at 1280×800.
      java.nio.file.Files.copy(
          Path.of("target", "screens", "larger-text-high-contrast", "1280x800", name + ".png"),
          screensFolder().resolve("14-unit-larger-text-high-contrast.png"),
          java.nio.file.StandardCopyOption.REPLACE_EXISTING);
    }
  }
}
