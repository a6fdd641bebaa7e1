package com.stagewise.ui.editor;

/**
 * One problem of the stage being edited, placed beside what causes it.
 *
 * @param place the kind of thing it belongs to
 * @param key which one: a part's or section's designator, a rail's or input's position (as text),
 *     or empty for the stage as a whole
 * @param message what is wrong and what to do, in plain words
 */
public record EditorProblem(Place place, String key, String message) {

  /** The kinds of thing a problem can sit beside. */
  public enum Place {
    STAGE,
    PART,
    SECTION,
    RAIL,
    INPUT
  }

  /** Returns whether the problem belongs to this thing. */
  public boolean isAbout(Place where, String which) {
    return place == where && key.equals(which);
  }
}
