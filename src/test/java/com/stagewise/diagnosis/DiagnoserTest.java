package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Facts of the trade as check values (common practice at the repair bench), on an inverting stage:
 * IN 1 V through R1 = 10k to SUM, R2 = 47k from SUM to OUT, in+ at ground, ±15 V, classic bipolar
 * (headroom 1.5 V), dual-8 package U1 section A (out 1, in- 2, in+ 3, v- 4, v+ 8).
 */
class DiagnoserTest {
  static Stage inverting() {
    return new Stage(
        "test inverting stage",
        "",
        "GND",
        List.of(new Rail("VCC", 15, 0.05), new Rail("VEE", -15, 0.05)),
        List.of(TestInput.dc("IN", 1.0)),
        List.of(
            Part.resistor("R1", 10e3, 0.01, "IN", "SUM"),
            Part.resistor("R2", 47e3, 0.01, "SUM", "OUT")),
        List.of(
            new Amplifier(
                "U1A",
                "U1",
                PackageType.DUAL_8,
                "A",
                DeviceClass.CLASSIC_BIPOLAR,
                "GND",
                "SUM",
                "OUT",
                "VCC",
                "VEE")));
  }

  static ReadingSet readings(Object... pairs) {
    List<Reading> list = new ArrayList<>();
    for (int i = 0; i < pairs.length; i += 2) {
      list.add(Reading.dc((String) pairs[i], ((Number) pairs[i + 1]).doubleValue()));
    }
    return new ReadingSet(MeterSpec.DEFAULT, list);
  }

  private final Diagnoser diagnoser = Diagnoser.of(inverting());

  @Test
  void workingStage_isCalledHealthy() {
    // A working inverting stage: OUT = -R2/R1 · 1 V = -4.70 V, inputs at 0 V (closed form).
    Diagnosis d =
        diagnoser.diagnose(
            readings("U1.8", 15.02, "U1.4", -14.97, "U1.1", -4.70, "U1.2", 0.0, "U1.3", 0.0));
    assertThat(d.verdict()).isEqualTo(Verdict.HEALTHY);
    assertThat(d.suspects().get(0).fault()).isEqualTo("healthy");
  }

  @Test
  void openFeedbackResistor_drivesOutputToALimit() {
    // Common practice: an open feedback resistor drives the output to a limit; the inverting input
    // then follows IN through R1 (no current flows), so the inputs differ by about 1 V.
    Diagnosis d =
        diagnoser.diagnose(
            readings("U1.8", 15.0, "U1.4", -15.0, "U1.1", -13.45, "U1.2", 1.0, "U1.3", 0.0));
    assertThat(d.verdict()).isEqualTo(Verdict.FAULT);
    assertThat(d.suspects().get(0).group()).contains("R2:open");
    assertThat(d.observations()).anySatisfy(o -> assertThat(o.text()).contains("lower limit"));
    assertThat(d.observations()).anySatisfy(o -> assertThat(o.text()).contains("feedback lost"));
  }

  @Test
  void shortedFeedbackResistor_givesZeroAtOutput() {
    // Common practice: a shorted feedback resistor of an inverting stage gives about 0 V out.
    Diagnosis d =
        diagnoser.diagnose(readings("U1.8", 15.0, "U1.4", -15.0, "U1.1", 0.0, "U1.2", 0.0));
    assertThat(d.suspects().get(0).group()).contains("R2:short");
  }

  @Test
  void missingRail_clipsTheOutput() {
    // Common practice: with v- missing the output cannot swing below about -1.5 V of ground here.
    Diagnosis d =
        diagnoser.diagnose(readings("U1.8", 15.0, "U1.4", 0.0, "U1.1", -1.5, "U1.2", 0.62));
    assertThat(d.suspects().get(0).group()).contains("VEE:missing");
    assertThat(d.observations()).anySatisfy(o -> assertThat(o.text()).contains("missing"));
  }

  @Test
  void misreadValue_doesNotEliminateTheTruth() {
    // One mistyped value (4.70 for -4.70 at OUT) on an otherwise healthy set.
    Diagnosis d =
        diagnoser.diagnose(
            readings(
                "U1.8", 15.0, "U1.4", -15.0, "U1.1", 4.70, "U1.2", 0.0, "U1.3", 0.0, "SUM", 0.0));
    assertThat(d.suspects().stream().limit(3).map(Suspect::fault)).contains("healthy");
  }

  @Test
  void inputOff_isDiagnosedWithTheMeasuredLevel() {
    Diagnosis d =
        diagnoser.diagnose(
            readings("IN", 0.5, "U1.8", 15.0, "U1.4", -15.0, "U1.1", -2.35, "U1.2", 0.0));
    assertThat(d.verdict()).isEqualTo(Verdict.HEALTHY);
    assertThat(d.notes()).anySatisfy(n -> assertThat(n).contains("upstream"));
  }

  @Test
  void probabilities_sumToOne_andProbesAreSorted() {
    Diagnosis d = diagnoser.diagnose(readings("U1.1", -13.45));
    assertThat(d.suspects().stream().mapToDouble(Suspect::probability).sum())
        .isCloseTo(1.0, org.assertj.core.data.Offset.offset(1e-9));
    for (int i = 1; i < d.nextProbes().size(); i++) {
      assertThat(d.nextProbes().get(i).bits())
          .isLessThanOrEqualTo(d.nextProbes().get(i - 1).bits());
    }
    assertThat(d.nextProbes()).isNotEmpty();
    assertThat(d.nextProbes().get(0).bits()).isGreaterThan(0.1);
  }

  @Test
  void badReadings_nameWhatToFix() {
    assertThatThrownBy(() -> diagnoser.diagnose(readings("U1.9", 1.0)))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("has no pin 9 (expected 1 to 8)");
    assertThatThrownBy(() -> diagnoser.diagnose(readings("U1.5", 1.0)))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("not used");
    assertThatThrownBy(() -> diagnoser.diagnose(readings("NOPE", 1.0)))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("NOPE");
    assertThatThrownBy(() -> diagnoser.diagnose(readings("OUT", 400.0)))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("beyond every rail");
  }

  @Test
  void outputBridgedToPositiveRail_readsTheRailItself() {
    // Common practice: a solder bridge from an output to v+ reads the rail itself, not the rail
    // less the headroom. Section B of a dual-8 has its output on pin 7, beside v+ on pin 8.
    Stage follower =
        new Stage(
            "test follower, section B",
            "",
            "GND",
            List.of(new Rail("VCC", 15, 0.05), new Rail("VEE", -15, 0.05)),
            List.of(TestInput.dc("IN", 2.0)),
            List.of(Part.resistor("RL", 10e3, 0.01, "OUT", "GND")),
            List.of(
                new Amplifier(
                    "U1B",
                    "U1",
                    PackageType.DUAL_8,
                    "B",
                    DeviceClass.CLASSIC_BIPOLAR,
                    "IN",
                    "OUT",
                    "OUT",
                    "VCC",
                    "VEE")));
    Diagnosis d =
        Diagnoser.of(follower)
            .diagnose(readings("U1.8", 15.0, "U1.4", -15.0, "U1.7", 15.0, "U1.5", 2.0));
    assertThat(d.suspects().get(0).fault()).isEqualTo("U1.7-8:bridge");
    assertThat(d.observations()).anySatisfy(o -> assertThat(o.text()).contains("v+ rail itself"));
    // Stuck high would sit at least 1 V below the rail (classic-bipolar headroom 1.0–2.5 V), so
    // the bridge leads although a stuck output is ten times likelier beforehand.
  }
}
