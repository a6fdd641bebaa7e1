package com.stagewise.report;

import java.util.ArrayList;
import java.util.List;

/** Breaks text into lines that fit a width: at spaces where it can, inside a word where it must. */
final class LineBreaker {
  private LineBreaker() {}

  /**
   * Returns the lines of {@code text} no wider than {@code width} points in {@code style}.
   *
   * <p>Each line break in the text starts a new line (an empty line stays empty); runs of spaces
   * between words print as one; a word wider than the whole line is cut where it must be. Empty
   * text gives one empty line.
   */
  static List<String> wrap(String text, Style style, double width, TextWidth measure) {
    List<String> lines = new ArrayList<>();
    for (String paragraph : text.split("\n", -1)) {
      wrapParagraph(paragraph.strip(), style, width, measure, lines);
    }
    return lines;
  }

  private static void wrapParagraph(
      String paragraph, Style style, double width, TextWidth measure, List<String> lines) {
    if (paragraph.isEmpty()) {
      lines.add("");
      return;
    }
    StringBuilder line = new StringBuilder();
    for (String word : paragraph.split(" +")) {
      String candidate = line.length() == 0 ? word : line + " " + word;
      if (measure.width(style, candidate) <= width) {
        line.setLength(0);
        line.append(candidate);
        continue;
      }
      if (line.length() > 0) {
        lines.add(line.toString());
        line.setLength(0);
      }
      String rest = word;
      while (measure.width(style, rest) > width) {
        int cut = longestFit(rest, style, width, measure);
        lines.add(rest.substring(0, cut));
        rest = rest.substring(cut);
      }
      line.append(rest);
    }
    lines.add(line.toString());
  }

  /** Returns how many leading characters of {@code word} fit (at least one, so that it ends). */
  private static int longestFit(String word, Style style, double width, TextWidth measure) {
    int fit = 1;
    while (fit < word.length() && measure.width(style, word.substring(0, fit + 1)) <= width) {
      fit++;
    }
    return fit;
  }
}
