package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.Stage;
import com.stagewise.interchange.StageSheet;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/**
 * Regression: the ohms planner kept a leaky junction's and a misset trimmer's power-off network
 * under the fault's id alone, so the value asked first answered for every later one (a diagnoser
 * that had seen other readings then planned other ohms checks than a fresh one). Each value must
 * read as itself, whatever was asked before.
 *
 * <p>Outside facts (Ohm's law; series and parallel resistors, any circuits textbook): with the
 * power off, a resistance that is the only path between two points reads as itself; a rheostat
 * (wiper tied to one end) reads the share of its track between the other end and the wiper.
 */
class OhmsChecksPerValueTest {
  /** Meter-free comparison: the solver's figures, to a milliohm. */
  private static final double OHMS = 1e-3;

  private static Fault fault(Stage stage, String id) {
    return FaultCatalogue.of(stage).faults().stream()
        .filter(f -> f.id().equals(id))
        .findFirst()
        .orElseThrow();
  }

  @Test
  void leakyLed_readsEachLeakAsked_notTheFirstOne() {
    // LED2 alone joins LED_A to GND (R13 goes to the op-amp's output, which draws nothing with the
    // power off): a leak of R there reads R.
    Stage stage = StageSheet.read(Path.of("data/stages/brannock-tc4-over-temp.stage.json"));
    OhmsChecks checks = new OhmsChecks(stage);
    Fault leaky = fault(stage, "LED2:leaky");
    assertThat(checks.predict(leaky, 1e6, "LED_A", "GND").nominal()).isCloseTo(1e6, within(OHMS));
    assertThat(checks.predict(leaky, 1e7, "LED_A", "GND").nominal()).isCloseTo(1e7, within(OHMS));
    assertThat(checks.predictAll(leaky, 3e5)).isNotSameAs(checks.predictAll(leaky, 1e6));
  }

  @Test
  void missetTrimmer_readsEachPositionAsked_notTheFirstOne() {
    // RV1 (10 kΩ) runs from FOOT to GND with its wiper on GND: FOOT to GND reads the track between
    // FOOT and the wiper, p or 1 - p of 10 kΩ by which end the position counts from (R31 leads on
    // to the op-amp's output and input, which draw nothing with the power off).
    Stage stage = StageSheet.read(Path.of("data/stages/ferrowick-wb2-span-trim.stage.json"));
    OhmsChecks checks = new OhmsChecks(stage);
    Fault misset = fault(stage, "RV1:misset");
    double at20 = checks.predict(misset, 0.2, "FOOT", "GND").nominal();
    double at70 = checks.predict(misset, 0.7, "FOOT", "GND").nominal();
    assertThat(at20)
        .satisfiesAnyOf(
            x -> assertThat(x).isCloseTo(2_000, within(OHMS)),
            x -> assertThat(x).isCloseTo(8_000, within(OHMS)));
    // The same end counts both positions: 0.7 of the track where 0.2 read 0.2, else 0.3.
    assertThat(at70).isCloseTo(at20 < 5_000 ? 7_000 : 3_000, within(OHMS));
  }
}
