package com.stagewise.ui.start;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Stage;
import com.stagewise.history.CaseFile;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.ui.Bench;
import com.stagewise.ui.CaseResume;
import com.stagewise.ui.Step;
import java.util.Optional;

/**
 * An open case as it is resumed: read from the history as it is now, with the stage to put on the
 * bench and the screen to go to.
 *
 * @param history the unit's history as the store holds it now
 * @param file the case, empty if the store no longer has it
 * @param stage the stage: as it was left on this bench, else the version the case is diagnosed with
 *     (the command line and other benches record it in the history), else none
 * @param step the screen to go to: where the case was left on this bench, else the readings when
 *     the stage is known and readings were taken, else the stage screen
 */
record Resumed(UnitHistory history, Optional<CaseFile> file, Optional<Stage> stage, Step step) {

  /** Reads it; runs off the screen's thread. */
  static Resumed read(Bench bench, String unitId, String caseId, CaseResume resume) {
    UnitHistory history = bench.store().cases().unitHistory(unitId).orElseThrow();
    Optional<CaseFile> file =
        history.cases().stream().filter(c -> c.repairCase().id().equals(caseId)).findFirst();
    if (file.isEmpty() || file.get().repairCase().status() != CaseStatus.OPEN) {
      return new Resumed(history, file, Optional.empty(), Step.STAGE);
    }
    Optional<CaseResume.Saved> saved = resume.load(caseId);
    Optional<Stage> stage = saved.flatMap(CaseResume.Saved::stage);
    if (stage.isEmpty()) {
      stage = keptStage(bench, caseId);
    }
    if (stage.isEmpty()) {
      return new Resumed(history, file, stage, Step.STAGE);
    }
    Step step =
        saved
            .filter(s -> s.stage().isPresent())
            .map(CaseResume.Saved::step)
            .orElse(file.get().readings().isEmpty() ? Step.STAGE : Step.READINGS);
    return new Resumed(history, file, stage, step);
  }

  private static Optional<Stage> keptStage(Bench bench, String caseId) {
    try {
      return bench.casework().library().ofCase(caseId).map(kept -> kept.used().stage());
    } catch (InvalidInputException e) {
      // A kept version that no longer reads as a stage: the technician picks the stage again.
      return Optional.empty();
    }
  }
}
