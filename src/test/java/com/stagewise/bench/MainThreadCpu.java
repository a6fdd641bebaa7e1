package com.stagewise.bench;

import com.stagewise.app.Main;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Runs the program's {@code main} on this thread and, when the JVM ends, writes this thread's
 * processor time in milliseconds to the file named by {@code -Dcpu.out}: the work a cold command
 * line does on its own thread, without the compiler's and collector's threads, which on a loaded
 * two-core machine moves far less than the wall time. {@code src/scripts/cli-main-cpu.sh} runs it.
 * Usage: {@code java -Dcpu.out=FILE -cp test-classes:stagewise.jar
 * com.stagewise.bench.MainThreadCpu ARGS…}
 */
public final class MainThreadCpu {

  private static volatile long doneNanos = -1;

  private MainThreadCpu() {}

  public static void main(String[] args) {
    Path out = Path.of(System.getProperty("cpu.out", "main-thread-cpu.txt"));
    Thread main = Thread.currentThread();
    Runtime.getRuntime()
        .addShutdownHook(
            new Thread(
                () -> {
                  // The program ends with System.exit, so the main thread is still there, waiting.
                  // (The management classes are loaded here, after the work, off the main thread.)
                  ThreadMXBean threads = ManagementFactory.getThreadMXBean();
                  long nanos = doneNanos >= 0 ? doneNanos : threads.getThreadCpuTime(main.getId());
                  try {
                    Files.writeString(out, nanos / 1_000_000 + "\n");
                  } catch (IOException e) {
                    throw new UncheckedIOException(e);
                  }
                }));
    Main.main(args);
    doneNanos = ManagementFactory.getThreadMXBean().getCurrentThreadCpuTime();
  }
}
