package com.stagewise.circuit;

/** The five terminals of an op-amp section. */
public enum Terminal {
  IN_PLUS("in+", "non-inverting input"),
  IN_MINUS("in-", "inverting input"),
  OUT("out", "output"),
  V_PLUS("v+", "positive supply pin"),
  V_MINUS("v-", "negative supply pin");

  private final String symbol;
  private final String words;

  Terminal(String symbol, String words) {
    this.symbol = symbol;
    this.words = words;
  }

  /** Returns the short symbol, e.g. {@code in+}. */
  public String symbol() {
    return symbol;
  }

  /** Returns the terminal in a technician's words, e.g. {@code non-inverting input}. */
  public String words() {
    return words;
  }

  /** Returns whether this is a supply pin. */
  public boolean isSupply() {
    return this == V_PLUS || this == V_MINUS;
  }
}
