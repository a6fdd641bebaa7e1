package com.stagewise.ui.shell;

import com.stagewise.ui.Tasks;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.function.Consumer;
import javafx.application.Platform;
import javafx.beans.property.ReadOnlyIntegerProperty;
import javafx.beans.property.ReadOnlyIntegerWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;

/**
 * Runs work on one background thread, in the order given, and hands results back on the JavaFX
 * thread. One thread keeps database writes and diagnosis runs in the order the technician made
 * them.
 */
public final class FxTasks implements Tasks, AutoCloseable {
  private final ExecutorService worker =
      Executors.newSingleThreadExecutor(
          r -> {
            Thread thread = new Thread(r, "stagewise-worker");
            thread.setDaemon(true);
            return thread;
          });
  private final ReadOnlyIntegerWrapper pending = new ReadOnlyIntegerWrapper(0);
  private final ReadOnlyStringWrapper current = new ReadOnlyStringWrapper("");

  /** Returns how many tasks are queued or running (0 when idle); changes on the FX thread. */
  public ReadOnlyIntegerProperty pendingProperty() {
    return pending.getReadOnlyProperty();
  }

  /** Returns what the latest task does, for the progress line; changes on the FX thread. */
  public ReadOnlyStringProperty currentProperty() {
    return current.getReadOnlyProperty();
  }

  @Override
  public <T> void run(String what, Callable<T> work, Consumer<T> done, Consumer<Exception> failed) {
    pending.set(pending.get() + 1);
    current.set(what);
    worker.execute(
        () -> {
          try {
            T result = work.call();
            Platform.runLater(
                () -> {
                  finish();
                  done.accept(result);
                });
          } catch (Exception e) {
            Platform.runLater(
                () -> {
                  finish();
                  failed.accept(e);
                });
          }
        });
  }

  private void finish() {
    pending.set(pending.get() - 1);
    if (pending.get() == 0) {
      current.set("");
    }
  }

  @Override
  public void close() {
    worker.shutdownNow();
  }
}
