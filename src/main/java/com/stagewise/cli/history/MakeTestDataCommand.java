package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.demo.SyntheticHistory;
import java.io.PrintWriter;
import java.util.Locale;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history make-test-data}: generated cases for the speed benchmark. */
@Command(
    name = "make-test-data",
    mixinStandardHelpOptions = true,
    description = "Fill a history with generated cases, for the speed benchmark.")
final class MakeTestDataCommand extends HistorySubcommand {
  @Option(
      names = "--cases",
      defaultValue = "100000",
      description = "Cases to generate (default ${DEFAULT-VALUE}).")
  int cases;

  @Option(
      names = "--readings-per-case",
      defaultValue = "10",
      description = "Readings per case (default ${DEFAULT-VALUE}).")
  int readingsPerCase;

  @Option(
      names = "--seed",
      defaultValue = "1",
      description = "Random seed (default ${DEFAULT-VALUE}).")
  long seed;

  @Override
  void run(Casework work, PrintWriter out) {
    if (cases < 1 || readingsPerCase < 0) {
      throw new InvalidInputException(
          "command line", "--cases", "expected 1 or more cases and 0 or more readings per case");
    }
    long started = System.nanoTime();
    // Imports of 2,000 cases each (a benchmark's data, not a technician's work).
    SyntheticHistory.fill(work.history(), cases, readingsPerCase, seed, 2_000);
    double seconds = (System.nanoTime() - started) / 1e9;
    out.println(
        String.format(
            Locale.ROOT,
            "Generated %d cases with %d readings each in %.1f s.",
            cases,
            readingsPerCase,
            seconds));
  }
}
