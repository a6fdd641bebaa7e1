package com.stagewise.interchange;

import static com.stagewise.interchange.ReadingsSheetTest.FILE;
import static com.stagewise.interchange.ReadingsSheetTest.STAGE;
import static com.stagewise.interchange.ReadingsSheetTest.badReadings;
import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.OhmsSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Readings contract version 2: power-off (ohms) readings, the meter's ohms spec, part leads. */
class ReadingsSheetOhmsTest {
  /** The power-off example of the design notes (the contract), with a meter ohms spec. */
  static final String EXAMPLE =
      """
      {
        "format": "stagewise-readings", "version": 2,
        "meter": {"percent": 0.5, "counts": 2, "displayCounts": 6000,
                  "ohms": {"percent": 1.0, "counts": 5}},
        "readings": [
          {"at": "SUM", "to": "OUT", "ohms": 46800},
          {"at": "R2.1", "to": "R2.2", "ohms": 0.4},
          {"at": "U1.2", "to": "GND", "ohms": "OL"},
          {"at": "OUT", "dc": 13.41}
        ]
      }
      """;

  private static String one(String reading) {
    return "{\"format\": \"stagewise-readings\", \"version\": 2, \"readings\": [" + reading + "]}";
  }

  @Test
  void read_designExample_givesOhmsAndVoltsReadings() {
    ReadingSet set = ReadingsSheet.read(EXAMPLE, FILE, STAGE);
    assertThat(set.meter().ohms()).isEqualTo(new OhmsSpec(1.0, 5));
    assertThat(set.readings().get(0)).isEqualTo(Reading.ohms("SUM", "OUT", 46800));
    assertThat(set.readings().get(1)).isEqualTo(Reading.ohms("R2.1", "R2.2", 0.4));
    assertThat(set.readings().get(2).isOverRange()).isTrue();
    assertThat(set.readings().get(3)).isEqualTo(Reading.dc("OUT", 13.41));
  }

  @Test
  void writeThenRead_keepsOhmsOverRangeAndTheSpec() {
    ReadingSet set = ReadingsSheet.read(EXAMPLE, FILE, STAGE);
    String written = ReadingsSheet.write(set);
    assertThat(written).contains("\"version\": 2", "\"ohms\": \"OL\"", "\"to\": \"OUT\"");
    assertThat(written).doesNotContain("Infinity");
    assertThat(ReadingsSheet.read(written, "again", STAGE)).isEqualTo(set);
  }

  @Test
  void versionOneFile_readsAsBeforeAndNoOhmsSpecMeansTheDefault() {
    ReadingSet set = ReadingsSheet.read(ReadingsSheetTest.EXAMPLE, FILE, STAGE);
    assertThat(set.meter()).isEqualTo(MeterSpec.DEFAULT);
    assertThat(set.meter().ohms()).isEqualTo(OhmsSpec.DEFAULT);
    assertThat(set.readings()).allMatch(r -> r.to().isEmpty());
  }

  @Test
  void defaultOhmsSpec_followsTheContract() {
    // ±(0.8 % + 3 counts), 6000 counts: 10 kΩ reads on the 60 kΩ range (10 Ω a count).
    ReadingSet set = new ReadingSet(MeterSpec.DEFAULT, java.util.List.of());
    assertThat(set.uncertainty(Reading.ohms("A", "B", 10e3))).isEqualTo(0.008 * 10e3 + 3 * 10);
    // 100 Ω on the 600 Ω range (0.1 Ω a count).
    assertThat(set.uncertainty(Reading.ohms("A", "B", 100)))
        .isCloseTo(0.8 + 0.3, org.assertj.core.api.Assertions.within(1e-12));
    assertThat(MeterSpec.DEFAULT.ohmsOverRange()).isEqualTo(60e6);
  }

  @ParameterizedTest
  @CsvSource(
      delimiter = '|',
      value = {
        "{\"at\": \"SUM\", \"to\": \"OUT\", \"ohms\": -5}|readings[0].ohms|must be 0 or more",
        "{\"at\": \"SUM\", \"to\": \"X9\", \"ohms\": 100}|readings[0].to|\"X9\" is not a net",
        "{\"at\": \"SUM\", \"to\": \"OUT\", \"ohms\": 100, \"dc\": 1}|readings[0]|one of \"dc\", \"ac\" or \"ohms\"",
        "{\"at\": \"OUT\", \"dc\": \"OL\"}|readings[0].dc|over-range (expected volts here",
        "{\"at\": \"SUM\", \"ohms\": 100}|readings[0]|missing field \"to\"",
        "{\"at\": \"SUM\", \"to\": \"GND\", \"dc\": 1}|readings[0].to|a volts reading has no \"to\"",
        "{\"at\": \"SUM\", \"to\": \"SUM\", \"ohms\": 1}|readings[0].to|same point",
        "{\"at\": \"R2.3\", \"to\": \"SUM\", \"ohms\": 1}|readings[0].at|not a lead of R2",
        // Limits.READING_OHMS: 0 Ω … 1 TΩ, beyond it a meter shows OL.
        "{\"at\": \"SUM\", \"to\": \"OUT\", \"ohms\": 5e13}|readings[0].ohms|beyond any meter",
        "{\"at\": \"SUM\", \"to\": \"OUT\", \"ohms\": \"lots\"}|readings[0].ohms|lots",
      })
  void badOhmsReading_isRefusedNamingFileFieldAndExpectation(
      String reading, String path, String words) {
    String message = badReadings(one(reading)).getMessage();
    assertThat(message).contains(FILE + ": " + path).contains(words);
  }

  @Test
  void ohmsInAVersionOneFile_isRefusedNamingTheKey() {
    String json =
        "{\"format\": \"stagewise-readings\", \"version\": 1, \"readings\": [{\"at\": \"SUM\","
            + " \"to\": \"OUT\", \"ohms\": 100}]}";
    assertThat(badReadings(json).getMessage()).contains("to");
  }

  @Test
  void partLeadInAVersionOneFile_isRefused() {
    String json =
        "{\"format\": \"stagewise-readings\", \"version\": 1, \"readings\": [{\"at\": \"R2.1\","
            + " \"dc\": 1}]}";
    assertThat(badReadings(json).getMessage()).contains("version 2");
  }
}
