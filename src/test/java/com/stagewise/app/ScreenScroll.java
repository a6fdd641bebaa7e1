package com.stagewise.app;

import java.util.concurrent.TimeUnit;
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
   * Scrolls the nearest scrolling pane around {@code target} so that it stands in the middle,
   * unless it is already wholly in sight.
   */
  static void intoView(Node target) throws Exception {
    WaitForAsyncUtils.asyncFx(
            () -> {
              Node node = target.getParent();
              while (node != null && !(node instanceof ScrollPane)) {
                node = node.getParent();
              }
              if (node instanceof ScrollPane pane) {
                Node content = pane.getContent();
                var place = content.sceneToLocal(target.localToScene(target.getBoundsInLocal()));
                double y = place.getCenterY();
                double view = pane.getViewportBounds().getHeight();
                double top = -pane.getViewportBounds().getMinY();
                if (place.getMinY() >= top && place.getMaxY() <= top + view) {
                  return; // already wholly in sight: a finger taps it where it is
                }
                double room = content.getBoundsInLocal().getHeight() - view;
                if (room > 0) {
                  pane.setVvalue(Math.max(0, Math.min(1, (y - view / 2) / room)));
                }
              }
            })
        .get(30, TimeUnit.SECONDS);
    WaitForAsyncUtils.waitForFxEvents();
  }
}
