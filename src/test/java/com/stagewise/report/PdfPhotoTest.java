package com.stagewise.report;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.Cases;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.SteppingClock;
import com.stagewise.history.TestPictures;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.cos.COSName;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDResources;
import org.apache.pdfbox.pdmodel.graphics.PDXObject;
import org.apache.pdfbox.pdmodel.graphics.image.PDImageXObject;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A case's photos of the board in its report: the real PDF is opened with PDFBox and its pages'
 * image XObjects (PDF 1.7, ISO 32000-1, section 8.9.5) are read back with their size in pixels.
 */
class PdfPhotoTest {
  @TempDir Path folder;

  private CaseReport reportWith(byte[]... pictures) {
    SteppingClock clock = ReportFixture.steppingClock();
    try (HistoryStore store = SqliteHistory.open(folder.resolve("history.db"), clock)) {
      String id = ReportFixture.storeCase(store, clock, 3);
      for (int i = 0; i < pictures.length; i++) {
        store.cases().attachPhoto(id, new Cases.PhotoDraft("board-" + (i + 1), pictures[i], "Ann"));
      }
      return CaseReport.read(store, id, ReportFixture.GENERATED, "test build");
    }
  }

  private static List<PDImageXObject> images(PDDocument document) throws IOException {
    List<PDImageXObject> images = new ArrayList<>();
    for (PDPage page : document.getPages()) {
      PDResources resources = page.getResources();
      for (COSName name : resources.getXObjectNames()) {
        PDXObject x = resources.getXObject(name);
        if (x instanceof PDImageXObject image) {
          images.add(image);
        }
      }
    }
    return images;
  }

  @Test
  void report_withAPngAndAJpeg_holdsBothAsImages_scaledIntoThePage_withTheirCaptions()
      throws IOException {
    // A photo wider than the page (2000 px) must be scaled down to the body's width.
    CaseReport report = reportWith(TestPictures.png(2000, 1500), TestPictures.jpeg(320, 240));
    byte[] pdf = ReportFixture.pdf(report);
    try (PDDocument document = Loader.loadPDF(pdf)) {
      List<PDImageXObject> images = images(document);
      assertThat(images)
          .extracting(i -> i.getWidth() + "x" + i.getHeight())
          .containsExactlyInAnyOrder("2000x1500", "320x240");
      // The JPEG is carried as it is (DCT-encoded), not decoded and re-encoded.
      assertThat(images).anyMatch(i -> i.getSuffix() != null && i.getSuffix().equals("jpg"));
      String text = new PDFTextStripper().getText(document).replaceAll("\\s+", " ");
      assertThat(text).contains("Photos of the board (2)");
      assertThat(text).contains("1. board-1 — attached", "by Ann (2000 × 1500 pixels)");
      assertThat(text).contains("2. board-2 — attached", "(320 × 240 pixels)");
    }
  }

  @Test
  void layout_scalesAWidePhotoToTheBodyWidth_andKeepsItsShape() {
    CaseReport report = reportWith(TestPictures.png(2000, 1500));
    List<PageItem.Picture> pictures = new ArrayList<>();
    for (Page page : ReportLayout.lay(report, (style, text) -> text.length() * 5.0)) {
      page.items().stream()
          .filter(PageItem.Picture.class::isInstance)
          .map(PageItem.Picture.class::cast)
          .forEach(pictures::add);
    }
    assertThat(pictures).hasSize(1);
    PageItem.Picture p = pictures.get(0);
    assertThat(p.width())
        .isCloseTo(PageFlow.bodyWidth(), org.assertj.core.data.Offset.offset(1e-9));
    assertThat(p.width() / p.height())
        .isCloseTo(2000.0 / 1500.0, org.assertj.core.data.Offset.offset(1e-9));
    assertThat(p.y() + p.height()).isLessThanOrEqualTo(PageFlow.BOTTOM);
  }

  @Test
  void report_withoutPhotos_hasNoImageAndNoPhotoSection() throws IOException {
    byte[] pdf = ReportFixture.pdf(reportWith());
    try (PDDocument document = Loader.loadPDF(pdf)) {
      assertThat(images(document)).isEmpty();
      assertThat(new PDFTextStripper().getText(document)).doesNotContain("Photos of the board");
    }
  }
}
