package com.stagewise.app;

import com.stagewise.ui.shell.Overlays;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;
import javafx.application.Application;
import javafx.application.Platform;
import javafx.geometry.Pos;
import javafx.geometry.Rectangle2D;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import javafx.stage.Screen;
import javafx.stage.Stage;

/**
 * Starts the bench app: opens the history on a thread of its own (filling the demo data with {@code
 * --demo}) while JavaFX starts and shows a window, then shows the unit screen.
 *
 * <p>With {@code -Dstagewise.timing=true} it prints one line when the first window is shown and one
 * when the window is usable (the unit screen laid out with the units listed, nothing left to do in
 * the background), each with the milliseconds since the process started ({@code
 * src/scripts/time-to-window.sh} reads them).
 */
public final class DesktopLauncher extends Application {
  private BenchApp app;
  private Workshop workshop;

  /** JavaFX's own log; held so that its level survives garbage collection. */
  private static final java.util.logging.Logger FX_LOG =
      java.util.logging.Logger.getLogger("javafx");

  /**
   * The history being opened (and the demo filled) on a thread of its own from the moment the
   * process starts, while JavaFX starts its toolkit and shows the first window on the other core.
   */
  private static CompletableFuture<Workshop> opened;

  /** Where the history is opened (for the message when it cannot be). */
  private static DataFolder openingFolder;

  static void open(String[] args) {
    mark("main");
    AppOptions options = AppOptions.parse(List.of(args));
    openingFolder = options.folder(System.getenv(), System.getProperty("user.home"));
    Path stages = Path.of(System.getProperty("stagewise.stages", "data/stages"));
    opened = new CompletableFuture<>();
    Thread opener =
        new Thread(
            () -> {
              try {
                Workshop opened = Workshop.open(openingFolder, options.demo(), stages);
                mark("history open");
                DesktopLauncher.opened.complete(opened);
              } catch (RuntimeException | LinkageError e) {
                // A linkage error: the database's native library could not be loaded.
                DesktopLauncher.opened.completeExceptionally(e);
              }
            },
            "stagewise-open");
    opener.setDaemon(true);
    opener.start();
    quietOnTheClassPath();
    Application.launch(DesktopLauncher.class, args);
  }

  /**
   * Started from the jar ({@code java -jar stagewise.jar}), JavaFX runs from the class path rather
   * than as named modules. Everything the app uses works so, but JavaFX then logs "Unsupported
   * JavaFX configuration" at start, which would only alarm a technician; its warnings are left out
   * in that case (errors are still logged). The app image (jpackage) loads JavaFX as modules and
   * keeps every message.
   */
  static boolean quietOnTheClassPath() {
    if (Application.class.getModule().isNamed()) {
      return false;
    }
    FX_LOG.setLevel(java.util.logging.Level.SEVERE);
    return true;
  }

  private double startWidth = BenchApp.WIDTH;
  private double startHeight = BenchApp.HEIGHT;

  @Override
  public void start(Stage window) {
    mark("toolkit up");
    AppOptions options = AppOptions.parse(getParameters().getRaw());
    window.setTitle("Stagewise — bench");
    // From a 1024×600 touch laptop to a 1920×1080 bench screen: the window never starts larger
    // than the screen, and fills a small one.
    Rectangle2D screen = Screen.getPrimary().getVisualBounds();
    double width = Math.min(BenchApp.WIDTH, screen.getWidth());
    double height = Math.min(BenchApp.HEIGHT, screen.getHeight());
    if (screen.getWidth() >= 1600 && screen.getHeight() >= 1000) {
      // A large bench screen: use most of it, so that the drawings and lists grow.
      width = Math.round(screen.getWidth() * 0.9);
      height = Math.round(screen.getHeight() * 0.9);
    }
    window.setMinWidth(Math.min(BenchApp.MIN_WIDTH, screen.getWidth()));
    window.setMinHeight(Math.min(BenchApp.MIN_HEIGHT, screen.getHeight()));
    window.setWidth(width);
    window.setHeight(height);
    startWidth = width;
    startHeight = height;
    Label opening = new Label("Opening the repair history …");
    opening.setFont(javafx.scene.text.Font.font(22));
    // Only a label: the first window must come up fast; the screens follow when the history is
    // open.
    VBox splash = new VBox(18, opening);
    splash.setAlignment(Pos.CENTER);
    window.setScene(new Scene(new StackPane(splash), width, height));
    window.setOnShown(e -> reportTiming());
    window.show();
    opened.whenComplete(
        (workshopOpened, failure) ->
            Platform.runLater(
                () -> {
                  if (failure == null) {
                    showBench(window, workshopOpened, options.sheet());
                  } else {
                    cannotOpen(window, openingFolder, unwrapped(failure));
                  }
                }));
  }

  private static RuntimeException unwrapped(Throwable failure) {
    Throwable cause =
        failure instanceof CompletionException && failure.getCause() != null
            ? failure.getCause()
            : failure;
    return cause instanceof RuntimeException runtime ? runtime : new IllegalStateException(cause);
  }

  private void showBench(Stage window, Workshop opened, Path sheet) {
    workshop = opened;
    app = BenchApp.build(opened, sheet);
    mark("screens built");
    Overlays overlays = app.overlays();
    Thread.setDefaultUncaughtExceptionHandler(
        (thread, e) ->
            overlays.show(
                "Something went wrong inside Stagewise",
                String.valueOf(e),
                "Your readings so far are saved in the history. Go back to the Unit screen and resume the case."
                    + " If it happens again, write down what you did and tell whoever looks after Stagewise."));
    window.setScene(app.scene());
    window.setWidth(startWidth);
    window.setHeight(startHeight);
    window.centerOnScreen();
    app.cautionOnFirstRun();
    mark("unit screen shown");
    app.whenSettled(() -> mark("usable window"));
  }

  private static void cannotOpen(Stage window, DataFolder folder, RuntimeException e) {
    Overlays overlays = new Overlays();
    StackPane root = new StackPane(overlays.layer());
    root.getStylesheets().add(Overlays.class.getResource("bench.css").toExternalForm());
    window.setScene(new Scene(root, BenchApp.WIDTH, BenchApp.HEIGHT));
    overlays.show(
        "Could not open the repair history",
        "The file " + folder.database() + " could not be opened: " + e.getMessage(),
        "Check that the disk is not full and the folder can be written. To use another file, start with --db FILE."
            + " Close this window and start Stagewise again.");
  }

  private static void reportTiming() {
    mark("first window shown");
  }

  /** With -Dstagewise.timing=true, prints the milliseconds since the process started. */
  static void mark(String what) {
    if (Boolean.getBoolean("stagewise.timing")) {
      Instant started = ProcessHandle.current().info().startInstant().orElse(Instant.now());
      long millis = Duration.between(started, Instant.now()).toMillis();
      // The processor time the process has used so far (every thread): on a busy machine it
      // varies far less than the time on the clock.
      long cpu =
          ProcessHandle.current().info().totalCpuDuration().map(Duration::toMillis).orElse(-1L);
      System.out.println(
          String.format(
              Locale.ROOT, "stagewise: %s %d ms after start, cpu %d ms", what, millis, cpu));
    }
  }

  @Override
  public void stop() {
    if (app != null) {
      app.close();
    }
    if (workshop != null) {
      workshop.close();
    }
  }
}
