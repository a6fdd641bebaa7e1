package com.stagewise.history;

import java.util.Optional;

/**
 * What the unit search looks for: a part of a serial (letter case, blanks, dashes, underscores and
 * slashes ignored, as people type serials off a label) and optionally one board model.
 *
 * @param serialPart the typed part of a serial; empty matches every unit
 * @param boardModelId the board model's id, if the search is limited to one
 * @param limit the most units returned (1 or more)
 */
public record UnitQuery(String serialPart, Optional<String> boardModelId, int limit) {
  /** The most units any search returns. */
  public static final int MAX_LIMIT = 10_000;

  public UnitQuery {
    serialPart = normal(serialPart);
    boardModelId = boardModelId == null ? Optional.empty() : boardModelId;
    if (limit < 1 || limit > MAX_LIMIT) {
      throw new IllegalArgumentException("limit " + limit + " must be 1 to " + MAX_LIMIT);
    }
  }

  /** Returns a search for units whose serial contains {@code serialPart}. */
  public static UnitQuery serialLike(String serialPart) {
    return new UnitQuery(serialPart, Optional.empty(), MAX_LIMIT);
  }

  /** Returns this search limited to one board model. */
  public UnitQuery withBoardModel(String id) {
    return new UnitQuery(serialPart, Optional.of(id), limit);
  }

  /** Returns this search returning at most {@code most} units. */
  public UnitQuery withLimit(int most) {
    return new UnitQuery(serialPart, boardModelId, most);
  }

  /**
   * Returns a serial as the search compares it: ASCII letters in upper case (as SQL's {@code
   * upper()} does, so that the comparison can run inside the query), without blanks, dashes,
   * underscores or slashes.
   */
  public static String normal(String serial) {
    if (serial == null) {
      return "";
    }
    StringBuilder out = new StringBuilder(serial.length());
    for (int i = 0; i < serial.length(); i++) {
      char c = serial.charAt(i);
      if (Character.isWhitespace(c) || c == '-' || c == '_' || c == '/') {
        continue;
      }
      out.append(c >= 'a' && c <= 'z' ? (char) (c - 'a' + 'A') : c);
    }
    return out.toString();
  }
}
