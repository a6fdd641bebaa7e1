package com.stagewise.diagnosis;

/** The kinds of fault Stagewise considers, with the suffix each has in a fault id. */
public enum FaultKind {
  HEALTHY("healthy"),
  OPEN("open"),
  SHORT("short"),
  HIGH("high"),
  LOW("low"),
  STUCK_HIGH("stuck-high"),
  STUCK_LOW("stuck-low"),
  DEAD("dead"),
  LIFTED("lifted"),
  BRIDGE("bridge"),
  RAIL_MISSING("missing"),
  RAIL_LOW("low"),
  /** A diode, LED or zener passing reverse current. */
  LEAKY("leaky"),
  /** A trimmer's wiper no longer touching its track. */
  WIPER_OPEN("wiper-open"),
  /** A trimmer turned away from where the stage needs it. */
  MISSET("misset");

  private final String suffix;

  FaultKind(String suffix) {
    this.suffix = suffix;
  }

  /** Returns the part of the fault id after the colon, e.g. {@code open}. */
  public String suffix() {
    return suffix;
  }
}
