package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.solver.OhmsPrediction;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * Suspects that read the same everywhere, and the ohms check across two neighbouring pins, on the
 * demo line driver (inverting amplifier: R14 10 kΩ from IN to SUM, R15 47 kΩ feedback from SUM to
 * OUT; U3 pin 1 is the output on OUT, pin 2 the inverting input on SUM, pin 3 the non-inverting
 * input on GND).
 *
 * <p>Outside facts: two nets joined by 0 Ω are one node whichever part joins them (Kirchhoff's
 * laws, any circuits textbook), so a solder bridge between pins 1 and 2 and a shorted R15 are the
 * same circuit, powered or not. With R15 shorted the textbook inverting amplifier becomes a
 * follower of its grounded non-inverting input: output and inverting input near 0 V, no AC at the
 * output. An open R14 puts the same volts there (no input current, the loop still closed), but an
 * ohmmeter from IN to SUM reads OL instead of R14 (series and parallel resistors, any circuits
 * textbook): those two do not read the same everywhere. An open joint breaks the path through its
 * leg, so an ohmmeter across two legs reads OL when either joint is open (common practice).
 */
class SameReadingsTest {
  private static final ReadingSet OUTPUT_AT_ZERO =
      new ReadingSet(
          MeterSpec.DEFAULT,
          List.of(
              Reading.dc("IN", 1.0),
              Reading.dc("U3.1", 0.001),
              Reading.dc("U3.2", 0.0),
              Reading.ac("OUT", 0.0, 1000)));

  private static Suspect suspect(Diagnosis d, String fault) {
    return d.suspects().stream().filter(s -> s.fault().equals(fault)).findFirst().orElseThrow();
  }

  @Test
  void bridgeAcrossTheFeedbackPins_andShortedFeedbackResistor_readTheSameAndSaySo() {
    Diagnosis d = Diagnoser.of(DiagnoserOhmsTest.STAGE).diagnose(OUTPUT_AT_ZERO);
    Suspect shorted = suspect(d, "R15:short");
    Suspect bridge = suspect(d, "U3.1-2:bridge");
    assertThat(shorted.group()).contains("U3.1-2:bridge");
    assertThat(shorted.why())
        .contains(
            "Same readings as solder bridge U3 pins 1–2 at every point, powered or not;"
                + " only a look or lifting a leg splits them.");
    assertThat(bridge.why()).contains("Same readings as R15 shorted");
  }

  @Test
  void openInputResistor_putsTheSameVoltsButNotTheSameOhms_andIsNotNamedAlike() {
    Diagnosis d = Diagnoser.of(DiagnoserOhmsTest.STAGE).diagnose(OUTPUT_AT_ZERO);
    Suspect open = suspect(d, "R14:open");
    // The readings cannot tell it from R15 shorted yet (one group) …
    assertThat(open.group()).contains("R15:short");
    // … but an ohms check from IN to SUM can, so it is not said to read the same.
    assertThat(open.why()).doesNotContain("Same readings as R15");
    assertThat(suspect(d, "R15:short").why()).doesNotContain("R14 open");
    // R14 open comes first (an open is likelier than a short or a bridge): its group holds the
    // two that read alike, but nothing reads the same as R14 open everywhere.
    assertThat(d.suspects().get(0).fault()).isEqualTo("R14:open");
    assertThat(open.group()).contains("U3.1-2:bridge");
    assertThat(Diagnoser.of(DiagnoserOhmsTest.STAGE).sameAsFirst(OUTPUT_AT_ZERO))
        .containsExactly("R14:open");
  }

  @Test
  void neighbouringPins_areOfferedAsOneOhmsCheck_OlWhenEitherJointIsOpen() {
    OhmsChecks checks = new OhmsChecks(DiagnoserOhmsTest.STAGE);
    List<Set<String>> pairs = checks.pairs().stream().map(p -> Set.of(p[0], p[1])).toList();
    assertThat(pairs).contains(Set.of("U3.1", "U3.2"), Set.of("U3.2", "U3.3"));
    // Pins 7 and 8: pin 7 is not used by the one section, so there is no pair to check.
    assertThat(pairs).doesNotContain(Set.of("U3.7", "U3.8"));
    OhmsPrediction healthy = checks.predict(Fault.HEALTHY, Double.NaN, "U3.1", "U3.2");
    assertThat(healthy.connected()).isTrue();
    // R15 alone between OUT and SUM with the power off (R14 leads to IN, which floats): 47 kΩ.
    assertThat(healthy.nominal())
        .isCloseTo(47e3, org.assertj.core.data.Percentage.withPercentage(1));
    Fault liftedOut = Fault.lifted("U3", 1);
    Fault liftedIn = Fault.lifted("U3", 2);
    assertThat(checks.predict(liftedOut, Double.NaN, "U3.1", "U3.2").connected()).isFalse();
    assertThat(checks.predict(liftedIn, Double.NaN, "U3.1", "U3.2").connected()).isFalse();
    // Read on the nets instead, a lifted pin is not seen: the nets still meet through R15.
    assertThat(checks.predict(liftedOut, Double.NaN, "OUT", "SUM").connected()).isTrue();
  }
}
