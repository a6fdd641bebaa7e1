package com.stagewise.ui.editor;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Terminal;
import com.stagewise.ui.editor.DraftStage.DraftInput;
import com.stagewise.ui.editor.DraftStage.DraftPart;
import com.stagewise.ui.editor.DraftStage.DraftRail;
import com.stagewise.ui.editor.DraftStage.DraftSection;
import com.stagewise.ui.editor.EditorProblem.Place;
import com.stagewise.ui.widget.ValuePad;
import com.stagewise.ui.widget.ValuePadModel;
import java.util.List;
import java.util.function.BiConsumer;
import java.util.function.Consumer;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.TextField;
import javafx.scene.control.ToggleButton;
import javafx.scene.layout.FlowPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

/**
 * The right-hand panel of the stage editor: the chosen item's details (the stage's title, board and
 * ground; a part's designator, value on the value pad, class, colour or wiper, tolerance and the
 * nets of its leads; a section's package, letter, class and pins; a rail's or an input's net and
 * values), every control editing the model directly.
 */
final class EditorDetails {
  private final StageEditorModel model;
  private final VBox details;
  private final BiConsumer<Place, String> select;

  EditorDetails(StageEditorModel model, VBox details, BiConsumer<Place, String> select) {
    this.model = model;
    this.details = details;
    this.select = select;
  }

  private static Node heading(String text) {
    Label label = new Label(text);
    label.getStyleClass().add("section-title");
    return label;
  }

  /** A new net's name as technicians number them: N1, N2, … (the first free one). */
  private static String nextNumbered(String prefix, DraftStage draft) {
    int n = 1;
    while (draft.nets().contains(prefix + n)) {
      n++;
    }
    return prefix + n;
  }

  /** Shows the details of the item at {@code place} and {@code key}, or the stage's. */
  void show(DraftStage draft, Place place, String key) {
    details.getChildren().clear();
    switch (place) {
      case PART -> {
        DraftPart part = draft.part(key);
        if (part != null) {
          partDetails(part);
          return;
        }
      }
      case SECTION -> {
        DraftSection section = draft.section(key);
        if (section != null) {
          sectionDetails(section);
          return;
        }
      }
      case RAIL -> {
        int i = Integer.parseInt(key);
        if (i < draft.rails().size()) {
          railDetails(i, draft.rails().get(i));
          return;
        }
      }
      case INPUT -> {
        int i = Integer.parseInt(key);
        if (i < draft.inputs().size()) {
          inputDetails(i, draft.inputs().get(i));
          return;
        }
      }
      default -> {}
    }
    stageDetails(draft);
  }

  private void stageDetails(DraftStage draft) {
    details.getChildren().add(heading("The stage"));
    details
        .getChildren()
        .add(field("editor-title", "Title", draft.title(), t -> model.setTitle(t, draft.board())));
    details
        .getChildren()
        .add(
            field(
                "editor-board",
                "Board model",
                draft.board(),
                b -> model.setTitle(draft.title(), b)));
    details
        .getChildren()
        .add(netPicker("editor-ground", "Ground net", draft.ground(), model::setGround));
    Label hint =
        new Label(
            "Add the op-amp sections first, then the parts; tap a net to connect a lead, or type a"
                + " new net's name.");
    hint.setWrapText(true);
    hint.getStyleClass().add("hint");
    details.getChildren().add(hint);
  }

  private void partDetails(DraftPart part) {
    String ref = part.ref();
    details.getChildren().add(heading(part.kind().word() + " " + ref));
    details
        .getChildren()
        .add(
            field(
                "editor-part-ref",
                "Designator",
                ref,
                n -> {
                  if (model.renamePart(ref, n)) {
                    select.accept(Place.PART, n.strip());
                  }
                }));
    if (part.kind() == PartKind.DIODE || part.kind() == PartKind.LED) {
      // A diode's class or an LED's colour sets its junction; it has no value to type.
      List<String> words =
          part.kind() == PartKind.LED
              ? java.util.Arrays.stream(com.stagewise.circuit.LedColour.values())
                  .map(com.stagewise.circuit.LedColour::word)
                  .toList()
              : List.of("silicon", "schottky");
      FlowPane choices = new FlowPane(6, 6);
      for (String w : words) {
        ToggleButton b = new ToggleButton(w);
        b.setId("editor-part-choice-" + w);
        b.setSelected(w.equals(part.choice()));
        b.setOnAction(e -> model.setPartChoice(ref, w));
        choices.getChildren().add(b);
      }
      details
          .getChildren()
          .addAll(
              small((part.kind() == PartKind.LED ? "Colour: " : "Class: ") + part.choice()),
              choices);
    } else {
      details
          .getChildren()
          .add(
              pad(
                  "editor-value",
                  "Value: " + PartWords.value(part),
                  switch (part.kind()) {
                    case CAPACITOR -> ValuePadModel.Quantity.FARADS;
                    case ZENER -> ValuePadModel.Quantity.ZENER;
                    default -> ValuePadModel.Quantity.OHMS;
                  },
                  "Set " + ref,
                  v -> model.setPartValue(ref, DraftStage.valueText(part.kind(), v))));
    }
    if (part.kind().isTrimmer()) {
      details
          .getChildren()
          .add(
              pad(
                  "editor-position",
                  "Wiper position (0 at end 1, 1 at end 2): " + part.position().text(),
                  ValuePadModel.Quantity.POSITION,
                  "Set wiper",
                  v ->
                      model.setPartPosition(
                          ref,
                          java.math.BigDecimal.valueOf(v).stripTrailingZeros().toPlainString(),
                          part.sealed())));
      ToggleButton sealed = new ToggleButton("Sealed (factory-set)");
      sealed.setId("editor-part-sealed");
      sealed.setSelected(part.sealed());
      sealed.setOnAction(
          e -> model.setPartPosition(ref, part.position().text(), sealed.isSelected()));
      details.getChildren().add(sealed);
    }
    FlowPane tolerances = new FlowPane(6, 6);
    for (String t : List.of("1%", "2%", "5%", "10%", "20%")) {
      ToggleButton b = new ToggleButton(t);
      b.setId("editor-part-tolerance-" + t.replace("%", ""));
      b.setSelected(t.equals(part.tolerance().text()));
      b.setOnAction(e -> model.setPartTolerance(ref, t));
      tolerances.getChildren().add(b);
    }
    if (part.kind() != PartKind.DIODE && part.kind() != PartKind.LED) {
      details.getChildren().addAll(small("Tolerance: " + part.tolerance().text()), tolerances);
    }
    if (part.kind() == PartKind.RESISTOR) {
      details
          .getChildren()
          .add(
              field(
                  "editor-part-smd",
                  "SMD code (e.g. 473, 4702, 01C)",
                  "",
                  c -> model.setPartValueFromSmd(ref, c)));
    }
    for (int lead = 0; lead < part.nets().size(); lead++) {
      int l = lead;
      details
          .getChildren()
          .add(
              netPicker(
                  "editor-part-net-" + (lead + 1),
                  leadWords(part, lead),
                  part.nets().get(lead),
                  n -> model.setPartNet(ref, l, n)));
    }
    Button delete = new Button("Delete " + ref);
    delete.setId("editor-part-delete");
    delete.setOnAction(
        e -> {
          model.removePart(ref);
          select.accept(Place.STAGE, "");
        });
    details.getChildren().add(delete);
  }

  /** A lead in words: "End 1", "Anode", "Cathode", "Wiper". */
  private static String leadWords(DraftPart part, int lead) {
    return switch (part.leads().get(lead)) {
      case "a" -> "Anode";
      case "k" -> "Cathode";
      case "w" -> "Wiper";
      default -> "End " + part.leads().get(lead);
    };
  }

  private void sectionDetails(DraftSection section) {
    String ref = section.ref();
    details.getChildren().add(heading("Section " + ref + " of " + section.packageRef()));
    details
        .getChildren()
        .add(
            field(
                "editor-section-ref",
                "Designator",
                ref,
                n -> {
                  if (model.renameSection(ref, n)) {
                    select.accept(Place.SECTION, n.strip());
                  }
                }));
    FlowPane letters = new FlowPane(6, 6);
    for (String letter : section.packageType().sections()) {
      ToggleButton b = new ToggleButton(letter);
      b.setId("editor-section-letter-" + letter);
      b.setSelected(letter.equals(section.section()));
      b.setOnAction(e -> model.setSectionLetter(ref, letter));
      letters.getChildren().add(b);
    }
    details
        .getChildren()
        .addAll(small("Section letter (" + section.packageType().word() + ")"), letters);
    FlowPane classes = new FlowPane(6, 6);
    for (DeviceClass cls : DeviceClass.values()) {
      ToggleButton b = new ToggleButton(cls.word());
      b.setId("editor-section-class-" + cls.word());
      b.setSelected(cls == section.deviceClass());
      b.setOnAction(e -> model.setSectionClass(ref, cls));
      classes.getChildren().add(b);
    }
    details.getChildren().addAll(small("Device class"), classes);
    for (Terminal terminal : Terminal.values()) {
      details
          .getChildren()
          .add(
              netPicker(
                  "editor-section-"
                      + terminal.name().toLowerCase(java.util.Locale.ROOT).replace('_', '-'),
                  terminal.words() + " — pin " + section.packageRef() + "." + section.pin(terminal),
                  section.net(terminal),
                  n -> model.setSectionNet(ref, terminal, n)));
    }
    Button delete = new Button("Delete " + ref);
    delete.setId("editor-section-delete");
    delete.setOnAction(
        e -> {
          model.removeSection(ref);
          select.accept(Place.STAGE, "");
        });
    details.getChildren().add(delete);
  }

  private void railDetails(int index, DraftRail rail) {
    details.getChildren().add(heading("Rail " + rail.net()));
    details
        .getChildren()
        .add(netPicker("editor-rail-net", "Net", rail.net(), n -> model.setRailNet(index, n)));
    details
        .getChildren()
        .add(
            pad(
                "editor-volts",
                "Volts: " + rail.volts().text(),
                ValuePadModel.Quantity.VOLTS,
                "Set rail volts",
                v -> model.setRailVolts(index, DraftStage.plain(v))));
    details
        .getChildren()
        .add(
            field(
                "editor-rail-tolerance",
                "Tolerance",
                rail.tolerance().text(),
                t -> model.setRailTolerance(index, t)));
    Button remove = new Button("Remove this rail");
    remove.setId("editor-rail-remove");
    remove.setOnAction(
        e -> {
          model.removeRail(index);
          select.accept(Place.STAGE, "");
        });
    details.getChildren().add(remove);
  }

  private void inputDetails(int index, DraftInput input) {
    details.getChildren().add(heading("Test input " + input.net()));
    details
        .getChildren()
        .add(netPicker("editor-input-net", "Net", input.net(), n -> model.setInputNet(index, n)));
    details
        .getChildren()
        .add(
            pad(
                "editor-volts",
                "DC level: " + input.dc().text() + " V",
                ValuePadModel.Quantity.VOLTS,
                "Set DC level",
                v -> model.setInputDc(index, DraftStage.plain(v))));
    Button ac = new Button("AC 0.1 V at 1 kHz");
    ac.setId("editor-input-ac-preset");
    ac.setOnAction(e -> model.setInputAc(index, "0.1", "1000"));
    Button noAc = new Button("No AC");
    noAc.setId("editor-input-no-ac");
    noAc.setOnAction(e -> model.setInputAc(index, "", ""));
    details.getChildren().add(new HBox(6, ac, noAc));
    details
        .getChildren()
        .add(
            field(
                "editor-input-ac",
                "AC amplitude (V, empty for none)",
                input.ac().text(),
                v -> model.setInputAc(index, v, input.hz().text())));
    details
        .getChildren()
        .add(
            field(
                "editor-input-hz",
                "AC frequency (Hz), e.g. 1k",
                input.hz().text(),
                v -> model.setInputAc(index, input.ac().text(), v)));
    Button remove = new Button("Remove this input");
    remove.setId("editor-input-remove");
    remove.setOnAction(
        e -> {
          model.removeInput(index);
          select.accept(Place.STAGE, "");
        });
    details.getChildren().add(remove);
  }

  /** A value pad for one number; its enter key sets it. */
  private Node pad(
      String id,
      String label,
      ValuePadModel.Quantity quantity,
      String enter,
      java.util.function.DoubleConsumer set) {
    ValuePadModel padModel = new ValuePadModel(quantity);
    ValuePad pad =
        new ValuePad(
            padModel,
            id,
            enter,
            () -> {
              if (padModel.valueProperty().get() != null) {
                set.accept(padModel.valueProperty().get());
              }
            });
    return new VBox(4, small(label), pad);
  }

  private static Label small(String text) {
    Label label = new Label(text);
    label.getStyleClass().add("hint");
    label.setWrapText(true);
    return label;
  }

  /** A text field that commits on Enter or with its OK button (large enough to tap). */
  private Node field(String id, String label, String value, Consumer<String> commit) {
    TextField text = new TextField(value);
    text.setId(id);
    HBox.setHgrow(text, Priority.ALWAYS);
    text.setOnAction(e -> commit.accept(text.getText()));
    Button ok = new Button("OK");
    ok.setId(id + "-ok");
    ok.setOnAction(e -> commit.accept(text.getText()));
    // OK keeps its word: bound, as a value set in code loses to the theme's 48 px minimum width,
    // and the details are built anew after the window's own pass over the buttons.
    ok.minWidthProperty()
        .bind(new javafx.beans.property.SimpleDoubleProperty(Region.USE_PREF_SIZE));
    return new VBox(4, small(label), new HBox(6, text, ok));
  }

  /**
   * The nets of the stage as buttons to tap (the current one selected), and a field for a new net's
   * name.
   */
  private Node netPicker(String id, String label, String current, Consumer<String> choose) {
    FlowPane nets = new FlowPane(6, 6);
    nets.setId(id);
    for (String net : model.netChoices()) {
      ToggleButton b = new ToggleButton(net);
      b.setId(id + "-" + net.replaceAll("[^A-Za-z0-9_]", "_"));
      b.getStyleClass().add("editor-net");
      b.setSelected(net.equals(current));
      b.setOnAction(e -> choose.accept(net));
      nets.getChildren().add(b);
    }
    TextField name = new TextField();
    name.setId(id + "-new");
    name.setPromptText("new net");
    name.setPrefColumnCount(7);
    name.setOnAction(e -> choose.accept(name.getText()));
    Button use = new Button("Use");
    use.setId(id + "-use");
    use.setOnAction(e -> choose.accept(name.getText()));
    Button fresh = new Button("New net");
    fresh.setId(id + "-new-net");
    fresh.setOnAction(e -> choose.accept(nextNumbered("N", model.draft())));
    String now = current == null || current.isEmpty() ? "not connected" : current;
    // A flow, not a row: with larger text in a 1024 px window the three wrap rather than squeeze
    // "New net" and "Use" to an ellipsis.
    return new VBox(4, small(label + ": " + now), nets, new FlowPane(6, 6, fresh, name, use));
  }
}
