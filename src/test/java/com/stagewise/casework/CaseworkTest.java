package com.stagewise.casework;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.history.CaseFile;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.StorageException;
import com.stagewise.history.Units;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.interchange.StageSheet;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The case workflow on a real history file in a temporary folder. */
class CaseworkTest {
  /**
   * An inverting line driver, gain -R2/R1 = -4.7, on ±15 V rails (an invented stage of our own).
   */
  static final String DRIVER =
      """
      {"format": "stagewise-stage", "version": 1,
       "title": "Line driver", "board": "Test board TB-1", "ground": "GND",
       "rails": [ {"net": "VCC", "volts": 15, "tolerance": "5%"},
                  {"net": "VEE", "volts": -15, "tolerance": "5%"} ],
       "inputs": [ {"net": "IN", "dc": 1.0, "ac": 0.1, "hz": 1000} ],
       "parts": [
         {"ref": "R1", "kind": "resistor", "value": "10k", "tolerance": "1%", "nets": ["IN", "SUM"]},
         {"ref": "R2", "kind": "resistor", "value": "47k", "tolerance": "1%", "nets": ["SUM", "OUT"]}
       ],
       "amplifiers": [
         {"ref": "U1A", "package": "U1", "packageType": "dual-8", "section": "A",
          "class": "classic-bipolar",
          "inPlus": "GND", "inMinus": "SUM", "out": "OUT", "vPlus": "VCC", "vMinus": "VEE"} ]}
      """;

  /** The same board's second stage, a buffer, so that a library can hold two. */
  static final String BUFFER = DRIVER.replace("Line driver", "Output buffer").replace("47k", "10k");

  /**
   * Readings of the driver with R2 open: the stage runs open-loop, so with +1 V at IN the output
   * sits at its lower limit, about 1.5 V above the -15 V rail for a classic bipolar part
   * (DESIGN.md, device classes), and the inverting input follows IN through R1 (textbook op-amp
   * behaviour, common practice).
   */
  static List<Reading> openFeedback() {
    return List.of(
        Reading.dc("U1.8", 14.97),
        Reading.dc("U1.4", -14.96),
        Reading.dc("U1.1", -13.48),
        Reading.dc("U1.2", 0.99));
  }

  @TempDir Path folder;
  private Path file;
  private HistoryStore store;
  private Casework casework;
  private final Clock clock =
      Clock.fixed(Instant.parse("2026-05-06T09:10:11.123Z"), ZoneOffset.UTC);

  @BeforeEach
  void open() {
    file = folder.resolve("bench.db");
    store = SqliteHistory.open(file, clock);
    casework = new Casework(store, clock);
  }

  @AfterEach
  void close() {
    store.close();
  }

  private Path sheet(String name, String text) throws Exception {
    Path path = folder.resolve(name);
    Files.writeString(path, text, StandardCharsets.UTF_8);
    return path;
  }

  /** A board model with the driver in its library, a unit of it and an open case. */
  private CaseAtHand driverCase() throws Exception {
    casework.addBoardModel("TB-1", "Test maker", List.of(sheet("d.stage.json", DRIVER)));
    Units.AddedUnit unit = casework.addUnit("TB1-0001", "tb-1", "job 12");
    RepairCase opened = casework.openCase(unit.unit().id(), "no output");
    return casework.caseAtHand(opened.id().substring(0, 8));
  }

  @Nested
  class Readings {
    @Test
    void addReadings_fromAReadingsSet_storesEveryReadingAndTheSuspectListInTheCase()
        throws Exception {
      CaseAtHand at = driverCase();
      Stage stage = casework.storedStage(at.boardModel(), null).stage();
      ReadingSet set = new ReadingSet(MeterSpec.DEFAULT, openFeedback());

      StoredReadings stored =
          casework.addReadings(at.id(), casework.diagnoser(stage, at.boardModel()), set, 12);

      CaseFile kept = store.cases().caseFile(at.id()).orElseThrow();
      assertThat(kept.readings()).containsExactlyElementsOf(stored.readings());
      assertThat(kept.suspectLists()).containsExactly(stored.suspectList());
      assertThat(kept.readings())
          .extracting(StoredReading::at)
          .containsExactly("U1.8", "U1.4", "U1.1", "U1.2");
      // DESIGN.md, Readings: the default meter is a 6000-count handheld at ±(0.5 % + 2 counts).
      assertThat(kept.readings())
          .allSatisfy(
              r -> {
                assertThat(r.meterText()).isEqualTo("6000-count meter, ±(0.5 % + 2 counts)");
                assertThat(r.kind()).isEqualTo(ReadingKind.DC);
                assertThat(r.uncertainty()).isNull();
                assertThat(r.takenAt()).isEqualTo(clock.instant());
              });
      List<String> named = new ArrayList<>();
      double total = 0;
      for (StoredSuspect s : stored.suspectList().suspects()) {
        named.addAll(s.group());
        named.add(s.fault());
        total += s.probability();
      }
      // The open feedback resistor explains the readings (textbook, see openFeedback()).
      assertThat(named).contains("R2:open");
      // Bayes' rule: the posterior over the listed suspects sums to 1 (DESIGN.md, Diagnosis).
      assertThat(total).isBetween(0.999, 1.001);
      assertThat(stored.suspectList().suspects())
          .extracting(StoredSuspect::rank)
          .containsExactlyElementsOf(
              java.util.stream.IntStream.rangeClosed(1, stored.suspectList().suspects().size())
                  .boxed()
                  .toList());
      assertThat(stored.suspectList().programVersion()).isEqualTo(Casework.version());
      assertThat(stored.suspectList().verdict()).isEqualTo(stored.diagnosis().verdict().word());
    }

    @Test
    void addReadings_oneAddedOfSeveralTaken_storesTheAddedOneAndDiagnosesThemAll()
        throws Exception {
      CaseAtHand at = driverCase();
      Stage stage = casework.storedStage(at.boardModel(), null).stage();
      Diagnoser diagnoser = casework.diagnoser(stage, at.boardModel());
      List<Reading> taken = openFeedback();
      ReadingSet firstThree = new ReadingSet(MeterSpec.DEFAULT, taken.subList(0, 3));
      casework.addReadings(at.id(), diagnoser, firstThree, taken.subList(0, 3), 12);

      ReadingSet all = new ReadingSet(MeterSpec.DEFAULT, taken);
      StoredReadings last = casework.addReadings(at.id(), diagnoser, all, taken.subList(3, 4), 12);

      assertThat(last.readings()).extracting(StoredReading::at).containsExactly("U1.2");
      assertThat(last.suspectList().suspects())
          .isEqualTo(
              StoredText.suspectList(diagnoser.diagnose(all, 12), at.id(), clock.instant(), "")
                  .suspects());
      CaseFile kept = store.cases().caseFile(at.id()).orElseThrow();
      assertThat(kept.readings()).hasSize(4);
      assertThat(kept.suspectLists()).hasSize(2);
    }

    @Test
    void addReadings_acWithoutUncertainty_isStoredAsAScopeReading_andAGivenUncertaintyIsKept()
        throws Exception {
      CaseAtHand at = driverCase();
      Stage stage = casework.storedStage(at.boardModel(), null).stage();
      // A healthy inverting stage: AC gain R2/R1 = 4.7, so 0.1 V in gives 0.47 V out (textbook).
      List<Reading> readings =
          List.of(
              Reading.ac("OUT", 0.47, 1000),
              new Reading("U1.1", Reading.Kind.DC, -4.70, 0, OptionalDouble.of(0.05)));
      StoredReadings stored =
          casework.addReadings(
              at.id(),
              casework.diagnoser(stage, at.boardModel()),
              new ReadingSet(MeterSpec.DEFAULT, readings),
              12);

      StoredReading ac = stored.readings().get(0);
      // DESIGN.md, Readings: an AC reading without its own uncertainty is a scope reading,
      // ±(3 % of reading + 1 mV).
      assertThat(ac.meterText()).isEqualTo("scope, ±(3 % + 1 mV)");
      assertThat(ac.hz()).isEqualTo(1000.0);
      assertThat(ac.uncertainty()).isNull();
      StoredReading given = stored.readings().get(1);
      assertThat(given.uncertainty()).isEqualTo(0.05);
      assertThat(given.meterText()).isEmpty();
      assertThat(given.hz()).isNull();
      assertThat(store.cases().caseFile(at.id()).orElseThrow().readings())
          .containsExactlyElementsOf(stored.readings());
    }

    @Test
    void addReadings_pointNotOnTheStage_storesNothing() throws Exception {
      CaseAtHand at = driverCase();
      Stage stage = casework.storedStage(at.boardModel(), null).stage();
      Map<String, String> before = HistoryDigest.of(file);
      List<Reading> readings = List.of(Reading.dc("U1.8", 14.97), Reading.dc("NOWHERE", 1.0));

      assertThatThrownBy(
              () ->
                  casework.addReadings(
                      at.id(),
                      casework.diagnoser(stage, at.boardModel()),
                      new ReadingSet(MeterSpec.DEFAULT, readings),
                      12))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("NOWHERE");
      assertThat(HistoryDigest.of(file)).isEqualTo(before);
    }

    @Test
    void addReadings_unknownCase_storesNothing() throws Exception {
      CaseAtHand at = driverCase();
      Stage stage = casework.storedStage(at.boardModel(), null).stage();
      Map<String, String> before = HistoryDigest.of(file);

      assertThatThrownBy(
              () ->
                  casework.addReadings(
                      HistoryStore.newId(),
                      casework.diagnoser(stage, at.boardModel()),
                      new ReadingSet(MeterSpec.DEFAULT, openFeedback()),
                      12))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("no case has the id");
      assertThat(HistoryDigest.of(file)).isEqualTo(before);
    }

    @Test
    void probeLine_acProbe_namesItsFrequency_withoutTheMachinesLocale() {
      // The suite runs in a decimal-comma locale; stored text must not depend on it.
      assertThat(
              StoredText.probeLine(
                  new ProbeAdvice("OUT", Reading.Kind.AC, 1000, 0.6149, "tells R2 from R1\nhere")))
          .isEqualTo("OUT ac 1000 Hz (0.61 bits): tells R2 from R1 here");
      assertThat(StoredText.probeLine(new ProbeAdvice("U1.2", Reading.Kind.DC, 0, 0.84, "the sum")))
          .isEqualTo("U1.2 dc (0.84 bits): the sum");
      assertThat(StoredText.meterLine(new MeterSpec(0.05, 10, 60000)))
          .isEqualTo("60000-count meter, ±(0.05 % + 10 counts)");
    }
  }

  @Nested
  class ShopCounts {
    @Test
    void shopCounts_countOnlyFixedCasesOfTheModel() throws Exception {
      CaseAtHand first = driverCase();
      casework.closeCase(first.id(), Outcome.FIXED, List.of("R2:open"), "");
      RepairCase second = casework.openCase(first.unit().id(), "no output again");
      casework.closeCase(second.id(), Outcome.FIXED, List.of("R2:open", "U1A:dead"), null);
      RepairCase third = casework.openCase(first.unit().id(), "hum");
      casework.closeCase(third.id(), Outcome.NOT_FIXED, List.of("R1:open"), "");
      Units.AddedUnit other = casework.addUnit("X-1", "Other board", "");
      RepairCase elsewhere = casework.openCase(other.unit().id(), "dead");
      casework.closeCase(elsewhere.id(), Outcome.FIXED, List.of("R2:open"), "");

      assertThat(casework.shopCounts(first.boardModel()))
          .isEqualTo(Map.of("R2:open", 2, "U1A:dead", 1));
      assertThat(casework.shopCounts(null)).isEmpty();
    }
  }

  @Nested
  class Stages {
    @Test
    void storedStage_theOnlyOne_orByTitle_orRefusedNamingTheTitles() throws Exception {
      BoardModel none = casework.addBoardModel("Empty board", "", List.of());
      assertThatThrownBy(() -> casework.storedStage(none, null))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("has no stored stage sheet");

      BoardModel one = casework.addBoardModel("TB-1", "", List.of(sheet("d.stage.json", DRIVER)));
      assertThat(casework.storedStage(one, null).title()).isEqualTo("Line driver");

      BoardModel two =
          casework.addBoardModel(
              "TB-2", "", List.of(sheet("d.stage.json", DRIVER), sheet("b.stage.json", BUFFER)));
      assertThatThrownBy(() -> casework.storedStage(two, null))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("several stage sheets")
          .hasMessageContaining("'Line driver'")
          .hasMessageContaining("'Output buffer'");
      assertThat(
              casework.storedStage(two, "output BUFFER ").stage().part("R2").orElseThrow().value())
          .isEqualTo(10e3);
      assertThatThrownBy(() -> casework.storedStage(two, "Input stage"))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("no stage sheet is titled 'Input stage'");
    }

    @Test
    void addToLibrary_aStageBuiltOnTheBench_comesBackFromTheLibrary() throws Exception {
      BoardModel model = casework.addBoardModel("TB-1", "", List.of());
      Stage built = StageSheet.read(DRIVER, "test");

      casework.addToLibrary(model, built);

      List<LibraryStage> library = casework.stageLibrary(model);
      assertThat(library).hasSize(1);
      assertThat(library.get(0).title()).isEqualTo("Line driver");
      assertThat(library.get(0).stage()).isEqualTo(built);
    }
  }

  @Nested
  class CaseFromOpenToClose {
    @Test
    void wholeCase_actionsNotesAndTheCloseOut_areKept() throws Exception {
      CaseAtHand at = driverCase();
      assertThat(at.unit().serial()).isEqualTo("TB1-0001");
      assertThat(at.boardModel().name()).isEqualTo("TB-1");
      casework.addAction(at.id(), ActionKind.PART_REPLACED, "R2", "open", "47k", "");
      casework.addNote(at.id(), "R2 cracked across its body");

      RepairCase closed =
          casework.closeCase(at.id(), Outcome.FIXED, List.of("R2:open"), "Tested for an hour");

      assertThat(closed.status()).isEqualTo(CaseStatus.CLOSED);
      CaseFile kept = store.cases().caseFile(at.id()).orElseThrow();
      assertThat(kept.repairCase().confirmedFaults()).containsExactly("R2:open");
      assertThat(kept.actions()).hasSize(1);
      assertThat(kept.notes())
          .extracting(n -> n.text())
          .containsExactly("R2 cracked across its body", "Tested for an hour");
    }

    @Test
    void addUnit_newModelName_addsTheModel_andAKnownNameInOtherLetterCaseReusesIt() {
      Units.AddedUnit first = casework.addUnit("A-1", "PSU-30", "");
      Units.AddedUnit second = casework.addUnit("A-2", "psu-30", "");
      Units.AddedUnit byId = casework.addUnit("A-3", first.boardModel().id(), "");

      assertThat(second.boardModel()).isEqualTo(first.boardModel());
      assertThat(byId.boardModel()).isEqualTo(first.boardModel());
      assertThat(store.units().boardModels()).hasSize(1);
      assertThat(store.units().list(null)).hasSize(3);
    }

    @Test
    void version_isTheJarsVersionOrADevelopmentBuild() {
      // Tests run from the classes, which carry no manifest version.
      assertThat(Casework.version()).isEqualTo("development build");
    }
  }

  /** Issue 9: every refused action leaves the history exactly as it was. */
  @Nested
  class RefusedLeavesNothing {
    @Test
    void addUnit_blankSerial_addsNoBoardModel() {
      Map<String, String> before = HistoryDigest.of(file);

      assertThatThrownBy(() -> casework.addUnit("   ", "X", ""))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("serial");

      assertThat(HistoryDigest.of(file)).isEqualTo(before);
      assertThat(store.units().findBoardModel("X")).isEmpty();
    }

    @Test
    void addUnit_duplicateSerialWithNewModelName_addsNothing() {
      casework.addUnit("A-1", "PSU-30", "");
      Map<String, String> before = HistoryDigest.of(file);

      assertThatThrownBy(() -> casework.addUnit("A-1", "PSU-30", ""))
          .isInstanceOf(InvalidInputException.class);

      assertThat(HistoryDigest.of(file)).isEqualTo(before);
    }

    @Test
    void closeCase_noteOverTheLimit_leavesTheCaseOpenWithoutTheNote() throws Exception {
      CaseAtHand at = driverCase();
      Map<String, String> before = HistoryDigest.of(file);

      assertThatThrownBy(
              () -> casework.closeCase(at.id(), Outcome.FIXED, List.of(), "x".repeat(60_000)))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("note");

      assertThat(HistoryDigest.of(file)).isEqualTo(before);
      assertThat(store.cases().find(at.id()).orElseThrow().status()).isEqualTo(CaseStatus.OPEN);
    }

    @Test
    void closeCase_badFaultId_addsNoNote() throws Exception {
      CaseAtHand at = driverCase();
      Map<String, String> before = HistoryDigest.of(file);

      assertThatThrownBy(
              () -> casework.closeCase(at.id(), Outcome.FIXED, List.of("R2 open"), "a note"))
          .isInstanceOf(InvalidInputException.class);

      assertThat(HistoryDigest.of(file)).isEqualTo(before);
    }

    @Test
    void addBoardModel_secondSheetBad_keepsNeitherTheModelNorTheFirstSheet() throws Exception {
      Path good = sheet("good.stage.json", DRIVER);
      Path bad = sheet("bad.stage.json", DRIVER.replace("\"10k\"", "\"ten k\""));
      Map<String, String> before = HistoryDigest.of(file);

      assertThatThrownBy(() -> casework.addBoardModel("TB-1", "", List.of(good, bad)))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("bad.stage.json");

      assertThat(HistoryDigest.of(file)).isEqualTo(before);
    }

    @Test
    void addBoardModel_missingSheetFile_addsNothing() throws Exception {
      Path good = sheet("good.stage.json", DRIVER);
      Map<String, String> before = HistoryDigest.of(file);

      assertThatThrownBy(
              () ->
                  casework.addBoardModel(
                      "TB-1", "", List.of(good, folder.resolve("missing.stage.json"))))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("missing.stage.json");

      assertThat(HistoryDigest.of(file)).isEqualTo(before);
    }

    @Test
    void fillWithDemo_historyNotEmpty_addsNothing() {
      casework.addUnit("A-1", "PSU-30", "");
      Map<String, String> before = HistoryDigest.of(file);

      assertThatThrownBy(() -> casework.fillWithDemo())
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("empty history only");

      assertThat(HistoryDigest.of(file)).isEqualTo(before);
    }

    @Test
    void addUnit_onADamagedFile_addsNoBoardModel_andSaysTheFileWasLeftAsItIs() throws Exception {
      casework.addUnit("A-1", "PSU-30", "");
      store.close();
      DamagedHistory.damageTheUnitTable(file);
      Map<String, String> before = HistoryDigest.of(file, List.of("unit"));

      // The board model is new, so the old two-step write added it before the unit table's damage
      // stopped the unit. A store may also refuse the damaged file as it opens it for writing;
      // either way nothing is written and the message says so.
      assertThatThrownBy(
              () -> {
                try (HistoryStore damaged = SqliteHistory.open(file, clock)) {
                  new Casework(damaged, clock).addUnit("A-2", "LP-3005", "");
                }
              })
          .isInstanceOf(StorageException.class)
          .hasMessageContaining("damaged")
          .hasMessageContaining("left as it is");

      assertThat(HistoryDigest.of(file, List.of("unit"))).isEqualTo(before);
      store = SqliteHistory.open(folder.resolve("sound.db"), clock);
    }
  }
}
