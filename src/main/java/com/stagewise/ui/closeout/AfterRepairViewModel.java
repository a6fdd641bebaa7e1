package com.stagewise.ui.closeout;

import com.stagewise.casework.AfterRepair;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.RepairCase;
import com.stagewise.ui.Bench;
import com.stagewise.ui.widget.ValuePadModel;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import javafx.beans.property.IntegerProperty;
import javafx.beans.property.SimpleIntegerProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The check after the repair, on the close-out: the DC points read during the diagnosis are read
 * again on the value pad, each shown against its healthy band with a plain word whether it is
 * inside, and stored (apart from the readings of the fault, which the diagnosis keeps to).
 */
public final class AfterRepairViewModel {
  private final Bench bench;
  private final ObservableList<CheckRow> rows = FXCollections.observableArrayList();
  private final IntegerProperty current = new SimpleIntegerProperty(-1);
  private final ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.VOLTS);
  private final StringProperty summary = new SimpleStringProperty("");
  private final List<AfterRepairReading> stored = new ArrayList<>();

  /**
   * One point of the check.
   *
   * @param point where, with its healthy band
   * @param title the point in words ("U1 pin 1")
   * @param value the volts read after the repair, or null while not read
   * @param saved whether that value is stored in the history
   */
  public record CheckRow(AfterRepair.CheckPoint point, String title, Double value, boolean saved) {
    /** Returns the band in words: "healthy −4.76 V to −4.64 V", or that none is known. */
    public String band() {
      return point.hasBand()
          ? "healthy " + Words.band(point.low(), point.high())
          : "no healthy band known here";
    }

    /** Returns the verdict in plain words, or empty while not read. */
    public String verdict() {
      if (value == null) {
        return "";
      }
      if (!point.hasBand()) {
        return Words.measured(value) + ": no band to compare with";
      }
      if (point.inside(value)) {
        return Words.measured(value) + ": inside the healthy band";
      }
      return Words.measured(value)
          + ": OUTSIDE the healthy band, "
          + (value > point.high()
              ? Words.volts(value - point.high()) + " above its top end"
              : Words.volts(point.low() - value) + " below its bottom end");
    }

    /** Returns whether it was read and lies outside a known band. */
    public boolean outside() {
      return value != null && point.hasBand() && !point.inside(value);
    }
  }

  /** Creates the check's model on a bench. */
  public AfterRepairViewModel(Bench bench) {
    this.bench = bench;
    bench.openCaseProperty().addListener((o, was, now) -> clear());
  }

  public ObservableList<CheckRow> rows() {
    return rows;
  }

  /** The row the pad reads into, or −1 when none. */
  public IntegerProperty currentProperty() {
    return current;
  }

  public ValuePadModel pad() {
    return pad;
  }

  /** Says how many readings are inside their bands, and which are not. */
  public StringProperty summaryProperty() {
    return summary;
  }

  private void clear() {
    rows.clear();
    stored.clear();
    current.set(-1);
    summary.set("");
    pad.textProperty().set("");
  }

  /**
   * Lists the points to read again (the case's DC points, each with its healthy band), with what
   * was stored from an earlier check of this case, and puts the pad on the first point not read.
   */
  public void start() {
    RepairCase rc = bench.openCaseProperty().get();
    Stage stage = bench.stageProperty().get();
    if (rc == null || stage == null) {
      bench
          .problems()
          .show(
              "No stage to check against",
              "The check after the repair compares each point with the stage's healthy band.",
              "Pick the case's stage and take its readings first.");
      return;
    }
    List<Reading> standing = List.copyOf(bench.readings());
    bench
        .tasks()
        .run(
            "Working out the healthy bands",
            () ->
                new Loaded(
                    AfterRepair.points(stage, standing),
                    bench
                        .store()
                        .cases()
                        .caseFile(rc.id())
                        .map(f -> f.afterRepair())
                        .orElse(List.of())),
            loaded -> {
              if (bench.openCaseProperty().get() != rc) {
                return;
              }
              stored.clear();
              stored.addAll(loaded.stored());
              List<CheckRow> list = new ArrayList<>();
              for (AfterRepair.CheckPoint p : loaded.points()) {
                Double last = null;
                for (AfterRepairReading r : loaded.stored()) {
                  if (r.at().equals(p.at())) {
                    last = r.value();
                  }
                }
                list.add(new CheckRow(p, Words.pin(p.at()), last, last != null));
              }
              rows.setAll(list);
              if (list.isEmpty()) {
                summary.set(
                    "No DC readings were taken in this case: there is nothing to read again.");
              }
              moveToNext(-1);
              summarize();
            },
            e ->
                bench
                    .problems()
                    .failed("Could not work out the healthy bands", e, Words.CHECK_DATABASE));
  }

  private record Loaded(List<AfterRepair.CheckPoint> points, List<AfterRepairReading> stored) {}

  /** Puts the pad on row {@code index} (tapped). */
  public void select(int index) {
    if (index >= 0 && index < rows.size()) {
      current.set(index);
      pad.textProperty().set("");
    }
  }

  /** Takes the pad's value as the reading of the current point and moves to the next one. */
  public void enter() {
    int i = current.get();
    if (i < 0 || i >= rows.size()) {
      return;
    }
    if (!pad.hasValue()) {
      bench
          .problems()
          .show(
              "Type the reading",
              "The pad holds no value in volts.",
              "Type what the meter shows at " + rows.get(i).title() + ", e.g. -4.70.");
      return;
    }
    CheckRow row = rows.get(i);
    rows.set(i, new CheckRow(row.point(), row.title(), pad.valueProperty().get(), false));
    pad.textProperty().set("");
    moveToNext(i);
    summarize();
  }

  private void moveToNext(int after) {
    for (int j = after + 1; j < rows.size(); j++) {
      if (rows.get(j).value() == null) {
        current.set(j);
        return;
      }
    }
    current.set(-1);
  }

  /** Returns whether some value read is not stored yet. */
  public boolean hasUnsaved() {
    return rows.stream().anyMatch(r -> r.value() != null && !r.saved());
  }

  /** Stores the values read and not yet stored, in one transaction, and marks them stored. */
  public void store(Runnable then) {
    RepairCase rc = bench.openCaseProperty().get();
    if (rc == null) {
      return;
    }
    List<AfterRepair.Taken> taken = new ArrayList<>();
    for (CheckRow r : rows) {
      if (r.value() != null && !r.saved()) {
        taken.add(new AfterRepair.Taken(r.point(), r.value()));
      }
    }
    if (taken.isEmpty()) {
      then.run();
      return;
    }
    bench
        .tasks()
        .run(
            "Storing the check after the repair",
            () -> bench.casework().addAfterRepair(rc.id(), taken, MeterSpec.DEFAULT),
            saved -> {
              stored.addAll(saved);
              for (int i = 0; i < rows.size(); i++) {
                CheckRow r = rows.get(i);
                if (r.value() != null && !r.saved()) {
                  rows.set(i, new CheckRow(r.point(), r.title(), r.value(), true));
                }
              }
              summarize();
              then.run();
            },
            e -> bench.problems().failed("Could not store the check", e, Words.CHECK_DATABASE));
  }

  /** Returns each point read after the repair that lies outside its healthy band, in words. */
  public List<String> outside() {
    List<String> lines = new ArrayList<>();
    for (CheckRow r : rows) {
      if (r.outside()) {
        lines.add(r.title() + " reads " + Words.measured(r.value()) + " (" + r.band() + ")");
      }
    }
    return lines;
  }

  private void summarize() {
    long read = rows.stream().filter(r -> r.value() != null).count();
    if (rows.isEmpty() || read == 0) {
      if (!rows.isEmpty()) {
        summary.set(
            "Read each point again with the meter, as during the diagnosis (the unit powered"
                + " as then: keep clear of mains and high voltages).");
      }
      return;
    }
    long inside =
        rows.stream().filter(r -> r.value() != null && r.point().inside(r.value())).count();
    List<String> outside = outside();
    StringBuilder text = new StringBuilder();
    text.append(inside)
        .append(" of ")
        .append(read)
        .append(read == 1 ? " reading is" : " readings are")
        .append(" inside the healthy band.");
    if (!outside.isEmpty()) {
      text.append(" Outside: ").append(String.join("; ", outside)).append('.');
    }
    if (read < rows.size()) {
      text.append(" ").append(rows.size() - read).append(" still to read.");
    }
    summary.set(text.toString());
  }
}
