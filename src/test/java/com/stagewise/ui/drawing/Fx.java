package com.stagewise.ui.drawing;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.function.Supplier;
import javafx.application.Platform;
import javafx.embed.swing.SwingFXUtils;
import javafx.scene.Node;
import javafx.scene.Scene;
import javafx.scene.image.WritableImage;
import javafx.scene.layout.Region;
import javafx.scene.layout.StackPane;
import javax.imageio.ImageIO;

/** Runs code on the JavaFX thread (headless Monocle in the test run) and takes snapshots. */
final class Fx {
  /** Where the drawings' pictures go when the run asks for them with -Dscreenshots=true. */
  static final Path SHOTS = Path.of("src", "site", "screens", "drawings");

  private static boolean started;
  // Held so the setting survives garbage collection; the toolkit warns about the class path.
  private static final java.util.logging.Logger FX_LOG =
      java.util.logging.Logger.getLogger("javafx");

  private Fx() {}

  static synchronized void start() {
    if (started) {
      return;
    }
    FX_LOG.setLevel(java.util.logging.Level.SEVERE);
    try {
      Platform.startup(() -> {});
    } catch (IllegalStateException alreadyRunning) {
      // Another test class started the toolkit first; that is fine.
    }
    Platform.setImplicitExit(false);
    started = true;
  }

  /** Runs {@code work} on the FX thread and returns its result, rethrowing its failure. */
  static <T> T call(Supplier<T> work) {
    start();
    CompletableFuture<T> result = new CompletableFuture<>();
    Platform.runLater(
        () -> {
          try {
            result.complete(work.get());
          } catch (Throwable failure) {
            result.completeExceptionally(failure);
          }
        });
    try {
      return result.get(60, TimeUnit.SECONDS);
    } catch (java.util.concurrent.ExecutionException e) {
      if (e.getCause() instanceof RuntimeException runtime) {
        throw runtime;
      }
      if (e.getCause() instanceof Error error) {
        throw error;
      }
      throw new IllegalStateException(e.getCause());
    } catch (Exception e) {
      throw new IllegalStateException(e);
    }
  }

  /** Lays a region out at a fixed size in a scene and snapshots it; call on the FX thread. */
  static BufferedImage render(Region region, double width, double height) {
    StackPane root = new StackPane(region);
    region.setPrefSize(width, height);
    region.setMaxSize(width, height);
    Scene scene = new Scene(root, width, height);
    root.applyCss();
    root.layout();
    // A second pass lets a region that changed its preferred size during layout settle.
    root.layout();
    return snapshot(root);
  }

  static BufferedImage snapshot(Node node) {
    WritableImage image = node.snapshot(null, null);
    return SwingFXUtils.fromFXImage(image, null);
  }

  /**
   * Writes the picture under src/site/screens/drawings when the run was started with
   * -Dscreenshots=true.
   */
  static void keep(BufferedImage image, String name) {
    if (!Boolean.getBoolean("screenshots")) {
      return;
    }
    try {
      Files.createDirectories(SHOTS);
      ImageIO.write(image, "png", SHOTS.resolve(name + ".png").toFile());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Returns how many distinct colours the picture holds (a blank picture has one). */
  static int colours(BufferedImage image) {
    java.util.Set<Integer> seen = new java.util.HashSet<>();
    for (int y = 0; y < image.getHeight(); y += 2) {
      for (int x = 0; x < image.getWidth(); x += 2) {
        seen.add(image.getRGB(x, y));
        if (seen.size() > 50) {
          return seen.size();
        }
      }
    }
    return seen.size();
  }

  /** Returns the share of sampled pixels that differ from the top-left pixel (the paper). */
  static double inked(BufferedImage image) {
    int paper = image.getRGB(0, 0);
    int inked = 0;
    int all = 0;
    for (int y = 0; y < image.getHeight(); y += 2) {
      for (int x = 0; x < image.getWidth(); x += 2) {
        all++;
        if (image.getRGB(x, y) != paper) {
          inked++;
        }
      }
    }
    return (double) inked / all;
  }
}
