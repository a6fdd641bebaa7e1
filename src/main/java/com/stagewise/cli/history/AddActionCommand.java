package com.stagewise.cli.history;

import static com.stagewise.history.HistoryStore.shortId;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.RepairAction;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code history add-action}: what was done to the unit in a case. */
@Command(
    name = "add-action",
    mixinStandardHelpOptions = true,
    description = "Record what was done: a part replaced, a reflow, an adjustment.")
final class AddActionCommand extends HistorySubcommand {
  @Mixin CaseOption target;

  @Option(
      names = "--kind",
      required = true,
      description = "part-replaced, reflow, adjustment or other.")
  String kind;

  @Option(names = "--part", defaultValue = "", description = "The part designator, e.g. R2 or U1.")
  String part;

  @Option(names = "--old", defaultValue = "", description = "The old value or part number.")
  String oldValue;

  @Option(names = "--new", defaultValue = "", description = "The new value or part number.")
  String newValue;

  @Option(names = "--text", defaultValue = "", description = "What was done, in words.")
  String text;

  @Override
  void run(Casework work, PrintWriter out) {
    ActionKind what =
        ActionKind.fromWord(kind)
            .orElseThrow(
                () ->
                    new InvalidInputException(
                        "command line",
                        "--kind",
                        "expected part-replaced, reflow, adjustment or other, got '" + kind + "'"));
    RepairAction action =
        work.addAction(
            work.history().cases().resolveId(target.caseId), what, part, oldValue, newValue, text);
    out.println(
        json()
            ? HistoryJson.action(action)
            : "Action recorded in case " + shortId(action.caseId()) + ".");
  }
}
