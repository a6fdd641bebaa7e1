package com.stagewise.interchange;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Templates;
import com.stagewise.solver.AcSolution;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class SolutionJsonTest {
  static final ObjectMapper MAPPER = new ObjectMapper();

  static JsonNode solve(Stage stage) throws Exception {
    SolveResult.Solved solved = (SolveResult.Solved) StageSolver.solve(stage);
    Optional<AcSolution> ac = StageSolver.ac(stage, solved.primary());
    return MAPPER.readTree(SolutionJson.write(solved, ac));
  }

  static java.util.stream.Stream<Path> stageFiles() throws Exception {
    return DemoLibraryTest.stageFiles();
  }

  /** Checks the keys of the solution contract (design notes, "Solution"). */
  static void assertContract(JsonNode root, Stage stage) {
    assertThat(root.get("format").asText()).isEqualTo("stagewise-solution");
    assertThat(root.get("version").asInt()).isEqualTo(1);
    JsonNode dc = root.get("dc");
    for (String net : stage.nets()) {
      assertThat(dc.get("nets").get(net)).as(net).isNotNull();
      assertThat(dc.get("nets").get(net).isNumber()).isTrue();
    }
    for (String pin : stage.pinNets().keySet()) {
      assertThat(dc.get("pins").get(pin).isNumber()).as(pin).isTrue();
    }
    assertThat(root.get("sections")).hasSize(stage.amplifiers().size());
    for (JsonNode section : root.get("sections")) {
      assertThat(section.get("state").asText()).isIn("linear", "high", "low");
      assertThat(stage.amplifier(section.get("ref").asText())).isPresent();
    }
    boolean hasAc = stage.inputs().stream().anyMatch(i -> i.hasAc());
    assertThat(root.has("ac")).isEqualTo(hasAc);
    if (hasAc) {
      assertThat(root.get("ac").get("hz").isNumber()).isTrue();
      root.get("ac")
          .get("nets")
          .forEach(
              p -> {
                assertThat(p.get("amplitude").isNumber()).isTrue();
                assertThat(p.get("phaseDegrees").isNumber()).isTrue();
              });
    }
  }

  @ParameterizedTest
  @MethodSource("stageFiles")
  void write_everyDemoSheet_keepsTheContract(Path file) throws Exception {
    Stage stage = StageSheet.read(file);
    assertContract(solve(stage), stage);
  }

  @Test
  void write_inverting_givesSolverNumbers() throws Exception {
    Stage stage = Templates.named("inverting").build(Map.of("r1", "10k", "r2", "47k", "vin", "1"));
    JsonNode root = solve(stage);
    // Closed-form ideal op-amp result -R2/R1 x 1 V = -4.7 V, within finite-gain error.
    assertThat(root.at("/dc/nets/OUT").asDouble()).isBetween(-4.701, -4.699);
    assertThat(root.at("/dc/pins/U1.1").asDouble()).isEqualTo(root.at("/dc/nets/OUT").asDouble());
    assertThat(root.at("/dc/nets/VCC").isIntegralNumber()).isTrue();
    assertThat(root.at("/ac/nets/OUT/amplitude").asDouble()).isBetween(0.4699, 0.4701);
    assertThat(root.at("/sections/0/state").asText()).isEqualTo("linear");
    assertThat(root.has("alternatives")).isFalse();
  }

  @Test
  void write_schmittTrigger_listsTheSecondStateAsAlternative() throws Exception {
    Stage stage = Templates.named("inverting-schmitt-trigger").build();
    JsonNode root = solve(stage);
    assertContract(root, stage);
    assertThat(root.get("alternatives")).hasSize(1);
    JsonNode other = root.get("alternatives").get(0);
    assertThat(other.at("/sections/0/state").asText())
        .isNotEqualTo(root.at("/sections/0/state").asText());
    assertThat(other.at("/dc/nets/OUT").asDouble())
        .isEqualTo(-root.at("/dc/nets/OUT").asDouble(), org.assertj.core.data.Offset.offset(1e-6));
  }

  @Test
  void number_printsPlainDecimals() {
    assertThat(JsonText.oneLine(JsonText.number(0.0000235))).isEqualTo("0.0000235");
    assertThat(JsonText.oneLine(JsonText.number(15.0))).isEqualTo("15");
    assertThat(JsonText.oneLine(JsonText.number(-4.6998))).isEqualTo("-4.6998");
  }
}
