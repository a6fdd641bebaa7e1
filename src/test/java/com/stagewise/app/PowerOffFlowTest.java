package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Reading;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.StoredReading;
import com.stagewise.ui.readings.ProbePoint;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import javafx.scene.Node;
import javafx.scene.control.ComboBox;
import javafx.scene.text.Text;
import org.junit.jupiter.api.Test;

/**
 * The readings screen's power-off mode in a real (headless) window, on the demo shop's mixing desk
 * (mains-powered) and its channel line driver: R1 10 kΩ from IN to SUM, R2 47 kΩ feedback from SUM
 * to OUT, both 1 %, on U1A.
 *
 * <p>Outside facts: with R2 open or R1 shorted the inverting amplifier runs with no working loop
 * gain, its output clamps about 1.5 V above the negative rail and SUM follows the input, so volts
 * cannot tell the two apart (any op-amp textbook). With the power off the rails and the input float
 * and the op-amp draws nothing (DESIGN.md's power-off model), so IN to SUM reads R1 alone (10 kΩ
 * when whole) and SUM to OUT reads R2 alone: OL when it is open (series and parallel resistors, any
 * circuits textbook).
 *
 * <p>With {@code -Dscreenshots=true} the power-off picture goes to src/site/screens.
 */
class PowerOffFlowTest extends WindowFlow {

  /** Where each test point of the line driver sits (its stage sheet in the demo shop). */
  private static final Map<String, String> NET =
      Map.ofEntries(
          Map.entry("U1.1", "OUT"),
          Map.entry("U1.2", "SUM"),
          Map.entry("U1.3", "GND"),
          Map.entry("U1.4", "VEE"),
          Map.entry("U1.8", "VCC"),
          Map.entry("R1.1", "IN"),
          Map.entry("R1.2", "SUM"),
          Map.entry("R2.1", "SUM"),
          Map.entry("R2.2", "OUT"));

  @Test
  void ohmsProbe_followedInPowerOffMode_narrowsTheSuspectsToTheOpenFeedbackResistor()
      throws Exception {
    openLineDriverCase("Channel 1 output pinned negative, no audio");

    // Powered: the rails, then the output and the inverting input tapped on the package drawing
    // (dual-8: pin 1 out A, pin 2 in− A; DESIGN.md), read as an open R2 gives them.
    typeReading(VCC);
    typeReading(VEE);
    tap("#package-drawing #pin-1");
    typeReading(VEE + HEADROOM);
    tap("#package-drawing #pin-2");
    typeReading(1.0);
    Suspect first = fx(() -> app.bench().diagnosisProperty().get().suspects().get(0));
    assertThat(first.group()).contains("R2:open", "R1:short");
    assertThat(visible("#poweroff-banner")).isFalse();

    // The diagnosis ranks a power-off check first: the screen offers it, one tap takes it.
    ProbeAdvice offered = fx(() -> app.bench().diagnosisProperty().get().nextProbes().get(0));
    assertThat(offered.kind()).isEqualTo(Reading.Kind.OHMS);
    assertThat(visible("#take-ohms")).isTrue();
    assertThat(text("#ohms-offer")).contains("power-off check");
    ScreenScroll.intoView(robot.lookup("#take-ohms").query());
    robot.clickOn("#take-ohms");
    settle();
    assertThat(visible("#poweroff-banner")).isTrue();
    assertThat(text("#poweroff-caution"))
        .contains("unplug", "discharge", "wait", "ohms", "local codes and licensed practice");
    assertThat(text("#ohms-call")).startsWith("Read ohms from");
    assertThat(visible("#reading-key-ol")).isTrue();
    assertThat(visible("#reading-key-sign")).isFalse();
    shoot("13-readings-power-off");

    // The suggested pair, as the meter reads it with R2 open; then the other check by taps.
    Set<String> done = new java.util.HashSet<>();
    done.add(pairNets(offered.at(), offered.to()));
    typeOhms(ohmsWithOpenFeedback(offered.at(), offered.to()));
    if (!done.contains("IN|SUM")) {
      pickFromList("IN");
      tap("#package-drawing #pin-2");
      settle();
      assertThat(text("#ohms-call")).isEqualTo("Read ohms from net IN to U1 pin 2");
      typeOhms("9k98");
    }
    if (!done.contains("OUT|SUM")) {
      tap("#package-drawing #pin-2");
      tap("#package-drawing #pin-1");
      settle();
      assertThat(text("#ohms-call")).isEqualTo("Read ohms from U1 pin 2 to U1 pin 1");
      typeOhms("OL");
    }

    Diagnosis after = fx(() -> app.bench().diagnosisProperty().get());
    assertThat(after.suspects().get(0).fault()).isEqualTo("R2:open");
    assertThat(after.suspects().get(0).group()).containsExactly("R2:open");
    assertThat(text("#readings-verdict")).contains("R2 open");
    // The stored case holds both ohms readings beside the volts, through the case workflow.
    String caseId = fx(() -> app.bench().openCaseProperty().get().id());
    List<StoredReading> stored = workshop.store().cases().caseFile(caseId).orElseThrow().readings();
    List<StoredReading> ohms = stored.stream().filter(r -> r.kind() == ReadingKind.OHMS).toList();
    assertThat(ohms).hasSize(2);
    assertThat(ohms).anyMatch(r -> r.value() == Double.POSITIVE_INFINITY);
    assertThat(ohms).anyMatch(r -> Math.abs(r.value() - 9980) < 1e-6 || r.value() < 1);
    assertThat(stored).hasSize(6);
    // The cards chart ohms with the healthy range of the closed forms: SUM to OUT reads R2 alone,
    // 47 kΩ ±1 %; IN to SUM reads R1 alone, 10 kΩ ±1 %.
    List<String> charted = fx(() -> chartTexts());
    assertThat(charted)
        .contains("healthy 46.5\u00a0kΩ to 47.5\u00a0kΩ", "healthy 9.9\u00a0kΩ to 10.1\u00a0kΩ");
    assertThat(charted).contains("OL  outside");
    shoot("13-readings-power-off-done");

    // On the schematic a part's lead is a point of its own: R1's lead on IN, tapped.
    tap("#show-schematic");
    settle();
    Node lead = robot.lookup((Node n) -> "point-R1.1".equals(n.getId())).query();
    ScreenScroll.intoView(lead);
    robot.clickOn(lead);
    settle();
    assertThat(text("#ohms-from")).isEqualTo("From:  R1 lead 1");
    // A wire stands for its net: OUT's wire, tapped, fills the second place.
    Node wire = robot.lookup((Node n) -> "point-OUT".equals(n.getId())).query();
    ScreenScroll.intoView(wire);
    robot.clickOn(wire);
    settle();
    assertThat(text("#ohms-to")).contains("OUT");

    // Back to volts: nothing is lost, the banner goes.
    scrollToTop("#mode-volts");
    robot.clickOn("#mode-volts");
    settle();
    assertThat(visible("#poweroff-banner")).isFalse();
    assertThat(fx(() -> app.bench().readings().size())).isEqualTo(6);
  }

  /** Returns every text drawn on the band charts of the ohms readings' cards. */
  private List<String> chartTexts() {
    List<String> texts = new ArrayList<>();
    for (Node chart : robot.lookup("#readings-list .band-chart").queryAll()) {
      if (chart instanceof com.stagewise.ui.drawing.BandChart band && band.showsOhms()) {
        for (Node n : band.getChildrenUnmodifiable()) {
          if (n instanceof Text t) {
            texts.add(t.getText());
          }
        }
      }
    }
    return texts;
  }

  /** Returns the two points' nets, sorted and joined: "OUT|SUM". */
  private static String pairNets(String a, String b) {
    String x = NET.getOrDefault(a, a);
    String y = NET.getOrDefault(b, b);
    return x.compareTo(y) < 0 ? x + "|" + y : y + "|" + x;
  }

  /** Returns what the ohmmeter shows between two points with R2 open (as the pad takes it). */
  private static String ohmsWithOpenFeedback(String a, String b) {
    String pair = pairNets(a, b);
    if (NET.getOrDefault(a, a).equals(NET.getOrDefault(b, b))) {
      return "0.3"; // a joint against its own net: the test leads alone (common practice)
    }
    return pair.equals("IN|SUM") ? "9k98" : "OL";
  }

  private void typeOhms(String shown) throws Exception {
    if (shown.equals("OL")) {
      robot.clickOn("#reading-key-ol");
    } else {
      for (char c : shown.toCharArray()) {
        robot.clickOn(
            "#reading-key-"
                + switch (c) {
                  case '.' -> "point";
                  case 'M' -> "mega";
                  default -> String.valueOf(c);
                });
      }
    }
    robot.clickOn("#reading-enter");
    settle();
  }

  /** Picks a point from the screen's list of test points (the list's own selection). */
  @SuppressWarnings("unchecked")
  private void pickFromList(String at) throws Exception {
    fx(
        () -> {
          ComboBox<ProbePoint> box = robot.lookup("#other-point").queryAs(ComboBox.class);
          ProbePoint point =
              box.getItems().stream().filter(p -> p.at().equals(at)).findFirst().orElseThrow();
          box.getSelectionModel().select(point);
          return null;
        });
    settle();
  }

  /**
   * Shows the screen at 1280×800 and 1024×600, in the ordinary look, with larger text and with high
   * contrast; fails when a text of the power-off parts is cut short (drawn with an ellipsis) or the
   * screen needs a sideways scroll bar, and saves a picture of each.
   */
  private void shoot(String name) throws Exception {
    scrollToTop("#mode-volts");
    atSizes(
        new int[][] {LAPTOP, SMALL},
        (size, where) -> {
          boolean site =
              Boolean.getBoolean("screenshots") && size == LAPTOP && !name.endsWith("done");
          savePicture(
              site
                  ? Path.of("src", "site", "screens", name + ".png")
                  : Path.of("target", "screens", where, name + ".png"));
          String[] parts = {
            "#poweroff-banner", "#ohms-call", "#ohms-from", "#ohms-to", "#ohms-why"
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
