package com.stagewise.bench;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Templates;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.interchange.StageSheet;
import com.stagewise.reference.SpiceBatch;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.SectionState;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The whole signal chain's diagnosis (five sections over two quad packages, the demo channel of the
 * Tarnwell preamp) beside the largest single stages (the instrumentation-amplifier template, the
 * bridge amplifier demo sheet), and beside ngspice computing each one's fault dictionary in one
 * batch.
 *
 * <p>Readings: every net and used pin at the solver's nominal values with one middle section stuck
 * high, so the ranking has real work to do. Run with {@code src/scripts/bench-chain.sh}; figures in
 * DEVELOPERS.md.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
@Threads(1)
public class ChainBenchmark {
  @Param({"chain", "instrumentation", "bridge"})
  public String stageName;

  private Stage stage;
  private ReadingSet readings;

  /** Returns the stage a benchmark parameter names. */
  static Stage stage(String name) {
    return switch (name) {
      case "chain" -> StageSheet.read(Path.of("data/stages/tarnwell-ps4-channel-chain.stage.json"));
      case "bridge" -> StageSheet.read(Path.of("data/stages/ferrowick-wb2-bridge-amp.stage.json"));
      default -> Templates.named(name).build();
    };
  }

  @Setup(Level.Trial)
  public void setUp() {
    stage = stage(stageName);
    String middle = stage.amplifiers().get(stage.amplifiers().size() / 2).ref();
    SolveResult.Solved solved =
        (SolveResult.Solved)
            StageSolver.solve(stage, Conditions.NOMINAL.withForced(middle, SectionState.HIGH));
    OperatingPoint point = solved.primary();
    List<Reading> all = new ArrayList<>();
    point.nets().forEach((net, volts) -> all.add(Reading.dc(net, volts)));
    point.pins().forEach((pin, volts) -> all.add(Reading.dc(pin, volts)));
    readings = new ReadingSet(MeterSpec.DEFAULT, all);
  }

  /** A fresh diagnoser: every hypothesis's predictions, the ranking and the next probe. */
  @Benchmark
  public Diagnosis fullDiagnosis() {
    return Diagnoser.of(stage).diagnose(readings);
  }

  /**
   * ngspice 39 solving the same stage's fault dictionary (every fault, nominal parts), one batch.
   */
  @Benchmark
  @BenchmarkMode(Mode.SingleShotTime)
  @Warmup(iterations = 1)
  @Measurement(iterations = 5)
  public Duration ngspiceFaultDictionary() {
    return SpiceBatch.timeFaultDictionary(stage);
  }
}
