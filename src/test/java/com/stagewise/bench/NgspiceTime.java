package com.stagewise.bench;

import com.stagewise.interchange.StageSheet;
import com.stagewise.reference.SpiceBatch;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;

/**
 * Prints ngspice's wall time (process start included) for a stage sheet's fault dictionary in one
 * batch process, on netlists written beforehand: one line per run, then the median. For {@code
 * src/scripts/cli-startup.sh}.
 */
public final class NgspiceTime {
  private NgspiceTime() {}

  /**
   * Arguments: the stage sheet, then the number of runs (default 5); or {@code --keep SHEET}:
   * writes the dictionary, runs it once to check it, and prints the folder and the command to run
   * in it (the folder is left for the caller to time and delete).
   */
  public static void main(String[] args) {
    if (args[0].equals("--keep")) {
      SpiceBatch.Written netlists = SpiceBatch.written(StageSheet.read(Path.of(args[1])));
      netlists.run();
      System.out.println(netlists.folder() + "\t" + netlists.command());
      return;
    }
    int runs = args.length > 1 ? Integer.parseInt(args[1]) : 5;
    try (SpiceBatch.Written netlists = SpiceBatch.written(StageSheet.read(Path.of(args[0])))) {
      netlists.run();
      double[] ms = new double[runs];
      for (int i = 0; i < runs; i++) {
        ms[i] = netlists.run().toNanos() / 1e6;
      }
      Arrays.sort(ms);
      System.out.printf(
          Locale.ROOT,
          "ngspice fault dictionary: median %.0f ms of %d runs %s%n",
          ms[runs / 2],
          runs,
          Arrays.toString(ms));
    }
  }
}
