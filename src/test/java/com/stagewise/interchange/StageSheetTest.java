package com.stagewise.interchange;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class StageSheetTest {
  static final String FILE = "left.stage.json";

  /** The stage sheet example of the design notes (the contract), with its own values. */
  static final String EXAMPLE =
      """
      {
        "format": "stagewise-stage", "version": 1,
        "title": "Input buffer, left channel",
        "board": "Example main board",
        "ground": "GND",
        "rails": [ {"net": "VCC", "volts": 15, "tolerance": "5%"},
                   {"net": "VEE", "volts": -15, "tolerance": "5%"} ],
        "inputs": [ {"net": "IN", "dc": 1.0, "ac": 0.1, "hz": 1000} ],
        "parts": [
          {"ref": "R1", "kind": "resistor",  "value": "10k",  "tolerance": "1%",  "nets": ["IN", "SUM"]},
          {"ref": "R2", "kind": "resistor",  "value": "47k",  "tolerance": "1%",  "nets": ["SUM", "OUT"]},
          {"ref": "C1", "kind": "capacitor", "value": "100n", "tolerance": "10%", "nets": ["SUM", "OUT"]}
        ],
        "amplifiers": [
          {"ref": "U1A", "package": "U1", "packageType": "dual-8", "section": "A",
           "class": "classic-bipolar",
           "inPlus": "GND", "inMinus": "SUM", "out": "OUT", "vPlus": "VCC", "vMinus": "VEE"}
        ]
      }
      """;

  static InvalidInputException badSheet(String json) {
    Throwable thrown =
        org.assertj.core.api.Assertions.catchThrowable(() -> StageSheet.read(json, FILE));
    assertThat(thrown).isInstanceOf(InvalidInputException.class);
    assertThat(thrown.getMessage())
        .startsWith(FILE + ": ")
        .doesNotContain("com.fasterxml", "Exception");
    return (InvalidInputException) thrown;
  }

  @Test
  void read_designExample_givesTheStage() {
    Stage stage = StageSheet.read(EXAMPLE, FILE);
    assertThat(stage.title()).isEqualTo("Input buffer, left channel");
    assertThat(stage.rails()).hasSize(2);
    assertThat(stage.rails().get(1).volts()).isEqualTo(-15);
    assertThat(stage.rails().get(1).tolerance()).isEqualTo(0.05);
    assertThat(stage.inputs().get(0).ac()).isEqualTo(0.1);
    assertThat(stage.parts().get(1).value()).isEqualTo(47_000);
    assertThat(stage.parts().get(2).kind()).isEqualTo(PartKind.CAPACITOR);
    assertThat(stage.parts().get(2).value()).isEqualTo(100e-9);
    assertThat(stage.amplifiers().get(0).packageType()).isEqualTo(PackageType.DUAL_8);
    assertThat(stage.amplifiers().get(0).deviceClass()).isEqualTo(DeviceClass.CLASSIC_BIPOLAR);
  }

  @Test
  void writeThenRead_designExample_givesEqualStage() {
    Stage stage = StageSheet.read(EXAMPLE, FILE);
    String written = StageSheet.write(stage);
    assertThat(StageSheet.read(written, "again.stage.json")).isEqualTo(stage);
    assertThat(StageSheet.write(StageSheet.read(written, "again.stage.json"))).isEqualTo(written);
  }

  @Test
  void write_values_areInRkmForPeople() {
    String written =
        StageSheet.write(StageSheet.read(EXAMPLE.replace("\"10k\"", "\"4700\""), FILE));
    assertThat(written)
        .contains(
            "\"value\": \"4k7\"",
            "\"value\": \"47k\"",
            "\"value\": \"100n\"",
            "\"tolerance\": \"1%\"")
        .contains("\"volts\": 15,", "\"volts\": -15,", "\"hz\": 1000")
        .contains("\"format\": \"stagewise-stage\"", "\"version\": 1");
  }

  @Test
  void writeToFileThenRead_givesEqualStage(@TempDir Path dir) {
    Stage stage = StageSheet.read(EXAMPLE, FILE);
    Path file = dir.resolve("x.stage.json");
    StageSheet.write(stage, file);
    assertThat(StageSheet.read(file)).isEqualTo(stage);
  }

  @Test
  void read_plainNumbersAndFractions_areAccepted() {
    Stage stage =
        StageSheet.read(
            EXAMPLE
                .replace("\"10k\"", "10000")
                .replace("\"tolerance\": \"1%\"", "\"tolerance\": 0.01"),
            FILE);
    assertThat(stage.parts().get(0).value()).isEqualTo(10_000);
    assertThat(stage.parts().get(0).tolerance()).isEqualTo(0.01);
  }

  @Nested
  class BadInput {
    @Test
    void unknownKey_namesTheKeyAndPath() {
      InvalidInputException e =
          badSheet(
              EXAMPLE.replace(
                  "\"kind\": \"resistor\",  \"value\": \"47k\"",
                  "\"kind\": \"resistor\",  \"valeu\": \"47k\""));
      assertThat(e.field()).isEqualTo("parts[1].valeu");
      assertThat(e.getMessage()).contains("unknown key \"valeu\"", "value");
    }

    @Test
    void unknownTopLevelKey_namesTheKey() {
      assertThat(
              badSheet(
                      EXAMPLE.replace(
                          "\"ground\": \"GND\",", "\"ground\": \"GND\", \"notes\": \"x\","))
                  .getMessage())
          .contains("notes", "unknown key");
    }

    @Test
    void missingField_namesTheField() {
      InvalidInputException e = badSheet(EXAMPLE.replace("\"value\": \"100n\", ", ""));
      assertThat(e.field()).isEqualTo("parts[2].value");
      assertThat(e.getMessage()).contains("missing field \"value\"", "farads");
    }

    @Test
    void missingAmplifierTerminal_namesIt() {
      InvalidInputException e = badSheet(EXAMPLE.replace("\"out\": \"OUT\", ", ""));
      assertThat(e.field()).isEqualTo("amplifiers[0].out");
    }

    @Test
    void wrongType_saysWhatWasFound() {
      InvalidInputException e = badSheet(EXAMPLE.replace("\"volts\": 15", "\"volts\": true"));
      assertThat(e.field()).isEqualTo("rails[0].volts");
      assertThat(e.getMessage()).contains("found true");
      assertThat(
              badSheet(
                      EXAMPLE
                          .replace("\"parts\": [", "\"parts\": {\"a\": [")
                          .replace("]}\n  ],", "]}\n  ]},"))
                  .getMessage())
          .contains("parts");
    }

    @Test
    void badValue_namesPathAndExpectation() {
      InvalidInputException e = badSheet(EXAMPLE.replace("\"47k\"", "\"47q\""));
      assertThat(e.getMessage())
          .startsWith(FILE + ": parts[1].value: value \"47q\" is not a number")
          .contains("4k7");
    }

    @Test
    void negativeValue_isRefused() {
      InvalidInputException e = badSheet(EXAMPLE.replace("\"47k\"", "\"-47k\""));
      assertThat(e.field()).isEqualTo("parts[1].value");
      assertThat(e.getMessage()).contains("negative");
    }

    @ParameterizedTest
    @CsvSource(
        delimiter = '|',
        value = {
          "\"101%\"|parts[0].tolerance",
          "-0.1|parts[0].tolerance",
          "\"x%\"|parts[0].tolerance"
        })
    void badTolerance_isRefused(String tolerance, String path) {
      assertThat(badSheet(EXAMPLE.replaceFirst("\"1%\"", tolerance)).field()).isEqualTo(path);
    }

    @Test
    void wrongFormat_saysWhatItIs() {
      assertThat(badSheet(EXAMPLE.replace("stagewise-stage", "stagewise-readings")).getMessage())
          .contains("format", "readings", "expected \"stagewise-stage\"");
    }

    @Test
    void newerVersion_saysItIsNewer() {
      InvalidInputException e = badSheet(EXAMPLE.replace("\"version\": 1", "\"version\": 3"));
      assertThat(e.field()).isEqualTo("version");
      assertThat(e.getMessage()).contains("newer");
    }

    @Test
    void missingFormat_isRefused() {
      assertThat(badSheet(EXAMPLE.replace("\"format\": \"stagewise-stage\",", "")).field())
          .isEqualTo("format");
    }

    @Test
    void amplifierTerminalOnNoNet_namesTheTerminal() {
      InvalidInputException e =
          badSheet(EXAMPLE.replace("\"inMinus\": \"SUM\"", "\"inMinus\": \"SUMM\""));
      assertThat(e.field()).isEqualTo("amplifiers[0].inMinus");
      assertThat(e.getMessage()).contains("SUMM", "inverting input");
    }

    @Test
    void duplicateDesignator_isRefused() {
      InvalidInputException e = badSheet(EXAMPLE.replace("\"ref\": \"C1\"", "\"ref\": \"R2\""));
      assertThat(e.field()).isEqualTo("parts[2].ref");
      assertThat(e.getMessage()).contains("R2", "twice");
    }

    @Test
    void twoSectionsOnTheSamePins_isRefused() {
      String second =
          "\"vMinus\": \"VEE\"},\n {\"ref\": \"U1B\", \"package\": \"U1\", \"packageType\": \"dual-8\","
              + " \"section\": \"A\", \"class\": \"classic-bipolar\", \"inPlus\": \"GND\", \"inMinus\": \"OUT\","
              + " \"out\": \"OUT\", \"vPlus\": \"VCC\", \"vMinus\": \"VEE\"}";
      InvalidInputException e = badSheet(EXAMPLE.replace("\"vMinus\": \"VEE\"}", second));
      assertThat(e.field()).isEqualTo("amplifiers[1].section");
      assertThat(e.getMessage()).contains("U1B", "section A");
    }

    @Test
    void groundTouchingNothing_isRefused() {
      InvalidInputException e =
          badSheet(EXAMPLE.replace("\"inPlus\": \"GND\"", "\"inPlus\": \"VEE\""));
      assertThat(e.field()).isEqualTo("ground");
    }

    @Test
    void netWithNoDcPath_isRefused() {
      // R1 replaced by a capacitor: SUM is then reached only through capacitors and an op-amp
      // input.
      InvalidInputException e =
          badSheet(
              EXAMPLE
                  .replace(
                      "\"ref\": \"R1\", \"kind\": \"resistor\",  \"value\": \"10k\"",
                      "\"ref\": \"C2\", \"kind\": \"capacitor\",  \"value\": \"10n\"")
                  .replace(
                      "\"ref\": \"R2\", \"kind\": \"resistor\",  \"value\": \"47k\"",
                      "\"ref\": \"C3\", \"kind\": \"capacitor\",  \"value\": \"10n\""));
      assertThat(e.getMessage()).contains("SUM", "no DC path");
    }

    @Test
    void unknownPackageType_namesTheField() {
      InvalidInputException e = badSheet(EXAMPLE.replace("\"dual-8\"", "\"dual-14\""));
      assertThat(e.field()).isEqualTo("amplifiers[0].packageType");
      assertThat(e.getMessage()).contains("single-8, dual-8 or quad-14");
    }

    @Test
    void sectionNotOnPackage_namesTheField() {
      InvalidInputException e =
          badSheet(EXAMPLE.replace("\"section\": \"A\"", "\"section\": \"C\""));
      assertThat(e.field()).isEqualTo("amplifiers[0].section");
    }

    @Test
    void acWithoutHz_isRefused() {
      assertThat(badSheet(EXAMPLE.replace(", \"hz\": 1000", "")).getMessage()).contains("hz");
    }

    @Test
    void partWithOneNet_isRefused() {
      InvalidInputException e =
          badSheet(EXAMPLE.replace("\"nets\": [\"IN\", \"SUM\"]", "\"nets\": [\"IN\"]"));
      assertThat(e.field()).isEqualTo("parts[0].nets");
      assertThat(e.getMessage()).contains("two net names");
    }

    @Test
    void brokenJson_saysWhereWithoutParserText() {
      InvalidInputException e =
          badSheet(
              EXAMPLE.replace("\"title\": \"Input buffer, left channel\",", "\"title\": \"x\""));
      assertThat(e.getMessage())
          .contains("not valid JSON", "line")
          .doesNotContain("Unexpected character", "code 34");
    }

    @Test
    void truncatedJson_saysItEndsEarly() {
      assertThat(badSheet(EXAMPLE.substring(0, 200)).getMessage()).contains("ends too early");
    }

    @Test
    void duplicateKey_namesTheKey() {
      assertThat(
              badSheet(EXAMPLE.replace("\"title\":", "\"board\": \"a\", \"board\":")).getMessage())
          .contains("\"board\" appears twice");
    }

    @Test
    void emptyText_saysEmpty() {
      assertThat(badSheet("  ").getMessage()).contains("empty");
    }

    @Test
    void topIsAnArray_isRefused() {
      assertThat(badSheet("[1, 2]").getMessage()).contains("JSON object");
    }

    @Test
    void nanVolts_isRefused() {
      assertThat(badSheet(EXAMPLE.replace("\"volts\": 15", "\"volts\": NaN")).field())
          .isEqualTo("rails[0].volts");
    }

    @Test
    void missingFile_namesTheFile(@TempDir Path dir) {
      Path missing = dir.resolve("none.stage.json");
      assertThatThrownBy(() -> StageSheet.read(missing))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("none.stage.json")
          .hasMessageContaining("no such file");
    }

    @Test
    void notUtf8_isRefused(@TempDir Path dir) throws Exception {
      Path file = dir.resolve("latin.stage.json");
      Files.write(file, new byte[] {'{', (byte) 0xE9, '}'});
      assertThatThrownBy(() -> StageSheet.read(file)).isInstanceOf(InvalidInputException.class);
    }
  }
}
