package com.stagewise.circuit.value;

import static com.stagewise.circuit.value.Colour.BLACK;
import static com.stagewise.circuit.value.Colour.BROWN;
import static com.stagewise.circuit.value.Colour.GOLD;
import static com.stagewise.circuit.value.Colour.GREEN;
import static com.stagewise.circuit.value.Colour.NONE;
import static com.stagewise.circuit.value.Colour.RED;
import static com.stagewise.circuit.value.Colour.SILVER;
import static com.stagewise.circuit.value.Colour.VIOLET;
import static com.stagewise.circuit.value.Colour.WHITE;
import static com.stagewise.circuit.value.Colour.YELLOW;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertEquals;

import com.stagewise.circuit.InvalidInputException;
import java.util.List;
import java.util.OptionalInt;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.NullAndEmptySource;
import org.junit.jupiter.params.provider.ValueSource;

class ColourCodeTest {

  @Nested
  class Decode {
    // Worked examples of the IEC 60062 colour code (from memory of the standard and of the usual
    // textbook examples: yellow violet red gold is 4.7 kΩ ±5 %).
    @ParameterizedTest
    @CsvSource({
      "yellow violet red gold, 4700, 0.05",
      "brown black black red brown, 10000, 0.01",
      "brown black orange gold, 10000, 0.05",
      "red red brown, 220, 0.20",
      "orange orange black brown, 33, 0.01",
      "green blue gold gold, 5.6, 0.05",
      "yellow violet silver silver, 0.47, 0.10",
      "brown black pink red, 0.01, 0.02",
      "orange orange red black brown, 332, 0.01",
      "blue grey black brown green, 6800, 0.005",
      "yellow white white brown brown, 4990, 0.01",
      "brown black red none, 1000, 0.20",
      "brown black white gold, 1e10, 0.05",
      "brown green black gold blue, 15, 0.0025"
    })
    void decode_fourAndFiveBands(String bands, double ohms, double tolerance) {
      assertEquals(new BandedValue(ohms, tolerance, OptionalInt.empty()), ColourCode.decode(bands));
    }

    // IEC 60062:2016 six-band resistors: the sixth band is the temperature coefficient (from
    // memory).
    @ParameterizedTest
    @CsvSource({
      "brown black black red brown brown, 10000, 0.01, 100",
      "yellow violet black brown brown red, 4700, 0.01, 50",
      "red red black black brown black, 220, 0.01, 250"
    })
    void decode_sixBands(String bands, double ohms, double tolerance, int ppm) {
      assertEquals(new BandedValue(ohms, tolerance, OptionalInt.of(ppm)), ColourCode.decode(bands));
    }

    // IEC 60062:2016 tolerance letters and colours (from memory; orange, yellow and grey were
    // given these tolerances in the 2016 edition).
    @ParameterizedTest
    @CsvSource({
      "brown, 0.01",
      "red, 0.02",
      "orange, 0.0005",
      "yellow, 0.0002",
      "green, 0.005",
      "blue, 0.0025",
      "violet, 0.001",
      "grey, 0.0001",
      "gold, 0.05",
      "silver, 0.10",
      "none, 0.20"
    })
    void decode_everyToleranceColour(String colour, double tolerance) {
      assertEquals(tolerance, ColourCode.decode("brown black black " + colour).tolerance());
    }

    // IEC 60062 multipliers: black 1 to white 10^9, gold 0.1, silver 0.01, pink 0.001 (pink added
    // in the 2016 edition; from memory).
    @ParameterizedTest
    @CsvSource({
      "black, 10", "brown, 100", "red, 1e3", "orange, 1e4", "yellow, 1e5", "green, 1e6",
      "blue, 1e7", "violet, 1e8", "grey, 1e9", "white, 1e10", "gold, 1", "silver, 0.1",
      "pink, 0.01"
    })
    void decode_everyMultiplierColour(String colour, double ohms) {
      assertEquals(ohms, ColourCode.decode("brown black " + colour + " gold").ohms());
    }

    // IEC 60062:2016 temperature coefficients in ppm/K (from memory).
    @ParameterizedTest
    @CsvSource({
      "black, 250",
      "brown, 100",
      "red, 50",
      "orange, 15",
      "yellow, 25",
      "green, 20",
      "blue, 10",
      "violet, 5",
      "grey, 1"
    })
    void decode_everyTempcoColour(String colour, int ppm) {
      assertEquals(
          OptionalInt.of(ppm),
          ColourCode.decode("brown black black red brown " + colour).ppmPerKelvin());
    }

    @Test
    void decode_acceptsSpellingsCaseAndSeparators() {
      BandedValue expected = new BandedValue(4700, 0.05, OptionalInt.empty());
      assertEquals(expected, ColourCode.decode("yellow purple red gold"));
      assertEquals(expected, ColourCode.decode("YELLOW Violet RED gOLD"));
      assertEquals(expected, ColourCode.decode("yellow-violet-red-gold"));
      assertEquals(expected, ColourCode.decode("yellow, violet, red, gold"));
      assertEquals(expected, ColourCode.decode(List.of("yellow", " violet ", "red", "gold")));
      assertEquals(ColourCode.decode("grey red red gold"), ColourCode.decode("gray red red gold"));
      assertEquals(8200, ColourCode.decode("gray red red gold").ohms());
    }
  }

  @Nested
  class DecodeErrors {
    @ParameterizedTest
    @NullAndEmptySource
    @ValueSource(strings = {"brown black", "brown", "brown black black red brown brown red"})
    void wrongNumberOfBands_saysHowManyWereGiven(String text) {
      assertThatThrownBy(() -> ColourCode.decode(text))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageStartingWith("a colour code has 3 to 6 bands, but ");
    }

    @Test
    void wrongNumberOfBands_listsThem() {
      assertThatThrownBy(() -> ColourCode.decode("brown black"))
          .hasMessage("a colour code has 3 to 6 bands, but 2 were given (brown black)");
    }

    @Test
    void unknownColour_namesPositionAndColour() {
      assertThatThrownBy(() -> ColourCode.decode("brown black magenta gold"))
          .isInstanceOf(InvalidInputException.class)
          .hasMessage(
              "band 3 (\"magenta\") is not a band colour; expected one of black, brown, red,"
                  + " orange, yellow, green, blue, violet, grey, white, gold, silver, pink, none");
    }

    @Test
    void goldFirst_suggestsReadingFromTheOtherEnd() {
      assertThatThrownBy(() -> ColourCode.decode("gold red violet yellow"))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageStartingWith("band 1 (\"gold\") cannot be a digit; expected one of black,")
          .hasMessageEndingWith("read from the other end");
    }

    @ParameterizedTest
    @CsvSource({
      "'brown pink black gold', 'band 2 (\"pink\") cannot be a digit'",
      "'brown black none gold', 'band 3 (\"none\") cannot be a multiplier'",
      "'brown black red white', 'band 4 (\"white\") cannot be a tolerance'",
      "'brown black black red pink', 'band 5 (\"pink\") cannot be a tolerance'",
      "'brown black black red brown gold', 'band 6 (\"gold\") cannot be a temperature coefficient'",
      "'brown black black none brown', 'band 4 (\"none\") cannot be a multiplier'",
      "'brown silver red gold', 'band 2 (\"silver\") cannot be a digit'"
    })
    void colourInTheWrongPlace_namesPositionAndColour(String bands, String start) {
      assertThatThrownBy(() -> ColourCode.decode(bands))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageStartingWith(start + "; expected one of ");
    }

    @Test
    void toleranceError_listsTheToleranceColours() {
      assertThatThrownBy(() -> ColourCode.decode("brown black red white"))
          .hasMessage(
              "band 4 (\"white\") cannot be a tolerance; expected one of brown, red, orange,"
                  + " yellow, green, blue, violet, grey, gold, silver, none");
    }
  }

  @Nested
  class Encode {
    @Test
    void encode_textbookExamples() {
      // IEC 60062 worked examples (from memory), as in Decode above.
      assertEquals(List.of(YELLOW, VIOLET, RED, GOLD), ColourCode.encode(4700, 0.05));
      assertEquals(List.of(BROWN, BLACK, BLACK, RED, BROWN), ColourCode.encode(10_000, 0.01));
      assertEquals(List.of(RED, RED, BROWN, NONE), ColourCode.encode(220, 0.20));
      assertEquals(List.of(GREEN, Colour.BLUE, GOLD, GOLD), ColourCode.encode(5.6, 0.05));
      assertEquals(List.of(YELLOW, VIOLET, SILVER, SILVER), ColourCode.encode(0.47, 0.10));
      assertEquals(List.of(BROWN, BLACK, Colour.PINK, RED), ColourCode.encode(0.01, 0.02));
    }

    @Test
    void encode_fiveBandsWhenThreeDigitsOrTightTolerance() {
      // The documented choice: 1 % and tighter, or three significant digits, take five bands.
      assertEquals(List.of(YELLOW, WHITE, WHITE, BROWN, BROWN), ColourCode.encode(4990, 0.01));
      assertEquals(List.of(YELLOW, WHITE, WHITE, BROWN, GOLD), ColourCode.encode(4990, 0.05));
      assertEquals(List.of(YELLOW, VIOLET, BLACK, GOLD, BROWN), ColourCode.encode(47, 0.01));
      assertEquals(
          List.of(BLACK, YELLOW, VIOLET, Colour.PINK, BROWN), ColourCode.encode(0.047, 0.01));
    }

    @Test
    void encode_sixBands() {
      assertEquals(
          List.of(BROWN, BLACK, BLACK, RED, BROWN, BROWN), ColourCode.encode(10_000, 0.01, 100));
      assertEquals(
          List.of(YELLOW, VIOLET, BLACK, BROWN, BROWN, RED), ColourCode.encode(4700, 0.01, 50));
    }

    @Test
    void encode_toleratesBinaryNoiseInTheValue() {
      assertEquals(ColourCode.encode(330, 0.05), ColourCode.encode(0.1 * 3 * 1000 * 1.1, 0.05));
    }

    @Test
    void encode_valueWithTooManyDigits_saysSo() {
      assertThatThrownBy(() -> ColourCode.encode(4712.3, 0.01))
          .isInstanceOf(InvalidInputException.class)
          .hasMessage(
              "resistance 4712.3 Ω cannot be colour-coded with 3 digits and a multiplier from"
                  + " pink (×0.001) to white (×10^9)");
    }

    @ParameterizedTest
    @ValueSource(doubles = {0, -4700, Double.NaN, Double.POSITIVE_INFINITY, 1e13, 0.0001})
    void encode_valueOutOfReach_isRefused(double ohms) {
      assertThatThrownBy(() -> ColourCode.encode(ohms, 0.05))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("cannot be colour-coded");
    }

    @Test
    void encode_toleranceWithoutColour_listsTheColourTolerances() {
      assertThatThrownBy(() -> ColourCode.encode(4700, 0.03))
          .isInstanceOf(InvalidInputException.class)
          .hasMessage(
              "tolerance 0.03 has no colour; expected one of 1%, 2%, 0.05%, 0.02%, 0.5%, 0.25%,"
                  + " 0.1%, 0.01%, 5%, 10%, 20%");
    }

    @Test
    void encode_tempcoWithoutColour_listsTheCoefficients() {
      assertThatThrownBy(() -> ColourCode.encode(4700, 0.01, 30))
          .isInstanceOf(InvalidInputException.class)
          .hasMessage(
              "temperature coefficient 30 ppm/K has no colour; expected one of 250, 100, 50, 15,"
                  + " 25, 20, 10, 5, 1 ppm/K");
    }
  }

  @Nested
  class RoundTrip {
    @Test
    void e24AtFivePercent_encodesToFourBandsAndDecodesBack() {
      // Every E24 value (IEC 60063) from 0.1 Ω to 91 GΩ: the 4-band range of the colour code.
      for (int decade = -1; decade <= 10; decade++) {
        for (double mantissa : ESeries.E24.decade()) {
          double ohms = Decimals.times10(Math.round(mantissa * 10), decade - 1);
          List<Colour> bands = ColourCode.encode(ohms, 0.05);
          assertEquals(4, bands.size(), () -> "bands for " + ohms);
          assertEquals(
              new BandedValue(ohms, 0.05, OptionalInt.empty()), ColourCode.decode(names(bands)));
        }
      }
    }

    @Test
    void e96AndE192_encodeToFiveAndSixBandsAndDecodeBack() {
      // Every E96 value at 1 % and E192 value at 0.5 % with 25 ppm/K, from 1 Ω to 976 MΩ.
      for (int decade = 0; decade <= 8; decade++) {
        for (double mantissa : ESeries.E96.decade()) {
          double ohms = Decimals.times10(Math.round(mantissa * 100), decade - 2);
          List<Colour> bands = ColourCode.encode(ohms, 0.01);
          assertEquals(5, bands.size());
          assertEquals(
              new BandedValue(ohms, 0.01, OptionalInt.empty()), ColourCode.decode(names(bands)));
        }
        for (double mantissa : ESeries.E192.decade()) {
          double ohms = Decimals.times10(Math.round(mantissa * 100), decade - 2);
          assertEquals(
              new BandedValue(ohms, 0.005, OptionalInt.of(25)),
              ColourCode.decode(names(ColourCode.encode(ohms, 0.005, 25))));
        }
      }
    }

    private List<String> names(List<Colour> bands) {
      return bands.stream().map(Colour::displayName).collect(Collectors.toList());
    }
  }
}
