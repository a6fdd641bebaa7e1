package com.stagewise.app;

import java.util.List;
import javafx.geometry.Bounds;
import javafx.scene.Node;
import javafx.scene.Parent;
import javafx.scene.control.ButtonBase;
import javafx.scene.control.ComboBoxBase;
import javafx.scene.control.ScrollPane;
import javafx.scene.control.TextInputControl;

/**
 * What a finger can reach on a screen of the headless window without scrolling: whether a node
 * stands wholly in sight (inside the window and inside the view of every scrolling pane around it,
 * as they are scrolled now), and which controls give a finger less than a touch target's room.
 */
final class Reach {
  /**
   * The smallest side of a touch target the flow tests accept, in px: about 48 px (9 mm) is the
   * common-practice minimum for a fingertip, 44 px the smallest that common practice allows (both
   * figures from memory of the usual platform touch guidelines).
   */
  static final double FINGER = 44;

  private Reach() {}

  /**
   * Returns why the node is not wholly in sight, or an empty text when it is: it and every node
   * around it visible, its bounds inside the window and inside the view of every scroll pane around
   * it.
   */
  static String outOfSight(Node node, double windowWidth, double windowHeight) {
    for (Node n = node; n != null; n = n.getParent()) {
      if (!n.isVisible()) {
        return "hidden";
      }
    }
    Bounds place = node.localToScene(node.getBoundsInLocal());
    if (place.getWidth() <= 0 || place.getHeight() <= 0) {
      return "of no size";
    }
    if (place.getMinX() < -0.5
        || place.getMinY() < -0.5
        || place.getMaxX() > windowWidth + 0.5
        || place.getMaxY() > windowHeight + 0.5) {
      return "outside the window at " + round(place);
    }
    for (Parent p = node.getParent(); p != null; p = p.getParent()) {
      if (p instanceof ScrollPane pane) {
        Bounds box = pane.localToScene(pane.getLayoutBounds());
        double left = box.getMinX() + pane.snappedLeftInset();
        double top = box.getMinY() + pane.snappedTopInset();
        double right = left + pane.getViewportBounds().getWidth();
        double bottom = top + pane.getViewportBounds().getHeight();
        if (place.getMinX() < left - 0.5
            || place.getMinY() < top - 0.5
            || place.getMaxX() > right + 0.5
            || place.getMaxY() > bottom + 0.5) {
          return "outside the view of #"
              + pane.getId()
              + " (its view "
              + Math.round(top)
              + " to "
              + Math.round(bottom)
              + " px down) at "
              + round(place);
        }
      }
    }
    return "";
  }

  /**
   * Collects every visible control a finger taps (a button, a switch, a list box, a field) under
   * {@code node} whose width or height on the screen is below {@link #FINGER}.
   */
  static List<String> smallControls(Node node, List<String> found) {
    if (!node.isVisible()) {
      return found;
    }
    if (node instanceof ButtonBase
        || node instanceof ComboBoxBase<?>
        || node instanceof TextInputControl) {
      Bounds b = node.localToScene(node.getBoundsInLocal());
      if (b.getWidth() > 0 && (b.getWidth() < FINGER || b.getHeight() < FINGER)) {
        found.add(
            (node.getId() == null ? node.getClass().getSimpleName() : "#" + node.getId())
                + " is "
                + Math.round(b.getWidth())
                + "×"
                + Math.round(b.getHeight())
                + " px");
      }
      return found;
    }
    if (node instanceof Parent parent) {
      for (Node child : parent.getChildrenUnmodifiable()) {
        smallControls(child, found);
      }
    }
    return found;
  }

  /** Returns the hit area of a node as it stands on the screen (scaled as drawn), in words. */
  static String size(Node node) {
    Bounds b = node.localToScene(node.getBoundsInLocal());
    return Math.round(b.getWidth()) + "×" + Math.round(b.getHeight()) + " px";
  }

  /** Whether a node's hit area on the screen is at least {@link #FINGER} each way. */
  static boolean fingerSized(Node node) {
    Bounds b = node.localToScene(node.getBoundsInLocal());
    return b.getWidth() >= FINGER && b.getHeight() >= FINGER;
  }

  private static String round(Bounds b) {
    return "x "
        + Math.round(b.getMinX())
        + " to "
        + Math.round(b.getMaxX())
        + ", y "
        + Math.round(b.getMinY())
        + " to "
        + Math.round(b.getMaxY());
  }
}
