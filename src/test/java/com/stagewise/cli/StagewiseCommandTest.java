package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.circuit.Stage;
import com.stagewise.interchange.StageSheet;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class StagewiseCommandTest {
  @TempDir Path dir;

  record Run(int code, String out, String err) {}

  static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  static void assertBadInput(Run run, String... fragments) {
    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.err()).contains(fragments).doesNotContain("\tat ", "Exception");
    assertThat(run.err().strip().lines()).hasSize(1);
  }

  static Stream<Path> stageFiles() throws IOException {
    try (Stream<Path> files = Files.list(Path.of("data", "stages"))) {
      return files.filter(f -> f.toString().endsWith(".stage.json")).sorted().toList().stream();
    }
  }

  @ParameterizedTest
  @MethodSource("stageFiles")
  void solveJson_everyDemoSheet_givesTheContractDocument(Path file) throws Exception {
    Run run = run("solve", "--stage", file.toString(), "--json");
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    assertThat(run.err()).isEmpty();
    JsonNode root = new ObjectMapper().readTree(run.out());
    Stage stage = StageSheet.read(file);
    assertThat(root.get("format").asText()).isEqualTo("stagewise-solution");
    assertThat(root.get("version").asInt()).isEqualTo(1);
    assertThat(root.has("dc") && root.get("dc").has("nets") && root.get("dc").has("pins")).isTrue();
    assertThat(root.get("dc").get("nets").size()).isEqualTo(stage.nets().size());
    assertThat(root.get("sections").size()).isEqualTo(stage.amplifiers().size());
    assertThat(root.has("ac")).isEqualTo(stage.inputs().stream().anyMatch(i -> i.hasAc()));
  }

  @ParameterizedTest
  @MethodSource("stageFiles")
  void solveTable_everyDemoSheet_namesEveryNetAndSection(Path file) {
    Run run = run("solve", "--stage", file.toString());
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    Stage stage = StageSheet.read(file);
    assertThat(run.out()).contains(stage.nets()).contains(stage.amplifiers().get(0).ref());
  }

  @Test
  void solveTable_lineDriver_showsExpectedVoltsAndAc() {
    Run run =
        run(
            "solve",
            "--stage",
            Path.of("data", "stages", "larkspur-sm8-line-driver.stage.json").toString());
    // Closed-form ideal op-amp result: -R2/R1 x 1 V = -4.7 V; AC 0.1 V x 4.7 = 0.47 V, inverted.
    assertThat(run.out()).containsPattern("OUT +U3\\.1 +-4\\.699\\d +0\\.4700 +180\\.0°");
    assertThat(run.out()).contains("U3A linear");
  }

  @Test
  void solve_missingFile_isBadInputNamingTheFile() {
    assertBadInput(
        run("solve", "--stage", dir.resolve("none.stage.json").toString()),
        "none.stage.json",
        "no such file");
  }

  @Test
  void solve_badSheet_isBadInputNamingFileAndPath() throws IOException {
    Path file = dir.resolve("bad.stage.json");
    String good =
        Files.readString(
            Path.of("data", "stages", "larkspur-sm8-line-driver.stage.json"),
            StandardCharsets.UTF_8);
    Files.writeString(
        file, good.replace("\"value\": \"47k\"", "\"value\": \"47kk\""), StandardCharsets.UTF_8);
    assertBadInput(
        run("solve", "--stage", file.toString()), "bad.stage.json", "parts[1].value", "47kk");
  }

  @Test
  void solve_brokenJson_isBadInputWithoutParserText() throws IOException {
    Path file = dir.resolve("broken.stage.json");
    Files.writeString(file, "{\"format\": \"stagewise-stage\",, }", StandardCharsets.UTF_8);
    assertBadInput(run("solve", "--stage", file.toString()), "broken.stage.json", "not valid JSON");
  }

  @Test
  void solve_withoutStage_isBadInput() {
    assertBadInput(run("solve"), "--stage");
  }

  @Test
  void unknownOption_isBadInput() {
    assertBadInput(run("solve", "--stage", "x.stage.json", "--colour"), "--colour");
  }

  @Test
  void template_withoutName_listsEveryTemplate() {
    Run run = run("template");
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    assertThat(run.out())
        .contains("inverting:", "sallen-key-low-pass:", "single-supply-inverting:", "r2", "47k");
  }

  @Test
  void template_writeWithValuesAndRenames_givesASheetThatReadsBack() {
    Path file = dir.resolve("driver.stage.json");
    Run run =
        run(
            "template",
            "inverting",
            "--set",
            "r2=22k",
            "--rename",
            "R2=R15",
            "--rename",
            "U1=U3",
            "--net",
            "VCC=+15V",
            "--title",
            "Line driver",
            "--board",
            "Test board",
            "--out",
            file.toString());
    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    Stage stage = StageSheet.read(file);
    assertThat(stage.part("R15").orElseThrow().value()).isEqualTo(22_000);
    assertThat(stage.amplifier("U3A")).isPresent();
    assertThat(stage.rail("+15V")).isPresent();
    assertThat(stage.title()).isEqualTo("Line driver");
  }

  @Test
  void template_toScreen_printsTheSheet() {
    Run run = run("template", "voltage-follower");
    assertThat(run.code()).isEqualTo(ExitCode.OK);
    assertThat(StageSheet.read(run.out(), "screen").amplifiers()).hasSize(1);
  }

  @Test
  void template_badValue_isBadInputNamingTheParameter() {
    assertBadInput(run("template", "inverting", "--set", "r2=-4k7"), "template inverting", "r2");
  }

  @Test
  void template_unknownName_isBadInputListingTemplates() {
    assertBadInput(run("template", "band-pass"), "band-pass", "inverting");
  }

  @Test
  void template_unknownRename_isBadInput() {
    assertBadInput(run("template", "inverting", "--rename", "R7=R70"), "--rename", "R7");
  }
}
