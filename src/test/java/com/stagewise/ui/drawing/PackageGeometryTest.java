package com.stagewise.ui.drawing;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.PackageType;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.EnumSource;

class PackageGeometryTest {

  @ParameterizedTest
  @EnumSource(PackageType.class)
  void pins_areCountedCounterClockwiseFromTopLeft(PackageType type) {
    // DIP top view: pin 1 top left, down the left side, up the right side (common practice).
    PackageGeometry g = PackageGeometry.of(type.pinCount());
    int perSide = type.pinCount() / 2;
    assertThat(g.pin(1).left()).isTrue();
    assertThat(g.pin(1).pad().y()).isLessThan(g.pin(2).pad().y());
    assertThat(g.pin(perSide).left()).isTrue();
    assertThat(g.pin(perSide + 1).left()).isFalse();
    // The first pin on the right side is opposite the last on the left (bottom right).
    assertThat(g.pin(perSide + 1).pad().cy()).isEqualTo(g.pin(perSide).pad().cy());
    // The last pin is opposite pin 1 (top right).
    assertThat(g.pin(type.pinCount()).pad().cy()).isEqualTo(g.pin(1).pad().cy());
    for (int pin = perSide + 1; pin < type.pinCount(); pin++) {
      assertThat(g.pin(pin + 1).pad().cy()).isLessThan(g.pin(pin).pad().cy());
    }
  }

  @ParameterizedTest
  @EnumSource(PackageType.class)
  void targets_areAtLeast48PixelsAndDoNotOverlap(PackageType type) {
    PackageGeometry g = PackageGeometry.of(type.pinCount());
    for (PackageGeometry.PinPlace a : g.pins()) {
      assertThat(a.pad().w()).isGreaterThanOrEqualTo(48);
      assertThat(a.pad().h()).isGreaterThanOrEqualTo(48);
      assertThat(g.pinAt(a.pad().cx(), a.pad().cy())).contains(a.pin());
      assertThat(g.pinAt(a.text().cx(), a.text().cy())).contains(a.pin());
      for (PackageGeometry.PinPlace b : g.pins()) {
        if (a != b) {
          assertThat(a.pad().overlaps(b.pad())).as("pads %d and %d", a.pin(), b.pin()).isFalse();
          assertThat(a.text().overlaps(b.text())).as("texts %d and %d", a.pin(), b.pin()).isFalse();
          assertThat(a.pad().overlaps(b.text())).as("pad %d, text %d", a.pin(), b.pin()).isFalse();
        }
      }
    }
    assertThat(g.pinAt(g.body().cx(), g.body().cy())).isEmpty();
  }

  @ParameterizedTest
  // A 14-pin package needs 7 rows of at least 58 px plus 70 px above and below: 476 px.
  @CsvSource({"8, 370, 330", "14, 370, 480", "14, 350, 476", "8, 900, 700"})
  void fittedToARoom_keepsTargetsAt48PixelsAndFitsWhereItCan(
      int pins, double width, double height) {
    PackageGeometry g = PackageGeometry.of(pins, width, height);
    assertThat(g.width()).isLessThanOrEqualTo(width);
    assertThat(g.height()).isLessThanOrEqualTo(height);
    for (PackageGeometry.PinPlace place : g.pins()) {
      assertThat(place.pad().w()).isGreaterThanOrEqualTo(48);
      assertThat(place.pad().right()).isLessThanOrEqualTo(g.width());
      assertThat(place.text().x()).isGreaterThanOrEqualTo(0);
      assertThat(place.text().right()).isLessThanOrEqualTo(g.width());
    }
  }

  @ParameterizedTest
  @EnumSource(PackageType.class)
  void hitRows_coverTheWholePitch_soATapBetweenTwoPinsTextsChoosesOne(PackageType type) {
    PackageGeometry g = PackageGeometry.of(type.pinCount(), 330, 200);
    for (PackageGeometry.PinPlace a : g.pins()) {
      // Taller than the pad drawn: a drawing scaled to 0.8 still leaves a 46 px row, above the
      // 44 px that common practice allows for a touch target (48 px, 9 mm, preferred).
      assertThat(a.hit().h()).isGreaterThanOrEqualTo(58);
      assertThat(a.hit().h()).isGreaterThan(a.pad().h());
      assertThat(g.pinAt(a.hit().cx(), a.hit().y() + 1)).contains(a.pin());
      for (PackageGeometry.PinPlace b : g.pins()) {
        if (a != b) {
          Box inner = new Box(a.hit().x(), a.hit().y() + 0.5, a.hit().w(), a.hit().h() - 1);
          assertThat(inner.overlaps(b.hit())).as("rows %d and %d", a.pin(), b.pin()).isFalse();
        }
      }
    }
  }

  @Test
  void tooSmallARoom_stillKeeps48PixelTargets() {
    PackageGeometry g = PackageGeometry.of(14, 100, 100);
    assertThat(g.pins()).allMatch(p -> p.pad().w() >= 48 && p.pad().h() >= 48);
    assertThat(g.width()).isGreaterThan(100);
  }

  @ParameterizedTest
  @CsvSource({
    // The pinouts of DESIGN.md (industry-standard single, dual and quad op-amp packages).
    "single-8, 2, in\u2212",
    "single-8, 6, out",
    "single-8, 1, offset",
    "single-8, 8, n/c",
    "dual-8, 1, out A",
    "dual-8, 5, in+ B",
    "dual-8, 4, v\u2212",
    "dual-8, 8, v+",
    "quad-14, 4, v+",
    "quad-14, 11, v\u2212",
    "quad-14, 9, in\u2212 C",
    "quad-14, 14, out D",
  })
  void pinName_followsThePinout(String type, int pin, String name) {
    assertThat(PackageGeometry.pinName(PackageType.of(type), pin)).isEqualTo(name);
  }
}
