package com.stagewise.cli;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.Observation;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.interchange.DiagnosisJson;
import com.stagewise.interchange.ReadingsSheet;
import com.stagewise.interchange.StageSheet;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code stagewise diagnose --stage S --readings R [--json] [--top N]}. */
@Command(
    name = "diagnose",
    mixinStandardHelpOptions = true,
    description = "Rank the faults that explain a set of readings, and say what to probe next.")
final class DiagnoseCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;

  @Option(
      names = "--stage",
      required = true,
      paramLabel = "FILE",
      description = "the stage sheet (*.stage.json)")
  Path stageFile;

  @Option(
      names = "--readings",
      required = true,
      paramLabel = "FILE",
      description = "the readings (*.readings.json)")
  Path readingsFile;

  @Option(names = "--json", description = "print the diagnosis document instead of a table")
  boolean json;

  @Option(
      names = "--top",
      paramLabel = "N",
      defaultValue = "" + Diagnoser.DEFAULT_TOP,
      description = "list at most N suspects (default ${DEFAULT-VALUE})")
  int top;

  @Override
  public Integer call() {
    if (top < 1) {
      throw new InvalidInputException(
          "command line", "--top", "the number of suspects (" + top + ") must be 1 or more");
    }
    Stage stage = StageSheet.read(stageFile);
    ReadingSet readings = ReadingsSheet.read(readingsFile, stage);
    Diagnosis diagnosis;
    try {
      diagnosis = Diagnoser.of(stage).diagnose(readings, top);
    } catch (InvalidInputException e) {
      throw e.inSource(readingsFile.toString());
    }
    PrintWriter out = spec.commandLine().getOut();
    if (json) {
      out.print(DiagnosisJson.write(diagnosis));
    } else {
      print(out, diagnosis);
    }
    out.flush();
    return ExitCode.OK;
  }

  static void print(PrintWriter out, Diagnosis d) {
    out.println("Verdict: " + d.verdict().word());
    if (!d.observations().isEmpty()) {
      out.println();
      out.println("What the readings show:");
      for (Observation o : d.observations()) {
        out.printf(Locale.ROOT, "  %-10s %s%n", o.at(), o.text());
      }
    }
    out.println();
    out.println("Suspects:");
    int rank = 1;
    for (Suspect s : d.suspects()) {
      int bar = (int) Math.round(s.probability() * 20);
      out.printf(
          Locale.ROOT,
          "  %2d. %-18s %5.1f %%  %-20s%s%n",
          rank++,
          s.fault(),
          100 * s.probability(),
          "#".repeat(bar),
          s.group().size() > 1
              ? "  cannot yet be told apart from: "
                  + String.join(", ", s.group().stream().filter(g -> !g.equals(s.fault())).toList())
              : "");
      out.println("      " + s.why());
    }
    if (!d.nextProbes().isEmpty()) {
      out.println();
      out.println("Probe next:");
      for (ProbeAdvice p : d.nextProbes()) {
        String kind =
            p.kind().word()
                + (p.hz() > 0 ? String.format(Locale.ROOT, " at %s Hz", trim(p.hz())) : "")
                + (p.to().isEmpty() ? "" : " to " + p.to());
        out.printf(Locale.ROOT, "  %-10s %-14s %.2f bits  %s%n", p.at(), kind, p.bits(), p.why());
      }
    }
    if (!d.confirmingCheck().isEmpty()) {
      out.println();
      out.println("To confirm the first suspect: " + d.confirmingCheck());
    }
    for (String note : d.notes()) {
      out.println();
      out.println("Note: " + note);
    }
  }

  private static String trim(double hz) {
    return hz == Math.rint(hz) ? Long.toString((long) hz) : Double.toString(hz);
  }
}
