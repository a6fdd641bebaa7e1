package com.stagewise.history.record;

import java.util.Locale;
import java.util.Optional;

/** Whether a case is still being worked or has been closed out. */
public enum CaseStatus {
  OPEN("open"),
  CLOSED("closed");

  private final String word;

  CaseStatus(String word) {
    this.word = word;
  }

  /** Returns the word used in files, the database and the command line. */
  public String word() {
    return word;
  }

  /** Returns the status for {@code word} (case-insensitive), or empty if there is none. */
  public static Optional<CaseStatus> fromWord(String word) {
    for (CaseStatus status : values()) {
      if (status.word.equals(word == null ? null : word.toLowerCase(Locale.ROOT))) {
        return Optional.of(status);
      }
    }
    return Optional.empty();
  }
}
