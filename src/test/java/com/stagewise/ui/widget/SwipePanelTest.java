package com.stagewise.ui.widget;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import javafx.application.Platform;
import javafx.geometry.Point2D;
import javafx.scene.Scene;
import javafx.scene.control.Button;
import javafx.scene.control.ScrollPane;
import javafx.scene.input.MouseButton;
import javafx.scene.layout.VBox;
import javafx.stage.Stage;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.testfx.api.FxRobot;
import org.testfx.api.FxToolkit;
import org.testfx.util.WaitForAsyncUtils;

/**
 * A long panel moves under a dragging finger, and a swipe that starts on a button does not press
 * it, while a tap does (common practice on touch screens: a swipe is not a tap).
 */
class SwipePanelTest {
  private final FxRobot robot = new FxRobot();
  private final AtomicInteger pressed = new AtomicInteger();
  private ScrollPane pane;

  @BeforeAll
  static void toolkit() {
    try {
      Platform.startup(() -> {});
    } catch (IllegalStateException alreadyRunning) {
      // Another test class started the toolkit first.
    }
    Platform.setImplicitExit(false);
  }

  @BeforeEach
  void open() throws Exception {
    FxToolkit.registerStage(
        () -> {
          VBox rows = new VBox(4);
          for (int i = 0; i < 40; i++) {
            Button b = new Button("Row " + i);
            b.setId("row-" + i);
            b.setPrefSize(280, 48);
            b.setOnAction(e -> pressed.incrementAndGet());
            rows.getChildren().add(b);
          }
          pane = SwipePanel.of(new ScrollPane(rows));
          Stage stage = new Stage();
          stage.setScene(new Scene(pane, 320, 400));
          stage.show();
          return stage;
        });
    WaitForAsyncUtils.waitForFxEvents();
  }

  @AfterEach
  void close() throws Exception {
    FxToolkit.cleanupStages();
  }

  @Test
  void swipeStartingOnAButton_movesThePanelAndPressesNothing() throws Exception {
    Point2D onRow = fx(() -> centre("#row-3"));
    robot.drag(onRow, MouseButton.PRIMARY).dropBy(0, -150);
    WaitForAsyncUtils.waitForFxEvents();

    assertThat(fx(() -> pane.getVvalue())).isGreaterThan(0.0);
    assertThat(pressed.get()).isZero();
  }

  @Test
  void tapOnAButton_pressesIt() throws Exception {
    robot.clickOn("#row-2");
    WaitForAsyncUtils.waitForFxEvents();

    assertThat(pressed.get()).isEqualTo(1);
  }

  private Point2D centre(String query) {
    var node = robot.lookup(query).query();
    var box = node.localToScreen(node.getBoundsInLocal());
    return new Point2D(box.getCenterX(), box.getCenterY());
  }

  private static <T> T fx(Callable<T> work) throws Exception {
    return WaitForAsyncUtils.asyncFx(work).get(30, TimeUnit.SECONDS);
  }
}
