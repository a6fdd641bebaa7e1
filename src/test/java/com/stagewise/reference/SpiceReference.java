package com.stagewise.reference;

import com.stagewise.solver.Conditions;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

/**
 * Regenerates the stored reference files: solves every checked stage with ngspice (ngspice 39,
 * Debian package, as reference simulator) and writes its DC net and pin voltages and AC phasors to
 * {@code src/test/resources/reference/spice/NAME.json}. Run by {@code
 * src/scripts/spice-reference.sh} from the project root; stale files of stages that no longer exist
 * are removed.
 */
public final class SpiceReference {
  private SpiceReference() {}

  /** Writes every reference file; exits with status 1 if ngspice fails on a stage. */
  public static void main(String[] args) throws IOException {
    if (!Ngspice.available()) {
      System.err.println(Ngspice.MISSING);
      System.exit(1);
    }
    List<String> written = new ArrayList<>();
    int failed = 0;
    for (ReferenceStages.Named named : ReferenceStages.all()) {
      FlatCircuit flat = FlatCircuit.of(named.stage(), Conditions.NOMINAL);
      List<Ngspice.Solved> solved = SpiceSolve.states(flat, named.stage().title());
      if (solved.isEmpty()) {
        System.err.println(named.source().name() + ": ngspice found no solution");
        failed++;
        continue;
      }
      String name = named.source().name() + ".json";
      ReferenceFiles.write(
          ReferenceFiles.FOLDER.resolve(name),
          ReferenceFiles.toJson(
              named.source(), named.stage().title(), SpiceComparison.of(flat, solved)));
      written.add(name);
    }
    try (Stream<Path> files = Files.list(ReferenceFiles.FOLDER)) {
      for (Path file : files.toList()) {
        if (!written.contains(file.getFileName().toString())) {
          Files.delete(file);
        }
      }
    }
    System.out.println("wrote " + written.size() + " reference files to " + ReferenceFiles.FOLDER);
    if (failed > 0) {
      System.exit(1);
    }
  }
}
