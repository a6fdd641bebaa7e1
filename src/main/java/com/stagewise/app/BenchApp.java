package com.stagewise.app;

import com.stagewise.ui.Bench;
import com.stagewise.ui.SafetyCaution;
import com.stagewise.ui.Step;
import com.stagewise.ui.closeout.CloseOutView;
import com.stagewise.ui.closeout.CloseOutViewModel;
import com.stagewise.ui.history.HistoryView;
import com.stagewise.ui.history.HistoryViewModel;
import com.stagewise.ui.readings.ReadingsView;
import com.stagewise.ui.readings.ReadingsViewModel;
import com.stagewise.ui.shell.BenchWindow;
import com.stagewise.ui.shell.FxTasks;
import com.stagewise.ui.shell.Overlays;
import com.stagewise.ui.stage.StageView;
import com.stagewise.ui.stage.StageViewModel;
import com.stagewise.ui.start.StartView;
import com.stagewise.ui.start.StartViewModel;
import com.stagewise.ui.suspects.SuspectsView;
import com.stagewise.ui.suspects.SuspectsViewModel;
import javafx.application.Platform;
import javafx.beans.value.ChangeListener;
import javafx.beans.value.ObservableValue;
import javafx.scene.Scene;
import javafx.scene.input.KeyCode;
import javafx.scene.input.KeyCodeCombination;
import javafx.scene.input.KeyCombination;

/** Wires the bench app's screens to a workshop and puts them in a scene. */
public final class BenchApp {
  /** The window's usual size (a 1280×800 laptop). */
  public static final double WIDTH = 1280;

  /** The window's usual size (a 1280×800 laptop). */
  public static final double HEIGHT = 800;

  /** The smallest window every screen works in (a 1024×600 touch laptop). */
  public static final double MIN_WIDTH = 1024;

  /** The smallest window every screen works in (a 1024×600 touch laptop). */
  public static final double MIN_HEIGHT = 600;

  private final Workshop workshop;
  private final Overlays overlays = new Overlays();
  private final FxTasks tasks = new FxTasks();
  private final Bench bench;
  private final BenchWindow window;
  private final java.util.Optional<ShopSync> shopSync;
  private final Scene scene;

  private BenchApp(Workshop workshop, java.nio.file.Path sheet) {
    this.workshop = workshop;
    bench =
        new Bench(
            workshop.store(), tasks, overlays, overlays, workshop.boardFlags(), workshop.resume());
    window = new BenchWindow(bench, overlays, tasks.pendingProperty(), tasks.currentProperty());
    bench.largeTextProperty().set(workshop.settings().largeText());
    bench.highContrastProperty().set(workshop.settings().highContrast());
    bench.largeTextProperty().addListener((o, was, now) -> workshop.settings().setLargeText(now));
    bench
        .highContrastProperty()
        .addListener((o, was, now) -> workshop.settings().setHighContrast(now));
    shopSync = ShopSync.start(workshop.store(), workshop.settings());
    shopSync.ifPresent(sync -> window.showShopServer(sync.text()));
    StartViewModel start = new StartViewModel(bench);
    StartView startView = new StartView(start);
    window.screen(Step.UNIT, startView::root);
    StageViewModel stage = new StageViewModel(bench);
    if (sheet != null) {
      stage.libraryModel().openOnArrival(sheet);
      overlays.show(
          "A stage sheet to open",
          "Stagewise was started with the stage sheet " + sheet.getFileName() + ".",
          "Find the unit and open its case: the sheet opens on the Stage screen.");
    }
    window.screen(Step.STAGE, () -> new StageView(stage).root());
    ReadingsViewModel readings = new ReadingsViewModel(bench);
    window.screen(Step.READINGS, () -> new ReadingsView(readings, bench).root());
    SuspectsViewModel suspects = new SuspectsViewModel(bench);
    window.screen(Step.SUSPECTS, () -> new SuspectsView(suspects).root());
    CloseOutViewModel closeOut = new CloseOutViewModel(bench);
    window.screen(Step.CLOSE_OUT, () -> new CloseOutView(closeOut).root());
    HistoryViewModel history = new HistoryViewModel(bench);
    window.screen(Step.HISTORY, () -> new HistoryView(history).root());
    suspects.chosenForCloseOutProperty().addListener((o, was, now) -> closeOut.prepareFor(now));
    closeOut.setAfterClose(
        caseId -> {
          history.queryProperty().set("");
          history.search();
          history.show(caseId);
          bench.go(Step.HISTORY);
          start.search();
        });
    bench
        .stepProperty()
        .addListener(
            (o, was, now) -> {
              if (now == Step.STAGE) {
                stage.loadLibrary();
              } else if (now == Step.HISTORY && history.hits().isEmpty()) {
                history.search();
              } else if (now == Step.UNIT && was != Step.UNIT) {
                start.search();
              }
            });
    scene = new Scene(window.root(), WIDTH, HEIGHT);
    bench.setFiles(new WindowFiles(scene::getWindow));
    window.addShortcuts(scene);
    scene
        .getAccelerators()
        .put(
            new KeyCodeCombination(KeyCode.F, KeyCombination.SHORTCUT_DOWN),
            () -> {
              bench.go(Step.UNIT);
              startView.focusSearch();
            });
    start.search();
  }

  /** Builds the app on an opened workshop. Call on the JavaFX thread. */
  static BenchApp build(Workshop workshop) {
    return new BenchApp(workshop, null);
  }

  /**
   * Builds the app on a workshop with a stage sheet to open (from the command line or a file
   * manager): it opens on the stage screen once a unit's case is open.
   */
  static BenchApp build(Workshop workshop, java.nio.file.Path sheet) {
    return new BenchApp(workshop, sheet);
  }

  /** Returns the scene with every screen. */
  public Scene scene() {
    return scene;
  }

  /** Returns the bench (for tests and the screenshot tool). */
  public Bench bench() {
    return bench;
  }

  /** Returns the overlay layer (caution and problems). */
  public Overlays overlays() {
    return overlays;
  }

  /** Shows the safety caution if it was never acknowledged on this machine. */
  void cautionOnFirstRun() {
    if (!workshop.settings().cautionAcknowledged()) {
      overlays.show(SafetyCaution.Reason.FIRST_RUN, () -> workshop.settings().acknowledgeCaution());
    }
  }

  /** Returns true when no background work is queued or running (call on the FX thread). */
  boolean idle() {
    return tasks.pendingProperty().get() == 0;
  }

  /**
   * Runs {@code then} once the background work queued so far is done and the screen has been laid
   * out with its results (the pulse after): the window then shows what it will show and takes a
   * tap. Call on the FX thread.
   */
  void whenSettled(Runnable then) {
    if (idle()) {
      afterNextPulse(then);
      return;
    }
    tasks
        .pendingProperty()
        .addListener(
            new ChangeListener<Number>() {
              @Override
              public void changed(ObservableValue<? extends Number> o, Number was, Number now) {
                if (now.intValue() == 0) {
                  tasks.pendingProperty().removeListener(this);
                  // The task's own result is handed over just after the count drops.
                  Platform.runLater(() -> afterNextPulse(then));
                }
              }
            });
  }

  private void afterNextPulse(Runnable then) {
    Runnable once =
        new Runnable() {
          @Override
          public void run() {
            scene.removePostLayoutPulseListener(this);
            then.run();
          }
        };
    scene.addPostLayoutPulseListener(once);
    Platform.requestNextPulse();
  }

  /** Stops the background thread. */
  void close() {
    shopSync.ifPresent(ShopSync::close);
    tasks.close();
  }
}
