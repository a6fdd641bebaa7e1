package com.stagewise.cli.history;

import static com.stagewise.cli.history.Phrases.plural;
import static com.stagewise.history.HistoryStore.shortId;

import com.stagewise.casework.CaseAtHand;
import com.stagewise.casework.Casework;
import com.stagewise.casework.StoredReadings;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.interchange.ReadingsSheet;
import com.stagewise.interchange.StageSheet;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code history add-readings}: a readings file into a case, with the diagnosis it gives. */
@Command(
    name = "add-readings",
    mixinStandardHelpOptions = true,
    description =
        "Store a readings file in a case, with the diagnosis of all the case's standing"
            + " readings (those stored before, then the file's).")
final class AddReadingsCommand extends HistorySubcommand {
  @Mixin CaseOption target;

  @Option(
      names = "--readings",
      required = true,
      paramLabel = "FILE",
      description = "The readings file (*.readings.json).")
  Path readings;

  @Option(
      names = "--stage",
      paramLabel = "FILE",
      description =
          "The stage sheet the readings were taken on (default: the stage version the case is"
              + " diagnosed with, else the board model's stored sheet).")
  Path stageFile;

  @Option(
      names = "--sheet",
      paramLabel = "TITLE",
      description = "Which of the board model's stored sheets, if it has several.")
  String sheetTitle;

  @Option(
      names = "--top",
      defaultValue = "" + Diagnoser.DEFAULT_TOP,
      description = "The most suspects to keep (default ${DEFAULT-VALUE}).")
  int top;

  @Option(
      names = "--mains-powered",
      description =
          "The unit is mains-powered: when a power-off (ohms) check tells the leading suspects"
              + " apart, it is proposed first.")
  boolean mainsPowered;

  @Override
  void run(Casework work, PrintWriter out) {
    CaseAtHand at = work.caseAtHand(target.caseId);
    Stage stage = stage(work, at);
    ReadingSet set = ReadingsSheet.read(readings, stage);
    if (stageFile == null && at.repairCase().stageSheetId() == null) {
      // The case keeps the stored stage it is diagnosed with (the same version, nothing new is
      // saved), so that the app and other benches open it on that stage with these readings.
      work.library().useForCase(at.id(), stage);
    }
    Map<String, Integer> counts = work.shopCounts(at.boardModel());
    // The diagnosis stored with the case is that of all its standing readings, as in the app: the
    // ones stored before (whoever took them, struck ones left out), then this file's.
    List<Reading> taken = new ArrayList<>(work.standingReadings(at.id(), stage));
    int before = taken.size();
    taken.addAll(set.readings());
    StoredReadings stored =
        work.addReadings(
            at.id(),
            Diagnoser.of(stage, counts).mainsPowered(mainsPowered),
            new ReadingSet(set.meter(), taken),
            set.readings(),
            top);
    SuspectListRecord suspects = stored.suspectList();
    if (json()) {
      out.println(HistoryJson.storedReadings(stored.readings(), suspects));
      return;
    }
    out.println(
        plural(stored.readings().size(), "reading") + " stored in case " + shortId(at.id()) + ".");
    if (before > 0) {
      out.println(
          "Diagnosed together with the case's "
              + plural(before, "earlier reading")
              + " (struck ones left out).");
    }
    out.println("Verdict: " + suspects.verdict());
    suspects.suspects().forEach(s -> out.println(HistoryText.suspectLine(s, counts)));
    if (!suspects.nextProbes().isEmpty()) {
      out.println("Next probes:");
      suspects.nextProbes().lines().forEach(line -> out.println("  " + line));
    }
  }

  private Stage stage(Casework work, CaseAtHand at) {
    if (stageFile != null) {
      return StageSheet.read(stageFile);
    }
    if (sheetTitle == null) {
      // The case's own version (kept by the app or an earlier add-readings) stays its stage.
      var kept = work.library().ofCase(at.id());
      if (kept.isPresent()) {
        return kept.get().used().stage();
      }
    }
    try {
      return work.storedStage(at.boardModel(), sheetTitle).stage();
    } catch (InvalidInputException e) {
      throw new InvalidInputException(
          e.getMessage()
              + (sheetTitle == null
                  ? " (give the stage sheet with --stage FILE, or choose a stored one with --sheet"
                      + " TITLE)"
                  : " (choose a stored sheet by its title with --sheet TITLE)"));
    }
  }
}
