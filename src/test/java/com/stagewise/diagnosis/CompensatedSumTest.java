package com.stagewise.diagnosis;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The diagnosis's loop sums give the very bits the JDK's {@code DoubleStream.sum()} gives for the
 * same values in the same order (the reference: the JDK's own stream, run beside it), so that
 * replacing a stream by a loop changes no probability, however the terms cancel.
 */
class CompensatedSumTest {

  private static double loop(double[] values) {
    CompensatedSum sum = new CompensatedSum();
    for (double v : values) {
      sum.add(v);
    }
    return sum.total();
  }

  private static void assertSameBits(double[] values) {
    double stream = Arrays.stream(values).sum();
    assertEquals(
        Double.doubleToRawLongBits(stream),
        Double.doubleToRawLongBits(loop(values)),
        () -> "sum of " + Arrays.toString(values) + ": stream " + stream);
  }

  @Test
  void matchesTheStreamOnSeededValuesOfEveryScale() {
    SplittableRandom random = new SplittableRandom(20261203L);
    for (int trial = 0; trial < 20_000; trial++) {
      double[] values = new double[random.nextInt(0, 70)];
      int scale = random.nextInt(0, 4);
      for (int i = 0; i < values.length; i++) {
        double v =
            switch (scale) {
              // Probabilities and weights, as the diagnosis sums them.
              case 0 -> random.nextDouble();
              case 1 -> Math.exp(-random.nextDouble(0, 700));
              // Terms of every size and sign, where compensation matters most.
              case 2 -> (random.nextBoolean() ? 1 : -1) * Math.pow(10, random.nextDouble(-20, 20));
              default -> random.nextDouble() < 0.5 ? 1e16 : random.nextDouble(-1, 1);
            };
        values[i] = v;
      }
      assertSameBits(values);
    }
  }

  @Test
  void matchesTheStreamOnCancellationAndTheEdges() {
    assertSameBits(new double[] {});
    assertSameBits(new double[] {0.1, 0.2, 0.3});
    assertSameBits(new double[] {1e100, 1.0, -1e100});
    assertSameBits(new double[] {1.0, 1e-16, 1e-16, 1e-16, 1e-16});
    assertSameBits(new double[] {Double.MAX_VALUE, Double.MAX_VALUE});
    assertSameBits(new double[] {Double.POSITIVE_INFINITY, 1.0});
    assertSameBits(new double[] {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY});
    assertSameBits(new double[] {Double.NaN, 1.0});
    assertSameBits(new double[] {-0.0, -0.0});
    assertSameBits(new double[] {Double.MIN_VALUE, -Double.MIN_VALUE, Double.MIN_VALUE});
  }
}
