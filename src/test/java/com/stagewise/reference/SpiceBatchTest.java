package com.stagewise.reference;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The batch deck of a fault dictionary solves the same circuits as one run per fault (ngspice 39,
 * Debian package, as reference simulator): every fault's node voltages agree within 1 µV, so the
 * time {@link SpiceBatch#timeFaultDictionary} measures is spent on the real work.
 */
class SpiceBatchTest {

  @BeforeAll
  static void ngspiceIsInstalled() {
    assertTrue(Ngspice.available(), Ngspice.MISSING);
  }

  @Test
  void batchDeck_givesTheSameVoltagesAsOneRunPerFault() {
    ReferenceStages.Named named = ReferenceStages.all().get(0);
    SpiceBatch.Deck deck = SpiceBatch.deck(named.stage());
    List<Ngspice.Outcome> batch = SpiceBatch.solve(deck);
    List<String> problems = new ArrayList<>();
    for (int i = 0; i < deck.faults().size(); i++) {
      Ngspice.Outcome single =
          Ngspice.run(SpiceNetlist.of(deck.flats().get(i), deck.faults().get(i)));
      if (!(batch.get(i) instanceof Ngspice.Solved b) || !(single instanceof Ngspice.Solved s)) {
        problems.add(deck.faults().get(i) + ": batch " + batch.get(i) + ", single " + single);
        continue;
      }
      for (Map.Entry<String, Double> e : s.dc().entrySet()) {
        double other = b.dc().get(e.getKey());
        if (Math.abs(other - e.getValue()) > 1e-6) {
          problems.add(
              String.format(
                  Locale.ROOT,
                  "%s at %s: batch %.9f, single %.9f",
                  deck.faults().get(i),
                  e.getKey(),
                  other,
                  e.getValue()));
        }
      }
    }
    assertThat(deck.faults()).hasSizeGreaterThan(10);
    assertThat(problems).isEmpty();
  }

  @Test
  void timeFaultDictionary_measuresAPositiveWallTime() {
    // Not a speed target (those are JMH benchmarks): only that a run happened and was timed.
    assertThat(SpiceBatch.timeFaultDictionary(ReferenceStages.all().get(0).stage()).toNanos())
        .isPositive();
  }
}
