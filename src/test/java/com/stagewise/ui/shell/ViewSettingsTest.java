package com.stagewise.ui.shell;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.function.Supplier;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import javafx.application.Platform;
import javafx.scene.Scene;
import javafx.scene.control.Label;
import javafx.scene.layout.StackPane;
import javafx.scene.layout.VBox;
import javafx.scene.paint.Color;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The larger-text and high-contrast settings: every text size of every screen's sheet has a larger
 * one (so the setting cannot drift from the screens), and on a real scene the settings change the
 * sizes and colours of a screen's labels, beside its own sheet.
 */
class ViewSettingsTest {
  private static final Path SHEETS = Path.of("src/main/resources/com/stagewise/ui");
  private static final Pattern RULE = Pattern.compile("([^{}]+)\\{([^}]*)}");
  private static final Pattern SIZE = Pattern.compile("-fx-font-size:\\s*(\\d+)px");

  @BeforeAll
  static void toolkit() {
    try {
      Platform.startup(() -> {});
    } catch (IllegalStateException alreadyRunning) {
      // Another test class started the toolkit first.
    }
    Platform.setImplicitExit(false);
  }

  /** Every selector with a text size in px, with the size, from the sheets at {@code files}. */
  private static Map<String, Integer> sizes(List<Path> files) throws IOException {
    Map<String, Integer> sizes = new TreeMap<>();
    for (Path file : files) {
      String css = Files.readString(file).replaceAll("(?s)/\\*.*?\\*/", "");
      Matcher rule = RULE.matcher(css);
      while (rule.find()) {
        Matcher size = SIZE.matcher(rule.group(2));
        if (size.find()) {
          for (String selector : rule.group(1).split(",")) {
            sizes.put(selector.strip(), Integer.parseInt(size.group(1)));
          }
        }
      }
    }
    return sizes;
  }

  @Test
  void everyTextSizeOfEveryScreen_hasALargerOneInTheLargeTextSheet() throws IOException {
    List<Path> screens = new ArrayList<>();
    try (Stream<Path> files = Files.walk(SHEETS)) {
      files
          .filter(f -> f.toString().endsWith(".css"))
          .filter(f -> !f.getFileName().toString().equals("large-text.css"))
          .forEach(screens::add);
    }
    Map<String, Integer> normal = sizes(screens);
    Map<String, Integer> large = sizes(List.of(SHEETS.resolve("shell/large-text.css")));

    assertThat(normal).hasSizeGreaterThan(20);
    for (var entry : normal.entrySet()) {
      String selector =
          entry.getKey().equals(".root") ? ".root.large-text" : ".large-text " + entry.getKey();
      assertThat(large).as("larger size for " + entry.getKey()).containsKey(selector);
      // A fifth larger at least: the step a reader notices (common practice for a "large" setting).
      assertThat(large.get(selector))
          .as(selector)
          .isGreaterThanOrEqualTo((int) Math.ceil(entry.getValue() * 1.2));
    }
  }

  private static <T> T fx(Supplier<T> work) throws Exception {
    CompletableFuture<T> result = new CompletableFuture<>();
    Platform.runLater(
        () -> {
          try {
            result.complete(work.get());
          } catch (Throwable failure) {
            result.completeExceptionally(failure);
          }
        });
    return result.get(60, TimeUnit.SECONDS);
  }

  /** A window root with the shell's sheets and a screen with its own sheet, as the app has. */
  private record Window(StackPane root, Label title, Label hint, Label plain) {
    static Window build() {
      StackPane root = new StackPane();
      for (String sheet : List.of("bench.css", "large-text.css", "high-contrast.css")) {
        root.getStylesheets().add(BenchWindow.class.getResource(sheet).toExternalForm());
      }
      VBox screen = new VBox();
      screen
          .getStylesheets()
          .add(
              ViewSettingsTest.class
                  .getResource("/com/stagewise/ui/readings/readings.css")
                  .toExternalForm());
      Label title = new Label("Probe U1 pin 6");
      title.getStyleClass().add("probe-call");
      Label hint = new Label("Black probe on ground");
      hint.getStyleClass().add("hint");
      Label plain = new Label("12.01 V");
      screen.getChildren().addAll(title, hint, plain);
      root.getChildren().add(screen);
      new Scene(root, 800, 600);
      return new Window(root, title, hint, plain);
    }

    double[] sizes() {
      root.applyCss();
      return new double[] {
        title.getFont().getSize(), hint.getFont().getSize(), plain.getFont().getSize()
      };
    }
  }

  @Test
  void largeText_makesEveryLabelOfAScreenLarger() throws Exception {
    double[][] sizes =
        fx(
            () -> {
              Window w = Window.build();
              double[] before = w.sizes();
              w.root().getStyleClass().add("large-text");
              return new double[][] {before, w.sizes()};
            });

    assertThat(sizes[0]).containsExactly(30, 15, 17);
    assertThat(sizes[1]).containsExactly(38, 19, 21);
  }

  @Test
  void highContrast_makesTheTextBlack() throws Exception {
    Color[] fills =
        fx(
            () -> {
              Window w = Window.build();
              w.root().applyCss();
              Color before = (Color) w.plain().getTextFill();
              w.root().getStyleClass().add("high-contrast");
              w.root().applyCss();
              return new Color[] {before, (Color) w.plain().getTextFill()};
            });

    assertThat(fills[0]).isEqualTo(Color.web("#15171a"));
    assertThat(fills[1]).isEqualTo(Color.BLACK);
  }
}
