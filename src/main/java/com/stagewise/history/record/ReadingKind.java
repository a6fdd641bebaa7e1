package com.stagewise.history.record;

import java.util.Locale;
import java.util.Optional;

/** Whether a reading is a DC level, an AC amplitude or (power off) a resistance in ohms. */
public enum ReadingKind {
  DC("dc"),
  AC("ac"),
  /** A resistance between two points, taken with the power off. */
  OHMS("ohms");

  private final String word;

  ReadingKind(String word) {
    this.word = word;
  }

  /** Returns the word used in files and the database. */
  public String word() {
    return word;
  }

  /** Returns the kind for {@code word} (case-insensitive), or empty if there is none. */
  public static Optional<ReadingKind> fromWord(String word) {
    for (ReadingKind kind : values()) {
      if (kind.word.equals(word == null ? null : word.toLowerCase(Locale.ROOT))) {
        return Optional.of(kind);
      }
    }
    return Optional.empty();
  }
}
