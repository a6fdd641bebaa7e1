package com.stagewise.ui.drawing;

import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Terminal;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Places the body and pins of a dual-in-line package seen from the top, in pixels: pin 1 at the
 * top left beside the notch, pins counted counter-clockwise (down the left side, then up the right
 * side), as every DIP data sheet draws it (common practice).
 */
final class PackageGeometry {
  /** Side of a pin's touch target; at least 48 px, about 9 mm on a laptop (common practice). */
  static final double PAD = 52;
  /** Distance between neighbouring pins on one side. */
  static final double PITCH = 62;
  /** Width of the text column beside each side (pin name above, pin text below). */
  static final double TEXT_COLUMN = 176;
  static final double BODY_WIDTH = 150;
  static final double TOP = 56;
  static final double BOTTOM = 24;
  static final double MARGIN = 12;

  private final int pinCount;
  private final Box body;
  private final List<PinPlace> pins;

  /**
   * Where one pin goes.
   *
   * @param pin the pin number, from 1
   * @param left whether the pin is on the left side of the top view
   * @param pad the touch target drawn as the pin
   * @param text the area beside the pad for the pin's name and text, on the outer side
   */
  record PinPlace(int pin, boolean left, Box pad, Box text) {}

  private PackageGeometry(int pinCount) {
    if (pinCount < 2 || pinCount % 2 != 0) {
      throw new IllegalArgumentException("pin count (" + pinCount + ") must be even and at least 2");
    }
    this.pinCount = pinCount;
    int perSide = pinCount / 2;
    double bodyX = MARGIN + TEXT_COLUMN + PAD;
    body = new Box(bodyX, TOP, BODY_WIDTH, perSide * PITCH);
    List<PinPlace> places = new ArrayList<>();
    for (int pin = 1; pin <= pinCount; pin++) {
      boolean left = pin <= perSide;
      int row = left ? pin - 1 : pinCount - pin;
      double cy = TOP + PITCH / 2 + row * PITCH;
      // The pads overlap the body edge by a few pixels so that they read as legs of the package.
      double padX = left ? bodyX - PAD + 6 : bodyX + BODY_WIDTH - 6;
      Box pad = new Box(padX, cy - PAD / 2, PAD, PAD);
      Box text =
          left
              ? new Box(MARGIN, cy - PAD / 2, TEXT_COLUMN - 8, PAD)
              : new Box(padX + PAD + 8, cy - PAD / 2, TEXT_COLUMN - 8, PAD);
      places.add(new PinPlace(pin, left, pad, text));
    }
    pins = List.copyOf(places);
  }

  /**
   * Returns the geometry of a package with this many pins.
   *
   * @throws IllegalArgumentException if the count is odd or below 2
   */
  static PackageGeometry of(int pinCount) {
    return new PackageGeometry(pinCount);
  }

  int pinCount() {
    return pinCount;
  }

  Box body() {
    return body;
  }

  List<PinPlace> pins() {
    return pins;
  }

  /** Returns the place of one pin (1-based). */
  PinPlace pin(int pin) {
    return pins.get(pin - 1);
  }

  /** Returns the pin whose touch target holds the point, if any (pad or its text area). */
  Optional<Integer> pinAt(double x, double y) {
    for (PinPlace place : pins) {
      if (place.pad().contains(x, y) || place.text().contains(x, y)) {
        return Optional.of(place.pin());
      }
    }
    return Optional.empty();
  }

  double width() {
    return 2 * (MARGIN + TEXT_COLUMN + PAD) + BODY_WIDTH;
  }

  double height() {
    return body.bottom() + BOTTOM;
  }

  /**
   * Returns the usual short name of a pin from the package's pinout, e.g. "out A", "in− B", "v+",
   * "offset", "n/c".
   */
  static String pinName(PackageType type, int pin) {
    Optional<PackageType.PinRole> role = type.role(pin);
    if (role.isEmpty()) {
      // The single op-amp pinout has offset-null pins 1 and 5 and pin 8 not connected (DESIGN.md).
      return type == PackageType.SINGLE_8 && (pin == 1 || pin == 5) ? "offset" : "n/c";
    }
    Terminal terminal = role.get().terminal();
    String symbol =
        switch (terminal) {
          case IN_PLUS -> "in+";
          case IN_MINUS -> "in\u2212";
          case OUT -> "out";
          case V_PLUS -> "v+";
          case V_MINUS -> "v\u2212";
        };
    String section = role.get().section();
    boolean oneSection = type.sections().size() == 1;
    return section.isEmpty() || oneSection ? symbol : symbol + " " + section;
  }
}
