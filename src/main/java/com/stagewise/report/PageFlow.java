package com.stagewise.report;

import java.util.ArrayList;
import java.util.List;

/**
 * Flows text, fields, tables and boxes down A4 pages, starting a new page when the next thing does
 * not fit, and adds the running header and the page footers at the end.
 *
 * <p>All text passes through {@link Printable} here, so nothing placed is unprintable. Distances
 * are in points (1/72 inch); y grows downwards from the top of the page.
 */
final class PageFlow {
  /** A4 (ISO 216: 210 mm × 297 mm) in points. */
  static final double PAGE_WIDTH = 595.28;

  static final double PAGE_HEIGHT = 841.89;
  static final double LEFT = 50;
  static final double RIGHT = PAGE_WIDTH - 50;

  /** The top of the body on every page (below the running header). */
  static final double TOP = 58;

  /** The lowest point the body may reach (above the footer). */
  static final double BOTTOM = PAGE_HEIGHT - 62;

  private static final double HEADER_BASELINE = 34;
  private static final double HEADER_RULE = 40;
  private static final double FOOTER_RULE = PAGE_HEIGHT - 50;
  private static final double FOOTER_BASELINE = PAGE_HEIGHT - 36;

  /** Space between the text of a table cell and the next column. */
  private static final double CELL_GAP = 6;

  private static final double BOX_PADDING = 8;

  private final TextWidth measure;
  private final String runningHeader;
  private final List<List<PageItem>> pages = new ArrayList<>();
  private List<PageItem> current;
  private double y;

  /** Starts the first page; {@code runningHeader} goes at the top of every later page. */
  PageFlow(TextWidth measure, String runningHeader) {
    this.measure = measure;
    this.runningHeader = Printable.text(runningHeader);
    newPage();
  }

  /** Returns the width of the body in points. */
  static double bodyWidth() {
    return RIGHT - LEFT;
  }

  /** Returns the top of the next line on the current page. */
  double cursor() {
    return y;
  }

  /** Starts a new page. */
  void newPage() {
    current = new ArrayList<>();
    pages.add(current);
    y = TOP;
    if (pages.size() > 1) {
      current.add(new PageItem.Text(LEFT, HEADER_BASELINE, Style.SMALL, runningHeader));
      current.add(new PageItem.Line(LEFT, HEADER_RULE, RIGHT, HEADER_RULE));
    }
  }

  /**
   * Starts a new page unless {@code height} points still fit below the cursor (or the page is
   * empty).
   */
  void ensure(double height) {
    if (y + height > BOTTOM && y > TOP) {
      newPage();
    }
  }

  /** Leaves {@code points} of space, unless at the top of a page. */
  void gap(double points) {
    if (y > TOP) {
      y = Math.min(y + points, BOTTOM);
    }
  }

  /** Places wrapped text across the body. */
  void paragraph(Style style, String text) {
    paragraph(style, LEFT, bodyWidth(), text);
  }

  /** Places wrapped text starting at {@code x} within {@code width}, line by line across pages. */
  void paragraph(Style style, double x, double width, String text) {
    for (String line : LineBreaker.wrap(Printable.text(text), style, width, measure)) {
      ensure(style.leading());
      place(x, style, line);
      y += style.leading();
    }
  }

  /**
   * Places a section heading with a rule under it, on a new page if the heading and {@code
   * keepWithNext} points of what follows would not fit on this one.
   */
  void heading(String text, double keepWithNext) {
    gap(12);
    ensure(Style.HEADING.leading() + 4 + keepWithNext);
    place(LEFT, Style.HEADING, Printable.text(text));
    y += Style.HEADING.leading();
    current.add(new PageItem.Line(LEFT, y - 2, RIGHT, y - 2));
    y += 4;
  }

  /**
   * Places a bold label and its wrapped value beside it, {@code labelWidth} points to the right.
   */
  void field(String label, String value, double labelWidth) {
    Style style = Style.BODY;
    List<String> lines =
        LineBreaker.wrap(Printable.text(value), style, bodyWidth() - labelWidth, measure);
    ensure(style.leading());
    place(LEFT, Style.BODY_BOLD, Printable.text(label));
    for (int i = 0; i < lines.size(); i++) {
      if (i > 0) {
        ensure(style.leading());
      }
      place(LEFT + labelWidth, style, lines.get(i));
      y += style.leading();
    }
  }

  /**
   * Places a table: a bold header row with a rule under it, then each row with its cells wrapped to
   * their column. A row that does not fit goes to the next page, where the header is repeated; a
   * row taller than a whole page is split line by line.
   */
  void table(List<Column> columns, List<List<String>> rows) {
    Style style = Style.TABLE;
    double headerHeight = Style.TABLE_HEAD.leading() + 3;
    List<List<List<String>>> wrapped = new ArrayList<>();
    for (List<String> row : rows) {
      if (row.size() != columns.size()) {
        throw new IllegalArgumentException(
            "a row has " + row.size() + " cells for " + columns.size() + " columns");
      }
      List<List<String>> cells = new ArrayList<>();
      for (int c = 0; c < columns.size(); c++) {
        cells.add(
            LineBreaker.wrap(
                Printable.text(row.get(c)), style, columns.get(c).width() - CELL_GAP, measure));
      }
      wrapped.add(cells);
    }
    double firstRow = wrapped.isEmpty() ? 0 : rowHeight(wrapped.get(0), style);
    ensure(headerHeight + Math.min(firstRow, BOTTOM - TOP - headerHeight));
    tableHeader(columns);
    for (List<List<String>> cells : wrapped) {
      double height = rowHeight(cells, style);
      if (y + height > BOTTOM && height <= BOTTOM - TOP - headerHeight) {
        newPage();
        tableHeader(columns);
      }
      int lines = cells.stream().mapToInt(List::size).max().orElse(1);
      for (int line = 0; line < lines; line++) {
        if (y + style.leading() > BOTTOM) {
          newPage();
          tableHeader(columns);
        }
        double x = LEFT;
        for (int c = 0; c < columns.size(); c++) {
          List<String> cell = cells.get(c);
          if (line < cell.size() && !cell.get(line).isEmpty()) {
            place(x, style, cell.get(line));
          }
          x += columns.get(c).width();
        }
        y += style.leading();
      }
      y += 2;
    }
    current.add(new PageItem.Line(LEFT, y, LEFT + tableWidth(columns), y));
    y += 4;
  }

  /**
   * Places a picture of {@code pixelsWide} × {@code pixelsHigh} pixels across the body, scaled to
   * fit the body's width and a page's height less {@code reserve} points (never larger than one
   * point per pixel), on a new page if it does not fit below the cursor; returns its height.
   */
  double picture(int pixelsWide, int pixelsHigh, int photo, double reserve) {
    double fit =
        Math.min(1.0, Math.min(bodyWidth() / pixelsWide, (BOTTOM - TOP - reserve) / pixelsHigh));
    double width = pixelsWide * fit;
    double height = pixelsHigh * fit;
    ensure(height);
    current.add(new PageItem.Picture(LEFT, y, width, height, photo));
    y += height;
    return height;
  }

  /** Places a framed box with a bold title and wrapped text, kept whole on one page. */
  void box(String title, String text) {
    double inner = bodyWidth() - 2 * BOX_PADDING;
    List<String> lines = LineBreaker.wrap(Printable.text(text), Style.BODY, inner, measure);
    double height =
        2 * BOX_PADDING + Style.BODY_BOLD.leading() + lines.size() * Style.BODY.leading();
    ensure(height);
    current.add(new PageItem.Frame(LEFT, y, bodyWidth(), height));
    double top = y;
    y += BOX_PADDING;
    place(LEFT + BOX_PADDING, Style.BODY_BOLD, Printable.text(title));
    y += Style.BODY_BOLD.leading();
    for (String line : lines) {
      place(LEFT + BOX_PADDING, Style.BODY, line);
      y += Style.BODY.leading();
    }
    y = top + height;
  }

  /**
   * Adds the footers ({@code footer} on the left, "Page n of N" on the right) and returns the
   * pages; the flow is finished after this.
   */
  List<Page> finish(String footer) {
    String left = Printable.text(footer);
    List<Page> result = new ArrayList<>();
    for (int i = 0; i < pages.size(); i++) {
      List<PageItem> items = new ArrayList<>(pages.get(i));
      items.add(new PageItem.Line(LEFT, FOOTER_RULE, RIGHT, FOOTER_RULE));
      items.add(new PageItem.Text(LEFT, FOOTER_BASELINE, Style.SMALL, left));
      String number = "Page " + (i + 1) + " of " + pages.size();
      items.add(
          new PageItem.Text(
              RIGHT - measure.width(Style.SMALL, number), FOOTER_BASELINE, Style.SMALL, number));
      result.add(new Page(i + 1, items));
    }
    return result;
  }

  private void tableHeader(List<Column> columns) {
    double x = LEFT;
    for (Column column : columns) {
      place(x, Style.TABLE_HEAD, Printable.text(column.title()));
      x += column.width();
    }
    y += Style.TABLE_HEAD.leading();
    current.add(new PageItem.Line(LEFT, y, LEFT + tableWidth(columns), y));
    y += 3;
  }

  private static double rowHeight(List<List<String>> cells, Style style) {
    return cells.stream().mapToInt(List::size).max().orElse(1) * style.leading() + 2;
  }

  private static double tableWidth(List<Column> columns) {
    return Math.min(columns.stream().mapToDouble(Column::width).sum(), bodyWidth());
  }

  /** Places one line whose top is the cursor; its baseline sits one font size lower. */
  private void place(double x, Style style, String text) {
    current.add(new PageItem.Text(x, y + style.size(), style, text));
  }
}
