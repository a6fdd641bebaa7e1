package com.stagewise.ui;

/** The screens of the bench app, in the order a repair goes through them. */
public enum Step {
  UNIT("Unit", "Find the unit and open a case"),
  STAGE("Stage", "Choose the stage and check its parts"),
  READINGS("Readings", "Probe the pins and enter what the meter shows"),
  SUSPECTS("Suspects", "What the readings point to"),
  CLOSE_OUT("Close-out", "What was done and how it ended"),
  HISTORY("History", "Earlier cases of every unit");

  private final String title;
  private final String purpose;

  Step(String title, String purpose) {
    this.title = title;
    this.purpose = purpose;
  }

  /** Returns the screen's name as shown on its button. */
  public String title() {
    return title;
  }

  /** Returns one line saying what the screen is for. */
  public String purpose() {
    return purpose;
  }

  /** Returns whether the screen belongs to an open case (it needs a case to be useful). */
  public boolean needsCase() {
    return this == STAGE || this == READINGS || this == SUSPECTS || this == CLOSE_OUT;
  }
}
