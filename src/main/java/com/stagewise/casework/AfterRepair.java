package com.stagewise.casework;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.BandFit;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.solver.ExpectedAc;
import com.stagewise.solver.ExpectedVolts;
import com.stagewise.solver.OhmsPrediction;
import com.stagewise.solver.PowerOff;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The check after a repair: every point read during the diagnosis is read again in its own kind,
 * and each is compared with what a healthy stage reads there — a DC level with the solver's healthy
 * range over the parts' and rails' tolerances ({@link ExpectedVolts}), an AC amplitude with the
 * healthy AC range at the test frequency in the measure it was read in ({@link ExpectedAc}, as the
 * readings screen's AC cards), ohms between two points with the power off with the healthy range of
 * the power-off network ({@link PowerOff}, as the ohms cards and the confirming checks). The
 * readings are stored apart from those of the fault, so that no diagnosis counts them.
 */
public final class AfterRepair {
  private AfterRepair() {}

  /**
   * A point to read again, in the kind it was read during the diagnosis, with the healthy band
   * there.
   *
   * @param at the test point (a net, {@code PACKAGE.PIN} or a part lead); the first point of an
   *     ohms reading
   * @param kind DC volts, AC volts or ohms (power off)
   * @param to the second point of an ohms reading; empty for volts
   * @param measure how an AC reading is stated (RMS, peak or peak-to-peak); null for DC and ohms
   * @param hz the test frequency of an AC reading in hertz; 0 for DC and ohms
   * @param nominal what a healthy stage reads there (volts, AC volts in {@code measure}, or ohms
   *     with +∞ for OL); NaN when unknown
   * @param low the lower end of the healthy band, in the same unit; NaN when unknown
   * @param high the upper end of the healthy band, in the same unit (+∞ where a healthy stage reads
   *     OL); NaN when unknown
   * @param across the resistors whose leads sit on an ohms reading's two nets ("R15"); empty when
   *     none, and for volts
   */
  public record CheckPoint(
      String at,
      Reading.Kind kind,
      String to,
      AcMeasure measure,
      double hz,
      double nominal,
      double low,
      double high,
      String across) {
    /** Checks the fields; see the record description. */
    public CheckPoint {
      Objects.requireNonNull(at, "at");
      Objects.requireNonNull(kind, "kind");
      to = to == null ? "" : to;
      across = across == null ? "" : across;
      if ((kind == Reading.Kind.AC) != (measure != null)) {
        throw new IllegalArgumentException("an AC point has a measure, a DC or ohms point none");
      }
      if ((kind == Reading.Kind.OHMS) == to.isEmpty()) {
        throw new IllegalArgumentException("an ohms point has a second point, a volts point none");
      }
    }

    /** Returns a DC point with its band in volts; see the record description. */
    public CheckPoint(String at, double nominal, double low, double high) {
      this(at, Reading.Kind.DC, "", null, 0, nominal, low, high, "");
    }

    /** Returns whether a healthy band is known here. */
    public boolean hasBand() {
      return kind == Reading.Kind.OHMS
          ? !Double.isNaN(low) && !Double.isNaN(high)
          : Double.isFinite(low) && Double.isFinite(high);
    }

    /**
     * Returns whether {@code value} (volts, AC volts in this point's measure, or ohms with +∞ for
     * OL) fits the healthy band by the readings screen's rule for its kind ({@link BandFit}); false
     * when no band is known.
     */
    public boolean inside(double value) {
      if (!hasBand()) {
        return false;
      }
      return switch (kind) {
        case DC -> BandFit.dc(low, high, value);
        case AC -> BandFit.ac(low, high, value);
        case OHMS -> BandFit.ohms(low, high, value);
      };
    }
  }

  /**
   * A value read again at a point.
   *
   * @param point where, with its band
   * @param value what the meter (or scope) showed: volts, AC volts in the point's measure, or ohms
   *     (+∞ for OL)
   */
  public record Taken(CheckPoint point, double value) {}

  /**
   * Returns the points to read again: each distinct point of {@code standing} (the readings of the
   * case that stand) once, in the order first read and in its own kind — a DC point, an AC point in
   * each measure and frequency it was read in, an ohms pair (in either order) — with the healthy
   * band of {@code stage}. Solves the stage and its tolerance corners: call off the screen's
   * thread.
   */
  public static List<CheckPoint> points(Stage stage, List<Reading> standing) {
    Map<String, Reading> distinct = new LinkedHashMap<>();
    for (Reading r : standing) {
      distinct.putIfAbsent(key(stage, r), r);
    }
    Bands bands = new Bands(stage);
    List<CheckPoint> points = new ArrayList<>();
    for (Reading r : distinct.values()) {
      points.add(bands.point(r));
    }
    return points;
  }

  /** Returns what makes two readings the same point to read again. */
  private static String key(Stage stage, Reading r) {
    return switch (r.kind()) {
      case DC -> "dc " + r.at();
      case AC -> "ac " + r.at() + " " + r.measureIn(stage).word() + " " + r.hz();
      case OHMS ->
          "ohms " + (r.at().compareTo(r.to()) <= 0 ? r.at() + " " + r.to() : r.to() + " " + r.at());
    };
  }

  /** The healthy bands of one stage, each worked out once, when a point of its kind asks. */
  private static final class Bands {
    private final Stage stage;
    private ExpectedVolts volts;
    private ExpectedAc ac;
    private PowerOff powerOff;

    Bands(Stage stage) {
      this.stage = stage;
    }

    CheckPoint point(Reading r) {
      return switch (r.kind()) {
        case DC -> {
          if (volts == null) {
            volts = ExpectedVolts.of(stage);
          }
          yield new CheckPoint(r.at(), volts.at(r.at()), volts.low(r.at()), volts.high(r.at()));
        }
        case AC -> {
          if (ac == null) {
            ac = ExpectedAc.of(stage);
          }
          AcMeasure measure = r.measureIn(stage);
          // The band in the measure the point was read in, as the AC cards show it; none when the
          // stage's test signal is at another frequency than the reading was taken at.
          boolean known = ac.solved() && ac.hz() == r.hz();
          yield new CheckPoint(
              r.at(),
              Reading.Kind.AC,
              "",
              measure,
              r.hz(),
              known ? measure.fromPeak(ac.at(r.at())) : Double.NaN,
              known ? measure.fromPeak(ac.low(r.at())) : Double.NaN,
              known ? measure.fromPeak(ac.high(r.at())) : Double.NaN,
              "");
        }
        case OHMS -> {
          if (powerOff == null) {
            powerOff = PowerOff.of(stage);
          }
          double nominal = Double.NaN;
          double low = Double.NaN;
          double high = Double.NaN;
          try {
            OhmsPrediction p = powerOff.predict(r.at(), r.to());
            nominal = p.nominal();
            low = p.low();
            high = p.high();
          } catch (IllegalArgumentException e) {
            // A point the stage lacks: no band, as on the ohms cards.
          }
          yield new CheckPoint(
              r.at(), Reading.Kind.OHMS, r.to(), null, 0, nominal, low, high, across(r));
        }
      };
    }

    /** Returns the resistors whose two leads are on the two points' nets, e.g. "R15". */
    private String across(Reading r) {
      String netA = powerOff.node(r.at()).orElse("");
      String netB = powerOff.node(r.to()).orElse("");
      List<String> refs = new ArrayList<>();
      for (Part p : stage.parts()) {
        if (p.kind() == PartKind.RESISTOR
            && !netA.isEmpty()
            && !netB.isEmpty()
            && (p.netA().equals(netA) && p.netB().equals(netB)
                || p.netA().equals(netB) && p.netB().equals(netA))) {
          refs.add(p.ref());
        }
      }
      return String.join(", ", refs);
    }
  }

  /** Returns the records of values read again with {@code meter}, taken at {@code now}. */
  static List<AfterRepairReading> records(
      String caseId, List<Taken> taken, MeterSpec meter, Instant now) {
    List<AfterRepairReading> records = new ArrayList<>();
    for (Taken t : taken) {
      CheckPoint p = t.point();
      boolean ac = p.kind() == Reading.Kind.AC;
      records.add(
          new AfterRepairReading(
              HistoryStore.newId(),
              caseId,
              p.at(),
              t.value(),
              switch (p.kind()) {
                case DC -> StoredText.meterLine(meter);
                // Judged within the AC uncertainty the readings screen takes: a scope's.
                case AC -> StoredText.scopeLine();
                case OHMS -> StoredText.ohmsLine(meter);
              },
              now,
              p.hasBand() ? p.low() : null,
              p.hasBand() ? p.high() : null,
              switch (p.kind()) {
                case DC -> ReadingKind.DC;
                case AC -> ReadingKind.AC;
                case OHMS -> ReadingKind.OHMS;
              },
              ac ? p.measure().word() : null,
              ac ? p.hz() : null,
              p.to()));
    }
    return records;
  }
}
