package com.stagewise.cli;

import static com.stagewise.cli.StagewiseCommandTest.assertBadInput;
import static com.stagewise.cli.StagewiseCommandTest.run;
import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Stage;
import com.stagewise.cli.StagewiseCommandTest.Run;
import com.stagewise.interchange.StageSheet;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.w3c.dom.Document;
import org.w3c.dom.NodeList;

class StageCommandTest {
  @TempDir Path dir;

  static Stream<Path> stageFiles() throws IOException {
    return StagewiseCommandTest.stageFiles();
  }

  private static final String LINE_DRIVER = "data/stages/larkspur-sm8-line-driver.stage.json";

  /** The line driver with R2's far end misspelt and a second section put on U3A's pins. */
  private Path badSheet() throws IOException {
    String sheet =
        Files.readString(Path.of(LINE_DRIVER), StandardCharsets.UTF_8)
            .replaceFirst("\"nets\": \\[\"SUM\", \"OUT\"]", "\"nets\": [\"SUM\", \"OTU\"]");
    assertThat(sheet).contains("OTU");
    Stage stage = StageSheet.readForm(sheet, "test");
    var amp = stage.amplifiers().get(0);
    List<com.stagewise.circuit.Amplifier> amps = new ArrayList<>(stage.amplifiers());
    amps.add(
        new com.stagewise.circuit.Amplifier(
            amp.packageRef() + "X",
            amp.packageRef(),
            amp.packageType(),
            amp.section(),
            amp.deviceClass(),
            amp.inPlus(),
            amp.inMinus(),
            amp.out(),
            amp.vPlus(),
            amp.vMinus()));
    Path file = dir.resolve("bad.stage.json");
    Files.writeString(file, StageSheet.write(stage.withAmplifiers(amps)));
    return file;
  }

  @ParameterizedTest
  @MethodSource("stageFiles")
  void check_everyDemoSheet_hasNoProblems(Path file) {
    Run run = run("stage", "check", file.toString());

    assertThat(run.code()).isEqualTo(ExitCode.OK);
    assertThat(run.out()).contains(file + ": no problems");
  }

  @Test
  void check_badSheet_printsEveryProblemAndExits2() throws IOException {
    Path bad = badSheet();
    Run run = run("stage", "check", bad.toString(), LINE_DRIVER);

    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.out())
        .contains(bad + ": ")
        .contains("parts[1].nets: net OTU of R15 touches nothing else")
        .contains("amplifiers[1].section: U3X claims section A of U3")
        .contains(LINE_DRIVER + ": no problems");
    assertThat(run.err()).isEmpty();
  }

  @Test
  void check_notASheet_namesTheFileAndExits2() throws IOException {
    Path file = dir.resolve("broken.stage.json");
    Files.writeString(file, "{\"format\": \"stagewise-stage\", \"version\": 1, \"rails\": 3}");

    Run run = run("stage", "check", file.toString());

    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.err()).contains(file.toString()).doesNotContain("Exception");
  }

  @ParameterizedTest
  @MethodSource("stageFiles")
  void drawSvg_everyDemoSheet_isWellFormedAndNamesEveryPartAndSection(Path file) throws Exception {
    Path out = dir.resolve("schematic.svg");
    Run run = run("stage", "draw", file.toString(), "--out", out.toString());

    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    // Well-formed XML in the SVG namespace (W3C SVG 1.1).
    var factory = DocumentBuilderFactory.newInstance();
    factory.setNamespaceAware(true);
    Document svg = factory.newDocumentBuilder().parse(out.toFile());
    assertThat(svg.getDocumentElement().getNamespaceURI()).isEqualTo("http://www.w3.org/2000/svg");
    List<String> texts = new ArrayList<>();
    NodeList nodes = svg.getElementsByTagName("text");
    for (int i = 0; i < nodes.getLength(); i++) {
      texts.add(nodes.item(i).getTextContent());
    }
    Stage stage = StageSheet.read(file);
    stage.parts().forEach(p -> assertThat(texts).contains(p.ref()));
    stage.amplifiers().forEach(a -> assertThat(texts).anyMatch(t -> t.contains(a.ref())));
  }

  @Test
  void drawPng_isAPictureOfTheLaidOutSize() throws IOException {
    Path out = dir.resolve("chain.png");
    Run run =
        run(
            "stage",
            "draw",
            "data/stages/tarnwell-ps4-channel-chain.stage.json",
            "--out",
            out.toString(),
            "--scale",
            "1");

    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    BufferedImage image = ImageIO.read(out.toFile());
    assertThat(image).isNotNull();
    assertThat(image.getWidth()).isGreaterThan(400);
    assertThat(image.getHeight()).isGreaterThan(200);
    // Dark ink on light paper: some pixels are dark (the drawing), the corner is paper.
    assertThat(image.getRGB(0, 0) & 0xffffff).isEqualTo(0xfbfaf6);
    boolean ink = false;
    for (int x = 0; x < image.getWidth() && !ink; x++) {
      for (int y = 0; y < image.getHeight() && !ink; y++) {
        ink = (image.getRGB(x, y) & 0xff) < 0x40;
      }
    }
    assertThat(ink).isTrue();
  }

  @Test
  void draw_otherFormat_isBadInput() {
    assertBadInput(
        run("stage", "draw", LINE_DRIVER, "--out", dir.resolve("x.pdf").toString()),
        ".svg or .png");
  }

  @Test
  void draw_existingFile_isKeptWithoutForce() throws IOException {
    Path out = dir.resolve("keep.svg");
    Files.writeString(out, "mine");

    assertBadInput(run("stage", "draw", LINE_DRIVER, "--out", out.toString()), "--force");
    assertThat(Files.readString(out)).isEqualTo("mine");
    assertThat(run("stage", "draw", LINE_DRIVER, "--out", out.toString(), "--force").code())
        .isEqualTo(ExitCode.OK);
  }
}
