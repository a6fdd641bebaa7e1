package com.stagewise.interchange.history;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.interchange.StageSheet;

/**
 * Checks the documents a bundle carries with the same rules as the files they came from, before
 * anything of the bundle is written: every stage sheet through the stage sheet reader. A problem is
 * named by the bundle's file, the record's path and the path inside the document, e.g. {@code
 * shop.json: stageSheets[2].sheet.parts[1].value: …}.
 */
final class BundleDocuments {
  private BundleDocuments() {}

  /**
   * Checks every document in {@code bundle}.
   *
   * @param source the bundle's file, named in messages
   * @throws InvalidInputException for the first document that its reader refuses
   */
  static void check(HistoryBundle bundle, String source) {
    for (int i = 0; i < bundle.stageSheets().size(); i++) {
      StageSheetRecord sheet = bundle.stageSheets().get(i);
      String at = "stageSheets[" + i + "].sheet";
      try {
        StageSheet.read(sheet.sheetJson(), "");
      } catch (InvalidInputException e) {
        throw inside(source, at, e);
      }
    }
  }

  /** Returns the reader's complaint, placed at {@code at} inside the bundle {@code source}. */
  static InvalidInputException inside(String source, String at, InvalidInputException e) {
    String field = e.field().isEmpty() ? at : at + "." + e.field();
    return new InvalidInputException(source, field, problemOf(e));
  }

  /** Returns what an exception says is wrong, without its source and field. */
  static String problemOf(InvalidInputException e) {
    String problem = e.getMessage() == null ? "" : e.getMessage();
    String sourcePrefix = e.source().isEmpty() ? "" : e.source() + ": ";
    if (!sourcePrefix.isEmpty() && problem.startsWith(sourcePrefix)) {
      problem = problem.substring(sourcePrefix.length());
    }
    String fieldPrefix = e.field().isEmpty() ? "" : e.field() + ": ";
    if (!fieldPrefix.isEmpty() && problem.startsWith(fieldPrefix)) {
      problem = problem.substring(fieldPrefix.length());
    }
    return problem;
  }
}
