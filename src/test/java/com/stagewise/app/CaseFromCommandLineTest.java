package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.casework.Casework;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.cli.ExitCode;
import com.stagewise.cli.StagewiseCommand;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.TestPictures;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.interchange.StageSheet;
import com.stagewise.ui.Bench;
import com.stagewise.ui.Step;
import com.stagewise.ui.TestBench;
import com.stagewise.ui.closeout.CloseOutViewModel;
import com.stagewise.ui.readings.ReadingsViewModel;
import com.stagewise.ui.stage.StageViewModel;
import com.stagewise.ui.start.StartViewModel;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The history file is the truth, whoever writes it: a case worked from the command line (its own
 * connection to the same SQLite file, as another program would have) shows in the app's screens
 * with its readings, the struck one marked, and its photo, without restarting the app; readings
 * taken in the app show in {@code history show}.
 *
 * <p>The readings are those of an inverting amplifier whose feedback resistor R2 is open (textbook:
 * the loop is broken, no current flows in R1, so the inverting input follows the 1 V input and the
 * output clamps at its negative limit, 1.5 V above the −15 V rail for a classic bipolar part, the
 * headroom of DESIGN.md, a typical figure from memory).
 */
class CaseFromCommandLineTest {
  private static final String READINGS =
      """
      {"format": "stagewise-readings", "version": 1,
       "readings": [
         {"at": "U1.8", "dc": 14.97},
         {"at": "U1.4", "dc": -14.98},
         {"at": "U1.1", "dc": -13.48},
         {"at": "U1.2", "dc": 0.998},
         {"at": "U1.1", "dc": 13.48}
       ]}
      """;

  @TempDir Path folder;
  private TestBench t;
  private Path db;
  private Path sheet;
  private StartViewModel start;
  private ReadingsViewModel readings;
  private CloseOutViewModel closeOut;

  record Run(int code, String out, String err) {}

  /** Runs the command line on the same history file as the app (a connection of its own). */
  private Run history(String command, String... args) {
    List<String> all = new ArrayList<>(List.of("history", command, "--db", db.toString()));
    all.addAll(List.of(args));
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code =
        StagewiseCommand.execute(
            all.toArray(String[]::new), new PrintWriter(out), new PrintWriter(err));
    Run run = new Run(code, out.toString(), err.toString());
    assertThat(run.code()).as(command + ": " + run.err()).isEqualTo(ExitCode.OK);
    return run;
  }

  private static JsonNode json(Run run) throws Exception {
    return new ObjectMapper().readTree(run.out());
  }

  @BeforeEach
  void anAppRunningOnTheHistoryFile() throws Exception {
    t = TestBench.open(folder);
    db = folder.resolve("history.db");
    sheet = folder.resolve("inverting.stage.json");
    Files.writeString(
        sheet,
        StageSheet.write(TestBench.invertingStage("Test amp board")),
        StandardCharsets.UTF_8);
    history("add-model", "--name", "Test amp board", "--stage", sheet.toString());
    history("add-unit", "--serial", "TA-4711", "--model", "Test amp board");
    start = new StartViewModel(t.bench);
    readings = new ReadingsViewModel(t.bench);
    closeOut = new CloseOutViewModel(t.bench);
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  /** The stored stage of the board model (the case then keeps it), or a stage sheet file. */
  private enum StageGiven {
    STORED,
    FILE
  }

  private String openCaseWithReadingsFromTheCommandLine() throws Exception {
    return openCaseWithReadingsFromTheCommandLine(StageGiven.STORED);
  }

  private String openCaseWithReadingsFromTheCommandLine(StageGiven given) throws Exception {
    String caseId =
        json(history("open-case", "--serial", "TA-4711", "--symptom", "No output", "--json"))
            .get("id")
            .textValue();
    Path file = folder.resolve("no-feedback.readings.json");
    Files.writeString(file, READINGS, StandardCharsets.UTF_8);
    if (given == StageGiven.FILE) {
      history(
          "add-readings", "--case", caseId, "--readings", file.toString(), "--stage", "" + sheet);
    } else {
      history("add-readings", "--case", caseId, "--readings", file.toString());
    }
    // The fifth reading was typed with the wrong sign: struck out, kept in the history.
    history("strike-reading", "--case", caseId, "--reading", "5");
    return caseId;
  }

  /** Returns the stage version the case keeps, as {@code history show --json} gives it. */
  private String caseStageId(String caseId) throws Exception {
    JsonNode id = json(history("show", "--case", caseId, "--json")).get("stageSheetId");
    return id == null || id.isNull() ? null : id.textValue();
  }

  private String storedStageId() {
    var model = t.store.units().findBoardModel("Test amp board").orElseThrow();
    return t.store.library().latest(model.id()).get(0).id();
  }

  private void findTheUnit() {
    start.serialProperty().set("TA-4711");
    start.search();
    assertThat(start.selectedProperty().get().unit().serial()).isEqualTo("TA-4711");
  }

  private void assertTheCaseIsOnTheBench(String caseId) {
    Bench bench = t.bench;
    assertThat(bench.openCaseProperty().get().id()).isEqualTo(caseId);
    assertThat(bench.readings())
        .containsExactly(
            Reading.dc("U1.8", 14.97),
            Reading.dc("U1.4", -14.98),
            Reading.dc("U1.1", -13.48),
            Reading.dc("U1.2", 0.998));
    assertThat(bench.struckReadings())
        .singleElement()
        .satisfies(
            s -> {
              assertThat(s.reading()).isEqualTo(Reading.dc("U1.1", 13.48));
              assertThat(s.struckAt()).isNotNull();
            });
    assertThat(readings.rows()).hasSize(5);
    assertThat(readings.rows().stream().filter(r -> r.struck()).count()).isEqualTo(1);
    // Textbook open-feedback readings: R2 open stands first (or in the first suspect's group).
    assertThat(bench.diagnosisProperty().get().suspects().get(0).group()).contains("R2:open");
  }

  @Test
  void caseStartedOnTheCommandLine_whileTheUnitIsShown_opensOnItsStageWithItsReadings()
      throws Exception {
    findTheUnit(); // the app shows the unit before the command line opens its case
    String caseId = openCaseWithReadingsFromTheCommandLine();

    start.resumeCase(caseId);

    // The command line kept the stored stage it diagnosed with: the case opens on it.
    assertThat(caseStageId(caseId)).isEqualTo(storedStageId());
    assertThat(t.problems).isEmpty();
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.READINGS);
    assertThat(t.bench.stageProperty().get()).isEqualTo(TestBench.invertingStage("Test amp board"));
    assertTheCaseIsOnTheBench(caseId);
  }

  @Test
  void readingsOfAStageFile_comeWithTheStageOnceTheTechnicianChoosesIt() throws Exception {
    findTheUnit();
    String caseId = openCaseWithReadingsFromTheCommandLine(StageGiven.FILE);

    start.resumeCase(caseId);

    // A stage sheet file given on the command line is not the case's yet: the technician picks
    // the stage, and the readings stored on the command line come with it.
    assertThat(caseStageId(caseId)).isNull();
    assertThat(t.problems).isEmpty();
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.STAGE);
    StageViewModel stage = new StageViewModel(t.bench);
    stage.loadLibrary();
    stage.choose(stage.library().get(0).stage());
    stage.useStage();

    assertThat(t.problems).isEmpty();
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.READINGS);
    assertTheCaseIsOnTheBench(caseId);
    assertThat(caseStageId(caseId)).isEqualTo(storedStageId());
  }

  @Test
  void caseWhoseStageVersionIsInTheHistory_resumesAtTheReadingsWithoutAFileOfThisBench()
      throws Exception {
    String caseId = openCaseWithReadingsFromTheCommandLine(StageGiven.FILE);
    // Another program (another bench, through the shop server, say) keeps the stage the case is
    // diagnosed with; this bench has never seen the case.
    Stage used = TestBench.invertingStage("Test amp board");
    try (HistoryStore other = SqliteHistory.open(db)) {
      new Casework(other).library().useForCase(caseId, used);
    }
    findTheUnit();

    start.resumeCase(caseId);

    assertThat(t.problems).isEmpty();
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.READINGS);
    assertThat(t.bench.stageProperty().get()).isEqualTo(used);
    assertTheCaseIsOnTheBench(caseId);
  }

  @Test
  void readingsAndAPhotoAddedOnTheCommandLine_showWhenTheCaseIsResumedAgain() throws Exception {
    String caseId =
        json(history("open-case", "--serial", "TA-4711", "--symptom", "No output", "--json"))
            .get("id")
            .textValue();
    findTheUnit();
    start.resumeCase(caseId);
    StageViewModel stage = new StageViewModel(t.bench);
    stage.loadLibrary();
    stage.choose(stage.library().get(0).stage());
    stage.useStage();
    assertThat(t.bench.readings()).isEmpty();

    // Meanwhile, on the command line: the readings, a strike and a photo of the board.
    Path file = folder.resolve("no-feedback.readings.json");
    Files.writeString(file, READINGS, StandardCharsets.UTF_8);
    history("add-readings", "--case", caseId, "--readings", file.toString());
    history("strike-reading", "--case", caseId, "--reading", "5");
    Path photo = folder.resolve("board top.png");
    Files.write(photo, TestPictures.png(64, 48));
    history("attach-photo", "--case", caseId, photo.toString());

    // The technician goes back to the unit and resumes the case: no restart.
    t.bench.go(Step.UNIT);
    start.resumeCase(caseId);

    assertThat(t.problems).isEmpty();
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.READINGS);
    assertTheCaseIsOnTheBench(caseId);
    t.bench.go(Step.CLOSE_OUT);
    assertThat(closeOut.photos()).singleElement().asString().contains("board top.png");
  }

  @Test
  void photoAttachedOnTheCommandLine_showsOnTheCloseOutWhenItComesUpAgain() throws Exception {
    String caseId = openCaseWithReadingsFromTheCommandLine();
    findTheUnit();
    start.resumeCase(caseId);
    t.bench.go(Step.CLOSE_OUT);
    assertThat(closeOut.photos()).isEmpty();

    Path photo = folder.resolve("solder side.png");
    Files.write(photo, TestPictures.png(40, 30));
    history("attach-photo", "--case", caseId, photo.toString());
    history("add-note", "--case", caseId, "--text", "Cold joint at R2");
    t.bench.go(Step.UNIT);
    assertThat(start.glance()).singleElement().satisfies(line -> assertThat(line.open()).isTrue());
    t.bench.go(Step.CLOSE_OUT);

    assertThat(closeOut.photos()).singleElement().asString().contains("solder side.png");
  }

  @Test
  void caseOpenedOnTheCommandLine_showsInTheUnitsCasesWhenTheUnitScreenComesBack()
      throws Exception {
    findTheUnit();
    t.bench.go(Step.HISTORY);
    assertThat(start.glance()).isEmpty();

    String caseId = openCaseWithReadingsFromTheCommandLine();
    t.bench.go(Step.UNIT);

    assertThat(start.glance()).extracting(line -> line.caseId()).containsExactly(caseId);
  }

  @Test
  void readingTakenInTheApp_isListedByHistoryShow() throws Exception {
    String caseId = openCaseWithReadingsFromTheCommandLine();
    findTheUnit();
    start.resumeCase(caseId);
    StageViewModel stage = new StageViewModel(t.bench);
    stage.loadLibrary();
    stage.choose(stage.library().get(0).stage());
    stage.useStage();

    readings.choose("U1.3");
    readings.pad().textProperty().set(String.format(Locale.ROOT, "%.3f", 0.002));
    readings.addReading();

    JsonNode shown = json(history("show", "--case", caseId, "--json"));
    JsonNode stored = shown.get("readings");
    assertThat(stored).hasSize(6);
    assertThat(stored.get(5).get("at").textValue()).isEqualTo("U1.3");
    assertThat(stored.get(5).get("value").doubleValue()).isEqualTo(0.002);
    assertThat(stored.get(4).get("struckAt").isNull()).isFalse();
  }
}
