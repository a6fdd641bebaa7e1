package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Templates;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.SectionState;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ForkJoinPool;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The hypotheses are predicted on several threads; the diagnosis must not depend on how many: the
 * same answer from two ways of computing it (one thread, four threads), compared to the last bit of
 * every probability and of every next probe's bits, not within a tolerance.
 */
class ParallelPredictionTest {

  @ParameterizedTest
  @ValueSource(strings = {"instrumentation", "difference", "integrator"})
  void diagnosis_isBitForBitTheSame_onOneThreadAndOnFour(String template) throws Exception {
    Stage stage = Templates.named(template).build();
    ReadingSet readings = stuckHighEverywhere(stage);
    Diagnosis one = onThreads(1, stage, readings);
    Diagnosis four = onThreads(4, stage, readings);
    assertThat(four.verdict()).isEqualTo(one.verdict());
    assertThat(four.suspects()).hasSameSizeAs(one.suspects());
    for (int i = 0; i < one.suspects().size(); i++) {
      Suspect a = one.suspects().get(i);
      Suspect b = four.suspects().get(i);
      assertThat(b.fault()).isEqualTo(a.fault());
      assertThat(Double.doubleToRawLongBits(b.probability()))
          .as("%s probability %s against %s", a.fault(), b.probability(), a.probability())
          .isEqualTo(Double.doubleToRawLongBits(a.probability()));
      assertThat(b.group()).isEqualTo(a.group());
    }
    assertThat(four.nextProbes()).hasSameSizeAs(one.nextProbes());
    for (int i = 0; i < one.nextProbes().size(); i++) {
      assertThat(four.nextProbes().get(i).at()).isEqualTo(one.nextProbes().get(i).at());
      assertThat(Double.doubleToRawLongBits(four.nextProbes().get(i).bits()))
          .isEqualTo(Double.doubleToRawLongBits(one.nextProbes().get(i).bits()));
    }
  }

  /**
   * A few volts readings and one ohms reading on a mains-powered unit: the ranking adds the ohms
   * figures, the suspects' same-reading test and the power-off checks' planning run side by side
   * and share the power-off predictions. Same bits on one thread and on four.
   */
  @ParameterizedTest
  @ValueSource(strings = {"instrumentation", "summing"})
  void diagnosisWithOhmsReadings_isBitForBitTheSame_onOneThreadAndOnFour(String template)
      throws Exception {
    Stage stage = Templates.named(template).build();
    List<Reading> some = new ArrayList<>(stuckHighEverywhere(stage).readings().subList(0, 3));
    Part first = stage.parts().get(0);
    some.add(Reading.ohms(first.netA(), first.netB(), first.value() * 1.02));
    ReadingSet readings = new ReadingSet(MeterSpec.DEFAULT, some);
    Diagnosis one = onThreads(1, stage, readings, true);
    Diagnosis four = onThreads(4, stage, readings, true);
    assertThat(four.suspects()).hasSameSizeAs(one.suspects());
    for (int i = 0; i < one.suspects().size(); i++) {
      assertThat(four.suspects().get(i).fault()).isEqualTo(one.suspects().get(i).fault());
      assertThat(Double.doubleToRawLongBits(four.suspects().get(i).probability()))
          .isEqualTo(Double.doubleToRawLongBits(one.suspects().get(i).probability()));
      assertThat(four.suspects().get(i).why()).isEqualTo(one.suspects().get(i).why());
    }
    assertThat(four.nextProbes()).isEqualTo(one.nextProbes());
    assertThat(one.nextProbes()).isNotEmpty();
  }

  /** A fresh diagnoser's diagnosis, its parallel work done by a pool of the given size. */
  private static Diagnosis onThreads(int threads, Stage stage, ReadingSet readings)
      throws Exception {
    return onThreads(threads, stage, readings, false);
  }

  private static Diagnosis onThreads(
      int threads, Stage stage, ReadingSet readings, boolean mainsPowered) throws Exception {
    ForkJoinPool pool = new ForkJoinPool(threads);
    try {
      return pool.submit(() -> Diagnoser.of(stage).mainsPowered(mainsPowered).diagnose(readings))
          .get();
    } finally {
      pool.shutdown();
    }
  }

  /** Every net and used pin read off the solver with the last section stuck high. */
  private static ReadingSet stuckHighEverywhere(Stage stage) {
    String last = stage.amplifiers().get(stage.amplifiers().size() - 1).ref();
    SolveResult.Solved solved =
        (SolveResult.Solved)
            StageSolver.solve(stage, Conditions.NOMINAL.withForced(last, SectionState.HIGH));
    OperatingPoint point = solved.primary();
    List<Reading> all = new ArrayList<>();
    point.nets().forEach((net, volts) -> all.add(Reading.dc(net, volts)));
    point.pins().forEach((pin, volts) -> all.add(Reading.dc(pin, volts)));
    return new ReadingSet(MeterSpec.DEFAULT, all);
  }
}
