package com.stagewise.report;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.util.Calendar;
import java.util.GregorianCalendar;
import java.util.List;
import java.util.TimeZone;
import java.util.logging.Level;
import java.util.logging.Logger;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDDocumentInformation;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDPageContentStream;
import org.apache.pdfbox.pdmodel.common.PDRectangle;
import org.apache.pdfbox.pdmodel.font.PDType1Font;
import org.apache.pdfbox.pdmodel.font.Standard14Fonts;
import org.apache.pdfbox.pdmodel.graphics.image.PDImageXObject;

/** Writes a repair report as a PDF (A4, the standard Helvetica fonts, nothing embedded). */
public final class PdfReport {
  /**
   * PDFBox looks for a Helvetica on this machine to draw with and notes (once per font, at warning
   * level) when it borrows a look-alike. A written PDF never needs it (the viewer supplies the
   * standard fonts), so its font notes are kept to real errors. Held here so that the setting is
   * not collected with the logger.
   */
  private static final Logger FONT_NOTES = Logger.getLogger("org.apache.pdfbox.pdmodel.font");

  static {
    FONT_NOTES.setLevel(Level.SEVERE);
  }

  private PdfReport() {}

  /**
   * Writes the report of one case to {@code out} and returns its number of pages.
   *
   * @throws IOException if {@code out} cannot be written
   */
  public static int write(CaseReport report, OutputStream out) throws IOException {
    try (PDDocument document = new PDDocument()) {
      Fonts fonts = new Fonts();
      List<Page> pages = ReportLayout.lay(report, fonts::width);
      Pictures pictures = new Pictures(document, report);
      for (Page page : pages) {
        PDPage pdfPage =
            new PDPage(new PDRectangle((float) PageFlow.PAGE_WIDTH, (float) PageFlow.PAGE_HEIGHT));
        document.addPage(pdfPage);
        try (PDPageContentStream content = new PDPageContentStream(document, pdfPage)) {
          for (PageItem item : page.items()) {
            draw(content, fonts, pictures, item);
          }
        }
      }
      PDDocumentInformation info = document.getDocumentInformation();
      info.setTitle(Printable.text("Repair report, unit " + report.unit().serial()));
      info.setSubject("Case " + report.caseFile().repairCase().id());
      info.setCreator("Stagewise " + report.programVersion());
      Calendar created = new GregorianCalendar(TimeZone.getTimeZone("UTC"), java.util.Locale.ROOT);
      created.setTimeInMillis(report.generatedAt().toEpochMilli());
      info.setCreationDate(created);
      document.save(out);
      return pages.size();
    }
  }

  private static void draw(
      PDPageContentStream content, Fonts fonts, Pictures pictures, PageItem item)
      throws IOException {
    // The layout measures y downwards from the top; PDF measures it upwards from the bottom.
    double height = PageFlow.PAGE_HEIGHT;
    if (item instanceof PageItem.Text text) {
      content.beginText();
      content.setFont(fonts.font(text.style()), (float) text.style().size());
      content.newLineAtOffset((float) text.x(), (float) (height - text.y()));
      content.showText(text.text());
      content.endText();
    } else if (item instanceof PageItem.Line line) {
      content.setLineWidth(0.5f);
      content.moveTo((float) line.x1(), (float) (height - line.y1()));
      content.lineTo((float) line.x2(), (float) (height - line.y2()));
      content.stroke();
    } else if (item instanceof PageItem.Frame frame) {
      content.setLineWidth(1f);
      content.addRect(
          (float) frame.x(),
          (float) (height - frame.y() - frame.height()),
          (float) frame.width(),
          (float) frame.height());
      content.stroke();
    } else if (item instanceof PageItem.Picture picture) {
      float bottom = (float) (height - picture.y() - picture.height());
      PDImageXObject image = pictures.image(picture.photo());
      if (image != null) {
        content.drawImage(
            image, (float) picture.x(), bottom, (float) picture.width(), (float) picture.height());
      } else {
        // A picture that PDFBox cannot read is said so in its place; the rest of the report stands.
        content.setLineWidth(1f);
        content.addRect(
            (float) picture.x(), bottom, (float) picture.width(), (float) picture.height());
        content.stroke();
        content.beginText();
        content.setFont(fonts.font(Style.BODY), (float) Style.BODY.size());
        content.newLineAtOffset((float) picture.x() + 6, bottom + (float) picture.height() - 14);
        content.showText("This picture could not be read; it is kept in the history.");
        content.endText();
      }
    }
  }

  /** The report's photos as PDF images, each made once however often it is drawn. */
  private static final class Pictures {
    private final PDDocument document;
    private final CaseReport report;
    private final java.util.Map<Integer, PDImageXObject> made = new java.util.HashMap<>();

    Pictures(PDDocument document, CaseReport report) {
      this.document = document;
      this.report = report;
    }

    /** Returns the photo as an image of the document, or null if its picture cannot be read. */
    PDImageXObject image(int photo) {
      if (!made.containsKey(photo)) {
        PDImageXObject image;
        try {
          image =
              PDImageXObject.createFromByteArray(
                  document,
                  report.photos().get(photo).image(),
                  report.photos().get(photo).photo().fileName());
        } catch (IOException | RuntimeException e) {
          image = null;
        }
        made.put(photo, image);
      }
      return made.get(photo);
    }
  }

  /** Helvetica and Helvetica-Bold, two of the 14 standard PDF fonts, and their text widths. */
  static final class Fonts {
    private final PDType1Font regular = new PDType1Font(Standard14Fonts.FontName.HELVETICA);
    private final PDType1Font bold = new PDType1Font(Standard14Fonts.FontName.HELVETICA_BOLD);

    PDType1Font font(Style style) {
      return style.bold() ? bold : regular;
    }

    /**
     * Returns the width of {@code text} in points; the font's widths are per 1000 units of size.
     */
    double width(Style style, String text) {
      try {
        return font(style).getStringWidth(text) / 1000.0 * style.size();
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
    }
  }
}
