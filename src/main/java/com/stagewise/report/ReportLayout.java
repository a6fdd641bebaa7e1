package com.stagewise.report;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.value.Engineering;
import com.stagewise.diagnosis.Wording;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import java.math.BigDecimal;
import java.math.MathContext;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Decides what goes on the pages of a repair report and in which order: title, unit, case, the
 * safety caution, readings, suspect lists, actions, confirmed faults and notes, then the footers.
 */
final class ReportLayout {
  /** The safety caution printed on every report (DESIGN.md "Safety"; common practice). */
  static final String CAUTION_TITLE = "Caution: working on powered equipment can kill.";

  static final String CAUTION_TEXT =
      "Mains-powered units carry lethal voltages, and their capacitors can hold a dangerous charge"
          + " after the plug is pulled: discharge capacitors before ohms checks. Follow local codes"
          + " and licensed practice. This report records what was measured and done; it is not a"
          + " statement that the unit is safe.";

  private static final DateTimeFormatter WHEN =
      DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm", Locale.ROOT).withZone(ZoneOffset.UTC);
  private static final double LABEL_WIDTH = 110;
  private static final MathContext SIGNIFICANT = new MathContext(6);

  private final CaseReport report;
  private final PageFlow flow;

  private ReportLayout(CaseReport report, TextWidth measure) {
    this.report = report;
    this.flow =
        new PageFlow(
            measure,
            "Repair report — unit "
                + report.unit().serial()
                + " — case "
                + HistoryStore.shortId(report.caseFile().repairCase().id()));
  }

  /** Returns the pages of the report, measured with {@code measure}. */
  static List<Page> lay(CaseReport report, TextWidth measure) {
    return new ReportLayout(report, measure).lay();
  }

  /** Returns a time as the report prints it in tables (UTC, to the minute, without the zone). */
  static String when(Instant time) {
    return WHEN.format(time);
  }

  /** Returns a time as the report prints it on its own, with the zone named. */
  static String whenUtc(Instant time) {
    return WHEN.format(time) + " UTC";
  }

  /**
   * Returns a number to 6 significant digits (more than any bench meter shows), without exponent or
   * trailing zeros, with a decimal point in every locale: 14.93, -13.45 (not -13.450000000000001),
   * 1000, 0.000023.
   */
  static String number(double value) {
    if (!Double.isFinite(value)) {
      return Double.toString(value);
    }
    return BigDecimal.valueOf(value).round(SIGNIFICANT).stripTrailingZeros().toPlainString();
  }

  private List<Page> lay() {
    RepairCase c = report.caseFile().repairCase();
    flow.paragraph(Style.TITLE, "Repair report");
    flow.gap(4);

    flow.heading("Unit", Style.BODY.leading());
    flow.field("Serial number", report.unit().serial(), LABEL_WIDTH);
    String maker = report.boardModel().maker();
    flow.field(
        "Board model",
        report.boardModel().name() + (maker.isBlank() ? "" : " (" + maker + ")"),
        LABEL_WIDTH);
    flow.field("Owner / job", orNone(report.unit().owner(), "not recorded"), LABEL_WIDTH);

    flow.heading("Case", Style.BODY.leading());
    flow.field("Case id", c.id(), LABEL_WIDTH);
    flow.field("Opened", whenUtc(c.openedAt()), LABEL_WIDTH);
    flow.field("Closed", c.closedAt() == null ? "not yet" : whenUtc(c.closedAt()), LABEL_WIDTH);
    flow.field("Status", c.status().word(), LABEL_WIDTH);
    flow.field(
        "Outcome",
        c.outcome() == null ? "none yet (the case is open)" : c.outcome().word(),
        LABEL_WIDTH);
    flow.field("Reported symptom", orNone(c.symptom(), "not recorded"), LABEL_WIDTH);
    flow.gap(10);
    flow.box(CAUTION_TITLE, CAUTION_TEXT);

    readings();
    suspects();
    afterRepair();
    actions();
    confirmed(c);
    notes();
    photos();
    return flow.finish(
        "Generated "
            + whenUtc(report.generatedAt())
            + " by Stagewise "
            + report.programVersion()
            + ". Times are UTC.");
  }

  private void readings() {
    List<StoredReading> readings = report.caseFile().readings();
    flow.heading("Readings (" + readings.size() + ")", 3 * Style.TABLE.leading());
    if (readings.stream().anyMatch(StoredReading::struck)) {
      flow.paragraph(
          Style.BODY,
          "A reading struck out (mistyped or taken at the wrong point) is kept here, marked, and"
              + " was left out of every diagnosis after it was struck.");
      flow.gap(3);
    }
    if (readings.isEmpty()) {
      flow.paragraph(Style.BODY, "No readings were stored in this case.");
      return;
    }
    List<String> meters = readings.stream().map(StoredReading::meterText).distinct().toList();
    boolean oneMeter = meters.size() == 1;
    if (oneMeter && !meters.get(0).isBlank()) {
      flow.paragraph(Style.BODY, "Meter: " + meters.get(0));
      flow.gap(3);
    }
    List<Column> columns =
        new ArrayList<>(
            List.of(
                new Column("#", 26),
                new Column("Test point", 84),
                new Column("Kind", 120),
                new Column("Value", 88),
                new Column("Taken (UTC)", 80)));
    if (!oneMeter) {
      columns.add(new Column("Meter", PageFlow.bodyWidth() - 398));
    }
    List<List<String>> rows = new ArrayList<>();
    for (int i = 0; i < readings.size(); i++) {
      StoredReading r = readings.get(i);
      List<String> row =
          new ArrayList<>(
              List.of(
                  Integer.toString(i + 1),
                  r.to().isEmpty()
                      ? Wording.point(r.at())
                      : Wording.point(r.at()) + " to " + Wording.point(r.to()),
                  r.to().isEmpty() ? r.hz() == null ? "DC" : acKind(r) : "ohms (power off)",
                  value(r),
                  r.struck()
                      ? when(r.takenAt()) + ", struck out " + when(r.struckAt())
                      : when(r.takenAt())));
      if (!oneMeter) {
        row.add(r.meterText());
      }
      rows.add(row);
    }
    flow.table(columns, rows);
  }

  /**
   * Returns an AC reading's kind with its measure and frequency, as the probe call says it: "AC RMS
   * at 1 kHz", "AC peak at 1 kHz" (every AC reading stored before measures is a peak).
   */
  private static String acKind(StoredReading r) {
    return "AC "
        + AcMeasure.of(r.measureWord()).map(AcMeasure::words).orElse(r.measureWord())
        + " at "
        + Engineering.of(r.hz(), "Hz", 4);
  }

  /** Returns a reading's value as printed: volts with the meter's digits, or ohms (OL). */
  private static String value(StoredReading r) {
    if (!r.to().isEmpty()) {
      return r.isOverRange() ? "OL" : Engineering.of(r.value(), "Ω", 4);
    }
    return Engineering.reading(r.value(), MeterSpec.DEFAULT)
        + (r.uncertainty() == null
            ? ""
            : " " + Engineering.PLUS_MINUS + Engineering.volts(r.uncertainty()));
  }

  private void suspects() {
    List<SuspectListRecord> lists = report.caseFile().suspectLists();
    flow.heading("Suspects as computed at the time", 4 * Style.TABLE.leading());
    if (lists.isEmpty()) {
      flow.paragraph(Style.BODY, "No suspect list was stored in this case.");
      return;
    }
    for (SuspectListRecord list : lists) {
      flow.gap(2);
      flow.ensure(Style.BODY_BOLD.leading() + 3 * Style.TABLE.leading());
      flow.paragraph(
          Style.BODY_BOLD,
          "Computed "
              + whenUtc(list.computedAt())
              + " by Stagewise "
              + list.programVersion()
              + "; verdict: "
              + list.verdict());
      List<List<String>> rows = new ArrayList<>();
      for (StoredSuspect s : list.suspects()) {
        List<String> others =
            s.group().stream().filter(f -> !f.equals(s.fault())).map(Wording::fault).toList();
        rows.add(
            List.of(
                Integer.toString(s.rank()),
                Wording.fault(s.fault()),
                String.format(Locale.ROOT, "%.1f", 100 * s.probability()) + Engineering.SPACE + "%",
                others.isEmpty() ? "" : String.join(", ", others),
                s.why()));
      }
      if (rows.isEmpty()) {
        flow.paragraph(Style.BODY, "No suspects were listed.");
      } else {
        flow.table(
            List.of(
                new Column("#", 24),
                new Column("Fault", 90),
                new Column("Probability", 62),
                new Column("Cannot be told from", 100),
                new Column("Why", PageFlow.bodyWidth() - 276)),
            rows);
      }
      if (!list.nextProbes().isBlank()) {
        flow.paragraph(Style.BODY_BOLD, "Next probes proposed then:");
        flow.paragraph(Style.TABLE, list.nextProbes());
      }
    }
  }

  private void actions() {
    List<RepairAction> actions = report.caseFile().actions();
    flow.heading("Actions", 3 * Style.TABLE.leading());
    if (actions.isEmpty()) {
      flow.paragraph(Style.BODY, "No actions were recorded in this case.");
      return;
    }
    List<List<String>> rows = new ArrayList<>();
    for (RepairAction a : actions) {
      rows.add(
          List.of(
              when(a.at()),
              a.kind().word().replace('-', ' '),
              a.part(),
              a.oldValue(),
              a.newValue(),
              a.text()));
    }
    flow.table(
        List.of(
            new Column("When (UTC)", 80),
            new Column("What", 70),
            new Column("Part", 38),
            new Column("Old value", 85),
            new Column("New value", 85),
            new Column("Details", PageFlow.bodyWidth() - 358)),
        rows);
  }

  private void confirmed(RepairCase c) {
    flow.heading("Confirmed fault", Style.BODY.leading());
    if (!c.confirmedFaults().isEmpty()) {
      flow.paragraph(
          Style.BODY, String.join(", ", c.confirmedFaults().stream().map(Wording::fault).toList()));
    } else if (c.closedAt() == null) {
      flow.paragraph(Style.BODY, "None yet: the case is not closed out.");
    } else {
      flow.paragraph(Style.BODY, "No fault was confirmed at close-out.");
    }
  }

  private void notes() {
    List<CaseNote> notes = report.caseFile().notes();
    flow.heading("Notes", 2 * Style.BODY.leading());
    if (notes.isEmpty()) {
      flow.paragraph(Style.BODY, "No notes.");
      return;
    }
    for (CaseNote note : notes) {
      flow.ensure(2 * Style.BODY.leading());
      flow.paragraph(Style.BODY_BOLD, whenUtc(note.at()));
      flow.paragraph(Style.BODY, PageFlow.LEFT + 12, PageFlow.bodyWidth() - 12, note.text());
      flow.gap(4);
    }
  }

  /**
   * The readings taken again after the repair, each in its kind (DC, AC in its measure at its
   * frequency, ohms with the power off between two points) against its healthy band.
   */
  private void afterRepair() {
    List<AfterRepairReading> readings = report.caseFile().afterRepair();
    if (readings.isEmpty()) {
      return;
    }
    flow.heading("After repair", 3 * Style.TABLE.leading());
    flow.paragraph(
        Style.BODY,
        "The points read again after the repair, each in the kind it was read during the diagnosis"
            + " and against what a healthy stage reads there (the healthy band over the parts' and"
            + " rails' tolerances). These readings are not part of the diagnosis above.");
    flow.gap(3);
    long inside = readings.stream().filter(AfterRepairReading::inside).count();
    flow.paragraph(
        Style.BODY_BOLD, inside + " of " + readings.size() + " inside the healthy band.");
    flow.gap(2);
    List<List<String>> rows = new ArrayList<>();
    for (AfterRepairReading r : readings) {
      rows.add(
          List.of(
              r.to().isEmpty()
                  ? Wording.point(r.at())
                  : Wording.point(r.at()) + " to " + Wording.point(r.to()),
              afterRepairKind(r),
              afterRepairValue(r, r.value()),
              !r.hasBand() ? "not known" : afterRepairBand(r),
              !r.hasBand() ? "-" : r.inside() ? "inside" : "OUTSIDE",
              when(r.takenAt())));
    }
    flow.table(
        List.of(
            new Column("Test point", 85),
            new Column("Kind", 90),
            new Column("Value", 65),
            new Column("Healthy band", 120),
            new Column("Verdict", 55),
            new Column("Taken (UTC)", PageFlow.bodyWidth() - 415)),
        rows);
  }

  /** Returns "DC", "AC RMS at 1 kHz" or "ohms (power off)", as the close-out names the kinds. */
  private static String afterRepairKind(AfterRepairReading r) {
    return switch (r.kind()) {
      case DC -> "DC";
      case AC ->
          "AC "
              + AcMeasure.of(r.measure()).map(AcMeasure::words).orElse(r.measure())
              + " at "
              + Engineering.of(r.hz(), "Hz", 4);
      case OHMS -> "ohms (power off)";
    };
  }

  /** Returns a value as printed: volts with the meter's digits, or ohms (OL for +∞). */
  private static String afterRepairValue(AfterRepairReading r, double value) {
    if (r.kind() == ReadingKind.OHMS) {
      return value == Double.POSITIVE_INFINITY ? "OL" : Engineering.of(value, "Ω", 4);
    }
    return Engineering.reading(value, MeterSpec.DEFAULT);
  }

  /** Returns a healthy band as printed: "-4.8 V to -4.6 V", "46.5 kΩ to 47.5 kΩ", "OL". */
  private static String afterRepairBand(AfterRepairReading r) {
    if (r.kind() != ReadingKind.OHMS) {
      return Engineering.band(r.healthyLow(), r.healthyHigh());
    }
    if (r.healthyLow() == Double.POSITIVE_INFINITY) {
      return "OL";
    }
    return afterRepairValue(r, r.healthyLow()) + " to " + afterRepairValue(r, r.healthyHigh());
  }

  private void photos() {
    List<StoredPhoto> photos = report.photos();
    if (photos.isEmpty()) {
      return;
    }
    flow.heading("Photos of the board (" + photos.size() + ")", 2 * Style.BODY.leading());
    for (int i = 0; i < photos.size(); i++) {
      CasePhoto p = photos.get(i).photo();
      String caption =
          (i + 1)
              + ". "
              + p.fileName()
              + " — attached "
              + whenUtc(p.attachedAt())
              + (p.attachedBy().isBlank() ? "" : " by " + p.attachedBy())
              + " ("
              + p.width()
              + " × "
              + p.height()
              + " pixels)";
      double reserve = 2 * Style.BODY.leading() + 8;
      flow.gap(4);
      flow.ensure(Style.BODY.leading() + Math.min(60, p.height()));
      flow.paragraph(Style.BODY_BOLD, caption);
      flow.gap(2);
      flow.picture(p.width(), p.height(), i, reserve);
    }
  }

  private static String orNone(String text, String none) {
    return text.isBlank() ? none : text;
  }
}
