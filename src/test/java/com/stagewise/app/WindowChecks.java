package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.concurrent.TimeUnit;
import javafx.embed.swing.SwingFXUtils;
import javafx.scene.Node;
import javafx.scene.control.ScrollPane;
import javafx.scene.image.WritableImage;
import javafx.stage.Stage;
import javax.imageio.ImageIO;
import org.testfx.api.FxRobot;
import org.testfx.util.WaitForAsyncUtils;

/**
 * What the app flow tests check on the bench's window whatever the flow: the window at each size a
 * technician uses and in each look of the settings, no text cut short, no control out of its panel,
 * no sideways scroll, a screen's next action in sight with the screen at its top and big enough for
 * a finger, and pictures of the window. {@link WindowFlow} opens the window.
 */
abstract class WindowChecks {
  BenchApp app;
  Stage window;
  final FxRobot robot = new FxRobot();

  /** The window sizes every screen must work at: a small touch laptop, a laptop, a desk screen. */
  static final int[] SMALL = {1024, 600};

  static final int[] LAPTOP = {1280, 800};
  static final int[] DESK = {1920, 1080};

  /** Runs {@code work} on the JavaFX thread and returns its result. */
  static <T> T fx(Callable<T> work) throws Exception {
    return WaitForAsyncUtils.asyncFx(work).get(30, TimeUnit.SECONDS);
  }

  /** What to look at or check with the window at one size. */
  interface AtSize {
    void look(int[] size, String where) throws Exception;
  }

  /**
   * Shows the window at each size in turn (laid out anew), runs {@code look} at each, and puts the
   * window back to its usual 1280×800.
   */
  void atSizes(int[][] sizes, AtSize look) throws Exception {
    for (int[] size : sizes) {
      resize(size[0], size[1]);
      relayout();
      look.look(size, size[0] + "x" + size[1]);
    }
    resize(BenchApp.WIDTH, BenchApp.HEIGHT);
  }

  /** Lays the window out anew (after a change of size or of look) and lets it settle. */
  void relayout() throws Exception {
    for (int pass = 0; pass < 2; pass++) {
      // Twice: a drawing that redraws for its new room may change its own size once more.
      fx(
          () -> {
            window.getScene().getRoot().applyCss();
            window.getScene().getRoot().layout();
            return null;
          });
      WaitForAsyncUtils.waitForFxEvents();
    }
  }

  /** The settings' switches of the screens' look. */
  enum Look {
    LARGER_TEXT,
    HIGH_CONTRAST
  }

  /** Turns a switch of the screens' look on or off, as the unit screen's buttons do, and relays. */
  void look(Look look, boolean on) throws Exception {
    fx(
        () -> {
          (look == Look.LARGER_TEXT
                  ? app.bench().largeTextProperty()
                  : app.bench().highContrastProperty())
              .set(on);
          return null;
        });
    relayout();
  }

  /** What to check with the window in one look. */
  interface InLook {
    void check(String look) throws Exception;
  }

  /**
   * Turns each look of the settings (larger text, high contrast) on in turn, then both at once,
   * saves a picture of the window under target/screens/LOOK/WHERE/NAME.png, runs {@code check}
   * (given the look's name to put in its messages) and turns the look off again.
   */
  void inEveryLook(String name, String where, InLook check) throws Exception {
    List<List<Look>> looks =
        List.of(
            List.of(Look.LARGER_TEXT),
            List.of(Look.HIGH_CONTRAST),
            List.of(Look.LARGER_TEXT, Look.HIGH_CONTRAST));
    for (List<Look> on : looks) {
      for (Look look : on) {
        look(look, true);
      }
      String folder =
          String.join(
              "-",
              on.stream().map(l -> l.name().toLowerCase(Locale.ROOT).replace('_', '-')).toList());
      try {
        savePicture(Path.of("target", "screens", folder, where, name + ".png"));
        check.check(folder);
      } finally {
        for (Look look : on) {
          look(look, false);
        }
      }
    }
  }

  /** What to check with the window at one size in one look. */
  interface InSizeAndLook {
    void check(int[] size, String where, String look) throws Exception;
  }

  /**
   * Shows the window at each size and, at each, runs {@code check} in the ordinary look, then with
   * larger text, with high contrast and with both (pictures of those three under
   * target/screens/LOOK/WHERE/NAME.png); the window is put back to its usual size and look.
   */
  void inFourLooks(String name, int[][] sizes, InSizeAndLook check) throws Exception {
    atSizes(
        sizes,
        (size, where) -> {
          check.check(size, where, "ordinary look");
          inEveryLook(name, where, look -> check.check(size, where, look));
        });
  }

  /**
   * Fails, at each size in each of the four looks, on a text cut short, a control out of its panel
   * or a sideways scroll bar anywhere in the window (at 1024×600 a screen scrolls down, never
   * sideways, which a finger on a touch laptop misses); saves a picture of each in the ordinary
   * look under target/screens/WHERE/NAME.png.
   */
  void assertWholeInFourLooks(String name, int[][] sizes) throws Exception {
    assertWholeInFourLooks(
        name,
        sizes,
        (size, where) -> savePicture(Path.of("target", "screens", where, name + ".png")));
  }

  /**
   * As {@link #assertWholeInFourLooks(String, int[][])}, with {@code picture} saving what the test
   * keeps of each size in the ordinary look.
   */
  void assertWholeInFourLooks(String name, int[][] sizes, AtSize picture) throws Exception {
    inFourLooks(
        name,
        sizes,
        (size, where, look) -> {
          String screen = look.equals("ordinary look") ? name : name + " with " + look;
          assertNothingCut(screen, where);
          assertNoSidewaysScroll(screen, where);
          if (look.equals("ordinary look")) {
            picture.look(size, where);
          }
        });
  }

  /**
   * Scrolls the screen's own scroll pane ({@code scroller}, e.g. {@code #scroll-stage}) to its top
   * and fails unless every node the queries name stands wholly inside the window and inside the
   * view of every scroll pane around it: what a technician must see without scrolling.
   */
  void assertInSightAtTop(String scroller, String what, String... queries) throws Exception {
    fx(
        () -> {
          ((ScrollPane) robot.lookup(scroller).query()).setVvalue(0);
          return null;
        });
    relayout();
    assertThat(fx(() -> ((ScrollPane) robot.lookup(scroller).query()).getVvalue()))
        .as("%s scrolled to its top", scroller)
        .isZero();
    List<String> missing = new ArrayList<>();
    for (String query : queries) {
      String why =
          fx(
              () ->
                  Reach.outOfSight(
                      robot.lookup(query).query(),
                      window.getScene().getWidth(),
                      window.getScene().getHeight()));
      if (!why.isEmpty()) {
        missing.add(query + " " + why);
      }
    }
    assertThat(missing).as("out of sight without scrolling: %s", what).isEmpty();
  }

  /**
   * Returns how many px of a screen's content its scroll pane cannot show at once (0 or less when
   * the screen fits the window and shows no scroll bar).
   */
  double screenOverflow(String scroller) {
    ScrollPane pane = (ScrollPane) robot.lookup(scroller).query();
    return pane.getContent().getLayoutBounds().getHeight() - pane.getViewportBounds().getHeight();
  }

  /**
   * Fails unless every node the queries name gives a finger at least {@link Reach#FINGER} px each
   * way on the screen (about 48 px, 9 mm, is common practice for a touch target; from memory).
   */
  void assertFingerSized(String what, String... queries) throws Exception {
    List<String> small = new ArrayList<>();
    for (String query : queries) {
      Node node = robot.lookup(query).query();
      if (!fx(() -> Reach.fingerSized(node))) {
        small.add(query + " is " + fx(() -> Reach.size(node)));
      }
    }
    assertThat(small).as("touch targets under %s px: %s", Reach.FINGER, what).isEmpty();
  }

  private void resize(double width, double height) throws Exception {
    fx(
        () -> {
          window.setWidth(width);
          window.setHeight(height);
          return null;
        });
    // The window system applies a new size asynchronously: wait until the scene has it.
    WaitForAsyncUtils.waitFor(
        30,
        TimeUnit.SECONDS,
        () ->
            fx(
                () ->
                    window.getScene().getWidth() == width
                        && window.getScene().getHeight() == height));
    WaitForAsyncUtils.waitForFxEvents();
  }

  /**
   * Fails when a text is cut short on the whole window (no {@code parts}) or inside each of the
   * nodes the queries name.
   */
  void assertNothingCut(String screen, String where, String... parts) throws Exception {
    if (parts.length == 0) {
      List<String> cut =
          fx(() -> ScreenFaults.cutTexts(window.getScene().getRoot(), new ArrayList<>()));
      assertThat(cut).as("texts cut short on %s at %s", screen, where).isEmpty();
      List<String> out =
          fx(() -> ScreenFaults.spilled(window.getScene().getRoot(), new ArrayList<>()));
      assertThat(out).as("controls out of their panels on %s at %s", screen, where).isEmpty();
    }
    for (String part : parts) {
      List<String> cut =
          fx(() -> ScreenFaults.cutTexts(robot.lookup(part).query(), new ArrayList<>()));
      assertThat(cut).as("texts cut short in %s on %s at %s", part, screen, where).isEmpty();
      List<String> out =
          fx(() -> ScreenFaults.spilled(robot.lookup(part).query(), new ArrayList<>()));
      assertThat(out)
          .as("controls out of their panels in %s on %s at %s", part, screen, where)
          .isEmpty();
    }
  }

  /**
   * Fails when any scroll bar across the window shows: at 1024×600 every screen fits the window's
   * width (it scrolls down, never sideways, which a finger on a touch laptop misses).
   */
  void assertNoSidewaysScroll(String screen, String where) throws Exception {
    List<String> bars =
        fx(() -> ScreenFaults.sidewaysBars(window.getScene().getRoot(), new ArrayList<>()));
    assertThat(bars).as("sideways scroll bars on %s at %s", screen, where).isEmpty();
  }

  /** The folder of the README's pictures with {@code -Dscreenshots=true}, else target/screens. */
  static Path screensFolder() {
    return Boolean.getBoolean("screenshots")
        ? Path.of("src", "site", "screens")
        : Path.of("target", "screens");
  }

  /** Saves a picture of the whole window, as large as the window is. */
  void savePicture(Path file) throws Exception {
    WritableImage image = fx(() -> window.getScene().snapshot(null));
    BufferedImage picture = SwingFXUtils.fromFXImage(image, null);
    assertThat(picture.getWidth()).isEqualTo((int) Math.round(window.getScene().getWidth()));
    assertThat(picture.getHeight()).isEqualTo((int) Math.round(window.getScene().getHeight()));
    Files.createDirectories(file.getParent());
    try {
      ImageIO.write(picture, "png", file.toFile());
    } catch (IOException e) {
      throw new AssertionError("could not write the picture " + file, e);
    }
  }
}
