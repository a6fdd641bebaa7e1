package com.stagewise.ui;

import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;

/** The safety caution: its words, and when it must be shown. */
public final class SafetyCaution {

  /** Rails above this many volts (either polarity) bring the caution up again (common practice). */
  public static final double HIGH_RAIL_VOLTS = 50.0;

  /** The caution's heading. */
  public static final String TITLE = "Before you work on a powered unit";

  /** The caution's text, one point per line. */
  public static final String TEXT =
      String.join(
          "\n",
          "Working on powered equipment can kill or injure you.",
          "Mains-powered units carry lethal voltages, also inside, also after unplugging.",
          "Discharge the capacitors before any ohms check.",
          "Follow your local codes and licensed practice.",
          "Stagewise never tells you that a unit is safe.");

  /** The label of the button that acknowledges the caution. */
  public static final String ACKNOWLEDGE = "I understand";

  /** Why the caution is shown. */
  public enum Reason {
    FIRST_RUN(""),
    MAINS("This unit is mains-powered."),
    HIGH_RAILS("This stage has a rail above " + (int) HIGH_RAIL_VOLTS + " V.");

    private final String line;

    Reason(String line) {
      this.line = line;
    }

    /** Returns the extra line shown above the caution (empty for the first run). */
    public String line() {
      return line;
    }
  }

  private SafetyCaution() {}

  /** Returns whether any rail of the stage is above {@link #HIGH_RAIL_VOLTS} in magnitude. */
  public static boolean hasHighRails(Stage stage) {
    for (Rail rail : stage.rails()) {
      if (Math.abs(rail.volts()) > HIGH_RAIL_VOLTS) {
        return true;
      }
    }
    return false;
  }
}
