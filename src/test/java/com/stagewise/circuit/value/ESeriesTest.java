package com.stagewise.circuit.value;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.stagewise.circuit.InvalidInputException;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.NullAndEmptySource;
import org.junit.jupiter.params.provider.ValueSource;

class ESeriesTest {

  @Nested
  class Tables {
    // IEC 60063: the series name is the number of values per decade.
    @ParameterizedTest
    @CsvSource({"E3, 3", "E6, 6", "E12, 12", "E24, 24", "E48, 48", "E96, 96", "E192, 192"})
    void count_isTheNumberInTheName(ESeries series, int count) {
      assertEquals(count, series.count());
      assertEquals(count, series.decade().size());
    }

    @Test
    void e12_isTheStandardTable() {
      // IEC 60063 E12 (from memory of the standard; the familiar 10 % resistor values).
      assertEquals(
          List.of(1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2),
          ESeries.E12.decade());
    }

    @Test
    void e24_isTheStandardTable() {
      // IEC 60063 E24 (from memory of the standard; the familiar 5 % resistor values).
      assertEquals(
          List.of(
              1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7,
              5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1),
          ESeries.E24.decade());
    }

    @Test
    void e3AndE6_areTheStandardTables() {
      // IEC 60063 (from memory).
      assertEquals(List.of(1.0, 2.2, 4.7), ESeries.E3.decade());
      assertEquals(List.of(1.0, 1.5, 2.2, 3.3, 4.7, 6.8), ESeries.E6.decade());
    }

    // IEC 60063 E96, spot checks by position (1-based); the same positions are the EIA-96 index
    // numbers printed on SMD resistors (from memory of both tables).
    @ParameterizedTest
    @CsvSource({
      "1, 1.00", "2, 1.02", "10, 1.24", "20, 1.58", "30, 2.00", "40, 2.55", "44, 2.80",
      "48, 3.09", "50, 3.24", "60, 4.12", "67, 4.87", "68, 4.99", "70, 5.23", "80, 6.65",
      "85, 7.50", "90, 8.45", "96, 9.76"
    })
    void e96_spotChecks(int position, double expected) {
      assertEquals(expected, ESeries.E96.decade().get(position - 1));
    }

    // IEC 60063 E192 spot checks (from memory), including 9.20, the value that deviates from the
    // rounded geometric series.
    @ParameterizedTest
    @CsvSource({
      "1, 1.00",
      "2, 1.01",
      "8, 1.09",
      "95, 3.09",
      "96, 3.12",
      "135, 4.99",
      "186, 9.20",
      "187, 9.31",
      "192, 9.88"
    })
    void e192_spotChecks(int position, double expected) {
      assertEquals(expected, ESeries.E192.decade().get(position - 1));
    }

    // IEC 60063 builds E48, E96 and E192 as 10^(i/n) rounded to three significant digits, with a
    // single exception: E192 keeps 9.20 where rounding gives 9.19 (from memory). Computing the
    // series here checks every entry of the written-out tables.
    @ParameterizedTest
    @EnumSource(
        value = ESeries.class,
        names = {"E48", "E96", "E192"})
    void threeDigitSeries_matchTheRoundedGeometricSeries_exceptE192At920(ESeries series) {
      List<String> differences = new ArrayList<>();
      for (int i = 0; i < series.count(); i++) {
        double rounded = roundedGeometric(i, series.count(), 3);
        double written = series.decade().get(i);
        if (rounded != written) {
          differences.add(rounded + "->" + written);
        }
      }
      assertEquals(series == ESeries.E192 ? List.of("9.19->9.2") : List.of(), differences);
    }

    @Test
    void e24_deviatesFromTheRoundedGeometricSeriesAtTheKnownValues() {
      // IEC 60063 keeps the historical E24 values 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7 and 8.2, which
      // differ from 10^(i/24) rounded to two digits (from memory; widely documented).
      List<Double> deviating = new ArrayList<>();
      for (int i = 0; i < 24; i++) {
        if (roundedGeometric(i, 24, 2) != ESeries.E24.decade().get(i)) {
          deviating.add(ESeries.E24.decade().get(i));
        }
      }
      assertEquals(List.of(2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2), deviating);
    }

    // IEC 60063: each series is every other value of the next finer one (E3 of E6, … E12 of E24;
    // E48 of E96, E96 of E192). E24 and E48 are not nested (two versus three digits).
    @ParameterizedTest
    @CsvSource({"E3, E6", "E6, E12", "E12, E24", "E48, E96", "E96, E192"})
    void coarserSeries_isEveryOtherValueOfTheFinerOne(ESeries coarse, ESeries fine) {
      List<Double> everyOther = new ArrayList<>();
      for (int i = 0; i < fine.count(); i += 2) {
        everyOther.add(fine.decade().get(i));
      }
      assertEquals(everyOther, coarse.decade());
    }

    @ParameterizedTest
    @EnumSource(ESeries.class)
    void decade_isAscendingFromOneToBelowTen(ESeries series) {
      List<Double> values = series.decade();
      assertEquals(1.0, values.get(0));
      assertThat(values).isSorted().doesNotHaveDuplicates().allMatch(v -> v >= 1 && v < 10);
    }

    private double roundedGeometric(int i, int n, int digits) {
      return new BigDecimal(Math.pow(10, (double) i / n))
          .round(new MathContext(digits, RoundingMode.HALF_UP))
          .doubleValue();
    }
  }

  @Nested
  class Nearest {
    @ParameterizedTest
    @CsvSource({
      "E12, 4800, 4700",
      "E12, 5000, 4700",
      "E12, 5200, 5600",
      "E12, 9.6, 10",
      "E12, 0.0012, 0.0012",
      "E24, 1e-12, 1e-12",
      "E96, 4990, 4990",
      "E96, 4800, 4750",
      "E24, 4800, 4700",
      "E24, 2.9e-9, 3.0e-9",
      "E6, 1e6, 1e6",
      "E3, 3.2, 2.2",
      "E3, 3.3, 4.7",
      "E12, 8.6e5, 8.2e5",
      "E192, 9.2, 9.2",
      "E12, 1.09, 1.0",
      "E12, 1.1, 1.2"
    })
    void nearest_examples(ESeries series, double value, double expected) {
      // Expected values worked by hand from the IEC 60063 tables.
      assertEquals(expected, series.nearest(value));
    }

    @Test
    void nearest_isLogarithmic_notLinear() {
      // Between 4.7 and 5.6 the linear midpoint is 5.15, the geometric one sqrt(4.7 × 5.6) =
      // 5.130: 5.14 k is nearer 5.6 k by ratio although nearer 4.7 k by difference.
      assertEquals(5600, ESeries.E12.nearest(5140));
      assertEquals(4700, ESeries.E12.nearest(5120));
      // 1.25 is the linear midpoint of 1.0 and 1.5, but above their geometric mean 1.2247.
      assertEquals(1.5, ESeries.E6.nearest(1.25));
      assertEquals(1.0, ESeries.E6.nearest(1.22));
    }

    @Test
    void nearest_agreesWithBruteForceOverManyDecades() {
      // Independent check: a plain search over every preferred value from 1e-12 to 1e12.
      Random random = new Random(20260601L);
      for (ESeries series : ESeries.values()) {
        List<Double> all = new ArrayList<>();
        for (int decade = -13; decade <= 13; decade++) {
          for (double m : series.decade()) {
            all.add(new BigDecimal(Double.toString(m)).scaleByPowerOfTen(decade).doubleValue());
          }
        }
        for (int n = 0; n < 500; n++) {
          double value = Math.pow(10, -12 + 24 * random.nextDouble());
          double best = all.get(0);
          for (double candidate : all) {
            if (Math.abs(Math.log(candidate / value)) < Math.abs(Math.log(best / value))) {
              best = candidate;
            }
          }
          assertEquals(best, series.nearest(value), series + " near " + value);
        }
      }
    }

    @ParameterizedTest
    @ValueSource(doubles = {0, -4700, Double.NaN, Double.POSITIVE_INFINITY})
    void nearest_ofANonPositiveValue_isMisuse(double value) {
      assertThatThrownBy(() -> ESeries.E12.nearest(value))
          .isInstanceOf(IllegalArgumentException.class)
          .hasMessageContaining(String.valueOf(value));
    }
  }

  @Nested
  class Preferred {
    @ParameterizedTest
    @CsvSource({
      "E12, 4700, true",
      "E96, 4990, true",
      "E24, 4990, false",
      "E3, 4.7, true",
      "E24, 5100, true",
      "E12, 5100, false",
      "E192, 9.2, true",
      "E192, 9.19, false",
      "E48, 1.02, false",
      "E96, 1.02, true",
      "E24, 3e-9, true",
      "E12, 3e-9, false",
      "E6, 1e9, true",
      "E12, 4.7e-12, true"
    })
    void isPreferred_followsTheTables(ESeries series, double value, boolean expected) {
      // IEC 60063 tables (from memory).
      assertEquals(expected, series.isPreferred(value));
    }

    @Test
    void isPreferred_toleratesRoundingNoiseOnly() {
      assertTrue(ESeries.E12.isPreferred(4700 * (1 + 1e-12)));
      assertTrue(ESeries.E12.isPreferred(0.1 * 3 * 1000 * 1.1)); // 330 with binary noise
      assertFalse(ESeries.E12.isPreferred(4700 * 1.001));
    }

    @ParameterizedTest
    @ValueSource(doubles = {0, -4700, Double.NaN, Double.POSITIVE_INFINITY})
    void isPreferred_ofANonPositiveValue_isFalse(double value) {
      assertFalse(ESeries.E12.isPreferred(value));
    }
  }

  @Nested
  class Neighbours {
    @ParameterizedTest
    @CsvSource({
      "E12, 4700, 3900, 5600",
      "E12, 5000, 4700, 5600",
      "E12, 1000, 820, 1200",
      "E24, 9.5, 9.1, 10",
      "E96, 4990, 4870, 5110",
      "E3, 1, 0.47, 2.2",
      "E12, 0.0089, 0.0082, 0.01",
      "E192, 9.2, 9.09, 9.31"
    })
    void neighbours_areTheValuesJustBelowAndAbove(
        ESeries series, double value, double below, double above) {
      // Worked by hand from the IEC 60063 tables.
      assertEquals(new ESeries.Neighbours(below, above), series.neighbours(value));
    }

    @Test
    void neighbours_ofANonPositiveValue_isMisuse() {
      assertThatThrownBy(() -> ESeries.E12.neighbours(0))
          .isInstanceOf(IllegalArgumentException.class);
    }
  }

  @Nested
  class Parse {
    @ParameterizedTest
    @CsvSource({"E24, E24", "e24, E24", "' E96 ', E96", "E3, E3", "e192, E192"})
    void parse_readsTheName(String text, ESeries expected) {
      assertEquals(expected, ESeries.parse(text));
    }

    @ParameterizedTest
    @NullAndEmptySource
    @ValueSource(strings = {"E25", "24", "E 24", "E-24", "R10"})
    void parse_unknownName_listsTheSeries(String text) {
      assertThatThrownBy(() -> ESeries.parse(text))
          .isInstanceOf(InvalidInputException.class)
          .hasMessage(
              "series \""
                  + (text == null ? "" : text)
                  + "\" is not an E-series; expected one of"
                  + " E3, E6, E12, E24, E48, E96, E192");
    }
  }
}
