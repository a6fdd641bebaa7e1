package com.stagewise.solver;

import java.util.Iterator;
import java.util.NoSuchElementException;

/**
 * {@code start} varied over every combination of states of the sections marked in {@code vary}
 * (HIGH first, the first section fastest), each a fresh array; one combination when none varies.
 *
 * <p>The saturation search loops over these rather than passing a lambda to a visitor: a fresh
 * command-line JVM spins a class for each lambda on its first call.
 */
final class Combinations implements Iterable<SectionState[]> {
  private static final SectionState[] CHOICES = {
    SectionState.HIGH, SectionState.LOW, SectionState.LINEAR
  };
  private final SectionState[] start;
  private final boolean[] vary;

  Combinations(SectionState[] start, boolean[] vary) {
    this.start = start;
    this.vary = vary;
  }

  @Override
  public Iterator<SectionState[]> iterator() {
    return new Odometer();
  }

  /** Counts through the combinations like an odometer, the first section's digit fastest. */
  private final class Odometer implements Iterator<SectionState[]> {
    private final int[] digit = new int[start.length];
    private boolean done;

    @Override
    public boolean hasNext() {
      return !done;
    }

    @Override
    public SectionState[] next() {
      if (done) {
        throw new NoSuchElementException();
      }
      int n = start.length;
      SectionState[] states = new SectionState[n];
      for (int k = 0; k < n; k++) {
        states[k] = vary[k] ? CHOICES[digit[k]] : start[k];
      }
      int k = 0;
      while (k < n && (!vary[k] || ++digit[k] == CHOICES.length)) {
        digit[k] = 0;
        k++;
      }
      done = k == n;
      return states;
    }
  }
}
