package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermission;
import java.util.Set;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Files the command line writes for people (a bundle to carry to another bench, a printed report, a
 * drawing, a stage sheet) get the user's normal permissions: those of a file any program creates in
 * the same folder under the same umask (POSIX {@code open(2)}: mode 0666 less the umask), not the
 * owner-only 0600 of a temporary file. Issue 9 found bundles and reports written 0600.
 */
class WrittenFilesTest {
  @TempDir Path folder;
  private Path db;

  /** What the umask in force gives a plain new file in this folder. */
  private Set<PosixFilePermission> normal;

  record Run(int code, String out, String err) {}

  private static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    return new Run(code, out.toString(), err.toString());
  }

  @BeforeEach
  void demoHistory() throws IOException {
    normal = Files.getPosixFilePermissions(Files.createFile(folder.resolve("plain-new-file")));
    db = folder.resolve("bench.db");
    Run demo = run("history", "demo", "--db", db.toString());
    assertThat(demo.code()).as(demo.err()).isEqualTo(ExitCode.OK);
  }

  private void assertNormal(Run run, Path file) throws IOException {
    assertThat(run.code()).as(run.err()).isEqualTo(ExitCode.OK);
    assertThat(Files.getPosixFilePermissions(file)).isEqualTo(normal);
    try (var left = Files.list(folder)) {
      assertThat(left.map(p -> p.getFileName().toString())).noneMatch(n -> n.endsWith(".tmp"));
    }
  }

  @Test
  void exportedBundle_hasTheUsersNormalPermissions() throws IOException {
    Path bundle = folder.resolve("shop.json");
    assertNormal(
        run("history", "export", "--out", bundle.toString(), "--db", db.toString()), bundle);
  }

  @Test
  void report_hasTheUsersNormalPermissions() throws IOException {
    Run opened =
        run(
            "history",
            "open-case",
            "--serial",
            "NF8-21037",
            "--symptom",
            "crackles",
            "--json",
            "--db",
            db.toString());
    assertThat(opened.code()).as(opened.err()).isEqualTo(ExitCode.OK);
    String caseId = opened.out().replaceAll("(?s).*\"id\"\\s*:\\s*\"([0-9a-f-]+)\".*", "$1");
    Path pdf = folder.resolve("case.pdf");
    assertNormal(
        run("report", "--case", caseId, "--out", pdf.toString(), "--db", db.toString()), pdf);
  }

  @Test
  void drawing_hasTheUsersNormalPermissions() throws IOException {
    Path svg = folder.resolve("driver.svg");
    assertNormal(
        run(
            "stage",
            "draw",
            "data/stages/larkspur-sm8-line-driver.stage.json",
            "--out",
            svg.toString()),
        svg);
  }

  @Test
  void templateSheet_hasTheUsersNormalPermissions() throws IOException {
    Path sheet = folder.resolve("inverting.stage.json");
    assertNormal(run("template", "inverting", "--out", sheet.toString()), sheet);
  }
}
