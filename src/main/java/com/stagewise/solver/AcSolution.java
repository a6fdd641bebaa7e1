package com.stagewise.solver;

import java.util.Map;

/**
 * The small-signal AC response of a stage about one operating point, at one frequency.
 *
 * @param hz the frequency in hertz
 * @param nets the amplitude and phase on every net, in the stage's net order
 */
public record AcSolution(double hz, Map<String, Phasor> nets) {

  /** Keeps the map unmodifiable. */
  public AcSolution {
    nets = nets instanceof Layout.Phasors ? nets : java.util.Collections.unmodifiableMap(nets);
  }
}
