package com.stagewise.diagnosis;

import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The stage's inputs as the readings measured them, where they differ from the stage sheet's
 * levels: the diagnosis judges the stage with the measured level and notes that the fault may be
 * upstream.
 */
final class MeasuredInputs {
  private MeasuredInputs() {}

  /**
   * Returns the inputs (net to volts) whose DC reading on the input net itself is off the sheet's
   * level by more than the meter's uncertainty plus 1 % of the level and 2 mV, adding a note for
   * each to {@code notes}.
   */
  static Map<String, Double> of(
      Stage stage, TestPoints points, ReadingSet readings, List<String> notes) {
    Map<String, Double> measured = new HashMap<>();
    for (Reading r : readings.readings()) {
      if (r.kind() != Reading.Kind.DC) {
        continue;
      }
      int point = points.index.get(r.at());
      // Only a reading on the input net itself counts: a pin on that net may be the lifted one.
      if (points.isPin(point)) {
        continue;
      }
      String net = points.netOf.get(point);
      TestInput input = stage.input(net).orElse(null);
      if (input == null) {
        continue;
      }
      double u = readings.uncertainty(r);
      // Off by more than the meter's uncertainty plus 1 % of the level and 2 mV.
      if (Math.abs(r.value() - input.dc()) > u + 0.01 * Math.abs(input.dc()) + 2e-3) {
        measured.put(net, r.value());
        notes.add(
            String.format(
                java.util.Locale.ROOT,
                "Input %s reads %s where the stage sheet says %s: the stage is judged with the"
                    + " measured level, and the fault may be upstream of this stage.",
                net,
                Units.volts(r.value()),
                Units.volts(input.dc())));
      }
    }
    return measured;
  }
}
