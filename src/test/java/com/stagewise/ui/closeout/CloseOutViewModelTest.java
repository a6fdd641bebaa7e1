package com.stagewise.ui.closeout;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.diagnosis.Suspect;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.ui.Step;
import com.stagewise.ui.TestBench;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CloseOutViewModelTest {
  @TempDir Path temp;
  private TestBench t;
  private CloseOutViewModel model;
  private String caseId;
  private final java.util.List<String> closed = new java.util.ArrayList<>();

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    var board = t.store.units().boardModel("Test amp board", "");
    var unit = t.store.units().add("TA-1", board.id(), "");
    t.bench.showUnit(unit, board);
    model = new CloseOutViewModel(t.bench);
    model.setAfterClose(closed::add);
    t.bench.startCase(t.store.cases().open(unit.id(), "Output pinned"));
    caseId = t.bench.openCaseProperty().get().id();
    t.bench.stageProperty().set(TestBench.invertingStage(board.name()));
    t.bench.go(Step.CLOSE_OUT);
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  private static Suspect suspect(String fault, OptionalDouble estimate) {
    return new Suspect(fault, 0.9, true, List.of(fault), "", estimate, Map.of());
  }

  @Test
  void prepareFor_openResistor_offersItsReplacementWithTheMarkedValue() {
    model.prepareFor(suspect("R2:open", OptionalDouble.empty()));
    assertThat(model.actionKindProperty().get()).isEqualTo(ActionKind.PART_REPLACED);
    assertThat(model.actionPartProperty().get()).isEqualTo("R2");
    assertThat(model.actionOldProperty().get()).isEqualTo("open");
    assertThat(model.actionNewProperty().get()).isEqualTo("47 kΩ");
    assertThat(model.confirmedFaults()).containsExactly("R2:open");
  }

  @Test
  void prepareFor_liftedPin_offersAReflow() {
    model.prepareFor(suspect("U1.3:lifted", OptionalDouble.empty()));
    assertThat(model.actionKindProperty().get()).isEqualTo(ActionKind.REFLOW);
    assertThat(model.actionPartProperty().get()).isEqualTo("U1");
  }

  @Test
  void prepareFor_drift_recordsTheEstimate() {
    model.prepareFor(suspect("R2:high", OptionalDouble.of(68_000)));
    assertThat(model.actionOldProperty().get()).isEqualTo("measured 68 kΩ");
  }

  @Test
  void closeCase_withoutOutcome_asksForIt() {
    model.closeCase();
    assertThat(t.problems).containsExactly("How did it end?");
    assertThat(t.store.cases().find(caseId).orElseThrow().status()).isEqualTo(CaseStatus.OPEN);
  }

  @Test
  void closeCase_fixed_storesActionsFaultsNotesAndOutcome() {
    model.prepareFor(suspect("R2:open", OptionalDouble.empty()));
    model.addAction();
    model.outcomeProperty().set(Outcome.FIXED);
    model.notesProperty().set("Checked both half-waves on the scope.");
    model.closeCase();
    var file = t.store.cases().caseFile(caseId).orElseThrow();
    assertThat(file.repairCase().status()).isEqualTo(CaseStatus.CLOSED);
    assertThat(file.repairCase().outcome()).isEqualTo(Outcome.FIXED);
    assertThat(file.repairCase().confirmedFaults()).containsExactly("R2:open");
    assertThat(file.actions())
        .singleElement()
        .satisfies(
            a -> {
              assertThat(a.part()).isEqualTo("R2");
              assertThat(a.newValue()).isEqualTo("47 kΩ");
            });
    assertThat(file.notes())
        .extracting(n -> n.text())
        .containsExactly("Checked both half-waves on the scope.");
    assertThat(closed).containsExactly(caseId);
    assertThat(t.bench.openCaseProperty().get()).isNull();
    // The shop's memory now counts the fault for this board model.
    assertThat(t.store.cases().confirmedFaultCounts("Test amp board")).containsEntry("R2:open", 1);
  }

  @Test
  void closeCase_fixedWithNothingRecorded_asksWhatFixedIt() {
    model.outcomeProperty().set(Outcome.FIXED);
    model.closeCase();
    assertThat(t.problems).containsExactly("What fixed it?");
  }

  @Test
  void leaveOpen_keepsTheCaseAndWhereItWas() {
    model.notesProperty().set("Waiting for a replacement op-amp.");
    model.leaveOpen();
    assertThat(t.store.cases().find(caseId).orElseThrow().status()).isEqualTo(CaseStatus.OPEN);
    assertThat(t.resume.load(caseId).orElseThrow().step()).isEqualTo(Step.CLOSE_OUT);
    assertThat(t.bench.stepProperty().get()).isEqualTo(Step.UNIT);
    assertThat(t.store.cases().caseFile(caseId).orElseThrow().notes()).hasSize(1);
  }
}
