package com.stagewise.interchange;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.value.SiValue;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class ValueTextTest {

  // Printing in RKM code (IEC 60062: the letter stands for the decimal point, 4k7 = 4.7 kΩ,
  // 2u2 = 2.2 µF, 470R = 470 Ω), resistors with R below 1 k.
  @ParameterizedTest
  @CsvSource({
    "4700, true, 4k7",
    "10000, true, 10k",
    "470, true, 470R",
    "0, true, 0R",
    "4.7, true, 4R7",
    "1.5e6, true, 1M5",
    "1e-7, false, 100n",
    "2.2e-6, false, 2u2",
    "2.2e-11, false, 22p",
    "4.7e-9, false, 4n7",
    "1e-6, false, 1u",
    "1e-9, false, 1n",
    "1e6, true, 1M",
    "1000, true, 1k",
    "10370, true, 10k37",
    "0.5, true, 0R5"
  })
  void format_value_printsRkm(double value, boolean ohms, String expected) {
    assertThat(ValueText.format(value, ohms)).isEqualTo(expected);
  }

  @ParameterizedTest
  @ValueSource(
      doubles = {4700, 1e-7, 2.2e-6, 3.3e-12, 1.234567e5, 0.1, 6.8e4, 1e9, 12.5, 33e-9, 1.0 / 3})
  void formatThenParse_anyValue_givesSameDouble(double value) {
    assertThat(SiValue.parse(ValueText.format(value, true))).isEqualTo(value);
    assertThat(SiValue.parse(ValueText.format(value, false))).isEqualTo(value);
  }

  @ParameterizedTest
  @CsvSource({"0.01, 1%", "0.005, 0.5%", "0.1, 10%", "0.05, 5%"})
  void formatTolerance_fraction_printsPercent(double fraction, String expected) {
    assertThat(ValueText.formatTolerance(fraction)).isEqualTo(expected);
  }
}
