package com.stagewise.reference;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Runs ngspice in batch mode on a netlist and reads the node voltages it prints.
 *
 * <p>Reference simulator: ngspice 39, the Debian package ({@code apt-get install ngspice}). Its
 * output is read locale-independently: ngspice prints C-locale numbers, the child process runs with
 * {@code LC_ALL=C}, and numbers are parsed with {@link Double#parseDouble}.
 */
final class Ngspice {
  /** How long one run may take before it counts as failed (a run takes milliseconds). */
  private static final long TIMEOUT_SECONDS = 60;

  /** One printed value: {@code name = value} or, after an AC analysis, {@code name = re,im}. */
  private static final Pattern VALUE =
      Pattern.compile("^\\s*(\\S+)\\s*=\\s*([-+0-9.eE]+)(?:\\s*,\\s*([-+0-9.eE]+))?\\s*$");

  private Ngspice() {}

  /** What a run produced: the voltages, or why there are none. */
  sealed interface Outcome permits Solved, Failed {}

  /**
   * A converged run.
   *
   * @param dc DC volts by our node name
   * @param acRe real part of the AC phasor by our node name (empty without AC)
   * @param acIm imaginary part of the AC phasor by our node name
   */
  record Solved(
      Map<String, Double> dc,
      Map<String, Double> acRe,
      Map<String, Double> acIm,
      Map<String, Double> printed)
      implements Outcome {
    /** Returns the AC amplitude at a node. */
    double acAmplitude(String node) {
      return Math.hypot(acRe.get(node), acIm.get(node));
    }

    /** Returns the AC phase at a node in degrees, in (-180, 180]. */
    double acPhaseDegrees(String node) {
      double phase = Math.toDegrees(Math.atan2(acIm.get(node), acRe.get(node)));
      return phase <= -180 ? phase + 360 : phase;
    }
  }

  /**
   * A run that printed no complete solution (no convergence, a singular matrix, a crash).
   *
   * @param reason the last lines ngspice printed
   */
  record Failed(String reason) implements Outcome {}

  /** Returns whether ngspice can be started from the PATH. */
  static boolean available() {
    try {
      Process p = new ProcessBuilder("ngspice", "--version").redirectErrorStream(true).start();
      p.getInputStream().readAllBytes();
      return p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS) && p.exitValue() == 0;
    } catch (IOException e) {
      return false;
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      return false;
    }
  }

  /** The message for a machine without ngspice. */
  static final String MISSING =
      "ngspice is not on the PATH: the reference checks need it. Install it with"
          + " `apt-get install ngspice` (ngspice 39, the Debian package) and run the tests again.";

  /**
   * Runs one netlist and returns the voltages of every node of the netlist's map.
   *
   * @throws IllegalStateException if ngspice cannot be started
   */
  static Outcome run(SpiceNetlist netlist) {
    String output = runRaw(netlist.text());
    return parse(output, netlist.spiceNodes());
  }

  /** Runs ngspice on a netlist text and returns everything it printed (stdout, then stderr). */
  static String runRaw(String text) {
    return runFiles(Map.of("stage.cir", text), "stage.cir");
  }

  /**
   * Writes the files into a fresh temporary folder, runs {@code ngspice -b main} there and returns
   * everything it printed: stdout, then a line {@code @@stderr}, then stderr.
   */
  static String runFiles(Map<String, String> files, String main) {
    Path dir = null;
    try {
      dir = writeFiles(files);
      return runIn(dir, main);
    } finally {
      deleteQuietly(dir);
    }
  }

  /** Writes the files into a new temporary folder and returns it. */
  static Path writeFiles(Map<String, String> files) {
    try {
      Path dir = Files.createTempDirectory("stagewise-spice");
      for (Map.Entry<String, String> f : files.entrySet()) {
        Files.writeString(dir.resolve(f.getKey()), f.getValue(), StandardCharsets.US_ASCII);
      }
      return dir;
    } catch (IOException e) {
      throw new IllegalStateException("cannot write the netlists (" + e.getMessage() + ")", e);
    }
  }

  /** Runs ngspice in batch mode on {@code main} in a folder of netlists written before. */
  static String runIn(Path dir, String main) {
    try {
      // Notes on stderr would otherwise interleave with printed values in mid-line.
      Path errors = dir.resolve("stderr.txt");
      ProcessBuilder builder =
          new ProcessBuilder(List.of("ngspice", "-b", main)).redirectError(errors.toFile());
      builder.directory(dir.toFile());
      builder.environment().put("LC_ALL", "C");
      builder.environment().put("LANG", "C");
      Process process = builder.start();
      byte[] bytes = process.getInputStream().readAllBytes();
      if (!process.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS)) {
        process.destroyForcibly();
        return "timed out";
      }
      String stderr = Files.readString(errors, StandardCharsets.UTF_8);
      return new String(bytes, StandardCharsets.UTF_8) + "\n@@stderr\n" + stderr;
    } catch (IOException e) {
      throw new IllegalStateException(MISSING + " (" + e.getMessage() + ")", e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while ngspice ran", e);
    }
  }

  /** Reads the values printed between the {@code @@op}, {@code @@ac} and {@code @@end} markers. */
  static Outcome parse(String output, Map<String, String> spiceNodes) {
    Map<String, Double> dc = new HashMap<>();
    Map<String, Double> re = new HashMap<>();
    Map<String, Double> im = new HashMap<>();
    String part = "";
    boolean ended = false;
    for (String line : output.split("\\R")) {
      String trimmed = line.trim();
      switch (trimmed) {
        case "@@op" -> part = "op";
        case "@@ac" -> part = "ac";
        case "@@end" -> ended = true;
        case "@@stderr" -> part = "stderr";
        default -> {
          Matcher m = VALUE.matcher(trimmed);
          if (!m.matches()) {
            break;
          }
          String name = m.group(1).toLowerCase(Locale.ROOT);
          double first = Double.parseDouble(m.group(2));
          if (part.equals("op") && m.group(3) == null) {
            dc.put(name, first);
          } else if (part.equals("ac") && m.group(3) != null) {
            re.put(name, first);
            im.put(name, Double.parseDouble(m.group(3)));
          }
        }
      }
    }
    boolean hasAc = output.contains("\n@@ac") || output.startsWith("@@ac");
    Map<String, Double> ourDc = new HashMap<>();
    Map<String, Double> ourRe = new HashMap<>();
    Map<String, Double> ourIm = new HashMap<>();
    for (Map.Entry<String, String> node : spiceNodes.entrySet()) {
      String name = node.getValue();
      if (name.equals("0")) {
        ourDc.put(node.getKey(), 0.0);
        ourRe.put(node.getKey(), 0.0);
        ourIm.put(node.getKey(), 0.0);
        continue;
      }
      Double volts = dc.get(name);
      if (volts == null || !Double.isFinite(volts)) {
        return new Failed(tail(output));
      }
      ourDc.put(node.getKey(), volts);
      if (hasAc) {
        if (!re.containsKey(name)) {
          return new Failed(tail(output));
        }
        ourRe.put(node.getKey(), re.get(name));
        ourIm.put(node.getKey(), im.get(name));
      }
    }
    if (!ended) {
      return new Failed(tail(output));
    }
    Map<String, Double> printed = new HashMap<>();
    dc.forEach(
        (name, volts) -> {
          if (!name.contains("#")) {
            printed.put(name, volts);
          }
        });
    return new Solved(ourDc, ourRe, ourIm, printed);
  }

  private static String tail(String output) {
    String[] lines = output.split("\\R");
    StringBuilder sb = new StringBuilder();
    for (int i = Math.max(0, lines.length - 12); i < lines.length; i++) {
      sb.append(lines[i]).append('\n');
    }
    return sb.toString().trim();
  }

  static void deleteQuietly(Path dir) {
    if (dir == null) {
      return;
    }
    try (var files = Files.walk(dir)) {
      files.sorted((a, b) -> b.getNameCount() - a.getNameCount()).forEach(p -> p.toFile().delete());
    } catch (IOException | UncheckedIOException e) {
      // A leftover temporary file is harmless; the run's result stands.
    }
  }
}
