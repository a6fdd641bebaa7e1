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
import com.stagewise.solver.OperatingPoint;
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
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Threads;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Speed of the diagnosis on the largest template, the three-section instrumentation amplifier with
 * every net and used pin read, beside ngspice computing the same fault dictionary in one batch; and
 * on the largest stages with newer parts: the back-to-back diode limiter (two junctions, Newton's
 * method in every solve) and the offset-null stage (a trimmer; the most faults of the new stages).
 *
 * <p>Run with {@code src/scripts/bench-diagnosis.sh}; see DEVELOPERS.md for the figures. The
 * ngspice netlists are written once per trial, outside the timed runs (the first timed run writes
 * them, and is the warm-up). The readings are the solver's nominal values with the third (or only)
 * section stuck high, so that the ranking has real work to do.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
@Threads(1)
public class DiagnosisBenchmark {
  /** A template's name, or a test sheet's name under src/test/resources/stages. */
  @Param({
    "instrumentation",
    "chain-12",
    "chain-7-bistable",
    "chain-9-bistable",
    "diode-limiter",
    "offset-null"
  })
  public String stageName;

  private Stage stage;
  private ReadingSet allPins;
  private ReadingSet allButOne;
  private Diagnoser warm;
  private SpiceBatch.Written netlists;

  @Setup(Level.Trial)
  public void setUp() {
    stage =
        Templates.find(stageName).isPresent()
            ? Templates.named(stageName).build()
            : StageSheet.read(
                Path.of("src", "test", "resources", "stages", stageName + ".stage.json"));
    SolveResult.Solved solved =
        (SolveResult.Solved)
            StageSolver.solve(
                stage,
                com.stagewise.solver.Conditions.NOMINAL.withForced(
                    stage.amplifiers().get(Math.min(2, stage.amplifiers().size() - 1)).ref(),
                    com.stagewise.solver.SectionState.HIGH));
    OperatingPoint point = solved.primary();
    List<Reading> readings = new ArrayList<>();
    point.nets().forEach((net, volts) -> readings.add(Reading.dc(net, volts)));
    point.pins().forEach((pin, volts) -> readings.add(Reading.dc(pin, volts)));
    allPins = new ReadingSet(MeterSpec.DEFAULT, readings);
    allButOne = new ReadingSet(MeterSpec.DEFAULT, readings.subList(0, readings.size() - 1));
    warm = Diagnoser.of(stage);
    warm.diagnose(allButOne);
  }

  /** A fresh diagnoser: builds every hypothesis's predictions, ranks, chooses the next probe. */
  @Benchmark
  public Diagnosis fullDiagnosis() {
    return Diagnoser.of(stage).diagnose(allPins);
  }

  /** One more reading on a diagnoser that has seen the stage: ranking and next probe only. */
  @Benchmark
  public Diagnosis rerankAfterOneMoreReading() {
    return warm.diagnose(allPins);
  }

  /**
   * No readings yet on a diagnoser that has seen the stage: the ranking is the priors and the next
   * probe is chosen over every hypothesis in play, the planner's heaviest case.
   */
  @Benchmark
  public Diagnosis nextProbeFromNoReadings() {
    return warm.diagnose(new ReadingSet(MeterSpec.DEFAULT, List.of()));
  }

  /**
   * Our solver doing the work the ngspice benchmark below gives ngspice: one circuit per fault,
   * nominal parts, DC and AC ({@link com.stagewise.diagnosis.NominalDictionary}), for a same-work
   * ratio beside the full diagnosis's.
   */
  @Benchmark
  public int nominalFaultDictionary() {
    return com.stagewise.diagnosis.NominalDictionary.solveAll(stage);
  }

  /**
   * ngspice 39 solving the same fault dictionary (every fault, nominal parts) in one batch process,
   * on netlists written beforehand (in the trial's set-up), so that only ngspice is timed.
   */
  @Benchmark
  @BenchmarkMode(Mode.SingleShotTime)
  @Warmup(iterations = 1)
  @Measurement(iterations = 5)
  public Duration ngspiceFaultDictionary() {
    if (netlists == null) {
      netlists = SpiceBatch.written(stage);
    }
    return netlists.run();
  }

  @TearDown(Level.Trial)
  public void tearDown() {
    if (netlists != null) {
      netlists.close();
      netlists = null;
    }
  }
}
