package com.stagewise.cli.history;

import static com.stagewise.history.HistoryStore.shortId;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code history close-case}: the outcome, the faults found and a note, all or nothing. */
@Command(
    name = "close-case",
    mixinStandardHelpOptions = true,
    description = "Close out a case: its outcome, the faults found and a closing note.")
final class CloseCaseCommand extends HistorySubcommand {
  @Mixin CaseOption target;

  @Option(names = "--outcome", required = true, description = "fixed, not-fixed or returned.")
  String outcome;

  @Option(
      names = "--fault",
      paramLabel = "FAULT",
      description = "A fault found to be wrong, e.g. R2:open; repeatable.")
  List<String> faults = new ArrayList<>();

  @Option(names = "--note", description = "A closing note.")
  String note;

  @Override
  void run(Casework work, PrintWriter out) {
    Outcome how =
        Outcome.fromWord(outcome)
            .orElseThrow(
                () ->
                    new InvalidInputException(
                        "command line",
                        "--outcome",
                        "expected fixed, not-fixed or returned, got '" + outcome + "'"));
    String id = work.history().cases().resolveId(target.caseId);
    RepairCase closed = work.closeCase(id, how, faults, note);
    out.println(
        json()
            ? HistoryJson.repairCase(closed)
            : "Case "
                + shortId(id)
                + " closed: "
                + how.word()
                + (faults.isEmpty() ? "" : ", found " + String.join(", ", faults))
                + ".");
  }
}
