package com.stagewise.app;

import java.util.List;
import javafx.geometry.Bounds;
import javafx.geometry.Orientation;
import javafx.scene.Node;
import javafx.scene.Parent;
import javafx.scene.control.Control;
import javafx.scene.control.Labeled;
import javafx.scene.control.ScrollBar;
import javafx.scene.control.TextInputControl;
import javafx.scene.text.Text;

/**
 * What the flow tests look for on a screen of the headless window: texts cut short, controls out of
 * their panels, sideways scroll bars. Each method walks the nodes under the one given and adds what
 * it finds, in words, to the list it returns.
 */
final class ScreenFaults {
  private ScreenFaults() {}

  /**
   * Collects every visible control that reaches sideways past the edge of the panel it sits in (a
   * row of buttons wider than its panel draws them over the panel's border, or past the window's
   * edge where they are out of reach).
   */
  static List<String> spilled(Node node, List<String> found) {
    if (!node.isVisible()) {
      return found;
    }
    if (node instanceof Control control && control.getWidth() > 0) {
      Node panel = control.getParent();
      while (panel != null && !panel.getStyleClass().contains("panel")) {
        panel = panel.getParent();
      }
      if (panel != null) {
        Bounds inner = panel.localToScene(panel.getLayoutBounds());
        Bounds outer = control.localToScene(control.getLayoutBounds());
        double past =
            Math.max(inner.getMinX() - outer.getMinX(), outer.getMaxX() - inner.getMaxX());
        if (past > 1) {
          found.add(
              (control.getId() == null ? control.getClass().getSimpleName() : "#" + control.getId())
                  + (control instanceof Labeled l ? " \"" + l.getText() + "\"" : "")
                  + " reaches "
                  + Math.round(past)
                  + " px past its panel");
        }
      }
    }
    if (node instanceof Parent parent) {
      for (Node child : parent.getChildrenUnmodifiable()) {
        spilled(child, found);
      }
    }
    return found;
  }

  /**
   * Collects every horizontal scroll bar that shows (it and every node it sits in visible), named
   * by the nearest node with an id around it.
   */
  static List<String> sidewaysBars(Node node, List<String> found) {
    if (!node.isVisible()) {
      return found;
    }
    if (node instanceof ScrollBar bar
        && bar.getOrientation() == Orientation.HORIZONTAL
        && bar.getWidth() > 0
        && bar.getHeight() > 0) {
      Node named = bar;
      while (named != null && named.getId() == null) {
        named = named.getParent();
      }
      found.add(
          "a sideways scroll bar in "
              + (named == null ? "the window" : "#" + named.getId())
              + " (max "
              + Math.round(bar.getMax())
              + ", visible "
              + Math.round(bar.getVisibleAmount())
              + ")");
    }
    if (node instanceof Parent parent) {
      for (Node child : parent.getChildrenUnmodifiable()) {
        sidewaysBars(child, found);
      }
    }
    return found;
  }

  /**
   * Collects every visible text that its control shows shortened (JavaFX then draws it with an
   * ellipsis: the control's own text and the text it draws differ), every wrapping label squeezed
   * narrower than one of its words (which it then breaks letter by letter), and every text a
   * drawing paints shortened with its own ellipsis (a pin's value in the package drawing).
   */
  static List<String> cutTexts(Node node, List<String> cut) {
    if (!node.isVisible()) {
      return cut;
    }
    if (node instanceof TextInputControl field) {
      // What a field holds is the technician's own typing, scrolled within the field; its hint
      // (the prompt shown while it is empty) is ours, and must show whole.
      return cutPrompt(field, cut);
    }
    if (node instanceof Text drawn
        && !(drawn.getParent() instanceof Labeled)
        && drawn.getText() != null
        && drawn.getText().indexOf('\u2026') >= 0) {
      Node named = drawn;
      while (named != null && named.getId() == null) {
        named = named.getParent();
      }
      cut.add(
          "a drawing's text in "
              + (named == null ? "the window" : "#" + named.getId())
              + " shows \""
              + drawn.getText()
              + "\"");
    }
    if (node instanceof Labeled labeled
        && labeled.getText() != null
        && !labeled.getText().isBlank()
        && labeled.getWidth() > 0) {
      for (Node part : labeled.getChildrenUnmodifiable()) {
        if (part instanceof Text shown
            && part.isVisible()
            && shown.getText() != null
            && !shown.getText().equals(labeled.getText())) {
          cut.add(
              name(labeled)
                  + " shows \""
                  + shown.getText()
                  + "\" for \""
                  + labeled.getText()
                  + "\"");
        }
      }
      if (labeled.isWrapText()) {
        double room =
            labeled.getWidth() - labeled.snappedLeftInset() - labeled.snappedRightInset() + 0.5;
        for (String word : labeled.getText().split("\\s+")) {
          Text measured = new Text(word);
          measured.setFont(labeled.getFont());
          if (!word.isEmpty() && measured.getLayoutBounds().getWidth() > room) {
            cut.add(
                name(labeled)
                    + " is narrower than \""
                    + word
                    + "\" in \""
                    + labeled.getText()
                    + "\"");
            break;
          }
        }
      }
    }
    if (node instanceof Parent parent) {
      for (Node child : parent.getChildrenUnmodifiable()) {
        cutTexts(child, cut);
      }
    }
    return cut;
  }

  /**
   * Adds the field's hint when the field is empty and shows its prompt text cut: wider than the
   * room the field gives its text (its clip, which leaves out the padding and any button inside the
   * field, as the clearable serial field's cross).
   */
  static List<String> cutPrompt(TextInputControl field, List<String> cut) {
    String prompt = field.getPromptText();
    if (prompt == null
        || prompt.isBlank()
        || (field.getText() != null && !field.getText().isEmpty())
        || field.getWidth() <= 0) {
      return cut;
    }
    for (Text shown : promptNodes(field, prompt, new java.util.ArrayList<>())) {
      Node holder = shown.getParent();
      double room =
          holder != null && holder.getClip() != null
              ? holder.getClip().getLayoutBounds().getWidth()
              : field.getWidth() - field.snappedLeftInset() - field.snappedRightInset();
      double needs = shown.getLayoutBounds().getWidth();
      if (field instanceof javafx.scene.control.TextArea) {
        // A text area wraps its hint: only a word wider than the area is cut.
        needs = 0;
        for (String word : prompt.split("\\s+")) {
          Text measured = new Text(word);
          measured.setFont(shown.getFont());
          needs = Math.max(needs, measured.getLayoutBounds().getWidth());
        }
      }
      if (needs > room + 0.5) {
        cut.add(
            (field.getId() == null ? field.getClass().getSimpleName() : "#" + field.getId())
                + " shows its hint \""
                + prompt
                + "\" cut ("
                + Math.round(needs)
                + " px in "
                + Math.round(room)
                + " px)");
      }
    }
    return cut;
  }

  private static List<Text> promptNodes(Node node, String prompt, List<Text> found) {
    if (node instanceof Text text && prompt.equals(text.getText()) && text.isVisible()) {
      found.add(text);
    }
    if (node instanceof Parent parent) {
      for (Node child : parent.getChildrenUnmodifiable()) {
        promptNodes(child, prompt, found);
      }
    }
    return found;
  }

  static String name(Labeled labeled) {
    return labeled.getId() == null ? labeled.getClass().getSimpleName() : "#" + labeled.getId();
  }
}
