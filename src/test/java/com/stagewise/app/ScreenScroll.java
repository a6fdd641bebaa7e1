package com.stagewise.app;

import java.util.concurrent.TimeUnit;
import javafx.geometry.Bounds;
import javafx.scene.Node;
import javafx.scene.control.ScrollPane;
import org.testfx.util.WaitForAsyncUtils;

/**
 * Scrolls a screen of the headless window as a finger would, so that a robot's tap lands on what it
 * means to tap: a control below the fold of a small window is brought into the middle of the view
 * first. Shared by the app flow tests.
 */
final class ScreenScroll {
  private ScreenScroll() {}

  /**
   * Scrolls each scrolling pane around {@code target}, the innermost first, so that it stands in
   * the middle of that pane's view, unless it is already wholly in sight there.
   */
  static void intoView(Node target) throws Exception {
    for (Node node = target.getParent(); node != null; node = parentOf(node)) {
      if (node instanceof ScrollPane pane) {
        scroll(pane, target);
      }
    }
  }

  private static Node parentOf(Node node) throws Exception {
    return WaitForAsyncUtils.asyncFx(node::getParent).get(30, TimeUnit.SECONDS);
  }

  private static void scroll(ScrollPane pane, Node target) throws Exception {
    WaitForAsyncUtils.asyncFx(
            () -> {
              Node content = pane.getContent();
              Bounds place = content.sceneToLocal(target.localToScene(target.getBoundsInLocal()));
              double view = pane.getViewportBounds().getHeight();
              double room = content.getBoundsInLocal().getHeight() - view;
              if (room <= 0) {
                return;
              }
              // Where the view starts in the content, from the pane's own value (the viewport's
              // bounds follow it only at the next layout).
              double share =
                  (pane.getVvalue() - pane.getVmin()) / (pane.getVmax() - pane.getVmin());
              double top = share * room;
              if (place.getMinY() >= top && place.getMaxY() <= top + view) {
                return; // already wholly in sight: a finger taps it where it is
              }
              double wanted = Math.max(0, Math.min(1, (place.getCenterY() - view / 2) / room));
              pane.setVvalue(pane.getVmin() + wanted * (pane.getVmax() - pane.getVmin()));
              pane.layout();
            })
        .get(30, TimeUnit.SECONDS);
    WaitForAsyncUtils.waitForFxEvents();
  }
}
