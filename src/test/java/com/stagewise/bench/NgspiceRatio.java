package com.stagewise.bench;

import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.reference.SpiceBatch;
import java.util.Arrays;
import java.util.Locale;

/**
 * The ratio of ngspice's time for a stage's fault dictionary (one circuit per fault, nominal parts,
 * one batch process, netlists written beforehand) to our full diagnosis of the same stage in a warm
 * JVM, both measured round by round, side by side: each round runs ngspice once and then a batch of
 * fresh diagnoses, and the round's ratio is ngspice's time over the batch's median. A slow spell of
 * the machine (these build machines have them: the same benchmark's medians moved from 2.5 to 4.4
 * ms between two runs of the same hour) then falls on both sides of a ratio, where benchmarks run
 * one after the other would compare one spell with another.
 *
 * <p>Run by {@code src/scripts/bench-ngspice-ratio.sh}. Arguments: stage name (a template or a
 * sheet under src/test/resources/stages), seconds of warm-up, rounds, diagnoses per round. Prints a
 * line per round and then the medians: {@code ngspice-ms diagnosis-ms ratio}.
 */
public final class NgspiceRatio {
  private NgspiceRatio() {}

  /** Runs the measurement; see the class comment for the arguments. */
  public static void main(String[] args) {
    String name = args.length > 0 ? args[0] : "instrumentation";
    double warmSeconds = args.length > 1 ? Double.parseDouble(args[1]) : 10;
    int rounds = args.length > 2 ? Integer.parseInt(args[2]) : 15;
    int perRound = args.length > 3 ? Integer.parseInt(args[3]) : 200;
    Stage stage = DiagnosisCpuTime.stage(name);
    ReadingSet readings = DiagnosisCpuTime.readings(stage);
    int sink = 0;
    long end = System.nanoTime() + (long) (warmSeconds * 1e9);
    while (System.nanoTime() < end) {
      sink += Diagnoser.of(stage).diagnose(readings).suspects().size();
    }
    double[] spice = new double[rounds];
    double[] ours = new double[rounds];
    double[] ratio = new double[rounds];
    try (SpiceBatch.Written netlists = SpiceBatch.written(stage)) {
      netlists.run(); // the first run reads ngspice's own files from disk
      for (int round = 0; round < rounds; round++) {
        spice[round] = netlists.run().toNanos() / 1e6;
        double[] each = new double[perRound];
        for (int i = 0; i < perRound; i++) {
          long t0 = System.nanoTime();
          sink += Diagnoser.of(stage).diagnose(readings).suspects().size();
          each[i] = (System.nanoTime() - t0) / 1e6;
        }
        ours[round] = DiagnosisCpuTime.median(each);
        ratio[round] = spice[round] / ours[round];
        System.out.printf(
            Locale.ROOT,
            "round %2d: ngspice %.1f ms, diagnosis %.3f ms, ratio %.0f%n",
            round + 1,
            spice[round],
            ours[round],
            ratio[round]);
      }
    }
    double[] sorted = ratio.clone();
    Arrays.sort(sorted);
    System.out.printf(
        Locale.ROOT,
        "%s medians: ngspice %.1f ms, diagnosis %.3f ms, ratio %.0f (least %.0f, most %.0f) (%d)%n",
        name,
        DiagnosisCpuTime.median(spice),
        DiagnosisCpuTime.median(ours),
        DiagnosisCpuTime.median(ratio),
        sorted[0],
        sorted[sorted.length - 1],
        sink % 10);
  }
}
