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
  }

  @Test
  void aLongTitle_isCutAtAWord_withinItsRoom() {
    String title = "Channel level meter with calibration trimmer, rev C board";
    String shown = Titles.fitted(title, 30, CHARACTERS);
    assertThat(shown).isEqualTo("Channel level meter with…");
    assertThat(shown.length()).isLessThanOrEqualTo(30);
    assertThat(title).startsWith(shown.substring(0, shown.length() - 1));
  }

  @Test
  void oneLongWord_isCutAtALetter() {
    assertThat(Titles.fitted("Supercalibrationtrimmerboard", 10, CHARACTERS))
        .isEqualTo("Supercali…");
  }
}
