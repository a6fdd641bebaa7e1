package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.ui.Step;
import org.junit.jupiter.api.Test;

/**
 * Builds a stage from empty in the stage editor by taps alone (rails, input, a section, parts, each
 * net tapped or made new, values on the value pad), diagnoses an open feedback resistor on it and
 * closes the case, in a real (headless) window on the demo shop.
 *
 * <p>With {@code -Dscreenshots=true} it writes the editor's pictures to src/site/screens.
 */
class EditorFlowTest extends WindowFlow {

  @Test
  void stageBuiltFromEmptyByTouch_diagnosesAnOpenFeedbackResistorAndClosesTheCase()
      throws Exception {
    tap("#caution-ok");
    for (char c : SERIAL.toCharArray()) {
      tap("#serial-key-" + c);
    }
    tap("#serial-search");
    // The case's symptom is words; the stage below is built by taps alone.
    robot.clickOn("#symptom").write("Output pinned negative, no audio");
    tap("#open-case");
    tap("#caution-ok");
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.STAGE);

    // The editor, from empty.
    tap("#stage-new");
    assertThat(fx(() -> shown("#screen-stage-editor"))).isTrue();
    // Rails: the split supply the editor offers first.
    tap("#editor-add-rail");
    tap("#editor-add-rail");
    // The test input: 1 V DC on the value pad, and the AC preset.
    tap("#editor-add-input");
    tap("#editor-volts-key-1");
    tap("#editor-volts-enter");
    tap("#editor-input-ac-preset");
    // One section of a dual package, its supply pins already on the rails; inputs and output
    // tapped: in+ to ground, in- and out on new nets.
    tap("#editor-add-dual-8");
    tap("#editor-section-in-plus-GND");
    tap("#editor-section-in-minus-new-net");
    tap("#editor-section-out-new-net");
    // R1 (10 kΩ offered) from the input to the inverting input; R2 47 kΩ across the section.
    tap("#editor-add-resistor");
    tap("#editor-part-net-1-IN");
    tap("#editor-part-net-2-N1");
    tap("#editor-add-resistor");
    tap("#editor-value-key-4");
    tap("#editor-value-key-7");
    tap("#editor-value-key-k");
    tap("#editor-value-enter");
    tap("#editor-part-net-1-N1");
    tap("#editor-part-net-2-N2");
    assertThat(text("#editor-problem-count")).startsWith("No problems");
    shoot("11-stage-editor");
    tap("#editor-save");
    assertThat(fx(() -> shown("#screen-stage-editor"))).isFalse();

    tap("#use-stage");
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.READINGS);
    var built = fx(() -> app.bench().stageProperty().get());
    assertThat(built.amplifiers()).hasSize(1);
    assertThat(built.part("R2").orElseThrow().value()).isEqualTo(47000.0);

    // Readings of an open R2, as the diagnosis asks for them (rails first).
    for (int probe = 0; probe < 8 && !text("#probe-call").startsWith("No further"); probe++) {
      typeReading(openFeedbackResistor(currentProbeAt(), "N1", "N2"));
      Diagnosis now = fx(() -> app.bench().diagnosisProperty().get());
      if (now.suspects().get(0).probability() > 0.8
          && now.suspects().get(0).group().contains("R2:open")) {
        break;
      }
    }
    Diagnosis diagnosis = fx(() -> app.bench().diagnosisProperty().get());
    Suspect first = diagnosis.suspects().get(0);
    // Textbook: with the feedback resistor open the inverting stage runs open-loop and the output
    // clamps at the negative limit while the inverting input follows the input.
    assertThat(first.group()).contains("R2:open");

    tap("#show-suspects");
    tap("#suspects-close-out");
    tap("#action-add");
    tap("#outcome-fixed");
    tap("#close-case");
    assertThat(fx(() -> app.bench().stepProperty().get())).isEqualTo(Step.HISTORY);

    var hits =
        workshop
            .store()
            .cases()
            .search(SearchQuery.all().withSerial(SERIAL).withStatus(CaseStatus.CLOSED));
    assertThat(hits)
        .anySatisfy(
            hit -> {
              assertThat(hit.outcome()).isEqualTo(Outcome.FIXED);
              assertThat(hit.confirmedFaults()).contains(first.fault());
            });
    // The stage built for this unit joined its board model's library.
    var model = workshop.store().units().findBoardModel("Northfield MX-8 channel board");
    assertThat(model).isPresent();
    assertThat(workshop.store().library().sheets(model.get().id()))
        .anySatisfy(sheet -> assertThat(sheet.title()).isEqualTo("New stage"));
  }

  private String currentProbeAt() throws Exception {
    String call = text("#probe-call");
    return call.replace("Probe ", "")
        .replace(" pin ", ".")
        .replace("net ", "")
        .replaceAll(" \\(AC.*", "");
  }

  /** Taps a node as a finger would (scrolled into sight first) and waits for what it starts. */
  @Override
  void tap(String query) throws Exception {
    try {
      super.tap(query);
      settle();
    } catch (Exception | AssertionError e) {
      // A picture of the window as it was when the tap failed, to see why.
      shoot("failed-tap-" + query.replaceAll("[^A-Za-z0-9-]", ""));
      throw e;
    }
  }

  /** Whether a node is shown: it and every node it sits in are visible. */
  private boolean shown(String query) {
    for (javafx.scene.Node n = robot.lookup(query).query(); n != null; n = n.getParent()) {
      if (!n.isVisible()) {
        return false;
      }
    }
    return true;
  }

  /**
   * Saves the editor's picture, and at 1024×600 and 1280×800, in the ordinary look, with larger
   * text, with high contrast and with both, fails on any text cut short (a hint in a field
   * included), any control past its panel and any sideways scroll bar.
   */
  private void shoot(String name) throws Exception {
    savePicture(screensFolder().resolve(name + ".png"));
    if (name.startsWith("failed-tap")) {
      return;
    }
    assertWholeInFourLooks(name, new int[][] {SMALL, LAPTOP});
  }
}
