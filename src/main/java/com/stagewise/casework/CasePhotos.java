package com.stagewise.casework;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.Cases;
import com.stagewise.history.Checks;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.PhotoFormat;
import com.stagewise.history.record.CasePhoto;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Attaches a photo of the board to a case from a picture file: the file is checked first (it is
 * there, a PNG or JPEG picture, at most {@link Checks#MAX_PHOTO_BYTES}), every refusal in plain
 * words naming the file, and then stored in one transaction.
 */
final class CasePhotos {
  private CasePhotos() {}

  static CasePhoto attach(HistoryStore store, String caseId, Path file, String who) {
    String name = file.getFileName() == null ? file.toString() : file.getFileName().toString();
    String source = file.toString();
    long size;
    try {
      if (Files.isDirectory(file)) {
        throw new InvalidInputException(
            source, "", name + " is a folder, not a photo; choose a PNG or JPEG picture in it");
      }
      size = Files.size(file);
    } catch (NoSuchFileException e) {
      throw new InvalidInputException(source, "", "no such file: " + name);
    } catch (IOException e) {
      throw new InvalidInputException(source, "", "cannot read " + name + ": " + e.getMessage());
    }
    if (size > Checks.MAX_PHOTO_BYTES) {
      throw new InvalidInputException(
          source,
          "",
          name
              + " is "
              + Checks.megabytes(size)
              + "; a photo may be at most "
              + Checks.megabytes(Checks.MAX_PHOTO_BYTES)
              + ". Save it smaller (a lower resolution or more JPEG compression) and attach it"
              + " again");
    }
    if (size == 0) {
      throw new InvalidInputException(source, "", name + " is empty; it holds no picture");
    }
    byte[] image;
    try {
      image = Files.readAllBytes(file);
    } catch (IOException e) {
      throw new InvalidInputException(source, "", "cannot read " + name + ": " + e.getMessage());
    }
    if (PhotoFormat.of(image).isEmpty()) {
      throw new InvalidInputException(
          source,
          "",
          name
              + " is not a photo this program can keep: expected a PNG or JPEG picture (as a"
              + " camera or phone saves it)");
    }
    return store.cases().attachPhoto(caseId, new Cases.PhotoDraft(name, image, who));
  }
}
