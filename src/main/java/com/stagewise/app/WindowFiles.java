package com.stagewise.app;

import com.stagewise.ui.FilePicker;
import java.io.File;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.function.Supplier;
import javafx.stage.FileChooser;
import javafx.stage.Window;

/** The app's file chooser for saving and opening files, over the bench's window. */
final class WindowFiles implements FilePicker {
  private final Supplier<Window> window;
  private File lastFolder = new File(System.getProperty("user.home"));

  WindowFiles(Supplier<Window> window) {
    this.window = window;
  }

  @Override
  public Optional<Path> saveAs(String title, String suggestedName, String kind, String pattern) {
    FileChooser chooser = new FileChooser();
    chooser.setTitle(title);
    chooser.setInitialFileName(suggestedName);
    if (lastFolder.isDirectory()) {
      chooser.setInitialDirectory(lastFolder);
    }
    chooser
        .getExtensionFilters()
        .addAll(
            new FileChooser.ExtensionFilter(kind, pattern),
            new FileChooser.ExtensionFilter("All files", "*.*"));
    File chosen = chooser.showSaveDialog(window.get());
    if (chosen == null) {
      return Optional.empty();
    }
    lastFolder = chosen.getAbsoluteFile().getParentFile();
    return Optional.of(chosen.toPath());
  }

  @Override
  public Optional<Path> open(String title, String kind, List<String> patterns) {
    FileChooser chooser = new FileChooser();
    chooser.setTitle(title);
    if (lastFolder.isDirectory()) {
      chooser.setInitialDirectory(lastFolder);
    }
    chooser
        .getExtensionFilters()
        .addAll(
            new FileChooser.ExtensionFilter(kind, patterns),
            new FileChooser.ExtensionFilter("All files", "*.*"));
    File chosen = chooser.showOpenDialog(window.get());
    if (chosen == null) {
      return Optional.empty();
    }
    lastFolder = chosen.getAbsoluteFile().getParentFile();
    return Optional.of(chosen.toPath());
  }
}
