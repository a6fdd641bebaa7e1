package com.stagewise.cli;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.Observation;
import com.stagewise.diagnosis.ProbeAdvice;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.interchange.BatchLine;
import com.stagewise.interchange.DiagnosisJson;
import com.stagewise.interchange.ReadingsSheet;
import com.stagewise.interchange.StageSheet;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code stagewise diagnose --stage S --readings R [--json] [--top N]}, or {@code diagnose --batch
 * FILE.jsonl} for many cases in one run.
 */
@Command(
    name = "diagnose",
    mixinStandardHelpOptions = true,
    description = "Rank the faults that explain a set of readings, and say what to probe next.")
final class DiagnoseCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;

  /** Where the output goes when the command was made without picocli ({@link QuickStart}). */
  private PrintWriter plainOut;

  @Option(names = "--stage", paramLabel = "FILE", description = "the stage sheet (*.stage.json)")
  Path stageFile;

  @Option(names = "--readings", paramLabel = "FILE", description = "the readings (*.readings.json)")
  Path readingsFile;

  @Option(
      names = "--batch",
      paramLabel = "FILE",
      description =
          "diagnose many cases: one {\"stage\": PATH-or-sheet, \"readings\": PATH-or-readings}"
              + " a line (paths relative to FILE's folder); prints one diagnosis JSON a line, or"
              + " {\"error\": ...} for a bad line, and exits 2 if any line was bad")
  Path batchFile;

  @Option(names = "--json", description = "print the diagnosis document instead of a table")
  boolean json;

  @Option(
      names = "--top",
      paramLabel = "N",
      defaultValue = "" + Diagnoser.DEFAULT_TOP,
      description = "list at most N suspects (default ${DEFAULT-VALUE})")
  int top;

  @Option(
      names = "--mains-powered",
      description =
          "the unit is mains-powered: when a power-off (ohms) check tells the leading suspects"
              + " apart, it is proposed first")
  boolean mainsPowered;

  /**
   * Returns the command for options in their plain form ({@link QuickStart}), or null when a value
   * needs picocli's conversion or message.
   */
  static DiagnoseCommand plain(Map<String, String> options, PrintWriter out) {
    DiagnoseCommand command = new DiagnoseCommand();
    command.plainOut = out;
    command.stageFile = QuickStart.path(options.get("--stage"));
    command.readingsFile = QuickStart.path(options.get("--readings"));
    command.batchFile = QuickStart.path(options.get("--batch"));
    command.top =
        options.containsKey("--top")
            ? QuickStart.count(options.get("--top"))
            : Diagnoser.DEFAULT_TOP;
    command.json = options.containsKey("--json");
    command.mainsPowered = options.containsKey("--mains-powered");
    boolean converted =
        (command.stageFile != null || !options.containsKey("--stage"))
            && (command.readingsFile != null || !options.containsKey("--readings"))
            && (command.batchFile != null || !options.containsKey("--batch"))
            && command.top >= 0;
    return converted ? command : null;
  }

  private PrintWriter out() {
    return spec == null ? plainOut : spec.commandLine().getOut();
  }

  @Override
  public Integer call() {
    if (top < 1) {
      throw new InvalidInputException(
          "command line", "--top", "the number of suspects (" + top + ") must be 1 or more");
    }
    if (batchFile != null) {
      if (stageFile != null || readingsFile != null) {
        throw new InvalidInputException(
            "command line", "--batch", "give either --batch or --stage and --readings, not both");
      }
      return batch();
    }
    if (stageFile == null || readingsFile == null) {
      throw new InvalidInputException(
          "command line",
          stageFile == null ? "--stage" : "--readings",
          "a file is needed (--stage FILE --readings FILE), or --batch FILE");
    }
    Stage stage = StageSheet.read(stageFile);
    ReadingSet readings = ReadingsSheet.read(readingsFile, stage);
    Diagnosis diagnosis;
    try {
      diagnosis = Diagnoser.of(stage).mainsPowered(mainsPowered).diagnose(readings, top);
    } catch (InvalidInputException e) {
      throw e.inSource(readingsFile.toString());
    }
    PrintWriter out = out();
    if (json) {
      out.print(DiagnosisJson.write(diagnosis));
    } else {
      print(out, diagnosis);
    }
    out.flush();
    return ExitCode.OK;
  }

  /**
   * Diagnoses every line of the batch file in this one process; a diagnoser is kept per stage, so
   * that many cases on one stage compute its predictions once.
   */
  private int batch() {
    List<String> lines;
    try {
      lines = Files.readAllLines(batchFile, StandardCharsets.UTF_8);
    } catch (NoSuchFileException e) {
      throw new InvalidInputException(batchFile.toString(), "", "the batch file does not exist");
    } catch (IOException | UncheckedIOException e) {
      throw new InvalidInputException(
          batchFile.toString(),
          "",
          "the batch file cannot be read as UTF-8 text: " + e.getMessage());
    }
    Path folder = batchFile.toAbsolutePath().getParent();
    Map<String, Stage> stages = new HashMap<>();
    Map<Stage, Diagnoser> diagnosers = new HashMap<>();
    PrintWriter out = out();
    boolean bad = false;
    for (int i = 0; i < lines.size(); i++) {
      String line = lines.get(i);
      if (line.isBlank()) {
        continue;
      }
      String source = batchFile + " line " + (i + 1);
      try {
        BatchLine read = BatchLine.read(line, source, folder, stages);
        Diagnoser diagnoser = diagnosers.get(read.stage());
        if (diagnoser == null) {
          diagnoser = Diagnoser.of(read.stage());
          diagnosers.put(read.stage(), diagnoser);
        }
        Diagnosis diagnosis;
        try {
          diagnosis = diagnoser.diagnose(read.readings(), top);
        } catch (InvalidInputException e) {
          throw e.inSource(read.readingsSource());
        }
        out.println(DiagnosisJson.writeLine(diagnosis));
      } catch (InvalidInputException e) {
        bad = true;
        out.println(DiagnosisJson.errorLine(e.getMessage()));
      }
    }
    out.flush();
    return bad ? ExitCode.BAD_INPUT : ExitCode.OK;
  }

  static void print(PrintWriter out, Diagnosis d) {
    out.println("Verdict: " + d.verdict().word());
    if (!d.observations().isEmpty()) {
      out.println();
      out.println("What the readings show:");
      for (Observation o : d.observations()) {
        out.println("  " + TableText.left(o.at(), 10) + " " + o.text());
      }
    }
    out.println();
    out.println("Suspects:");
    int rank = 1;
    for (Suspect s : d.suspects()) {
      int bar = (int) Math.round(s.probability() * 20);
      out.println(
          "  "
              + TableText.right(rank++, 2)
              + ". "
              + TableText.left(s.fault(), 18)
              + " "
              + TableText.right(TableText.fixed(100 * s.probability(), 1), 5)
              + " %  "
              + TableText.left("#".repeat(bar), 20)
              + (s.group().size() > 1
                  ? "  cannot yet be told apart from: " + String.join(", ", others(s))
                  : ""));
      out.println("      " + s.why());
    }
    if (!d.nextProbes().isEmpty()) {
      out.println();
      out.println("Probe next:");
      for (ProbeAdvice p : d.nextProbes()) {
        String kind =
            p.kind().word()
                + (p.kind() == Reading.Kind.AC ? " " + p.measure().word() : "")
                + (p.hz() > 0 ? " at " + trim(p.hz()) + " Hz" : "")
                + (p.to().isEmpty() ? "" : " to " + p.to());
        out.println(
            "  "
                + TableText.left(p.at(), 10)
                + " "
                + TableText.left(kind, 14)
                + " "
                + TableText.fixed(p.bits(), 2)
                + " bits  "
                + p.why());
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

  /** The faults of the suspect's group other than its own, in the group's order. */
  private static List<String> others(Suspect s) {
    List<String> others = new ArrayList<>();
    for (String g : s.group()) {
      if (!g.equals(s.fault())) {
        others.add(g);
      }
    }
    return others;
  }

  private static String trim(double hz) {
    return hz == Math.rint(hz) ? Long.toString((long) hz) : Double.toString(hz);
  }
}
