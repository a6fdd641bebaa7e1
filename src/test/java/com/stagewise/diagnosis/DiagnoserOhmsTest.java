package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.interchange.ReadingsSheet;
import com.stagewise.interchange.StageSheet;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Power-off readings in the diagnosis, on the demo line driver (inverting amplifier: R14 10 kΩ from
 * IN to SUM, R15 47 kΩ feedback from SUM to OUT).
 *
 * <p>Outside facts: with the feedback resistor open, or the input resistor shorted, the textbook
 * inverting amplifier has no working loop gain and its output clamps near the negative rail while
 * the inverting input follows the input, so the two faults put the same volts on every pin. With
 * the power off and the op-amp drawing nothing, SUM to OUT reads R15 alone (series and parallel
 * resistors, any circuits textbook): 47 kΩ healthy or with R14 shorted, OL with R15 open; IN to SUM
 * reads R14 alone: about 0 Ω with R14 shorted.
 */
class DiagnoserOhmsTest {
  static final Stage STAGE =
      StageSheet.read(Path.of("data/stages/larkspur-sm8-line-driver.stage.json"));
  static final ReadingSet VOLTS =
      ReadingsSheet.read(
          Path.of("data/readings/larkspur-sm8-line-driver.no-feedback.readings.json"), STAGE);

  private static ReadingSet plus(ReadingSet set, Reading more) {
    List<Reading> all = new ArrayList<>(set.readings());
    all.add(more);
    return new ReadingSet(set.meter(), all);
  }

  @Test
  void voltsAlone_cannotSplitOpenFeedbackFromShortedInput_andAnOhmsCheckIsProposedFirst() {
    Diagnosis d = Diagnoser.of(STAGE).diagnose(VOLTS);
    Suspect first = d.suspects().get(0);
    assertThat(first.group()).contains("R15:open", "R14:short");
    ProbeAdvice probe = d.nextProbes().get(0);
    assertThat(probe.kind()).isEqualTo(Reading.Kind.OHMS);
    assertThat(List.of(probe.at(), probe.to())).containsAnyOf("SUM", "IN");
    assertThat(probe.to()).isNotEmpty();
    assertThat(probe.why()).contains("unplug", "discharge");
    // It beats every volts probe.
    double bestVolts =
        d.nextProbes().stream()
            .filter(p -> p.kind() != Reading.Kind.OHMS)
            .mapToDouble(ProbeAdvice::bits)
            .max()
            .orElse(0);
    assertThat(probe.bits()).isGreaterThan(bestVolts);
  }

  @Test
  void demoFileWithTheOhmsReading_leavesOneSuspect() {
    ReadingSet set =
        ReadingsSheet.read(
            Path.of("data/readings/larkspur-sm8-line-driver.no-feedback-ohms.readings.json"),
            STAGE);
    Diagnosis d = Diagnoser.of(STAGE).diagnose(set);
    assertThat(d.suspects().get(0).fault()).isEqualTo("R15:open");
    assertThat(d.suspects().get(0).group()).containsExactly("R15:open");
    assertThat(d.suspects().get(0).probability()).isGreaterThan(0.95);
  }

  @Test
  void nearZeroOhmsAcrossTheInputResistor_pointsToItsShort() {
    Diagnosis d = Diagnoser.of(STAGE).diagnose(plus(VOLTS, Reading.ohms("R14.1", "R14.2", 0.4)));
    assertThat(d.suspects().get(0).fault()).isEqualTo("R14:short");
    assertThat(d.suspects().get(0).group()).containsExactly("R14:short");
  }

  @Test
  void ohmsAloneOnAHealthyNetwork_fitHealthy() {
    // Power-off readings only, as a technician takes them on a mains unit before powering it:
    // 10.02 kΩ across R14 and 46.9 kΩ across R15 are in tolerance.
    ReadingSet set =
        new ReadingSet(
            MeterSpec.DEFAULT,
            List.of(Reading.ohms("IN", "SUM", 10_020), Reading.ohms("SUM", "OUT", 46_900)));
    Diagnosis d = Diagnoser.of(STAGE).diagnose(set);
    List<String> likely =
        d.suspects().stream().filter(s -> s.probability() > 0.05).map(Suspect::fault).toList();
    assertThat(likely).doesNotContain("R15:open", "R14:short", "R14:open", "R15:short");
  }

  @Test
  void ohmsReadingToAPointTheStageLacks_isRefused() {
    ReadingSet set = new ReadingSet(MeterSpec.DEFAULT, List.of(Reading.ohms("SUM", "X9", 100)));
    assertThatThrownBy(() -> Diagnoser.of(STAGE).diagnose(set))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("X9");
  }
}
