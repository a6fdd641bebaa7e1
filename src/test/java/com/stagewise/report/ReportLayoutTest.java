package com.stagewise.report;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.CaseFile;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The layout keeps every line inside the page's margins, however long the texts are. */
class ReportLayoutTest {
  private static final double EPSILON = 1e-6;
  private static final double FOOTER_BASELINE = PageFlow.PAGE_HEIGHT - 36;

  @TempDir Path folder;

  @Test
  void lay_longTextsAndManyReadings_stayInsideTheMarginsOnEveryPage() {
    CaseReport stored = ReportFixture.report(folder, 150);
    CaseFile file = stored.caseFile();
    // A suspect whose explanation is longer than a whole page, and a note of one unbroken word.
    String longWhy = "Explains the reading at U1.1 within its spread. ".repeat(400);
    SuspectListRecord list = file.suspectLists().get(0);
    List<StoredSuspect> suspects = new ArrayList<>(list.suspects());
    suspects.add(new StoredSuspect("R1:high", 0.001, List.of("R1:high"), longWhy, 4));
    List<CaseNote> notes = new ArrayList<>(file.notes());
    CaseNote first = notes.get(0);
    notes.add(new CaseNote("n2", first.caseId(), first.at(), "x".repeat(3000), first.updatedAt()));
    CaseFile longer =
        new CaseFile(
            file.repairCase(),
            file.readings(),
            List.of(
                new SuspectListRecord(
                    list.id(),
                    list.caseId(),
                    list.computedAt(),
                    list.programVersion(),
                    list.verdict(),
                    suspects,
                    list.nextProbes())),
            file.actions(),
            notes);
    CaseReport report =
        new CaseReport(
            stored.unit(),
            stored.boardModel(),
            longer,
            stored.generatedAt(),
            stored.programVersion());

    PdfReport.Fonts fonts = new PdfReport.Fonts();
    List<Page> pages = ReportLayout.lay(report, fonts::width);
    assertThat(pages.size()).isGreaterThan(5);
    int words = 0;
    for (Page page : pages) {
      for (PageItem.Text text : page.texts()) {
        double right = text.x() + fonts.width(text.style(), text.text());
        assertThat(text.x())
            .as("page %d: %s", page.number(), text.text())
            .isGreaterThanOrEqualTo(PageFlow.LEFT - EPSILON);
        assertThat(right)
            .as("page %d: %s", page.number(), text.text())
            .isLessThanOrEqualTo(PageFlow.RIGHT + EPSILON);
        boolean footer = Math.abs(text.y() - FOOTER_BASELINE) < EPSILON;
        assertThat(footer || text.y() <= PageFlow.BOTTOM)
            .as("page %d: %s at %f", page.number(), text.text(), text.y())
            .isTrue();
        words += text.text().split("Explains the reading", -1).length - 1;
      }
    }
    // Split across pages, the long explanation is still all there.
    assertThat(words).isEqualTo(400);
  }
}
