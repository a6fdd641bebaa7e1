package com.stagewise.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Feeds thousands of seeded, mutated stage sheets, readings files and history bundles through the
 * real command line, in this JVM, and checks what an outside probe checks: no exception escapes,
 * the exit code is 0 or 2, no output holds NaN, Infinity or a number of more than 20 digits, no
 * message quotes the JSON library's internals, every refusal names the file it refuses, and a
 * refused import leaves every table of the history as it was (a checksum of every row).
 *
 * <p>The seed is fixed, so a failure reruns the same way; the failing document is printed with the
 * failure. Every run of the suite takes 10,100 documents (4,500 stage sheets, 4,000 readings files,
 * 1,600 bundles); the counts are system properties ({@code fuzz.stages}, {@code fuzz.readings},
 * {@code fuzz.bundles}) for a longer or a quicker run.
 */
class HostileDocumentsFuzzTest {
  /** The fixed seed of every generator here. */
  private static final long SEED = 20261202L;

  static final int STAGE_SHEETS = Integer.getInteger("fuzz.stages", 4_500);
  static final int READINGS_FILES = Integer.getInteger("fuzz.readings", 4_000);
  static final int BUNDLES = Integer.getInteger("fuzz.bundles", 1_600);

  /**
   * A number with more than 20 digits in a row (a 300-digit voltage, a raw double's expansion),
   * unless the document itself holds that run.
   */
  private static final Pattern LONG_NUMBER = Pattern.compile("[0-9]{21,}");

  /**
   * NaN or Infinity as a printed number, not inside quotes (a quoted one is the user's own text).
   */
  private static final Pattern NOT_A_NUMBER =
      Pattern.compile("(?<![\"\\w])(NaN|-?Infinity)(?![\"\\w])");

  /** Words of the JSON library's own messages that a user must never see. */
  private static final List<String> LIBRARY_WORDS =
      List.of(
          "JsonNode",
          "JsonReadFeature",
          "StreamReadConstraints",
          "com.fasterxml",
          "Jackson",
          "jackson",
          "JsonParseException",
          "MismatchedInput",
          "Exception",
          "\tat ");

  private static final Path STAGES = Path.of("data", "stages");
  private static final Path READINGS = Path.of("data", "readings");

  @TempDir static Path dir;

  private static List<Path> stageSeeds;
  private static List<Path[]> readingSeeds;

  @BeforeAll
  static void seeds() throws IOException {
    try (Stream<Path> files = Files.list(STAGES)) {
      stageSeeds = files.filter(f -> f.toString().endsWith(".stage.json")).sorted().toList();
    }
    readingSeeds = new ArrayList<>();
    try (Stream<Path> files = Files.list(READINGS)) {
      for (Path f : files.filter(f -> f.toString().endsWith(".readings.json")).sorted().toList()) {
        String stageName = f.getFileName().toString().split("\\.")[0] + ".stage.json";
        readingSeeds.add(new Path[] {STAGES.resolve(stageName), f});
      }
    }
  }

  record Run(int code, String out, String err) {}

  private static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code;
    try {
      code = StagewiseCommand.execute(args, new PrintWriter(out), new PrintWriter(err));
    } catch (Throwable t) {
      // An exception that escapes the command line's own handling is a failure of its own.
      return new Run(-1, out.toString(), err + "\nescaped: " + t);
    }
    return new Run(code, out.toString(), err.toString());
  }

  /** Collects the first failures with the document that caused each. */
  private static final class Findings {
    private final List<String> found = new ArrayList<>();
    private int count;

    void check(String what, byte[] document, Run run, List<Path> sources) {
      List<String> problems = new ArrayList<>();
      if (run.code() != ExitCode.OK && run.code() != ExitCode.BAD_INPUT) {
        problems.add("exit " + run.code());
      }
      String all = run.out() + run.err();
      // Quoted text is the user's own (a time "13:-Infinity:00" quoted back); the rest is ours.
      String input = new String(document, StandardCharsets.UTF_8);
      java.util.regex.Matcher words = NOT_A_NUMBER.matcher(all.replaceAll("\"[^\"\n]*\"", "\"\""));
      while (words.find()) {
        // JSON has no NaN or Infinity: a document that holds the word holds it as text (a net
        // named "-Infinity"), and a message may name that net as it names any other. Any other
        // is a computed number that is not finite.
        if (!input.contains(words.group())) {
          problems.add("prints NaN or Infinity");
          break;
        }
      }
      java.util.regex.Matcher digits = LONG_NUMBER.matcher(all);
      while (digits.find()) {
        // A long run of digits that the document itself holds is the user's own text echoed (a
        // net named by 30 digits); any other is a computed number printed in full.
        if (!input.contains(digits.group())) {
          problems.add("prints a number of more than 20 digits");
          break;
        }
      }
      for (String word : LIBRARY_WORDS) {
        if (run.err().contains(word)) {
          problems.add("the message quotes \"" + word + "\"");
        }
      }
      if (run.code() == ExitCode.BAD_INPUT) {
        long named = sources.stream().filter(s -> run.err().contains(s.toString())).count();
        if (named == 0) {
          problems.add("the message names no source file");
        }
        for (Path source : sources) {
          String err = run.err();
          int first = err.indexOf(source.toString());
          if (first >= 0 && err.indexOf(source.toString(), first + 1) >= 0) {
            problems.add("the message repeats its source " + source);
          }
        }
        if (run.err().strip().lines().count() != 1) {
          problems.add("the refusal is not one line");
        }
      }
      if (!problems.isEmpty()) {
        count++;
        if (found.size() < 10) {
          String text = new String(document, StandardCharsets.UTF_8);
          found.add(
              what
                  + ": "
                  + problems
                  + "\n  exit "
                  + run.code()
                  + ", stderr: "
                  + abbreviate(run.err())
                  + "\n  stdout: "
                  + abbreviate(run.out())
                  + "\n  document: "
                  + abbreviate(text));
        }
      }
    }

    void fail(String problem) {
      count++;
      if (found.size() < 10) {
        found.add(problem);
      }
    }

    void assertNone() {
      assertThat(found).as("%d of the mutated documents failed; the first ones", count).isEmpty();
    }

    private static String abbreviate(String text) {
      String flat = text.replace("\n", "⏎");
      return flat.length() > 600 ? flat.substring(0, 600) + "…" : flat;
    }
  }

  @Test
  void mutatedStageSheets_solveAndDiagnose_failCleanly() throws IOException {
    Mutator mutator = new Mutator(SEED);
    Findings findings = new Findings();
    for (int i = 0; i < STAGE_SHEETS; i++) {
      Path seed = stageSeeds.get(i % stageSeeds.size());
      byte[] document = mutator.mutate(Files.readString(seed, StandardCharsets.UTF_8));
      Path file = dir.resolve("fuzz-" + i + ".stage.json");
      Files.write(file, document);
      Run run;
      if (i % 3 == 0) {
        run = run("solve", "--stage", file.toString());
      } else if (i % 3 == 1) {
        run = run("solve", "--stage", file.toString(), "--json");
      } else {
        // Diagnose with the line driver's readings where the seed is the line driver, else a
        // readings file that names no pin (the sheet's own checks come first either way).
        Path readings = readingsFor(seed);
        run = run("diagnose", "--stage", file.toString(), "--readings", readings.toString());
      }
      List<Path> sources = i % 3 == 2 ? List.of(file, readingsFor(seed)) : List.of(file);
      findings.check("stage sheet " + i + " from " + seed.getFileName(), document, run, sources);
      Files.delete(file);
    }
    findings.assertNone();
  }

  @Test
  void mutatedReadings_diagnose_failCleanly() throws IOException {
    Mutator mutator = new Mutator(SEED + 1);
    Findings findings = new Findings();
    for (int i = 0; i < READINGS_FILES; i++) {
      Path[] seed = readingSeeds.get(i % readingSeeds.size());
      byte[] document = mutator.mutate(Files.readString(seed[1], StandardCharsets.UTF_8));
      Path file = dir.resolve("fuzz-" + i + ".readings.json");
      Files.write(file, document);
      Run run =
          i % 2 == 0
              ? run("diagnose", "--stage", seed[0].toString(), "--readings", file.toString())
              : run(
                  "diagnose",
                  "--stage",
                  seed[0].toString(),
                  "--readings",
                  file.toString(),
                  "--json",
                  "--top",
                  "3");
      findings.check(
          "readings " + i + " from " + seed[1].getFileName(),
          document,
          run,
          List.of(file, seed[0]));
      Files.delete(file);
    }
    findings.assertNone();
  }

  @Test
  void mutatedBundles_import_failCleanly_andARefusalChangesNothing() throws Exception {
    Path pristine = dir.resolve("pristine.db");
    assertThat(run("history", "demo", "--db", pristine.toString()).code()).isEqualTo(ExitCode.OK);
    List<String> seedBundles = new ArrayList<>();
    Path whole = dir.resolve("whole.bundle.json");
    assertThat(
            run("history", "export", "--out", whole.toString(), "--db", pristine.toString()).code())
        .isEqualTo(ExitCode.OK);
    seedBundles.add(Files.readString(whole, StandardCharsets.UTF_8));
    // Import into the demo history itself: the mutated records meet their own originals, so the
    // merge rules (newer copy wins, conflicts kept) run too. The pristine copy is put back after
    // an import that was accepted.
    Path db = dir.resolve("fuzz.db");
    Files.copy(pristine, db);
    String before = checksum(db);
    Mutator mutator = new Mutator(SEED + 2);
    Findings findings = new Findings();
    for (int i = 0; i < BUNDLES; i++) {
      byte[] document = mutator.mutate(seedBundles.get(i % seedBundles.size()));
      Path file = dir.resolve("fuzz-" + i + ".bundle.json");
      Files.write(file, document);
      Run run = run("history", "import", file.toString(), "--db", db.toString());
      findings.check("bundle " + i, document, run, sources(file));
      if (run.code() == ExitCode.BAD_INPUT) {
        String after = checksum(db);
        if (!after.equals(before)) {
          findings.fail("bundle " + i + ": a refused import changed the history: " + run.err());
        }
      } else {
        Files.copy(pristine, db, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        Files.deleteIfExists(Path.of(db + "-wal"));
        Files.deleteIfExists(Path.of(db + "-shm"));
      }
      Files.delete(file);
    }
    findings.assertNone();
  }

  private static List<Path> sources(Path file) {
    return List.of(file);
  }

  private static Path readingsFor(Path stage) {
    String name = stage.getFileName().toString().replace(".stage.json", "");
    return readingSeeds.stream()
        .filter(r -> r[0].getFileName().toString().startsWith(name))
        .map(r -> r[1])
        .findFirst()
        .orElse(readingSeeds.get(0)[1]);
  }

  /** Returns a digest of every row of every table of an SQLite file, in rowid order. */
  static String checksum(Path db) throws Exception {
    MessageDigest digest = MessageDigest.getInstance("SHA-256");
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db + "?mode=ro");
        Statement s = c.createStatement()) {
      List<String> tables = new ArrayList<>();
      try (ResultSet r =
          s.executeQuery("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name")) {
        while (r.next()) {
          tables.add(r.getString(1));
        }
      }
      for (String table : tables) {
        digest.update(table.getBytes(StandardCharsets.UTF_8));
        try (ResultSet r =
            s.executeQuery("SELECT * FROM \"" + table.replace("\"", "\"\"") + "\"")) {
          int columns = r.getMetaData().getColumnCount();
          while (r.next()) {
            for (int col = 1; col <= columns; col++) {
              byte[] bytes = r.getBytes(col);
              digest.update(bytes == null ? new byte[] {0} : bytes);
              digest.update((byte) 0x1f);
            }
            digest.update((byte) 0x1e);
          }
        }
      }
    }
    return HexFormat.of().formatHex(digest.digest());
  }
}
