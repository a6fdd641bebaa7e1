package com.stagewise.history.record;

import java.util.Locale;
import java.util.Optional;

/** Whether a reading is a DC level or an AC amplitude. */
public enum ReadingKind {
  DC("dc"),
  AC("ac");

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
