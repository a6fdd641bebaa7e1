package com.stagewise.history;

/**
 * A failure of the history database: it cannot be opened, it is damaged, or a write failed.
 *
 * <p>The message is meant for the user: it names the database file and says what went wrong and,
 * where there is one, what to do about it. The underlying {@code SQLException} (if any) is the
 * cause.
 */
public final class StorageException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  /** Creates an exception with a message for the user. */
  public StorageException(String message) {
    super(message);
  }

  /** Creates an exception with a message for the user and the failure underneath it. */
  public StorageException(String message, Throwable cause) {
    super(message, cause);
  }
}
