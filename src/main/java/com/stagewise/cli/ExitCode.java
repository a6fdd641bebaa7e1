package com.stagewise.cli;

/** The process exit codes of the command line (DESIGN.md). */
public final class ExitCode {
  /** Everything went as asked. */
  public static final int OK = 0;

  /** Something went wrong inside Stagewise (a bug or a storage failure). */
  public static final int INTERNAL_ERROR = 1;

  /** The input was bad: the message names the file, the field and what was expected. */
  public static final int BAD_INPUT = 2;

  private ExitCode() {}
}
