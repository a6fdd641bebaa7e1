package com.stagewise.circuit;

/**
 * Bad user data from a file, a form or the command line.
 *
 * <p>The message names where the data came from (a file name or a screen), the field (a JSON path
 * such as {@code parts[2].value}) and what was expected, so that the user knows what to fix.
 */
public final class InvalidInputException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  private final String source;
  private final String field;

  /** Creates an exception whose message is exactly {@code message}; source and field are empty. */
  public InvalidInputException(String message) {
    super(message);
    this.source = "";
    this.field = "";
  }

  /**
   * Creates an exception that names the source, the field and what was expected.
   *
   * @param source the file name or screen the data came from (may be empty)
   * @param field the field, e.g. a JSON path (may be empty)
   * @param problem what is wrong and what was expected
   */
  public InvalidInputException(String source, String field, String problem) {
    super(compose(source, field, problem));
    this.source = source == null ? "" : source;
    this.field = field == null ? "" : field;
  }

  public String source() {
    return source;
  }

  public String field() {
    return field;
  }

  /** Returns a copy of this exception that names {@code newSource} as where the data came from. */
  public InvalidInputException inSource(String newSource) {
    String problem = getMessage();
    String prefix = compose(source, field, "");
    if (!prefix.isEmpty() && problem.startsWith(prefix)) {
      problem = problem.substring(prefix.length());
    }
    return new InvalidInputException(newSource, field, problem);
  }

  private static String compose(String source, String field, String problem) {
    StringBuilder text = new StringBuilder();
    if (source != null && !source.isEmpty()) {
      text.append(source).append(": ");
    }
    if (field != null && !field.isEmpty()) {
      text.append(field).append(": ");
    }
    return text.append(problem).toString();
  }
}
