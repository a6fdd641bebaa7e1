package com.stagewise.ui.history;

import com.stagewise.history.SearchHit;
import com.stagewise.ui.widget.Keypad;
import com.stagewise.ui.words.Words;
import java.io.ByteArrayInputStream;
import java.util.List;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.control.ListView;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TextField;
import javafx.scene.control.ToggleButton;
import javafx.scene.control.ToggleGroup;
import javafx.scene.image.Image;
import javafx.scene.image.ImageView;
import javafx.scene.layout.FlowPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;

/** The history screen: search, results, and the chosen case as it was with its unit's timeline. */
public final class HistoryView {
  private final HistoryViewModel model;
  private final HBox root = new HBox(12);
  private final VBox caseBox = new VBox(6);
  private final ListView<SearchHit> list;

  /** The width of a thumbnail in pixels (about a thumb's width on a 13-inch touch screen). */
  private static final double THUMB_WIDTH = 180;

  /** The largest side a photo is decoded to for the large view (a full-HD screen's width). */
  private static final double LARGE = 1920;

  /** Builds the screen bound to its model. */
  public HistoryView(HistoryViewModel model) {
    this.model = model;
    root.getStyleClass().add("screen");
    root.getStylesheets().add(HistoryView.class.getResource("history.css").toExternalForm());
    root.setId("screen-history");
    list = new ListView<>(model.hits());
    VBox left = searchPanel();
    left.setPrefWidth(640);
    // Room for the keypad at the 48 px touch minimum per key; at 1024 wide the case beside it gets
    // the rest.
    left.setMinWidth(560);
    VBox right = new VBox(8);
    right.getStyleClass().add("panel");
    caseBox.setId("history-case");
    ScrollPane scroll = new ScrollPane(caseBox);
    scroll.setFitToWidth(true);
    StackPane layers = new StackPane(scroll, largePhoto(scroll));
    VBox.setVgrow(layers, Priority.ALWAYS);
    right.getChildren().add(layers);
    HBox.setHgrow(right, Priority.ALWAYS);
    root.getChildren().addAll(left, right);
    model.shownProperty().addListener((o, was, now) -> showCase(now));
    model
        .photos()
        .addListener(
            (javafx.collections.ListChangeListener<HistoryViewModel.ShownPhoto>)
                c -> showCase(model.shownProperty().get()));
    model
        .timeline()
        .addListener(
            (javafx.collections.ListChangeListener<String>)
                c -> showCase(model.shownProperty().get()));
    showCase(null);
  }

  /** Returns the screen's root node. */
  public Node root() {
    return root;
  }

  private VBox searchPanel() {
    VBox box = new VBox(8);
    box.getStyleClass().add("panel");
    Label title = new Label("Search the repair history");
    title.getStyleClass().add("section-title");
    TextField field = new TextField();
    field.setId("history-query");
    field.getStyleClass().add("big-field");
    field.setPromptText("Serial, part or words");
    field.textProperty().bindBidirectional(model.queryProperty());
    field.setOnAction(e -> model.search());
    HBox.setHgrow(field, Priority.ALWAYS);
    Button search = new Button("Search");
    search.setId("history-search");
    search.getStyleClass().add("primary");
    search.setMinHeight(60);
    search.setOnAction(e -> model.search());
    ToggleGroup fields = new ToggleGroup();
    // The fields wrap onto a second row where larger text leaves no room for them all.
    FlowPane fieldRow = new FlowPane(6, 6);
    fieldRow.setAlignment(Pos.CENTER_LEFT);
    Label in = new Label("In:");
    in.setMinWidth(javafx.scene.layout.Region.USE_PREF_SIZE);
    fieldRow.getChildren().add(in);
    for (HistoryViewModel.Field f : HistoryViewModel.Field.values()) {
      ToggleButton b = new ToggleButton(f.label());
      b.setId("history-field-" + f.name().toLowerCase(java.util.Locale.ROOT));
      b.setToggleGroup(fields);
      b.setUserData(f);
      b.setSelected(model.fieldProperty().get() == f);
      fieldRow.getChildren().add(b);
    }
    fields
        .selectedToggleProperty()
        .addListener(
            (o, was, now) -> {
              if (now == null) {
                was.setSelected(true);
              } else {
                model.fieldProperty().set((HistoryViewModel.Field) now.getUserData());
              }
            });
    Keypad keypad = new Keypad(model.queryProperty(), "history");
    keypad.follow(field);
    list.setId("history-hits");
    VBox.setVgrow(list, Priority.ALWAYS);
    // At least two hits stay in view: a short window scrolls the screen rather than squeezing
    // the list under the note below it.
    list.setMinHeight(120);
    list.setCellFactory(
        v ->
            new ListCell<>() {
              {
                setPrefWidth(0);
                setWrapText(true);
              }

              @Override
              protected void updateItem(SearchHit hit, boolean empty) {
                super.updateItem(hit, empty);
                if (empty || hit == null) {
                  setText(null);
                  return;
                }
                String end = hit.outcome() == null ? "open" : Words.outcome(hit.outcome());
                String found =
                    hit.confirmedFaults().isEmpty()
                        ? ""
                        : ": "
                            + String.join(
                                ", ", hit.confirmedFaults().stream().map(Words::fault).toList());
                setText(
                    Words.date(hit.openedAt())
                        + "  "
                        + hit.serial()
                        + "  —  "
                        + hit.symptom()
                        + "\n"
                        + hit.boardModel()
                        + "  ·  "
                        + end
                        + found);
              }
            });
    list.getSelectionModel()
        .selectedItemProperty()
        .addListener(
            (o, was, hit) -> {
              if (hit != null) {
                model.show(hit.caseId());
              }
            });
    Label note = new Label();
    note.setId("history-note");
    note.getStyleClass().add("hint");
    note.textProperty().bind(model.hitsNoteProperty());
    box.getChildren().addAll(title, new HBox(8, field, search), fieldRow, keypad, list, note);
    return box;
  }

  private void showCase(HistoryViewModel.CaseView view) {
    caseBox.getChildren().clear();
    if (view == null) {
      Label none = new Label("Choose a case on the left to see it as it was.");
      none.getStyleClass().add("hint");
      caseBox.getChildren().add(none);
      return;
    }
    Label title = new Label(view.title());
    title.getStyleClass().add("section-title");
    title.setWrapText(true);
    Label symptom = new Label("Reported: " + view.symptom());
    symptom.setWrapText(true);
    symptom.getStyleClass().add("strong");
    Label status =
        new Label(view.status() + (view.faults().isEmpty() ? "" : " — found: " + view.faults()));
    status.setId("history-case-status");
    status.setWrapText(true);
    Button save = new Button("Save report (PDF)");
    save.setId("history-save-report");
    save.setMinHeight(48);
    save.setOnAction(e -> model.saveReport());
    Label saved = new Label();
    saved.setId("history-report-note");
    saved.getStyleClass().add("hint");
    saved.setWrapText(true);
    saved.textProperty().bind(model.reportNoteProperty());
    Button attach = new Button("Attach photo…");
    attach.setId("history-attach-photo");
    attach.setMinHeight(48);
    attach.setOnAction(e -> model.attachPhoto());
    FlowPane buttons = new FlowPane(8, 8, save, attach);
    caseBox.getChildren().addAll(title, symptom, status, buttons, saved);
    photos();
    section("Readings", view.readings(), "No readings.");
    section("Suspects at the time", view.suspects(), "No suspect list was computed.");
    if (!model.afterRepair().isEmpty()) {
      section("After repair (read again, not part of the diagnosis)", model.afterRepair(), "");
    }
    section("What was done", view.actions(), "Nothing recorded.");
    section("Notes", view.notes(), "No notes.");
    section("This unit's cases", model.timeline(), "");
  }

  /** The shown case's photos as thumbnails; tapping one shows it large. */
  private void photos() {
    if (model.photos().isEmpty()) {
      return;
    }
    Label head = new Label("Photos of the board (tap one to see it larger)");
    head.getStyleClass().add("case-section");
    head.setWrapText(true);
    FlowPane thumbs = new FlowPane(8, 8);
    thumbs.setId("history-photos");
    int n = 0;
    for (HistoryViewModel.ShownPhoto photo : model.photos()) {
      ImageView view =
          new ImageView(
              new Image(
                  new ByteArrayInputStream(photo.image()), THUMB_WIDTH, THUMB_WIDTH, true, true));
      Label caption = new Label(photo.caption());
      caption.setWrapText(true);
      caption.setMaxWidth(THUMB_WIDTH);
      caption.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
      caption.getStyleClass().add("hint");
      VBox content = new VBox(4, view, caption);
      Button thumb = new Button(null, content);
      thumb.setId("history-photo-" + (++n));
      thumb.getStyleClass().add("photo-thumb");
      thumb.setOnAction(e -> model.enlarge(photo));
      thumbs.getChildren().add(thumb);
    }
    caseBox.getChildren().addAll(head, thumbs);
  }

  /** The layer over the case that shows one photo large, with the way back. */
  private VBox largePhoto(ScrollPane over) {
    VBox layer = new VBox(8);
    layer.setMinSize(0, 0);
    layer.setId("history-photo-large");
    layer.getStyleClass().add("photo-large");
    ImageView view = new ImageView();
    view.setPreserveRatio(true);
    view.setSmooth(true);
    // Sized by the case's pane it covers, so that a large picture never widens the screen.
    view.fitWidthProperty().bind(over.widthProperty().subtract(28));
    view.fitHeightProperty().bind(over.heightProperty().subtract(130));
    Label caption = new Label();
    caption.setWrapText(true);
    caption.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
    Button back = new Button("Back to the case");
    back.setId("history-photo-close");
    back.getStyleClass().add("primary");
    back.setOnAction(e -> model.closeEnlarged());
    layer.getChildren().addAll(back, caption, view);
    layer.setVisible(false);
    model
        .enlargedProperty()
        .addListener(
            (o, was, now) -> {
              layer.setVisible(now != null);
              view.setImage(
                  now == null
                      ? null
                      : new Image(new ByteArrayInputStream(now.image()), LARGE, LARGE, true, true));
              caption.setText(now == null ? "" : now.caption());
            });
    return layer;
  }

  private void section(String heading, List<String> lines, String empty) {
    Label head = new Label(heading);
    head.setWrapText(true);
    head.setMinHeight(javafx.scene.layout.Region.USE_PREF_SIZE);
    head.getStyleClass().add("case-section");
    caseBox.getChildren().add(head);
    if (lines.isEmpty() && !empty.isEmpty()) {
      Label none = new Label(empty);
      none.getStyleClass().add("hint");
      caseBox.getChildren().add(none);
    }
    for (String line : lines) {
      Label l = new Label(line);
      l.setWrapText(true);
      caseBox.getChildren().add(l);
    }
  }
}
