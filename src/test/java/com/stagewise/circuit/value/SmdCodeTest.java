package com.stagewise.circuit.value;

import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertEquals;

import com.stagewise.circuit.InvalidInputException;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.NullAndEmptySource;
import org.junit.jupiter.params.provider.ValueSource;

class SmdCodeTest {

  @Nested
  class Decode {
    // 3-digit code: two digits and a power of ten; R is the decimal point (common practice of
    // resistor makers' marking guides).
    @ParameterizedTest
    @CsvSource({
      "472, 4700",
      "101, 100",
      "100, 10",
      "103, 10000",
      "105, 1e6",
      "220, 22",
      "4R7, 4.7",
      "R47, 0.47",
      "1R0, 1",
      "000, 0",
      "0, 0",
      "00, 0",
      "' 472 ', 4700",
      "r47, 0.47",
      "107, 1e8"
    })
    void threeDigit(String code, double ohms) {
      assertEquals(ohms, SmdCode.decode(code));
    }

    // 4-digit code: three digits and a power of ten (common practice, 1 % parts).
    @ParameterizedTest
    @CsvSource({
      "4702, 47000",
      "1003, 100000",
      "1000, 100",
      "49R9, 49.9",
      "1R00, 1",
      "R100, 0.1",
      "0000, 0",
      "4991, 4990",
      "10R0, 10",
      "R047, 0.047",
      "2491, 2490"
    })
    void fourDigit(String code, double ohms) {
      assertEquals(ohms, SmdCode.decode(code));
    }

    // EIA-96: index into the E96 series and a multiplier letter (EIA-96 marking table, from
    // memory: 01 = 100, 68 = 499, 96 = 976; Z 0.001, Y/R 0.01, X/S 0.1, A 1, B/H 10, C 100,
    // D 1000, E 10^4, F 10^5).
    @ParameterizedTest
    @CsvSource({
      "01C, 10000", "68X, 49.9", "01A, 100", "96F, 97.6e6", "01Z, 0.1", "01Y, 1", "01R, 1",
      "30X, 20", "30S, 20", "01B, 1000", "01H, 1000", "44A, 280", "85D, 750000", "68B, 4990",
      "10E, 1.24e6", "01c, 10000", "48A, 309"
    })
    void eia96(String code, double ohms) {
      assertEquals(ohms, SmdCode.decode(code));
    }

    @Test
    void theThreeStylesOfOneValue_agree() {
      // 4.99 kΩ: 4-digit 4991 and EIA-96 68B; 4.7 kΩ: 3-digit 472 and 4-digit 4701.
      assertEquals(SmdCode.decode("4991"), SmdCode.decode("68B"));
      assertEquals(SmdCode.decode("472"), SmdCode.decode("4701"));
      assertEquals(SiValue.parse("4k99"), SmdCode.decode("68B"));
    }
  }

  @Nested
  class DecodeErrors {
    @ParameterizedTest
    @NullAndEmptySource
    @ValueSource(strings = {"4k7", "47", "R", "4R7R", "12345", "01Q", "47A1", "RR1", "4.7", "-472"})
    void notACode_listsTheForms(String code) {
      assertThatThrownBy(() -> SmdCode.decode(code))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("SMD code \"" + (code == null ? "" : code) + "\"")
          .hasMessageContaining("3-digit (472), 4-digit (4702), R (4R7, R47) or EIA-96 (01C)");
    }

    @ParameterizedTest
    @ValueSource(strings = {"97C", "00C", "99A"})
    void eia96IndexOutOfRange_saysSo(String code) {
      assertThatThrownBy(() -> SmdCode.decode(code))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining(
              "EIA-96 index " + code.substring(0, 2) + " is not between 01 and 96");
    }

    @ParameterizedTest
    @ValueSource(strings = {"479", "478", "1009"})
    void multiplierEightOrNine_isRefused(String code) {
      assertThatThrownBy(() -> SmdCode.decode(code))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("multiplier digit " + code.charAt(code.length() - 1));
    }
  }

  @Nested
  class Encode {
    @ParameterizedTest
    @CsvSource({
      "4700, 472",
      "100, 101",
      "10, 100",
      "4.7, 4R7",
      "0.47, R47",
      "0, 000",
      "1e6, 105",
      "22, 220",
      "1, 1R0",
      "0.1, R10",
      "9.1e8, 917"
    })
    void threeDigit(double ohms, String code) {
      assertEquals(code, SmdCode.encodeThreeDigit(ohms));
    }

    @ParameterizedTest
    @CsvSource({
      "47000, 4702",
      "100000, 1003",
      "100, 1000",
      "49.9, 49R9",
      "0.1, R100",
      "4990, 4991",
      "0, 0000",
      "10, 10R0",
      "1, 1R00",
      "0.047, R047",
      "4.99, 4R99"
    })
    void fourDigit(double ohms, String code) {
      assertEquals(code, SmdCode.encodeFourDigit(ohms));
    }

    @ParameterizedTest
    @CsvSource({
      "10000, 01C",
      "49.9, 68X",
      "100, 01A",
      "0.1, 01Z",
      "97.6e6, 96F",
      "4990, 68B",
      "1.24e6, 10E",
      "1, 01Y"
    })
    void eia96(double ohms, String code) {
      assertEquals(code, SmdCode.encodeEia96(ohms));
    }

    @Test
    void threeDigit_valueNeedingThreeDigits_isRefused() {
      assertThatThrownBy(() -> SmdCode.encodeThreeDigit(4750))
          .isInstanceOf(InvalidInputException.class)
          .hasMessage(
              "resistance 4750 Ω needs more than 2 significant digits (or is too small) for the"
                  + " 3-digit code");
      assertThatThrownBy(() -> SmdCode.encodeThreeDigit(0.047))
          .isInstanceOf(InvalidInputException.class);
      assertThatThrownBy(() -> SmdCode.encodeFourDigit(0.0047))
          .isInstanceOf(InvalidInputException.class);
    }

    @Test
    void tooLarge_isRefused() {
      assertThatThrownBy(() -> SmdCode.encodeFourDigit(1e12))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("too large for the 4-digit code");
    }

    @Test
    void eia96_ofAnE24Value_namesTheNearestE96Value() {
      assertThatThrownBy(() -> SmdCode.encodeEia96(4700))
          .isInstanceOf(InvalidInputException.class)
          .hasMessage(
              "resistance 4.7 kΩ is not an E96 value, so it has no EIA-96 code; the nearest E96"
                  + " value is 4.75 kΩ");
      assertThatThrownBy(() -> SmdCode.encodeEia96(0)).isInstanceOf(InvalidInputException.class);
      assertThatThrownBy(() -> SmdCode.encodeEia96(1e8))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("outside the EIA-96 range");
    }

    @ParameterizedTest
    @ValueSource(doubles = {-1, Double.NaN, Double.NEGATIVE_INFINITY})
    void negativeOrNonFinite_isRefused(double ohms) {
      assertThatThrownBy(() -> SmdCode.encodeThreeDigit(ohms))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("has no SMD code");
      assertThatThrownBy(() -> SmdCode.encodeEia96(ohms)).isInstanceOf(InvalidInputException.class);
    }
  }

  @Nested
  class RoundTrip {
    @Test
    void everyE96Value_throughEia96AndFourDigit() {
      // Every E96 value (IEC 60063) from 0.1 Ω to 97.6 MΩ: the EIA-96 range.
      int checked = 0;
      for (int power = -3; power <= 5; power++) {
        for (double mantissa : ESeries.E96.decade()) {
          double ohms = Decimals.times10(Math.round(mantissa * 100), power);
          assertEquals(ohms, SmdCode.decode(SmdCode.encodeEia96(ohms)), () -> "EIA-96 " + ohms);
          assertEquals(ohms, SmdCode.decode(SmdCode.encodeFourDigit(ohms)), () -> "4 " + ohms);
          checked++;
        }
      }
      assertEquals(9 * 96, checked);
    }

    @Test
    void everyE24Value_throughThreeDigit() {
      // Every E24 value from 0.1 Ω to 910 MΩ.
      for (int power = -2; power <= 7; power++) {
        for (double mantissa : ESeries.E24.decade()) {
          double ohms = Decimals.times10(Math.round(mantissa * 10), power);
          assertEquals(ohms, SmdCode.decode(SmdCode.encodeThreeDigit(ohms)), () -> "3 " + ohms);
        }
      }
    }
  }
}
