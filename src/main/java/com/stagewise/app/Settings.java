package com.stagewise.app;

import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Properties;

/** The app's few settings, in a properties file in the data folder. */
final class Settings {
  private static final String CAUTION = "caution.acknowledged";
  private static final String SHOP_SERVER = "shop.server";
  private static final String LARGE_TEXT = "view.large-text";
  private static final String HIGH_CONTRAST = "view.high-contrast";

  private final Path file;
  private final Properties props = new Properties();

  /** Reads the settings file, if there is one (a missing or unreadable file gives the defaults). */
  Settings(Path file) {
    this.file = file;
    if (Files.exists(file)) {
      try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
        props.load(in);
      } catch (IOException e) {
        // An unreadable settings file only means the caution shows again: safe to go on.
        props.clear();
      }
    }
  }

  /** Returns whether the technician has acknowledged the safety caution on this machine. */
  synchronized boolean cautionAcknowledged() {
    return Boolean.parseBoolean(props.getProperty(CAUTION, "false"));
  }

  /**
   * Returns the shop server's address as set in the settings file ({@code shop.server}, e.g. {@code
   * postgresql://bench-server/shop}), or null when none is set.
   */
  synchronized String shopServer() {
    String server = props.getProperty(SHOP_SERVER, "").strip();
    return server.isEmpty() ? null : server;
  }

  /** Records that the safety caution was acknowledged. */
  synchronized void acknowledgeCaution() {
    props.setProperty(CAUTION, "true");
    save();
  }

  /** Returns whether the screens show larger text. */
  synchronized boolean largeText() {
    return Boolean.parseBoolean(props.getProperty(LARGE_TEXT, "false"));
  }

  /** Returns whether the screens show high contrast. */
  synchronized boolean highContrast() {
    return Boolean.parseBoolean(props.getProperty(HIGH_CONTRAST, "false"));
  }

  /** Keeps whether the screens show larger text, for the next start. */
  synchronized void setLargeText(boolean on) {
    props.setProperty(LARGE_TEXT, Boolean.toString(on));
    save();
  }

  /** Keeps whether the screens show high contrast, for the next start. */
  synchronized void setHighContrast(boolean on) {
    props.setProperty(HIGH_CONTRAST, Boolean.toString(on));
    save();
  }

  private void save() {
    try {
      Files.createDirectories(file.toAbsolutePath().getParent());
      try (Writer out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
        props.store(out, "Stagewise settings");
      }
    } catch (IOException e) {
      throw new UncheckedIOException("could not write the settings file " + file, e);
    }
  }
}
