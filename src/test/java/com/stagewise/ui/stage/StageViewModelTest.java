package com.stagewise.ui.stage;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.StageSheet;
import com.stagewise.ui.SafetyCaution;
import com.stagewise.ui.Step;
import com.stagewise.ui.TestBench;
import java.nio.file.Path;
import java.util.List;
import org.assertj.core.data.Offset;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class StageViewModelTest {
  @TempDir Path temp;
  private TestBench t;
  private StageViewModel model;
  private String boardId;

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    var board = t.store.units().boardModel("Test amp board", "");
    boardId = board.id();
    t.store
        .library()
        .add(
            board.id(),
            "Inverting amplifier, test",
            StageSheet.write(TestBench.invertingStage(board.name())));
    var unit = t.store.units().add("TA-1", board.id(), "");
    t.bench.showUnit(unit, board);
    t.bench.startCase(t.store.cases().open(unit.id(), "Dead"));
    t.bench.go(Step.STAGE);
    model = new StageViewModel(t.bench);
    model.loadLibrary();
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  @Test
  void loadLibrary_listsTheBoardModelsStages() {
    assertThat(model.library())
        .extracting(LibraryEntry::title)
        .containsExactly("Inverting amplifier, test");
    assertThat(model.libraryNoteProperty().get()).isEqualTo("1 stage of Test amp board.");
  }

  @Test
  void choose_showsPartsAndExpectedVoltsWithTheirRange() {
    model.choose(model.library().get(0).stage());
    assertThat(model.parts())
        .extracting(PartRow::line)
        .containsExactly("R1   10 kΩ  ±1%   (IN – SUM)", "R2   47 kΩ  ±1%   (SUM – OUT)");
    var expected = model.expectedProperty().get();
    // Textbook inverting gain -Rf/Rin = -4.7 for 1 V in; 1 % parts move it by about 1 % each way.
    assertThat(expected.at("OUT")).isCloseTo(-4.7, Offset.offset(1e-3));
    assertThat(expected.low().get("OUT")).isCloseTo(-4.7 * 1.01 - 0.005, Offset.offset(2e-3));
    assertThat(expected.high().get("OUT")).isCloseTo(-4.7 * 0.99 + 0.005, Offset.offset(2e-3));
  }

  @Test
  void applyValue_changesThePartAndTheExpectedOutput() {
    model.choose(model.library().get(0).stage());
    model.selectedPartProperty().set(model.parts().get(1));
    assertThat(model.pad().textProperty().get()).isEqualTo("47K");
    model.pad().textProperty().set("22k");
    model.applyValue();
    assertThat(model.stageProperty().get().part("R2").orElseThrow().value()).isEqualTo(22_000.0);
    assertThat(model.expectedProperty().get().at("OUT")).isCloseTo(-2.2, Offset.offset(1e-3));
  }

  @Test
  void applyDesignator_renamesThePart_andRefusesADuplicate() {
    model.choose(model.library().get(0).stage());
    model.selectedPartProperty().set(model.parts().get(1));
    model.designatorProperty().set("R15");
    model.applyDesignator();
    assertThat(model.stageProperty().get().part("R15")).isPresent();
    model.designatorProperty().set("R1");
    model.applyDesignator();
    assertThat(t.problems).containsExactly("Designator already used");
  }

  @Test
  void buildFromTemplate_usesItAndAddsItToTheLibrary() {
    var template = Templates.all().get(0);
    model.templateProperty().set(template);
    assertThat(model.parameters()).hasSize(template.parameters().size());
    model.buildFromTemplate();
    assertThat(model.stageProperty().get().board()).isEqualTo("Test amp board");
    model.useStage();
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.READINGS);
    assertThat(t.store.library().sheets(boardId)).hasSize(2);
  }

  @Test
  void editedStage_joinsTheLibraryAndIsOfferedFirstForTheNextUnit() {
    model.choose(model.library().get(0).stage());
    model.openEditor(false);
    assertThat(model.editingProperty().get()).isTrue();
    model.editor().setPartValue("R2", "100k");
    model.editor().setTitle("Inverting amplifier, R2 changed", "Test amp board");
    model.useEdited(model.editor().save().orElseThrow());
    assertThat(model.editingProperty().get()).isFalse();
    model.useStage();

    StageViewModel next = new StageViewModel(t.bench);
    next.loadLibrary();
    assertThat(next.library()).hasSize(2);
    assertThat(next.library().get(0).title()).isEqualTo("Inverting amplifier, R2 changed");
    assertThat(next.library().get(0).stage().part("R2").orElseThrow().value()).isEqualTo(100_000.0);
  }

  @Test
  void newStage_opensTheEditorEmptyOnTheBoardModel() {
    model.openEditor(true);
    assertThat(model.editor().draft().parts()).isEmpty();
    assertThat(model.editor().draft().board()).isEqualTo("Test amp board");
  }

  @Test
  void useStage_railAboveFiftyVolts_showsTheCautionFirst() {
    Stage base = model.library().get(0).stage();
    model.choose(base.withRails(List.of(new Rail("VCC", 60, 0.05), new Rail("VEE", -60, 0.05))));
    model.useStage();
    assertThat(t.cautions).containsExactly(SafetyCaution.Reason.HIGH_RAILS);
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.READINGS);
    assertThat(t.resume.load(t.bench.openCaseProperty().get().id()).orElseThrow().stage())
        .isPresent();
  }

  /** Regression: a new case on another board showed the last board's stage and decoder entry. */
  @Test
  void newCaseOnAnotherBoard_startsClean() {
    model.choose(model.library().get(0).stage());
    model.selectedPartProperty().set(model.parts().get(1));
    model.decoder().addBand("yellow");
    model.decoder().smdProperty().set("472");
    model.templateProperty().set(Templates.all().get(0));
    assertThat(model.expectedProperty().get()).isNotNull();

    var other = t.store.units().boardModel("Other board", "");
    var unit = t.store.units().add("OB-2", other.id(), "");
    t.bench.showUnit(unit, other);
    t.bench.startCase(t.store.cases().open(unit.id(), "Hum"));

    assertThat(model.stageProperty().get()).isNull();
    assertThat(model.parts()).isEmpty();
    assertThat(model.expectedProperty().get()).isNull();
    assertThat(model.selectedPartProperty().get()).isNull();
    assertThat(model.decoder().smdProperty().get()).isEmpty();
    assertThat(model.decoder().ohmsProperty().get()).isNull();
    assertThat(model.templateProperty().get()).isNull();
    assertThat(model.designatorProperty().get()).isEmpty();
    assertThat(model.pad().textProperty().get()).isEmpty();
    model.loadLibrary();
    assertThat(model.library()).isEmpty();
  }

  @Test
  void templateFields_speakPlainWords_offerLists_andCheckWhatIsTyped() {
    model.templateProperty().set(Templates.named("inverting"));
    var byName = new java.util.HashMap<String, ParameterEntry>();
    model.parameters().forEach(p -> byName.put(p.parameter().name(), p));
    assertThat(byName.get("r1").label()).isEqualTo("Input resistor R1 (Ω)");
    assertThat(byName.get("vac").label()).startsWith("Test signal amplitude");
    assertThat(model.parameters())
        .allSatisfy(p -> assertThat(p.label()).doesNotStartWith(p.parameter().name() + " "));
    // Class and package are lists of the words DESIGN.md defines, not free text.
    assertThat(byName.get("class").choices())
        .containsExactly("classic-bipolar", "ground-sensing", "rail-to-rail");
    assertThat(byName.get("package").choices()).containsExactly("single-8", "dual-8", "quad-14");
    assertThat(byName.get("class").problem("rail-to-rail")).isEmpty();
    assertThat(byName.get("class").problem("rail to rail")).startsWith("Choose one of");
    // Values as in stage sheets (IEC 60062 RKM code); the decimal comma is refused.
    assertThat(byName.get("r1").problem("4k7")).isEmpty();
    assertThat(byName.get("r1").problem("4,7k")).startsWith("Not a value");
    assertThat(byName.get("r1").problem("-10k")).contains("cannot be negative");
    assertThat(byName.get("vee").problem("-15")).isEmpty();
    assertThat(byName.get("r1").problem("")).startsWith("Type a value");
    // The junction templates: diode class and LED colour are lists of DESIGN.md's words, a zener
    // takes its usual marking, a trimmer position is a share of the travel (0 to 1).
    model.templateProperty().set(Templates.named("precision-rectifier"));
    var diode = field(model, "diode");
    assertThat(diode.choices()).containsExactly("silicon", "schottky");
    assertThat(diode.label()).isEqualTo("Diode class");
    model.templateProperty().set(Templates.named("led-comparator"));
    assertThat(field(model, "colour").choices())
        .containsExactly("red", "orange", "yellow", "green", "blue", "white");
    assertThat(field(model, "colour").problem("purple")).startsWith("Choose one of");
    model.templateProperty().set(Templates.named("zener-reference"));
    assertThat(field(model, "zd1").problem("5V1")).isEmpty();
    assertThat(field(model, "zd1").problem("3.3V")).isEmpty();
    assertThat(field(model, "zd1").problem("5,1V")).startsWith("Not a zener voltage");
    model.templateProperty().set(Templates.named("offset-null"));
    assertThat(field(model, "pos").problem("0.82")).isEmpty();
    assertThat(field(model, "pos").problem("1.7")).startsWith("A wiper position is from 0");
    // Every default of every template is a value its field takes.
    for (var template : Templates.all()) {
      model.templateProperty().set(template);
      assertThat(model.parameters())
          .allSatisfy(p -> assertThat(p.problem(p.value().get())).as(p.label()).isEmpty());
    }
  }

  @Test
  void exportThenImport_bringsBackTheSameStage_andItJoinsTheLibraryWhenUsed() {
    Stage chosen = model.library().get(0).stage();
    model.choose(chosen);
    Path file = temp.resolve("usb").resolve("inverting");
    file.getParent().toFile().mkdirs();

    model.libraryModel().exportSheet(file);
    Path written = temp.resolve("usb").resolve("inverting" + StageSheet.SUFFIX);
    assertThat(written).exists();
    assertThat(model.libraryNoteProperty().get()).startsWith("Saved ");

    // Change R2, so that the stage on the screen is no longer the saved one.
    model.selectedPartProperty().set(model.parts().get(1));
    model.pad().textProperty().set("22k");
    model.applyValue();
    assertThat(model.stageProperty().get()).isNotEqualTo(chosen);
    model.libraryModel().importSheet(written);
    // Read back from its own file, the stage is the one that was saved.
    assertThat(model.stageProperty().get()).isEqualTo(chosen);
    assertThat(model.libraryNoteProperty().get()).contains("joins the library of Test amp board");
  }

  @Test
  void aSheetTheAppWasStartedWith_opensWhenTheStageScreenIsShown() {
    Stage chosen = model.library().get(0).stage();
    Path file = temp.resolve("given" + StageSheet.SUFFIX);
    StageSheet.write(chosen, file);
    StageViewModel arriving = new StageViewModel(t.bench);
    arriving.libraryModel().openOnArrival(file);
    assertThat(arriving.stageProperty().get()).isNull();

    arriving.loadLibrary();

    assertThat(arriving.stageProperty().get()).isEqualTo(chosen);
  }

  @Test
  void importOfABrokenSheet_isRefusedWithWhatToFix_andKeepsTheChosenStage() throws Exception {
    Stage chosen = model.library().get(0).stage();
    model.choose(chosen);
    Path broken = temp.resolve("broken" + StageSheet.SUFFIX);
    java.nio.file.Files.writeString(
        broken,
        StageSheet.write(chosen)
            .replaceFirst("\"value\"\\s*:\\s*\"[^\"]*\"", "\"value\": \"ten\""));

    model.libraryModel().importSheet(broken);

    assertThat(t.problemTexts).hasSize(1);
    assertThat(t.problemTexts.get(0))
        .contains("broken" + StageSheet.SUFFIX)
        .contains("ten")
        .contains("Nothing was changed");
    assertThat(model.stageProperty().get()).isEqualTo(chosen);
  }

  private static ParameterEntry field(StageViewModel model, String name) {
    return model.parameters().stream()
        .filter(p -> p.parameter().name().equals(name))
        .findFirst()
        .orElseThrow();
  }

  @Test
  void useStage_readingsOfTheCaseInTheHistory_comeWithIt_andOnesTheStageLacksAreNamed() {
    // Stored through the history (as the command line stores them), not on this bench.
    String caseId = t.bench.openCaseProperty().get().id();
    t.store
        .cases()
        .addReadings(
            caseId, List.of(stored(caseId, "U1.8", 14.9), stored(caseId, "U7.3", 2.5)), null);
    model.choose(model.library().get(0).stage());

    model.useStage();

    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.READINGS);
    assertThat(t.bench.readings()).containsExactly(com.stagewise.circuit.Reading.dc("U1.8", 14.9));
    assertThat(t.problemTexts)
        .singleElement()
        .asString()
        .startsWith("1 reading of this case is not on this stage\nIt was taken at U7.3,")
        .contains("stays in the case's history");
  }

  private static com.stagewise.history.record.StoredReading stored(
      String caseId, String at, double volts) {
    return new com.stagewise.history.record.StoredReading(
        com.stagewise.history.HistoryStore.newId(),
        caseId,
        at,
        com.stagewise.history.record.ReadingKind.DC,
        volts,
        null,
        null,
        "",
        java.time.Instant.now());
  }
}
