package com.stagewise.ui;

import java.util.concurrent.Callable;
import java.util.function.Consumer;

/**
 * Runs slow work (the database, the solver, the diagnosis) away from the screen's thread and hands
 * the result back on it.
 *
 * <p>The app uses {@link FxTasks}; view-model tests use {@link #direct()}, which runs everything at
 * once on the caller's thread.
 */
public interface Tasks {

  /**
   * Runs {@code work} in the background, then {@code done} with its result (or {@code failed} with
   * what it threw) on the screen's thread.
   *
   * @param what what the work does, in a technician's words, for the progress line
   */
  <T> void run(String what, Callable<T> work, Consumer<T> done, Consumer<Exception> failed);

  /** Returns tasks that run at once on the calling thread (for tests and tools). */
  static Tasks direct() {
    return new Tasks() {
      @Override
      public <T> void run(
          String what, Callable<T> work, Consumer<T> done, Consumer<Exception> failed) {
        T result;
        try {
          result = work.call();
        } catch (Exception e) {
          failed.accept(e);
          return;
        }
        done.accept(result);
      }
    };
  }
}
