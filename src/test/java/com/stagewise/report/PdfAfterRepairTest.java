package com.stagewise.report;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.SteppingClock;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The report's "After repair" section, read back from the real PDF with PDFBox's own text
 * extraction: each point read again with its value, its healthy band and whether it is inside,
 * apart from the readings of the fault. Values: the textbook inverting amplifier's output (−4.7 V,
 * band ±2 % for two 1 % resistors) and a rail.
 */
class PdfAfterRepairTest {
  @TempDir Path folder;

  private String pdfText(boolean withCheck) throws IOException {
    return pdfText(withCheck, false);
  }

  private String pdfText(boolean withCheck, boolean acAndOhms) throws IOException {
    SteppingClock clock = ReportFixture.steppingClock();
    CaseReport report;
    try (HistoryStore store = SqliteHistory.open(folder.resolve("history.db"), clock)) {
      String id = ReportFixture.storeCase(store, clock, 3);
      if (withCheck) {
        store
            .cases()
            .addAfterRepair(
                id,
                List.of(
                    new AfterRepairReading(
                        HistoryStore.newId(),
                        id,
                        "U1.1",
                        -4.71,
                        "m",
                        clock.instant(),
                        -4.80,
                        -4.60),
                    new AfterRepairReading(
                        HistoryStore.newId(),
                        id,
                        "U1.8",
                        11.20,
                        "m",
                        clock.instant(),
                        14.25,
                        15.75)));
      }
      if (acAndOhms) {
        // The textbook inverting amplifier: 0.332 V RMS out for 0.1 V peak in at gain 4.7 (a
        // sine's peak over √2); with the power off R2 = 47 kΩ ± 1 % between SUM and OUT.
        store
            .cases()
            .addAfterRepair(
                id,
                List.of(
                    new AfterRepairReading(
                        HistoryStore.newId(),
                        id,
                        "U1.1",
                        0.333,
                        "scope",
                        clock.instant(),
                        0.329,
                        0.336,
                        ReadingKind.AC,
                        "rms",
                        1000.0,
                        ""),
                    new AfterRepairReading(
                        HistoryStore.newId(),
                        id,
                        "SUM",
                        Double.POSITIVE_INFINITY,
                        "meter, ohms",
                        clock.instant(),
                        46_530.0,
                        47_470.0,
                        ReadingKind.OHMS,
                        null,
                        null,
                        "OUT")));
      }
      report = CaseReport.read(store, id, ReportFixture.GENERATED, "test build");
    }
    try (PDDocument document = Loader.loadPDF(ReportFixture.pdf(report))) {
      return new PDFTextStripper().getText(document).replaceAll("\\s+", " ");
    }
  }

  @Test
  void report_hasTheAfterRepairSection_withEachPointAgainstItsBand() throws IOException {
    String text = pdfText(true);
    assertThat(text).contains("After repair", "1 of 2 inside the healthy band.");
    assertThat(text).contains("-4.710 V", "-4.8 V to -4.6 V", "inside");
    assertThat(text).contains("11.20 V", "14.25 V to 15.75 V", "OUTSIDE");
    assertThat(text).contains("not part of the diagnosis");
    // After the suspects, before the actions.
    assertThat(text.indexOf("After repair")).isGreaterThan(text.indexOf("Suspects as computed"));
    assertThat(text.indexOf("After repair")).isLessThan(text.lastIndexOf("Actions"));
  }

  @Test
  void report_listsAcAndOhmsPoints_withTheirKindMeasureAndBand() throws IOException {
    String text = pdfText(false, true);
    assertThat(text).contains("After repair", "1 of 2 inside the healthy band.");
    // Printable writes the no-break space as a space and Ω as "ohm" (PDF standard fonts).
    assertThat(text).contains("U1 pin 1", "AC RMS at 1 kHz", "333.0 mV", "329 mV to 336 mV");
    assertThat(text).contains("SUM to OUT", "ohms (power off)", "OL", "46.53 kohm to 47.47 kohm");
    assertThat(text).contains("OUTSIDE", "inside");
  }

  @Test
  void report_withoutACheck_hasNoAfterRepairSection() throws IOException {
    assertThat(pdfText(false)).doesNotContain("After repair");
  }
}
