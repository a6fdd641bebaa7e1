package com.stagewise.diagnosis;

import java.util.Locale;

/** The overall answer of a diagnosis. */
public enum Verdict {
  /** The readings fit a working stage. */
  HEALTHY,
  /** A fault explains the readings better than a working stage does. */
  FAULT,
  /** The readings do not yet decide; take the next probe. */
  INCONCLUSIVE;

  /**
   * Returns the word used in diagnosis files: {@code healthy}, {@code fault}, {@code inconclusive}.
   */
  public String word() {
    return name().toLowerCase(Locale.ROOT);
  }
}
