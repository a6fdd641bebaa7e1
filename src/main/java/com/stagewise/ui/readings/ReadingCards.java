package com.stagewise.ui.readings;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Fault;
import com.stagewise.diagnosis.PowerOffFaults;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.solver.ExpectedAc;
import com.stagewise.solver.ExpectedVolts;
import com.stagewise.solver.OhmsPrediction;
import com.stagewise.solver.PowerOff;
import com.stagewise.ui.Bench;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The cards of the readings screen: each reading with its healthy range and where the top suspects
 * put it. Volts come from the expected voltages and the suspects' predictions; AC amplitudes from
 * the expected AC and the suspects' AC predictions, in the reading's measure; ohms (power off) from
 * the power-off model, healthy and under each suspect's fault (the same predictions the diagnosis
 * scores them with).
 */
final class ReadingCards {
  private final Map<String, OhmsPrediction> ohms = new HashMap<>();
  private Stage ohmsStage;
  private PowerOff healthy;

  /** Returns the rows of the bench's readings: standing ones newest first, then struck ones. */
  List<ReadingRow> rows(
      Stage stage, Bench bench, ExpectedVolts volts, ExpectedAc signal, List<Suspect> top) {
    List<ReadingRow> list = new ArrayList<>();
    for (Reading r : bench.readings()) {
      double low = Double.NaN;
      double high = Double.NaN;
      Map<String, Double> predictions = new LinkedHashMap<>();
      if (r.kind() == Reading.Kind.OHMS) {
        OhmsPrediction band = healthyOhms(stage, r);
        if (band != null) {
          low = band.low();
          high = band.high();
        }
        for (Suspect s : top) {
          OhmsPrediction p = suspectOhms(stage, s, r);
          if (p != null && !s.fault().equals("healthy")) {
            predictions.put(Words.fault(s.fault()), p.nominal());
          }
        }
      } else if (r.kind() == Reading.Kind.AC) {
        // The band and the suspects' markers in the measure the reading is stated in.
        AcMeasure measure = stage == null ? r.measure().orElse(AcMeasure.PEAK) : r.measureIn(stage);
        if (signal != null && signal.solved() && signal.hz() == r.hz()) {
          low = measure.fromPeak(signal.low(r.at()));
          high = measure.fromPeak(signal.high(r.at()));
        }
        for (Suspect s : top) {
          Double v = s.predictedAc().get(r.at());
          if (v != null && !s.fault().equals("healthy")) {
            predictions.put(Words.fault(s.fault()), measure.fromPeak(v));
          }
        }
      } else {
        if (volts != null
            && volts.solved()
            && r.kind() == Reading.Kind.DC
            && volts.nominal().containsKey(r.at())) {
          low = volts.low().get(r.at());
          high = volts.high().get(r.at());
        }
        for (Suspect s : top) {
          Double v = s.predicted().get(r.at());
          if (v != null && !s.fault().equals("healthy")) {
            predictions.put(Words.fault(s.fault()), v);
          }
        }
      }
      list.add(new ReadingRow(r, title(stage, r), low, high, predictions, null, false));
    }
    // Newest first: the reading just taken is where the eye goes.
    Collections.reverse(list);
    // Struck readings last, greyed, newest strike first: kept in sight, left out of the diagnosis.
    List<Bench.StruckReading> struck = new ArrayList<>(bench.struckReadings());
    Collections.reverse(struck);
    for (Bench.StruckReading s : struck) {
      Reading r = s.reading();
      list.add(
          new ReadingRow(r, title(stage, r), Double.NaN, Double.NaN, Map.of(), s.struckAt(), true));
    }
    return list;
  }

  /** Returns a reading's place in words: a point's title, or a pair's for ohms. */
  static String title(Stage stage, Reading r) {
    if (r.kind() == Reading.Kind.OHMS) {
      return pairTitle(stage, r.at(), r.to());
    }
    return stage == null
        ? r.at()
        : ProbePoint.of(stage, r.at(), r.kind(), r.hz()).map(ProbePoint::title).orElse(r.at());
  }

  /** Returns "Ohms from net SUM to net OUT, power off". */
  static String pairTitle(Stage stage, String at, String to) {
    return "Ohms from " + shortName(stage, at) + " to " + shortName(stage, to) + ", power off";
  }

  private static String shortName(Stage stage, String point) {
    return stage == null
        ? point
        : ProbePoint.of(stage, point, Reading.Kind.OHMS, 0)
            .map(ProbePoint::shortName)
            .orElse(point);
  }

  /** Returns what a healthy stage reads between the reading's points, or null if unknown. */
  OhmsPrediction healthyOhms(Stage stage, Reading r) {
    return cached(stage, "healthy", r, () -> network(stage).predict(r.at(), r.to()));
  }

  /** Returns what the stage reads between the reading's points under a suspect's fault. */
  OhmsPrediction suspectOhms(Stage stage, Suspect s, Reading r) {
    double value = s.estimatedValue().orElse(Double.NaN);
    return cached(
        stage,
        s.fault() + "@" + value,
        r,
        () -> {
          Set<String> rails = new HashSet<>();
          stage.rails().forEach(x -> rails.add(x.net()));
          Fault fault = Fault.parse(s.fault(), rails);
          return PowerOffFaults.predict(stage, fault, value, r.at(), r.to());
        });
  }

  private PowerOff network(Stage stage) {
    if (healthy == null) {
      healthy = PowerOff.of(stage);
    }
    return healthy;
  }

  private OhmsPrediction cached(
      Stage stage, String what, Reading r, java.util.function.Supplier<OhmsPrediction> work) {
    if (stage == null) {
      return null;
    }
    if (stage != ohmsStage) {
      ohms.clear();
      healthy = null;
      ohmsStage = stage;
    }
    String key = what + "|" + r.at() + "|" + r.to();
    if (ohms.containsKey(key)) {
      return ohms.get(key);
    }
    OhmsPrediction p;
    try {
      p = work.get();
    } catch (IllegalArgumentException | InvalidInputException e) {
      // A fault whose value the diagnosis did not estimate, or a point the stage lacks: no marker.
      p = null;
    }
    ohms.put(key, p);
    return p;
  }
}
