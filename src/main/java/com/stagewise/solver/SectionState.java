package com.stagewise.solver;

/** What an op-amp section's output is doing at an operating point. */
public enum SectionState {
  /** The output follows its inputs (negative feedback holds the inputs together). */
  LINEAR("linear"),
  /** The output is clamped at its upper limit (v+ pin voltage less the headroom). */
  HIGH("high"),
  /** The output is clamped at its lower limit (v- pin voltage plus the headroom). */
  LOW("low"),
  /** The output no longer drives (high impedance); only when a fault forces it. */
  DEAD("dead");

  private final String word;

  SectionState(String word) {
    this.word = word;
  }

  /**
   * Returns the word used in solution files: {@code linear}, {@code high}, {@code low}, {@code
   * dead}.
   */
  public String word() {
    return word;
  }
}
