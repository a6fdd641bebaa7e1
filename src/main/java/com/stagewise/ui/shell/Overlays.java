package com.stagewise.ui.shell;

import com.stagewise.ui.Caution;
import com.stagewise.ui.Problems;
import com.stagewise.ui.SafetyCaution;
import java.util.ArrayDeque;
import java.util.Deque;
import javafx.application.Platform;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.input.KeyCode;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;

/**
 * Shows the safety caution and problems as a panel over the whole window (no separate windows: they
 * stay put on a touch screen and one tap closes them). One at a time; the rest wait in turn.
 */
public final class Overlays implements Caution, Problems {
  private final StackPane layer = new StackPane();
  private final Deque<Node> waiting = new ArrayDeque<>();

  /** Creates the overlay layer, hidden until something is shown. */
  public Overlays() {
    layer.getStyleClass().add("overlay");
    layer.setVisible(false);
    layer.setPickOnBounds(true);
  }

  /** Returns the layer to stack over the window's content. */
  public Node layer() {
    return layer;
  }

  /** Returns whether something is shown. */
  public boolean isShowing() {
    return layer.isVisible();
  }

  @Override
  public void show(SafetyCaution.Reason reason, Runnable then) {
    VBox box = new VBox();
    box.setId("caution");
    box.getStyleClass().add("caution");
    box.setMaxSize(820, Region_USE_PREF);
    Label title = new Label(SafetyCaution.TITLE);
    title.getStyleClass().add("caution-title");
    box.getChildren().add(title);
    if (!reason.line().isEmpty()) {
      Label why = new Label(reason.line());
      why.getStyleClass().add("caution-reason");
      why.setWrapText(true);
      box.getChildren().add(why);
    }
    Label text = new Label(SafetyCaution.TEXT);
    text.getStyleClass().add("caution-text");
    text.setWrapText(true);
    Button ok = new Button(SafetyCaution.ACKNOWLEDGE);
    ok.setId("caution-ok");
    ok.getStyleClass().add("primary");
    ok.setDefaultButton(true);
    ok.setOnAction(
        e -> {
          next();
          then.run();
        });
    box.getChildren().addAll(text, ok);
    offer(box, ok);
  }

  @Override
  public void show(String title, String what, String todo) {
    if (!Platform.isFxApplicationThread()) {
      Platform.runLater(() -> show(title, what, todo));
      return;
    }
    VBox box = new VBox();
    box.setId("problem");
    box.getStyleClass().add("problem");
    box.setMaxSize(760, Region_USE_PREF);
    Label heading = new Label(title);
    heading.getStyleClass().add("problem-title");
    heading.setWrapText(true);
    Label whatLabel = new Label(what);
    whatLabel.setWrapText(true);
    Label todoLabel = new Label("What to do: " + todo);
    todoLabel.setWrapText(true);
    todoLabel.getStyleClass().add("strong");
    Button ok = new Button("OK");
    ok.setId("problem-ok");
    ok.getStyleClass().add("primary");
    ok.setDefaultButton(true);
    ok.setOnAction(e -> next());
    box.getChildren().addAll(heading, whatLabel, todoLabel, ok);
    offer(box, ok);
  }

  private static final double Region_USE_PREF = javafx.scene.layout.Region.USE_PREF_SIZE;

  private void offer(VBox box, Button ok) {
    box.setAlignment(Pos.CENTER_LEFT);
    box.setOnKeyPressed(
        e -> {
          if (e.getCode() == KeyCode.ENTER || e.getCode() == KeyCode.SPACE) {
            ok.fire();
            e.consume();
          }
        });
    if (layer.isVisible()) {
      waiting.add(box);
      return;
    }
    present(box);
  }

  private void present(Node box) {
    layer.getChildren().setAll(box);
    layer.setVisible(true);
    Platform.runLater(
        () -> box.lookupAll(".button").stream().findFirst().ifPresent(Node::requestFocus));
  }

  private void next() {
    Node following = waiting.poll();
    if (following == null) {
      layer.getChildren().clear();
      layer.setVisible(false);
    } else {
      present(following);
    }
  }
}
