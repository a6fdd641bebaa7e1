package com.stagewise.cli.history;

import static com.stagewise.history.HistoryStore.shortId;

import com.stagewise.casework.Casework;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.nio.file.Path;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Parameters;

/**
 * {@code history attach-photo --case ID FILE}: a photo of the board kept with a case, as the
 * close-out attaches one: a PNG or JPEG picture of at most 20 MB, stored exactly as the file is,
 * with its name, when and by whom. A photo is never changed once attached.
 */
@Command(
    name = "attach-photo",
    mixinStandardHelpOptions = true,
    description =
        "Attach a photo of the board to a case: a PNG or JPEG picture of at most 20 MB, kept in"
            + " the history exactly as the file is, with its name, when and by whom.")
final class AttachPhotoCommand extends HistorySubcommand {
  @Mixin CaseOption target;

  @Parameters(index = "0", paramLabel = "FILE", description = "The picture file (PNG or JPEG).")
  Path file;

  @Override
  void run(Casework work, PrintWriter out) {
    String caseId = work.history().cases().resolveId(target.caseId);
    CasePhoto photo = work.attachPhoto(caseId, file);
    if (json()) {
      out.println(HistoryJson.photo(photo));
      return;
    }
    out.println(
        "Photo "
            + photo.fileName()
            + " ("
            + HistoryText.pixels(photo)
            + ") attached to case "
            + shortId(caseId)
            + ".");
  }
}
