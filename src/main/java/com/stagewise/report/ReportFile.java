package com.stagewise.report;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.UUID;

/**
 * Writes a report to a file whole or not at all: to a temporary file beside the target first, then
 * moved into place, so a failed write leaves no half-written report and never the wrong one.
 */
public final class ReportFile {
  private ReportFile() {}

  /**
   * Writes {@code report} as a PDF to {@code target} and returns its number of pages.
   *
   * @param replace whether an existing file at {@code target} is replaced
   * @throws FileAlreadyExistsException if {@code target} exists and {@code replace} is false
   * @throws IOException if the folder cannot be written
   */
  public static int write(CaseReport report, Path target, boolean replace) throws IOException {
    // Files.createTempFile would make the report readable by its owner only (0600); a report is
    // made to be printed and passed on, so it gets the user's normal permissions (umask).
    Path temporary =
        Files.createFile(
            target
                .toAbsolutePath()
                .getParent()
                .resolve(".stagewise-report-" + UUID.randomUUID() + ".tmp"));
    try {
      int pages;
      try (OutputStream stream = Files.newOutputStream(temporary)) {
        pages = PdfReport.write(report, stream);
      }
      moveIntoPlace(temporary, target, replace);
      return pages;
    } finally {
      try {
        Files.deleteIfExists(temporary);
      } catch (IOException ignored) {
        // Only a stray temporary file is left; the report itself is complete or absent.
      }
    }
  }

  private static void moveIntoPlace(Path temporary, Path target, boolean replace)
      throws IOException {
    if (!replace) {
      // Without REPLACE_EXISTING the move fails rather than overwrite a file that appeared
      // meanwhile.
      Files.move(temporary, target);
      return;
    }
    try {
      Files.move(
          temporary, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
    } catch (AtomicMoveNotSupportedException e) {
      Files.move(temporary, target, StandardCopyOption.REPLACE_EXISTING);
    }
  }
}
