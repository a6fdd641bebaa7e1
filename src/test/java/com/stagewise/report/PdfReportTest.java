package com.stagewise.report;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.diagnosis.Wording;
import com.stagewise.history.CaseFile;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.demo.DemoHistory;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Writes reports and reads them back with PDFBox's own text extraction ({@link PDFTextStripper}),
 * an independent reader of what a PDF viewer would show.
 */
class PdfReportTest {
  @TempDir Path folder;

  /**
   * The text of pages {@code from} to {@code to} (from 1), with every run of white space as one
   * space.
   */
  private static String text(PDDocument document, int from, int to) throws IOException {
    PDFTextStripper stripper = new PDFTextStripper();
    stripper.setSortByPosition(true);
    stripper.setStartPage(from);
    stripper.setEndPage(to);
    return stripper.getText(document).replaceAll("\\s+", " ");
  }

  private static String text(byte[] pdf) throws IOException {
    try (PDDocument document = Loader.loadPDF(pdf)) {
      return text(document, 1, document.getNumberOfPages());
    }
  }

  @Test
  void report_showsTheUnitCaseCautionReadingsSuspectsActionsAndNotes() throws IOException {
    CaseReport report = ReportFixture.report(folder, 12);
    String text = text(ReportFixture.pdf(report));

    assertThat(text)
        .contains(
            "Repair report",
            ReportFixture.SERIAL,
            "Northfield MX-8 channel board",
            "job 1184 — Riverside Hall");
    String opened =
        report.caseFile().repairCase().openedAt().toString(); // e.g. 2026-03-01T09:04:00Z
    assertThat(text)
        .contains(
            report.caseFile().repairCase().id(),
            "Opened " + opened.substring(0, 10) + " " + opened.substring(11, 16) + " UTC");
    assertThat(text).contains("Status closed", "Outcome fixed");
    // Characters the standard fonts lack come out as plain text: the minus sign and the ohm sign.
    assertThat(text)
        .contains(
            "Channel 2 output stuck near -13 V after a power surge; 10 kohm input path looks fine");
    assertThat(text).contains(ReportLayout.CAUTION_TITLE, ReportLayout.CAUTION_TEXT);
    for (int i = 1; i <= 12; i++) {
      assertThat(text).contains(String.format(java.util.Locale.ROOT, "TP-%03d", i));
    }
    // Reading 1 is -13.48 + 0.01 V; reading 10 is an AC reading at 1 kHz given with its own
    // uncertainty, stored as a peak (no measure), which its kind says.
    assertThat(text)
        .contains("-13.47 V", "AC peak at 1 kHz", "-13.38 V ±3 mV", "±(0.5 % + 2 counts)");
    // -13.48 + 3/100 is -13.450000000000001 in binary floating point; the report prints it as
    // typed.
    assertThat(text).contains("TP-003 DC -13.45 V").doesNotContain("0000");
    assertThat(text)
        .contains(
            Wording.fault(ReportFixture.FIRST_SUSPECT) + " 78.1 %",
            "R2 drifted high 13.8 %",
            "U1A output stuck 8.1 %")
        .doesNotContain(
            "R2:high", "U1A:stuck-low"); // fault ids stay in files, the PDF speaks words
    assertThat(text)
        .contains(
            "by Stagewise 0.1.0; verdict: fault", "R2 open (marked 47 kohm)", "SUM dc (0.37 bits)");
    assertThat(text)
        .contains(
            "part replaced R2 47k 1% (cracked) 47k 1% metal film",
            "reflow U1", "Reflowed pins 1–4.");
    assertThat(text).contains("Confirmed fault R2 open");
    assertThat(text)
        .contains(
            "Discharged the 4700 µF reservoir capacitors (“about 35 V”) before ohms checks -> 0.2 V. Label in Japanese: ??. ?");
    assertThat(text)
        .contains(
            "Generated 2026-03-04 05:06 UTC by Stagewise test build", "Page 1 of 2", "Page 2 of 2");
  }

  @Test
  void acReadings_stateTheirMeasure_rmsAndPeakToPeak() throws IOException {
    CaseReport report = ReportFixture.report(folder, 10);
    CaseFile file = report.caseFile();
    StoredReading peak = file.readings().get(9);
    List<StoredReading> readings = new ArrayList<>(file.readings());
    // The same sine stated two more ways: RMS 0.3536 V and peak-to-peak 1.000 V of a 0.5 V peak
    // (sine RMS = peak/√2, peak-to-peak = 2 × peak; any circuits textbook).
    for (String[] m : new String[][] {{"rms", "0.3536"}, {"pp", "1"}}) {
      readings.add(
          new StoredReading(
              m[0] + "-reading",
              peak.caseId(),
              "OUT",
              ReadingKind.AC,
              Double.parseDouble(m[1]),
              1000.0,
              null,
              peak.meterText(),
              peak.takenAt(),
              "",
              null,
              null,
              m[0]));
    }
    CaseReport withMeasures =
        new CaseReport(
            report.unit(),
            report.boardModel(),
            new CaseFile(
                file.repairCase(), readings, file.suspectLists(), file.actions(), file.notes()),
            report.generatedAt(),
            report.programVersion());
    String text = text(ReportFixture.pdf(withMeasures));
    assertThat(text)
        .contains(
            "OUT AC RMS at 1 kHz 353.6 mV",
            "OUT AC peak-to-peak at 1 kHz 1.000 V",
            "AC peak at 1 kHz -13.38 V ±3 mV");
  }

  @Test
  void report_with200Readings_paginatesWithRightPageNumbersAndEveryReadingOnce()
      throws IOException {
    byte[] pdf = ReportFixture.pdf(ReportFixture.report(folder, 200));
    try (PDDocument document = Loader.loadPDF(pdf)) {
      int pages = document.getNumberOfPages();
      // About 60 table rows fit on an A4 page at 9 pt, so 200 readings need at least 4 pages.
      assertThat(pages).isGreaterThanOrEqualTo(4);
      String all = text(document, 1, pages);
      for (int page = 1; page <= pages; page++) {
        String onPage = text(document, page, page);
        assertThat(onPage).as("page %d", page).contains("Page " + page + " of " + pages);
        assertThat(count(onPage, "Page \\d+ of \\d+")).as("page %d", page).isEqualTo(1);
        if (page > 1) {
          assertThat(onPage).contains("Repair report — unit " + ReportFixture.SERIAL + " — case ");
        }
        if (onPage.contains("TP-")) {
          // The table header is repeated on every page that the readings run over.
          assertThat(onPage).as("page %d", page).contains("Test point");
        }
      }
      for (int i = 1; i <= 200; i++) {
        assertThat(count(all, String.format(java.util.Locale.ROOT, "TP-%03d", i)))
            .as("reading %d", i)
            .isEqualTo(1);
      }
      assertThat(all)
          .contains(
              Wording.fault(ReportFixture.FIRST_SUSPECT) + " 78.1 %",
              ReportLayout.CAUTION_TEXT,
              "Reflowed pins 1–4.");
    }
  }

  @Test
  void report_ofEveryDemoCase_renders() throws IOException {
    try (HistoryStore store = SqliteHistory.open(folder.resolve("demo.db"))) {
      DemoHistory.fill(store);
      List<String> serials = new ArrayList<>();
      for (Unit unit : store.units().list(null)) {
        UnitHistory history = store.cases().unitHistory(unit.id()).orElseThrow();
        for (CaseFile file : history.cases()) {
          CaseReport report =
              CaseReport.read(store, file.repairCase().id(), ReportFixture.GENERATED, "test build");
          String text = text(ReportFixture.pdf(report));
          assertThat(text)
              .contains(
                  unit.serial(),
                  Printable.text(file.repairCase().symptom()).replaceAll("\\s+", " "));
          assertThat(text).contains(ReportLayout.CAUTION_TEXT);
          file.readings().forEach(r -> assertThat(text).contains(Wording.point(r.at())));
          file.notes()
              .forEach(
                  n -> assertThat(text).contains(Printable.text(n.text()).replaceAll("\\s+", " ")));
          serials.add(unit.serial());
        }
      }
      // The demo history has six cases on five units (DemoHistory).
      assertThat(serials).hasSize(6);
    }
  }

  private static int count(String text, String regex) {
    Matcher matcher = Pattern.compile(regex).matcher(text);
    int n = 0;
    while (matcher.find()) {
      n++;
    }
    return n;
  }
}
