package com.stagewise.interchange;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The {@code measure} of an AC amplitude in stage sheets and readings files (DESIGN.md, "Stage
 * sheet" and "Readings"): read, written only when it is not the default, and refused with the file,
 * the JSON path and the three words when it is anything else.
 */
class MeasureSheetsTest {
  private static final String SHEET = StageSheetTest.EXAMPLE;
  private static final String READINGS = ReadingsSheetTest.EXAMPLE;

  private static String inputWith(String measure) {
    return SHEET.replace(
        "{\"net\": \"IN\", \"dc\": 1.0, \"ac\": 0.1, \"hz\": 1000}",
        "{\"net\": \"IN\", \"dc\": 1.0, \"ac\": 0.1, \"hz\": 1000, \"measure\": " + measure + "}");
  }

  private static String acReadingWith(String measure) {
    return READINGS.replace(
        "{\"at\": \"OUT\",  \"ac\": 0.0, \"hz\": 1000}",
        "{\"at\": \"OUT\",  \"ac\": 0.33, \"hz\": 1000, \"measure\": " + measure + "}");
  }

  @ParameterizedTest
  @CsvSource({"rms, RMS", "peak, PEAK", "pp, PP"})
  void stageInput_measure_isReadAndRoundTrips(String word, AcMeasure measure) {
    Stage stage = StageSheet.read(inputWith("\"" + word + "\""), StageSheetTest.FILE);
    assertThat(stage.inputs().get(0).measure()).isEqualTo(measure);
    assertThat(stage.inputs().get(0).ac()).isEqualTo(0.1);
    String written = StageSheet.write(stage);
    assertThat(StageSheet.read(written, "again")).isEqualTo(stage);
    // Peak is the default and is not written, so the sheet stays a version-1 sheet as before.
    assertThat(written.contains("\"measure\"")).isEqualTo(measure != AcMeasure.PEAK);
    assertThat(StageSheet.write(StageSheet.read(written, "again"))).isEqualTo(written);
  }

  @Test
  void versionOneSheets_ofTheDemoLibrary_roundTripByteForByte() throws Exception {
    // Each demo sheet written by this program and read back writes the very same text.
    try (var files = Files.list(Path.of("data", "stages"))) {
      for (Path file : files.sorted().toList()) {
        String once = StageSheet.write(StageSheet.read(file));
        assertThat(StageSheet.write(StageSheet.read(once, file.toString())))
            .as(file.toString())
            .isEqualTo(once)
            .doesNotContain("\"measure\"");
      }
    }
  }

  @ParameterizedTest
  @CsvSource({"rms, RMS", "peak, PEAK", "pp, PP"})
  void acReading_measure_isReadAndRoundTrips(String word, AcMeasure measure) {
    ReadingSet set =
        ReadingsSheet.read(acReadingWith("\"" + word + "\""), ReadingsSheetTest.FILE, stage());
    Reading ac = set.readings().get(3);
    assertThat(ac.measure()).contains(measure);
    String written = ReadingsSheet.write(set);
    assertThat(written).contains("\"measure\": \"" + word + "\"");
    assertThat(ReadingsSheet.read(written, "again", stage())).isEqualTo(set);
    assertThat(ReadingsSheet.write(ReadingsSheet.read(written, "again", stage())))
        .isEqualTo(written);
  }

  @Test
  void versionOneReadings_haveNoMeasure_andRoundTripByteForByte() {
    ReadingSet set = ReadingsSheet.read(READINGS, ReadingsSheetTest.FILE, stage());
    assertThat(set.readings().get(3).measure()).isEmpty();
    String written = ReadingsSheet.write(set);
    assertThat(written).doesNotContain("measure");
    assertThat(ReadingsSheet.write(ReadingsSheet.read(written, "again", stage())))
        .isEqualTo(written);
  }

  @ParameterizedTest
  @EnumSource(AcMeasure.class)
  void readingWithoutMeasure_isInTheMeasureOfTheStagesInput(AcMeasure inputMeasure) {
    // DESIGN.md, Readings: "without it they are in the same measure as the input's ac".
    Stage stage =
        StageSheet.read(inputWith("\"" + inputMeasure.word() + "\""), StageSheetTest.FILE);
    Reading ac = ReadingsSheet.read(READINGS, ReadingsSheetTest.FILE, stage).readings().get(3);
    assertThat(ac.measureIn(stage)).isEqualTo(inputMeasure);
  }

  @Test
  void badMeasureOfAnInput_namesFilePathAndTheWords() {
    InvalidInputException e = StageSheetTest.badSheet(inputWith("\"average\""));
    assertThat(e.field()).isEqualTo("inputs[0].measure");
    assertThat(e.getMessage()).contains("\"rms\", \"peak\" or \"pp\"", "\"average\"");
  }

  @Test
  void measureAsANumber_isRefused() {
    InvalidInputException e = StageSheetTest.badSheet(inputWith("0.707"));
    assertThat(e.field()).isEqualTo("inputs[0].measure");
    assertThat(e.getMessage()).contains("\"rms\", \"peak\" or \"pp\"", "the number 0.707");
  }

  @Test
  void measureOnAnInputWithoutAc_isRefused() {
    InvalidInputException e =
        StageSheetTest.badSheet(
            SHEET.replace(
                "{\"net\": \"IN\", \"dc\": 1.0, \"ac\": 0.1, \"hz\": 1000}",
                "{\"net\": \"IN\", \"dc\": 1.0, \"measure\": \"rms\"}"));
    assertThat(e.field()).isEqualTo("inputs[0].measure");
    assertThat(e.getMessage()).contains("only beside \"ac\"");
  }

  @Test
  void badMeasureOfAReading_namesFilePathAndTheWords() {
    InvalidInputException e = ReadingsSheetTest.badReadings(acReadingWith("\"p-p\""));
    assertThat(e.field()).isEqualTo("readings[3].measure");
    assertThat(e.getMessage()).contains("\"rms\", \"peak\" or \"pp\"", "\"p-p\"");
  }

  @Test
  void measureOnADcReading_isRefused() {
    InvalidInputException e =
        ReadingsSheetTest.badReadings(
            READINGS.replace(
                "{\"at\": \"U1.8\", \"dc\": 14.96}",
                "{\"at\": \"U1.8\", \"dc\": 14.96, \"measure\": \"rms\"}"));
    assertThat(e.field()).isEqualTo("readings[0].measure");
    assertThat(e.getMessage()).contains("only beside \"ac\"");
  }

  private static Stage stage() {
    return ReadingsSheetTest.STAGE;
  }
}
