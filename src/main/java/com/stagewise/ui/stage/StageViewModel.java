package com.stagewise.ui.stage;

import com.stagewise.casework.LibraryStage;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.DiodeClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.LedColour;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Parameter;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.Tolerance;
import com.stagewise.circuit.value.ZenerMarking;
import com.stagewise.history.record.BoardModel;
import com.stagewise.interchange.StageSheet;
import com.stagewise.solver.ExpectedVolts;
import com.stagewise.ui.Bench;
import com.stagewise.ui.SafetyCaution;
import com.stagewise.ui.Step;
import com.stagewise.ui.editor.StageEditorModel;
import com.stagewise.ui.widget.ValuePadModel;
import com.stagewise.ui.words.Words;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
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
  private final ObservableList<LibraryEntry> library = FXCollections.observableArrayList();
  private final StringProperty libraryNote = new SimpleStringProperty("");
  private final ObjectProperty<Stage> stage = new SimpleObjectProperty<>();
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
  private Path arriving;

  /** Creates the stage screen's model on a bench. */
  public StageViewModel(Bench bench) {
    this.bench = bench;
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
    bench.boardModelProperty().addListener((o, was, now) -> library.clear());
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

  /**
   * One parameter of the chosen template with the value typed for it.
   *
   * @param parameter the parameter
   * @param value the value text, as in stage sheets ({@code 4k7}); starts at the default
   */
  public record ParameterEntry(Parameter parameter, StringProperty value) {
    /**
     * Returns the label shown beside the field in plain words, e.g. "Feedback resistor R2 (Ω)" or
     * "Test signal amplitude (V, 0 for none)"; the template's short names (r2, vac) stay in files.
     */
    public String label() {
      String words =
          switch (parameter.name()) {
            case "vin" -> "Test signal DC level";
            case "vac" -> "Test signal amplitude (peak; 0 for none)";
            case "hz" -> "Test signal frequency";
            case "vcc" -> "Positive rail VCC";
            case "vee" -> "Negative rail VEE";
            case "class" -> "Op-amp class";
            case "package" -> "Package of U1 (section A is used)";
            case "diode" -> "Diode class";
            case "colour" -> "LED colour";
            default ->
                Character.toUpperCase(parameter.meaning().charAt(0))
                    + parameter.meaning().substring(1);
          };
      return words + (parameter.unit().isEmpty() ? "" : " (" + parameter.unit() + ")");
    }

    /**
     * Returns the words the field takes, when it is a choice (op-amp class, package, diode class,
     * LED colour); else empty.
     */
    public List<String> choices() {
      return switch (parameter.name()) {
        case "class" -> Arrays.stream(DeviceClass.values()).map(DeviceClass::word).toList();
        case "package" -> Arrays.stream(PackageType.values()).map(PackageType::word).toList();
        case "diode" ->
            Arrays.stream(DiodeClass.values())
                .filter(c -> c != DiodeClass.LED)
                .map(DiodeClass::word)
                .toList();
        case "colour" -> Arrays.stream(LedColour.values()).map(LedColour::word).toList();
        default -> List.of();
      };
    }

    /** Whether the field takes a zener's marked voltage ({@code 5V1}). */
    private boolean isZenerMarking() {
      return parameter.meaning().startsWith("zener ");
    }

    /** Whether the field takes a trimmer's wiper position (0 to 1). */
    private boolean isPosition() {
      return parameter.meaning().contains("wiper position");
    }

    /**
     * Returns what is wrong with {@code text} for this field, in plain words, or the empty string
     * when it is a value the field takes (checked as the technician types).
     */
    public String problem(String text) {
      String typed = text == null ? "" : text.strip();
      if (!choices().isEmpty()) {
        return choices().contains(typed) ? "" : "Choose one of " + String.join(", ", choices());
      }
      if (typed.isEmpty()) {
        return "Type a value, e.g. " + parameter.defaultValue();
      }
      if (typed.equals("none") && parameter.meaning().contains("none")) {
        return "";
      }
      if (isZenerMarking()) {
        try {
          ZenerMarking.parse(typed);
          return "";
        } catch (InvalidInputException e) {
          return "Not a zener voltage: write its marking, e.g. 5V1, 12V or 3.3V";
        }
      }
      if (isPosition()) {
        try {
          double v = SiValue.parse(typed);
          return v >= 0 && v <= 1 ? "" : "A wiper position is from 0 (first end) to 1 (other end)";
        } catch (InvalidInputException e) {
          return "Not a position: write a share of the travel from 0 to 1, e.g. 0.5";
        }
      }
      try {
        double v = SiValue.parse(typed);
        if (!parameter.unit().equals("V") && v < 0) {
          return "A part value or frequency cannot be negative";
        }
        return "";
      } catch (InvalidInputException e) {
        return "Not a value: write it as 4k7, 100n, 15 or -15"
            + (parameter.meaning().contains("none") ? ", or none" : "");
      }
    }
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

  /**
   * One stage of the board model's library.
   *
   * @param title its title
   * @param stage the stage
   */
  public record LibraryEntry(String title, Stage stage) {}

  /**
   * One part of the stage as listed.
   *
   * @param part the part
   * @param value its value with unit, e.g. "4.7 kΩ"
   * @param tolerance its tolerance, e.g. "1 %"
   * @param nets the nets it joins, e.g. "IN – SUM"
   */
  public record PartRow(Part part, String value, String tolerance, String nets) {
    /** Returns the row as one line. */
    public String line() {
      // A diode's or an LED's class fixes its figures: it has no tolerance to show.
      String within = tolerance.isEmpty() ? "" : "  ±" + tolerance;
      return part.ref() + "   " + value + within + "   (" + nets + ")";
    }
  }

  public ObservableList<LibraryEntry> library() {
    return library;
  }

  public StringProperty libraryNoteProperty() {
    return libraryNote;
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

  /** Loads the library of the board model on the bench. */
  public void loadLibrary() {
    BoardModel model = bench.boardModelProperty().get();
    if (model == null) {
      library.clear();
      libraryNote.set("Choose a unit first.");
      return;
    }
    if (arriving != null) {
      Path sheet = arriving;
      arriving = null;
      importSheet(sheet);
    }
    bench
        .tasks()
        .run(
            "Reading the stage library",
            () -> {
              List<LibraryEntry> entries = new ArrayList<>();
              for (LibraryStage stored : bench.casework().stageLibrary(model)) {
                entries.add(new LibraryEntry(stored.title(), stored.stage()));
              }
              // The casework lists the latest version of each stage, the one saved most recently
              // first: a stage built or edited for an earlier unit of the model is the likeliest
              // one on the bench now.
              return entries;
            },
            entries -> {
              library.setAll(entries);
              libraryNote.set(
                  entries.isEmpty()
                      ? "No stages for " + model.name() + " yet. Build one from a template."
                      : entries.size()
                          + " stage"
                          + (entries.size() == 1 ? "" : "s")
                          + " of "
                          + model.name()
                          + ".");
            },
            e ->
                bench
                    .problems()
                    .failed("Could not read the stage library", e, Words.CHECK_DATABASE));
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
   * nothing. Like a stage built here, it joins the board model's library when it is used.
   */
  public void importSheet(Path file) {
    bench
        .tasks()
        .run(
            "Opening the stage sheet " + file.getFileName(),
            () -> StageSheet.read(file),
            opened -> {
              setStage(opened);
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
    Stage s = stage.get();
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
                valueWords(part),
                part.kind() == PartKind.DIODE || part.kind() == PartKind.LED
                    ? ""
                    : Tolerance.format(part.tolerance()),
                leadWords(part)));
      }
    }
    parts.setAll(rows);
  }

  /**
   * Returns a part's value as the list shows it: {@code 4.7 kΩ}, a zener's marking {@code 5V1}, a
   * diode's class, an LED's colour, a trimmer's value and wiper ({@code 10 kΩ, wiper at 0.5}).
   */
  static String valueWords(Part part) {
    return switch (part.kind()) {
      case CAPACITOR -> SiValue.format(part.value(), "F");
      case ZENER -> ZenerMarking.format(part.value()) + " zener";
      case DIODE -> part.diodeClass().word() + " diode";
      case LED -> part.colour().word() + " LED";
      case TRIMMER, POTENTIOMETER ->
          SiValue.format(part.value(), "Ω")
              + ", wiper at "
              + java.math.BigDecimal.valueOf(part.position()).stripTrailingZeros().toPlainString()
              + (part.sealed() ? " (sealed)" : "");
      default -> SiValue.format(part.value(), "Ω");
    };
  }

  /**
   * Returns a part's nets with its lead names where they matter: {@code anode OUT – cathode RECT},
   * {@code VCC – wiper NULL – VEE}; a resistor's or capacitor's as {@code SUM – OUT}.
   */
  static String leadWords(Part part) {
    if (part.kind().isJunction()) {
      return "anode " + part.anode() + " – cathode " + part.cathode();
    }
    if (part.kind().isTrimmer()) {
      return part.netA() + " – wiper " + part.wiper() + " – " + part.netB();
    }
    return part.netA() + " – " + part.netB();
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
    Runnable go =
        () -> {
          boolean changed =
              bench.stageProperty().get() == null || !bench.stageProperty().get().equals(s);
          bench.stageProperty().set(s);
          if (changed) {
            bench.readings().clear();
            bench.diagnosisProperty().set(null);
          }
          String caseId = bench.openCaseProperty().get().id();
          bench
              .tasks()
              .run(
                  "Saving the case's stage",
                  () -> {
                    bench.resume().saveStage(caseId, s);
                    // The case keeps the version it is diagnosed with; a stage built or changed
                    // here becomes the next version of its library stage, so the next unit of the
                    // model is offered it first.
                    bench.casework().library().useForCase(caseId, s);
                    return null;
                  },
                  ok -> {},
                  e ->
                      bench
                          .problems()
                          .failed(
                              "Could not keep the stage for this case", e, Words.CHECK_DATABASE));
          bench.go(Step.READINGS);
        };
    if (SafetyCaution.hasHighRails(s)) {
      bench.caution().show(SafetyCaution.Reason.HIGH_RAILS, go);
    } else {
      go.run();
    }
  }
}
