package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.ui.drawing.PackageDrawing;
import java.util.ArrayList;
import java.util.List;
import javafx.scene.Node;
import org.junit.jupiter.api.Test;
import org.testfx.util.WaitForAsyncUtils;

/**
 * The readings screen as a technician with a probe in one hand uses it, in a real (headless) window
 * on the demo's channel line driver: at 1024×600 and 1280×800, in the ordinary look, with larger
 * text, with high contrast and with both, the probe call, the point to read (in words and lit on
 * the package drawing) and the value field with its Add reading button stand in the window with the
 * screen scrolled to its top, and at 1024×600 every pin and every control a finger taps gives it at
 * least {@link Reach#FINGER} px each way. With the power off (ohms), the same holds for the
 * caution's key message, the pair of points being measured, the value field and Add reading.
 */
class ReadingsReachFlowTest extends WindowFlow {

  /** What must be in sight without scrolling while a point is read. */
  private static final String[] ESSENTIALS = {
    "#probe-call", "#probe-title", "#reading-display", "#reading-enter"
  };

  /**
   * What must be in sight without scrolling while ohms are read with the power off: the caution's
   * key message (unplug and discharge before any ohms check), the pair and the pad.
   */
  private static final String[] OHMS_ESSENTIALS = {
    "#poweroff-key", "#ohms-call", "#ohms-from", "#ohms-to", "#reading-display", "#reading-enter"
  };

  @Test
  void probeCallPadAndPoint_stayInSightWithoutScrolling_andTargetsAreFingerSized()
      throws Exception {
    openLineDriverCase("Channel 1 output pinned negative, no audio");
    // The rails first (common practice); then the diagnosis asks for a signal pin, and two cards
    // and the suspects fill the results column.
    typeReading(VCC);
    typeReading(VEE);
    assertThat(text("#probe-call")).startsWith("Probe").isNotEqualTo("Probe U1 pin 4");
    // The output pin tapped on the drawing (dual-8: pin 1 is out A; DESIGN.md): lit as the point.
    tap("#package-drawing #pin-1");
    settle();
    assertThat(text("#probe-call")).isEqualTo("Probe U1 pin 1");
    checkEveryLook("DC");

    // The pad on AC volts: the measure's switch and what the pad takes join the pad column.
    scrollToTop("#pad-kind");
    tap("#pad-ac");
    settle();
    assertThat(visible("#pad-measure")).isTrue();
    checkEveryLook("AC");

    // Power off: the caution's key message, the pair being measured, the value field and Add
    // reading in sight (the ohms pad replaces the volts pad).
    scrollToTop("#mode-ohms");
    tap("#mode-ohms");
    settle();
    assertThat(visible("#poweroff-banner")).isTrue();
    assertThat(text("#poweroff-key").toLowerCase(java.util.Locale.ROOT))
        .contains("unplug", "discharge", "capacitors", "ohms");
    assertThat(visible("#reading-key-ol")).isTrue();
    checkEveryLook("ohms");
  }

  @Test
  void powerOffCaution_tappedOpenAndShut_showsItWholeAndKeepsThePadInSightAndWorking()
      throws Exception {
    openLineDriverCase("Channel 1 output pinned negative, no audio");
    typeReading(VCC);
    typeReading(VEE);
    scrollToTop("#mode-ohms");
    tap("#mode-ohms");
    settle();
    assertThat(visible("#poweroff-caution")).as("the whole caution, before a tap").isFalse();

    inFourLooks(
        "caution-open",
        new int[][] {SMALL, LAPTOP},
        (size, where, look) -> {
          String what = "the readings screen, caution open, at " + where + ", " + look;
          tap("#poweroff-key");
          settle();
          relayout();
          // The whole caution: unplug (not just the switch), discharge the capacitors, wait for
          // near 0 V, and local codes first (common practice before any ohms check on mains gear).
          assertThat(visible("#poweroff-caution")).as(what).isTrue();
          assertThat(text("#poweroff-caution"))
              .as(what)
              .contains("unplug the unit", "discharge", "read near 0", "local codes");
          assertThat(text("#poweroff-key")).as(what).contains("Less");
          assertNothingCut(what, where, "#poweroff-banner");
          savePicture(
              java.nio.file.Path.of(
                  "target",
                  "screens",
                  "caution-open",
                  where,
                  look.replaceAll("[^a-zA-Z]+", "-") + ".png"));
          assertInSightAtTop(
              "#scroll-readings",
              what,
              "#poweroff-key",
              "#poweroff-caution",
              "#reading-display",
              "#reading-enter");
          assertFingerSized(what, "#poweroff-key", "#reading-enter");

          // Tapped again: short, its key message still in sight, and the pad with it.
          tap("#poweroff-key");
          settle();
          relayout();
          assertThat(visible("#poweroff-caution")).as(what + ", shut").isFalse();
          assertThat(text("#poweroff-key")).as(what + ", shut").contains("More");
          assertInSightAtTop(
              "#scroll-readings",
              what + ", shut",
              "#poweroff-key",
              "#reading-display",
              "#reading-enter");
        });

    // The pad takes a reading with the caution open: OL between the pair, kept as an ohms reading.
    tap("#poweroff-key");
    settle();
    int before = fx(() -> app.bench().readings().size());
    tap("#reading-key-ol");
    tap("#reading-enter");
    settle();
    assertThat(fx(() -> app.bench().readings().size())).isEqualTo(before + 1);
    assertThat(fx(() -> app.bench().readings().get(before).kind()))
        .isEqualTo(com.stagewise.circuit.Reading.Kind.OHMS);
    assertThat(visible("#poweroff-caution")).isTrue();
  }

  /** Runs the checks at 1024×600 and 1280×800 in each look: ordinary, each switch, both. */
  private void checkEveryLook(String pad) throws Exception {
    inFourLooks(
        "reach-" + pad,
        new int[][] {SMALL, LAPTOP},
        (size, where, look) -> {
          String name = look + ", pad on " + pad;
          savePicture(
              java.nio.file.Path.of(
                  "target",
                  "screens",
                  "reach",
                  where,
                  name.replaceAll("[^a-zA-Z]+", "-") + ".png"));
          assertInSightAtTop(name, where, pad.equals("ohms"));
          // The screen itself needs no scroll bar on any pad (DC, AC, ohms with the power off):
          // each column scrolls its own lower part.
          assertThat(fx(() -> screenOverflow("#scroll-readings")))
              .as("px of the readings screen below the window at %s, %s", where, name)
              .isLessThanOrEqualTo(0.5);
          if (look.equals("ordinary look") && size == SMALL) {
            assertFingerSized(name, where);
          }
        });
  }

  /**
   * Scrolls the readings screen to its top and fails unless the probe call, the point in words, the
   * lit pin on the drawing, the value field and Add reading all stand in the window (with the power
   * off: the caution's key message, the call, the pair, the value field and Add reading).
   */
  private void assertInSightAtTop(String look, String where, boolean ohms) throws Exception {
    List<String> queries = new ArrayList<>(List.of(ohms ? OHMS_ESSENTIALS : ESSENTIALS));
    if (!ohms) {
      int lit =
          fx(() -> robot.lookup("#package-drawing").queryAs(PackageDrawing.class).highlighted());
      assertThat(lit).as("the pin to probe is lit on the drawing").isPositive();
      queries.add("#package-drawing #pin-" + lit);
    }
    assertInSightAtTop(
        "#scroll-readings",
        "the readings screen at " + where + ", " + look,
        queries.toArray(String[]::new));
  }

  /**
   * Fails when a pin of the package drawing or a control of the readings screen gives a finger less
   * than {@link Reach#FINGER} px each way (about 48 px, 9 mm: common practice for touch targets).
   */
  private void assertFingerSized(String look, String where) throws Exception {
    List<String> small =
        fx(
            () -> {
              List<String> found = new ArrayList<>();
              for (Node pin : pins()) {
                if (!Reach.fingerSized(pin)) {
                  found.add("#" + pin.getId() + " is " + Reach.size(pin));
                }
              }
              return Reach.smallControls(robot.lookup("#screen-readings").query(), found);
            });
    WaitForAsyncUtils.waitForFxEvents();
    assertThat(fx(this::pins)).as("the dual-8's pins on the drawing").hasSize(8);
    assertThat(small)
        .as("touch targets under %s px on the readings screen at %s, %s", Reach.FINGER, where, look)
        .isEmpty();
  }

  /** The pins of the package drawing, each a touch target of its own (ids pin-1, pin-2, …). */
  private java.util.Set<Node> pins() {
    return robot
        .lookup("#package-drawing")
        .lookup((Node n) -> n.getId() != null && n.getId().matches("pin-\\d+"))
        .queryAll();
  }
}
