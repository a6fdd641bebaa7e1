package com.stagewise.cli;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.StageRules;
import com.stagewise.interchange.StageSheet;
import com.stagewise.ui.drawing.SchematicPicture;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code stagewise stage check FILE…} and {@code stagewise stage draw FILE --out FILE.png|svg}: a
 * shop engineer's tools for preparing stage sheets at a desk.
 */
@Command(
    name = "stage",
    mixinStandardHelpOptions = true,
    description = "Checks stage sheets and draws their schematics.",
    subcommands = {StageCommand.Check.class, StageCommand.Draw.class})
final class StageCommand implements Runnable {
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw new CommandLine.ParameterException(
        spec.commandLine(), "Name what to do: 'stage check FILE' or 'stage draw FILE --out FILE'.");
  }

  /**
   * Returns every problem of a stage: the stage rules (which include section pins on nets nothing
   * else touches).
   */
  static List<StageRules.Problem> problems(Stage stage) {
    return StageRules.problems(stage);
  }

  /** {@code stage check FILE…}: prints every problem of each sheet; exit 2 if any. */
  @Command(
      name = "check",
      mixinStandardHelpOptions = true,
      description = {
        "Prints every problem of each stage sheet, with the field to fix.",
        "Exit code 0 when every sheet is sound, 2 when any has a problem."
      })
  static final class Check implements Callable<Integer> {
    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "FILE", description = "stage sheets (*.stage.json)")
    List<Path> files;

    @Override
    public Integer call() {
      PrintWriter out = spec.commandLine().getOut();
      PrintWriter err = spec.commandLine().getErr();
      boolean any = false;
      for (Path file : files) {
        Stage stage;
        try {
          stage = StageSheet.readForm(file);
        } catch (InvalidInputException e) {
          err.println("stagewise: " + e.getMessage());
          any = true;
          continue;
        }
        List<StageRules.Problem> problems = problems(stage);
        if (problems.isEmpty()) {
          out.println(file + ": no problems");
        } else {
          any = true;
          out.println(
              file + ": " + problems.size() + (problems.size() == 1 ? " problem" : " problems"));
          for (StageRules.Problem problem : problems) {
            out.println("  " + problem.field() + ": " + problem.message());
          }
        }
      }
      out.flush();
      err.flush();
      return any ? ExitCode.BAD_INPUT : ExitCode.OK;
    }
  }

  /** {@code stage draw FILE --out FILE.png|svg}: draws the sheet's schematic. */
  @Command(
      name = "draw",
      mixinStandardHelpOptions = true,
      description = {
        "Draws the schematic of a stage sheet as an SVG or PNG picture,",
        "laid out from the topology as the app does. A sheet with problems is still drawn."
      })
  static final class Draw implements Callable<Integer> {
    @CommandLine.Spec CommandLine.Model.CommandSpec spec;

    @Parameters(index = "0", paramLabel = "FILE", description = "the stage sheet (*.stage.json)")
    Path file;

    @Option(
        names = "--out",
        required = true,
        paramLabel = "FILE",
        description = "the picture to write: a name ending in .svg or .png")
    Path out;

    @Option(
        names = "--scale",
        paramLabel = "FACTOR",
        description = "pixels per drawing unit for PNG (default ${DEFAULT-VALUE})",
        defaultValue = "2")
    double scale;

    @Option(names = "--force", description = "replace the picture if it exists")
    boolean force;

    @Override
    public Integer call() throws IOException {
      String name = out.getFileName().toString().toLowerCase(Locale.ROOT);
      boolean svg = name.endsWith(".svg");
      if (!svg && !name.endsWith(".png")) {
        throw new InvalidInputException(
            "--out", "", out + " must end in .svg or .png (the picture's format)");
      }
      if (!(scale > 0 && scale <= 10)) {
        throw new InvalidInputException(
            "--scale", "", "scale (" + scale + ") must be above 0 and at most 10");
      }
      if (Files.exists(out) && !force) {
        throw new InvalidInputException(
            "--out", "", out + " already exists (give --force to replace it)");
      }
      Path folder = out.toAbsolutePath().getParent();
      if (folder == null || !Files.isDirectory(folder)) {
        throw new InvalidInputException(
            "--out", "", "the folder of " + out + " does not exist (expected an existing folder)");
      }
      Stage stage = StageSheet.readForm(file);
      // Not Files.createTempFile, which makes the file readable by its owner only (0600): a
      // drawing gets the user's normal permissions (umask), as every file we write for people.
      Path temp = Files.createFile(folder.resolve(".stagewise-draw-" + UUID.randomUUID() + ".tmp"));
      try {
        try (OutputStream stream = Files.newOutputStream(temp)) {
          if (svg) {
            stream.write(SchematicPicture.svg(stage).getBytes(StandardCharsets.UTF_8));
          } else {
            SchematicPicture.png(stage, scale, stream);
          }
        }
        Files.move(temp, out, StandardCopyOption.REPLACE_EXISTING);
      } finally {
        Files.deleteIfExists(temp);
      }
      PrintWriter screen = spec.commandLine().getOut();
      screen.println("wrote " + out);
      screen.flush();
      return ExitCode.OK;
    }
  }
}
