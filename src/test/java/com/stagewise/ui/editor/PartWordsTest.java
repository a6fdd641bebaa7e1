package com.stagewise.ui.editor;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.PartKind;
import com.stagewise.ui.editor.DraftStage.DraftPart;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The editor's part rows show values in engineering units, whatever was typed: RKM codes read per
 * IEC 60062 (47K and 4k7 are 47 kΩ and 4.7 kΩ, 2u2 is 2.2 µF), zener markings in their usual form
 * (5V1, common practice), a text that is not a value as typed.
 */
class PartWordsTest {
  @ParameterizedTest(name = "{0} {1} shows as {2}")
  @CsvSource(
      delimiter = '|',
      textBlock =
          """
          resistor  | 47K  | R1  47 kΩ  IN – SUM
          resistor  | 4k7  | R1  4.7 kΩ  IN – SUM
          resistor  | 470R | R1  470 Ω  IN – SUM
          capacitor | 2u2  | R1  2.2 µF  IN – SUM
          capacitor | 100n | R1  100 nF  IN – SUM
          zener     | 5V1  | R1  5V1 zener  IN – SUM
          zener     | 12V  | R1  12V zener  IN – SUM
          resistor  | 4x7  | R1  "4x7"  IN – SUM
          resistor  |      | R1  (no value)  IN – SUM
          """)
  void row_showsTheValueInUnits(String kind, String typed, String row) {
    DraftPart part =
        new DraftPart(
            "R1",
            PartKind.valueOf(kind.toUpperCase(java.util.Locale.ROOT)),
            Entry.typed(typed),
            Entry.typed("1%"),
            List.of("IN", "SUM"));
    assertThat(PartWords.row(part)).isEqualTo(row);
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(
      delimiter = '|',
      textBlock =
          """
          diode         | silicon | D1  silicon diode  OUT – RECT
          led           | green   | D1  green LED  OUT – RECT
          """)
  void junction_showsItsClassOrColour(String kind, String choice, String row) {
    DraftPart part =
        new DraftPart(
            "D1",
            PartKind.valueOf(kind.toUpperCase(java.util.Locale.ROOT)),
            Entry.typed(""),
            Entry.typed(""),
            List.of("OUT", "RECT"),
            choice,
            Entry.typed(""),
            false);
    assertThat(PartWords.row(part)).isEqualTo(row);
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource({"trimmer", "potentiometer"})
  void track_showsItsValueAndWiper_withALeadNotWiredYet(String kind) {
    DraftPart part =
        new DraftPart(
            "RV1",
            PartKind.valueOf(kind.toUpperCase(java.util.Locale.ROOT)),
            Entry.typed("10k"),
            Entry.typed("20%"),
            List.of("VCC", "", "VEE"),
            "",
            Entry.typed("0.25"),
            false);
    assertThat(PartWords.row(part)).isEqualTo("RV1  10 kΩ, wiper at 0.25  VCC – ? – VEE");
  }
}
