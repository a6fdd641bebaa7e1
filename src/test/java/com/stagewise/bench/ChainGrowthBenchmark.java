package com.stagewise.bench;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnoser;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.interchange.StageSheet;
import com.stagewise.solver.Conditions;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.SectionState;
import com.stagewise.solver.SolveResult;
import com.stagewise.solver.StageSolver;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
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
 * How the diagnosis grows with the number of sections: the first N sections of the 12-section test
 * chain (inverting, non-inverting and follower sections over three quad packages, with the parts
 * between their nets), N from 1 to 12, each read at every net and used pin with its last section
 * stuck high. Run with {@code src/scripts/bench-growth.sh}; figures in DEVELOPERS.md.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
@Fork(1)
@Threads(1)
public class ChainGrowthBenchmark {
  @Param({"1", "2", "3", "4", "5", "6", "7", "8", "9", "10", "11", "12"})
  public int sections;

  private Stage stage;
  private ReadingSet readings;

  /** The first {@code n} sections of the 12-section chain with the parts among their nets. */
  static Stage firstSections(int n) {
    Stage chain =
        StageSheet.read(Path.of("src", "test", "resources", "stages", "chain-12.stage.json"));
    List<Amplifier> kept = chain.amplifiers().subList(0, n);
    Set<String> nets = new HashSet<>(chain.drivenVolts().keySet());
    nets.add(chain.ground());
    for (Amplifier amp : kept) {
      nets.addAll(List.of(amp.inPlus(), amp.inMinus(), amp.out(), amp.vPlus(), amp.vMinus()));
    }
    List<Part> parts = new ArrayList<>();
    for (Part part : chain.parts()) {
      if (nets.contains(part.netA()) && nets.contains(part.netB())) {
        parts.add(part);
      }
    }
    return chain.withAmplifiers(kept).withParts(parts);
  }

  @Setup(Level.Trial)
  public void setUp() {
    stage = firstSections(sections);
    String last = stage.amplifiers().get(sections - 1).ref();
    SolveResult.Solved solved =
        (SolveResult.Solved)
            StageSolver.solve(stage, Conditions.NOMINAL.withForced(last, SectionState.HIGH));
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
}
