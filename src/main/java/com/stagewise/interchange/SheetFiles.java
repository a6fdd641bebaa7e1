package com.stagewise.interchange;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Limits;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Reads and writes the text of a JSON document's file (UTF-8), refusing folders, special files,
 * texts that are not UTF-8 and files larger than {@link Limits#MAX_FILE_BYTES}, each with a message
 * that names the file.
 */
final class SheetFiles {
  private SheetFiles() {}

  static String readText(Path file) {
    try {
      if (Files.isDirectory(file)) {
        throw new InvalidInputException(file.toString(), "", "this is a folder (expected a file)");
      }
      if (Files.exists(file) && !Files.isRegularFile(file)) {
        throw new InvalidInputException(
            file.toString(), "", "this is not a regular file (expected a JSON text file)");
      }
      long size = Files.size(file);
      if (size > Limits.MAX_FILE_BYTES) {
        throw new InvalidInputException(
            file.toString(),
            "",
            "the file is "
                + size
                + " bytes long, more than this program reads ("
                + Limits.MAX_FILE_BYTES
                + " bytes at most; a stage sheet or readings file is a few kilobytes)");
      }
      return Files.readString(file, StandardCharsets.UTF_8);
    } catch (java.nio.file.NoSuchFileException e) {
      throw new InvalidInputException(
          file.toString(), "", "no such file (expected an existing file)");
    } catch (java.nio.charset.MalformedInputException e) {
      throw new InvalidInputException(
          file.toString(), "", "the file is not UTF-8 text (expected a JSON text file)");
    } catch (IOException e) {
      throw new InvalidInputException(
          file.toString(), "", "cannot read the file (" + e.getClass().getSimpleName() + ")");
    }
  }

  /** Refuses a text longer than {@link Limits#MAX_FILE_BYTES} characters before parsing it. */
  static void requireSize(String json, String source) {
    if (json.length() > Limits.MAX_FILE_BYTES) {
      throw new InvalidInputException(
          source,
          "",
          "the text is "
              + json.length()
              + " characters long, more than this program reads ("
              + Limits.MAX_FILE_BYTES
              + " at most)");
    }
  }

  static void writeText(Path file, String text) {
    try {
      Files.writeString(file, text, StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new InvalidInputException(
          file.toString(),
          "",
          "cannot write the file (" + e.getClass().getSimpleName() + "): expected a writable path");
    }
  }
}
