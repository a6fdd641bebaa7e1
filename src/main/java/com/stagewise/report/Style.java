package com.stagewise.report;

/** The few text styles of the report: a font (regular or bold) and a size in points. */
enum Style {
  TITLE(true, 20),
  HEADING(true, 13),
  BODY(false, 10),
  BODY_BOLD(true, 10),
  TABLE(false, 9),
  TABLE_HEAD(true, 9),
  SMALL(false, 8);

  private final boolean bold;
  private final double size;

  Style(boolean bold, double size) {
    this.bold = bold;
    this.size = size;
  }

  boolean bold() {
    return bold;
  }

  /** Returns the font size in points. */
  double size() {
    return size;
  }

  /**
   * Returns the distance from one baseline to the next, in points (1.25 times the size, common
   * practice).
   */
  double leading() {
    return size * 1.25;
  }
}
