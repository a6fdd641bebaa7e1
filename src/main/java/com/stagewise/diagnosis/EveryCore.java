package com.stagewise.diagnosis;

import java.util.concurrent.CountedCompleter;
import java.util.function.IntConsumer;

/**
 * Runs independent pieces of work, one per index, on the calling thread and every core the common
 * pool offers, each index as a task of its own. A parallel stream of a range cuts it into about
 * four pieces per pool worker; when the pieces' costs differ tenfold (a fault tried on a grid of
 * forty values beside one tried once) a thread is left with the heavy piece while the others wait.
 * Here every index can be taken by whichever thread is free (the divide-in-halves pattern of {@link
 * CountedCompleter}'s documentation), so the threads finish close together. The caller decides the
 * order in which indices are offered; the work of each index must not depend on the others'.
 */
final class EveryCore {
  private EveryCore() {}

  /**
   * Calls {@code work} once for each index from 0 to {@code count} − 1 and returns when all have.
   */
  static void forEach(int count, IntConsumer work) {
    if (count == 1) {
      work.accept(0);
    } else if (count > 1) {
      new Piece(null, 0, count, work).invoke();
    }
  }

  private static final class Piece extends CountedCompleter<Void> {
    private final int from;
    private int to;
    private final IntConsumer work;

    Piece(CountedCompleter<?> parent, int from, int to, IntConsumer work) {
      super(parent);
      this.from = from;
      this.to = to;
      this.work = work;
    }

    @Override
    public void compute() {
      // Offer the upper half to other threads and keep the lower, down to one index.
      while (to - from > 1) {
        int middle = (from + to) >>> 1;
        addToPendingCount(1);
        new Piece(this, middle, to, work).fork();
        to = middle;
      }
      work.accept(from);
      tryComplete();
    }
  }
}
