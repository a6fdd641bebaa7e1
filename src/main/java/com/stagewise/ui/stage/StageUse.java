package com.stagewise.ui.stage;

import com.stagewise.circuit.Stage;
import com.stagewise.history.CaseFile;
import com.stagewise.history.record.StoredReading;
import com.stagewise.ui.Bench;
import com.stagewise.ui.ReadingsLeftOff;
import com.stagewise.ui.Step;
import com.stagewise.ui.words.Words;
import java.util.List;

/**
 * Puts the stage chosen on the stage screen on the bench for the open case and keeps it with the
 * case. A stage that is new on the bench comes with the case's readings as the history holds them
 * (whoever took them: this bench, the command line, another bench), those the stage has points for.
 */
final class StageUse {
  private StageUse() {}

  /** Puts {@code s} on the bench for the open case and goes to the readings. */
  static void use(Bench bench, StageLibraryModel library, Stage s) {
    String caseId = bench.openCaseProperty().get().id();
    boolean changed = bench.stageProperty().get() == null || !bench.stageProperty().get().equals(s);
    if (!changed) {
      keepForCase(bench, library, caseId, s);
      bench.go(Step.READINGS);
      return;
    }
    // The case's readings are the history's, whoever took them (this bench, the command
    // line, another bench): the ones this stage has points for come onto the bench with it.
    bench
        .tasks()
        .run(
            "Reading the case's readings",
            () -> bench.store().cases().caseFile(caseId).map(CaseFile::readings).orElse(List.of()),
            stored -> {
              if (bench.openCaseProperty().get() == null
                  || !bench.openCaseProperty().get().id().equals(caseId)) {
                return;
              }
              List<StoredReading> leftOff = bench.takeReadings(stored, s);
              bench.stageProperty().set(s);
              keepForCase(bench, library, caseId, s);
              bench.go(Step.READINGS);
              ReadingsLeftOff.tell(bench.problems(), leftOff);
            },
            e ->
                bench
                    .problems()
                    .failed("Could not read the case's readings", e, Words.CHECK_DATABASE));
  }

  /** Keeps the stage with the case: on this bench (where it was left) and in the history. */
  private static void keepForCase(Bench bench, StageLibraryModel library, String caseId, Stage s) {
    bench
        .tasks()
        .run(
            "Saving the case's stage",
            () -> {
              bench.resume().saveStage(caseId, s);
              // The case keeps the version it is diagnosed with; a stage built or changed here
              // becomes the next version of its library stage, so the next unit of the model is
              // offered it first.
              return bench.casework().library().useForCase(caseId, s);
            },
            kept ->
                library
                    .caseNoteProperty()
                    .set(
                        "This case is diagnosed with \""
                            + kept.title()
                            + "\", "
                            + LibraryEntry.of(kept).versionLine()
                            + "."),
            e ->
                bench
                    .problems()
                    .failed("Could not keep the stage for this case", e, Words.CHECK_DATABASE));
  }
}
