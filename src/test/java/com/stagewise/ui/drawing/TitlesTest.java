package com.stagewise.ui.drawing;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.function.ToDoubleFunction;
import org.junit.jupiter.api.Test;

/** A drawing's title cut to its room: whole where it fits, else at a word, with "…". */
class TitlesTest {
  /** One unit per character: easy to reason about, the rule does not depend on the font. */
  private static final ToDoubleFunction<String> CHARACTERS = String::length;

  @Test
  void aTitleThatFits_isShownWhole() {
    assertThat(Titles.fitted("Input buffer", 12, CHARACTERS)).isEqualTo("Input buffer");
    assertThat(Titles.fitted("", 0, CHARACTERS)).isEmpty();
    // Never less room than the least, whatever the sheet's width.
    String fiftyFive = "x".repeat(55);
    assertThat(Titles.fitted(fiftyFive, 10, t -> t.length() * 9.0)).isEqualTo(fiftyFive);
  }

  @Test
  void aLongTitle_isCutAtAWord_withinItsRoom() {
    String title = "Channel level meter with calibration trimmer, rev C board";
    // Twenty units per character: room for 26 characters.
    String shown = Titles.fitted(title, 10, t -> t.length() * 20.0);
    assertThat(shown).isEqualTo("Channel level meter with…");
    assertThat(shown.length() * 20.0).isLessThanOrEqualTo(Titles.LEAST_ROOM);
    assertThat(title).startsWith(shown.substring(0, shown.length() - 1));
  }

  @Test
  void oneLongWord_isCutAtALetter() {
    assertThat(Titles.fitted("Supercalibrationtrimmerboard".repeat(2), 10, t -> t.length() * 52.0))
        .isEqualTo("Supercali…");
  }
}
