package com.stagewise.ui.stage;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.interchange.StageSheet;
import com.stagewise.ui.Step;
import com.stagewise.ui.TestBench;
import com.stagewise.ui.widget.ValuePadModel;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The stage screen's model on a stage with a diode, a zener, an LED and a trimmer (stage sheet
 * version 2, DESIGN.md): the list names classes, markings and leads; the pad takes a zener's
 * marking and a trimmer's wiper position; a diode has no value to type.
 */
class NewPartsStageTest {
  // Invented stage: a buffer whose input is set by a trimmer, with a zener, a diode and an LED.
  private static final String SHEET =
      """
      {"format": "stagewise-stage", "version": 2, "title": "Set-point with lamp", "board": "B",
       "ground": "GND",
       "rails": [{"net": "VCC", "volts": 15, "tolerance": "5%"},
                 {"net": "VEE", "volts": -15, "tolerance": "5%"}],
       "parts": [
         {"ref": "R1", "kind": "resistor", "value": "10k", "tolerance": "1%", "nets": ["VCC", "REF"]},
         {"ref": "ZD1", "kind": "zener", "value": "5V1", "tolerance": "5%", "nets": ["GND", "REF"]},
         {"ref": "RV1", "kind": "trimmer", "value": "10k", "tolerance": "20%", "position": 0.5,
          "nets": ["REF", "SET", "GND"]},
         {"ref": "D1", "kind": "diode", "class": "silicon", "nets": ["OUT", "LAMP"]},
         {"ref": "LED1", "kind": "led", "colour": "green", "nets": ["LAMP", "GND"]},
         {"ref": "R2", "kind": "resistor", "value": "1k", "tolerance": "5%", "nets": ["LAMP", "GND"]}
       ],
       "amplifiers": [{"ref": "U1A", "package": "U1", "packageType": "dual-8", "section": "A",
         "class": "classic-bipolar", "inPlus": "SET", "inMinus": "OUT", "out": "OUT",
         "vPlus": "VCC", "vMinus": "VEE"}]}
      """;

  @TempDir Path temp;
  private TestBench t;
  private StageViewModel model;

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    var board = t.store.units().boardModel("B", "");
    var unit = t.store.units().add("B-1", board.id(), "");
    t.bench.showUnit(unit, board);
    t.bench.startCase(t.store.cases().open(unit.id(), "Lamp stays dark"));
    t.bench.go(Step.STAGE);
    model = new StageViewModel(t.bench);
    model.choose(StageSheet.read(SHEET, "set-point.stage.json"));
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  private PartRow row(String ref) {
    return model.parts().stream().filter(r -> r.part().ref().equals(ref)).findFirst().orElseThrow();
  }

  @Test
  void list_namesClassesMarkingsAndLeads() {
    assertThat(row("ZD1").line()).contains("5V1 zener").contains("anode GND – cathode REF");
    assertThat(row("D1").line()).contains("silicon diode").contains("anode OUT – cathode LAMP");
    assertThat(row("LED1").line()).contains("green LED").doesNotContain("±");
    assertThat(row("RV1").line()).contains("10 kΩ, wiper at 0.5").contains("REF – wiper SET – GND");
  }

  @Test
  void wiper_setOnThePad_movesTheWiperAndTheBufferFollowsIt() {
    model.selectedPartProperty().set(row("RV1"));
    model.wiperProperty().set(true);
    assertThat(model.pad().quantityProperty().get()).isEqualTo(ValuePadModel.Quantity.POSITION);
    assertThat(model.pad().textProperty().get()).isEqualTo("0.5");
    double before = model.expectedProperty().get().at("OUT");
    model.pad().textProperty().set("0.25");
    model.applyValue();
    assertThat(model.stageProperty().get().part("RV1").orElseThrow().position()).isEqualTo(0.25);
    // A divider from REF: the wiper at 0.25 of the way from REF to GND leaves 0.75 of REF
    // (voltage divider rule; the follower's input draws next to nothing).
    double after = model.expectedProperty().get().at("OUT");
    assertThat(after / before).isCloseTo(0.75 / 0.5, org.assertj.core.data.Offset.offset(1e-3));
    // The pad stays on the wiper of the same trimmer after the edit.
    assertThat(model.wiperProperty().get()).isTrue();
    assertThat(model.pad().textProperty().get()).isEqualTo("0.25");
  }

  @Test
  void zener_markingOnThePad_changesItsVoltage() {
    model.selectedPartProperty().set(row("ZD1"));
    assertThat(model.pad().quantityProperty().get()).isEqualTo(ValuePadModel.Quantity.ZENER);
    assertThat(model.pad().textProperty().get()).isEqualTo("5V1");
    model.pad().textProperty().set("6V2");
    model.applyValue();
    assertThat(model.stageProperty().get().part("ZD1").orElseThrow().value()).isEqualTo(6.2);
  }

  @Test
  void diode_hasNoValueToType_andStaysAsItWas() {
    model.selectedPartProperty().set(row("D1"));
    model.pad().textProperty().set("1k");
    model.applyValue();
    assertThat(t.problems).isNotEmpty();
    assertThat(model.stageProperty().get().part("D1").orElseThrow().diodeClass().word())
        .isEqualTo("silicon");
  }
}
