package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;

/**
 * Power-off resistance between two points against closed forms of circuit theory (series and
 * parallel resistors, the balanced and unbalanced Wheatstone bridge: any circuits textbook) and
 * against a brute-force nodal solve of random networks.
 */
class PowerOffTest {
  /** Relative agreement with the closed forms (they are exact; only rounding differs). */
  private static final double REL = 1e-9;

  private static Stage network(List<Part> parts) {
    return new Stage("ohms test", "", "GND", List.of(), List.of(), parts, List.of());
  }

  private static Part r(String ref, double ohms, String a, String b) {
    return Part.resistor(ref, ohms, 0.01, a, b);
  }

  private static double parallel(double... rs) {
    double g = 0;
    for (double r : rs) {
      g += 1 / r;
    }
    return 1 / g;
  }

  @Nested
  class ClosedForms {
    @Test
    void seriesResistors_add() {
      // Series resistors add (any circuits textbook).
      PowerOff off =
          PowerOff.of(network(List.of(r("R1", 1000, "A", "B"), r("R2", 2200, "B", "C"))));
      assertThat(off.ohms("A", "C")).isCloseTo(3200, within(3200 * REL));
      assertThat(off.ohms("C", "A")).isCloseTo(3200, within(3200 * REL));
    }

    @Test
    void partInCircuit_readsInParallelWithTheRestOfTheNetwork() {
      // Across R1: R1 in parallel with R2 + R3 in series (any circuits textbook).
      PowerOff off =
          PowerOff.of(
              network(
                  List.of(
                      r("R1", 10e3, "A", "B"), r("R2", 4700, "B", "C"), r("R3", 3300, "C", "A"))));
      double expected = parallel(10e3, 4700 + 3300);
      assertThat(off.ohms("R1.1", "R1.2")).isCloseTo(expected, within(expected * REL));
      assertThat(off.ohms("A", "B")).isCloseTo(expected, within(expected * REL));
    }

    @Test
    void balancedWheatstoneBridge_detectorArmCarriesNothing() {
      // Balanced bridge R1/R2 = R3/R4: the detector resistor R5 carries no current, so A–D reads
      // (R1 + R2) ∥ (R3 + R4) whatever R5 is (Wheatstone bridge, any circuits textbook).
      PowerOff off =
          PowerOff.of(
              network(
                  List.of(
                      r("R1", 1000, "A", "B"),
                      r("R2", 2000, "B", "D"),
                      r("R3", 1500, "A", "C"),
                      r("R4", 3000, "C", "D"),
                      r("R5", 777, "B", "C"))));
      double expected = parallel(3000, 4500);
      assertThat(off.ohms("A", "D")).isCloseTo(expected, within(expected * REL));
    }

    @Test
    void unbalancedWheatstoneBridge_matchesTheDeltaWyeResult() {
      // Unbalanced bridge, all arms and the detector 1 kΩ except R4 = 2 kΩ: the delta–wye
      // transformation of the triangle A–B–C (any circuits textbook) gives
      // Ra = Rb = Rc = 1/3 kΩ, then Ra + (Rb + R2) ∥ (Rc + R4) = 1/3 + (4/3 ∥ 7/3) kΩ.
      PowerOff off =
          PowerOff.of(
              network(
                  List.of(
                      r("R1", 1000, "A", "B"),
                      r("R2", 1000, "B", "D"),
                      r("R3", 1000, "A", "C"),
                      r("R4", 2000, "C", "D"),
                      r("R5", 1000, "B", "C"))));
      double expected = 1000.0 / 3 + parallel(4000.0 / 3, 7000.0 / 3);
      assertThat(off.ohms("A", "D")).isCloseTo(expected, within(expected * REL));
    }

    @Test
    void nothingConnects_readsOverRange() {
      PowerOff off =
          PowerOff.of(network(List.of(r("R1", 1000, "A", "B"), r("R2", 1000, "C", "D"))));
      assertThat(off.ohms("A", "C")).isInfinite();
      assertThat(off.predict("A", "C").connected()).isFalse();
      assertThat(off.ohms("A", "A")).isZero();
    }

    @Test
    void shortedPart_readsTheSolversFloorInParallel() {
      PowerOff off = PowerOff.of(network(List.of(r("R1", 0, "A", "B"), r("R2", 10e3, "A", "B"))));
      double expected = parallel(PowerOff.SHORT_FLOOR, 10e3);
      assertThat(off.ohms("A", "B")).isCloseTo(expected, within(expected * 1e-6));
    }
  }

  @Nested
  class PowerOffModel {
    /** An inverting stage with rails, an input and a feedback capacitor. */
    private Stage inverting(double feedbackFarads) {
      return new Stage(
          "inverting",
          "",
          "GND",
          List.of(new Rail("VCC", 15, 0.05), new Rail("VEE", -15, 0.05)),
          List.of(TestInput.dc("IN", 1)),
          List.of(
              Part.resistor("R1", 10e3, 0.01, "IN", "SUM"),
              Part.resistor("R2", 47e3, 0.01, "SUM", "OUT"),
              Part.resistor("R3", 10e3, 0.05, "OUT", "GND"),
              Part.capacitor("C1", feedbackFarads, 0.1, "SUM", "OUT")),
          List.of(
              new Amplifier(
                  "U1A",
                  "U1",
                  PackageType.DUAL_8,
                  "A",
                  DeviceClass.CLASSIC_BIPOLAR,
                  "GND",
                  "SUM",
                  "OUT",
                  "VCC",
                  "VEE")));
    }

    @Test
    void railsInputsAndOpAmpPins_drawNothing() {
      PowerOff off = PowerOff.of(inverting(100e-12));
      // IN–SUM–OUT–GND is a series chain once the input source and the op-amp are gone.
      assertThat(off.ohms("IN", "GND")).isCloseTo(67e3, within(67e3 * REL));
      // The op-amp does not tie its input to its output, and the rails connect to nothing.
      assertThat(off.ohms("U1.2", "U1.1")).isCloseTo(47e3 + 0, within(47e3 * 1e-6));
      assertThat(off.ohms("U1.8", "U1.4")).isInfinite();
      assertThat(off.ohms("VCC", "GND")).isInfinite();
      // A pin no section uses (pin 5's section B is absent) touches nothing.
      assertThat(off.ohms("U1.5", "GND")).isInfinite();
    }

    @Test
    void healthyRange_spansTheToleranceCorners() {
      PowerOff off = PowerOff.of(inverting(100e-12));
      OhmsPrediction p = off.predict("IN", "GND");
      // Series chain: each part at its own corner (R1, R2 at 1 %, R3 at 5 %).
      assertThat(p.low()).isCloseTo(10e3 * 0.99 + 47e3 * 0.99 + 10e3 * 0.95, within(1e-6));
      assertThat(p.high()).isCloseTo(10e3 * 1.01 + 47e3 * 1.01 + 10e3 * 1.05, within(1e-6));
      assertThat(p.creep()).isEmpty();
    }

    @Test
    void largeCapacitorAcrossTheReading_makesItCreep() {
      // 100 µF across R2 alone (R1 and R3 lead to the disconnected input and ground): τ = 4.7 s.
      OhmsPrediction p = PowerOff.of(inverting(100e-6)).predict("SUM", "OUT");
      assertThat(p.creep()).extracting(OhmsPrediction.Creep::ref).containsExactly("C1");
      double seen = 47e3;
      assertThat(p.creep().get(0).seconds()).isCloseTo(7 * 100e-6 * seen, within(1e-9));
    }

    @Test
    void partLeadsAndPins_resolveToTheirNets() {
      PowerOff off = PowerOff.of(inverting(1e-9));
      assertThat(off.node("R2.1")).contains("SUM");
      assertThat(off.node("R2.2")).contains("OUT");
      assertThat(off.node("U1.2")).contains("SUM");
      assertThat(off.node("R2.3")).isEmpty();
      assertThat(off.node("X9")).isEmpty();
      assertThat(off.node("U1.9")).isEmpty();
      assertThatThrownBy(() -> off.ohms("X9", "GND")).hasMessageContaining("X9");
      assertThat(off.points()).contains("SUM", "U1.1", "R1.1", "R3.2");
    }
  }

  @Nested
  class RandomNetworks {
    /**
     * Agreement of two double-precision solves: a 1 mΩ short beside a 10 MΩ resistor makes the
     * systems ill-conditioned (about 1e10), so the two round differently by up to about 1e-6; far
     * below the 0.1 % a meter shows.
     */
    private static final double AGREE = 1e-5;

    /**
     * Random networks of 2–9 nodes and 1–18 resistors (some 0 Ω, some parallel, some isolated
     * nodes), each pair checked against a plain nodal solve: full conductance matrix, node b
     * grounded, 1 A into node a, Gaussian elimination, resistance = v(a). Seeded.
     */
    @Test
    void everyPair_matchesABruteForceNodalSolve() {
      SplittableRandom rnd = new SplittableRandom(20261202L);
      int checked = 0;
      for (int trial = 0; trial < 400; trial++) {
        int n = 2 + rnd.nextInt(8);
        List<Part> parts = new ArrayList<>();
        int count = 1 + rnd.nextInt(2 * n);
        for (int k = 0; k < count; k++) {
          int a = rnd.nextInt(n);
          int b = rnd.nextInt(n);
          double ohms = rnd.nextInt(10) == 0 ? 0 : Math.pow(10, 1 + 6 * rnd.nextDouble());
          parts.add(Part.resistor("R" + k, ohms, 0.05, "N" + a, "N" + b));
        }
        Stage stage = network(parts);
        PowerOff off = PowerOff.of(stage);
        for (int a = 0; a < n; a++) {
          for (int b = 0; b < n; b++) {
            String na = "N" + a;
            String nb = "N" + b;
            if (off.node(na).isEmpty() || off.node(nb).isEmpty()) {
              continue;
            }
            double expected = bruteForce(parts, na, nb, 0);
            double got = off.ohms(na, nb);
            if (Double.isInfinite(expected)) {
              assertThat(got).as("trial %d %s-%s", trial, na, nb).isInfinite();
            } else {
              assertThat(got)
                  .as("trial %d %s-%s", trial, na, nb)
                  .isCloseTo(expected, within(expected * AGREE + 1e-12));
              OhmsPrediction p = off.predict(na, nb);
              assertThat(p.low())
                  .isCloseTo(bruteForce(parts, na, nb, -1), within(expected * AGREE + 1e-12));
              assertThat(p.high())
                  .isCloseTo(bruteForce(parts, na, nb, 1), within(expected * AGREE + 1e-12));
              // Rayleigh monotonicity: any in-tolerance draw lies within the corners.
              double drawn = bruteForceDrawn(parts, na, nb, rnd);
              assertThat(drawn).isBetween(p.low() * (1 - 1e-9), p.high() * (1 + 1e-9));
            }
            checked++;
          }
        }
      }
      assertThat(checked).isGreaterThan(4000);
    }

    private double bruteForceDrawn(List<Part> parts, String a, String b, SplittableRandom rnd) {
      List<Part> drawn = new ArrayList<>();
      for (Part p : parts) {
        double f = 1 + p.tolerance() * (2 * rnd.nextDouble() - 1);
        drawn.add(Part.resistor(p.ref(), p.value() * f, 0, p.netA(), p.netB()));
      }
      return bruteForce(drawn, a, b, 0);
    }

    /** Plain nodal analysis over every node, with b as reference; OL when a cannot reach b. */
    private double bruteForce(List<Part> parts, String a, String b, int corner) {
      if (a.equals(b)) {
        return 0;
      }
      List<String> names = new ArrayList<>();
      for (Part p : parts) {
        for (String net : List.of(p.netA(), p.netB())) {
          if (!names.contains(net)) {
            names.add(net);
          }
        }
      }
      // Reachability by depth-first search over the resistors.
      List<String> reach = new ArrayList<>(List.of(a));
      for (int i = 0; i < reach.size(); i++) {
        for (Part p : parts) {
          String other =
              p.netA().equals(reach.get(i))
                  ? p.netB()
                  : p.netB().equals(reach.get(i)) ? p.netA() : null;
          if (other != null && !reach.contains(other)) {
            reach.add(other);
          }
        }
      }
      if (!reach.contains(b)) {
        return Double.POSITIVE_INFINITY;
      }
      reach.remove(b);
      int m = reach.size();
      double[][] g = new double[m][m + 1];
      for (Part p : parts) {
        double ohms = Math.max(1e-3, p.value() * (1 + corner * p.tolerance()));
        int i = reach.indexOf(p.netA());
        int j = reach.indexOf(p.netB());
        boolean inI = i >= 0 || p.netA().equals(b);
        boolean inJ = j >= 0 || p.netB().equals(b);
        if (!inI || !inJ || p.netA().equals(p.netB())) {
          continue;
        }
        if (i >= 0) {
          g[i][i] += 1 / ohms;
        }
        if (j >= 0) {
          g[j][j] += 1 / ohms;
        }
        if (i >= 0 && j >= 0) {
          g[i][j] -= 1 / ohms;
          g[j][i] -= 1 / ohms;
        }
      }
      int ia = reach.indexOf(a);
      g[ia][m] = 1;
      for (int col = 0; col < m; col++) {
        int pivot = col;
        for (int row = col + 1; row < m; row++) {
          if (Math.abs(g[row][col]) > Math.abs(g[pivot][col])) {
            pivot = row;
          }
        }
        double[] t = g[col];
        g[col] = g[pivot];
        g[pivot] = t;
        for (int row = 0; row < m; row++) {
          if (row != col && g[row][col] != 0) {
            double f = g[row][col] / g[col][col];
            for (int k = col; k <= m; k++) {
              g[row][k] -= f * g[col][k];
            }
          }
        }
      }
      return g[ia][m] / g[ia][ia];
    }
  }
}
