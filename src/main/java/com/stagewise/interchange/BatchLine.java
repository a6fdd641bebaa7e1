package com.stagewise.interchange;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import java.nio.file.Path;
import java.util.List;

/**
 * One line of a diagnosis batch file: {@code {"stage": PATH-or-sheet, "readings":
 * PATH-or-readings}} (DESIGN.md, "Command line"). A path is taken relative to the batch file's
 * folder; a sheet or readings document may stand in the line itself.
 *
 * @param stage the stage
 * @param stageSource where the stage came from, for messages
 * @param readings the readings, checked against the stage
 * @param readingsSource where the readings came from, for messages
 */
public record BatchLine(
    Stage stage, String stageSource, ReadingSet readings, String readingsSource) {
  private static final List<String> KEYS = List.of("stage", "readings");

  /**
   * Reads one line of a batch file.
   *
   * @param text the line's text
   * @param source the batch file and line number, for messages (e.g. {@code cases.jsonl line 3})
   * @param folder the batch file's folder, against which paths are resolved
   * @param stages already read stage sheets by their text or path, so that many lines on one stage
   *     read it once (may be changed by this call)
   * @throws InvalidInputException naming the line, the field and what was expected
   */
  public static BatchLine read(
      String text, String source, Path folder, java.util.Map<String, Stage> stages) {
    JsonField root = JsonField.parseRoot(text, source);
    root.object("a batch line", KEYS);
    JsonField stageField = root.require("stage", "a stage sheet's path or the stage sheet itself");
    String stageSource;
    Stage stage;
    if (stageField.isText()) {
      Path file = folder.resolve(stageField.text());
      stageSource = file.toString();
      stage = stages.get("file:" + file);
      if (stage == null) {
        stage = StageSheet.read(file);
        stages.put("file:" + file, stage);
      }
    } else {
      stageSource = source + ", stage";
      String json = stageField.json();
      stage = stages.get("text:" + json);
      if (stage == null) {
        stage = StageSheet.read(json, stageSource);
        stages.put("text:" + json, stage);
      }
    }
    JsonField readingsField =
        root.require("readings", "a readings file's path or the readings document itself");
    if (readingsField.isText()) {
      Path file = folder.resolve(readingsField.text());
      return new BatchLine(stage, stageSource, ReadingsSheet.read(file, stage), file.toString());
    }
    String readingsSource = source + ", readings";
    return new BatchLine(
        stage,
        stageSource,
        ReadingsSheet.read(readingsField.json(), readingsSource, stage),
        readingsSource);
  }
}
