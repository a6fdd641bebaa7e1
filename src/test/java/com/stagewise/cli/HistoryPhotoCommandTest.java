package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.history.TestPictures;
import java.io.PrintWriter;
import java.io.RandomAccessFile;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code history attach-photo} end to end on a real history file: pictures written by the JDK's own
 * PNG and JPEG encoders (javax.imageio, {@link TestPictures}) are kept with the case, and {@code
 * history show} lists them with the size in pixels the encoder was given; bad input is refused with
 * exit 2 and a message naming what to fix, and leaves the case as it was.
 */
class HistoryPhotoCommandTest {
  @TempDir Path folder;
  private Path db;
  private String caseId;

  record Run(int code, String out, String err) {}

  private Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  private Run history(String command, String... args) {
    List<String> all = new ArrayList<>(List.of("history", command, "--db", db.toString()));
    all.addAll(List.of(args));
    return run(all.toArray(String[]::new));
  }

  private static JsonNode json(Run run) throws Exception {
    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    return new ObjectMapper().readTree(run.out());
  }

  private static void assertRefused(Run run, String... fragments) {
    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.err()).contains(fragments).doesNotContain("\tat ", "Exception");
    assertThat(run.err().strip().lines()).hasSize(1);
  }

  @BeforeEach
  void aCaseOnABench() throws Exception {
    db = folder.resolve("bench.db");
    Path stage = folder.resolve("mixer.stage.json");
    Files.writeString(stage, HistoryCommandTest.DemoStage.MIXER, StandardCharsets.UTF_8);
    assertThat(
            history("add-model", "--name", "MX-8", "--maker", "Northfield", "--stage", "" + stage)
                .code())
        .isEqualTo(ExitCode.OK);
    assertThat(history("add-unit", "--serial", "NF8-7", "--model", "MX-8").code())
        .isEqualTo(ExitCode.OK);
    caseId =
        json(history("open-case", "--serial", "NF8-7", "--symptom", "No output", "--json"))
            .get("id")
            .textValue();
  }

  @Test
  void aPngAndAJpeg_areKeptWithTheCaseAndListedByShow() throws Exception {
    Path png = folder.resolve("board top.png");
    Files.write(png, TestPictures.png(64, 48));
    Path jpeg = folder.resolve("solder side.jpg");
    Files.write(jpeg, TestPictures.jpeg(40, 30));

    Run text = history("attach-photo", "--case", caseId.substring(0, 8), png.toString());
    JsonNode second = json(history("attach-photo", "--case", caseId, jpeg.toString(), "--json"));

    assertThat(text.code()).as(text.err()).isEqualTo(ExitCode.OK);
    assertThat(text.out()).contains("board top.png", "64 × 48 px", caseId.substring(0, 8));
    assertThat(second.get("fileName").textValue()).isEqualTo("solder side.jpg");
    assertThat(second.get("mediaType").textValue()).isEqualTo("image/jpeg");
    assertThat(second.get("width").intValue()).isEqualTo(40);
    assertThat(second.get("height").intValue()).isEqualTo(30);
    assertThat(second.get("bytes").longValue()).isEqualTo(Files.size(jpeg));
    assertThat(second.has("image")).as("the picture itself is not printed").isFalse();

    Run shown = history("show", "--case", caseId);
    assertThat(shown.out())
        .contains("Photos:")
        .containsPattern("board top\\.png  64 × 48 px")
        .containsPattern("solder side\\.jpg  40 × 30 px");
    JsonNode photos = json(history("show", "--case", caseId, "--json")).get("photos");
    assertThat(photos).hasSize(2);
    assertThat(photos.get(0).get("fileName").textValue()).isEqualTo("board top.png");
    assertThat(photos.get(0).get("mediaType").textValue()).isEqualTo("image/png");
    assertThat(photos.get(0).get("width").intValue()).isEqualTo(64);
    assertThat(photos.get(0).get("height").intValue()).isEqualTo(48);
    assertThat(photos.get(1).get("fileName").textValue()).isEqualTo("solder side.jpg");
    assertThat(photos.get(0).get("attachedAt").textValue()).endsWith("Z");
  }

  @Test
  void badInput_isRefusedNamingWhatToFix_andTheCaseKeepsNoPhoto() throws Exception {
    Path text = folder.resolve("notes.png");
    Files.writeString(text, "not a picture at all", StandardCharsets.UTF_8);
    Path huge = folder.resolve("huge.jpg");
    try (RandomAccessFile file = new RandomAccessFile(huge.toFile(), "rw")) {
      file.setLength(21L * 1024 * 1024);
    }
    Path png = folder.resolve("board.png");
    Files.write(png, TestPictures.png(16, 16));

    assertRefused(
        history("attach-photo", "--case", caseId, folder.resolve("missing.png").toString()),
        "missing.png");
    assertRefused(history("attach-photo", "--case", caseId, text.toString()), "notes.png", "PNG");
    assertRefused(history("attach-photo", "--case", caseId, huge.toString()), "huge.jpg", "20");
    assertRefused(history("attach-photo", "--case", "ffffffff", png.toString()), "ffffffff");
    assertRefused(history("attach-photo", "--case", caseId), "FILE");

    assertThat(json(history("show", "--case", caseId, "--json")).get("photos")).isEmpty();
    assertThat(history("show", "--case", caseId).out()).doesNotContain("Photos:");
  }

  @Test
  void help_namesTheCommandAndItsFile() {
    Run help = run("history", "--help");
    Run own = run("history", "attach-photo", "--help");

    assertThat(help.out()).contains("attach-photo");
    assertThat(own.code()).isEqualTo(ExitCode.OK);
    assertThat(own.out()).contains("--case", "FILE", "PNG or JPEG", "--db", "--json");
  }
}
