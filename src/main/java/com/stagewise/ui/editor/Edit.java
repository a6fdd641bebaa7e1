package com.stagewise.ui.editor;

/**
 * What one edit of a draft gives: the stage after it with what the edit did (for undo's label), or
 * why it was refused. The edits themselves ({@link PartEdits}, {@link SectionEdits}, {@link
 * SupplyEdits}) are plain functions of the draft; {@link StageEditorModel} applies them.
 *
 * @param next the stage after the edit (null when refused)
 * @param label what the edit did, e.g. "add R3"
 * @param made the designator the edit created ({@code R3}, {@code U1A}), or {@code ""}
 * @param refusal why the edit was refused, or {@code ""}
 */
record Edit(DraftStage next, String label, String made, String refusal) {

  /** An edit that gives {@code next}. */
  static Edit to(String label, DraftStage next) {
    return new Edit(next, label, "", "");
  }

  /** An edit that gives {@code next} with a new part or section {@code made}. */
  static Edit making(String made, String label, DraftStage next) {
    return new Edit(next, label, made, "");
  }

  /** An edit refused, changing nothing. */
  static Edit refused(String why) {
    return new Edit(null, "", "", why);
  }

  boolean wasRefused() {
    return next == null;
  }
}
