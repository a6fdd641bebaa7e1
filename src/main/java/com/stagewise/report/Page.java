package com.stagewise.report;

import java.util.List;

/**
 * One laid-out page of a report.
 *
 * @param number its page number, from 1
 * @param items what is drawn on it, in drawing order
 */
record Page(int number, List<PageItem> items) {
  Page {
    items = List.copyOf(items);
  }

  /** Returns the texts on the page, top to bottom as placed. */
  List<PageItem.Text> texts() {
    return items.stream()
        .filter(PageItem.Text.class::isInstance)
        .map(PageItem.Text.class::cast)
        .toList();
  }
}
