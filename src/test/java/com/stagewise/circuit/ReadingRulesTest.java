package com.stagewise.circuit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ReadingRulesTest {
  private final Stage stage = StageRulesTest.inverting();

  private List<StageRules.Problem> problems(MeterSpec meter, Reading... readings) {
    return ReadingRules.problems(stage, new ReadingSet(meter, List.of(readings)));
  }

  private List<StageRules.Problem> problems(Reading... readings) {
    return problems(MeterSpec.DEFAULT, readings);
  }

  @Test
  void soundReadings_haveNoProblems() {
    assertThat(
            problems(Reading.dc("U1.1", -4.7), Reading.dc("SUM", 0), Reading.ac("OUT", 0.47, 1000)))
        .isEmpty();
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(
      delimiter = '|',
      value = {
        // DESIGN.md pinouts: a dual-8 has pins 1 to 8; pin 5 is section B's in+, unused here.
        "U1.9 | U1 is a dual-8 package, which has no pin 9 (expected 1 to 8)",
        "U1.5 | pin 5 of U1 is not used by any section of the stage (expected one of pins [1, 2, 3, 4, 8], or a net)",
        "U2.1 | package U2 is not on the stage",
        "U1.x | \"x\" is not a pin number",
        "NOPE | \"NOPE\" is not a net of the stage (expected one of GND, VCC, VEE, IN, SUM, OUT"
      })
  void unknownTestPoint_oneMessageNamingWhatIsThere(String at, String message) {
    List<StageRules.Problem> found = problems(Reading.dc(at, 1));
    assertThat(found).hasSize(1);
    assertThat(found.get(0).field()).isEqualTo("readings[0].at");
    assertThat(found.get(0).message()).contains(message);
  }

  @Test
  void readingFarBeyondTheRails_isRefused() {
    // Limit: 2 × 15 V + 1 V = 31 V (Limits.READING_RAIL_FACTOR, READING_MARGIN_VOLTS).
    assertThat(problems(Reading.dc("OUT", 31))).isEmpty();
    List<StageRules.Problem> found = problems(Reading.dc("OUT", -1e308));
    assertThat(found).extracting(StageRules.Problem::field).containsExactly("readings[0].dc");
    assertThat(found.get(0).message())
        .contains("-1.000e+308 V")
        .contains("far beyond every rail")
        .contains("±31 V");
    // AC: 4 × 15 V + 1 V = 61 V (a peak-to-peak swing between the rails spans 60 V).
    assertThat(problems(Reading.ac("OUT", 61, 1000))).isEmpty();
    assertThat(problems(Reading.ac("OUT", 62, 1000)))
        .extracting(StageRules.Problem::field)
        .containsExactly("readings[0].ac");
  }

  @Test
  void acReading_atAnotherFrequency_orWithoutAnAcInput_isRefused() {
    assertThat(problems(Reading.ac("OUT", 0.4, 50)).get(0).message())
        .contains("is at 50 Hz but the stage's test input is at 1 kHz");
    assertThat(problems(Reading.ac("OUT", 0.4, 1e12)).get(0).message())
        .contains("plausible range 10 mHz … 100 MHz");
    Stage dcOnly = stage.withInputs(List.of(TestInput.dc("IN", 1)));
    assertThat(
            ReadingRules.problems(
                    dcOnly,
                    new ReadingSet(MeterSpec.DEFAULT, List.of(Reading.ac("OUT", 0.4, 1000))))
                .get(0)
                .message())
        .contains("no AC test input");
  }

  @Test
  void absurdMeter_isRefusedField_byField() {
    List<StageRules.Problem> found = problems(new MeterSpec(500, 5000, 10), Reading.dc("OUT", 1));
    assertThat(found)
        .extracting(StageRules.Problem::field)
        .containsExactly("meter.percent", "meter.counts", "meter.displayCounts");
  }

  @Test
  void absurdUncertainty_isRefused() {
    Reading r = new Reading("OUT", Reading.Kind.DC, 1, 0, OptionalDouble.of(1e300));
    assertThat(problems(r))
        .extracting(StageRules.Problem::field)
        .containsExactly("readings[0].uncertainty");
  }

  @Test
  void tooManyReadings_isRefusedSayingHowMany() {
    Reading[] many = new Reading[Limits.MAX_READINGS + 1];
    java.util.Arrays.fill(many, Reading.dc("OUT", 1));
    List<StageRules.Problem> found = problems(many);
    assertThat(found).hasSize(1);
    assertThat(found.get(0).message())
        .contains((Limits.MAX_READINGS + 1) + " readings")
        .contains("at most " + Limits.MAX_READINGS);
  }

  @Test
  void requireSound_namesSourceFieldAndProblem_once() {
    assertThatThrownBy(
            () ->
                ReadingRules.requireSound(
                    stage,
                    new ReadingSet(MeterSpec.DEFAULT, List.of(Reading.dc("U1.9", 1))),
                    "bench.readings.json"))
        .isInstanceOf(InvalidInputException.class)
        .hasMessage(
            "bench.readings.json: readings[0].at: U1 is a dual-8 package, which has no pin 9"
                + " (expected 1 to 8)");
  }

  @org.junit.jupiter.api.Nested
  class PowerOff {
    // The readings contract, version 2 (DESIGN.md): ohms between two points (nets, package pins,
    // part leads PART.N), "OL" for the meter's over-range.

    @Test
    void ohmsBetweenLeadsPinsAndNets_andVoltsAtALead_areSound() {
      assertThat(
              problems(
                  Reading.ohms("R2.1", "R2.2", 46800),
                  Reading.ohms("U1.2", "GND", Double.POSITIVE_INFINITY),
                  Reading.ohms("SUM", "OUT", 1e12),
                  Reading.dc("R2.2", -4.7)))
          .isEmpty();
    }

    @Test
    void leadThePartLacks_namesTheLeadsItHas() {
      List<StageRules.Problem> found = problems(Reading.ohms("R2.3", "SUM", 1));
      assertThat(found).extracting(StageRules.Problem::field).containsExactly("readings[0].at");
      assertThat(found.get(0).message())
          .isEqualTo("\"3\" is not a lead of R2 (expected R2.1 or R2.2)");
    }

    @Test
    void secondPointUnknown_namesTheToField() {
      List<StageRules.Problem> found = problems(Reading.ohms("SUM", "X9", 100));
      assertThat(found).extracting(StageRules.Problem::field).containsExactly("readings[0].to");
      assertThat(found.get(0).message()).contains("\"X9\" is not a net of the stage");
    }

    @Test
    void ohmsBeyondOneTeraohm_isRefused_butOverRangeIsNot() {
      // Limits.READING_OHMS: 0 Ω … 1 TΩ; beyond it a meter shows OL.
      List<StageRules.Problem> found = problems(Reading.ohms("SUM", "OUT", 2e12));
      assertThat(found).extracting(StageRules.Problem::field).containsExactly("readings[0].ohms");
      assertThat(found.get(0).message())
          .contains("2 TΩ")
          .contains("beyond any meter's range")
          .contains("\"OL\"");
      assertThat(problems(Reading.ohms("SUM", "OUT", Double.POSITIVE_INFINITY))).isEmpty();
    }

    @Test
    void absurdOhmsSpecAndUncertainty_areRefusedFieldByField() {
      MeterSpec meter = new MeterSpec(0.5, 2, 6000, new OhmsSpec(50, 5000));
      Reading r = new Reading("SUM", Reading.Kind.OHMS, 100, 0, OptionalDouble.of(1e300), "OUT");
      assertThat(problems(meter, r))
          .extracting(StageRules.Problem::field)
          .containsExactly("meter.ohms.percent", "meter.ohms.counts", "readings[0].uncertainty");
    }
  }
}
