package com.stagewise.ui.drawing;

import com.stagewise.circuit.PackageType;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;
import java.util.function.IntConsumer;
import javafx.geometry.BoundingBox;
import javafx.geometry.Bounds;
import javafx.geometry.VPos;
import javafx.scene.Cursor;
import javafx.scene.Group;
import javafx.scene.layout.Region;
import javafx.scene.paint.Color;
import javafx.scene.shape.Arc;
import javafx.scene.shape.ArcType;
import javafx.scene.shape.Circle;
import javafx.scene.shape.Rectangle;
import javafx.scene.text.Text;
import javafx.scene.text.TextAlignment;
import javafx.scene.transform.Scale;

/**
 * A top view of an op-amp package (DIP, 8 or 14 pins) with numbered pins, the notch and dot at pin
 * 1, each pin's name, an optional text per pin (a reading, a net name) and one highlighted pin to
 * probe. Every pin is a touch target of at least 48 px at the preferred size.
 */
public final class PackageDrawing extends Region {
  /** The smallest font a pin's text shrinks to before its column widens. */
  private static final double SMALLEST_FONT = 12;

  private final Group content = new Group();
  private final Scale scale = new Scale(1, 1, 0, 0);
  private final Map<Integer, String> pinText = new HashMap<>();
  private PackageType type;
  private String packageRef = "";
  private Map<Integer, String> pinNames = Map.of();
  private int highlighted;
  private int alsoHighlighted;
  private IntConsumer onPinChosen = pin -> {};
  private PackageGeometry geometry = PackageGeometry.of(8);

  /** Creates an empty drawing; {@link #show} gives it a package. */
  public PackageDrawing() {
    getStyleClass().add("package-drawing");
    Palette.paperAndClip(this, this::redraw);
    content.getTransforms().add(scale);
    getChildren().add(content);
    setMinSize(USE_PREF_SIZE, USE_PREF_SIZE);
  }

  /**
   * Shows a package: its type, designator (e.g. "U1") and the name of every pin (e.g. "out A");
   * pins missing from {@code pinNames} get their name from the pinout. Clears the highlight and
   * every pin text.
   */
  public void show(PackageType type, String packageRef, Map<Integer, String> pinNames) {
    this.type = Objects.requireNonNull(type, "type");
    this.packageRef = packageRef == null ? "" : packageRef;
    this.pinNames = pinNames == null ? Map.of() : new LinkedHashMap<>(pinNames);
    this.geometry = fitted(Math.max(getWidth(), 1), Math.max(getHeight(), 1));
    this.highlighted = 0;
    this.alsoHighlighted = 0;
    pinText.clear();
    redraw();
  }

  /** Highlights the pin to probe (0 clears the highlight). */
  public void highlight(int pin) {
    highlight(pin, 0);
  }

  /**
   * Highlights the pins of a pair to read between (power off): the first is spelled out above the
   * package; 0 leaves a place without a pin.
   */
  public void highlight(int pin, int second) {
    highlighted = pin;
    alsoHighlighted = second;
    redraw();
  }

  /** Sets the text shown beside a pin, e.g. a reading or the net name; null or empty clears it. */
  public void setPinText(int pin, String text) {
    if (text == null || text.isEmpty()) {
      pinText.remove(pin);
    } else {
      pinText.put(pin, text);
    }
    // A longer text needs a wider column: laid out anew for it, never drawn shortened in the
    // column of the text before.
    geometry = fitted(Math.max(getWidth(), 1), Math.max(getHeight(), 1));
    requestLayout();
    redraw();
  }

  /** Sets what happens when the user touches or clicks a pin (its pad or its text). */
  public void setOnPinChosen(IntConsumer action) {
    onPinChosen = action == null ? pin -> {} : action;
  }

  /** Returns the highlighted pin, 0 when none. */
  public int highlighted() {
    return highlighted;
  }

  /**
   * Returns where the highlighted pin's touch target stands in the drawing, as drawn (scaled), in
   * the drawing's own coordinates; null when no pin is highlighted. A scrolling panel around the
   * drawing brings it into sight with this.
   */
  public Bounds highlightedBounds() {
    if (highlighted < 1 || highlighted > geometry.pinCount()) {
      return null;
    }
    Box hit = geometry.pin(highlighted).hit();
    return content.localToParent(new BoundingBox(hit.x(), hit.y(), hit.w(), hit.h()));
  }

  @Override
  protected double computePrefWidth(double height) {
    return PackageGeometry.of(pinCount(), PackageGeometry.PREFERRED_WIDTH, 10_000).width();
  }

  @Override
  protected double computePrefHeight(double width) {
    return PackageGeometry.of(pinCount(), PackageGeometry.PREFERRED_WIDTH, 10_000).height();
  }

  @Override
  protected double computeMinWidth(double height) {
    return PackageGeometry.of(pinCount(), 0, 0).width();
  }

  @Override
  protected double computeMinHeight(double width) {
    return PackageGeometry.of(pinCount(), 0, 0).height();
  }

  /**
   * Returns the geometry for a room: text columns wide enough for every pin's name and text whole
   * at the smallest font. Only where narrower columns let the drawing, scaled to the room, keep its
   * pins 48 px (common practice for a finger) are they narrowed, and a longer text shortened
   * ({@link #fit}); a room too narrow for 48 px pins even then keeps every text whole and scales
   * the drawing ({@link #layoutChildren}): shortening "−14.97 V" to "−14.9…" would buy no
   * finger-sized pin and would show a wrong value.
   */
  private PackageGeometry fitted(double roomWidth, double roomHeight) {
    double whole = minColumn();
    PackageGeometry g = PackageGeometry.of(pinCount(), roomWidth, roomHeight, whole);
    if (fingerSized(g, roomWidth, roomHeight)) {
      return g;
    }
    PackageGeometry narrowest =
        PackageGeometry.of(pinCount(), roomWidth, roomHeight, PackageGeometry.MIN_TEXT_COLUMN);
    if (!fingerSized(narrowest, roomWidth, roomHeight)) {
      return g;
    }
    for (double column = whole - 4; column > PackageGeometry.MIN_TEXT_COLUMN; column -= 4) {
      g = PackageGeometry.of(pinCount(), roomWidth, roomHeight, column);
      if (fingerSized(g, roomWidth, roomHeight)) {
        return g;
      }
    }
    return narrowest;
  }

  /**
   * Whether the drawing, scaled to the room as {@link #layoutChildren} scales it, keeps its pins at
   * least 48 px (a room too low scales the drawing whatever its columns: narrower texts then buy
   * nothing).
   */
  private static boolean fingerSized(PackageGeometry g, double roomWidth, double roomHeight) {
    double s = Math.min(1, Math.min(roomWidth / g.width(), roomHeight / g.height()));
    // A hair of rounding must not count as a pin too small: 47.99 px is a 48 px pin.
    return s * g.pin(1).pad().w() >= PackageGeometry.MIN_PAD - 0.05;
  }

  /**
   * Returns the width a pin's text column needs so that every pin's name and text fit whole at the
   * smallest font the drawing uses ({@link #fit}); a smaller room scales the drawing as a whole.
   */
  private double minColumn() {
    double widest = 0;
    if (type != null) {
      for (int pin = 1; pin <= type.pinCount(); pin++) {
        String name = pinNames.getOrDefault(pin, PackageGeometry.pinName(type, pin));
        widest = Math.max(widest, width(name, true));
        String extra = pinText.get(pin);
        if (extra != null) {
          widest = Math.max(widest, width(extra, true));
        }
      }
    }
    return widest + 16;
  }

  private static double width(String value, boolean bold) {
    Text text = new Text(value);
    text.setFont(bold ? Palette.bold(SMALLEST_FONT) : Palette.font(SMALLEST_FONT));
    return Math.ceil(text.getLayoutBounds().getWidth());
  }

  private int pinCount() {
    return type == null ? 8 : type.pinCount();
  }

  @Override
  protected void layoutChildren() {
    PackageGeometry fitted = fitted(getWidth(), getHeight());
    if (fitted.width() != geometry.width()
        || fitted.height() != geometry.height()
        || fitted.pin(1).text().w() != geometry.pin(1).text().w()) {
      geometry = fitted;
      redraw();
    }
    // Scale down only when the room is smaller than the smallest layout with 48 px targets.
    double fit = Math.min(getWidth() / geometry.width(), getHeight() / geometry.height());
    double s = Math.max(0.3, Math.min(1.0, fit));
    scale.setX(s);
    scale.setY(s);
    content.setLayoutX(Math.max(0, (getWidth() - geometry.width() * s) / 2));
    content.setLayoutY(Math.max(0, (getHeight() - geometry.height() * s) / 2));
  }

  private void redraw() {
    content.getChildren().clear();
    Rectangle paper = new Rectangle(geometry.width(), geometry.height(), Palette.PAPER);
    content.getChildren().add(paper);
    if (type == null) {
      return;
    }
    Box body = geometry.body();
    for (PackageGeometry.PinPlace place : geometry.pins()) {
      drawPin(place);
    }
    Rectangle bodyShape = new Rectangle(body.x(), body.y(), body.w(), body.h());
    bodyShape.setArcWidth(10);
    bodyShape.setArcHeight(10);
    bodyShape.setFill(Palette.BODY);
    // The notch at the top edge and the dot beside pin 1 mark the pin-1 end, as on real parts.
    Arc notch = new Arc(body.cx(), body.y(), 18, 14, 180, 180);
    notch.setType(ArcType.ROUND);
    notch.setFill(Palette.PAPER);
    Circle dot = new Circle(body.x() + 24, body.y() + 26, 9, Palette.PAPER);
    Text ref = text(packageRef, body.cx(), body.cy() - 14, Palette.bold(22));
    ref.setFill(Palette.PAPER);
    Text kind = text(type.word(), body.cx(), body.cy() + 14, Palette.font(15));
    kind.setFill(Palette.PAPER);
    Text caption =
        text(
            "top view, pin 1 at the notch",
            geometry.width() / 2,
            body.bottom() + 16,
            Palette.font(14));
    caption.setFill(Palette.SOFT_INK);
    // The pin to probe, spelled out above the package where it has the whole width.
    Text probe = new Text(probeLine());
    probe.setId("probe-line");
    probe.setFont(Palette.bold(17));
    probe.setFill(Palette.INK);
    probe.setTextOrigin(VPos.CENTER);
    fit(probe, geometry.width() - 16, true);
    probe.setX((geometry.width() - probe.getLayoutBounds().getWidth()) / 2);
    probe.setY(19);
    content.getChildren().add(probe);
    content.getChildren().addAll(bodyShape, notch, dot, ref, kind, caption);
    for (PackageGeometry.PinPlace place : geometry.pins()) {
      drawPinNumber(place);
    }
  }

  /** Returns e.g. "pin 6 · in− B · SUM +0.02 V" for the highlighted pin, or nothing. */
  private String probeLine() {
    if (highlighted < 1 || highlighted > geometry.pinCount()) {
      return "";
    }
    String name = pinNames.getOrDefault(highlighted, PackageGeometry.pinName(type, highlighted));
    String extra = pinText.get(highlighted);
    return "pin " + highlighted + " \u00b7 " + name + (extra == null ? "" : " \u00b7 " + extra);
  }

  private void drawPin(PackageGeometry.PinPlace place) {
    boolean on = place.pin() == highlighted || place.pin() == alsoHighlighted;
    Box pad = place.pad();
    Group pin = new Group();
    pin.setId("pin-" + place.pin());
    pin.setCursor(Cursor.HAND);
    // Unseen, and taller than the pad: the whole pitch takes the touch (a transparent fill still
    // takes it, a missing one would not).
    Box hit = place.hit();
    Rectangle hitArea = new Rectangle(hit.x(), hit.y(), hit.w(), hit.h());
    hitArea.setFill(Color.TRANSPARENT);
    Rectangle target = new Rectangle(pad.x(), pad.y(), pad.w(), pad.h());
    target.setArcWidth(8);
    target.setArcHeight(8);
    target.setFill(on ? Palette.HIGHLIGHT : Palette.PIN_FILL);
    target.setStroke(on ? Palette.HIGHLIGHT_RING : Palette.SOFT_INK);
    target.setStrokeWidth(on ? 4 : 1.5);
    Box area = place.text();
    Rectangle textTarget = new Rectangle(area.x(), area.y(), area.w(), area.h());
    textTarget.setArcWidth(8);
    textTarget.setArcHeight(8);
    textTarget.setFill(on ? Palette.HIGHLIGHT.deriveColor(0, 0.45, 1.15, 1) : Palette.PAPER);
    textTarget.setStroke(on ? Palette.HIGHLIGHT_RING : null);
    textTarget.setStrokeWidth(2);
    String name = pinNames.getOrDefault(place.pin(), PackageGeometry.pinName(type, place.pin()));
    double inner = place.left() ? area.right() - 10 : area.x() + 10;
    Text nameText = new Text(name);
    nameText.setFont(on ? Palette.bold(19) : Palette.font(17));
    fit(nameText, area.w() - 14, on);
    nameText.setFill(Palette.INK);
    nameText.setTextOrigin(VPos.CENTER);
    place(
        nameText,
        inner,
        area.y() + (pinText.containsKey(place.pin()) ? 16 : area.h() / 2),
        place.left());
    pin.getChildren().addAll(hitArea, target, textTarget, nameText);
    String extra = pinText.get(place.pin());
    if (extra != null) {
      Text extraText = new Text(extra);
      extraText.setFont(Palette.bold(16));
      fit(extraText, area.w() - 14, true);
      extraText.setFill(Palette.EXPECTED);
      extraText.setTextOrigin(VPos.CENTER);
      place(extraText, inner, area.y() + 37, place.left());
      pin.getChildren().add(extraText);
    }
    int number = place.pin();
    pin.setOnMouseClicked(event -> onPinChosen.accept(number));
    content.getChildren().add(pin);
  }

  private void drawPinNumber(PackageGeometry.PinPlace place) {
    boolean on = place.pin() == highlighted || place.pin() == alsoHighlighted;
    Box pad = place.pad();
    Text number =
        text(
            Integer.toString(place.pin()),
            pad.cx(),
            pad.cy(),
            on ? Palette.bold(30) : Palette.bold(18));
    number.setFill(Palette.INK);
    number.setMouseTransparent(true);
    content.getChildren().add(number);
  }

  /**
   * Shrinks the text's font until the text fits the width, down to 12 px, then shortens it with an
   * ellipsis.
   */
  private static void fit(Text text, double width, boolean bold) {
    double size = text.getFont().getSize();
    while (size > SMALLEST_FONT && text.getLayoutBounds().getWidth() > width) {
      size -= 1;
      text.setFont(bold ? Palette.bold(size) : Palette.font(size));
    }
    String full = text.getText();
    int keep = full.length();
    while (keep > 1 && text.getLayoutBounds().getWidth() > width) {
      keep--;
      text.setText(full.substring(0, keep).stripTrailing() + "\u2026");
    }
  }

  private static void place(Text text, double x, double y, boolean rightAligned) {
    double width = text.getLayoutBounds().getWidth();
    text.setX(rightAligned ? x - width : x);
    text.setY(y);
  }

  private static Text text(String value, double cx, double cy, javafx.scene.text.Font font) {
    Text text = new Text(value);
    text.setFont(font);
    text.setTextOrigin(VPos.CENTER);
    text.setTextAlignment(TextAlignment.CENTER);
    text.setX(cx - text.getLayoutBounds().getWidth() / 2);
    text.setY(cy);
    return text;
  }
}
