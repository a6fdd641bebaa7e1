package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code stagewise report}: a case stored through the history commands, written as a PDF and read
 * back.
 */
class ReportCommandTest {
  @TempDir Path folder;
  private Path db;
  private String caseId;
  private String firstSuspect;

  record Run(int code, String out, String err) {}

  private static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  private static String pdfText(Path file) throws IOException {
    try (PDDocument document = Loader.loadPDF(file.toFile())) {
      return new PDFTextStripper().getText(document).replaceAll("\\s+", " ");
    }
  }

  /**
   * One case on the demo stage whose feedback resistor is open, with the diagnosis stored with its
   * readings.
   */
  @BeforeEach
  void storeACase() throws IOException {
    db = folder.resolve("bench.db");
    String d = db.toString();
    Path stage = folder.resolve("driver.stage.json");
    Files.writeString(stage, HistoryCommandTest.DemoStage.MIXER, StandardCharsets.UTF_8);
    assertThat(
            run("history", "add-model", "--db", d, "--name", "MX-8", "--stage", stage.toString())
                .code())
        .isEqualTo(ExitCode.OK);
    assertThat(
            run(
                    "history",
                    "add-unit",
                    "--db",
                    d,
                    "--serial",
                    "NF8-7",
                    "--model",
                    "MX-8",
                    "--owner",
                    "job 7")
                .code())
        .isEqualTo(ExitCode.OK);
    Run opened =
        run(
            "history",
            "open-case",
            "--db",
            d,
            "--serial",
            "NF8-7",
            "--symptom",
            "Output stuck low; 47 kΩ feedback resistor suspected",
            "--json");
    caseId = new ObjectMapper().readTree(opened.out()).get("id").textValue();
    // With R2 open the inverting stage runs open-loop and its output sits near the lower limit,
    // about 1.5 V above the -15 V rail for a bipolar part (DESIGN.md; textbook op-amp behaviour).
    Path readings = folder.resolve("case.readings.json");
    Files.writeString(
        readings,
        """
        {"format": "stagewise-readings", "version": 1,
         "readings": [ {"at": "U1.8", "dc": 14.97}, {"at": "U1.4", "dc": -14.96},
                       {"at": "U1.1", "dc": -13.48}, {"at": "U1.2", "dc": 0.99} ]}
        """,
        StandardCharsets.UTF_8);
    Run stored =
        run(
            "history",
            "add-readings",
            "--db",
            d,
            "--case",
            caseId,
            "--readings",
            readings.toString(),
            "--json");
    JsonNode list = new ObjectMapper().readTree(stored.out()).get("suspectList");
    firstSuspect = list.get("suspects").get(0).get("fault").textValue();
    assertThat(
            run(
                    "history",
                    "add-note",
                    "--db",
                    d,
                    "--case",
                    caseId,
                    "--text",
                    "Replaced R2 → output −4.70 V at +1 V in")
                .code())
        .isEqualTo(ExitCode.OK);
    assertThat(
            run(
                    "history",
                    "close-case",
                    "--db",
                    d,
                    "--case",
                    caseId,
                    "--outcome",
                    "fixed",
                    "--fault",
                    "R2:open")
                .code())
        .isEqualTo(ExitCode.OK);
  }

  @Test
  void report_writesThePdf_withTheStoredDiagnosis() throws IOException {
    Path pdf = folder.resolve("case.pdf");
    Run report =
        run(
            "report",
            "--case",
            caseId.substring(0, 8),
            "--out",
            pdf.toString(),
            "--db",
            db.toString());
    assertThat(report.code()).as(report.err()).isEqualTo(ExitCode.OK);
    assertThat(report.err()).isEmpty();
    assertThat(Files.readAllBytes(pdf)).startsWith("%PDF-".getBytes(StandardCharsets.US_ASCII));
    try (PDDocument document = Loader.loadPDF(pdf.toFile())) {
      int pages = document.getNumberOfPages();
      assertThat(report.out())
          .contains("unit NF8-7, " + pages + (pages == 1 ? " page" : " pages"), pdf.toString());
    }
    String text = pdfText(pdf);
    assertThat(text)
        .contains(
            "NF8-7",
            "Output stuck low; 47 kohm feedback resistor suspected",
            "U1 pin 8",
            "U1 pin 4",
            "U1 pin 1",
            "U1 pin 2");
    assertThat(text)
        .contains(
            com.stagewise.diagnosis.Wording.fault(firstSuspect),
            "Replaced R2 -> output -4.70 V at +1 V in",
            "Confirmed fault R2 open");
    assertThat(text).contains("it is not a statement that the unit is safe");
    try (var left = Files.list(folder)) {
      assertThat(left.map(p -> p.getFileName().toString()))
          .noneMatch(name -> name.endsWith(".tmp"));
    }
  }

  @Test
  void report_neverReplacesAFileWithoutForce() throws IOException {
    Path pdf = folder.resolve("kept.pdf");
    Files.writeString(pdf, "an earlier report", StandardCharsets.UTF_8);
    Run refused = run("report", "--case", caseId, "--out", pdf.toString(), "--db", db.toString());
    assertThat(refused.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(refused.err())
        .contains("--out", "exists already", "--force")
        .doesNotContain("Exception");
    assertThat(Files.readString(pdf, StandardCharsets.UTF_8)).isEqualTo("an earlier report");

    Run forced =
        run("report", "--case", caseId, "--out", pdf.toString(), "--db", db.toString(), "--force");
    assertThat(forced.code()).as(forced.err()).isEqualTo(ExitCode.OK);
    assertThat(pdfText(pdf)).contains("NF8-7");
  }

  @Test
  void report_unknownCase_exitsTwoNamingTheId() {
    Run unknown =
        run(
            "report",
            "--case",
            "abcdef12",
            "--out",
            folder.resolve("x.pdf").toString(),
            "--db",
            db.toString());
    assertThat(unknown.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(unknown.err())
        .contains("abcdef12")
        .doesNotContain("Exception")
        .doesNotContain("\tat ");
    assertThat(folder.resolve("x.pdf")).doesNotExist();
  }

  @Test
  void report_outInAMissingFolderOrUnderAFile_exitsTwoWithAClearMessage() throws IOException {
    Run missing =
        run(
            "report",
            "--case",
            caseId,
            "--out",
            folder.resolve("no-such-folder/r.pdf").toString(),
            "--db",
            db.toString());
    assertThat(missing.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(missing.err()).contains("--out", "does not exist", "no-such-folder");

    Path file = Files.writeString(folder.resolve("plain.txt"), "x", StandardCharsets.UTF_8);
    Run underFile =
        run(
            "report",
            "--case",
            caseId,
            "--out",
            file.resolve("r.pdf").toString(),
            "--db",
            db.toString());
    assertThat(underFile.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(underFile.err()).contains("--out", "is not a folder");

    Run isFolder =
        run("report", "--case", caseId, "--out", folder.toString(), "--db", db.toString());
    assertThat(isFolder.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(isFolder.err()).contains("is a folder");
  }

  @Test
  void report_missingDatabase_exitsTwoAndCreatesNothing() {
    Path none = folder.resolve("none.db");
    Run run =
        run(
            "report",
            "--case",
            caseId,
            "--out",
            folder.resolve("r.pdf").toString(),
            "--db",
            none.toString());
    assertThat(run.code()).isEqualTo(ExitCode.BAD_INPUT);
    assertThat(run.err()).contains(none.toString(), "no history database");
    assertThat(none).doesNotExist();
  }

  @Test
  void help_namesEveryOption() {
    Run help = run("report", "--help");
    assertThat(help.code()).isEqualTo(ExitCode.OK);
    assertThat(help.out())
        .contains("--case", "--out", "--db", "--force", "never replaced unless --force");
    assertThat(run("report", "--out", "x.pdf").code()).isEqualTo(ExitCode.BAD_INPUT);
  }
}
