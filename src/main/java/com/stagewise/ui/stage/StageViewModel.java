package com.stagewise.ui.stage;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Parameter;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.circuit.value.Tolerance;
import com.stagewise.history.record.BoardModel;
import com.stagewise.solver.ExpectedVolts;
import com.stagewise.ui.Bench;
import com.stagewise.ui.SafetyCaution;
import com.stagewise.ui.editor.StageEditorModel;
import com.stagewise.ui.widget.ValuePadModel;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The stage screen: choose the stage from the board model's library, check and edit its part values
 * and designators, see what a healthy stage reads at each net, and take it to the readings.
 */
public final class StageViewModel {
  private final Bench bench;
  private final ObjectProperty<Stage> stage = new SimpleObjectProperty<>();
  private final StageLibraryModel libraryModel;
  private final ObservableList<PartRow> parts = FXCollections.observableArrayList();
  private final ObjectProperty<PartRow> selectedPart = new SimpleObjectProperty<>();
  private final StringProperty designator = new SimpleStringProperty("");
  private final BooleanProperty wiper = new SimpleBooleanProperty(false);
  private final ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.OHMS);
  private final ObjectProperty<ExpectedVolts> expected = new SimpleObjectProperty<>();
  private final DecoderModel decoder = new DecoderModel();
  private final ObservableList<StageTemplate> templates =
      FXCollections.observableArrayList(Templates.all());
  private final ObjectProperty<StageTemplate> template = new SimpleObjectProperty<>();
  private final ObservableList<ParameterEntry> parameters = FXCollections.observableArrayList();
  private final StageEditorModel editor = new StageEditorModel();
  private final BooleanProperty editing = new SimpleBooleanProperty(false);

  /** Creates the stage screen's model on a bench. */
  public StageViewModel(Bench bench) {
    this.bench = bench;
    this.libraryModel = new StageLibraryModel(bench, this::setStage, stage::get);
    selectedPart.addListener(
        (o, was, row) -> {
          if (row != null) {
            designator.set(row.part().ref());
            Part part = row.part();
            // The same trimmer chosen again after an edit keeps the pad on its wiper.
            boolean sameTrimmer =
                wiper.get()
                    && was != null
                    && was.part().ref().equals(part.ref())
                    && part.kind().isTrimmer();
            if (sameTrimmer) {
              pad.setValue(part.position());
              return;
            }
            wiper.set(false);
            pad.quantityProperty()
                .set(
                    switch (part.kind()) {
                      case CAPACITOR -> ValuePadModel.Quantity.FARADS;
                      case ZENER -> ValuePadModel.Quantity.ZENER;
                      default -> ValuePadModel.Quantity.OHMS;
                    });
            if (part.kind() == PartKind.DIODE || part.kind() == PartKind.LED) {
              pad.textProperty().set("");
            } else {
              pad.setValue(part.value());
            }
          }
        });
    wiper.addListener(
        (o, was, now) -> {
          PartRow row = selectedPart.get();
          if (row == null || !row.part().kind().isTrimmer()) {
            return;
          }
          pad.quantityProperty()
              .set(now ? ValuePadModel.Quantity.POSITION : ValuePadModel.Quantity.OHMS);
          pad.setValue(now ? row.part().position() : row.part().value());
        });
    bench
        .stageProperty()
        .addListener(
            (o, was, now) -> {
              if (now != null && now != stage.get()) {
                setStage(now);
              }
            });
    // A new case starts with no stage chosen, not with the last case's.
    bench
        .openCaseProperty()
        .addListener(
            (o, was, now) -> {
              if (bench.stageProperty().get() == null) {
                setStage(null);
              }
              // Nothing typed for the last case carries over: decoder, template, designator, pad.
              decoder.clear();
              template.set(null);
              designator.set("");
              pad.textProperty().set("");
            });
    bench.boardModelProperty().addListener((o, was, now) -> libraryModel.clear());
    template.addListener(
        (o, was, now) -> {
          List<ParameterEntry> entries = new ArrayList<>();
          if (now != null) {
            for (Parameter p : now.parameters()) {
              entries.add(new ParameterEntry(p, new SimpleStringProperty(p.defaultValue())));
            }
          }
          parameters.setAll(entries);
        });
  }

  public ObservableList<StageTemplate> templates() {
    return templates;
  }

  public ObjectProperty<StageTemplate> templateProperty() {
    return template;
  }

  public ObservableList<ParameterEntry> parameters() {
    return parameters;
  }

  /**
   * Builds a stage from the chosen template and the values typed, for the board model on the bench;
   * it joins the board model's library when it is used.
   */
  public void buildFromTemplate() {
    StageTemplate chosen = template.get();
    if (chosen == null) {
      bench
          .problems()
          .show(
              "Choose a template first",
              "No template is chosen.",
              "Tap the kind of stage in the list, e.g. an inverting amplifier.");
      return;
    }
    Map<String, String> values = new LinkedHashMap<>();
    for (ParameterEntry entry : parameters) {
      String text = entry.value().get() == null ? "" : entry.value().get().strip();
      if (!text.isEmpty()) {
        values.put(entry.parameter().name(), text);
      }
    }
    Stage built;
    try {
      built = chosen.build(values);
    } catch (InvalidInputException e) {
      bench
          .problems()
          .show(
              "The template cannot take these values",
              e.getMessage(),
              "Check the value named, e.g. 4k7 for 4.7 kΩ, then build again.");
      return;
    }
    String board =
        bench.boardModelProperty().get() == null
            ? built.board()
            : bench.boardModelProperty().get().name();
    setStage(
        new Stage(
            built.title(),
            board,
            built.ground(),
            built.rails(),
            built.inputs(),
            built.parts(),
            built.amplifiers()));
  }

  /** Returns where the screen picks a stage: the library, the versions, stage sheet files. */
  public StageLibraryModel libraryModel() {
    return libraryModel;
  }

  public ObservableList<LibraryEntry> library() {
    return libraryModel.library();
  }

  public StringProperty libraryNoteProperty() {
    return libraryModel.libraryNoteProperty();
  }

  /** Loads the library of the board model on the bench (see {@link StageLibraryModel}). */
  public void loadLibrary() {
    libraryModel.loadLibrary();
  }

  public ObjectProperty<Stage> stageProperty() {
    return stage;
  }

  public ObservableList<PartRow> parts() {
    return parts;
  }

  public ObjectProperty<PartRow> selectedPartProperty() {
    return selectedPart;
  }

  public StringProperty designatorProperty() {
    return designator;
  }

  /**
   * Whether the pad sets the chosen trimmer's wiper position (0 to 1) rather than its end-to-end
   * value; only a trimmer or potentiometer has one.
   */
  public BooleanProperty wiperProperty() {
    return wiper;
  }

  public ValuePadModel pad() {
    return pad;
  }

  public DecoderModel decoder() {
    return decoder;
  }

  public ObjectProperty<ExpectedVolts> expectedProperty() {
    return expected;
  }

  /** Returns the stage editor's model. */
  public StageEditorModel editor() {
    return editor;
  }

  /** Returns whether the stage editor is open over the screen. */
  public BooleanProperty editingProperty() {
    return editing;
  }

  /**
   * Opens the stage editor on a copy of the chosen stage, or on an empty stage of the board model
   * when {@code empty} or when no stage is chosen. (The editor asks before it drops unsaved edits.)
   */
  public void openEditor(boolean empty) {
    Stage s = stage.get();
    BoardModel model = bench.boardModelProperty().get();
    if (empty || s == null) {
      editor.startEmpty("New stage", model == null ? "" : model.name());
    } else {
      editor.startFrom(s, "\"" + s.title() + "\"");
    }
    editing.set(true);
  }

  /**
   * Takes a stage saved in the editor: it becomes the chosen stage and, when it is used for the
   * case, joins the board model's library so that the next unit of the model finds it.
   */
  public void useEdited(Stage edited) {
    setStage(edited);
    editing.set(false);
  }

  /** Closes the editor (its model has asked about unsaved edits first). */
  public void closeEditor() {
    editing.set(false);
  }

  /** Takes a stage to work on (from the library or a template); its parts become editable. */
  public void choose(Stage chosen) {
    setStage(chosen);
  }

  private void setStage(Stage chosen) {
    stage.set(chosen);
    refreshParts();
    selectedPart.set(null);
    solve();
  }

  private void refreshParts() {
    Stage s = stage.get();
    List<PartRow> rows = new ArrayList<>();
    if (s != null) {
      for (Part part : s.parts()) {
        rows.add(
            new PartRow(
                part,
                PartRow.valueWords(part),
                part.kind() == PartKind.DIODE || part.kind() == PartKind.LED
                    ? ""
                    : Tolerance.format(part.tolerance()),
                PartRow.leadWords(part)));
      }
    }
    parts.setAll(rows);
  }

  private void solve() {
    Stage s = stage.get();
    if (s == null) {
      expected.set(null);
      return;
    }
    bench
        .tasks()
        .run(
            "Working out the expected voltages",
            () -> ExpectedVolts.of(s),
            result -> {
              if (stage.get() == s) {
                expected.set(result);
              }
            },
            e ->
                bench
                    .problems()
                    .failed(
                        "Could not work out the expected voltages",
                        e,
                        "Check the part values of the stage."));
  }

  /** Sets the selected part's value to what the pad shows. */
  public void applyValue() {
    PartRow row = selectedPart.get();
    Double value = pad.valueProperty().get();
    if (row == null || value == null) {
      bench
          .problems()
          .show(
              "No value to set",
              "Choose a part, then type its value on the pad.",
              "Tap a part in the list, then type e.g. 4k7.");
      return;
    }
    String ref = row.part().ref();
    PartKind kind = row.part().kind();
    if (kind == PartKind.DIODE || kind == PartKind.LED) {
      bench
          .problems()
          .show(
              "A diode has no value to type",
              ref
                  + " is "
                  + (kind == PartKind.LED
                      ? "an LED: its colour sets its forward voltage."
                      : "a " + row.part().diodeClass().word() + " diode: its class sets its drop."),
              "Change its class or colour in the stage editor.");
      return;
    }
    if (wiper.get() && kind.isTrimmer()) {
      if (!(value >= 0 && value <= 1)) {
        bench
            .problems()
            .show(
                "Not a wiper position",
                "A wiper position is from 0 (end 1) to 1 (end 2).",
                "Type e.g. 0.5.");
        return;
      }
      edit(stage.get().withPart(ref, p -> p.withPosition(value)), ref);
      return;
    }
    edit(stage.get().withPart(ref, p -> p.withValue(value)), ref);
  }

  /** Renames the selected part to the designator typed (designators follow the board's legend). */
  public void applyDesignator() {
    PartRow row = selectedPart.get();
    String newRef = designator.get() == null ? "" : designator.get().strip();
    if (row == null) {
      return;
    }
    if (newRef.isEmpty() || !newRef.matches("[A-Za-z][A-Za-z0-9_]*")) {
      bench
          .problems()
          .show(
              "Not a designator",
              "\"" + newRef + "\" is not a designator.",
              "Type it as printed on the board, e.g. R12 or C3.");
      return;
    }
    Stage s = stage.get();
    if (!newRef.equals(row.part().ref()) && s.part(newRef).isPresent()) {
      bench
          .problems()
          .show(
              "Designator already used",
              newRef + " is already a part of this stage.",
              "Choose another designator.");
      return;
    }
    Part p = row.part();
    Part renamed = p.withRef(newRef);
    edit(s.withPart(p.ref(), old -> renamed), newRef);
  }

  private void edit(Stage edited, String selectRef) {
    try {
      stage.set(edited);
    } catch (InvalidInputException e) {
      bench
          .problems()
          .show("The stage cannot take this", e.getMessage(), "Check the value and try again.");
      return;
    }
    refreshParts();
    parts.stream()
        .filter(r -> r.part().ref().equals(selectRef))
        .findFirst()
        .ifPresent(selectedPart::set);
    solve();
  }

  /**
   * Puts the stage on the bench for the readings. A stage with a rail above 50 V brings up the
   * safety caution first.
   */
  public void useStage() {
    Stage s = stage.get();
    if (s == null) {
      bench
          .problems()
          .show("Choose a stage first", "No stage is chosen.", "Tap a stage in the library.");
      return;
    }
    Runnable go = () -> StageUse.use(bench, libraryModel, s);
    if (SafetyCaution.hasHighRails(s)) {
      bench.caution().show(SafetyCaution.Reason.HIGH_RAILS, go);
    } else {
      go.run();
    }
  }
}
