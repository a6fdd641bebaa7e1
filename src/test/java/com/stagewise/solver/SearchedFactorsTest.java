package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Linearising a point the saturation search has just solved takes the search's own factors instead
 * of solving the same system again. The same answer from two ways of computing it (STYLE.md): every
 * step of the linearised point against the same step from a compiled stage that never searched (so
 * its linearisation solves afresh), compared to the last bit.
 */
class SearchedFactorsTest {

  @Test
  void linearisingASearchedPoint_givesTheFreshSolvesBits_onEveryTemplate() {
    int compared = 0;
    int reused = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      List<Conditions> variants = new ArrayList<>(List.of(Conditions.NOMINAL));
      for (Amplifier amp : stage.amplifiers()) {
        variants.add(Conditions.NOMINAL.withForced(amp.ref(), SectionState.HIGH));
        variants.add(Conditions.NOMINAL.withForced(amp.ref(), SectionState.LOW));
      }
      for (Conditions conditions : variants) {
        CompiledStage searched = CompiledStage.of(stage, conditions);
        if (!(searched.solve() instanceof SolveResult.Solved solved)) {
          continue;
        }
        OperatingPoint point = solved.primary();
        if (!searched.network.nonlinear && takesTheSearchsSystem(searched, point)) {
          reused++;
        }
        Analysis.Linearized kept = searched.linearize(point).orElseThrow();
        CompiledStage fresh = CompiledStage.of(stage, conditions);
        Analysis.Linearized solvedAgain = fresh.linearize(point).orElseThrow();
        List<String> nets = List.copyOf(stage.nets());
        Probe keptProbe = searched.probe(nets);
        Probe freshProbe = fresh.probe(nets);
        for (Change change : changes(stage)) {
          double[] a = kept.stepRead(change, keptProbe);
          double[] b = solvedAgain.stepRead(change, freshProbe);
          assertThat(a == null).as("%s %s", template.name(), change).isEqualTo(b == null);
          if (a == null) {
            continue;
          }
          for (int i = 0; i < nets.size(); i++) {
            assertThat(Double.doubleToRawLongBits(a[i]))
                .as("%s %s at %s", template.name(), change, nets.get(i))
                .isEqualTo(Double.doubleToRawLongBits(b[i]));
          }
          compared++;
        }
      }
    }
    assertThat(reused).as("points whose linearisation took the search's factors").isGreaterThan(20);
    assertThat(compared).isGreaterThan(300);
  }

  @Test
  void aChangedNumber_makesTheSearchsSystemStale_evenWhenUndone() {
    Stage stage = Templates.named("inverting").build();
    CompiledStage analysis = CompiledStage.of(stage, Conditions.NOMINAL);
    OperatingPoint point = ((SolveResult.Solved) analysis.solve()).primary();
    assertThat(takesTheSearchsSystem(analysis, point)).isTrue();
    Part part = stage.parts().get(0);
    Change undo = analysis.apply(new Change.PartValue(part.ref(), part.value() * 2));
    assertThat(takesTheSearchsSystem(analysis, point)).isFalse();
    analysis.apply(undo);
    // The numbers are back, but the count of changes is not: a fresh solve, never a stale one.
    assertThat(takesTheSearchsSystem(analysis, point)).isFalse();
  }

  /** Whether the search's last system is the one a linearisation of the point would take. */
  private static boolean takesTheSearchsSystem(CompiledStage analysis, OperatingPoint point) {
    Network network = analysis.network;
    SectionState[] states = new SectionState[network.sections.length];
    double[] x = new double[network.size];
    for (int k = 0; k < states.length; k++) {
      states[k] = point.states().get(network.sections[k].ref());
    }
    for (int i = 0; i < network.nets.length; i++) {
      if (network.unknownOf[i] >= 0) {
        x[network.unknownOf[i]] = point.at(network.nets[i]);
      }
    }
    boolean[] collapsed = new boolean[states.length];
    for (int k = 0; k < states.length; k++) {
      collapsed[k] = network.sourceNode[k] >= 0 && network.collapsed(x, k);
    }
    return analysis.search.solvedAlready(states, collapsed) != null;
  }

  private static List<Change> changes(Stage stage) {
    List<Change> changes = new ArrayList<>();
    for (Part part : stage.parts()) {
      changes.add(new Change.PartValue(part.ref(), part.value() * 1.05));
      changes.add(new Change.PartValue(part.ref(), part.value() * 0.5));
    }
    for (var rail : stage.rails()) {
      changes.add(new Change.DrivenVolts(rail.net(), rail.volts() * 0.97));
    }
    return changes;
  }
}
