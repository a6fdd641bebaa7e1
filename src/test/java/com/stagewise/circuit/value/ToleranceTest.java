package com.stagewise.circuit.value;

import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertEquals;

import com.stagewise.circuit.InvalidInputException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.NullAndEmptySource;
import org.junit.jupiter.params.provider.ValueSource;

class ToleranceTest {

  // A percentage is a hundredth (ISO 80000-1); the contract accepts "1%" or a fraction 0.01.
  @ParameterizedTest
  @CsvSource({
    "1%, 0.01",
    "0.5 %, 0.005",
    "0.01, 0.01",
    "±5%, 0.05",
    "+/-10 %, 0.1",
    "+-2%, 0.02",
    "20%, 0.2",
    "0, 0",
    "0%, 0",
    "0.1%, 0.001",
    "0.25%, 0.0025",
    "99.9%, 0.999",
    ".5%, 0.005",
    "  5%  , 0.05"
  })
  void parse_percentOrFraction(String text, double expected) {
    assertEquals(expected, Tolerance.parse(text));
  }

  @ParameterizedTest
  @ValueSource(strings = {"100%", "150%", "-1%", "1", "1.5", "-0.01"})
  void parse_outsideZeroToOne_namesTheValue(String text) {
    assertThatThrownBy(() -> Tolerance.parse(text))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("tolerance \"" + text + "\"")
        .hasMessageContaining("must be at least 0 and below 1");
  }

  @Test
  void parse_bareWholeNumber_suggestsAPercentSign() {
    assertThatThrownBy(() -> Tolerance.parse("5"))
        .isInstanceOf(InvalidInputException.class)
        .hasMessage(
            "tolerance \"5\" (5.0) must be at least 0 and below 1 (100 %); write 5% for a"
                + " percentage");
  }

  @ParameterizedTest
  @ValueSource(strings = {"abc", "5%%", "1,5%", "NaN", "Infinity", "%", "5 percent", "1e-2"})
  void parse_notANumber_quotesTheText(String text) {
    assertThatThrownBy(() -> Tolerance.parse(text))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("\"" + text + "\"")
        .hasMessageContaining("1%");
  }

  @ParameterizedTest
  @NullAndEmptySource
  @ValueSource(strings = {"  "})
  void parse_empty_isRefused(String text) {
    assertThatThrownBy(() -> Tolerance.parse(text))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("is empty");
  }

  @Test
  void check_namesTheRoleAndValue() {
    assertEquals(0.01, Tolerance.check(0.01, "tolerance of R2"));
    assertThatThrownBy(() -> Tolerance.check(1.0, "tolerance of R2"))
        .isInstanceOf(InvalidInputException.class)
        .hasMessage("tolerance of R2 (1.0) must be at least 0 and below 1");
    assertThatThrownBy(() -> Tolerance.check(Double.NaN, "tolerance of C1"))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("C1 (NaN)");
    assertThatThrownBy(() -> Tolerance.check(-0.01, "tolerance of C1"))
        .isInstanceOf(InvalidInputException.class);
  }

  @ParameterizedTest
  @CsvSource({
    "0.01, 1%",
    "0.005, 0.5%",
    "0.05, 5%",
    "0.0025, 0.25%",
    "0.07, 7%",
    "0, 0%",
    "0.2, 20%",
    "0.0001, 0.01%",
    "0.123456, 12.35%"
  })
  void format_percentWithoutTrailingZeros(double fraction, String expected) {
    assertEquals(expected, Tolerance.format(fraction));
  }

  @Test
  void formatThenParse_givesTheSameFraction_forEveryColourTolerance() {
    // The tolerances of the IEC 60062 colour code (from memory): each prints and reads back.
    for (Colour colour : Colour.values()) {
      if (colour.tolerance().isPresent()) {
        double fraction = colour.tolerance().getAsDouble();
        assertEquals(fraction, Tolerance.parse(Tolerance.format(fraction)), colour.name());
      }
    }
  }

  @Test
  void format_nonFinite_isMisuse() {
    assertThatThrownBy(() -> Tolerance.format(Double.NaN))
        .isInstanceOf(IllegalArgumentException.class);
  }
}
