package com.stagewise.history.record;

import java.time.Instant;
import java.time.temporal.ChronoUnit;

/** Normalises times to the precision the database keeps (milliseconds). */
final class Times {
  private Times() {}

  static Instant millis(Instant time) {
    return time == null ? null : time.truncatedTo(ChronoUnit.MILLIS);
  }

  static String text(String value, String role) {
    if (value == null) {
      throw new NullPointerException(role + " must not be null (use an empty string)");
    }
    return value;
  }
}
