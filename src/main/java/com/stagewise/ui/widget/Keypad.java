package com.stagewise.ui.widget;

import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.StringProperty;
import javafx.scene.control.Button;
import javafx.scene.control.TextInputControl;
import javafx.scene.layout.GridPane;

/** An on-screen keypad for serial numbers: digits, letters, a dash, backspace and clear. */
public final class Keypad extends GridPane {
  private final ObjectProperty<StringProperty> target = new SimpleObjectProperty<>();
  private static final String[] ROWS = {"1234567890", "QWERTYUIOP", "ASDFGHJKL-", "ZXCVBNM"};

  /**
   * Creates a keypad that types into {@code target}.
   *
   * @param idPrefix prefix of the keys' ids, e.g. {@code serial} gives {@code serial-key-A}
   */
  public Keypad(StringProperty target, String idPrefix) {
    this.target.set(target);
    setHgap(5);
    setVgap(5);
    setId(idPrefix + "-keypad");
    getStylesheets().add(Keypad.class.getResource("widgets.css").toExternalForm());
    for (int row = 0; row < ROWS.length; row++) {
      for (int col = 0; col < ROWS[row].length(); col++) {
        String key = String.valueOf(ROWS[row].charAt(col));
        Button button = key(idPrefix, key, key);
        button.setOnAction(e -> type(key));
        add(button, col, row);
      }
    }
    Button back = key(idPrefix, "back", "⌫");
    back.setOnAction(
        e -> {
          String now = text(this.target.get());
          this.target.get().set(now.isEmpty() ? "" : now.substring(0, now.length() - 1));
        });
    add(back, 7, 3);
    Button clear = key(idPrefix, "clear", "Clear");
    clear.setOnAction(e -> this.target.get().set(""));
    add(clear, 8, 3, 2, 1);
    clear.setMaxWidth(Double.MAX_VALUE);
  }

  /** Makes the keypad type into {@code field} whenever that field has the focus. */
  public void follow(TextInputControl field) {
    field
        .focusedProperty()
        .addListener(
            (o, was, is) -> {
              if (is) {
                target.set(field.textProperty());
              }
            });
  }

  private void type(String key) {
    StringProperty into = target.get();
    into.set(text(into) + key);
  }

  private static String text(StringProperty target) {
    return target.get() == null ? "" : target.get();
  }

  private static Button key(String idPrefix, String id, String label) {
    Button button = new Button(label);
    button.getStyleClass().add("key");
    button.setId(idPrefix + "-key-" + id);
    // Keys do not take the focus, so the field keeps its caret and a keyboard still works.
    button.setFocusTraversable(false);
    return button;
  }
}
