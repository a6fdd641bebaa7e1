package com.stagewise.bench;

import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.Locale;

/**
 * Processor time of the diagnosing thread for a re-rank after one more reading, as {@link
 * DiagnosisBenchmark#rerankAfterOneMoreReading} takes it (every net and used pin read, the third or
 * only section stuck high; a diagnoser that has diagnosed all but the last reading): a figure that
 * the load of other processes inflates far less than wall time. Run it with one build's classes and
 * then the other's, alternated, on the same test classes.
 *
 * <p>Arguments: stage name (a template or a sheet under src/test/resources/stages), seconds of
 * warm-up, number of timed re-ranks. Prints one line: {@code stage cpu-median-ms cpu-least-ms
 * wall-median-ms}.
 */
public final class RerankCpuTime {
  private RerankCpuTime() {}

  /** Runs the measurement; see the class comment for the arguments. */
  public static void main(String[] args) {
    String name = args.length > 0 ? args[0] : "instrumentation";
    double warmSeconds = args.length > 1 ? Double.parseDouble(args[1]) : 6;
    int runs = args.length > 2 ? Integer.parseInt(args[2]) : 400;
    Stage stage = DiagnosisCpuTime.stage(name);
    ReadingSet all = DiagnosisCpuTime.readings(stage);
    ReadingSet allButOne =
        new ReadingSet(all.meter(), all.readings().subList(0, all.readings().size() - 1));
    Diagnoser warm = Diagnoser.of(stage);
    warm.diagnose(allButOne);
    ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    long end = System.nanoTime() + (long) (warmSeconds * 1e9);
    int sink = 0;
    while (System.nanoTime() < end) {
      sink += warm.diagnose(all).suspects().size();
    }
    double[] cpu = new double[runs];
    double[] wall = new double[runs];
    for (int i = 0; i < runs; i++) {
      long c0 = threads.getCurrentThreadCpuTime();
      long w0 = System.nanoTime();
      sink += warm.diagnose(all).suspects().size();
      wall[i] = (System.nanoTime() - w0) / 1e6;
      cpu[i] = (threads.getCurrentThreadCpuTime() - c0) / 1e6;
    }
    double[] sorted = cpu.clone();
    Arrays.sort(sorted);
    System.out.printf(
        Locale.ROOT,
        "%s %.3f %.3f %.3f (%d)%n",
        name,
        DiagnosisCpuTime.median(cpu),
        sorted[0],
        DiagnosisCpuTime.median(wall),
        sink % 10);
  }
}
