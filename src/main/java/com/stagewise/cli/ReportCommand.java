package com.stagewise.cli;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.cli.history.Phrases;
import com.stagewise.history.DatabaseLocation;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.sqlite.SqliteHistory;
import com.stagewise.report.CaseReport;
import com.stagewise.report.ReportFile;
import java.io.IOException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code stagewise report --case ID --out FILE.pdf}: a printable repair report of one case. */
@Command(
    name = "report",
    mixinStandardHelpOptions = true,
    description =
        "Writes a PDF repair report of one case from the history: the unit, the case, the safety"
            + " caution, the readings, the suspects as computed at the time, the actions, the"
            + " confirmed fault and the notes. Times are printed in UTC.",
    footer =
        "An existing FILE.pdf is never replaced unless --force is given. The report is written to a"
            + " temporary file beside it first, so a failed run leaves no half-written report.")
final class ReportCommand implements Callable<Integer> {
  private static final String SOURCE = "command line";

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Option(
      names = "--case",
      required = true,
      paramLabel = "ID",
      description = "The case id (or its first 4 or more characters).")
  String caseId;

  @Option(
      names = "--out",
      required = true,
      paramLabel = "FILE.pdf",
      description = "The PDF file to write; its folder must exist.")
  Path out;

  @Option(names = "--force", description = "Replace FILE.pdf if it exists already.")
  boolean force;

  @Option(
      names = "--db",
      paramLabel = "FILE",
      description = "The history database (default: $STAGEWISE_DB, else the data folder).")
  Path db;

  /** Where the report's "generated" time comes from. */
  Clock clock = Clock.systemUTC();

  @Override
  public Integer call() {
    Path target = checkTarget(out, force);
    Path database = DatabaseLocation.resolve(db);
    if (!Files.isRegularFile(database)) {
      // Opening would create an empty history; a report only reads one.
      throw new InvalidInputException(
          database.toString(),
          "--db",
          "no history database here; give the right file with --db or STAGEWISE_DB");
    }
    CaseReport report;
    try (HistoryStore store = SqliteHistory.openReadOnly(database)) {
      report =
          CaseReport.read(
              store, store.cases().resolveId(caseId), clock.instant(), Casework.version());
    }
    int pages = write(report, target, force);
    spec.commandLine()
        .getOut()
        .println(
            "Repair report of case "
                + HistoryStore.shortId(report.caseFile().repairCase().id())
                + " (unit "
                + report.unit().serial()
                + ", "
                + Phrases.plural(pages, "page")
                + ") written to "
                + target
                + ".");
    return ExitCode.OK;
  }

  /**
   * Returns the output file, made absolute, after checking that its folder exists and that it is
   * not a folder, nor an existing file unless {@code force}.
   */
  static Path checkTarget(Path file, boolean force) {
    Path target = file.toAbsolutePath().normalize();
    Path folder = target.getParent();
    if (folder == null || target.getFileName() == null) {
      throw new InvalidInputException(
          SOURCE, "--out", "expected a file name such as report.pdf, got '" + file + "'");
    }
    if (!Files.isDirectory(folder)) {
      throw new InvalidInputException(
          SOURCE,
          "--out",
          (Files.exists(folder)
                  ? "'" + folder + "' is not a folder"
                  : "the folder '" + folder + "' does not exist")
              + "; create it first or choose another place for '"
              + target.getFileName()
              + "'");
    }
    if (Files.isDirectory(target)) {
      throw new InvalidInputException(
          SOURCE, "--out", "'" + target + "' is a folder; give a file name such as report.pdf");
    }
    if (Files.exists(target) && !force) {
      throw new InvalidInputException(
          SOURCE,
          "--out",
          "'" + target + "' exists already; give --force to replace it, or choose another name");
    }
    if (!Files.isWritable(folder)) {
      throw new InvalidInputException(
          SOURCE, "--out", "cannot write in the folder '" + folder + "'");
    }
    return target;
  }

  /** Writes the report whole or not at all (see {@link ReportFile}). */
  private static int write(CaseReport report, Path target, boolean force) {
    try {
      return ReportFile.write(report, target, force);
    } catch (FileAlreadyExistsException e) {
      throw new InvalidInputException(
          SOURCE,
          "--out",
          "'" + target + "' exists already; give --force to replace it, or choose another name");
    } catch (IOException e) {
      throw new InvalidInputException(
          SOURCE,
          "--out",
          "cannot write in the folder '" + target.getParent() + "': " + e.getMessage());
    }
  }
}
