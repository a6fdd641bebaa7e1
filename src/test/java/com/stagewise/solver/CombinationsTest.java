package com.stagewise.solver;

import static com.stagewise.solver.SectionState.HIGH;
import static com.stagewise.solver.SectionState.LINEAR;
import static com.stagewise.solver.SectionState.LOW;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.NoSuchElementException;
import org.junit.jupiter.api.Test;

/**
 * The combinations the saturation search tries: their order, their count and the fixed sections.
 */
class CombinationsTest {
  private static List<SectionState[]> all(SectionState[] start, boolean[] vary) {
    List<SectionState[]> all = new ArrayList<>();
    for (SectionState[] states : new Combinations(start, vary)) {
      all.add(states);
    }
    return all;
  }

  @Test
  void twoVariedOfThree_countLikeAnOdometer_firstSectionFastest_fixedOneKept() {
    List<SectionState[]> all =
        all(new SectionState[] {LINEAR, LOW, LINEAR}, new boolean[] {true, false, true});
    // 3 × 3 = 9, HIGH before LOW before LINEAR, the first varied section turning fastest.
    assertThat(all)
        .containsExactly(
            new SectionState[] {HIGH, LOW, HIGH},
            new SectionState[] {LOW, LOW, HIGH},
            new SectionState[] {LINEAR, LOW, HIGH},
            new SectionState[] {HIGH, LOW, LOW},
            new SectionState[] {LOW, LOW, LOW},
            new SectionState[] {LINEAR, LOW, LOW},
            new SectionState[] {HIGH, LOW, LINEAR},
            new SectionState[] {LOW, LOW, LINEAR},
            new SectionState[] {LINEAR, LOW, LINEAR});
  }

  @Test
  void noneVaried_givesTheStartOnce_asAFreshArray() {
    SectionState[] start = {LOW, HIGH};
    List<SectionState[]> all = all(start, new boolean[] {false, false});
    assertThat(all).hasSize(1);
    assertThat(all.get(0)).containsExactly(LOW, HIGH).isNotSameAs(start);
  }

  @Test
  void noSections_giveOneEmptyCombination() {
    assertThat(all(new SectionState[0], new boolean[0])).hasSize(1).allMatch(s -> s.length == 0);
  }

  @Test
  void next_afterTheLast_throws() {
    Iterator<SectionState[]> it =
        new Combinations(new SectionState[] {LINEAR}, new boolean[] {true}).iterator();
    for (int i = 0; i < 3; i++) {
      assertThat(it.hasNext()).isTrue();
      it.next();
    }
    assertThat(it.hasNext()).isFalse();
    assertThatThrownBy(it::next).isInstanceOf(NoSuchElementException.class);
  }
}
