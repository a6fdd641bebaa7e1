package com.stagewise.casework;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import com.stagewise.history.CaseFile;
import com.stagewise.history.ExportSelection;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.Units;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.interchange.history.HistoryBundleJson;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * AC readings keep their measure in the history (DESIGN.md, Readings: {@code "measure"}): stored
 * with the case, carried by a bundle into another bench, and read back as the same reading.
 */
class MeasureCaseworkTest {
  @TempDir Path folder;
  private HistoryStore store;
  private Casework casework;
  private final Clock clock =
      Clock.fixed(Instant.parse("2026-05-06T09:10:11.123Z"), ZoneOffset.UTC);

  @BeforeEach
  void open() {
    store = SqliteHistory.open(folder.resolve("bench.db"), clock);
    casework = new Casework(store, clock);
  }

  @AfterEach
  void close() {
    store.close();
  }

  private CaseAtHand driverCase(String sheet) throws Exception {
    Path path = folder.resolve("d.stage.json");
    Files.writeString(path, sheet, StandardCharsets.UTF_8);
    casework.addBoardModel("TB-1", "Test maker", List.of(path));
    Units.AddedUnit unit = casework.addUnit("TB1-0001", "tb-1", "job 12");
    RepairCase opened = casework.openCase(unit.unit().id(), "no output");
    return casework.caseAtHand(opened.id().substring(0, 8));
  }

  private List<StoredReading> add(CaseAtHand at, List<Reading> readings) {
    Stage stage = casework.storedStage(at.boardModel(), null).stage();
    ReadingSet set = new ReadingSet(MeterSpec.DEFAULT, readings);
    casework.addReadings(at.id(), casework.diagnoser(stage, at.boardModel()), set, 5);
    return store.cases().caseFile(at.id()).orElseThrow().readings();
  }

  @Test
  void eachMeasure_isStoredWithTheReading_peakAsBefore() throws Exception {
    CaseAtHand at = driverCase(CaseworkTest.DRIVER);
    List<StoredReading> kept =
        add(
            at,
            List.of(
                Reading.dc("U1.8", 14.97),
                Reading.ac("OUT", 0.332, 1000, AcMeasure.RMS),
                Reading.ac("OUT", 0.94, 1000, AcMeasure.PP),
                Reading.ac("OUT", 0.47, 1000)));
    assertThat(kept)
        .extracting(StoredReading::measureWord)
        .containsExactly("", "rms", "pp", "peak");
    // A peak reading (the driver's input is stated as a peak) is stored as before: no measure.
    assertThat(kept.get(3).measure()).isNull();
    assertThat(kept.get(1).measure()).isEqualTo("rms");
  }

  @Test
  void readingWithoutMeasure_onAnRmsStage_isStoredAsRms() throws Exception {
    String rmsSheet =
        CaseworkTest.DRIVER.replace(
            "\"ac\": 0.1, \"hz\": 1000}", "\"ac\": 0.1, \"hz\": 1000, \"measure\": \"rms\"}");
    CaseAtHand at = driverCase(rmsSheet);
    Stage stage = casework.storedStage(at.boardModel(), null).stage();
    assertThat(stage.inputs()).extracting(TestInput::measure).containsExactly(AcMeasure.RMS);
    List<StoredReading> kept = add(at, List.of(Reading.ac("OUT", 0.47, 1000)));
    assertThat(kept.get(0).measureWord()).isEqualTo("rms");
  }

  @Test
  void bundle_carriesTheMeasure_andLeavesPeakOutAsBefore() throws Exception {
    CaseAtHand at = driverCase(CaseworkTest.DRIVER);
    add(at, List.of(Reading.ac("OUT", 0.332, 1000, AcMeasure.RMS), Reading.ac("OUT", 0.47, 1000)));
    Path bundle = folder.resolve("case.bundle.json");
    HistoryBundle exported = store.transfer().export(new ExportSelection.All(), "test");
    HistoryBundleJson.write(exported, bundle);
    String json = Files.readString(bundle);
    assertThat(json).containsOnlyOnce("\"measure\" : \"rms\"");
    try (HistoryStore other = SqliteHistory.open(folder.resolve("other.db"), clock)) {
      other.transfer().importBundle(HistoryBundleJson.read(bundle), bundle.toString());
      CaseFile copy = other.cases().caseFile(at.id()).orElseThrow();
      assertThat(copy.readings())
          .extracting(StoredReading::measureWord)
          .containsExactly("rms", "peak");
      assertThat(copy.readings())
          .containsExactlyElementsOf(store.cases().caseFile(at.id()).orElseThrow().readings());
    }
  }
}
