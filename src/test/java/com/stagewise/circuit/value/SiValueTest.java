package com.stagewise.circuit.value;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertEquals;

import com.stagewise.circuit.InvalidInputException;
import java.util.Locale;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.NullAndEmptySource;
import org.junit.jupiter.params.provider.ValueSource;

class SiValueTest {

  @Nested
  class Parse {
    // Plain decimal numbers with an optional exponent: ordinary decimal notation.
    @ParameterizedTest
    @CsvSource({
      "1000, 1000",
      "1e3, 1000",
      "1E3, 1000",
      "-2.5, -2.5",
      "0.01, 0.01",
      ".5, 0.5",
      "5., 5",
      "+3, 3",
      "1e-3, 0.001",
      "2.2E-12, 2.2e-12",
      "0, 0",
      "  47  , 47"
    })
    void plainNumbers(String text, double expected) {
      assertEquals(expected, SiValue.parse(text));
    }

    // Prefix values from the SI Brochure (BIPM, 9th edition, table 7); K for kilo and u for micro
    // are common practice on parts lists.
    @ParameterizedTest
    @CsvSource({
      "10k, 1e4", "10K, 1e4", "1.5M, 1.5e6", "100n, 1e-7", "22p, 2.2e-11", "4.7u, 4.7e-6",
      "4.7µ, 4.7e-6", "4.7μ, 4.7e-6", "1m, 1e-3", "1G, 1e9", "3f, 3e-15", "2T, 2e12",
      "4.7 k, 4700", "0.1M, 1e5", "-12.5m, -0.0125", "1e3k, 1e6"
    })
    void siPrefixes(String text, double expected) {
      assertEquals(expected, SiValue.parse(text));
    }

    // Units written after the value, as on schematics and parts lists (common practice).
    @ParameterizedTest
    @CsvSource({
      "10kΩ, 1e4",
      "10kΩ, 1e4",
      "100nF, 1e-7",
      "10 kohm, 1e4",
      "1 Ohms, 1",
      "1kHz, 1000",
      "50 hz, 50",
      "5V, 5",
      "4.7R, 4.7",
      "470R, 470",
      "2A, 2",
      "4.7 kΩ, 4700",
      "100 nF, 1e-7",
      "1 F, 1",
      "3fF, 3e-15",
      "2.2 mΩ, 0.0022"
    })
    void units(String text, double expected) {
      assertEquals(expected, SiValue.parse(text));
    }

    // RKM code examples of IEC 60062 (from memory of the standard): the letter is the decimal
    // point and the multiplier.
    @ParameterizedTest
    @CsvSource({
      "4k7, 4700",
      "4K7, 4700",
      "4R7, 4.7",
      "R47, 0.47",
      "470R, 470",
      "0R, 0",
      "2u2, 2.2e-6",
      "2µ2, 2.2e-6",
      "1M5, 1.5e6",
      "6n8, 6.8e-9",
      "p47, 4.7e-13",
      "1m5, 1.5e-3",
      "1K0, 1000",
      "R10, 0.1",
      "4r7, 4.7",
      "1F5, 1.5",
      "4k7Ω, 4700",
      "2u2F, 2.2e-6",
      "4K7 ohm, 4700",
      "k47, 470",
      "2G2, 2.2e9"
    })
    void rkmCode(String text, double expected) {
      assertEquals(expected, SiValue.parse(text));
    }

    @Test
    void everySpellingOfOneValue_givesTheSameDouble() {
      // 4.7 kΩ written five ways must compare equal, not merely close.
      for (String text : new String[] {"4k7", "4K7", "4.7k", "4700", "4.7e3", "4.7 kΩ"}) {
        assertEquals(4700.0, SiValue.parse(text), text);
      }
      assertEquals(1e-7, SiValue.parse("100n"));
      assertEquals(SiValue.parse("0.1u"), SiValue.parse("100n"));
    }

    @Test
    void typographicMinusAndNoBreakSpace_areRead() {
      assertEquals(-2.5, SiValue.parse("\u22122.5"));
      assertEquals(4700, SiValue.parse("4.7\u00a0kΩ"));
      assertEquals(4700, SiValue.parse("4.7\u202fkΩ"));
    }
  }

  @Nested
  class BadInput {
    @ParameterizedTest
    @ValueSource(
        strings = {
          "4k7k",
          "k",
          "R",
          "1..2",
          "abc",
          "1e",
          "10 kk",
          "4.7k7",
          "NaN",
          "Infinity",
          "-Infinity",
          "10kR",
          "4R7Ω",
          "1 2",
          "--1",
          "0x10",
          "1e3.5",
          "4k7.",
          "4E",
          "1 kV V",
          "1mm"
        })
    void notAValue_saysWhatWasGivenAndWhatIsExpected(String text) {
      assertThatThrownBy(() -> SiValue.parse(text))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("\"" + text + "\"")
          .hasMessageContaining("examples: 4k7, 470R, 100n, 2u2");
    }

    @Test
    void doubledPrefix_hasTheDocumentedMessage() {
      assertThatThrownBy(() -> SiValue.parse("4k7k"))
          .isInstanceOf(InvalidInputException.class)
          .hasMessage(
              "value \"4k7k\" is not a number with an SI prefix or RKM code"
                  + " (examples: 4k7, 470R, 100n, 2u2)");
    }

    @ParameterizedTest
    @NullAndEmptySource
    @ValueSource(strings = {"   ", "\t"})
    void missingOrEmpty_isRefused(String text) {
      assertThatThrownBy(() -> SiValue.parse(text))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageMatching("value (is missing|\"\\s*\" is empty).*expected a number.*");
    }

    @ParameterizedTest
    @ValueSource(strings = {"1e999", "1e308k", "-1e400", "99999999999e2147483647"})
    void tooLarge_isRefused(String text) {
      assertThatThrownBy(() -> SiValue.parse(text))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("\"" + text + "\"");
    }

    @ParameterizedTest
    @ValueSource(strings = {"1e-999", "1e-330f"})
    void tooSmallToStore_isRefused(String text) {
      assertThatThrownBy(() -> SiValue.parse(text))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("\"" + text + "\" is too small");
    }

    @ParameterizedTest
    @ValueSource(strings = {"4,7k", "4,7", "0,1u"})
    void decimalComma_isRefusedWithAHint(String text) {
      assertThatThrownBy(() -> SiValue.parse(text))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("\"" + text + "\" has a decimal comma")
          .hasMessageContaining("4k7");
    }
  }

  @Nested
  class Format {
    // Engineering notation: powers of ten in steps of three with the SI prefix (SI Brochure,
    // BIPM, 9th edition; common practice for part values).
    @ParameterizedTest
    @CsvSource({
      "4700, Ω, 4.7 kΩ",
      "1e-7, F, 100 nF",
      "0, V, 0 V",
      "2.2e-6, F, 2.2 µF",
      "49.9, Ω, 49.9 Ω",
      "1e6, Ω, 1 MΩ",
      "999.96, Ω, 1 kΩ",
      "-0.0125, V, -12.5 mV",
      "1234.5678, Ω, 1.235 kΩ",
      "1e-18, F, 0.001 fF",
      "1e15, Ω, 1000 TΩ",
      "1000, Hz, 1 kHz",
      "0.47, Ω, 470 mΩ",
      "15, V, 15 V",
      "2.2e-11, F, 22 pF",
      "4.99e5, Ω, 499 kΩ",
      "-0.0, V, 0 V"
    })
    void engineeringNotation(double value, String unit, String expected) {
      assertEquals(expected, SiValue.format(value, unit));
    }

    @Test
    void withoutUnit_printsPrefixOrBareNumber() {
      assertEquals("4.7 k", SiValue.format(4700, ""));
      assertEquals("4.7 k", SiValue.format(4700, null));
      assertEquals("47", SiValue.format(47, ""));
      assertEquals("0", SiValue.format(0, ""));
    }

    @Test
    void significantDigits_roundHalfUp() {
      assertEquals("333 Ω", SiValue.format(1000.0 / 3, "Ω", 3));
      assertEquals("2.3 V", SiValue.format(2.25, "V", 2));
      assertEquals("333.333333 Ω", SiValue.format(1000.0 / 3, "Ω", 9));
    }

    @Test
    void nonFiniteOrBadDigits_isMisuse() {
      assertThatThrownBy(() -> SiValue.format(Double.NaN, "V"))
          .isInstanceOf(IllegalArgumentException.class)
          .hasMessageContaining("NaN");
      assertThatThrownBy(() -> SiValue.format(Double.POSITIVE_INFINITY, "V"))
          .isInstanceOf(IllegalArgumentException.class);
      assertThatThrownBy(() -> SiValue.format(1, "V", 0))
          .isInstanceOf(IllegalArgumentException.class)
          .hasMessageContaining("(0)");
    }

    @Test
    void germanDefaultLocale_stillPrintsAndReadsADecimalPoint() {
      // The suite runs in German; this test also forces it, for runs from an IDE.
      Locale saved = Locale.getDefault();
      try {
        Locale.setDefault(Locale.GERMANY);
        assertEquals("4.7 kΩ", SiValue.format(4700, "Ω"));
        assertEquals("0.5%", Tolerance.format(0.005));
        assertEquals(4700, SiValue.parse("4.7k"));
        assertEquals(0.005, Tolerance.parse("0.5 %"));
      } finally {
        Locale.setDefault(saved);
      }
    }
  }

  @Nested
  class Rkm {
    // IEC 60062 resistance code (from memory): R, K, M, G as decimal markers, at least two digits
    // (1K0, R10).
    @ParameterizedTest
    @CsvSource({
      "4700, 4K7",
      "470, 470R",
      "0, 0R",
      "0.47, R47",
      "4.7, 4R7",
      "1000, 1K0",
      "10000, 10K",
      "1e6, 1M0",
      "1.5e6, 1M5",
      "4990, 4K99",
      "49.9, 49R9",
      "0.1, R10",
      "2.2e9, 2G2",
      "100, 100R",
      "1, 1R0",
      "0.047, R047",
      "332000, 332K",
      "1e12, 1T0",
      "4753.4, 4K753"
    })
    void resistance(double ohms, String expected) {
      assertEquals(expected, SiValue.rkm(ohms));
    }

    // IEC 60062 capacitance code (from memory), with ASCII u for micro (common practice).
    @ParameterizedTest
    @CsvSource({
      "2.2e-6, 2u2",
      "1e-7, 100n",
      "6.8e-9, 6n8",
      "4.7e-13, p47",
      "1e-9, 1n0",
      "2.2e-11, 22p",
      "1e-3, 1m0",
      "1.5, 1F5",
      "4.7e-5, 47u",
      "0, 0F"
    })
    void capacitance(double farads, String expected) {
      assertEquals(expected, SiValue.rkmFarads(farads));
    }

    @Test
    void negativeOrNonFinite_isMisuse() {
      assertThatThrownBy(() -> SiValue.rkm(-1)).isInstanceOf(IllegalArgumentException.class);
      assertThatThrownBy(() -> SiValue.rkm(Double.NaN))
          .isInstanceOf(IllegalArgumentException.class);
      assertThatThrownBy(() -> SiValue.rkmFarads(Double.POSITIVE_INFINITY))
          .isInstanceOf(IllegalArgumentException.class);
    }
  }

  @Nested
  class RoundTrip {
    // Every E96 and E192 value (IEC 60063) in every decade from 1 mΩ to 1 GΩ must read back as
    // the same double after printing: printing keeps four digits, E192 needs three.
    @ParameterizedTest
    @EnumSource(
        value = ESeries.class,
        names = {"E24", "E96", "E192"})
    void formatThenParse_givesTheSameValue(ESeries series) {
      int checked = 0;
      for (int decade = -3; decade <= 9; decade++) {
        for (double mantissa : series.decade()) {
          double ohms = Decimals.times10(Math.round(mantissa * 100), decade - 2);
          assertEquals(ohms, SiValue.parse(SiValue.format(ohms, "Ω")), () -> "ohms " + ohms);
          assertEquals(ohms, SiValue.parse(SiValue.rkm(ohms)), () -> "rkm " + ohms);
          assertEquals(-ohms, SiValue.parse(SiValue.format(-ohms, "V")), () -> "volts " + ohms);
          double farads = Decimals.times10(Math.round(mantissa * 100), decade - 14);
          assertEquals(farads, SiValue.parse(SiValue.format(farads, "F")), () -> "F " + farads);
          assertEquals(farads, SiValue.parse(SiValue.rkmFarads(farads)), () -> "rkm " + farads);
          checked++;
        }
      }
      assertEquals(13 * series.count(), checked);
    }

    @Test
    void parseThenRkm_givesTheCodeBack() {
      // IEC 60062 codes (from memory) written in the canonical form read and print unchanged.
      for (String code : new String[] {"4K7", "470R", "R47", "1M5", "0R", "4R7", "10K", "1K0"}) {
        assertEquals(code, SiValue.rkm(SiValue.parse(code)));
      }
      for (String code : new String[] {"2u2", "6n8", "p47", "100n", "22p", "1n0"}) {
        assertEquals(code, SiValue.rkmFarads(SiValue.parse(code)));
      }
    }
  }

  @Test
  void theDesignNotesExamples_allRead() {
    // The value strings listed in the stage sheet contract.
    String[] texts = {"10k", "4k7", "4K7", "470R", "0R", "100n", "2u2", "1.5M", "22p", "47"};
    double[] values = {1e4, 4700, 4700, 470, 0, 1e-7, 2.2e-6, 1.5e6, 2.2e-11, 47};
    for (int i = 0; i < texts.length; i++) {
      assertThat(SiValue.parse(texts[i])).as(texts[i]).isEqualTo(values[i]);
    }
  }
}
