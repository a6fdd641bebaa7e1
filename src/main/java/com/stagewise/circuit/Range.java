package com.stagewise.circuit;

/**
 * A nominal value with the range it may take on a real part.
 *
 * @param nominal the value used when one number is wanted
 * @param low the lowest value expected on a working part
 * @param high the highest value expected on a working part
 */
public record Range(double nominal, double low, double high) {

  /** Checks that {@code low <= nominal <= high} and that all three are finite. */
  public Range {
    if (!(Double.isFinite(low) && Double.isFinite(nominal) && Double.isFinite(high))
        || low > nominal
        || nominal > high) {
      throw new IllegalArgumentException(
          "range (" + low + " … " + nominal + " … " + high + ") must be ordered and finite");
    }
  }

  /** Returns a range symmetric about zero, {@code ±halfWidth}, with nominal 0. */
  public static Range plusMinus(double halfWidth) {
    return new Range(0, -halfWidth, halfWidth);
  }

  /** Returns whether {@code value} lies within the range, ends included. */
  public boolean contains(double value) {
    return value >= low && value <= high;
  }
}
