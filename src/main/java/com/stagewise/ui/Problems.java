package com.stagewise.ui;

/**
 * Tells the technician about a problem in plain words: what happened and what to do about it.
 *
 * <p>The app shows a dialog; tests collect the messages.
 */
public interface Problems {

  /**
   * Shows a problem.
   *
   * @param title a few words, e.g. "Could not save the case"
   * @param what what happened, in a technician's words
   * @param todo what to do now
   */
  void show(String title, String what, String todo);

  /**
   * Shows that an AC amplitude was typed with a minus sign; what was typed stays on the pad to be
   * put right.
   *
   * @param volts the value typed
   */
  default void negativeAmplitude(double volts) {
    show(
        "An AC amplitude has no sign",
        "The pad holds " + com.stagewise.ui.words.Words.measured(volts) + ", below 0 V.",
        "Type the amplitude the meter or scope shows, 0 V or more: take the minus sign away.");
  }

  /** Shows a failed piece of work with the exception's message as "what happened". */
  default void failed(String title, Exception e, String todo) {
    String message =
        e.getMessage() == null || e.getMessage().isBlank() ? e.toString() : e.getMessage();
    show(title, message, todo);
  }
}
