package com.stagewise.solver;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * The cheap paths of the factorised re-solves against full solves of the changed stage (STYLE.md:
 * the same answer from two methods): the AC response after a part's value or a section's gain
 * changes, by the Sherman–Morrison rank-one update of the kept factors (a published textbook
 * formula: {@code (M + p·qᵀ)⁻¹ = M⁻¹ − M⁻¹p·qᵀM⁻¹ / (1 + qᵀM⁻¹p)}, from memory as given in Golub
 * and Van Loan, Matrix Computations), and the settled point after a section's offset moves, from
 * the one exact step of the kept factors.
 */
class RankOneUpdateTest {
  /** Agreement of the rank-one AC update with a fresh factorisation, relative to the response. */
  private static final double AC_AGREEMENT = 1e-10;

  @Test
  void acRankOneUpdate_equalsAFullSolve_forEveryPartAndGainOnEveryTemplate() {
    int updated = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      CompiledStage analysis = CompiledStage.of(stage, Conditions.NOMINAL);
      if (analysis.acHz() == 0 || !(analysis.solve() instanceof SolveResult.Solved solved)) {
        continue;
      }
      for (OperatingPoint point : solved.points()) {
        updated += checkAc(template.name(), analysis, point, changes(stage, analysis));
      }
    }
    // Every template with an AC input has parts and a linear section: the update did the work
    // for most changes (a short or a ×10⁴ value is solved in full: the update would lose digits).
    assertThat(updated).isGreaterThan(150);
  }

  @Test
  void acWithNoChange_isTheFullSolveToTheLastBit_onEveryTemplate() {
    // The kept AC factors' response with no change against Analysis.ac of the same point: the
    // same pivots and the same sums, so the same bits (junction stages answer by the full solve).
    // Each template nominal, each part up 30 % and open, each section clamped high and low.
    int compared = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      List<Analysis> variants = new ArrayList<>();
      Analysis nominal = Analysis.of(stage, Conditions.NOMINAL);
      if (nominal.acHz() == 0) {
        continue;
      }
      variants.add(nominal);
      for (Part part : stage.parts()) {
        variants.add(nominal.with(new Change.PartValue(part.ref(), part.value() * 1.3)));
        variants.add(nominal.with(new Change.PartValue(part.ref(), part.value() * 1e9)));
      }
      for (Amplifier amp : stage.amplifiers()) {
        for (SectionState state : new SectionState[] {SectionState.HIGH, SectionState.LOW}) {
          variants.add(Analysis.of(stage, Conditions.NOMINAL.withForced(amp.ref(), state)));
        }
      }
      for (Analysis analysis : variants) {
        if (!(analysis.solve() instanceof SolveResult.Solved solved)) {
          continue;
        }
        for (OperatingPoint point : solved.points()) {
          Optional<Analysis.Linearized> linear = analysis.linearize(point);
          if (linear.isEmpty()) {
            continue;
          }
          Optional<AcSolution> fresh = analysis.ac(point);
          Optional<AcSolution> kept = linear.get().ac();
          assertThat(kept.isPresent()).as(template.name()).isEqualTo(fresh.isPresent());
          if (fresh.isEmpty()) {
            continue;
          }
          for (String net : analysis.nets()) {
            Phasor expected = fresh.get().nets().get(net);
            Phasor got = kept.get().nets().get(net);
            assertThat(Double.doubleToRawLongBits(got.amplitude()))
                .as("%s, amplitude at %s", template.name(), net)
                .isEqualTo(Double.doubleToRawLongBits(expected.amplitude()));
            assertThat(Double.doubleToRawLongBits(got.phaseDegrees()))
                .as("%s, phase at %s", template.name(), net)
                .isEqualTo(Double.doubleToRawLongBits(expected.phaseDegrees()));
          }
          compared++;
        }
      }
    }
    assertThat(compared).isGreaterThan(100);
  }

  @Test
  void acRankOneUpdate_declinesWhatIsNotRankOne_andTheFullSolveAnswers() {
    Stage stage = Templates.named("inverting").build();
    CompiledStage analysis = CompiledStage.of(stage, Conditions.NOMINAL);
    OperatingPoint point = ((SolveResult.Solved) analysis.solve()).primary();
    String section = stage.amplifiers().get(0).ref();
    DeviceParams params = analysis.device(section);
    Change outputResistance =
        new Change.Device(
            section,
            new DeviceParams(
                params.gain(),
                params.offset(),
                params.biasPlus(),
                params.biasMinus(),
                params.outputResistance() * 2,
                params.headroomLow(),
                params.headroomHigh()));
    AcUpdate update =
        AcUpdate.of(
            analysis.network,
            new SectionState[] {SectionState.LINEAR},
            new boolean[1],
            new double[analysis.network.size]);
    assertThat(update.solve(outputResistance)).isNull();
    assertThat(update.solve(new Change.DrivenVolts("VCC", 14))).isNull();
    checkAc("inverting", analysis, point, List.of(outputResistance));
  }

  @Test
  void offsetSettle_givesTheSearchedPoint_whereItAnswers() {
    int answered = 0;
    int declined = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      Analysis analysis = Analysis.of(stage, Conditions.NOMINAL);
      if (!(analysis.solve() instanceof SolveResult.Solved solved)) {
        continue;
      }
      for (OperatingPoint point : solved.points()) {
        Analysis.Linearized linear = analysis.linearize(point).orElseThrow();
        for (Amplifier amp : stage.amplifiers()) {
          DeviceParams params = analysis.device(amp.ref());
          // Both ends of the class's offset range, and far beyond it (which clips open loops).
          for (double offset : new double[] {-0.5, -5e-3, 5e-3, 0.5}) {
            Change change = new Change.Device(amp.ref(), params.withOffset(offset));
            Optional<OperatingPoint> quick = linear.settle(change);
            Optional<OperatingPoint> searched = analysis.with(change).settleFrom(point);
            if (quick.isEmpty()) {
              declined++;
              continue;
            }
            assertThat(searched).as("%s %s %s", template.name(), amp.ref(), offset).isPresent();
            assertThat(quick.get().states()).isEqualTo(searched.get().states());
            for (String net : stage.nets()) {
              double expected = searched.get().at(net);
              assertThat(quick.get().at(net))
                  .as("%s %s %s at %s", template.name(), amp.ref(), offset, net)
                  .isCloseTo(expected, within(1e-9 * (1 + Math.abs(expected))));
            }
            answered++;
          }
        }
      }
    }
    assertThat(answered).isGreaterThan(50);
    assertThat(declined).as("an offset of 0.5 V clips some section").isGreaterThan(0);
  }

  @Test
  void stepRead_readsExactlyWhatStepGives_onEveryTemplate() {
    int read = 0;
    int exact = 0;
    int exactDevice = 0;
    for (StageTemplate template : Templates.all()) {
      Stage stage = template.build();
      Analysis analysis = Analysis.of(stage, Conditions.NOMINAL);
      if (!(analysis.solve() instanceof SolveResult.Solved solved)) {
        continue;
      }
      List<String> nets = List.copyOf(stage.nets());
      Probe probe = analysis.probe(nets);
      for (OperatingPoint point : solved.points()) {
        Analysis.Linearized linear = analysis.linearize(point).orElseThrow();
        for (Change change : spreadChanges(stage, analysis)) {
          Optional<OperatingPoint> stepped = linear.step(change);
          double[] quick = linear.stepRead(change, probe);
          assertThat(quick != null)
              .as("%s %s", template.name(), change)
              .isEqualTo(stepped.isPresent());
          if (quick == null) {
            continue;
          }
          for (int i = 0; i < nets.size(); i++) {
            // The same numbers, read without making a point: equal to the last bit.
            assertThat(quick[i])
                .as("%s %s at %s", template.name(), change, nets.get(i))
                .isEqualTo(stepped.get().at(nets.get(i)));
          }
          read++;
          boolean junctions = stage.parts().stream().anyMatch(p -> p.kind().isJunction());
          if (change instanceof Change.DrivenVolts && !junctions) {
            // A rail's volts move only the right-hand side: the one step is the exact solution in
            // these states, the same as searching the changed stage again.
            OperatingPoint searched = analysis.with(change).settleFrom(point).orElseThrow();
            for (int i = 0; i < nets.size(); i++) {
              double expected = searched.at(nets.get(i));
              assertThat(quick[i])
                  .as("%s %s at %s", template.name(), change, nets.get(i))
                  .isCloseTo(expected, within(1e-9 * (1 + Math.abs(expected))));
            }
            exact++;
          } else if (movesRightHandSideOnly(change, analysis) && !junctions) {
            // So do a section's offset, bias and headroom (a headroom of a linear section or an
            // offset of a clamped one not even that: the step is the one with no change): the
            // same as searching the changed stage again, where that keeps the states.
            Optional<OperatingPoint> searched = analysis.with(change).settleFrom(point);
            if (searched.isEmpty() || !searched.get().states().equals(point.states())) {
              continue;
            }
            for (int i = 0; i < nets.size(); i++) {
              double expected = searched.get().at(nets.get(i));
              assertThat(quick[i])
                  .as("%s %s at %s", template.name(), change, nets.get(i))
                  .isCloseTo(expected, within(1e-9 * (1 + Math.abs(expected))));
            }
            exactDevice++;
          }
        }
      }
    }
    assertThat(read).isGreaterThan(300);
    assertThat(exact).isGreaterThan(20);
    assertThat(exactDevice).isGreaterThan(60);
  }

  private static boolean movesRightHandSideOnly(Change change, Analysis analysis) {
    if (change instanceof Change.Device d) {
      DeviceParams now = analysis.device(d.section());
      return d.params().gain() == now.gain()
          && d.params().outputResistance() == now.outputResistance();
    }
    return change instanceof Change.DrivenVolts;
  }

  /** The changes of the spread: a part and a rail each way, and each section's numbers. */
  private static List<Change> spreadChanges(Stage stage, Analysis analysis) {
    List<Change> changes = new ArrayList<>();
    for (Part part : stage.parts()) {
      changes.add(new Change.PartValue(part.ref(), part.value() * 1.05));
      changes.add(new Change.PartValue(part.ref(), part.value() * 0.95));
    }
    for (var rail : stage.rails()) {
      changes.add(new Change.DrivenVolts(rail.net(), rail.volts() * 1.03));
      changes.add(new Change.DrivenVolts(rail.net(), rail.volts() * 0.97));
    }
    for (Amplifier amp : stage.amplifiers()) {
      DeviceParams p = analysis.device(amp.ref());
      changes.add(new Change.Device(amp.ref(), p.withOffset(p.offset() + 3e-3)));
      changes.add(new Change.Device(amp.ref(), p.withBias(p.biasPlus() + 1e-7, p.biasMinus())));
      changes.add(
          new Change.Device(amp.ref(), p.withHeadroom(p.headroomLow() + 0.3, p.headroomHigh())));
      changes.add(
          new Change.Device(amp.ref(), p.withHeadroom(p.headroomLow(), p.headroomHigh() + 0.3)));
      changes.add(new Change.Device(amp.ref(), p.withGain(2e4)));
    }
    return changes;
  }

  @Test
  void settle_declinesAChangeOfTheMatrix() {
    Stage stage = Templates.named("inverting").build();
    Analysis analysis = Analysis.of(stage, Conditions.NOMINAL);
    OperatingPoint point = ((SolveResult.Solved) analysis.solve()).primary();
    Analysis.Linearized linear = analysis.linearize(point).orElseThrow();
    Part part = stage.parts().get(0);
    assertThat(linear.settle(new Change.PartValue(part.ref(), part.value() * 1.01))).isEmpty();
    String section = stage.amplifiers().get(0).ref();
    assertThat(linear.settle(new Change.Device(section, analysis.device(section).withGain(1e4))))
        .isEmpty();
  }

  private static List<Change> changes(Stage stage, Analysis analysis) {
    List<Change> changes = new ArrayList<>();
    for (Part part : stage.parts()) {
      // Up and down, a short (taken as 1 mΩ) and a value far out: the update must hold for all.
      changes.add(new Change.PartValue(part.ref(), part.value() * 1.3));
      changes.add(new Change.PartValue(part.ref(), part.value() * 0.6));
      changes.add(new Change.PartValue(part.ref(), 0));
      changes.add(new Change.PartValue(part.ref(), part.value() * 1e4));
    }
    for (Amplifier amp : stage.amplifiers()) {
      changes.add(new Change.Device(amp.ref(), analysis.device(amp.ref()).withGain(2e4)));
      changes.add(new Change.Device(amp.ref(), analysis.device(amp.ref()).withGain(10)));
    }
    return changes;
  }

  /** Checks each change's AC re-solve against a fresh one; returns how many were rank-one. */
  private static int checkAc(
      String name, CompiledStage analysis, OperatingPoint point, List<Change> changes) {
    Analysis.Linearized linear = analysis.linearize(point).orElseThrow();
    // The update itself, to count the changes it takes (stages without junctions: their AC matrix
    // does not depend on the DC point, so a zero vector stands for it).
    Stage stage = analysis.stage();
    SectionState[] states = new SectionState[stage.amplifiers().size()];
    for (int k = 0; k < states.length; k++) {
      states[k] = point.states().get(stage.amplifiers().get(k).ref());
    }
    boolean junctions = stage.parts().stream().anyMatch(p -> p.kind().isJunction());
    AcUpdate update =
        junctions
            ? null
            : AcUpdate.of(
                analysis.network,
                states,
                new boolean[states.length],
                new double[analysis.network.size]);
    int updated = 0;
    for (Change change : changes) {
      Optional<AcSolution> fresh = analysis.with(change).ac(point);
      Optional<AcSolution> quick = linear.ac(change);
      assertThat(quick.isPresent()).as("%s, %s", name, change).isEqualTo(fresh.isPresent());
      if (fresh.isEmpty()) {
        continue;
      }
      double scale = 0;
      for (String net : analysis.nets()) {
        scale = Math.max(scale, fresh.get().nets().get(net).amplitude());
      }
      for (String net : analysis.nets()) {
        Phasor expected = fresh.get().nets().get(net);
        Phasor got = quick.get().nets().get(net);
        double er = expected.amplitude() * Math.cos(Math.toRadians(expected.phaseDegrees()));
        double ei = expected.amplitude() * Math.sin(Math.toRadians(expected.phaseDegrees()));
        double gr = got.amplitude() * Math.cos(Math.toRadians(got.phaseDegrees()));
        double gi = got.amplitude() * Math.sin(Math.toRadians(got.phaseDegrees()));
        assertThat(Math.hypot(gr - er, gi - ei))
            .as("%s, %s, at %s", name, change, net)
            .isLessThanOrEqualTo(AC_AGREEMENT * (1 + scale));
      }
      if (update != null && update.solve(change) != null) {
        updated++;
      }
    }
    return updated;
  }
}
