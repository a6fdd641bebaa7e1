package com.stagewise.ui;

/** Shows the safety caution and waits for the technician's "I understand". */
public interface Caution {

  /** Shows the caution for {@code reason}; runs {@code then} after it is acknowledged. */
  void show(SafetyCaution.Reason reason, Runnable then);
}
