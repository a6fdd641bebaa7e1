package com.stagewise.cli.history;

import static com.stagewise.history.HistoryStore.shortId;

import com.stagewise.casework.Casework;
import com.stagewise.history.record.StoredReading;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.util.List;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/**
 * {@code history strike-reading}: a mistyped reading struck out of a case (or restored). Nothing is
 * deleted: the reading stays in the history, marked struck with the time.
 */
@Command(
    name = "strike-reading",
    mixinStandardHelpOptions = true,
    description =
        "Strike out a mistyped reading of a case (it stays in the history, marked struck, and is"
            + " left out of later diagnoses), or restore it with --restore.")
final class StrikeReadingCommand extends HistorySubcommand {
  @Mixin CaseOption target;

  @Option(
      names = "--reading",
      required = true,
      paramLabel = "N|ID",
      description =
          "The reading: its number in the case as 'history show' lists them (1 is the first), or"
              + " its id (or the id's first characters).")
  String reading;

  @Option(names = "--restore", description = "Make a struck reading stand again.")
  boolean restore;

  @Override
  void run(Casework work, PrintWriter out) {
    String caseId = work.history().cases().resolveId(target.caseId);
    StoredReading r = work.strikeReading(caseId, reading, restore);
    if (json()) {
      out.println(HistoryJson.storedReadings(List.of(r), null));
      return;
    }
    out.println(
        "Reading at "
            + r.at()
            + " ("
            + r.kind().word()
            + " "
            + HistoryText.number(r.value())
            + " V) "
            + (r.struck() ? "struck out of" : "restored in")
            + " case "
            + shortId(caseId)
            + ".");
  }
}
