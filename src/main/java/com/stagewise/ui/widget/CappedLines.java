package com.stagewise.ui.widget;

import javafx.beans.binding.Bindings;
import javafx.scene.control.Label;
import javafx.scene.control.OverrunStyle;
import javafx.scene.control.Tooltip;
import javafx.scene.text.Text;

/**
 * A wrapped label kept to a few lines, the rest ending in "…" and the whole text in its tooltip:
 * for a title a user may make long (a stage sheet's may have 200 characters) above an action that
 * must stay in sight. The window gives every other wrapped label the lines it needs; it leaves the
 * labels that carry {@link #STYLE} as they are.
 */
public final class CappedLines {
  /** The style class of a label whose lines are capped. */
  public static final String STYLE = "capped-lines";

  private CappedLines() {}

  /** Caps a wrapped label to {@code lines} lines of its font, with its text in a tooltip. */
  public static void cap(Label label, int lines) {
    label.getStyleClass().add(STYLE);
    label.setWrapText(true);
    label.setTextOverrun(OverrunStyle.ELLIPSIS);
    Tooltip whole = new Tooltip();
    whole.textProperty().bind(label.textProperty());
    whole.setWrapText(true);
    whole.setMaxWidth(480);
    label.setTooltip(whole);
    label
        .maxHeightProperty()
        .bind(
            Bindings.createDoubleBinding(
                () -> height(label, lines), label.fontProperty(), label.insetsProperty()));
    // Its lines are kept when the screen is short of room (a box shrinks its children to their
    // least height, for a label one line): at least its text's lines at its width, up to the cap.
    label
        .minHeightProperty()
        .bind(
            Bindings.createDoubleBinding(
                () ->
                    Math.min(
                        label.prefHeight(label.getWidth() > 0 ? label.getWidth() : -1),
                        label.getMaxHeight()),
                label.widthProperty(),
                label.textProperty(),
                label.maxHeightProperty()));
  }

  /**
   * The height of so many lines of a label's text in its font, with its insets, and half a line
   * more: the label lays its lines out a little taller than a text node measures them, and without
   * the slack it showed one line fewer. Half a line is too little for another line to show.
   */
  private static double height(Label label, int lines) {
    Text one = new Text("Ag");
    one.setFont(label.getFont());
    one.setLineSpacing(label.getLineSpacing());
    double line = one.getLayoutBounds().getHeight() + label.getLineSpacing();
    return Math.ceil(line * (lines + 0.5))
        + label.getInsets().getTop()
        + label.getInsets().getBottom();
  }
}
