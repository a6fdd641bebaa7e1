package com.stagewise.ui.widget;

import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TextField;
import javafx.scene.layout.GridPane;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.VBox;

/** The value pad's view: a display that also takes typing, and large keys. */
public final class ValuePad extends VBox {
  private final ValuePadModel model;
  private final TextField display = new TextField();
  private final GridPane keys = new GridPane();
  private final Button enter;
  private final VBox notes;
  private final String idPrefix;
  private boolean enterInKeys;
  private final VBox below = new VBox(8);

  /**
   * Creates the pad.
   *
   * @param model the pad's model
   * @param idPrefix prefix of the node ids (tests and shortcuts find keys by id)
   * @param enterLabel the label of the enter key, e.g. "Add reading"
   * @param onEnter what the enter key does
   */
  public ValuePad(ValuePadModel model, String idPrefix, String enterLabel, Runnable onEnter) {
    this.model = model;
    this.idPrefix = idPrefix;
    setSpacing(8);
    display.getStyleClass().add("value-display");
    getStylesheets().add(ValuePad.class.getResource("widgets.css").toExternalForm());
    display.setPromptText("type or tap");
    display.setId(idPrefix + "-display");
    display.textProperty().bindBidirectional(model.textProperty());
    display.setOnAction(e -> onEnter.run());
    display.setPrefColumnCount(6);
    Label reading = new Label();
    reading.textProperty().bind(model.readingProperty());
    reading.getStyleClass().add("value-message");
    Label problem = new Label();
    problem.textProperty().bind(model.problemProperty());
    problem.getStyleClass().addAll("value-message", "bad");
    problem.setWrapText(true);
    Label hint = new Label();
    hint.textProperty().bind(model.hintProperty());
    hint.getStyleClass().add("hint");
    hint.setWrapText(true);
    keys.setHgap(6);
    // Four px between the rows (six across): on the AC pad at 1024×600, with the measure's switch
    // above it, the readings screen needed a scroll bar for 3 px more.
    keys.setVgap(4);
    keys.setId(idPrefix + "-keys");
    enter = new Button(enterLabel);
    enter.setId(idPrefix + "-enter");
    enter.getStyleClass().add("primary");
    enter.setMaxWidth(Double.MAX_VALUE);
    enter.setOnAction(e -> onEnter.run());
    enter.disableProperty().bind(model.valueProperty().isNull());
    layoutKeys(idPrefix);
    model.quantityProperty().addListener((o, a, b) -> layoutKeys(idPrefix));
    Label legend = new Label();
    legend.getStyleClass().add("hint");
    legend.setWrapText(true);
    legend
        .textProperty()
        .bind(
            javafx.beans.binding.Bindings.createStringBinding(
                () -> legend(model.quantityProperty().get(), model.unsignedProperty().get()),
                model.quantityProperty(),
                model.unsignedProperty()));
    notes = new VBox(8, new HBox(12, reading, problem), hint);
    getChildren().addAll(display, notes, keys, legend, enter);
  }

  /**
   * Puts the enter key into the keypad, two keys tall in the last column beside 1 2 3 and . 0 (as
   * on a numeric keypad), and what the pad says about the entry (the value read back, a problem, a
   * hint) and the legend below the keys, in a part of their own that scrolls when the pad's room is
   * short. The pad is then shorter by a row, the keys and the enter key stay whole in a small
   * window (1024×600, beside the probe), and a message that appears while typing never moves a key
   * under the finger.
   */
  public void enterInKeys() {
    enterInKeys = true;
    setSpacing(4);
    enter.setWrapText(true);
    enter.setMaxHeight(Double.MAX_VALUE);
    enter.getStyleClass().add("enter-key");
    Node legend = getChildren().get(3);
    below.getChildren().setAll(notes, legend);
    ScrollPane scroll = new ScrollPane(below);
    scroll.setId(idPrefix + "-notes");
    scroll.setFitToWidth(true);
    scroll.setHbarPolicy(ScrollPane.ScrollBarPolicy.NEVER);
    scroll.setVbarPolicy(ScrollPane.ScrollBarPolicy.AS_NEEDED);
    scroll.setMinHeight(0);
    VBox.setVgrow(scroll, Priority.ALWAYS);
    getChildren().setAll(display, keys, scroll);
    layoutKeys(idPrefix);
  }

  /**
   * Adds a line about the entry at the top of the pad's notes below the keys (with {@link
   * #enterInKeys}), e.g. what the pad takes in words.
   */
  public void addNote(Node note) {
    below.getChildren().add(0, note);
  }

  /** Returns the display field (to focus it). */
  public TextField display() {
    return display;
  }

  private void layoutKeys(String idPrefix) {
    keys.getChildren().clear();
    String[][] digits = {{"7", "8", "9"}, {"4", "5", "6"}, {"1", "2", "3"}, {".", "0", null}};
    for (int row = 0; row < digits.length; row++) {
      for (int col = 0; col < 3; col++) {
        String key = digits[row][col];
        if (key == null) {
          key =
              switch (model.quantityProperty().get()) {
                case VOLTS -> ValuePadModel.SIGN;
                case METER_OHMS -> ValuePadModel.OVER_RANGE;
                default -> null;
              };
        }
        if (key != null) {
          Button button = key(idPrefix, key, key);
          if (key.equals(ValuePadModel.SIGN)) {
            // Kept in its place (the keys do not move), but off while no sign may be typed.
            button
                .disableProperty()
                .bind(
                    model
                        .unsignedProperty()
                        .isNotNull()
                        .and(model.unsignedProperty().isNotEmpty()));
          }
          keys.add(button, col, row);
        }
      }
    }
    int col = 3;
    int row = 0;
    for (String prefix : model.quantityProperty().get().prefixKeys()) {
      keys.add(key(idPrefix, prefix, prefixLabel(prefix)), col, row++);
    }
    keys.add(key(idPrefix, ValuePadModel.BACK, ValuePadModel.BACK), 4, 0);
    Button clear = key(idPrefix, ValuePadModel.CLEAR, ValuePadModel.CLEAR);
    keys.add(clear, 4, 1);
    if (enterInKeys) {
      keys.add(enter, 4, 2, 1, 2);
    }
  }

  private static String prefixLabel(String prefix) {
    return prefix.equals("u") ? "µ" : prefix;
  }

  /**
   * Returns the line that says what the letter keys mean, and why ± is off while the pad takes
   * volts that are never negative ({@code unsigned}, e.g. an AC amplitude).
   */
  static String legend(ValuePadModel.Quantity quantity, String unsigned) {
    if (quantity == ValuePadModel.Quantity.VOLTS && unsigned != null && !unsigned.isEmpty()) {
      return "m = milli (350m = 0.35 V), µ = micro. ± is off: "
          + Character.toLowerCase(unsigned.charAt(0))
          + unsigned.substring(1)
          + " is never negative.";
    }
    return switch (quantity) {
      case OHMS -> "R marks the point in ohms (4R7 = 4.7 Ω), k = kilo (4k7 = 4.7 kΩ), M = mega.";
      case METER_OHMS ->
          "k = kilo (46k8 = 46.8 kΩ), M = mega, R marks the point in ohms; OL = the meter's"
              + " over-range.";
      case FARADS -> "p = pico, n = nano, µ = micro (100n = 100 nF, 2u2 = 2.2 µF).";
      case VOLTS -> "m = milli (350m = 0.35 V), µ = micro, ± changes the sign.";
      case ZENER -> "A zener's marking: V marks the point (5V1 = 5.1 V, 12V = 12 V).";
      case POSITION -> "The wiper's share of the travel: 0 at end 1, 1 at end 2 (0.5 = middle).";
    };
  }

  private Button key(String idPrefix, String key, String label) {
    Button button = new Button(label);
    button.getStyleClass().add("key");
    if (label.length() > 2) {
      button.getStyleClass().add("wide");
    }
    button.setFocusTraversable(false);
    button.setId(idPrefix + "-key-" + keyId(key));
    button.setOnAction(e -> model.press(key));
    return button;
  }

  /** Returns the id suffix of a key: the key itself, or a word for symbols. */
  public static String keyId(String key) {
    return switch (key) {
      case "." -> "point";
      case ValuePadModel.BACK -> "back";
      case ValuePadModel.CLEAR -> "clear";
      case ValuePadModel.SIGN -> "sign";
      case ValuePadModel.OVER_RANGE -> "ol";
      case "M" -> "mega";
      case "m" -> "milli";
      default -> key;
    };
  }
}
