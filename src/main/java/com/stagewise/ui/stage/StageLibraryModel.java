package com.stagewise.ui.stage;

import com.stagewise.casework.CaseStage;
import com.stagewise.casework.LibraryStage;
import com.stagewise.circuit.Stage;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.RepairCase;
import com.stagewise.interchange.StageSheet;
import com.stagewise.ui.Bench;
import com.stagewise.ui.words.Words;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;
import java.util.function.Supplier;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * Where the stage screen picks a stage: the board model's library (the latest version of each
 * stage, the one saved last first), the versions of the stage picked (latest first, with who saved
 * each and when), the version the open case is diagnosed with, and stage sheet files to open and
 * save (a shared folder or a USB stick is just a folder).
 */
public final class StageLibraryModel {
  private final Bench bench;
  private final Consumer<Stage> use;
  private final Supplier<Stage> current;
  private final ObservableList<LibraryEntry> library = FXCollections.observableArrayList();
  private final ObservableList<LibraryEntry> versions = FXCollections.observableArrayList();
  private final StringProperty libraryNote = new SimpleStringProperty("");
  private final StringProperty caseNote = new SimpleStringProperty("");
  private final javafx.beans.property.ObjectProperty<LibraryEntry> chosenForYou =
      new javafx.beans.property.SimpleObjectProperty<>();
  private Path arriving;

  /**
   * Creates the model on a bench; {@code use} takes a stage opened from a file or the case's own
   * version, {@code current} gives the stage chosen now (to save to a file).
   */
  StageLibraryModel(Bench bench, Consumer<Stage> use, Supplier<Stage> current) {
    this.bench = bench;
    this.use = use;
    this.current = current;
  }

  public ObservableList<LibraryEntry> library() {
    return library;
  }

  /** Returns the versions of the stage picked in the library, latest first. */
  public ObservableList<LibraryEntry> versions() {
    return versions;
  }

  public StringProperty libraryNoteProperty() {
    return libraryNote;
  }

  /**
   * Returns what the open case's stage version is, in words, with a word when a newer version of
   * its stage exists (empty when the case has kept none yet).
   */
  public StringProperty caseNoteProperty() {
    return caseNote;
  }

  /**
   * Returns the library entry chosen for the technician as the library loaded: the only stage of
   * the board model, when the case keeps no stage version of its own and no stage was chosen yet
   * (null otherwise). The screen selects it in its list.
   */
  public javafx.beans.property.ReadOnlyObjectProperty<LibraryEntry> chosenForYouProperty() {
    return chosenForYou;
  }

  /** Forgets the last board model's library (another unit is on the bench). */
  void clear() {
    chosenForYou.set(null);
    library.clear();
    versions.clear();
    caseNote.set("");
  }

  /**
   * Loads the library of the board model on the bench and the version the open case is diagnosed
   * with; a case that kept a version and has no stage chosen yet takes that version.
   */
  public void loadLibrary() {
    BoardModel model = bench.boardModelProperty().get();
    if (model == null) {
      clear();
      libraryNote.set("Choose a unit first.");
      return;
    }
    if (arriving != null) {
      Path sheet = arriving;
      arriving = null;
      importSheet(sheet);
    }
    RepairCase open = bench.openCaseProperty().get();
    String caseId = open == null ? null : open.id();
    bench
        .tasks()
        .run(
            "Reading the stage library",
            () -> {
              List<LibraryEntry> entries = new ArrayList<>();
              // The latest version of each stage, the one saved most recently first: a stage
              // built or edited for an earlier unit of the model is the likeliest one now.
              for (LibraryStage stored : bench.casework().stageLibrary(model)) {
                entries.add(LibraryEntry.of(stored));
              }
              Optional<CaseStage> kept =
                  caseId == null ? Optional.empty() : bench.casework().library().ofCase(caseId);
              return new Loaded(entries, kept);
            },
            loaded -> {
              chosenForYou.set(null);
              library.setAll(loaded.entries());
              versions.clear();
              libraryNote.set(
                  loaded.entries().isEmpty()
                      ? "No stages for " + model.name() + " yet. Build one from a template."
                      : loaded.entries().size()
                          + " stage"
                          + (loaded.entries().size() == 1 ? "" : "s")
                          + " of "
                          + model.name()
                          + ".");
              caseNote.set(loaded.kept().map(StageLibraryModel::caseWords).orElse(""));
              if (loaded.kept().isPresent() && current.get() == null) {
                // The case's own version wins over any choice of the list.
                use.accept(loaded.kept().get().used().stage());
              } else if (loaded.kept().isEmpty()
                  && current.get() == null
                  && loaded.entries().size() == 1) {
                // The only stage of the model: chosen, its drawing and parts shown, one tap less.
                LibraryEntry only = loaded.entries().get(0);
                use.accept(only.stage());
                showVersions(only);
                chosenForYou.set(only);
              }
            },
            e ->
                bench
                    .problems()
                    .failed("Could not read the stage library", e, Words.CHECK_DATABASE));
  }

  private record Loaded(List<LibraryEntry> entries, Optional<CaseStage> kept) {}

  /** Returns the case's stage version in words, and whether a newer version exists. */
  static String caseWords(CaseStage kept) {
    LibraryEntry used = LibraryEntry.of(kept.used());
    String words =
        "This case is diagnosed with \"" + used.title() + "\", " + used.versionLine() + ".";
    if (kept.newerExists()) {
      words +=
          " A newer version exists: version "
              + kept.latest().version()
              + (kept.latest().savedBy().isBlank() ? "" : " by " + kept.latest().savedBy())
              + ", "
              + Words.dateTime(kept.latest().savedAt())
              + ". The case keeps its own unless you choose another.";
    }
    return words;
  }

  /** Lists every version of the stage of {@code entry}, latest first. */
  public void showVersions(LibraryEntry entry) {
    BoardModel model = bench.boardModelProperty().get();
    if (entry == null || model == null) {
      versions.clear();
      return;
    }
    bench
        .tasks()
        .run(
            "Reading the versions of " + entry.title(),
            () ->
                bench.casework().library().versions(model, entry.sheet().title()).stream()
                    .map(LibraryEntry::of)
                    .toList(),
            versions::setAll,
            e ->
                bench
                    .problems()
                    .failed("Could not read the stage's versions", e, Words.CHECK_DATABASE));
  }

  /**
   * Keeps a stage sheet file to open when the stage screen is first shown for a unit (the app was
   * started with it, e.g. from a file manager).
   */
  public void openOnArrival(Path sheet) {
    arriving = sheet;
  }

  /**
   * Opens a stage sheet file (from a shared folder or a USB stick, say) as the stage to work on. It
   * is checked first; a file that is not a usable sheet is refused with what to fix and changes
   * nothing. Like a stage built here, it becomes a version of the board model's library stage of
   * its title when it is used.
   */
  public void importSheet(Path file) {
    bench
        .tasks()
        .run(
            "Opening the stage sheet " + file.getFileName(),
            () -> StageSheet.read(file),
            opened -> {
              use.accept(opened);
              BoardModel model = bench.boardModelProperty().get();
              libraryNote.set(
                  "Opened \""
                      + opened.title()
                      + "\" from "
                      + file.getFileName()
                      + (model == null
                          ? "."
                          : ". It joins the library of " + model.name() + " when you use it."));
            },
            e ->
                bench
                    .problems()
                    .show(
                        "This file is not a stage sheet that can be used",
                        e.getMessage(),
                        "Fix what is named above in the file, or choose another file ("
                            + StageSheet.SUFFIX
                            + "). Nothing was changed."));
  }

  /** Saves the chosen stage as a stage sheet file, for another bench or the shop's engineer. */
  public void exportSheet(Path file) {
    Stage s = current.get();
    if (s == null) {
      bench
          .problems()
          .show(
              "Choose a stage first", "No stage is chosen to save.", "Tap a stage in the library.");
      return;
    }
    Path target =
        file.getFileName().toString().endsWith(StageSheet.SUFFIX)
            ? file
            : file.resolveSibling(
                file.getFileName().toString().replaceFirst("\\.json$", "") + StageSheet.SUFFIX);
    bench
        .tasks()
        .run(
            "Saving the stage sheet " + target.getFileName(),
            () -> {
              StageSheet.write(s, target);
              return target;
            },
            saved -> libraryNote.set("Saved \"" + s.title() + "\" to " + saved + "."),
            e ->
                bench
                    .problems()
                    .failed(
                        "Could not save the stage sheet",
                        e,
                        "Check that the folder exists, is writable and has room, then try again."));
  }
}
