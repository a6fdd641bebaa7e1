package com.stagewise.ui.drawing;

import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.ui.drawing.Sheet.AmpGlyph;
import com.stagewise.ui.drawing.Sheet.Caption;
import com.stagewise.ui.drawing.Sheet.Dot;
import com.stagewise.ui.drawing.Sheet.PartGlyph;
import com.stagewise.ui.drawing.Sheet.Symbol;
import com.stagewise.ui.drawing.Sheet.Wire;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.RoundRectangle2D;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.OutputStream;
import java.util.Locale;

/**
 * A stage's schematic as a picture file, from the same layout as the screen's drawing ({@link
 * SchematicLayout}), in plain Java with no toolkit: SVG text, or a PNG drawn with Java2D (works
 * headless, no display or GPU needed). Used by {@code stage draw} and by the editor's benchmark.
 */
public final class SchematicPicture {
  private static final double MARGIN = 20;
  private static final double TITLE = 15;
  private static final String FONT = "SansSerif";
  private static final String PAPER = "#fbfaf6";
  private static final String INK = "#1c2128";
  private static final String SOFT_INK = "#5b6470";
  private static final String PART_FILL = "#ffffff";
  private static final String AMP_FILL = "#eef3f8";

  private SchematicPicture() {}

  /** Lays the stage out, measuring text with Java2D's metrics of the drawing font. */
  static Sheet layout(Stage stage) {
    return SchematicLayout.layout(stage, SchematicPicture::measure);
  }

  /** Returns the laid-out schematic's size at scale 1, {width, height}, title included. */
  public static double[] size(Stage stage) {
    Box box = frame(stage, layout(stage));
    return new double[] {box.w(), box.h()};
  }

  /** Returns the schematic of a stage as an SVG document (UTF-8 text). */
  public static String svg(Stage stage) {
    Sheet sheet = layout(stage);
    Box frame = frame(stage, sheet);
    SvgPen pen = new SvgPen(frame);
    draw(stage, sheet, frame, pen);
    return pen.finish();
  }

  /**
   * Writes the schematic of a stage as a PNG picture at {@code scale} pixels per layout unit.
   *
   * @throws IOException if the stream cannot be written
   */
  public static void png(Stage stage, double scale, OutputStream out) throws IOException {
    Sheet sheet = layout(stage);
    Box frame = frame(stage, sheet);
    int width = (int) Math.ceil(frame.w() * scale);
    int height = (int) Math.ceil(frame.h() * scale);
    BufferedImage image = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
    Graphics2D g = image.createGraphics();
    try {
      g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
      g.setRenderingHint(
          RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
      g.setColor(Color.decode(PAPER));
      g.fillRect(0, 0, width, height);
      g.scale(scale, scale);
      g.translate(-frame.x(), -frame.y());
      draw(stage, sheet, frame, new AwtPen(g));
    } finally {
      g.dispose();
    }
    if (!javax.imageio.ImageIO.write(image, "png", out)) {
      throw new IOException("no PNG writer in this Java runtime");
    }
  }

  /** The title as the picture shows it: cut to about the sheet's width ({@link Titles#fitted}). */
  private static String title(Stage stage, Sheet sheet) {
    return Titles.fitted(stage.title(), sheet.bounds().w(), t -> measure(t, TITLE, true));
  }

  private static Box frame(Stage stage, Sheet sheet) {
    Box all = sheet.bounds();
    String title = title(stage, sheet);
    double titleWidth = title.isEmpty() ? 0 : measure(title, TITLE, true);
    double top = all.y() - (title.isEmpty() ? 0 : TITLE * 1.3 + 12);
    return new Box(
        all.x() - MARGIN,
        top - MARGIN,
        Math.max(all.w(), titleWidth) + 2 * MARGIN,
        all.bottom() - top + 2 * MARGIN);
  }

  private static void draw(Stage stage, Sheet sheet, Box frame, Pen pen) {
    String title = title(stage, sheet);
    if (!title.isEmpty()) {
      pen.text(frame.x() + MARGIN, frame.y() + MARGIN, title, TITLE, true, INK);
    }
    for (Wire wire : sheet.wires()) {
      pen.line(wire.x1(), wire.y1(), wire.x2(), wire.y2(), 2, INK);
    }
    for (PartGlyph part : sheet.parts()) {
      drawPart(part, pen);
    }
    for (AmpGlyph amp : sheet.amps()) {
      Box box = amp.box();
      pen.polygon(
          new double[] {box.x(), box.y(), box.x(), box.bottom(), box.right(), box.cy()},
          AMP_FILL,
          INK,
          2.2);
    }
    for (Dot dot : sheet.dots()) {
      pen.circle(dot.x(), dot.y(), 4, INK, null, 0);
    }
    for (Symbol symbol : sheet.symbols()) {
      drawSymbol(symbol, pen);
    }
    for (Caption caption : sheet.captions()) {
      caption(caption, pen);
    }
  }

  private static void drawPart(PartGlyph glyph, Pen pen) {
    Box body = glyph.body();
    if (glyph.vertical()) {
      double top = Math.min(glyph.y1(), glyph.y2());
      double bottom = Math.max(glyph.y1(), glyph.y2());
      pen.line(glyph.x1(), top, glyph.x1(), body.y(), 2, INK);
      pen.line(glyph.x1(), body.bottom(), glyph.x1(), bottom, 2, INK);
    } else {
      double left = Math.min(glyph.x1(), glyph.x2());
      double right = Math.max(glyph.x1(), glyph.x2());
      pen.line(left, glyph.y1(), body.x(), glyph.y1(), 2, INK);
      pen.line(body.right(), glyph.y1(), right, glyph.y1(), 2, INK);
    }
    if (PartShape.drawnHere(glyph.part())) {
      if (glyph.part().kind().isTrimmer()) {
        pen.rect(body.x(), body.y(), body.w(), body.h(), 0, PART_FILL, INK, 2);
      }
      PartShape shape = PartShape.of(glyph);
      for (PartShape.Stroke st : shape.strokes) {
        pen.line(st.x1(), st.y1(), st.x2(), st.y2(), st.width(), INK);
      }
      for (PartShape.Fill f : shape.fills) {
        pen.polygon(f.points(), INK, INK, 1);
      }
      for (PartShape.Label l : shape.labels) {
        pen.text(l.x(), l.y(), l.text(), PartShape.LEAD_FONT, false, SOFT_INK);
      }
      return;
    }
    if (glyph.part().kind() == PartKind.CAPACITOR) {
      if (glyph.vertical()) {
        pen.line(body.x(), body.y() + 2, body.right(), body.y() + 2, 3.2, INK);
        pen.line(body.x(), body.bottom() - 2, body.right(), body.bottom() - 2, 3.2, INK);
      } else {
        pen.line(body.x() + 2, body.y(), body.x() + 2, body.bottom(), 3.2, INK);
        pen.line(body.right() - 2, body.y(), body.right() - 2, body.bottom(), 3.2, INK);
      }
    } else {
      pen.rect(body.x(), body.y(), body.w(), body.h(), 0, PART_FILL, INK, 2);
    }
  }

  private static void drawSymbol(Symbol symbol, Pen pen) {
    double x = symbol.x();
    double y = symbol.y();
    switch (symbol.kind()) {
      case GROUND -> {
        pen.line(x, y, x, y + 8, 2, INK);
        pen.line(x - 12, y + 8, x + 12, y + 8, 2.4, INK);
        pen.line(x - 7.5, y + 13.5, x + 7.5, y + 13.5, 2.4, INK);
        pen.line(x - 3, y + 19, x + 3, y + 19, 2.4, INK);
      }
      case RAIL -> {
        boolean across =
            symbol.direction() == Sheet.Direction.UP || symbol.direction() == Sheet.Direction.DOWN;
        if (across) {
          pen.line(x - 9, y, x + 9, y, 3, INK);
        } else {
          pen.line(x, y - 9, x, y + 9, 3, INK);
        }
        caption(symbol.caption(), pen);
      }
      case INPUT, OUTPUT -> {
        double cx = symbol.direction() == Sheet.Direction.LEFT ? x - 5 : x + 5;
        pen.circle(cx, y, 5, PAPER, INK, 2);
        caption(symbol.caption(), pen);
      }
      case FLAG -> {
        Box text = symbol.caption().box().grown(3);
        double edge = symbol.direction() == Sheet.Direction.LEFT ? text.right() : text.x();
        pen.line(x, y, edge, y, 2, INK);
        pen.rect(text.x(), text.y(), text.w(), text.h(), 8, PAPER, SOFT_INK, 1.5);
        caption(symbol.caption(), pen);
      }
      default -> throw new IllegalStateException("unknown symbol " + symbol.kind());
    }
  }

  private static void caption(Caption caption, Pen pen) {
    if (caption == null) {
      return;
    }
    String colour = caption.kind() == Sheet.CaptionKind.PIN_NUMBER ? SOFT_INK : INK;
    pen.text(
        caption.box().x(),
        caption.box().y(),
        caption.text(),
        caption.size(),
        caption.bold(),
        colour);
  }

  private static final BufferedImage MEASURE_IMAGE =
      new BufferedImage(1, 1, BufferedImage.TYPE_INT_RGB);

  /** Measures a line of text in the drawing font with Java2D (headless works). */
  static double measure(String text, double size, boolean bold) {
    Graphics2D g = MEASURE_IMAGE.createGraphics();
    try {
      g.setFont(new Font(FONT, bold ? Font.BOLD : Font.PLAIN, 1).deriveFont((float) size));
      return Math.ceil(g.getFontMetrics().getStringBounds(text, g).getWidth());
    } finally {
      g.dispose();
    }
  }

  /** What a picture is drawn with; coordinates in layout units, text placed by its top-left. */
  private interface Pen {
    void line(double x1, double y1, double x2, double y2, double width, String colour);

    void rect(
        double x,
        double y,
        double w,
        double h,
        double arc,
        String fill,
        String stroke,
        double width);

    void polygon(double[] points, String fill, String stroke, double width);

    void circle(double cx, double cy, double r, String fill, String stroke, double width);

    void text(double x, double top, String text, double size, boolean bold, String colour);
  }

  private static final class SvgPen implements Pen {
    private final StringBuilder svg = new StringBuilder();

    SvgPen(Box frame) {
      svg.append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n")
          .append("<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"")
          .append(n(frame.w()))
          .append("\" height=\"")
          .append(n(frame.h()))
          .append("\" viewBox=\"")
          .append(n(frame.x()))
          .append(' ')
          .append(n(frame.y()))
          .append(' ')
          .append(n(frame.w()))
          .append(' ')
          .append(n(frame.h()))
          .append("\">\n")
          .append("<rect x=\"")
          .append(n(frame.x()))
          .append("\" y=\"")
          .append(n(frame.y()))
          .append("\" width=\"100%\" height=\"100%\" fill=\"")
          .append(PAPER)
          .append("\"/>\n");
    }

    @Override
    public void line(double x1, double y1, double x2, double y2, double width, String colour) {
      svg.append(
          String.format(
              Locale.ROOT,
              "<line x1=\"%s\" y1=\"%s\" x2=\"%s\" y2=\"%s\" stroke=\"%s\" stroke-width=\"%s\""
                  + " stroke-linecap=\"round\"/>\n",
              n(x1),
              n(y1),
              n(x2),
              n(y2),
              colour,
              n(width)));
    }

    @Override
    public void rect(
        double x,
        double y,
        double w,
        double h,
        double arc,
        String fill,
        String stroke,
        double width) {
      svg.append(
          String.format(
              Locale.ROOT,
              "<rect x=\"%s\" y=\"%s\" width=\"%s\" height=\"%s\" rx=\"%s\" fill=\"%s\""
                  + " stroke=\"%s\" stroke-width=\"%s\"/>\n",
              n(x),
              n(y),
              n(w),
              n(h),
              n(arc / 2),
              fill,
              stroke,
              n(width)));
    }

    @Override
    public void polygon(double[] points, String fill, String stroke, double width) {
      StringBuilder list = new StringBuilder();
      for (int i = 0; i < points.length; i += 2) {
        list.append(i == 0 ? "" : " ").append(n(points[i])).append(',').append(n(points[i + 1]));
      }
      svg.append(
          String.format(
              Locale.ROOT,
              "<polygon points=\"%s\" fill=\"%s\" stroke=\"%s\" stroke-width=\"%s\""
                  + " stroke-linejoin=\"round\"/>\n",
              list,
              fill,
              stroke,
              n(width)));
    }

    @Override
    public void circle(double cx, double cy, double r, String fill, String stroke, double width) {
      svg.append(
          String.format(
              Locale.ROOT,
              "<circle cx=\"%s\" cy=\"%s\" r=\"%s\" fill=\"%s\"%s/>\n",
              n(cx),
              n(cy),
              n(r),
              fill,
              stroke == null
                  ? ""
                  : " stroke=\"" + stroke + "\" stroke-width=\"" + n(width) + "\""));
    }

    @Override
    public void text(double x, double top, String text, double size, boolean bold, String colour) {
      svg.append(
          String.format(
              Locale.ROOT,
              "<text x=\"%s\" y=\"%s\" font-family=\"DejaVu Sans, Arial, sans-serif\""
                  + " font-size=\"%s\"%s fill=\"%s\" dominant-baseline=\"text-before-edge\">%s"
                  + "</text>\n",
              n(x),
              n(top),
              n(size),
              bold ? " font-weight=\"bold\"" : "",
              colour,
              escape(text)));
    }

    String finish() {
      return svg.append("</svg>\n").toString();
    }

    private static String n(double value) {
      return String.format(Locale.ROOT, "%.2f", value);
    }

    private static String escape(String text) {
      return text.replace("&", "&amp;")
          .replace("<", "&lt;")
          .replace(">", "&gt;")
          .replace("\"", "&quot;");
    }
  }

  private static final class AwtPen implements Pen {
    private final Graphics2D g;

    AwtPen(Graphics2D g) {
      this.g = g;
    }

    @Override
    public void line(double x1, double y1, double x2, double y2, double width, String colour) {
      g.setColor(Color.decode(colour));
      g.setStroke(new BasicStroke((float) width, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
      g.draw(new Line2D.Double(x1, y1, x2, y2));
    }

    @Override
    public void rect(
        double x,
        double y,
        double w,
        double h,
        double arc,
        String fill,
        String stroke,
        double width) {
      RoundRectangle2D shape = new RoundRectangle2D.Double(x, y, w, h, arc, arc);
      g.setColor(Color.decode(fill));
      g.fill(shape);
      g.setColor(Color.decode(stroke));
      g.setStroke(new BasicStroke((float) width));
      g.draw(shape);
    }

    @Override
    public void polygon(double[] points, String fill, String stroke, double width) {
      Path2D.Double path = new Path2D.Double();
      path.moveTo(points[0], points[1]);
      for (int i = 2; i < points.length; i += 2) {
        path.lineTo(points[i], points[i + 1]);
      }
      path.closePath();
      g.setColor(Color.decode(fill));
      g.fill(path);
      g.setColor(Color.decode(stroke));
      g.setStroke(new BasicStroke((float) width, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND));
      g.draw(path);
    }

    @Override
    public void circle(double cx, double cy, double r, String fill, String stroke, double width) {
      Ellipse2D shape = new Ellipse2D.Double(cx - r, cy - r, 2 * r, 2 * r);
      g.setColor(Color.decode(fill));
      g.fill(shape);
      if (stroke != null) {
        g.setColor(Color.decode(stroke));
        g.setStroke(new BasicStroke((float) width));
        g.draw(shape);
      }
    }

    @Override
    public void text(double x, double top, String text, double size, boolean bold, String colour) {
      g.setFont(new Font(FONT, bold ? Font.BOLD : Font.PLAIN, 1).deriveFont((float) size));
      g.setColor(Color.decode(colour));
      g.drawString(text, (float) x, (float) (top + g.getFontMetrics().getAscent()));
    }
  }
}
