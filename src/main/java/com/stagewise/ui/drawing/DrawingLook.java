package com.stagewise.ui.drawing;

import javafx.beans.property.BooleanProperty;
import javafx.beans.property.SimpleBooleanProperty;

/**
 * The look every drawing on screen follows: the high-contrast setting of the bench reaches the
 * schematic, the package and the band charts here (the screens' texts follow it through their style
 * sheets). Used on the JavaFX thread only.
 */
public final class DrawingLook {
  private static final BooleanProperty HIGH_CONTRAST = new SimpleBooleanProperty(false);

  static {
    // Registered first, so that the colours change before any drawing repaints.
    HIGH_CONTRAST.addListener((o, was, on) -> Palette.use(on));
  }

  private DrawingLook() {}

  /** Returns the switch: true for the darker, heavier colours of a dim bench. */
  public static BooleanProperty highContrast() {
    return HIGH_CONTRAST;
  }
}
