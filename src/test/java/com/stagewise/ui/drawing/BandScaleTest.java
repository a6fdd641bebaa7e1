package com.stagewise.ui.drawing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.value.Engineering;
import java.util.List;
import org.junit.jupiter.api.Test;

class BandScaleTest {

  @Test
  void fit_holdsBandReadingAndMarkersWithMargin() {
    BandScale s = BandScale.fit(-4.8, -4.6, 13.4, List.of(-13.5, 0.0));
    assertThat(s.min()).isLessThan(-13.5);
    assertThat(s.max()).isGreaterThan(13.4);
    assertThat(s.position(s.min(), 500)).isEqualTo(0);
    assertThat(s.position(s.max(), 500)).isEqualTo(500, within(1e-9));
  }

  @Test
  void fit_equalLowAndHigh_givesAnAxisAroundTheValue() {
    BandScale s = BandScale.fit(2.5, 2.5, Double.NaN, List.of());
    assertThat(s.min()).isLessThan(2.5);
    assertThat(s.max()).isGreaterThan(2.5);
    assertThat(s.position(2.5, 100)).isEqualTo(50, within(1e-9));
  }

  @Test
  void fit_ignoresNonFiniteValues() {
    BandScale s =
        BandScale.fit(Double.NaN, Double.NaN, Double.NaN, List.of(Double.POSITIVE_INFINITY));
    assertThat(s).isEqualTo(new BandScale(-1, 1));
  }

  @Test
  void ticks_areRoundAndInsideTheSpan() {
    List<Double> ticks = new BandScale(-13.9, 14.2).ticks(6);
    assertThat(ticks).contains(0.0, 5.0, -5.0, 10.0, -10.0);
    assertThat(ticks).allMatch(t -> t >= -13.9 && t <= 14.2);
  }

  @Test
  void labelRows_separatesOverlappingLabels() {
    int[] rows =
        BandScale.labelRows(new double[] {100, 110, 300, 105}, new double[] {60, 60, 60, 60}, 8);
    assertThat(rows).containsExactly(0, 1, 0, 2);
  }

  @Test
  void voltText_usesRealMinusAndIgnoresLocale() {
    // The suite runs in a decimal-comma locale; the drawings must still print a decimal point.
    // Values and bands on the chart come from Engineering (its own table test); the chart's texts:
    assertThat(Engineering.volts(-4.7)).isEqualTo("\u22124.7\u00a0V");
    assertThat(Engineering.reading(13.412, MeterSpec.DEFAULT)).isEqualTo("13.41\u00a0V");
    assertThat(Engineering.volts(0.0234)).isEqualTo("23.4\u00a0mV");
    assertThat(Engineering.reading(-0.00001, MeterSpec.DEFAULT)).isEqualTo("0.0\u00a0mV");
    assertThat(VoltText.tick(-2.5)).isEqualTo("\u22122.5");
    assertThat(VoltText.tick(0)).isEqualTo("0");
  }
}
