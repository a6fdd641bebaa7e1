package com.stagewise.ui.words;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class WordsTest {

  @ParameterizedTest
  @CsvSource(
      delimiter = '|',
      value = {
        "healthy|Nothing wrong (healthy stage)",
        "R2:open|R2 open",
        "C1:short|C1 shorted",
        "R2:high|R2 drifted high",
        "R1:low|R1 drifted low",
        "VCC:low|Rail VCC low",
        "VEE:missing|Rail VEE missing",
        "U1A:stuck-high|U1A output stuck high",
        "U1A:dead|U1A output dead (not driving)",
        "U1.3:lifted|U1 pin 3 lifted (open joint)",
        "U1.6-7:bridge|Solder bridge U1 pins 6–7"
      })
  void fault_eachKindOfTheGrammar_readsAsWords(String id, String words) {
    // The fault id grammar of DESIGN.md, one row per kind.
    assertThat(Words.fault(id)).isEqualTo(words);
  }

  @Test
  void volts_inDecimalCommaLocale_usesAPoint() {
    // Values in engineering units with U+2212 and a no-break space (table in EngineeringTest).
    assertThat(Words.volts(-4.7)).isEqualTo("\u22124.7\u00a0V");
    assertThat(Words.volts(14.96)).isEqualTo("14.96\u00a0V");
    assertThat(Words.volts(0.001)).isEqualTo("1\u00a0mV");
    assertThat(Words.volts(Double.NaN)).isEqualTo("—");
    assertThat(Words.measured(11.9)).isEqualTo("11.90\u00a0V");
    assertThat(Words.band(-0.005, 0.005)).isEqualTo("\u00b15\u00a0mV");
  }

  @Test
  void percent_smallProbability_saysBelowOne() {
    assertThat(Words.percent(0.953)).isEqualTo("95\u00a0%");
    assertThat(Words.percent(0.004)).isEqualTo("<1\u00a0%");
    assertThat(Words.percent(0)).isEqualTo("0\u00a0%");
  }

  @Test
  void pin_packagePin_readsAsPinNumber() {
    assertThat(Words.pin("U1.8")).isEqualTo("U1 pin 8");
    assertThat(Words.pin("OUT")).isEqualTo("OUT");
    assertThat(Words.pin("+15V")).isEqualTo("+15V");
  }
}
