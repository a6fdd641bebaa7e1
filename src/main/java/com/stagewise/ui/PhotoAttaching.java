package com.stagewise.ui;

import com.stagewise.history.Checks;
import com.stagewise.history.record.CasePhoto;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;

/** Attaches a photo of the board to a case from a file the technician picks, from any screen. */
public final class PhotoAttaching {
  /** The file names the chooser shows first. */
  static final List<String> PATTERNS = List.of("*.png", "*.jpg", "*.jpeg", "*.PNG", "*.JPG");

  private PhotoAttaching() {}

  /**
   * Asks which picture to attach to case {@code caseId} and stores it off the screen's thread;
   * {@code attached} gets the photo as stored. Cancelling the chooser does nothing; a file that is
   * too large or not a picture is a problem that names it and says what to do.
   */
  public static void attach(Bench bench, String caseId, Consumer<CasePhoto> attached) {
    Optional<Path> chosen =
        bench.files().open("Attach a photo of the board", "Photos (PNG or JPEG)", PATTERNS);
    if (chosen.isEmpty()) {
      return;
    }
    Path file = chosen.get();
    bench
        .tasks()
        .run(
            "Attaching the photo",
            () -> bench.casework().attachPhoto(caseId, file),
            attached,
            e ->
                bench
                    .problems()
                    .failed(
                        "Could not attach the photo",
                        e,
                        "Choose a PNG or JPEG picture of at most "
                            + Checks.megabytes(Checks.MAX_PHOTO_BYTES)
                            + " (a phone's photo saved as JPEG is fine); the case is as it was."));
  }
}
