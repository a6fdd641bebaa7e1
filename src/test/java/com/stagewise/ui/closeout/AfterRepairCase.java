package com.stagewise.ui.closeout;

import com.stagewise.circuit.Reading;
import com.stagewise.ui.TestBench;
import java.nio.file.Path;
import java.util.List;

/**
 * The set-up the close-out's check-after-repair tests share: a bench on a new history with one unit
 * of a test board, an open case on the textbook inverting amplifier ({@link
 * TestBench#invertingStage}) and the readings of its fault on the bench.
 */
final class AfterRepairCase {
  final TestBench t;
  final String caseId;

  private AfterRepairCase(TestBench t, String caseId) {
    this.t = t;
    this.caseId = caseId;
  }

  /** Opens the case for unit {@code serial} with {@code symptom} and puts {@code readings} on. */
  static AfterRepairCase open(Path temp, String serial, String symptom, List<Reading> readings) {
    TestBench t = TestBench.open(temp);
    var board = t.store.units().boardModel("Test amp board", "");
    var unit = t.store.units().add(serial, board.id(), "");
    t.bench.showUnit(unit, board);
    t.bench.startCase(t.store.cases().open(unit.id(), symptom));
    String caseId = t.bench.openCaseProperty().get().id();
    t.bench.stageProperty().set(TestBench.invertingStage(board.name()));
    t.bench.readings().addAll(readings);
    return new AfterRepairCase(t, caseId);
  }

  /** Types {@code text} on the check's pad and takes it as the current point's reading. */
  static void type(AfterRepairViewModel check, String text) {
    check.pad().textProperty().set(text);
    check.enter();
  }
}
