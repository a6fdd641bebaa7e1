package com.stagewise.diagnosis;

/**
 * The AC (small-signal) part of a prediction: its mean amplitude and spread per test point, worked
 * out on first need and then kept. A diagnosis without AC readings ranks by DC alone, so only the
 * predictions that the next-probe planner or the listed suspects look at need their AC.
 *
 * <p>Worked out once, under a lock that every AC part of one hypothesis shares: that hypothesis's
 * compiled stages keep work space and may be asked from several threads. The numbers are the ones
 * an eager computation gives: the same calls in the same order, only later. The parts made from
 * others (a borrowed spread, a point between two grid points) take the same lock, so that one lock
 * is ever held at a time per hypothesis.
 */
final class AcPart {
  /**
   * What works an AC part's two arrays out ({@code {mean, sd}}). Named classes rather than lambdas:
   * each lambda spins a class of its own on first use, which a fresh command-line run pays for.
   */
  interface Source {
    double[][] work();
  }

  private final Object lock;

  /** What works the two arrays out; null once they are known. */
  private Source source;

  private double[] mean;
  private double[] sd;

  /** Set (after mean and sd) once they are known. */
  private volatile boolean known;

  private AcPart(Object lock, Source source) {
    this.lock = lock;
    this.source = source;
  }

  /** An AC part already known. */
  static AcPart of(double[] mean, double[] sd) {
    AcPart part = new AcPart(new Object(), null);
    part.mean = mean;
    part.sd = sd;
    part.known = true;
    return part;
  }

  /** An AC part worked out by {@code source} ({@code {mean, sd}}) on first need, under the lock. */
  static AcPart later(Object lock, Source source) {
    return new AcPart(lock, source);
  }

  /** The AC amplitude per test point (may be null where a borrowed part had none). */
  double[] mean() {
    know();
    return mean;
  }

  /** The AC spread per test point (may be null where a borrowed part had none). */
  double[] sd() {
    know();
    return sd;
  }

  /** Whether the numbers have been worked out (for tests). */
  boolean isKnown() {
    return known;
  }

  private void know() {
    if (known) {
      return;
    }
    synchronized (lock) {
      if (!known) {
        double[][] both = source.work();
        mean = both[0];
        sd = both[1];
        source = null;
        known = true;
      }
    }
  }

  /**
   * The mean of {@code meanOf} with the spread of {@code sdOf} (a grid point borrowing its
   * neighbour's spread), under the hypothesis's lock; null when both are null.
   */
  static AcPart borrow(Object lock, AcPart meanOf, AcPart sdOf) {
    if (meanOf == null && sdOf == null) {
      return null;
    }
    return later(lock, new Borrowed(meanOf, sdOf));
  }

  /** One part's mean with another's spread. */
  private record Borrowed(AcPart meanOf, AcPart sdOf) implements Source {
    @Override
    public double[][] work() {
      return new double[][] {
        meanOf == null ? null : meanOf.mean(), sdOf == null ? null : sdOf.sd()
      };
    }
  }

  /**
   * The part a fraction t of the way from {@code a} to {@code b}, element by element; where either
   * array is missing, a's (as {@link Prediction#toward} has always mixed).
   */
  static AcPart toward(Object lock, AcPart a, AcPart b, double t) {
    if (a == null) {
      return null;
    }
    return later(lock, new Toward(a, b, t));
  }

  /** The part a fraction of the way from one part to another. */
  private record Toward(AcPart a, AcPart b, double t) implements Source {
    @Override
    public double[][] work() {
      return new double[][] {
        mix(a.mean(), b == null ? null : b.mean(), t), mix(a.sd(), b == null ? null : b.sd(), t)
      };
    }
  }

  static double[] mix(double[] a, double[] b, double t) {
    if (a == null || b == null) {
      return a;
    }
    double[] out = new double[a.length];
    for (int i = 0; i < a.length; i++) {
      out[i] = a[i] + (b[i] - a[i]) * t;
    }
    return out;
  }
}
