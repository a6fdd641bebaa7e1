package com.stagewise.report;

import java.text.Normalizer;
import java.util.Map;

/**
 * Maps any text to characters that the PDF standard fonts can draw (the WinAnsi character set), so
 * that user text from the history never stops a report half-written.
 *
 * <p>Characters of that set are kept as they are (µ, ±, °, —, “ ”, é, ß). Common technical signs
 * outside it become plain text (Ω → "ohm", → → "->", ≤ → "<=", − → "-"); accented letters outside
 * it lose their accents (ł stays unknown, č becomes c); tabs and unusual spaces become a space;
 * control and zero-width characters are dropped; anything else becomes "?". Line breaks are kept as
 * {@code \n}.
 */
final class Printable {
  /**
   * The 27 characters that WinAnsiEncoding (PDF 32000-1:2008, Annex D.2) places in 0x80–0x9F; the
   * rest of the set is printable ASCII and Latin-1 (0xA1–0xFF).
   */
  private static final String WIN_ANSI_EXTRA = "€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ";

  private static final Map<Integer, String> PLAIN =
      Map.ofEntries(
          Map.entry(0x03A9, "ohm"), // Greek capital omega
          Map.entry(0x2126, "ohm"), // ohm sign
          Map.entry(0x03BC, "µ"), // Greek small mu: the micro sign (in the set) looks the same
          Map.entry(0x2192, "->"),
          Map.entry(0x2190, "<-"),
          Map.entry(0x2194, "<->"),
          Map.entry(0x21D2, "=>"),
          Map.entry(0x2264, "<="),
          Map.entry(0x2265, ">="),
          Map.entry(0x2260, "!="),
          Map.entry(0x2248, "~"),
          Map.entry(0x221E, "inf"),
          Map.entry(0x2212, "-"), // minus sign
          Map.entry(0x2010, "-"),
          Map.entry(0x2011, "-"),
          Map.entry(0x2012, "-"),
          Map.entry(0x2015, "—"),
          Map.entry(0x2032, "'"),
          Map.entry(0x2033, "\""),
          Map.entry(0x221A, "sqrt"),
          Map.entry(0x0394, "delta "),
          Map.entry(0x2206, "delta "),
          Map.entry(0x03C0, "pi"),
          Map.entry(0x2713, "ok"),
          Map.entry(0x2714, "ok"),
          Map.entry(0x2717, "x"),
          Map.entry(0x2718, "x"),
          Map.entry(0x26A0, "(!)"));

  private Printable() {}

  /** Returns {@code text} with every character mapped as the class says; null becomes "". */
  static String text(String text) {
    if (text == null) {
      return "";
    }
    String unified = text.replace("\r\n", "\n").replace('\r', '\n');
    StringBuilder out = new StringBuilder(unified.length());
    unified.codePoints().forEach(cp -> append(out, cp));
    return out.toString();
  }

  /** Returns whether the standard fonts can draw {@code c} as it is. */
  static boolean drawable(char c) {
    return (c >= 0x20 && c <= 0x7E)
        || (c >= 0xA1 && c <= 0xFF && c != 0xAD)
        || WIN_ANSI_EXTRA.indexOf(c) >= 0;
  }

  private static void append(StringBuilder out, int cp) {
    if (cp == '\n') {
      out.append('\n');
      return;
    }
    if (cp < Character.MIN_SUPPLEMENTARY_CODE_POINT && drawable((char) cp)) {
      out.append((char) cp);
      return;
    }
    String plain = PLAIN.get(cp);
    if (plain != null) {
      out.append(plain);
      return;
    }
    if (cp == '\t' || Character.isSpaceChar(cp) || Character.isWhitespace(cp)) {
      // Tabs, no-break, thin and other spaces: a plain space wraps and prints the same.
      out.append(' ');
      return;
    }
    int type = Character.getType(cp);
    if (type == Character.CONTROL
        || type == Character.FORMAT
        || type == Character.NON_SPACING_MARK
        || type == Character.ENCLOSING_MARK
        || type == Character.SURROGATE
        || cp == 0xAD) {
      // Control characters, zero-width joiners, soft hyphens, stray combining marks: nothing to
      // draw.
      return;
    }
    String decomposed =
        Normalizer.normalize(new String(Character.toChars(cp)), Normalizer.Form.NFKD);
    StringBuilder base = new StringBuilder();
    for (char c : decomposed.toCharArray()) {
      if (Character.getType(c) == Character.NON_SPACING_MARK) {
        continue;
      }
      if (!drawable(c)) {
        out.append('?');
        return;
      }
      base.append(c);
    }
    out.append(base.length() == 0 ? "?" : base);
  }
}
