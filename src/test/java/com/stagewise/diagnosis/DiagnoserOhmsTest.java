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

  private static String onNet(String point) {
    return STAGE.pinNets().getOrDefault(point, point);
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
  void mainsPoweredUnit_getsThePowerOffCheckFirst_whenItTellsTheLeadersApart() {
    // Only the output read, at its lower limit: an open feedback resistor, a stuck output and a
    // lifted output pin all put it there (textbook inverting amplifier). With the power off an
    // open R15 leaves SUM and OUT unconnected (OL), while with R15 whole the meter reads R15 in
    // parallel with the rest of the network (DESIGN.md power-off model): that check splits them.
    ReadingSet low = new ReadingSet(MeterSpec.DEFAULT, List.of(Reading.dc("U3.1", -13.46)));
    Diagnosis plain = Diagnoser.of(STAGE).diagnose(low);
    Diagnosis mains = Diagnoser.of(STAGE).mainsPowered(true).diagnose(low);
    assertThat(plain.nextProbes().get(0).kind()).isEqualTo(Reading.Kind.DC);
    ProbeAdvice first = mains.nextProbes().get(0);
    assertThat(first.kind()).isEqualTo(Reading.Kind.OHMS);
    // Across R15: its two nets by name, or the two neighbouring pins on them (U3 pin 1 on OUT, pin
    // 2 on SUM), which also read OL when either joint is open.
    assertThat(java.util.Set.of(onNet(first.at()), onNet(first.to())))
        .containsExactlyInAnyOrder("SUM", "OUT");
    assertThat(first.why()).contains("mains-powered", "unplug", "discharge", "OL", "across R15");
    // A powered probe promised more bits; the rest stay sorted by bits, best first.
    assertThat(first.bits()).isLessThan(plain.nextProbes().get(0).bits());
    List<ProbeAdvice> rest = mains.nextProbes().subList(1, mains.nextProbes().size());
    for (int i = 1; i < rest.size(); i++) {
      assertThat(rest.get(i).bits()).isLessThanOrEqualTo(rest.get(i - 1).bits());
    }
    // The suspects themselves do not depend on how the unit is powered.
    assertThat(mains.suspects()).isEqualTo(plain.suspects());
  }

  @Test
  void mainsPoweredUnit_keepsVoltsFirst_whenNoOhmsCheckTellsTheLeadersApart() {
    // The output near 0 V points at the negative rail (missing or low) or its pin: the resistor
    // network reads the same with the power off whatever the rail did, so volts stay first.
    ReadingSet rail = new ReadingSet(MeterSpec.DEFAULT, List.of(Reading.dc("OUT", 0.5)));
    Diagnosis mains = Diagnoser.of(STAGE).mainsPowered(true).diagnose(rail);
    assertThat(mains.suspects().get(0).fault()).isEqualTo("-15V:missing");
    assertThat(mains.nextProbes().get(0).kind()).isEqualTo(Reading.Kind.DC);
    assertThat(mains.nextProbes()).noneMatch(p -> p.why().contains("mains-powered"));
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
  void confirmingCheck_saysWhatTheOhmmeterReadsInCircuit_goodAndFaulty() {
    // With the power off the input IN floats (DESIGN.md power-off model), so nothing sits in
    // parallel with R15 or R14: in circuit each reads its own value, 47 kΩ ±1 % and 10 kΩ ±1 %
    // (series–parallel rules, any circuits textbook); open reads OL, shorted about 0 Ω.
    ReadingSet open =
        ReadingsSheet.read(
            Path.of("data/readings/larkspur-sm8-line-driver.no-feedback-ohms.readings.json"),
            STAGE);
    assertThat(Diagnoser.of(STAGE).diagnose(open).confirmingCheck())
        .contains("in circuit", "R15 reads 47 kΩ (46.5 kΩ to 47.5 kΩ) when good", "OL with this");
    Diagnosis shorted =
        Diagnoser.of(STAGE).diagnose(plus(VOLTS, Reading.ohms("R14.1", "R14.2", 0.4)));
    assertThat(shorted.confirmingCheck())
        .contains("R14 reads 10 kΩ (9.9 kΩ to 10.1 kΩ) when good", "about 0 Ω with this fault");
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

  @Test
  void ohmsProbeWhy_speaksInWords_neverFaultIds() {
    // Fault ids stay in files and --json (DESIGN.md); a why says "if R15 is open".
    Diagnosis d = Diagnoser.of(STAGE).diagnose(VOLTS);
    ProbeAdvice probe = d.nextProbes().get(0);
    assertThat(probe.kind()).isEqualTo(Reading.Kind.OHMS);
    assertThat(probe.why())
        .containsAnyOf("if R15 is open", "if R14 is shorted")
        .doesNotContain("R15:open", "R14:short", ":lifted", ":stuck");
    assertThat(probe.why()).doesNotContainPattern("[A-Z]+\\d*[A-Z]?:[a-z-]+");
  }
}
