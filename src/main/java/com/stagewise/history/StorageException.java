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

  private final boolean unusableFile;

  /** Creates an exception with a message for the user. */
  public StorageException(String message) {
    this(message, null, false);
  }

  /** Creates an exception with a message for the user and the failure underneath it. */
  public StorageException(String message, Throwable cause) {
    this(message, cause, false);
  }

  private StorageException(String message, Throwable cause, boolean unusableFile) {
    super(message, cause);
    this.unusableFile = unusableFile;
  }

  /**
   * Returns an exception for a file the user named that cannot serve as a history at all (not a
   * regular file, not a history, made by a newer program, damaged, missing, in a folder that takes
   * no files): bad input, which the file was left as it is for.
   */
  public static StorageException unusableFile(String message) {
    return new StorageException(message, null, true);
  }

  /** Returns an exception as {@link #unusableFile(String)} does, with the failure underneath. */
  public static StorageException unusableFile(String message, Throwable cause) {
    return new StorageException(message, cause, true);
  }

  /** Returns whether the file itself was refused (bad input), rather than a write that failed. */
  public boolean isUnusableFile() {
    return unusableFile;
  }
}
