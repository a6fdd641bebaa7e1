package com.stagewise.circuit;

/** The five terminals of an op-amp section. */
public enum Terminal {
  IN_PLUS("in+", "non-inverting input", "inPlus"),
  IN_MINUS("in-", "inverting input", "inMinus"),
  OUT("out", "output", "out"),
  V_PLUS("v+", "positive supply pin", "vPlus"),
  V_MINUS("v-", "negative supply pin", "vMinus");

  private final String symbol;
  private final String words;
  private final String key;

  Terminal(String symbol, String words, String key) {
    this.symbol = symbol;
    this.words = words;
    this.key = key;
  }

  /** Returns the key of the terminal's net in a stage sheet, e.g. {@code inPlus}. */
  public String key() {
    return key;
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
