package com.stagewise.history.record;

import java.util.Locale;
import java.util.Optional;

/** How a closed case ended. */
public enum Outcome {
  /** The unit works again. */
  FIXED("fixed"),
  /** The shop could not fix it. */
  NOT_FIXED("not-fixed"),
  /** Sent back to the owner unrepaired (declined quote, no parts, not worth it). */
  RETURNED("returned");

  private final String word;

  Outcome(String word) {
    this.word = word;
  }

  /** Returns the word used in files, the database and the command line. */
  public String word() {
    return word;
  }

  /** Returns the outcome for {@code word} (case-insensitive), or empty if there is none. */
  public static Optional<Outcome> fromWord(String word) {
    for (Outcome outcome : values()) {
      if (outcome.word.equals(word == null ? null : word.toLowerCase(Locale.ROOT))) {
        return Optional.of(outcome);
      }
    }
    return Optional.empty();
  }
}
