package com.stagewise.ui.stage;

import javafx.beans.binding.Bindings;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.control.ToggleButton;
import javafx.scene.control.ToggleGroup;
import javafx.scene.control.Tooltip;
import javafx.scene.layout.FlowPane;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

/**
 * The stage screen's left panel: where the stage is picked (the board model's library with each
 * stage's versions, or a template), the stage editor opened, and stage sheet files opened or saved.
 */
final class LibraryPanel {
  private final StageViewModel model;
  private final Node root;

  LibraryPanel(StageViewModel model, Node root) {
    this.model = model;
    this.root = root;
  }

  /** Builds the panel, with the template form {@code templateBox} in it. */
  VBox build(VBox templateBox) {
    VBox box = new VBox(10);
    box.getStyleClass().add("panel");
    ToggleGroup source = new ToggleGroup();
    ToggleButton fromLibrary = new ToggleButton("Library");
    fromLibrary.setId("stage-from-library");
    ToggleButton fromTemplate = new ToggleButton("Template");
    fromTemplate.setId("stage-from-template");
    fromLibrary.setToggleGroup(source);
    fromTemplate.setToggleGroup(source);
    fromLibrary.setSelected(true);
    fromLibrary.getStyleClass().add("source-toggle");
    fromTemplate.getStyleClass().add("source-toggle");
    fromLibrary.setMinWidth(javafx.scene.layout.Region.USE_PREF_SIZE);
    fromTemplate.setMinWidth(javafx.scene.layout.Region.USE_PREF_SIZE);
    source
        .selectedToggleProperty()
        .addListener(
            (o, was, now) -> {
              if (now == null) {
                was.setSelected(true);
              }
            });
    ListView<LibraryEntry> list = new ListView<>(model.library());
    list.setId("stage-library");
    VBox.setVgrow(list, Priority.ALWAYS);
    list.setCellFactory(
        v ->
            new ListCell<>() {
              {
                setPrefWidth(0);
              }

              @Override
              protected void updateItem(LibraryEntry entry, boolean empty) {
                super.updateItem(entry, empty);
                setText(empty || entry == null ? null : entry.title() + "\n" + entry.versionLine());
                setWrapText(true);
              }
            });
    list.getSelectionModel()
        .selectedItemProperty()
        .addListener(
            (o, was, entry) -> {
              if (entry != null && entry.stage() != model.stageProperty().get()) {
                model.choose(entry.stage());
              }
              model.libraryModel().showVersions(entry);
            });
    // The only stage of the model, chosen by the model as the library loaded: selected here too.
    model
        .libraryModel()
        .chosenForYouProperty()
        .addListener(
            (o, was, entry) -> {
              if (entry != null && list.getItems().contains(entry)) {
                list.getSelectionModel().select(entry);
              }
            });
    // Every version of the stage picked, latest first, with who saved it and when.
    Label versionsTitle = new Label("Versions of this stage, latest first");
    versionsTitle.getStyleClass().add("hint");
    ListView<LibraryEntry> versions = new ListView<>(model.libraryModel().versions());
    versions.setId("stage-versions");
    versions.setPrefHeight(3 * 48 + 4);
    versions.setMinHeight(2 * 48 + 4);
    versions.setCellFactory(
        v ->
            new ListCell<>() {
              {
                setPrefWidth(0);
              }

              @Override
              protected void updateItem(LibraryEntry entry, boolean empty) {
                super.updateItem(entry, empty);
                setText(empty || entry == null ? null : entry.versionLine());
                setWrapText(true);
              }
            });
    versions
        .getSelectionModel()
        .selectedItemProperty()
        .addListener(
            (o, was, entry) -> {
              if (entry != null) {
                model.choose(entry.stage());
              }
            });
    VBox versionsBox = new VBox(4, versionsTitle, versions);
    versionsBox.visibleProperty().bind(Bindings.isNotEmpty(model.libraryModel().versions()));
    versionsBox.managedProperty().bind(versionsBox.visibleProperty());
    Label caseVersion = new Label();
    caseVersion.setId("stage-case-version");
    caseVersion.getStyleClass().add("hint");
    caseVersion.setWrapText(true);
    caseVersion.textProperty().bind(model.libraryModel().caseNoteProperty());
    caseVersion.visibleProperty().bind(caseVersion.textProperty().isNotEmpty());
    caseVersion.managedProperty().bind(caseVersion.visibleProperty());
    Label note = new Label();
    note.getStyleClass().add("hint");
    note.setWrapText(true);
    note.textProperty().bind(model.libraryNoteProperty());
    VBox libraryBox = new VBox(8, caseVersion, list, versionsBox, note);
    VBox.setVgrow(libraryBox, Priority.ALWAYS);
    VBox.setVgrow(templateBox, Priority.ALWAYS);
    libraryBox.visibleProperty().bind(fromLibrary.selectedProperty());
    libraryBox.managedProperty().bind(fromLibrary.selectedProperty());
    templateBox.visibleProperty().bind(fromTemplate.selectedProperty());
    templateBox.managedProperty().bind(fromTemplate.selectedProperty());
    // Short words that fit the narrow column at every window size; the tooltips say the rest.
    Button edit = new Button("Edit");
    edit.setId("stage-edit");
    edit.setTooltip(new Tooltip("Edit a copy of the chosen stage in the stage editor"));
    edit.disableProperty().bind(model.stageProperty().isNull());
    edit.setOnAction(e -> model.openEditor(false));
    Button fresh = new Button("New");
    fresh.setId("stage-new");
    fresh.setTooltip(new Tooltip("Build a new stage from empty in the stage editor"));
    fresh.setOnAction(e -> model.openEditor(true));
    // Stage sheets as files: from a shared folder or a USB stick, and back.
    Button open = new Button("Open…");
    open.setId("stage-open-file");
    open.setTooltip(new Tooltip("Open a stage sheet file (from a shared folder or a USB stick)"));
    open.setOnAction(e -> chooseSheet(false).ifPresent(model.libraryModel()::importSheet));
    Button save = new Button("Save…");
    save.setId("stage-save-file");
    save.setTooltip(new Tooltip("Save the chosen stage as a stage sheet file"));
    save.disableProperty().bind(model.stageProperty().isNull());
    save.setOnAction(e -> chooseSheet(true).ifPresent(model.libraryModel()::exportSheet));
    box.getChildren()
        .addAll(
            new FlowPane(6, 6, fromLibrary, fromTemplate),
            libraryBox,
            templateBox,
            buttons(edit, fresh, open, save));
    return box;
  }

  /** The stage's buttons, wrapping onto as many rows as the column needs. */
  private static FlowPane buttons(Button... buttons) {
    FlowPane row = new FlowPane(6, 6, buttons);
    row.setPrefWrapLength(200);
    return row;
  }

  /** Asks for a stage sheet file to open, or where to save one. */
  private java.util.Optional<java.nio.file.Path> chooseSheet(boolean forSaving) {
    javafx.stage.FileChooser chooser = new javafx.stage.FileChooser();
    chooser.setTitle(forSaving ? "Save the stage sheet" : "Open a stage sheet");
    chooser
        .getExtensionFilters()
        .addAll(
            new javafx.stage.FileChooser.ExtensionFilter("Stage sheets", "*.stage.json"),
            new javafx.stage.FileChooser.ExtensionFilter("All files", "*.*"));
    var stage = model.stageProperty().get();
    if (forSaving && stage != null) {
      chooser.setInitialFileName(
          stage.title().replaceAll("[^A-Za-z0-9._-]+", "-").replaceAll("^-+|-+$", "")
              + ".stage.json");
    }
    var window = root.getScene() == null ? null : root.getScene().getWindow();
    java.io.File file = forSaving ? chooser.showSaveDialog(window) : chooser.showOpenDialog(window);
    return java.util.Optional.ofNullable(file).map(java.io.File::toPath);
  }
}
