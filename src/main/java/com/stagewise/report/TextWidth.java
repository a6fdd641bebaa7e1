package com.stagewise.report;

/** Measures text as it will be printed, so that the layout can wrap and align it. */
@FunctionalInterface
interface TextWidth {
  /** Returns the width in points of {@code text} (already {@link Printable}) in {@code style}. */
  double width(Style style, String text);
}
