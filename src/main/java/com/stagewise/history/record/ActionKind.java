package com.stagewise.history.record;

import java.util.Locale;
import java.util.Optional;

/** What was done to a unit during a case. */
public enum ActionKind {
  /** A part was replaced; the action records the old and the new value. */
  PART_REPLACED("part-replaced"),
  /** Joints were reflowed. */
  REFLOW("reflow"),
  /** A trimmer or setting was adjusted. */
  ADJUSTMENT("adjustment"),
  /** Anything else, described in the action's text. */
  OTHER("other");

  private final String word;

  ActionKind(String word) {
    this.word = word;
  }

  /** Returns the word used in files, the database and the command line. */
  public String word() {
    return word;
  }

  /** Returns the kind for {@code word} (case-insensitive), or empty if there is none. */
  public static Optional<ActionKind> fromWord(String word) {
    for (ActionKind kind : values()) {
      if (kind.word.equals(word == null ? null : word.toLowerCase(Locale.ROOT))) {
        return Optional.of(kind);
      }
    }
    return Optional.empty();
  }
}
