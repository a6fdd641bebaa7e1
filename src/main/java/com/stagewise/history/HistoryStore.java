package com.stagewise.history;

import com.stagewise.history.sqlite.SqliteHistory;
import java.nio.file.Path;
import java.time.Clock;
import java.util.UUID;

/**
 * The shop's repair history, handed out as one store per aggregate: {@link #units()} (units and
 * board models), {@link #cases()} (cases and their readings, suspect lists, notes and actions),
 * {@link #library()} (the board models' stage sheets) and {@link #transfer()} (export, import,
 * backup, restore).
 *
 * <p>Every write is one transaction: it checks everything first and then writes all of it or
 * nothing. Bad input (an unknown case, an empty serial, text over the limits of {@link Checks}) is
 * an {@code InvalidInputException}; trouble with the storage itself is a {@link StorageException}.
 * A store may be used from several threads; its calls run one at a time.
 *
 * <p>{@link #open(Path)} opens the embedded SQLite file; a second implementation passes the same
 * contract tests.
 */
public interface HistoryStore extends AutoCloseable {

  /**
   * Opens the history file at {@code file}, creating it (and its folder) if missing, and brings its
   * schema up to date.
   *
   * @throws StorageException if the file is not a history database, is damaged, was made by a newer
   *     program, or cannot be written; the file is then left as it was
   */
  static HistoryStore open(Path file) {
    return SqliteHistory.open(file, Clock.systemUTC());
  }

  /** Opens the history file as {@link #open(Path)} does, taking times from {@code clock}. */
  static HistoryStore open(Path file, Clock clock) {
    return SqliteHistory.open(file, clock);
  }

  /**
   * Opens an existing history file for reading only: nothing is created, migrated or written, so a
   * read-only file (or folder) can still be listed and searched. Every write through the store is
   * refused.
   *
   * @throws StorageException if the file is missing, not a history database, damaged, or of a
   *     schema this program does not know; the file is left as it was
   */
  static HistoryStore openReadOnly(Path file) {
    return SqliteHistory.openReadOnly(file, Clock.systemUTC());
  }

  /** Returns a new stable id (a random lower-case UUID). */
  static String newId() {
    return UUID.randomUUID().toString();
  }

  /** Units and board models. */
  Units units();

  /** Cases and everything recorded in them. */
  Cases cases();

  /** The board models' stage sheets. */
  StageLibrary library();

  /** Export, import, backup and restore. */
  Transfer transfer();

  /** Returns whether the history holds no board model, unit or case at all. */
  boolean isEmpty();

  /** Returns where the history lives, for messages (the file, or the server). */
  String location();

  /** Returns the file (for the embedded store), which backups and restores are placed beside. */
  Path file();

  /** Returns the schema version of the stored history. */
  int schemaVersion();

  /** Closes the store; its sub-stores can no longer be used. */
  @Override
  void close();
}
