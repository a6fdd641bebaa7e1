package com.stagewise.ui;

import com.stagewise.circuit.Stage;
import com.stagewise.interchange.StageSheet;
import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.Properties;

/**
 * Keeps where an open case was left (the screen and the stage as edited), so that the case can be
 * resumed exactly there later. One small file per open case in a folder of the data folder; the
 * readings themselves are in the history.
 */
public final class CaseResume {
  private static final String STEP = "step";
  private static final String STAGE = "stage";

  private final Path folder;

  /** Creates the keeper that writes into {@code folder} (made when first needed). */
  public CaseResume(Path folder) {
    this.folder = folder;
  }

  /**
   * Where an open case was left.
   *
   * @param step the screen it was on
   * @param stage the stage as chosen and edited, if one was chosen
   */
  public record Saved(Step step, Optional<Stage> stage) {}

  /** Records the screen a case is on. */
  public synchronized void saveStep(String caseId, Step step) {
    Properties props = read(caseId);
    props.setProperty(STEP, step.name());
    write(caseId, props);
  }

  /** Records the stage (with its edited values) a case uses. */
  public synchronized void saveStage(String caseId, Stage stage) {
    Properties props = read(caseId);
    props.setProperty(STAGE, StageSheet.write(stage));
    write(caseId, props);
  }

  /** Returns where the case was left, if anything was recorded. */
  public synchronized Optional<Saved> load(String caseId) {
    Path file = file(caseId);
    if (!Files.exists(file)) {
      return Optional.empty();
    }
    Properties props = read(caseId);
    Step step;
    try {
      step = Step.valueOf(props.getProperty(STEP, Step.STAGE.name()));
    } catch (IllegalArgumentException e) {
      step = Step.STAGE;
    }
    String sheet = props.getProperty(STAGE);
    Optional<Stage> stage =
        sheet == null ? Optional.empty() : Optional.of(StageSheet.read(sheet, file.toString()));
    return Optional.of(new Saved(step, stage));
  }

  /** Forgets a case (after it is closed out). */
  public synchronized void forget(String caseId) {
    try {
      Files.deleteIfExists(file(caseId));
    } catch (IOException e) {
      throw new UncheckedIOException("could not delete " + file(caseId), e);
    }
  }

  private Path file(String caseId) {
    // Case ids are UUIDs; anything else is refused so that an id can never name another path.
    if (!caseId.matches("[0-9A-Za-z-]+")) {
      throw new IllegalArgumentException("not a case id: " + caseId);
    }
    return folder.resolve(caseId + ".properties");
  }

  private Properties read(String caseId) {
    Properties props = new Properties();
    Path file = file(caseId);
    if (Files.exists(file)) {
      try (Reader in = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
        props.load(in);
      } catch (IOException e) {
        throw new UncheckedIOException("could not read " + file, e);
      }
    }
    return props;
  }

  private void write(String caseId, Properties props) {
    Path file = file(caseId);
    try {
      Files.createDirectories(folder);
      Path temp = folder.resolve(caseId + ".tmp");
      try (Writer out = Files.newBufferedWriter(temp, StandardCharsets.UTF_8)) {
        props.store(out, "Stagewise: where an open case was left");
      }
      Files.move(temp, file, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
    } catch (IOException e) {
      throw new UncheckedIOException("could not write " + file, e);
    }
  }
}
