package com.stagewise.interchange;

import java.time.DateTimeException;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneOffset;

/** Reads UTC times in the shapes this program writes, faster than {@code Instant.parse}. */
final class UtcText {
  private UtcText() {}

  /**
   * Returns the instant of a UTC time written as {@code Instant.toString} writes whole seconds or
   * milliseconds ({@code 2026-03-04T10:15:30Z}, {@code 2026-03-04T10:15:30.123Z}), or null for any
   * other shape (then {@code Instant.parse} decides). Bundles hold hundreds of thousands of times
   * and {@code Instant.parse} costs several microseconds each.
   */
  static Instant fastUtc(String t) {
    int n = t.length();
    if ((n != 20 && n != 24)
        || t.charAt(4) != '-'
        || t.charAt(7) != '-'
        || t.charAt(10) != 'T'
        || t.charAt(13) != ':'
        || t.charAt(16) != ':'
        || t.charAt(n - 1) != 'Z'
        || (n == 24 && t.charAt(19) != '.')) {
      return null;
    }
    int year = digits(t, 0, 4);
    int month = digits(t, 5, 2);
    int day = digits(t, 8, 2);
    int hour = digits(t, 11, 2);
    int minute = digits(t, 14, 2);
    int second = digits(t, 17, 2);
    int millis = n == 24 ? digits(t, 20, 3) : 0;
    if (year < 0
        || month < 1
        || month > 12
        || day < 1
        || day > 31
        || hour < 0
        || hour > 23
        || minute < 0
        || minute > 59
        || second < 0
        || second > 59
        || millis < 0) {
      return null;
    }
    try {
      return LocalDateTime.of(year, month, day, hour, minute, second, millis * 1_000_000)
          .toInstant(ZoneOffset.UTC);
    } catch (DateTimeException e) {
      return null;
    }
  }

  private static int digits(String text, int from, int count) {
    int value = 0;
    for (int i = from; i < from + count; i++) {
      char c = text.charAt(i);
      if (c < '0' || c > '9') {
        return -1;
      }
      value = value * 10 + (c - '0');
    }
    return value;
  }
}
