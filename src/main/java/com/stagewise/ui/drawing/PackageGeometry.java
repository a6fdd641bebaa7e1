package com.stagewise.ui.drawing;

import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Terminal;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Places the body and pins of a dual-in-line package seen from the top, in pixels: pin 1 at the top
 * left beside the notch, pins counted counter-clockwise (down the left side, then up the right
 * side), as every DIP data sheet draws it (common practice).
 */
final class PackageGeometry {
  /** Largest side of a pin's touch target. */
  static final double PAD = 52;

  /** Smallest side of a touch target: 48 px, about 9 mm on a laptop (common practice). */
  static final double MIN_PAD = 48;

  // 58 px: a drawing scaled to about 0.8 in a narrow column still gives each pin a 46 px row to
  // tap.
  static final double MIN_PITCH = 58;
  static final double MAX_PITCH = 62;
  static final double MIN_TEXT_COLUMN = 72;
  static final double MAX_TEXT_COLUMN = 176;
  // Narrow enough to leave a reading's column its room in a 350 px panel, wide enough for
  // "quad-14".
  static final double MIN_BODY = 72;
  static final double MAX_BODY = 150;
  static final double TOP = 40;
  static final double BOTTOM = 30;
  static final double MARGIN = 8;

  /** The size drawn when nothing constrains it. */
  static final double PREFERRED_WIDTH = 2 * (MARGIN + MAX_TEXT_COLUMN + PAD) + MAX_BODY;

  private final int pinCount;
  private final Box body;
  private final List<PinPlace> pins;
  private final double width;
  private final double height;

  /**
   * Where one pin goes.
   *
   * @param pin the pin number, from 1
   * @param left whether the pin is on the left side of the top view
   * @param pad the touch target drawn as the pin
   * @param text the area beside the pad for the pin's name and text, on the outer side
   * @param hit where a touch chooses the pin: its pad and text across the whole pitch, taller than
   *     the pad drawn, so that a drawing scaled down a little still gives a finger its room
   */
  record PinPlace(int pin, boolean left, Box pad, Box text, Box hit) {}

  private PackageGeometry(int pinCount, double roomWidth, double roomHeight, double minColumn) {
    if (pinCount < 2 || pinCount % 2 != 0) {
      throw new IllegalArgumentException(
          "pin count (" + pinCount + ") must be even and at least 2");
    }
    this.pinCount = pinCount;
    int perSide = pinCount / 2;
    // Fit the room: the pitch and text columns shrink down to their minimums, never the pads
    // below 48 px; a room smaller than that is handled by scaling the whole drawing.
    double pitch = clamp((roomHeight - TOP - BOTTOM) / perSide, MIN_PITCH, MAX_PITCH);
    double pad = Math.min(PAD, pitch - 4);
    double besideBody = 2 * (MARGIN + minColumn + 8 + pad - 6);
    double bodyWidth =
        clamp(Math.min(roomWidth * 0.26, roomWidth - besideBody), MIN_BODY, MAX_BODY);
    double column =
        clamp(
            (roomWidth - bodyWidth - 2 * pad - 2 * MARGIN) / 2 - 8,
            minColumn,
            Math.max(minColumn, MAX_TEXT_COLUMN));
    double bodyX = MARGIN + column + 8 + pad - 6;
    body = new Box(bodyX, TOP, bodyWidth, perSide * pitch);
    List<PinPlace> places = new ArrayList<>();
    for (int pin = 1; pin <= pinCount; pin++) {
      boolean left = pin <= perSide;
      int row = left ? pin - 1 : pinCount - pin;
      double cy = TOP + pitch / 2 + row * pitch;
      // The pads overlap the body edge by a few pixels so that they read as legs of the package.
      double padX = left ? bodyX - pad + 6 : bodyX + bodyWidth - 6;
      Box padBox = new Box(padX, cy - pad / 2, pad, pad);
      Box text =
          left
              ? new Box(MARGIN, cy - pad / 2, column, pad)
              : new Box(padX + pad + 8, cy - pad / 2, column, pad);
      double hitLeft = left ? text.x() : padBox.x();
      double hitRight = left ? padBox.right() : text.right();
      Box hit = new Box(hitLeft, cy - pitch / 2, hitRight - hitLeft, pitch);
      places.add(new PinPlace(pin, left, padBox, text, hit));
    }
    pins = List.copyOf(places);
    width = 2 * (MARGIN + column + 8 + pad - 6) + bodyWidth;
    height = body.bottom() + BOTTOM;
  }

  private static double clamp(double value, double min, double max) {
    return Math.max(min, Math.min(max, value));
  }

  /**
   * Returns the geometry of a package with this many pins for a room of the given size in pixels:
   * as large as fits, down to touch targets of 48 px; {@link #width()} and {@link #height()} may
   * then exceed the room.
   *
   * @throws IllegalArgumentException if the count is odd or below 2
   */
  static PackageGeometry of(int pinCount, double roomWidth, double roomHeight) {
    return new PackageGeometry(pinCount, roomWidth, roomHeight, MIN_TEXT_COLUMN);
  }

  /**
   * Returns the geometry for a room, with text columns at least {@code minColumn} wide (so that the
   * widest pin text fits whole; a room too small then scales the drawing instead of cutting text).
   *
   * @throws IllegalArgumentException if the count is odd or below 2
   */
  static PackageGeometry of(int pinCount, double roomWidth, double roomHeight, double minColumn) {
    return new PackageGeometry(
        pinCount, roomWidth, roomHeight, Math.max(MIN_TEXT_COLUMN, minColumn));
  }

  /**
   * Returns the geometry of a package with this many pins.
   *
   * @throws IllegalArgumentException if the count is odd or below 2
   */
  static PackageGeometry of(int pinCount) {
    return new PackageGeometry(pinCount, PREFERRED_WIDTH, 10_000, MIN_TEXT_COLUMN);
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

  /**
   * Returns the pin whose touch target holds the point, if any (its pad, its text area and the gap
   * to the next pin's).
   */
  Optional<Integer> pinAt(double x, double y) {
    for (PinPlace place : pins) {
      if (place.hit().contains(x, y)) {
        return Optional.of(place.pin());
      }
    }
    return Optional.empty();
  }

  double width() {
    return width;
  }

  double height() {
    return height;
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
