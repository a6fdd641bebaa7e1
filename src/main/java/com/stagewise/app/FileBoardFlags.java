package com.stagewise.app;

import com.stagewise.ui.BoardFlags;
import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Properties;

/** Which board models are mains-powered, kept in a small properties file beside the database. */
final class FileBoardFlags implements BoardFlags {
  private final Path file;
  private final Properties props = new Properties();

  FileBoardFlags(Path file) {
    this.file = file;
    if (Files.exists(file)) {
      try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
        props.load(in);
      } catch (IOException e) {
        throw new UncheckedIOException("could not read " + file, e);
      }
    }
  }

  @Override
  public synchronized boolean isMainsPowered(String boardModelId) {
    return Boolean.parseBoolean(props.getProperty("mains." + boardModelId, "false"));
  }

  @Override
  public synchronized void setMainsPowered(String boardModelId, boolean mains) {
    props.setProperty("mains." + boardModelId, Boolean.toString(mains));
    try {
      Files.createDirectories(file.toAbsolutePath().getParent());
      try (Writer out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
        props.store(out, "Stagewise: mains-powered board models");
      }
    } catch (IOException e) {
      throw new UncheckedIOException("could not write " + file, e);
    }
  }
}
