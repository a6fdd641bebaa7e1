package com.stagewise.ui;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.record.Outcome;
import com.stagewise.ui.closeout.CloseOutViewModel;
import com.stagewise.ui.history.HistoryViewModel;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The repair report saved from the app: from the close-out (as the case is closed) and from the
 * history screen, where the technician chooses; a cancelled chooser saves nothing.
 */
class ReportSavingTest {
  @TempDir Path temp;
  private TestBench t;
  private String caseId;
  private final List<String> asked = new ArrayList<>();

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    var board = t.store.units().boardModel("Test amp board", "");
    var unit = t.store.units().add("TA-7/2", board.id(), "");
    t.bench.showUnit(unit, board);
    t.bench.startCase(t.store.cases().open(unit.id(), "Output pinned"));
    caseId = t.bench.openCaseProperty().get().id();
    t.bench.stageProperty().set(TestBench.invertingStage(board.name()));
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  private void answer(Path file) {
    t.bench.setFiles(
        (title, name, kind, pattern) -> {
          asked.add(title + " | " + name + " | " + pattern);
          return Optional.ofNullable(file);
        });
  }

  private static String pdfText(Path file) throws IOException {
    try (PDDocument document = Loader.loadPDF(file.toFile())) {
      return new PDFTextStripper().getText(document).replaceAll("\\s+", " ");
    }
  }

  @Test
  void closingWithTheReportTicked_savesThePdfOfTheClosedCaseWhereChosen() throws IOException {
    Path out = temp.resolve("out").resolve("ta7-report");
    Files.createDirectories(out.getParent());
    answer(out);
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);
    closeOut.toggleFault("R2:open", true);
    closeOut.outcomeProperty().set(Outcome.FIXED);
    closeOut.saveReportProperty().set(true);

    closeOut.closeCase();

    // The chooser offers a name with the serial made safe for a file name and the short case id.
    assertThat(asked).hasSize(1);
    assertThat(asked.get(0)).contains("repair-report-TA-7-2-", ".pdf", "*.pdf");
    Path pdf = out.resolveSibling("ta7-report.pdf");
    assertThat(pdf).exists();
    assertThat(Files.readString(pdf, java.nio.charset.StandardCharsets.ISO_8859_1))
        .startsWith("%PDF-");
    assertThat(pdfText(pdf)).contains("TA-7/2", "Output pinned");
    assertThat(t.problems).containsExactly("Report saved");
  }

  @Test
  void closingWithoutTheReport_asksForNoFile() {
    answer(temp.resolve("never.pdf"));
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);
    closeOut.toggleFault("R2:open", true);
    closeOut.outcomeProperty().set(Outcome.FIXED);

    closeOut.closeCase();

    assertThat(asked).isEmpty();
    assertThat(temp.resolve("never.pdf")).doesNotExist();
  }

  @Test
  void historyScreen_savesTheShownCasesReport_andSaysWhere() throws IOException {
    Path pdf = temp.resolve("shown.pdf");
    answer(pdf);
    HistoryViewModel history = new HistoryViewModel(t.bench);
    history.show(caseId);

    history.saveReport();

    assertThat(pdf).exists();
    assertThat(pdfText(pdf)).contains("TA-7/2");
    assertThat(history.reportNoteProperty().get()).contains("Report saved: shown.pdf", "page");
  }

  @Test
  void aCancelledChooser_savesNothingAndSaysNothing() {
    answer(null);
    HistoryViewModel history = new HistoryViewModel(t.bench);
    history.show(caseId);

    history.saveReport();

    assertThat(history.reportNoteProperty().get()).isEmpty();
    assertThat(t.problems).isEmpty();
  }

  @Test
  void aFolderThatCannotBeWritten_isAProblemThatSaysWhatToDo() {
    answer(temp.resolve("no-such-folder").resolve("r.pdf"));
    HistoryViewModel history = new HistoryViewModel(t.bench);
    history.show(caseId);

    history.saveReport();

    assertThat(t.problems).containsExactly("Could not save the report");
    assertThat(t.problemTexts.get(0)).contains("Choose a folder you can write to");
  }
}
