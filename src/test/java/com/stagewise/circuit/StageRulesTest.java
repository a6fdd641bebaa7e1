package com.stagewise.circuit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.template.Templates;
import java.util.ArrayList;
import java.util.List;
import java.util.function.UnaryOperator;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class StageRulesTest {

  /** An inverting amplifier, gain -4.7, on ±15 V rails (textbook stage, values of our own). */
  static Stage inverting() {
    return new Stage(
        "inverting amplifier",
        "",
        "GND",
        List.of(new Rail("VCC", 15, 0.05), new Rail("VEE", -15, 0.05)),
        List.of(new TestInput("IN", 1, 0.1, 1000)),
        List.of(
            Part.resistor("R1", 10e3, 0.01, "IN", "SUM"),
            Part.resistor("R2", 47e3, 0.01, "SUM", "OUT"),
            Part.capacitor("C1", 100e-12, 0.1, "SUM", "OUT")),
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

  private static List<StageRules.Problem> problems(UnaryOperator<Stage> change) {
    return StageRules.problems(change.apply(inverting()));
  }

  @Test
  void soundStage_hasNoProblems() {
    assertThat(StageRules.problems(inverting())).isEmpty();
  }

  @Nested
  class PlausibleRanges {
    @ParameterizedTest(name = "rail {0} V refused: {1}")
    @CsvSource({"1e308, true", "-1001, true", "1000, false", "-1000, false", "48, false"})
    void railVolts_withinOneKilovolt(double volts, boolean refused) {
      List<StageRules.Problem> found =
          problems(s -> s.withRails(List.of(new Rail("VCC", volts, 0.05), s.rails().get(1))));
      assertThat(found.stream().anyMatch(p -> p.field().equals("rails[0].volts")))
          .isEqualTo(refused);
      if (refused) {
        assertThat(found.get(0).message()).contains("plausible range -1 kV … 1 kV");
      }
    }

    @ParameterizedTest(name = "resistor {0} Ω refused: {1}")
    @CsvSource({
      "1e200, true",
      "2e12, true",
      "1e12, false",
      "0.001, false",
      "0.0005, true",
      // 0 Ω is a link (0R, DESIGN.md value strings).
      "0, false"
    })
    void resistor_oneMilliohmToOneTeraohm_orALink(double ohms, boolean refused) {
      List<StageRules.Problem> found = problems(s -> s.withPart("R2", p -> p.withValue(ohms)));
      assertThat(found.stream().anyMatch(p -> p.field().equals("parts[1].value")))
          .isEqualTo(refused);
      if (refused) {
        assertThat(found.get(0).message()).contains("R2").contains("1 mΩ … 1 TΩ");
      }
    }

    @ParameterizedTest(name = "capacitor {0} F refused: {1}")
    @CsvSource({"2, true", "1, false", "1e-13, false", "1e-15, true"})
    void capacitor_upToOneFarad(double farads, boolean refused) {
      List<StageRules.Problem> found = problems(s -> s.withPart("C1", p -> p.withValue(farads)));
      assertThat(found.stream().anyMatch(p -> p.field().equals("parts[2].value")))
          .isEqualTo(refused);
    }

    @ParameterizedTest(name = "input {0} V dc, {1} V ac at {2} Hz refused at {3}")
    @CsvSource({
      "-1e308, 0.1, 1000, inputs[0].dc",
      "1, 2000, 1000, inputs[0].ac",
      "1, 0.1, 0.001, inputs[0].hz",
      "1, 0.1, 2e8, inputs[0].hz",
      "1, 0.1, 0.01, ''",
      "1, 0.1, 1e8, ''"
    })
    void input_levelAndFrequencyWithinRange(double dc, double ac, double hz, String field) {
      List<StageRules.Problem> found =
          problems(s -> s.withInputs(List.of(new TestInput("IN", dc, ac, hz))));
      if (field.isEmpty()) {
        assertThat(found).isEmpty();
      } else {
        assertThat(found).extracting(StageRules.Problem::field).contains(field);
      }
    }

    @Test
    void tolerance_ofNinetyNinePercentAndMore_isRefused() {
      List<StageRules.Problem> found =
          problems(s -> s.withPart("R1", p -> new Part("R1", p.kind(), 1e4, 0.995, "IN", "SUM")));
      assertThat(found).extracting(StageRules.Problem::field).containsExactly("parts[0].tolerance");
    }

    @Test
    void hugeValue_isShownShortly_notWithHundredsOfDigits() {
      String message = problems(s -> s.withPart("R2", p -> p.withValue(1e200))).get(0).message();
      assertThat(message).contains("1.000e+200 Ω").doesNotContainPattern("[0-9]{21}");
    }
  }

  @Nested
  class Sizes {
    @Test
    void tooManyParts_isRefusedBeforeAnyOtherCheck() {
      List<Part> parts = new ArrayList<>(inverting().parts());
      for (int i = 0; i < Limits.MAX_PARTS; i++) {
        parts.add(Part.resistor("RX" + i, 1e3, 0.01, "OUT", "GND"));
      }
      List<StageRules.Problem> found = problems(s -> s.withParts(parts));
      assertThat(found).hasSize(1);
      assertThat(found.get(0).field()).isEqualTo("parts");
      assertThat(found.get(0).message())
          .contains((Limits.MAX_PARTS + 3) + " parts")
          .contains("at most " + Limits.MAX_PARTS);
    }

    @Test
    void thirteenSections_areMoreThanThreeQuadPackages() {
      List<Amplifier> amps = new ArrayList<>();
      for (int i = 0; i < 13; i++) {
        amps.add(
            new Amplifier(
                "U" + i + "A",
                "U" + i,
                PackageType.SINGLE_8,
                "A",
                DeviceClass.CLASSIC_BIPOLAR,
                "GND",
                "SUM",
                "OUT",
                "VCC",
                "VEE"));
      }
      List<StageRules.Problem> found = problems(s -> s.withAmplifiers(amps));
      assertThat(found).extracting(StageRules.Problem::field).containsExactly("amplifiers");
      assertThat(found.get(0).message()).contains("13 op-amp sections").contains("at most 12");
    }

    @Test
    void longNetName_isRefusedWithItsLength() {
      String net = "N".repeat(Limits.MAX_NAME_LENGTH + 1);
      List<StageRules.Problem> found =
          problems(s -> s.withPart("R2", p -> p.withNetRenamed("OUT", net)));
      assertThat(found)
          .extracting(StageRules.Problem::message)
          .anyMatch(m -> m.contains((Limits.MAX_NAME_LENGTH + 1) + " characters long"));
    }
  }

  @Nested
  class SingleConnection {
    @Test
    void sectionInputOnANetNothingElseTouches_isRefusedForAStageBuiltInCode() {
      // Before, only the stage sheet reader knew this rule: a stage from a template or the app
      // with a misspelt input net passed.
      Stage stage = inverting().withAmplifier("U1A", a -> rewire(a, "SUMM"));
      List<StageRules.Problem> found = StageRules.problems(stage);
      assertThat(found).extracting(StageRules.Problem::field).contains("amplifiers[0].inMinus");
      assertThat(found.get(0).message())
          .contains("U1A inverting input is on net SUMM, which no part, other pin, rail or input");
    }

    @Test
    void templateStage_withAMisspeltSupplyNet_isRefused() {
      Stage stage = Templates.all().get(0).build();
      Stage broken =
          stage.withAmplifiers(
              stage.amplifiers().stream()
                  .map(
                      a ->
                          new Amplifier(
                              a.ref(),
                              a.packageRef(),
                              a.packageType(),
                              a.section(),
                              a.deviceClass(),
                              a.inPlus(),
                              a.inMinus(),
                              a.out(),
                              "VCCX",
                              a.vMinus()))
                  .toList());
      assertThatThrownBy(() -> StageRules.requireSound(broken, "template"))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("template: amplifiers[0].vPlus:")
          .hasMessageContaining("positive supply pin is on net VCCX");
    }

    private static Amplifier rewire(Amplifier a, String inMinus) {
      return new Amplifier(
          a.ref(),
          a.packageRef(),
          a.packageType(),
          a.section(),
          a.deviceClass(),
          a.inPlus(),
          inMinus,
          a.out(),
          a.vPlus(),
          a.vMinus());
    }
  }
}
