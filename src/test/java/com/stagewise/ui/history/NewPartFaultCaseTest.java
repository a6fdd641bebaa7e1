package com.stagewise.ui.history;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.casework.Casework;
import com.stagewise.casework.StoredReadings;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.history.CaseFile;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.interchange.ReadingsSheet;
import com.stagewise.interchange.StageSheet;
import com.stagewise.report.CaseReport;
import com.stagewise.report.PdfReport;
import java.io.ByteArrayOutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A case on a stage with a diode or a trimmer, diagnosed from readings that ngspice simulated for a
 * unit with that fault (the fault truth set: the peak rectifier's D7 shorted, the offset-null
 * trimmer RV2 turned to about 0.2 of its travel), stored through the case workflow, closed with the
 * fault found, then listed on the history screen and printed in the PDF report: the fault in a
 * technician's words ("D7 shorted", "RV2 set wrong"), not its id.
 */
class NewPartFaultCaseTest {
  @TempDir Path temp;

  @ParameterizedTest(name = "{1} on {0}")
  @CsvSource({
    "ostrander-dl5-peak-rectifier, D7:short, D7 shorted",
    "quillon-lx2-offset-null, RV2:misset, RV2 set wrong"
  })
  void newPartFault_isStoredListedAndPrintedInWords(String sheet, String fault, String words)
      throws Exception {
    Stage stage = StageSheet.read(Path.of("data", "stages", sheet + ".stage.json"));
    String readingsJson = truthReadings(sheet, fault);

    try (HistoryStore store = SqliteHistory.open(temp.resolve("history.db"))) {
      Casework work = new Casework(store);
      var added = work.addUnit("NP-1", stage.board(), "");
      BoardModel model = added.boardModel();
      String caseId =
          work.openCase(added.unit().id(), "Output wrong after a repair elsewhere").id();
      ReadingSet set = ReadingsSheet.read(readingsJson, "truth.readings.json", stage);
      StoredReadings stored = work.addReadings(caseId, work.diagnoser(stage, model), set, 5);

      // The suspect list as stored holds the fault among its first three (the accuracy rule of
      // DESIGN.md "How a diagnosis is judged").
      List<StoredSuspect> suspects = stored.suspectList().suspects();
      assertThat(suspects.stream().limit(3).map(StoredSuspect::fault).toList()).contains(fault);
      work.closeCase(caseId, Outcome.FIXED, List.of(fault), "");

      // Stored: the case file holds the fault id, as files and the database do.
      CaseFile file = store.cases().caseFile(caseId).orElseThrow();
      assertThat(file.repairCase().confirmedFaults()).containsExactly(fault);
      // Found by the fault's id, as the history screen's fault search takes it.
      List<SearchHit> hits = store.cases().search(SearchQuery.all().withFaultId(fault));
      assertThat(hits).extracting(SearchHit::caseId).containsExactly(caseId);

      // Listed in words on the history screen.
      UnitHistory unit = store.cases().unitHistory(added.unit().id()).orElseThrow();
      HistoryViewModel.CaseView view = HistoryViewModel.view(file, unit);
      assertThat(view.faults()).isEqualTo(words);
      assertThat(HistoryViewModel.timeline(unit)).anySatisfy(l -> assertThat(l).endsWith(words));
      assertThat(String.join("\n", view.suspects())).contains(words).doesNotContain(fault);

      // Printed in words.
      CaseReport report = CaseReport.read(store, caseId, Instant.now(), "test build");
      ByteArrayOutputStream pdf = new ByteArrayOutputStream();
      PdfReport.write(report, pdf);
      String text;
      try (PDDocument document = Loader.loadPDF(pdf.toByteArray())) {
        text = new PDFTextStripper().getText(document).replaceAll("\\s+", " ");
      }
      assertThat(text).contains(words);
      // The fault's id shows nowhere but inside the stored next-probe texts the diagnosis wrote
      // (its power-off checks name faults by id; the report prints them as stored).
      String probes = stored.suspectList().nextProbes();
      assertThat(count(text, fault)).isEqualTo(count(probes, fault));
    }
  }

  private static int count(String text, String word) {
    int n = 0;
    for (int i = text.indexOf(word); i >= 0; i = text.indexOf(word, i + word.length())) {
      n++;
    }
    return n;
  }

  /** The first simulated unit of {@code fault} in the stage's truth file, as a readings file. */
  private static String truthReadings(String sheet, String fault) throws Exception {
    ObjectMapper json = new ObjectMapper();
    JsonNode truth =
        json.readTree(
            Files.readString(
                Path.of(
                    "src", "test", "resources", "diagnosis", "truth", "sheet-" + sheet + ".json")));
    for (JsonNode c : truth.get("cases")) {
      if (c.get("fault").asText().equals(fault)) {
        return json.writeValueAsString(
            json.createObjectNode()
                .put("format", "stagewise-readings")
                .put("version", 1)
                .set("readings", c.get("readings")));
      }
    }
    throw new AssertionError(fault + " is not in the truth file of " + sheet);
  }
}
