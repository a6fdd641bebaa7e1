package com.stagewise.bench;

import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import java.util.Locale;

/**
 * Prints the sections, parts, nets and faults of each chain size of {@link ChainGrowthBenchmark}.
 */
public final class ChainSizes {
  private ChainSizes() {}

  /** Prints one line per size. */
  public static void main(String[] args) {
    for (int n = 1; n <= 12; n++) {
      Stage stage = ChainGrowthBenchmark.firstSections(n);
      System.out.printf(
          Locale.ROOT,
          "sections %2d  parts %2d  nets %2d  faults %3d%n",
          n,
          stage.parts().size(),
          stage.nets().size(),
          Diagnoser.of(stage).faults().size());
    }
  }
}
