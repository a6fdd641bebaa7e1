package com.stagewise.reference;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Our solver against stored answers of ngspice 39 (Debian package, as reference simulator): every
 * template's default stage, every demo sheet and the hand-built stages, DC within 1 mV + 0.01 %, AC
 * amplitudes within 0.1 %. The stored files are made by {@code src/scripts/spice-reference.sh}.
 */
class SpiceReferenceTest {

  static Stream<Path> storedFiles() throws IOException {
    try (Stream<Path> files = Files.list(ReferenceFiles.FOLDER)) {
      return files.filter(f -> f.toString().endsWith(".json")).sorted().toList().stream();
    }
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("storedFiles")
  void solver_agreesWithStoredNgspiceAnswer(Path file) throws IOException {
    ReferenceFiles.Stored stored = ReferenceFiles.read(file);
    List<String> problems =
        SpiceComparison.mismatches(ReferenceStages.resolve(stored.source()), stored.expected());
    assertThat(problems).as("disagreements with ngspice 39 for %s", file.getFileName()).isEmpty();
  }

  @Test
  void everyCheckedStage_hasAStoredAnswer() throws IOException {
    List<String> stored = storedFiles().map(f -> f.getFileName().toString()).toList();
    List<String> missing =
        ReferenceStages.all().stream()
            .map(n -> n.source().name() + ".json")
            .filter(name -> !stored.contains(name))
            .toList();
    assertThat(missing)
        .as(
            "stages without a stored ngspice answer: run src/scripts/spice-reference.sh to regenerate")
        .isEmpty();
  }
}
