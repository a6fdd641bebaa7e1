package com.stagewise.cli.history;

import static com.stagewise.history.HistoryStore.shortId;

import com.stagewise.history.CaseFile;
import com.stagewise.history.ImportReport;
import com.stagewise.history.SearchHit;
import com.stagewise.history.ShopMemory;
import com.stagewise.history.UnitHistory;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/** The readable text of the history commands (times in UTC, numbers with a decimal point). */
final class HistoryText {
  private static final DateTimeFormatter WHEN =
      DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm", Locale.ROOT).withZone(ZoneOffset.UTC);
  private static final String NL = System.lineSeparator();

  private HistoryText() {}

  static String when(Instant time) {
    return WHEN.format(time);
  }

  /** Returns a photo's size in pixels, "640 × 480 px". */
  static String pixels(CasePhoto photo) {
    return photo.width() + " × " + photo.height() + " px";
  }

  static String unitHistory(UnitHistory history) {
    StringBuilder text = new StringBuilder();
    text.append("Unit ")
        .append(history.unit().serial())
        .append(" — ")
        .append(history.boardModel().name());
    if (!history.unit().owner().isEmpty()) {
      text.append(" — ").append(history.unit().owner());
    }
    text.append(NL);
    if (history.cases().isEmpty()) {
      text.append("No cases yet.").append(NL);
    }
    for (CaseFile file : history.cases()) {
      text.append(NL).append(caseFile(file)).append(NL);
    }
    return text.toString();
  }

  static String caseFile(CaseFile file) {
    RepairCase c = file.repairCase();
    StringBuilder text = new StringBuilder();
    text.append("Case ").append(shortId(c.id())).append("  opened ").append(when(c.openedAt()));
    if (c.closedAt() != null) {
      text.append(", closed ").append(when(c.closedAt())).append(": ").append(c.outcome().word());
    } else {
      text.append(", open");
    }
    text.append(NL).append("  Symptom: ").append(indent(c.symptom())).append(NL);
    if (!c.confirmedFaults().isEmpty()) {
      text.append("  Found: ").append(String.join(", ", c.confirmedFaults())).append(NL);
    }
    if (!file.readings().isEmpty()) {
      text.append("  Readings:").append(NL);
      for (StoredReading r : file.readings()) {
        if (r.kind() == ReadingKind.OHMS) {
          // A power-off reading: between two points, in ohms or OL.
          text.append(
              String.format(
                  Locale.ROOT,
                  "    %s  %-8s to %-8s ohms %s",
                  when(r.takenAt()),
                  r.at(),
                  r.to(),
                  r.isOverRange() ? "OL" : number(r.value()) + " Ω"));
          text.append(NL);
          continue;
        }
        text.append(
            String.format(
                Locale.ROOT,
                "    %s  %-8s %s %s V",
                when(r.takenAt()),
                r.at(),
                r.kind().word(),
                number(r.value())));
        if (r.hz() != null) {
          // An AC reading says how it is stated: rms, peak or pp (peak for one stored earlier).
          text.append(' ')
              .append(r.measureWord())
              .append(" at ")
              .append(number(r.hz()))
              .append(" Hz");
        }
        if (r.struck()) {
          text.append("  struck out ").append(when(r.struckAt()));
        }
        text.append(NL);
      }
    }
    if (!file.afterRepair().isEmpty()) {
      // Read again after the repair: kept apart from the readings of the fault.
      text.append("  After repair:").append(NL);
      for (AfterRepairReading r : file.afterRepair()) {
        text.append("    ").append(afterRepairLine(r)).append(NL);
      }
    }
    if (!file.photos().isEmpty()) {
      text.append("  Photos:").append(NL);
      for (CasePhoto photo : file.photos()) {
        text.append(
            String.format(
                Locale.ROOT,
                "    %s  %s  %s%s",
                when(photo.attachedAt()),
                photo.fileName(),
                pixels(photo),
                photo.attachedBy().isEmpty() ? "" : "  by " + photo.attachedBy()));
        text.append(NL);
      }
    }
    for (SuspectListRecord list : file.suspectLists()) {
      text.append("  Suspects at ")
          .append(when(list.computedAt()))
          .append(" (Stagewise ")
          .append(list.programVersion())
          .append("): ")
          .append(list.verdict())
          .append(NL);
      for (StoredSuspect s : list.suspects()) {
        text.append("  ").append(suspectLine(s, Map.of())).append(NL);
      }
    }
    for (RepairAction a : file.actions()) {
      text.append("  ").append(when(a.at())).append("  ").append(a.kind().word());
      if (!a.part().isEmpty()) {
        text.append(' ').append(a.part());
      }
      if (!a.oldValue().isEmpty() || !a.newValue().isEmpty()) {
        text.append(": ").append(a.oldValue()).append(" → ").append(a.newValue());
      }
      if (!a.text().isEmpty()) {
        text.append(" — ").append(indent(a.text()));
      }
      text.append(NL);
    }
    for (CaseNote n : file.notes()) {
      text.append("  ").append(when(n.at())).append("  note: ").append(indent(n.text())).append(NL);
    }
    return text.toString().stripTrailing();
  }

  static String hits(List<SearchHit> hits) {
    if (hits.isEmpty()) {
      return "No cases found." + NL;
    }
    StringBuilder text = new StringBuilder();
    for (SearchHit hit : hits) {
      text.append(shortId(hit.caseId()))
          .append("  ")
          .append(when(hit.openedAt()))
          .append("  ")
          .append(hit.serial())
          .append("  ")
          .append(hit.boardModel())
          .append("  ")
          .append(hit.status().word());
      if (hit.outcome() != null) {
        text.append(" (").append(hit.outcome().word()).append(')');
      }
      if (!hit.confirmedFaults().isEmpty()) {
        text.append("  ").append(String.join(", ", hit.confirmedFaults()));
      }
      text.append(NL).append("    ").append(hit.snippet().replace('\n', ' ')).append(NL);
    }
    return text.toString();
  }

  static String importReport(ImportReport report) {
    StringBuilder text = new StringBuilder();
    text.append(
            String.format(
                Locale.ROOT,
                "Imported: %d added, %d updated, %d already here, %d conflicts.",
                report.added(),
                report.updated(),
                report.unchanged(),
                report.conflicts().size()))
        .append(NL);
    for (String match : report.matched()) {
      text.append("  matched: ").append(match).append(NL);
    }
    for (ImportReport.Conflict conflict : report.conflicts()) {
      text.append("  conflict: ")
          .append(conflict.kind())
          .append(' ')
          .append(conflict.id())
          .append(": ")
          .append(conflict.reason())
          .append(NL);
    }
    return text.toString();
  }

  /** Returns one suspect as a line of text, with the shop's hint ("seen 3 times on this model"). */
  static String suspectLine(StoredSuspect s, Map<String, Integer> shopCounts) {
    String hint = ShopMemory.hint(s.fault(), shopCounts).map(h -> "  [" + h + "]").orElse("");
    List<String> others = s.group().stream().filter(f -> !f.equals(s.fault())).toList();
    String group =
        s.group().size() > 1 ? "  (cannot yet be told from " + String.join(", ", others) + ")" : "";
    return String.format(
        Locale.ROOT,
        "  %2d. %-18s %5.1f %%%s%s",
        s.rank(),
        s.fault(),
        100 * s.probability(),
        group,
        hint);
  }

  /** Returns a number as typed, without trailing zeros or exponent, independent of the locale. */
  /**
   * Returns a reading after the repair in one line: "OUT dc -4.71 V inside healthy -4.8 to -4.6 V",
   * "U1.1 ac 0.72 V rms at 1000 Hz inside healthy 0.71 to 0.76 V", "SUM to OUT ohms 46800 Ω inside
   * healthy 46500 to 47500 Ω" (OL for the meter's over-range).
   */
  static String afterRepairLine(AfterRepairReading r) {
    String unit = r.kind() == ReadingKind.OHMS ? " Ω" : " V";
    String what =
        switch (r.kind()) {
          case DC -> String.format(Locale.ROOT, "%-8s dc %s V", r.at(), number(r.value()));
          case AC ->
              String.format(
                  Locale.ROOT,
                  "%-8s ac %s V %s at %s Hz",
                  r.at(),
                  number(r.value()),
                  r.measure(),
                  number(r.hz()));
          case OHMS ->
              String.format(
                  Locale.ROOT, "%-8s to %-8s ohms %s", r.at(), r.to(), ohms(r.value(), unit));
        };
    String verdict =
        !r.hasBand()
            ? "(no healthy band known)"
            : (r.inside() ? "inside" : "OUTSIDE")
                + " healthy "
                + (r.kind() == ReadingKind.OHMS
                    ? bandOhms(r.healthyLow(), r.healthyHigh())
                    : bandEnd(r.healthyLow()) + " to " + bandEnd(r.healthyHigh()) + unit);
    return when(r.takenAt()) + "  " + what + "  " + verdict;
  }

  private static String ohms(double value, String unit) {
    return value == Double.POSITIVE_INFINITY ? "OL" : number(value) + unit;
  }

  private static String bandOhms(double low, double high) {
    if (low == Double.POSITIVE_INFINITY) {
      return "OL";
    }
    return bandEnd(low) + " to " + (high == Double.POSITIVE_INFINITY ? "OL" : bandEnd(high) + " Ω");
  }

  /**
   * Returns an end of a computed healthy band with six significant digits (46530.00000000001 is
   * 46530): the band comes from tolerance corners, and the digits beyond are rounding.
   */
  private static String bandEnd(double value) {
    return java.math.BigDecimal.valueOf(value)
        .round(new java.math.MathContext(6))
        .stripTrailingZeros()
        .toPlainString();
  }

  static String number(double value) {
    return java.math.BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
  }

  private static String indent(String text) {
    return text.replace("\n", NL + "    ");
  }
}
