package com.stagewise.cli.history;

import static com.stagewise.history.HistoryStore.shortId;

import com.stagewise.casework.Casework;
import com.stagewise.history.record.CaseNote;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code history add-note}: a time-stamped note in a case. */
@Command(
    name = "add-note",
    mixinStandardHelpOptions = true,
    description = "Add a time-stamped note to a case.")
final class AddNoteCommand extends HistorySubcommand {
  @Mixin CaseOption target;

  @Option(names = "--text", required = true, description = "The note.")
  String text;

  @Override
  void run(Casework work, PrintWriter out) {
    CaseNote note = work.addNote(work.history().cases().resolveId(target.caseId), text);
    out.println(
        json() ? HistoryJson.note(note) : "Note added to case " + shortId(note.caseId()) + ".");
  }
}
