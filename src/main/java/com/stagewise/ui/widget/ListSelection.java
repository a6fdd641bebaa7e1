package com.stagewise.ui.widget;

import javafx.beans.property.Property;
import javafx.scene.control.ListView;

/** Keeps a list's selected row and a view model's selected row in step, both ways. */
public final class ListSelection {
  private ListSelection() {}

  /**
   * Binds the selection of {@code list} to {@code selected} in both directions; a cleared selection
   * on either side leaves the other as it is (a screen keeps its last choice while a list reloads).
   */
  public static <T> void bind(ListView<T> list, Property<T> selected) {
    list.getSelectionModel()
        .selectedItemProperty()
        .addListener(
            (o, was, row) -> {
              if (row != null && row != selected.getValue()) {
                selected.setValue(row);
              }
            });
    selected.addListener(
        (o, was, row) -> {
          if (row != null && list.getSelectionModel().getSelectedItem() != row) {
            list.getSelectionModel().select(row);
          }
        });
  }
}
