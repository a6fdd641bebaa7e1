package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.StageSheet;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * {@link Analysis.Linearized#solveWith} against a full solve of the changed stage (STYLE.md: the
 * same answer from two methods). A resistor's new value is a rank-one change of the nodal matrix,
 * answered with the Sherman–Morrison formula {@code (M + δ·u·uᵀ)⁻¹ = M⁻¹ − δ·M⁻¹u·uᵀM⁻¹ / (1 +
 * δ·uᵀM⁻¹u)} (Sherman and Morrison, 1950; as given in Golub and Van Loan, Matrix Computations, from
 * memory); a rail's new voltage moves the right-hand side only. Each template and the test chains,
 * nominal and with each section forced dead or high, each resistor from a thousandth to a thousand
 * times its value, each rail from half to 1.1 times its volts.
 */
class SolveWithTest {
  /**
   * Agreement of the two methods, relative to 1 V or the net's volts. Both carry rounding errors
   * that grow with the matrix's condition (a resistor made 1 mΩ beside 10 kΩ parts: about 10⁷, so
   * 10⁻⁹ of the volts); 10⁻⁷ is still ten thousand times below the model floor of 0.5 mV on 6 V.
   */
  private static final double AGREEMENT = 1e-7;

  private static final double[] FACTORS = {
    1e-3, 0.01, 0.1, 0.5, 0.9, 0.99, 1.01, 1.1, 2, 10, 100, 1e3
  };

  @Test
  void solveWith_givesTheFullSolvesPoint_orNothing_onEveryTemplateAndChain() {
    int[] counts = new int[3]; // answered, fresh single point in start states, checked in all
    for (Stage stage : stages()) {
      List<Conditions> conditions = new ArrayList<>(List.of(Conditions.NOMINAL));
      for (Amplifier amp : stage.amplifiers()) {
        conditions.add(Conditions.NOMINAL.withForced(amp.ref(), SectionState.DEAD));
        conditions.add(Conditions.NOMINAL.withForced(amp.ref(), SectionState.HIGH));
      }
      for (Conditions c : conditions) {
        check(stage, Analysis.of(stage, c), counts);
      }
    }
    assertThat(counts[2]).as("changes checked").isGreaterThan(2000);
    // The update gives up only near a singular matrix or where its terms cancel (a resistor made
    // near-short or near-open): most changes that settle in the starting states are answered.
    assertThat((double) counts[0]).as("answered").isGreaterThan(0.6 * counts[1]);
  }

  private static void check(Stage stage, Analysis analysis, int[] counts) {
    if (!(analysis.solve() instanceof SolveResult.Solved solved) || solved.points().size() != 1) {
      return;
    }
    OperatingPoint point = solved.primary();
    Optional<Analysis.Linearized> linear = analysis.linearize(point);
    if (linear.isEmpty()) {
      return;
    }
    for (Change change : changes(stage, analysis)) {
      counts[2]++;
      Optional<OperatingPoint> quick = linear.get().solveWith(change);
      SolveResult fresh = analysis.with(change).solve();
      boolean single =
          fresh instanceof SolveResult.Solved s
              && s.points().size() == 1
              && s.notes().isEmpty()
              && inStartStates(analysis, s.primary())
              && inStartStates(analysis, point);
      if (single) {
        counts[1]++;
      }
      if (quick.isEmpty()) {
        continue;
      }
      counts[0]++;
      String what = stage.title() + " " + change;
      assertThat(single)
          .as(what + ": answered although the full solve is not one such point")
          .isTrue();
      OperatingPoint full = ((SolveResult.Solved) fresh).primary();
      assertThat(quick.get().states()).as(what).isEqualTo(full.states());
      for (Map.Entry<String, Double> e : full.nets().entrySet()) {
        double v = quick.get().nets().get(e.getKey());
        assertThat(Math.abs(v - e.getValue()))
            .as(what + " at " + e.getKey())
            .isLessThanOrEqualTo(AGREEMENT * Math.max(1, Math.abs(e.getValue())));
      }
    }
  }

  private static boolean inStartStates(Analysis analysis, OperatingPoint point) {
    for (Map.Entry<String, SectionState> e : point.states().entrySet()) {
      if (e.getValue() != SectionState.LINEAR && !analysis.isForced(e.getKey())) {
        return false;
      }
    }
    return true;
  }

  private static List<Change> changes(Stage stage, Analysis analysis) {
    List<Change> changes = new ArrayList<>();
    for (Part part : stage.parts()) {
      for (double f : FACTORS) {
        changes.add(new Change.PartValue(part.ref(), analysis.partValue(part.ref()) * f));
      }
      if (part.kind() == PartKind.RESISTOR) {
        changes.add(new Change.PartValue(part.ref(), 0));
      }
    }
    for (Rail rail : stage.rails()) {
      for (double f : new double[] {0.5, 0.9, 1.1}) {
        changes.add(new Change.DrivenVolts(rail.net(), analysis.drivenVolts(rail.net()) * f));
      }
    }
    return changes;
  }

  private static List<Stage> stages() {
    List<Stage> stages = new ArrayList<>();
    for (StageTemplate template : Templates.all()) {
      stages.add(template.build());
    }
    for (String name : List.of("chain-12", "chain-12-clipped", "chain-7-bistable")) {
      stages.add(
          StageSheet.read(Path.of("src", "test", "resources", "stages", name + ".stage.json")));
    }
    return stages;
  }
}
