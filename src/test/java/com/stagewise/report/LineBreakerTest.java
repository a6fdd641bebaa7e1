package com.stagewise.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class LineBreakerTest {
  /** Every character 5 points wide, so that widths are easy to reckon by hand. */
  private static final TextWidth MONO = (style, text) -> 5.0 * text.length();

  @Test
  void wrap_breaksAtSpaces() {
    // 50 points hold 10 characters.
    assertThat(LineBreaker.wrap("the output sits at the lower limit", Style.BODY, 50, MONO))
        .containsExactly("the output", "sits at", "the lower", "limit");
  }

  @Test
  void wrap_cutsAWordLongerThanTheLine() {
    assertThat(LineBreaker.wrap("x 0123456789abcdefghij y", Style.BODY, 40, MONO))
        .containsExactly("x", "01234567", "89abcdef", "ghij y");
  }

  @Test
  void wrap_keepsLineBreaksAndEmptyLines() {
    assertThat(LineBreaker.wrap("first\n\nsecond   line", Style.BODY, 100, MONO))
        .containsExactly("first", "", "second line");
    assertThat(LineBreaker.wrap("", Style.BODY, 100, MONO)).containsExactly("");
  }

  /** Random texts (seeded): no line is too wide, and the words come back in order, none lost. */
  @Test
  void wrap_randomText_fitsAndKeepsEveryWord() {
    Random random = new Random(7);
    for (int round = 0; round < 200; round++) {
      StringBuilder text = new StringBuilder();
      int words = 1 + random.nextInt(40);
      for (int w = 0; w < words; w++) {
        text.append(" ".repeat(1 + random.nextInt(2)));
        int letters = 1 + random.nextInt(random.nextInt(10) == 0 ? 40 : 9);
        for (int i = 0; i < letters; i++) {
          text.append((char) ('a' + random.nextInt(26)));
        }
      }
      double width = 5.0 * (5 + random.nextInt(30));
      List<String> lines = LineBreaker.wrap(text.toString(), Style.BODY, width, MONO);
      lines.forEach(line -> assertThat(MONO.width(Style.BODY, line)).isLessThanOrEqualTo(width));
      assertThat(String.join("", lines).replace(" ", ""))
          .isEqualTo(text.toString().replace(" ", ""));
    }
  }
}
