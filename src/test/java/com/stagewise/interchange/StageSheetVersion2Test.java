package com.stagewise.interchange;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.LedColour;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Stage sheet version 2 (DESIGN.md "Stage sheet"): diodes, zeners, LEDs, trimmers. */
class StageSheetVersion2Test {
  static final String FILE = "rect.stage.json";

  /** The design notes' version 2 part examples, in a stage of our own. */
  static final String SHEET =
      """
      {
        "format": "stagewise-stage", "version": 2,
        "title": "Rectifier with reference",
        "rails": [ {"net": "VCC", "volts": 15}, {"net": "VEE", "volts": -15} ],
        "inputs": [ {"net": "IN", "dc": 1.0} ],
        "parts": [
          {"ref": "R1", "kind": "resistor", "value": "10k", "nets": ["IN", "SUM"]},
          {"ref": "R2", "kind": "resistor", "value": "10k", "nets": ["SUM", "RECT"]},
          {"ref": "D1",  "kind": "diode",  "class": "silicon", "nets": ["OUT", "RECT"]},
          {"ref": "D2",  "kind": "led",    "colour": "red",    "nets": ["LED", "GND"]},
          {"ref": "R3", "kind": "resistor", "value": "1k", "nets": ["OUT", "LED"]},
          {"ref": "ZD1", "kind": "zener",  "value": "5V1", "tolerance": "5%", "nets": ["GND", "REF"]},
          {"ref": "R4", "kind": "resistor", "value": "2k2", "nets": ["VCC", "REF"]},
          {"ref": "RV1", "kind": "trimmer", "value": "10k", "tolerance": "20%", "position": 0.5,
           "nets": ["REF", "FB", "GND"]},
          {"ref": "R5", "kind": "resistor", "value": "100k", "nets": ["FB", "SUM"]}
        ],
        "amplifiers": [
          {"ref": "U1A", "package": "U1", "packageType": "dual-8", "section": "A",
           "class": "classic-bipolar",
           "inPlus": "GND", "inMinus": "SUM", "out": "OUT", "vPlus": "VCC", "vMinus": "VEE"}
        ]
      }
      """;

  static String replaced(String from, String to) {
    String json = SHEET.replace(from, to);
    assertThat(json).isNotEqualTo(SHEET);
    return json;
  }

  static String badSheet(String json) {
    Throwable thrown =
        org.assertj.core.api.Assertions.catchThrowable(() -> StageSheet.read(json, FILE));
    assertThat(thrown).isInstanceOf(InvalidInputException.class);
    assertThat(thrown.getMessage())
        .startsWith(FILE + ": ")
        .doesNotContain("com.fasterxml", "Exception");
    return thrown.getMessage();
  }

  @Test
  void read_designExamples_giveTheParts() {
    Stage stage = StageSheet.read(SHEET, FILE);
    Part d1 = stage.part("D1").orElseThrow();
    assertThat(d1.kind()).isEqualTo(PartKind.DIODE);
    assertThat(d1.anode()).isEqualTo("OUT");
    assertThat(d1.cathode()).isEqualTo("RECT");
    assertThat(d1.diodeClass()).isEqualTo(DiodeClass.SILICON);
    Part d2 = stage.part("D2").orElseThrow();
    assertThat(d2.colour()).isEqualTo(LedColour.RED);
    Part zd1 = stage.part("ZD1").orElseThrow();
    assertThat(zd1.value()).isEqualTo(5.1);
    assertThat(zd1.tolerance()).isEqualTo(0.05);
    Part rv1 = stage.part("RV1").orElseThrow();
    assertThat(rv1.nets()).containsExactly("REF", "FB", "GND");
    assertThat(rv1.wiper()).isEqualTo("FB");
    assertThat(rv1.position()).isEqualTo(0.5);
    assertThat(rv1.sealed()).isFalse();
    assertThat(stage.nets()).contains("FB", "LED", "REF", "RECT");
  }

  @Test
  void writeAndRead_version2_roundTripsAndIsVersion2() {
    Stage stage =
        StageSheet.read(
            replaced("\"position\": 0.5,", "\"position\": 0.82, \"sealed\": true,"), FILE);
    String written = StageSheet.write(stage);
    assertThat(written).contains("\"version\": 2").contains("\"5V1\"").contains("\"sealed\": true");
    assertThat(StageSheet.read(written, FILE)).isEqualTo(stage);
  }

  @Test
  void write_version1Parts_staysVersion1() {
    Stage stage = StageSheet.read(StageSheetTest.EXAMPLE, StageSheetTest.FILE);
    assertThat(StageSheet.write(stage)).contains("\"version\": 1");
  }

  @Test
  void read_trimmerWithoutPosition_sitsMidTravel() {
    Stage stage = StageSheet.read(replaced("\"position\": 0.5,", ""), FILE);
    assertThat(stage.part("RV1").orElseThrow().position()).isEqualTo(0.5);
  }

  @Test
  void read_potentiometer_isATrimmerToo() {
    Stage stage =
        StageSheet.read(replaced("\"kind\": \"trimmer\"", "\"kind\": \"potentiometer\""), FILE);
    assertThat(stage.part("RV1").orElseThrow().kind().isTrimmer()).isTrue();
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(
      delimiter = '|',
      textBlock =
          """
          zener without a voltage | "value": "5V1", | | parts[5].value | 5V1
          LED without a colour | "colour": "red", | | parts[3].colour | red, orange
          trimmer position 1.7 | "position": 0.5 | "position": 1.7 | parts[7] | between 0 and 1
          trimmer sealed not a boolean | "position": 0.5, | "position": 0.5, "sealed": "yes", | parts[7].sealed | expected true or false, found the string "yes"
          trimmer with two nets | ["REF", "FB", "GND"] | ["REF", "GND"] | parts[7].nets | [end, wiper, end]
          diode with one net | ["OUT", "RECT"] | ["OUT"] | parts[2].nets | [anode, cathode]
          zener marking unreadable | "5V1" | "5X1" | parts[5].value | 5V1
          LED colour unknown | "red" | "purple" | parts[3].colour | purple
          diode class unknown | "silicon" | "germanium" | parts[2].class | silicon or schottky
          class on a resistor | "kind": "resistor", "value": "1k" | "kind": "resistor", "class": "silicon", "value": "1k" | parts[4].class | remove it
          value on a diode | "class": "silicon", | "class": "silicon", "value": "1k", | parts[2].value | no value
          new kind in a version-1 sheet | "version": 2 | "version": 1 | parts[2].kind | version 2
          """)
  void read_badVersion2Parts_nameFieldAndExpectation(
      String what, String from, String to, String field, String expected) {
    String message = badSheet(replaced(from, to == null ? "" : to));
    assertThat(message).contains(field).contains(expected);
  }
}
