package com.stagewise.cli;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.interchange.SolutionJson;
import com.stagewise.interchange.StageSheet;
import com.stagewise.solver.AcSolution;
import com.stagewise.solver.ExpectedVolts;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.Phasor;
import com.stagewise.solver.SectionState;
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
            + " each section and, when a test input has AC, the AC amplitude and phase, with nominal"
            + " part values and nominal device parameters; and the healthy range of each DC level"
            + " over the parts' and rails' tolerances.")
final class SolveCommand implements Callable<Integer> {
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  /** Where the output goes when the command was made without picocli ({@link QuickStart}). */
  private PrintWriter plainOut;

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

  /**
   * Returns the command for options in their plain form ({@link QuickStart}), or null when a value
   * needs picocli's conversion or message.
   */
  static SolveCommand plain(Map<String, String> options, PrintWriter out) {
    SolveCommand command = new SolveCommand();
    command.plainOut = out;
    command.stageFile = QuickStart.path(options.get("--stage"));
    command.json = options.containsKey("--json");
    return command.stageFile == null ? null : command;
  }

  @Override
  public Integer call() {
    Stage stage = StageSheet.read(stageFile);
    SolveResult result = StageSolver.solve(stage);
    if (!(result instanceof SolveResult.Solved solved)) {
      throw new InvalidInputException(stageFile.toString(), result.field(), result.problem());
    }
    Optional<AcSolution> ac = StageSolver.ac(stage, solved.primary());
    ExpectedVolts healthy = ExpectedVolts.of(stage, solved);
    PrintWriter out = spec == null ? plainOut : spec.commandLine().getOut();
    if (json) {
      out.print(SolutionJson.write(solved, ac, healthy, Reading.acMeasure(stage)));
    } else {
      out.print(table(stage, solved, ac, healthy));
    }
    out.flush();
    return ExitCode.OK;
  }

  /**
   * Returns the readable table: one row per net with its pins, expected volts, AC and (for the
   * first state) the healthy range over the tolerances.
   */
  static String table(
      Stage stage, SolveResult.Solved solved, Optional<AcSolution> ac, ExpectedVolts healthy) {
    StringBuilder text = new StringBuilder();
    // The AC column is stated in the measure of the stage's AC input (peak unless it says).
    AcMeasure measure = Reading.acMeasure(stage);
    String heading = stage.title().isEmpty() ? "Stage" : stage.title();
    text.append(heading)
        .append(stage.board().isEmpty() ? "" : " (" + stage.board() + ")")
        .append('\n');
    Map<String, List<String>> pinsOfNet = new LinkedHashMap<>();
    // Plain loops rather than lambdas: a fresh command-line JVM spins a class for each.
    for (Map.Entry<String, String> pin : stage.pinNets().entrySet()) {
      List<String> pins = pinsOfNet.get(pin.getValue());
      if (pins == null) {
        pins = new ArrayList<>();
        pinsOfNet.put(pin.getValue(), pins);
      }
      pins.add(pin.getKey());
    }
    List<OperatingPoint> points = solved.points();
    if (points.size() > 1) {
      text.append("This stage has ")
          .append(points.size())
          .append(" consistent states (positive feedback): each is a correct reading.\n");
    }
    for (int i = 0; i < points.size(); i++) {
      OperatingPoint point = points.get(i);
      boolean withAc = i == 0 && ac.isPresent();
      boolean withRange = i == 0 && healthy.solved();
      if (points.size() > 1) {
        text.append("\nState ").append(i + 1).append(":\n");
      }
      text.append('\n');
      String format =
          "%-14s %-18s %12s" + (withAc ? " %14s %10s" : "%s%s") + (withRange ? "   %s%n" : "%s%n");
      text.append(
          String.format(
                      Locale.ROOT,
                      format,
                      "net",
                      "pins",
                      "DC volts",
                      withAc
                          ? "AC " + measure.words() + " at " + number(ac.get().hz(), 0) + " Hz"
                          : "",
                      withAc ? "phase" : "",
                      withRange ? "healthy range (tolerances)" : "")
                  .stripTrailing()
              + "\n");
      for (Map.Entry<String, Double> net : point.nets().entrySet()) {
        String pins = String.join(" ", pinsOfNet.getOrDefault(net.getKey(), List.of()));
        String volts = number(net.getValue(), 4);
        String amplitude = "";
        String phase = "";
        if (withAc) {
          Phasor phasor = ac.get().nets().get(net.getKey());
          amplitude = phasor == null ? "" : number(measure.fromPeak(phasor.amplitude()), 4);
          phase =
              phasor == null || phasor.amplitude() == 0
                  ? ""
                  : number(phasor.phaseDegrees(), 1) + "°";
        }
        String range = "";
        // Ground and test inputs are set by the bench, not by the parts: no range to show.
        if (withRange
            && !net.getKey().equals(stage.ground())
            && stage.input(net.getKey()).isEmpty()) {
          range =
              number(healthy.low(net.getKey()), 4) + " … " + number(healthy.high(net.getKey()), 4);
        }
        text.append(
            String.format(Locale.ROOT, format, net.getKey(), pins, volts, amplitude, phase, range)
                    .stripTrailing()
                + "\n");
      }
      text.append("\nsections:");
      for (Map.Entry<String, SectionState> state : point.states().entrySet()) {
        text.append(' ').append(state.getKey()).append(' ').append(state.getValue().word());
      }
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
