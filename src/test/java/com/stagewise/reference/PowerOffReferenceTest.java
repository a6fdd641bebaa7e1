package com.stagewise.reference;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Our power-off (ohms) prediction against ngspice 39 (Debian package, as reference simulator):
 * every template and demo sheet, every pair of nets (and a lifted pin against every net), every
 * fault of the catalogue, within 0.1 %, OL where ngspice finds no connection. Stored answers (made
 * by {@code src/scripts/spice-reference.sh ohms}) and a live rerun.
 */
class PowerOffReferenceTest {

  static Stream<Path> storedFiles() throws IOException {
    try (Stream<Path> files = Files.list(PowerOffReference.FOLDER)) {
      return files.filter(f -> f.toString().endsWith(".json")).sorted().toList().stream();
    }
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("storedFiles")
  void prediction_agreesWithStoredNgspiceAnswers(Path file) throws IOException {
    ReferenceStages.Source source = PowerOffReference.source(file);
    List<SpicePowerOff.Answer> answers = PowerOffReference.read(file);
    assertThat(answers.stream().mapToInt(a -> a.ohms().length).sum()).isPositive();
    assertThat(PowerOffReference.mismatches(ReferenceStages.resolve(source), answers))
        .as("disagreements with ngspice 39 for %s", file.getFileName())
        .isEmpty();
  }

  @Test
  void everyTemplateAndSheet_hasStoredAnswers() throws IOException {
    List<String> stored = storedFiles().map(f -> f.getFileName().toString()).toList();
    List<String> missing =
        PowerOffReference.stages().stream()
            .map(n -> n.source().name() + ".json")
            .filter(name -> !stored.contains(name))
            .toList();
    assertThat(missing)
        .as("stages without stored power-off answers: run src/scripts/spice-reference.sh ohms")
        .isEmpty();
  }

  @Nested
  class Live {
    @BeforeAll
    static void ngspiceIsInstalled() {
      assertTrue(Ngspice.available(), Ngspice.MISSING);
    }

    static Stream<ReferenceStages.Named> stages() {
      return PowerOffReference.stages().stream();
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("stages")
    void prediction_agreesWithLiveNgspice(ReferenceStages.Named named) {
      List<SpicePowerOff.Answer> answers = SpicePowerOff.solve(named.stage());
      assertThat(answers).hasSameSizeAs(FaultList.of(named.stage()));
      assertThat(PowerOffReference.mismatches(named.stage(), answers))
          .as("disagreements with live ngspice 39 for %s", named.source().name())
          .isEmpty();
    }
  }
}
