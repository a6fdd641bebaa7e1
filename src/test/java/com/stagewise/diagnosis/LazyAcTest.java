package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.solver.Conditions;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A prediction's AC part is worked out on first need. The reference is the same prediction's AC
 * worked out at once, before the next scenario is solved (the order of the eager computation): the
 * AC asked for last, after every scenario of the fault, in reverse order, must equal it to the last
 * bit, on every scenario of every template; and a diagnosis with AC readings after one without must
 * equal, every digit of its full text (as the truth-set digest writes it), the same two diagnoses
 * with every AC part worked out beforehand.
 */
class LazyAcTest {

  @Test
  void acAskedForLate_equalsAcWorkedOutAtOnce_forEveryScenarioOfEveryTemplate() {
    int compared = 0;
    int withAc = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      Predictor predictor = new Predictor(new TestPoints(stage), stage);
      for (Fault fault : FaultCatalogue.of(stage).faults()) {
        List<Scenario> scenarios = FaultModel.scenarios(stage, Conditions.NOMINAL, fault);
        // Reference: each scenario's AC worked out straight after its DC, as before.
        List<Prediction> atOnce = new ArrayList<>();
        ScenarioCompiler first = new ScenarioCompiler();
        for (int i = 0; i < scenarios.size(); i++) {
          List<Prediction> some = predictor.predict(scenarios.get(i), i % 8 == 0, first);
          some.forEach(Prediction::acMean);
          atOnce.addAll(some);
        }
        List<Prediction> late = new ArrayList<>();
        ScenarioCompiler second = new ScenarioCompiler();
        for (int i = 0; i < scenarios.size(); i++) {
          late.addAll(predictor.predict(scenarios.get(i), i % 8 == 0, second));
        }
        assertThat(late).hasSameSizeAs(atOnce);
        for (Prediction p : late) {
          if (p.ac() != null && !p.label().contains("no steady state")) {
            assertThat(p.ac().isKnown()).as("worked out before it was asked for").isFalse();
          }
        }
        for (int k = late.size() - 1; k >= 0; k--) {
          Prediction a = atOnce.get(k);
          Prediction b = late.get(k);
          String what = template.name() + " " + fault.id() + " #" + k;
          assertThat(b.dcMean()).as(what).isEqualTo(a.dcMean());
          assertThat(b.dcSd()).as(what).isEqualTo(a.dcSd());
          assertThat(bits(b.acMean())).as(what + " AC").isEqualTo(bits(a.acMean()));
          assertThat(bits(b.acSd())).as(what + " AC spread").isEqualTo(bits(a.acSd()));
          withAc += a.acMean() == null ? 0 : 1;
          compared++;
        }
      }
    }
    assertThat(compared).isGreaterThan(1000);
    assertThat(withAc).isGreaterThan(500);
  }

  @Test
  void diagnosisWithAc_afterOneWithout_isTheSameWhenEveryAcWasWorkedOutBefore() {
    int compared = 0;
    int leftLazy = 0;
    for (TruthCases.StageCases stage : TruthCases.load()) {
      MeterSpec meter = stage.meter();
      int here = 0;
      for (TruthCases.Case c : stage.cases()) {
        if (c.ac().isEmpty() || here >= 3) {
          continue;
        }
        // Lazy: the diagnosis without AC readings leaves most AC parts unknown; the one with AC
        // readings works them out as it needs them.
        Diagnoser lazy = Diagnoser.of(stage.stage());
        Diagnosis lazyDc = lazy.diagnose(c.full(meter));
        List<Diagnoser.Hypothesis> hypotheses = lazy.hypotheses(c.full(meter));
        for (Diagnoser.Hypothesis h : hypotheses) {
          for (Prediction p : h.predictions) {
            leftLazy += p.ac() != null && !p.ac().isKnown() ? 1 : 0;
          }
        }
        String lazyAc = lazy.diagnose(c.fullWithAc(meter)).toString();
        // Reference: every AC part worked out (last hypothesis first) before either diagnosis,
        // as the eager prediction had them.
        Diagnoser eager = Diagnoser.of(stage.stage());
        List<Diagnoser.Hypothesis> all = eager.hypotheses(c.full(meter));
        for (int h = all.size() - 1; h >= 0; h--) {
          all.get(h).predictions.forEach(Prediction::acSd);
        }
        assertThat(eager.diagnose(c.full(meter)).toString())
            .as(stage.name())
            .isEqualTo(lazyDc.toString());
        assertThat(eager.diagnose(c.fullWithAc(meter)).toString())
            .as(stage.name())
            .isEqualTo(lazyAc);
        here++;
        compared++;
      }
    }
    assertThat(compared).isGreaterThan(3);
    assertThat(leftLazy).as("AC parts not worked out by a diagnosis without AC").isGreaterThan(0);
  }

  private static long[] bits(double[] values) {
    if (values == null) {
      return null;
    }
    long[] out = new long[values.length];
    for (int i = 0; i < values.length; i++) {
      out[i] = Double.doubleToRawLongBits(values[i]);
    }
    return out;
  }
}
