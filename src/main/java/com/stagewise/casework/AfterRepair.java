package com.stagewise.casework;

import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.solver.ExpectedVolts;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * The check after a repair: the DC points read during the diagnosis are read again, and each is
 * compared with what a healthy stage reads there (the solver's healthy range over the parts' and
 * rails' tolerances, {@link ExpectedVolts}). The readings are stored apart from those of the fault,
 * so that no diagnosis counts them.
 */
public final class AfterRepair {
  private AfterRepair() {}

  /**
   * A point to read again, with the healthy band there.
   *
   * @param at the test point (a net or {@code PACKAGE.PIN})
   * @param nominal what a healthy stage reads there, volts (NaN when unknown)
   * @param low the lower end of the healthy band, volts (NaN when unknown)
   * @param high the upper end of the healthy band, volts (NaN when unknown)
   */
  public record CheckPoint(String at, double nominal, double low, double high) {
    /** Returns whether a healthy band is known here. */
    public boolean hasBand() {
      return Double.isFinite(low) && Double.isFinite(high);
    }

    /** Returns whether {@code volts} lies within the healthy band (false when none is known). */
    public boolean inside(double volts) {
      return hasBand() && volts >= low && volts <= high;
    }
  }

  /**
   * A value read again at a point.
   *
   * @param point where, with its band
   * @param volts what the meter showed
   */
  public record Taken(CheckPoint point, double volts) {}

  /**
   * Returns the points to read again: each DC point of {@code standing} (the readings of the case
   * that stand) once, in the order first read, with the healthy band of {@code stage}. Solves the
   * stage and its tolerance corners: call off the screen's thread.
   */
  public static List<CheckPoint> points(Stage stage, List<Reading> standing) {
    Set<String> at = new LinkedHashSet<>();
    for (Reading r : standing) {
      if (r.kind() == Reading.Kind.DC) {
        at.add(r.at());
      }
    }
    ExpectedVolts healthy = ExpectedVolts.of(stage);
    List<CheckPoint> points = new ArrayList<>();
    for (String point : at) {
      points.add(new CheckPoint(point, healthy.at(point), healthy.low(point), healthy.high(point)));
    }
    return points;
  }

  /** Returns the records of values read again with {@code meter}, taken at {@code now}. */
  static List<AfterRepairReading> records(
      String caseId, List<Taken> taken, MeterSpec meter, Instant now) {
    List<AfterRepairReading> records = new ArrayList<>();
    for (Taken t : taken) {
      CheckPoint p = t.point();
      records.add(
          new AfterRepairReading(
              HistoryStore.newId(),
              caseId,
              p.at(),
              t.volts(),
              StoredText.meterLine(meter),
              now,
              p.hasBand() ? p.low() : null,
              p.hasBand() ? p.high() : null));
    }
    return records;
  }
}
