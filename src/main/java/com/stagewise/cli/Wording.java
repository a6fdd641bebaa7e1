package com.stagewise.cli;

/** Small pieces of wording that several commands print alike. */
public final class Wording {
  private Wording() {}

  /** Returns the first 8 characters of an id, as listings show it (a prefix finds the case). */
  public static String shortId(String id) {
    return id.substring(0, Math.min(8, id.length()));
  }

  /** Returns a count with its noun, e.g. {@code 1 case}, {@code 3 cases}. */
  public static String plural(int n, String word) {
    return n + " " + word + (n == 1 ? "" : "s");
  }
}
