package com.stagewise.ui.drawing;

/**
 * An axis-aligned rectangle in drawing coordinates (pixels before any scaling), used by the pure
 * layout classes to place things and to check that nothing overlaps.
 *
 * @param x left edge
 * @param y top edge
 * @param w width, not negative
 * @param h height, not negative
 */
record Box(double x, double y, double w, double h) {

  /** Returns the box spanning two corners given in any order. */
  static Box spanning(double x1, double y1, double x2, double y2) {
    return new Box(Math.min(x1, x2), Math.min(y1, y2), Math.abs(x2 - x1), Math.abs(y2 - y1));
  }

  /** Returns the box of the given size centred on a point. */
  static Box centred(double cx, double cy, double w, double h) {
    return new Box(cx - w / 2, cy - h / 2, w, h);
  }

  double right() {
    return x + w;
  }

  double bottom() {
    return y + h;
  }

  double cx() {
    return x + w / 2;
  }

  double cy() {
    return y + h / 2;
  }

  /** Returns whether the two boxes share interior area (touching edges do not count). */
  boolean overlaps(Box other) {
    return x < other.right() && other.x < right() && y < other.bottom() && other.y < bottom();
  }

  /** Returns whether the point lies inside or on the edge of the box. */
  boolean contains(double px, double py) {
    return px >= x && px <= right() && py >= y && py <= bottom();
  }

  /** Returns the smallest box that holds this one and the other. */
  Box union(Box other) {
    double left = Math.min(x, other.x);
    double top = Math.min(y, other.y);
    return new Box(
        left,
        top,
        Math.max(right(), other.right()) - left,
        Math.max(bottom(), other.bottom()) - top);
  }

  /** Returns this box grown by {@code margin} on every side. */
  Box grown(double margin) {
    return new Box(x - margin, y - margin, w + 2 * margin, h + 2 * margin);
  }

  /** Returns this box moved by (dx, dy). */
  Box moved(double dx, double dy) {
    return new Box(x + dx, y + dy, w, h);
  }
}
