package com.stagewise.history;

import java.nio.file.Path;
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
 * <p>{@code history.sqlite.SqliteHistory} opens the embedded SQLite file and {@code
 * history.postgres.PgHistory} the shop server; both pass the same contract tests. The contract
 * knows neither, so that it stays free of storage detail.
 */
public interface HistoryStore extends AutoCloseable {

  /** Returns a new stable id (a random lower-case UUID). */
  static String newId() {
    return UUID.randomUUID().toString();
  }

  /**
   * Returns the first 8 characters of an id, as listings and reports show it (a prefix finds the
   * case).
   */
  static String shortId(String id) {
    return id.substring(0, Math.min(8, id.length()));
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
