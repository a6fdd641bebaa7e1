package com.stagewise.diagnosis;

/**
 * A fault at a value, as a map key (the value's bits, so NaN is one value). A class, not a record:
 * a record's generated hash is set up through method handles on its first use, which is slow in a
 * fresh command-line run.
 */
final class FaultAtValue {
  private final String fault;
  private final long bits;

  FaultAtValue(String fault, double value) {
    this.fault = fault;
    this.bits = Double.doubleToLongBits(value);
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof FaultAtValue a && bits == a.bits && fault.equals(a.fault);
  }

  @Override
  public int hashCode() {
    return 31 * fault.hashCode() + Long.hashCode(bits);
  }
}
