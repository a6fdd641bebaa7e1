package com.stagewise.ui;

/** Which board models are mains-powered (so that their cases bring up the safety caution). */
public interface BoardFlags {

  /** Returns whether units of this board model are mains-powered. */
  boolean isMainsPowered(String boardModelId);

  /** Records whether units of this board model are mains-powered. */
  void setMainsPowered(String boardModelId, boolean mains);
}
