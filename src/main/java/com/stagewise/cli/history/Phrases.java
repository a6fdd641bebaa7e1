package com.stagewise.cli.history;

/** Small pieces of wording that several history commands print alike. */
public final class Phrases {
  private Phrases() {}

  /** Returns a count with its noun, e.g. {@code 1 case}, {@code 3 cases}. */
  public static String plural(int n, String word) {
    return n + " " + word + (n == 1 ? "" : "s");
  }
}
