package com.stagewise.ui;

import com.stagewise.casework.Casework;
import com.stagewise.history.HistoryStore;
import com.stagewise.report.CaseReport;
import com.stagewise.report.ReportFile;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Optional;
import java.util.function.Consumer;

/** Saves a case's repair report (PDF) where the technician chooses, from any screen. */
public final class ReportSaving {
  private ReportSaving() {}

  /** Returns the file name offered for a case's report: serial and short case id. */
  public static String suggestedName(String serial, String caseId) {
    String safeSerial = serial.strip().replaceAll("[^A-Za-z0-9._-]+", "-");
    return "repair-report-" + safeSerial + "-" + HistoryStore.shortId(caseId) + ".pdf";
  }

  /**
   * Asks where to save the report of case {@code caseId} (of the unit {@code serial}) and writes it
   * there off the screen's thread; {@code saved} gets a line saying where it went. Cancelling the
   * chooser does nothing.
   */
  public static void save(Bench bench, String caseId, String serial, Consumer<String> saved) {
    Optional<Path> chosen =
        bench
            .files()
            .saveAs("Save the repair report", suggestedName(serial, caseId), "PDF report", "*.pdf");
    if (chosen.isEmpty()) {
      return;
    }
    Path target = withPdfEnding(chosen.get());
    bench
        .tasks()
        .run(
            "Saving the repair report",
            () ->
                ReportFile.write(
                    CaseReport.read(bench.store(), caseId, Instant.now(), Casework.version()),
                    target,
                    true),
            pages ->
                saved.accept(
                    "Report saved: "
                        + target.getFileName()
                        + " ("
                        + (pages == 1 ? "1 page" : pages + " pages")
                        + ") in "
                        + target.toAbsolutePath().getParent()
                        + "."),
            e ->
                bench
                    .problems()
                    .failed(
                        "Could not save the report",
                        e,
                        "Choose a folder you can write to (your home folder, a USB stick) and"
                            + " save again; the case itself is kept in the history."));
  }

  private static Path withPdfEnding(Path file) {
    String name = file.getFileName().toString();
    return name.toLowerCase(java.util.Locale.ROOT).endsWith(".pdf")
        ? file
        : file.resolveSibling(name + ".pdf");
  }
}
