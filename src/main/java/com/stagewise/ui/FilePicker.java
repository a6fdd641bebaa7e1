package com.stagewise.ui;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;

/**
 * Asks the technician where to save a file, or which file to open (a chooser on screen; a fixed
 * answer in tests). Empty when they cancel.
 */
@FunctionalInterface
public interface FilePicker {
  /** Asks nobody: every request is answered as if cancelled (until the app sets its own). */
  FilePicker NONE = (title, name, kind, pattern) -> Optional.empty();

  /**
   * Asks where to save a file.
   *
   * @param title the chooser's title ("Save the repair report")
   * @param suggestedName the file name offered
   * @param kind what the file is, in words ("PDF report")
   * @param pattern the file names shown, e.g. {@code *.pdf}
   */
  Optional<Path> saveAs(String title, String suggestedName, String kind, String pattern);

  /**
   * Asks which file to open; a picker that only saves answers as if cancelled.
   *
   * @param title the chooser's title ("Attach a photo of the board")
   * @param kind what the files are, in words ("Photos (PNG or JPEG)")
   * @param patterns the file names shown, e.g. {@code *.png}, {@code *.jpg}
   */
  default Optional<Path> open(String title, String kind, List<String> patterns) {
    return Optional.empty();
  }
}
