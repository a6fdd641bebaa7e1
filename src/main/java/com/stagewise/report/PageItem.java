package com.stagewise.report;

/**
 * One thing drawn on a report page. Coordinates are in points from the page's top-left corner (y
 * grows downwards), as the layout thinks; the PDF writer turns them over.
 */
sealed interface PageItem {
  /** A line of text whose baseline starts at (x, y). */
  record Text(double x, double y, Style style, String text) implements PageItem {}

  /** A straight line from (x1, y1) to (x2, y2), 0.5 pt wide. */
  record Line(double x1, double y1, double x2, double y2) implements PageItem {}

  /**
   * A rectangle outline with its top-left corner at (x, y), {@code width} × {@code height}, 1 pt
   * wide.
   */
  record Frame(double x, double y, double width, double height) implements PageItem {}

  /**
   * A photo of the board with its top-left corner at (x, y), scaled to {@code width} × {@code
   * height} points; {@code photo} is its place in the report's list of photos.
   */
  record Picture(double x, double y, double width, double height, int photo) implements PageItem {}
}
