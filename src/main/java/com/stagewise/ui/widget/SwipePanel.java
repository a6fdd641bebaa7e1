package com.stagewise.ui.widget;

import javafx.scene.Node;
import javafx.scene.control.ButtonBase;
import javafx.scene.control.ScrollPane;
import javafx.scene.input.MouseEvent;

/**
 * A long panel that a finger drags along, as on a phone: pressing anywhere in it and dragging moves
 * its content. A drag is a swipe, not a tap, so a swipe that starts on a button moves the panel and
 * never presses the button.
 */
public final class SwipePanel {
  /** How far a finger moves before a press counts as a swipe, in pixels. */
  static final double SWIPE_DISTANCE = 10;

  private SwipePanel() {}

  /**
   * Makes a scroll pane draggable by finger and keeps its buttons from firing at the end of a
   * swipe.
   *
   * @param pane the panel
   * @return the same panel
   */
  public static ScrollPane of(ScrollPane pane) {
    // The panel follows the finger itself (not the scroll pane's own panning, which a button under
    // the finger would stop), and the drag goes to nobody else.
    double[] start = new double[2];
    boolean[] swiping = new boolean[1];
    pane.addEventFilter(
        MouseEvent.MOUSE_PRESSED,
        e -> {
          start[0] = e.getSceneY();
          start[1] = pane.getVvalue();
          swiping[0] = false;
        });
    pane.addEventFilter(
        MouseEvent.MOUSE_DRAGGED,
        e -> {
          double moved = e.getSceneY() - start[0];
          if (!swiping[0] && Math.abs(moved) > SWIPE_DISTANCE) {
            swiping[0] = true;
            disarm(e);
          }
          if (swiping[0]) {
            pane.setVvalue(scrolledBy(pane, start[1], moved));
            e.consume();
          }
        });
    pane.addEventFilter(
        MouseEvent.MOUSE_RELEASED,
        e -> {
          if (swiping[0]) {
            disarm(e);
            swiping[0] = false;
          }
        });
    return pane;
  }

  /** The scroll value after the finger moved the content by {@code moved} pixels (down > 0). */
  static double scrolledBy(ScrollPane pane, double from, double moved) {
    Node content = pane.getContent();
    double hidden =
        content == null
            ? 0
            : content.getLayoutBounds().getHeight() - pane.getViewportBounds().getHeight();
    if (hidden <= 0) {
      return from;
    }
    double range = pane.getVmax() - pane.getVmin();
    double to = from - moved / hidden * range;
    return Math.max(pane.getVmin(), Math.min(pane.getVmax(), to));
  }

  private static void disarm(MouseEvent e) {
    for (Node n = e.getPickResult().getIntersectedNode(); n != null; n = n.getParent()) {
      if (n instanceof ButtonBase button) {
        button.disarm();
        return;
      }
    }
  }
}
