package com.stagewise.diagnosis;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.ReadingSet;
import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/**
 * Writes every diagnosis of the fault truth set in full (every field of every suspect and next
 * probe, numbers as {@link Double#toString} gives them, which tells any two doubles apart), one
 * line a diagnosis, so that two builds' files can be compared with {@code cmp} or {@code diff}.
 *
 * <p>Not a test: a tool for speed work that is meant to change no result. Run it with one build's
 * classes, then with the other's, on the same test classes: {@code java -cp
 * target/test-classes:CLASSES:DEPS com.stagewise.diagnosis.TruthDigest OUT}. Each stage's cases run
 * through one diagnoser in order (DC, DC and AC, partial, DC and ohms, partial and ohms, then no
 * readings), so kept predictions and likelihoods are used as the app uses them.
 */
public final class TruthDigest {
  private TruthDigest() {}

  /** Writes the digest to the file given as the first argument. */
  public static void main(String[] args) throws IOException {
    try (Writer out = Files.newBufferedWriter(Path.of(args[0]), StandardCharsets.UTF_8)) {
      int count = 0;
      for (TruthCases.StageCases stage : TruthCases.load()) {
        Diagnoser diagnoser = Diagnoser.of(stage.stage());
        Diagnoser mains = diagnoser.mainsPowered(true);
        List<TruthCases.Case> cases = stage.cases();
        MeterSpec meter = stage.meter();
        for (int i = 0; i < cases.size(); i++) {
          TruthCases.Case c = cases.get(i);
          String key = stage.name() + "#" + i + "/";
          count += write(out, key + "dc", diagnoser, c.full(meter));
          if (!c.ac().isEmpty()) {
            count += write(out, key + "dc+ac", diagnoser, c.fullWithAc(meter));
          }
          ReadingSet partial = c.partial(meter);
          if (!partial.readings().isEmpty()) {
            count += write(out, key + "partial", diagnoser, partial);
            count += write(out, key + "partial/mains", mains, partial);
          }
          if (!c.ohms().isEmpty()) {
            count += write(out, key + "dc+ohms", diagnoser, c.fullWithOhms(meter));
            count += write(out, key + "partial+ohms", diagnoser, c.partialWithOhms(meter));
          }
        }
        count += write(out, stage.name() + "/none", diagnoser, new ReadingSet(meter, List.of()));
      }
      System.out.println(count + " diagnoses written to " + args[0]);
    }
  }

  private static int write(Writer out, String key, Diagnoser diagnoser, ReadingSet readings)
      throws IOException {
    out.write(key + "\t" + diagnoser.diagnose(readings) + "\n");
    return 1;
  }
}
