package com.stagewise.ui.drawing;

import java.util.function.ToDoubleFunction;

/**
 * A stage's title as a drawing shows it: whole where it fits its room, else cut at a word (or, for
 * one long word, at a letter) with "…" after it. A drawing scales to fit its window, so a title as
 * wide as the sheet's 200 characters would shrink the whole schematic to a strip.
 */
final class Titles {
  /**
   * The least room a title is given before it is cut, layout units: every sheet's title we have (55
   * characters at most) fits whole at the drawings' 15 px bold.
   */
  static final double LEAST_ROOM = 520;

  private Titles() {}

  /**
   * The title, or its longest start that fits {@code room} (at least {@link #LEAST_ROOM}) with "…"
   * added.
   */
  static String fitted(String title, double room, ToDoubleFunction<String> width) {
    room = Math.max(room, LEAST_ROOM);
    if (title.isEmpty() || width.applyAsDouble(title) <= room) {
      return title;
    }
    int end = title.length();
    while (end > 1) {
      int space = title.lastIndexOf(' ', end - 1);
      end = space > 0 ? space : end - 1;
      String shown = title.substring(0, end).strip() + "…";
      if (width.applyAsDouble(shown) <= room) {
        return shown;
      }
    }
    return title.substring(0, 1) + "…";
  }
}
