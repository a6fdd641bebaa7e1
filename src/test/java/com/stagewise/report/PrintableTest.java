package com.stagewise.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatCode;

import java.io.IOException;
import org.apache.pdfbox.pdmodel.font.PDType1Font;
import org.apache.pdfbox.pdmodel.font.Standard14Fonts;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class PrintableTest {

  /**
   * Every character of the Basic Multilingual Plane, and a few beyond it, comes out as text that
   * PDFBox can encode in the standard Helvetica fonts (WinAnsiEncoding, PDF 32000-1:2008 Annex D);
   * PDFBox throws for any character the font's encoding lacks.
   */
  @Test
  void everyCharacter_encodesInTheStandardFonts() throws IOException {
    PDType1Font regular = new PDType1Font(Standard14Fonts.FontName.HELVETICA);
    PDType1Font bold = new PDType1Font(Standard14Fonts.FontName.HELVETICA_BOLD);
    StringBuilder block = new StringBuilder();
    for (int cp = 0; cp <= 0x10FFFF; cp = cp < 0xFFFF ? cp + 1 : cp + 0x3F1) {
      if (cp >= Character.MIN_SURROGATE && cp <= Character.MAX_SURROGATE) {
        continue;
      }
      block.appendCodePoint(cp);
      if (block.length() >= 512) {
        check(regular, bold, block.toString());
        block.setLength(0);
      }
    }
    check(regular, bold, block.toString() + "🔌⚡️👍🏽");
  }

  private static void check(PDType1Font regular, PDType1Font bold, String text) {
    String printable = Printable.text(text).replace("\n", "");
    assertThatCode(
            () -> {
              regular.encode(printable);
              bold.encode(printable);
              regular.getStringWidth(printable);
            })
        .as("characters from U+%04X", text.codePointAt(0))
        .doesNotThrowAnyException();
    printable.chars().forEach(c -> assertThat(Printable.drawable((char) c)).isTrue());
  }

  @ParameterizedTest(name = "{0} -> {1}")
  @CsvSource(
      delimiter = '|',
      value = {
        "10 kΩ (ohm sign Ω)|10 kohm (ohm sign ohm)",
        "2µ2 and 2μ2|2µ2 and 2µ2", // the micro sign is in WinAnsi; Greek mu looks the same
        "±15 V, 25 °C|±15 V, 25 °C",
        "R2 → 47k|R2 -> 47k",
        "a — b – c|a — b – c",
        "“quoted” ‘single’|“quoted” ‘single’",
        "≤ 1 V ≥ 0 V ≈ 2 V|<= 1 V >= 0 V ~ 2 V",
        "−13.5 V|-13.5 V",
        "Čapek Łódź|Capek ?ódz", // ó is in Latin-1; Ł has no decomposition
        "Müller, Straße|Müller, Straße",
        "tab\there|tab here",
        "zero\u200Bwidth\u00ADsoft|zerowidthsoft",
        "plug 🔌|plug ?",
        "日本|??",
      })
  void text_mapsAsDocumented(String given, String expected) {
    assertThat(Printable.text(given)).isEqualTo(expected);
  }

  @Test
  void text_keepsLineBreaks_andUnifiesThem() {
    assertThat(Printable.text("one\r\ntwo\rthree\nfour")).isEqualTo("one\ntwo\nthree\nfour");
    assertThat(Printable.text(null)).isEmpty();
  }
}
