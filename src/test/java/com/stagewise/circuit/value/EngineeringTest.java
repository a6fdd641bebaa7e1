package com.stagewise.circuit.value;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.stagewise.circuit.MeterSpec;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Numbers as people read them. Sources: the SI Brochure (BIPM, 9th edition, 2019), §5.4.3: a space
 * separates the number from the unit, and §3: the prefixes µ, m, k (engineering steps of 10³); the
 * Unicode standard for U+2212 MINUS SIGN and U+00A0 NO-BREAK SPACE; the digits of a 6000-count
 * autoranging meter (ranges 600.0 mV, 6.000 V, 60.00 V, 600.0 V), common practice for a handheld
 * DMM.
 *
 * <p>In the tables, {@code _} stands for the no-break space and {@code ~} for the minus sign.
 */
class EngineeringTest {

  private static String plain(String text) {
    return text.replace(Engineering.SPACE, '_').replace(Engineering.MINUS, '~');
  }

  @ParameterizedTest(name = "meter shows {0} V as {1}")
  @CsvSource({
    "-0.0018, ~1.8_mV", // the example: −1.8 mV, not "0 V"
    "0.00004, 0.0_mV", // below one count of the 600 mV range
    "-0.00004, 0.0_mV", // rounds to zero: no minus sign
    "-0.0, 0.0_mV", // negative zero
    "0.0, 0.0_mV",
    "0.1234, 123.4_mV",
    "0.59994, 599.9_mV",
    "0.62, 0.620_V", // 6 V range: three decimals
    "2.498, 2.498_V",
    "-4.7, ~4.700_V",
    "11.9, 11.90_V", // 60 V range: two decimals, the trailing zero is a digit the meter gave
    "14.96, 14.96_V",
    "-13.474, ~13.47_V",
    "230.46, 230.5_V", // 600 V range: one decimal
    "599.9, 599.9_V",
  })
  void reading_showsTheMetersDigits(double volts, String expected) {
    assertEquals(expected, plain(Engineering.reading(volts, MeterSpec.DEFAULT)));
  }

  @Test
  void reading_ofAFinerMeter_showsItsFinerDigits() {
    // A 60000-count meter has a 6.0000 V range (0.1 mV steps), common practice for bench meters.
    assertEquals("2.4981_V", plain(Engineering.reading(2.49812, new MeterSpec(0.05, 2, 60000))));
  }

  @ParameterizedTest(name = "computed {0} V prints as {1}")
  @CsvSource({
    "0.0, 0_V",
    "-0.0, 0_V", // negative zero: no minus sign
    "0.000000004, 0_V", // below 10 nV: nothing a bench instrument resolves
    "0.0000005, 500_nV",
    "0.00002, 20_µV",
    "-0.0000234, ~23.4_µV",
    "0.000999, 999_µV",
    "-0.0018, ~1.8_mV",
    "0.005, 5_mV",
    "0.02, 20_mV",
    "0.6204, 620_mV", // a 6000-count meter resolves 1 mV at this size
    "-4.7, ~4.7_V",
    "2.498, 2.498_V",
    "11.9, 11.9_V",
    "-15, ~15_V",
    "230.46, 230.5_V",
    "400, 400_V",
  })
  void volts_printsEngineeringUnits(double volts, String expected) {
    assertEquals(expected, plain(Engineering.volts(volts)));
  }

  @ParameterizedTest(name = "band {0} … {1} prints as {2}")
  @CsvSource({
    "-0.005, 0.005, ±5_mV", // the example: not "−0.005 V to +0.005 V"
    "-0.0000200, 0.0000200, ±20_µV",
    "2.495, 2.505, 2.495_V to 2.505_V",
    "-4.75, -4.65, ~4.75_V to ~4.65_V",
    "-0.002, 0.005, ~2_mV to 5_mV",
  })
  void band_namesBothEnds_orPlusMinusWhenCentredOnZero(double low, double high, String expected) {
    assertEquals(expected, plain(Engineering.band(low, high)));
  }

  @ParameterizedTest(name = "{0} {1} to {2} digits is {3}")
  @CsvSource({
    "4700, Ω, 3, 4.7_kΩ",
    "0.0000022, F, 3, 2.2_µF",
    "-230.46, V, 4, ~230.5_V",
    "1000, Hz, 4, 1_kHz",
    "999.96, Hz, 4, 1_kHz", // rounding carries into the next prefix
    "0, V, 3, 0_V",
  })
  void of_printsAnyQuantity(double value, String unit, int digits, String expected) {
    assertEquals(expected, plain(Engineering.of(value, unit, digits)));
  }

  @ParameterizedTest
  @ValueSource(doubles = {Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY})
  void notANumber_isRefused(double bad) {
    assertThrows(IllegalArgumentException.class, () -> Engineering.volts(bad));
    assertThrows(IllegalArgumentException.class, () -> Engineering.reading(bad, MeterSpec.DEFAULT));
    assertThrows(IllegalArgumentException.class, () -> Engineering.of(bad, "V", 3));
    assertThrows(IllegalArgumentException.class, () -> Engineering.band(bad, 1));
  }

  @Test
  void everyText_hasOneMinusSign_andNoBreakBetweenNumberAndUnit() {
    for (double v = -700; v <= 700; v += 0.37) {
      String text = Engineering.volts(v);
      assertFalse(text.contains("-"), text);
      assertFalse(text.contains(" "), text);
      assertTrue(text.indexOf(Engineering.MINUS) <= 0, text);
      assertTrue(text.contains(Engineering.SPACE + ""), text);
      String shown = Engineering.reading(v, MeterSpec.DEFAULT);
      assertFalse(shown.contains("-") || shown.contains(" "), shown);
    }
  }

  @Test
  void printedVolts_readBack_withinHalfAStep() {
    // What the screens print can be typed back into a value field (SiValue reads U+2212 and
    // U+00A0).
    for (double v : new double[] {-0.0018, 2.498, 11.9, 0.00002, -230.46}) {
      double back = SiValue.parse(Engineering.volts(v));
      assertEquals(v, back, Math.abs(v) * 1e-3 + 1e-9, Engineering.volts(v));
    }
  }
}
