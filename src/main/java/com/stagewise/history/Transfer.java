package com.stagewise.history;

import com.stagewise.history.record.HistoryBundle;
import java.nio.file.Path;

/** Moving the history between benches and keeping it safe: export, import, backup, restore. */
public interface Transfer {

  /** Returns the selected part of the history as a bundle, in one consistent read. */
  HistoryBundle export(ExportSelection selection, String programVersion);

  /**
   * Merges a bundle into this history in one transaction, by id: new records are added, records
   * whose bundle copy is newer replace the local one, and a local copy that is newer (or as new)
   * and differs is kept and reported as a conflict. Board models are matched by name and units by
   * board model and serial when their ids differ, so nothing is duplicated.
   *
   * @param source names the bundle in messages (its file)
   * @throws com.stagewise.circuit.InvalidInputException if the bundle is malformed (bad ids,
   *     duplicate ids, references to missing records or to a record of the wrong kind, text over
   *     the limits, a newer format version): nothing is imported
   */
  ImportReport importBundle(HistoryBundle bundle, String source);

  /**
   * Writes a consistent, compact copy of the whole history to {@code target} while it stays in use.
   *
   * @throws com.stagewise.circuit.InvalidInputException if {@code target} already exists
   */
  void backupTo(Path target);

  /**
   * Replaces the whole history with the backup in {@code backup}, after checking that it is a sound
   * history; the current history is first saved beside it as {@code <name>.before-restore-<time>},
   * so a restore can be undone.
   *
   * @return where the previous history was saved
   * @throws com.stagewise.circuit.InvalidInputException if the backup is missing, empty or not a
   *     sound history (nothing is changed then)
   */
  Path restoreFrom(Path backup);

  /** Returns the storage's own integrity check: {@code ok}, or what is wrong. */
  String integrityCheck();
}
