package com.stagewise.ui.widget;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

class ValuePadModelTest {

  @Test
  void press_rkmCode_readsBackAsValue() {
    // IEC 60062 RKM code: 4k7 is 4.7 kΩ.
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.OHMS);
    for (String key : new String[] {"4", "k", "7"}) {
      pad.press(key);
    }
    assertThat(pad.valueProperty().get()).isEqualTo(4700.0);
    assertThat(pad.readingProperty().get()).isEqualTo("= 4.7\u00a0kΩ");
    assertThat(pad.hintProperty().get()).isEqualTo("A preferred E24 value.");
  }

  @Test
  void hint_offSeriesResistor_namesNearestE24AndE96() {
    // IEC 60063: E24 has 4.7 next to 5.1; E96 has 4.75 and 4.87 around 4.8.
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.OHMS);
    pad.textProperty().set("4k8");
    assertThat(pad.hintProperty().get()).isEqualTo("Nearest E24 value: 4.7 kΩ (E96: 4.75 kΩ)");
  }

  @Test
  void press_backAndClear_editTheEntry() {
    ValuePadModel pad = new ValuePadModel();
    pad.press("1");
    pad.press("2");
    pad.press(ValuePadModel.BACK);
    assertThat(pad.textProperty().get()).isEqualTo("1");
    pad.press(ValuePadModel.CLEAR);
    assertThat(pad.textProperty().get()).isEmpty();
    assertThat(pad.hasValue()).isFalse();
    assertThat(pad.problemProperty().get()).isEmpty();
  }

  @Test
  void press_sign_makesVoltsNegative() {
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.VOLTS);
    pad.press("1");
    pad.press("4");
    pad.press(".");
    pad.press("9");
    pad.press(ValuePadModel.SIGN);
    assertThat(pad.valueProperty().get()).isEqualTo(-14.9);
    pad.press(ValuePadModel.SIGN);
    assertThat(pad.valueProperty().get()).isEqualTo(14.9);
  }

  @Test
  void text_milliVolts_readsAsFractionOfAVolt() {
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.VOLTS);
    pad.textProperty().set("350m");
    assertThat(pad.valueProperty().get()).isEqualTo(0.35);
  }

  @Test
  void text_decimalComma_isRefusedWithExamples() {
    // The suite runs in a decimal-comma locale: the pad must still refuse "4,7".
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.VOLTS);
    pad.textProperty().set("4,7");
    assertThat(pad.hasValue()).isFalse();
    assertThat(pad.problemProperty().get()).startsWith("Not a value yet");
  }

  @Test
  void text_negativePart_isRefused() {
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.FARADS);
    pad.textProperty().set("-100n");
    assertThat(pad.hasValue()).isFalse();
    assertThat(pad.problemProperty().get()).contains("cannot be negative");
  }

  @Test
  void setValue_resistor_writesRkmCode() {
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.OHMS);
    pad.setValue(47_000);
    assertThat(pad.textProperty().get()).isEqualTo("47K");
    assertThat(pad.valueProperty().get()).isEqualTo(47_000.0);
  }

  @Test
  void setValue_capacitor_readsBack() {
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.FARADS);
    pad.setValue(2.2e-6);
    assertThat(pad.valueProperty().get()).isEqualTo(2.2e-6);
  }

  @Test
  void text_beyondAMetersTopRange_isWarnedInThePreview_andKept() {
    // Regression: 1e6 V previewed as "= 1 MV", then refused with developer text after the pad
    // was cleared. 1000 V is the top range of a usual handheld meter (common practice).
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.VOLTS);
    pad.textProperty().set("1e6");
    assertThat(pad.hasValue()).isFalse();
    assertThat(pad.readingProperty().get()).isEmpty();
    assertThat(pad.problemProperty().get())
        .isEqualTo(
            "1\u00a0MV is more than a bench meter reads (up to 1000 V)."
                + " Check the decimal point and the prefix.");
    assertThat(pad.textProperty().get()).isEqualTo("1e6");
    pad.textProperty().set("-1000");
    assertThat(pad.valueProperty().get()).isEqualTo(-1000.0);
    assertThat(pad.readingProperty().get()).isEqualTo("= \u22121\u00a0kV");
  }

  @Test
  void text_implausiblePartValue_isWarned() {
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.FARADS);
    pad.textProperty().set("4700"); // 4700 F: a slipped "u"
    assertThat(pad.hasValue()).isFalse();
    assertThat(pad.problemProperty().get()).contains("more than a capacitor on a board");
  }

  @Test
  void zener_markingTypedOnThePad_readsAsItsVoltage() {
    // The usual zener marking (common practice, e.g. BZX-style parts): 5V1 is 5.1 V, 3V3 is 3.3 V;
    // the pad's V key types the marking's letter.
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.ZENER);
    assertThat(pad.quantityProperty().get().prefixKeys()).containsExactly("V");
    for (String key : new String[] {"5", "V", "1"}) {
      pad.press(key);
    }
    assertThat(pad.valueProperty().get()).isEqualTo(5.1);
    assertThat(pad.readingProperty().get()).endsWith("zener voltage");
    pad.textProperty().set("3.3V");
    assertThat(pad.valueProperty().get()).isEqualTo(3.3);
    pad.setValue(12);
    assertThat(pad.textProperty().get()).isEqualTo("12V");
    pad.textProperty().set("5,1V");
    assertThat(pad.hasValue()).isFalse();
    assertThat(pad.problemProperty().get()).contains("5V1");
    assertThat(pad.textProperty().get()).isEqualTo("5,1V");
  }

  @Test
  void position_isAShareOfTheTravel_andBeyondTheTrackIsRefusedButKept() {
    // DESIGN.md: a trimmer's position is its wiper's share of the way from the first end, 0 to 1.
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.POSITION);
    pad.textProperty().set("0.82");
    assertThat(pad.valueProperty().get()).isEqualTo(0.82);
    assertThat(pad.readingProperty().get()).isEqualTo("= 0.82 of the travel from end 1");
    pad.textProperty().set("1.7");
    assertThat(pad.hasValue()).isFalse();
    assertThat(pad.problemProperty().get()).contains("0 (end 1) to 1 (end 2)");
    assertThat(pad.textProperty().get()).isEqualTo("1.7");
    pad.textProperty().set("-0.1");
    assertThat(pad.hasValue()).isFalse();
    // A position put on the pad from the stage reads as a plain share, as typed.
    pad.setValue(0.3);
    assertThat(pad.textProperty().get()).isEqualTo("0.3");
    assertThat(pad.valueProperty().get()).isEqualTo(0.3);
  }

  @Test
  void meterOhms_kAndMKeys_andOverRange() {
    // An ohmmeter's display: 46.8 kΩ typed as 46k8 (IEC 60062 RKM code); OL is its over-range.
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.METER_OHMS);
    for (String key : new String[] {"4", "6", "k", "8"}) {
      pad.press(key);
    }
    assertThat(pad.valueProperty().get()).isEqualTo(46_800.0);
    assertThat(pad.hintProperty().get()).isEmpty();
    pad.press(ValuePadModel.OVER_RANGE);
    assertThat(pad.textProperty().get()).isEqualTo("OL");
    assertThat(pad.valueProperty().get()).isEqualTo(Double.POSITIVE_INFINITY);
    assertThat(pad.readingProperty().get()).startsWith("= OL");
    // A digit after OL starts a new value.
    pad.press("1");
    pad.press("M");
    pad.press("2");
    assertThat(pad.valueProperty().get()).isEqualTo(1.2e6);
    pad.setValue(Double.POSITIVE_INFINITY);
    assertThat(pad.textProperty().get()).isEqualTo("OL");
  }

  @Test
  void meterOhms_negativeIsRefusedInWords_andOlMeansNothingForVolts() {
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.METER_OHMS);
    pad.textProperty().set("-5");
    assertThat(pad.hasValue()).isFalse();
    assertThat(pad.problemProperty().get()).contains("cannot be negative");
    ValuePadModel volts = new ValuePadModel(ValuePadModel.Quantity.VOLTS);
    volts.textProperty().set("OL");
    assertThat(volts.hasValue()).isFalse();
  }

  @Test
  void unsignedVolts_signKeyDoesNothing_andAMinusTypedIsRefusedKeepingTheText() {
    // An AC amplitude (RMS, peak or peak-to-peak) is a magnitude: never negative.
    ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.VOLTS);
    pad.unsignedProperty().set(ValuePadModel.AC_AMPLITUDE);
    pad.press("0");
    pad.press(".");
    pad.press("3");
    pad.press(ValuePadModel.SIGN);
    assertThat(pad.textProperty().get()).isEqualTo("0.3");
    assertThat(pad.valueProperty().get()).isEqualTo(0.3);

    pad.textProperty().set("-0.33");

    assertThat(pad.valueProperty().get()).isNull();
    assertThat(pad.refusedNegative()).hasValue(-0.33);
    assertThat(pad.problemProperty().get())
        .isEqualTo(
            "An AC amplitude (RMS, peak or peak-to-peak) cannot be negative: type it without the"
                + " minus sign.");
    assertThat(pad.textProperty().get()).isEqualTo("-0.33");

    // Back to DC volts: the same entry is a value and the sign key works.
    pad.unsignedProperty().set("");
    assertThat(pad.valueProperty().get()).isEqualTo(-0.33);
    assertThat(pad.refusedNegative()).isEmpty();
    pad.press(ValuePadModel.SIGN);
    assertThat(pad.valueProperty().get()).isEqualTo(0.33);
  }
}
