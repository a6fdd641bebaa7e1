package com.stagewise.interchange;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowable;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ReadingsSheetTest {
  static final String FILE = "bench.readings.json";
  static final Stage STAGE = StageSheet.read(StageSheetTest.EXAMPLE, "left.stage.json");

  /** The readings example of the design notes (the contract). */
  static final String EXAMPLE =
      """
      {
        "format": "stagewise-readings", "version": 1,
        "meter": {"percent": 0.5, "counts": 2, "displayCounts": 6000},
        "readings": [
          {"at": "U1.8", "dc": 14.96},
          {"at": "OUT",  "dc": 13.41},
          {"at": "U1.2", "dc": 0.62},
          {"at": "OUT",  "ac": 0.0, "hz": 1000}
        ]
      }
      """;

  static InvalidInputException badReadings(String json) {
    Throwable thrown = catchThrowable(() -> ReadingsSheet.read(json, FILE, STAGE));
    assertThat(thrown).isInstanceOf(InvalidInputException.class);
    assertThat(thrown.getMessage())
        .startsWith(FILE + ": ")
        .doesNotContain("com.fasterxml", "Exception");
    return (InvalidInputException) thrown;
  }

  @Test
  void read_designExample_givesReadings() {
    ReadingSet set = ReadingsSheet.read(EXAMPLE, FILE, STAGE);
    assertThat(set.meter()).isEqualTo(MeterSpec.DEFAULT);
    assertThat(set.readings()).hasSize(4);
    assertThat(set.readings().get(0)).isEqualTo(Reading.dc("U1.8", 14.96));
    assertThat(set.readings().get(3)).isEqualTo(Reading.ac("OUT", 0.0, 1000));
  }

  @Test
  void writeThenRead_givesEqualReadings() {
    ReadingSet set =
        ReadingsSheet.read(
            EXAMPLE.replace(
                "{\"at\": \"U1.2\", \"dc\": 0.62}",
                "{\"at\": \"U1.2\", \"dc\": 0.62, \"uncertainty\": 0.005}"),
            FILE,
            STAGE);
    String written = ReadingsSheet.write(set);
    assertThat(ReadingsSheet.read(written, "again", STAGE)).isEqualTo(set);
    assertThat(written).contains("\"format\": \"stagewise-readings\"", "\"uncertainty\": 0.005");
  }

  @Test
  void read_noMeterAndAcWithoutHz_takeDefaults() {
    ReadingSet set =
        ReadingsSheet.read(
            "{\"format\": \"stagewise-readings\", \"version\": 1, \"readings\": [{\"at\": \"OUT\", \"ac\": 0.47}]}",
            FILE,
            STAGE);
    assertThat(set.meter()).isEqualTo(MeterSpec.DEFAULT);
    // The stage's only ac input runs at 1 kHz.
    assertThat(set.readings().get(0).hz()).isEqualTo(1000);
  }

  @Test
  void uncertainty_followsTheContract() {
    ReadingSet set = new ReadingSet(MeterSpec.DEFAULT, java.util.List.of());
    // 6000-count meter at ±(0.5 % + 2 counts): 13.41 V sits on the 60 V range (10 mV a count), so
    // 0.067 05 + 0.02 V; 0.62 V on the 6 V range (1 mV a count): 0.0031 + 0.002 V (the readings
    // contract).
    assertThat(set.uncertainty(Reading.dc("OUT", 13.41)))
        .isCloseTo(0.08705, org.assertj.core.data.Offset.offset(1e-12));
    assertThat(set.uncertainty(Reading.dc("OUT", 0.62)))
        .isCloseTo(0.0051, org.assertj.core.data.Offset.offset(1e-12));
    assertThat(set.uncertainty(Reading.dc("OUT", 0.5)))
        .isCloseTo(0.0025 + 0.0002, org.assertj.core.data.Offset.offset(1e-12));
    // Scope: ±(3 % of reading + 1 mV).
    assertThat(set.uncertainty(Reading.ac("OUT", 0.47, 1000)))
        .isCloseTo(0.0151, org.assertj.core.data.Offset.offset(1e-12));
  }

  @Nested
  class BadInput {
    @Test
    void pinThePackageLacks_namesPackageAndPins() {
      InvalidInputException e = badReadings(EXAMPLE.replace("U1.8", "U1.9"));
      assertThat(e.field()).isEqualTo("readings[0].at");
      assertThat(e.getMessage()).contains("dual-8", "no pin 9");
    }

    @Test
    void packageNotOnStage_isRefused() {
      InvalidInputException e = badReadings(EXAMPLE.replace("U1.8", "U7.8"));
      assertThat(e.field()).isEqualTo("readings[0].at");
      assertThat(e.getMessage()).contains("package U7 is not on the stage");
    }

    @Test
    void netNotOnStage_isRefused() {
      InvalidInputException e =
          badReadings(EXAMPLE.replace("\"OUT\",  \"dc\"", "\"OUTPUT\",  \"dc\""));
      assertThat(e.field()).isEqualTo("readings[1].at");
      assertThat(e.getMessage()).contains("OUTPUT", "not a net");
    }

    @Test
    void nan_isRefused() {
      InvalidInputException e = badReadings(EXAMPLE.replace("13.41", "NaN"));
      assertThat(e.field()).isEqualTo("readings[1].dc");
    }

    @ParameterizedTest
    @CsvSource({"13.41, 31.1", "13.41, -40", "0.62, 1341"})
    void farBeyondEveryRail_isRefused(String old, String typo) {
      InvalidInputException e = badReadings(EXAMPLE.replace(old, typo));
      assertThat(e.getMessage()).contains("beyond every rail");
    }

    @Test
    void justWithinTwiceTheRails_isAccepted() {
      // 2 × 15 V + 1 V = 31 V is the limit.
      assertThat(ReadingsSheet.read(EXAMPLE.replace("13.41", "30.9"), FILE, STAGE).readings())
          .hasSize(4);
    }

    @Test
    void bothDcAndAc_isRefused() {
      assertThat(
              badReadings(EXAMPLE.replace("\"dc\": 0.62", "\"dc\": 0.62, \"ac\": 0.1"))
                  .getMessage())
          .contains("either");
    }

    @Test
    void neitherDcNorAc_isRefused() {
      assertThat(badReadings(EXAMPLE.replace(", \"dc\": 0.62", "")).field())
          .isEqualTo("readings[2]");
    }

    @Test
    void unknownKey_namesIt() {
      InvalidInputException e = badReadings(EXAMPLE.replace("\"dc\": 0.62", "\"volts\": 0.62"));
      assertThat(e.field()).isEqualTo("readings[2].volts");
    }

    @Test
    void wrongFormat_isRefused() {
      assertThat(badReadings(EXAMPLE.replace("stagewise-readings", "stagewise-stage")).getMessage())
          .contains("stage file");
    }

    @Test
    void newerVersion_isRefused() {
      assertThat(badReadings(EXAMPLE.replace("\"version\": 1", "\"version\": 3")).getMessage())
          .contains("newer");
    }

    @Test
    void badMeter_isRefused() {
      assertThat(
              badReadings(EXAMPLE.replace("\"displayCounts\": 6000", "\"displayCounts\": 0"))
                  .field())
          .isEqualTo("meter.displayCounts");
      assertThat(badReadings(EXAMPLE.replace("\"percent\": 0.5", "\"percent\": -1")).field())
          .isEqualTo("meter.percent");
    }

    @Test
    void negativeAc_isRefused() {
      assertThat(badReadings(EXAMPLE.replace("\"ac\": 0.0", "\"ac\": -0.1")).field())
          .isEqualTo("readings[3].ac");
    }

    @Test
    void unusedPin_isRefused() {
      // Pins 5, 6 and 7 of a dual-8 belong to section B, which this stage does not use.
      assertThat(badReadings(EXAMPLE.replace("U1.8", "U1.6")).getMessage()).contains("not used");
    }
  }
}
