package com.stagewise.app;

import javafx.application.Application;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.stage.Stage;

/** Starts the JavaFX desktop app (a placeholder window until the bench app lands). */
public final class DesktopLauncher extends Application {

  static void open(String[] args) {
    Application.launch(DesktopLauncher.class, args);
  }

  @Override
  public void start(Stage window) {
    window.setTitle("Stagewise");
    window.setScene(new Scene(new Label("Stagewise"), 640, 400));
    window.show();
  }
}
