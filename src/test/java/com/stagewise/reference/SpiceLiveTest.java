package com.stagewise.reference;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.stagewise.solver.Conditions;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Our solver against ngspice run live (ngspice 39, Debian package, as reference simulator) on every
 * checked stage. ngspice must be on the PATH: without it the test fails and says how to install it;
 * it never skips.
 */
class SpiceLiveTest {

  @BeforeAll
  static void ngspiceIsInstalled() {
    assertTrue(Ngspice.available(), Ngspice.MISSING);
  }

  static Stream<ReferenceStages.Named> stages() {
    return ReferenceStages.all().stream();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("stages")
  void solver_agreesWithLiveNgspice(ReferenceStages.Named named) {
    FlatCircuit flat = FlatCircuit.of(named.stage(), Conditions.NOMINAL);
    List<Ngspice.Solved> states = SpiceSolve.states(flat, named.stage().title());
    assertThat(states).as("ngspice solutions of %s", named.source().name()).isNotEmpty();
    List<String> problems =
        SpiceComparison.mismatches(named.stage(), SpiceComparison.of(flat, states));
    assertThat(problems)
        .as("disagreements with ngspice 39 for %s", named.source().name())
        .isEmpty();
  }
}
