package com.stagewise.bench;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Templates;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.interchange.StageSheet;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.SectionState;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * Processor time of the diagnosing thread for a full diagnosis (a fresh {@link Diagnoser}: every
 * hypothesis's predictions, the ranking and the next probe), with the same stage and readings as
 * {@link DiagnosisBenchmark}: a figure that the load of other processes on a busy machine inflates
 * far less than wall time. A full diagnosis may use more threads than the calling one; the wall
 * time is printed beside it, and the processor time of the whole process.
 *
 * <p>Run by {@code src/scripts/bench-cpu.sh}, which alternates two builds of the classes in one
 * run. Arguments: stage name (a template or a sheet under src/test/resources/stages), seconds of
 * warm-up, number of timed diagnoses. Prints one line: {@code stage cpu-median-ms wall-median-ms
 * process-cpu-median-ms}.
 */
public final class DiagnosisCpuTime {
  private DiagnosisCpuTime() {}

  /** Runs the measurement; see the class comment for the arguments. */
  public static void main(String[] args) {
    String name = args.length > 0 ? args[0] : "instrumentation";
    double warmSeconds = args.length > 1 ? Double.parseDouble(args[1]) : 6;
    int runs = args.length > 2 ? Integer.parseInt(args[2]) : 40;
    Stage stage = stage(name);
    ReadingSet readings = readings(stage);
    ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    com.sun.management.OperatingSystemMXBean os =
        (com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean();
    long end = System.nanoTime() + (long) (warmSeconds * 1e9);
    int sink = 0;
    while (System.nanoTime() < end) {
      sink += Diagnoser.of(stage).diagnose(readings).suspects().size();
    }
    double[] cpu = new double[runs];
    double[] wall = new double[runs];
    double[] process = new double[runs];
    for (int i = 0; i < runs; i++) {
      long c0 = threads.getCurrentThreadCpuTime();
      long p0 = os.getProcessCpuTime();
      long w0 = System.nanoTime();
      sink += Diagnoser.of(stage).diagnose(readings).suspects().size();
      wall[i] = (System.nanoTime() - w0) / 1e6;
      cpu[i] = (threads.getCurrentThreadCpuTime() - c0) / 1e6;
      process[i] = (os.getProcessCpuTime() - p0) / 1e6;
    }
    System.out.printf(
        Locale.ROOT,
        "%s %.2f %.2f %.2f (%d)%n",
        name,
        median(cpu),
        median(wall),
        median(process),
        sink % 10);
  }

  static Stage stage(String name) {
    return Templates.find(name).isPresent()
        ? Templates.named(name).build()
        : StageSheet.read(Path.of("src", "test", "resources", "stages", name + ".stage.json"));
  }

  /** Every net and used pin read, with the third (or only) section stuck high. */
  static ReadingSet readings(Stage stage) {
    SolveResult.Solved solved =
        (SolveResult.Solved)
            StageSolver.solve(
                stage,
                Conditions.NOMINAL.withForced(
                    stage.amplifiers().get(Math.min(2, stage.amplifiers().size() - 1)).ref(),
                    SectionState.HIGH));
    OperatingPoint point = solved.primary();
    List<Reading> all = new ArrayList<>();
    point.nets().forEach((net, volts) -> all.add(Reading.dc(net, volts)));
    point.pins().forEach((pin, volts) -> all.add(Reading.dc(pin, volts)));
    return new ReadingSet(MeterSpec.DEFAULT, all);
  }

  /** The median of the values (the mean of the middle two for an even count). */
  static double median(double[] values) {
    double[] sorted = values.clone();
    Arrays.sort(sorted);
    int n = sorted.length;
    return n % 2 == 1 ? sorted[n / 2] : (sorted[n / 2 - 1] + sorted[n / 2]) / 2;
  }
}
