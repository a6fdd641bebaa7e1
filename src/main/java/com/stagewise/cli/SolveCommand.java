package com.stagewise.cli;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Stage;
import com.stagewise.interchange.SolutionJson;
import com.stagewise.interchange.StageSheet;
import com.stagewise.solver.AcSolution;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.Phasor;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code stagewise solve --stage FILE [--json]}: what every net and pin of a healthy stage should
 * read.
 */
@Command(
    name = "solve",
    mixinStandardHelpOptions = true,
    description =
        "Prints what every net and op-amp pin of a healthy stage should read: DC volts, the state of"
            + " each section and, when a test input has AC, the AC amplitude and phase. Nominal part"
            + " values and nominal device parameters.")
final class SolveCommand implements Callable<Integer> {
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Option(
      names = "--stage",
      required = true,
      paramLabel = "FILE",
      description = "the stage sheet (*.stage.json)")
  Path stageFile;

  @Option(
      names = "--json",
      description = "print the solution document (format stagewise-solution) instead of a table")
  boolean json;

  @Override
  public Integer call() {
    Stage stage = StageSheet.read(stageFile);
    SolveResult result = StageSolver.solve(stage);
    String source = stageFile.toString();
    if (result instanceof SolveResult.Floating floating) {
      throw new InvalidInputException(
          source,
          "nets",
          "no DC path sets the voltage of "
              + String.join(", ", floating.nets())
              + " (expected a resistor or an output to tie it to ground, a rail or an input)");
    }
    if (result instanceof SolveResult.NoConsistentState none) {
      throw new InvalidInputException(
          source,
          "amplifiers",
          (none.section().isEmpty() ? "" : none.section() + ": ")
              + "no consistent state: "
              + none.reason());
    }
    SolveResult.Solved solved = (SolveResult.Solved) result;
    Optional<AcSolution> ac = StageSolver.ac(stage, solved.primary());
    PrintWriter out = spec.commandLine().getOut();
    if (json) {
      out.print(SolutionJson.write(solved, ac));
    } else {
      out.print(table(stage, solved, ac));
    }
    out.flush();
    return ExitCode.OK;
  }

  /** Returns the readable table: one row per net with its pins, expected volts and AC. */
  static String table(Stage stage, SolveResult.Solved solved, Optional<AcSolution> ac) {
    StringBuilder text = new StringBuilder();
    String heading = stage.title().isEmpty() ? "Stage" : stage.title();
    text.append(heading)
        .append(stage.board().isEmpty() ? "" : " (" + stage.board() + ")")
        .append('\n');
    Map<String, List<String>> pinsOfNet = new LinkedHashMap<>();
    stage
        .pinNets()
        .forEach((pin, net) -> pinsOfNet.computeIfAbsent(net, n -> new ArrayList<>()).add(pin));
    List<OperatingPoint> points = solved.points();
    if (points.size() > 1) {
      text.append("This stage has ")
          .append(points.size())
          .append(" consistent states (positive feedback): each is a correct reading.\n");
    }
    for (int i = 0; i < points.size(); i++) {
      OperatingPoint point = points.get(i);
      boolean withAc = i == 0 && ac.isPresent();
      if (points.size() > 1) {
        text.append("\nState ").append(i + 1).append(":\n");
      }
      text.append('\n');
      String format = withAc ? "%-14s %-18s %12s %14s %10s%n" : "%-14s %-18s %12s%n";
      if (withAc) {
        text.append(
            String.format(
                Locale.ROOT,
                format,
                "net",
                "pins",
                "DC volts",
                "AC at " + number(ac.get().hz(), 0) + " Hz",
                "phase"));
      } else {
        text.append(String.format(Locale.ROOT, format, "net", "pins", "DC volts"));
      }
      for (Map.Entry<String, Double> net : point.nets().entrySet()) {
        String pins = String.join(" ", pinsOfNet.getOrDefault(net.getKey(), List.of()));
        String volts = number(net.getValue(), 4);
        if (withAc) {
          Phasor phasor = ac.get().nets().get(net.getKey());
          String amplitude = phasor == null ? "" : number(phasor.amplitude(), 4);
          String phase =
              phasor == null || phasor.amplitude() == 0
                  ? ""
                  : number(phasor.phaseDegrees(), 1) + "°";
          text.append(
              String.format(Locale.ROOT, format, net.getKey(), pins, volts, amplitude, phase));
        } else {
          text.append(String.format(Locale.ROOT, format, net.getKey(), pins, volts));
        }
      }
      text.append("\nsections:");
      point
          .states()
          .forEach((ref, state) -> text.append(' ').append(ref).append(' ').append(state.word()));
      text.append('\n');
    }
    return text.toString();
  }

  private static String number(double value, int decimals) {
    String printed = String.format(Locale.ROOT, "%." + decimals + "f", value);
    // A value that rounds to zero prints without a minus sign.
    return printed.matches("-0\\.?0*") ? printed.substring(1) : printed;
  }
}
