package com.stagewise.circuit.value;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Zener markings as printed on zener bodies and in parts lists (common practice: a V in place of
 * the decimal point, as the RKM code of IEC 60062 puts R or k; the usual E24 zener voltages).
 */
class ZenerMarkingTest {
  @ParameterizedTest
  @CsvSource({
    "5V1, 5.1",
    "3V3, 3.3",
    "2V7, 2.7",
    "12V, 12",
    "3.3V, 3.3",
    "4.7, 4.7",
    "15 V, 15",
    "6v2, 6.2",
    "33V, 33"
  })
  void parse_usualMarkings_giveTheVolts(String marking, double volts) {
    assertThat(ZenerMarking.parse(marking)).isEqualTo(volts);
  }

  @ParameterizedTest
  @ValueSource(strings = {"", "V", "5V1V", "abc", "0V", "-5V1", "5,1V", "1000V"})
  void parse_notAMarking_namesTheTextAndAnExample(String text) {
    assertThatThrownBy(() -> ZenerMarking.parse(text))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("5V1");
  }

  @ParameterizedTest
  @CsvSource({"5.1, 5V1", "12, 12V", "3.3, 3V3", "0.6, 0V6", "6.8, 6V8", "47, 47V"})
  void format_roundTrips(double volts, String marking) {
    assertThat(ZenerMarking.format(volts)).isEqualTo(marking);
    assertThat(ZenerMarking.parse(marking)).isEqualTo(volts);
  }
}
