package com.stagewise.interchange;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.StageRules;
import com.stagewise.circuit.template.Templates;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Keeps the shipped demo library ({@code data/stages}, {@code data/readings}) sound and in step.
 */
class DemoLibraryTest {
  static final Path STAGES = Path.of("data", "stages");
  static final Path READINGS = Path.of("data", "readings");

  static Stream<Path> stageFiles() throws IOException {
    try (Stream<Path> files = Files.list(STAGES)) {
      return files
          .filter(f -> f.getFileName().toString().endsWith(StageSheet.SUFFIX))
          .sorted()
          .toList()
          .stream();
    }
  }

  static Stream<Path> readingsFiles() throws IOException {
    try (Stream<Path> files = Files.list(READINGS)) {
      return files
          .filter(f -> f.getFileName().toString().endsWith(ReadingsSheet.SUFFIX))
          .sorted()
          .toList()
          .stream();
    }
  }

  /** Returns the stage sheet a readings file belongs to: the name up to the first dot. */
  static Path stageOf(Path readings) {
    String name = readings.getFileName().toString();
    return STAGES.resolve(name.substring(0, name.indexOf('.')) + StageSheet.SUFFIX);
  }

  @Test
  void library_hasOneSheetPerTemplate() {
    assertThat(DemoLibrary.entries())
        .extracting(DemoLibrary.Entry::template)
        .containsExactlyInAnyOrderElementsOf(Templates.all().stream().map(t -> t.name()).toList());
  }

  @Test
  void everyEntry_isWrittenInDataStagesAsGenerated() throws IOException {
    for (DemoLibrary.Entry entry : DemoLibrary.entries()) {
      Path file = STAGES.resolve(entry.file());
      assertThat(file).as("run DemoLibrary to write %s", file).exists();
      assertThat(Files.readString(file, StandardCharsets.UTF_8))
          .as("%s is out of step with DemoLibrary: run it again", file)
          .isEqualTo(StageSheet.write(entry.build()));
    }
  }

  @Test
  void everySheet_comesFromAnEntry() throws IOException {
    List<String> known =
        new java.util.ArrayList<>(
            DemoLibrary.entries().stream().map(DemoLibrary.Entry::file).toList());
    known.addAll(DemoLibrary.HAND_WRITTEN);
    assertThat(stageFiles().map(f -> f.getFileName().toString())).allMatch(known::contains);
  }

  @Test
  void everyHandWrittenSheet_isThereInTheFormTheProgramWrites() throws IOException {
    for (String name : DemoLibrary.HAND_WRITTEN) {
      Path file = STAGES.resolve(name);
      assertThat(Files.readString(file, StandardCharsets.UTF_8))
          .as("%s: keep it as StageSheet.write prints it", file)
          .isEqualTo(StageSheet.write(StageSheet.read(file)));
    }
  }

  @Test
  void chainSheet_isAWholeChannelOverTwoQuadPackages() {
    Stage chain = StageSheet.read(STAGES.resolve(DemoLibrary.HAND_WRITTEN.get(0)));
    // The demo chain the diagnosis is judged on: at least five sections over two quad packages,
    // each section after the first fed by the one before.
    assertThat(chain.amplifiers()).hasSizeGreaterThanOrEqualTo(5);
    assertThat(chain.packages()).hasSize(2);
    assertThat(chain.packages())
        .allMatch(p -> chain.packageType(p).orElseThrow() == PackageType.QUAD_14);
    List<String> order = com.stagewise.diagnosis.SignalChain.of(chain).sections();
    for (int i = 1; i < order.size(); i++) {
      Amplifier before = chain.amplifier(order.get(i - 1)).orElseThrow();
      Amplifier next = chain.amplifier(order.get(i)).orElseThrow();
      boolean fed =
          next.inPlus().equals(before.out())
              || chain.parts().stream()
                  .anyMatch(
                      p ->
                          p.touches(before.out())
                              && (p.touches(next.inMinus()) || p.touches(next.inPlus())));
      assertThat(fed).as("%s feeds %s", before.ref(), next.ref()).isTrue();
    }
  }

  @ParameterizedTest
  @MethodSource("stageFiles")
  void everySheet_parsesToASoundStage(Path file) {
    Stage stage = StageSheet.read(file);
    assertThat(StageRules.problems(stage)).isEmpty();
    assertThat(stage.board()).isNotBlank();
  }

  @Test
  void readingsFolder_hasDemoReadings() throws IOException {
    assertThat(readingsFiles()).hasSizeGreaterThanOrEqualTo(3);
  }

  @ParameterizedTest
  @MethodSource("readingsFiles")
  void everyReadingsFile_parsesAgainstItsStage(Path file) {
    assertThat(stageOf(file)).exists();
    ReadingSet set = ReadingsSheet.read(file, StageSheet.read(stageOf(file)));
    assertThat(set.readings()).isNotEmpty();
  }
}
