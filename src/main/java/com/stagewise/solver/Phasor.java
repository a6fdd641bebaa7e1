package com.stagewise.solver;

/**
 * A sinusoid's amplitude and phase relative to the test input.
 *
 * @param amplitude in the same measure as the input's {@code ac} (peak or RMS)
 * @param phaseDegrees phase in degrees, in (-180, 180]
 */
public record Phasor(double amplitude, double phaseDegrees) {

  static Phasor of(double re, double im) {
    double phase = Math.toDegrees(Math.atan2(im, re));
    if (phase <= -180) {
      phase += 360;
    }
    return new Phasor(Math.hypot(re, im), phase);
  }
}
