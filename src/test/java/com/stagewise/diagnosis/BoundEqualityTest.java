package com.stagewise.diagnosis;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.RecordEquality;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * {@link Evidence.Bound}'s hand-written equality and hash (the key of the kept likelihoods) keep
 * the rules of a record's: see {@link RecordEquality}.
 */
class BoundEqualityTest {

  @Test
  void equalExactlyWhenEveryComponentIs() throws Exception {
    List<Evidence.Bound> bases =
        List.of(
            new Evidence.Bound(3, false, 4.98, 1e-4, "U1A.1"),
            new Evidence.Bound(0, true, 1.2, 2e-3, null, AcMeasure.RMS),
            new Evidence.Bound(1, false, -0.0, 0, "out", AcMeasure.PEAK));
    Map<String, List<Object>> others =
        Map.of(
            "point", List.of(7),
            "ac", List.of(true, false),
            "value", List.of(5.0, 0.0, Double.NaN),
            "variance", List.of(3e-4),
            "at", List.of("in"),
            "measure", List.of(AcMeasure.PEAK, AcMeasure.RMS));
    RecordEquality.check(Evidence.Bound.class, bases, others);
  }
}
