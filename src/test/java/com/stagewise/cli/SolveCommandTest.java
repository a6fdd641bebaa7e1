package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

class SolveCommandTest {
  private static final String LINE_DRIVER =
      Path.of("data", "stages", "larkspur-sm8-line-driver.stage.json").toString();

  // Closed form of the inverting amplifier (textbook): OUT = -1 V × R15/R14 = -4.7 V; with 1 %
  // parts, one at a time, the extremes come from R14 at ∓1 %: -4.7/0.99 and -4.7/1.01, each
  // widened by the 5 mV offset margin of the healthy range.
  private static final double LOW = -4.7 / 0.99 - 0.005;
  private static final double HIGH = -4.7 / 1.01 + 0.005;

  @Test
  void table_printsTheHealthyRangeOfEachSolvedNet() {
    StagewiseCommandTest.Run run = StagewiseCommandTest.run("solve", "--stage", LINE_DRIVER);
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    assertThat(run.out()).contains("healthy range (tolerances)");
    assertThat(run.out())
        .containsPattern(
            "OUT +U3\\.1 +-4\\.699\\d +0\\.4700 +180\\.0° +-4\\.75\\d\\d … -4\\.64\\d\\d");
    // Rails: 15 V ± 5 % (the sheet's tolerance) and the margin.
    assertThat(run.out()).containsPattern("\\+15V +U3\\.8 +15\\.0000 .* 14\\.2450 … 15\\.7550");
  }

  @Test
  void json_addsHealthyRanges_andKeepsEveryContractKey() throws Exception {
    StagewiseCommandTest.Run run =
        StagewiseCommandTest.run("solve", "--stage", LINE_DRIVER, "--json");
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    JsonNode root = new ObjectMapper().readTree(run.out());
    assertThat(root.get("format").asText()).isEqualTo("stagewise-solution");
    assertThat(root.get("version").asInt()).isEqualTo(1);
    assertThat(root.has("dc") && root.has("sections") && root.has("ac")).isTrue();
    JsonNode out = root.get("healthy").get("nets").get("OUT");
    assertThat(out.get("low").asDouble()).isCloseTo(LOW, within(2e-3));
    assertThat(out.get("high").asDouble()).isCloseTo(HIGH, within(2e-3));
    assertThat(root.get("healthy").get("pins").get("U3.1")).isEqualTo(out);
    double nominal = root.get("dc").get("nets").get("OUT").asDouble();
    assertThat(nominal).isBetween(out.get("low").asDouble(), out.get("high").asDouble());
  }
}
