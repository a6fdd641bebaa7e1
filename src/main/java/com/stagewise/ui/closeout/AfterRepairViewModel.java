package com.stagewise.ui.closeout;

import com.stagewise.casework.AfterRepair;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.RepairCase;
import com.stagewise.ui.Bench;
import com.stagewise.ui.readings.PowerOffMode;
import com.stagewise.ui.widget.ValuePadModel;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.IntegerProperty;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleIntegerProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The check after the repair, on the close-out: every point read during the diagnosis is read again
 * on the value pad in its own kind (DC volts, AC volts in its measure at the test frequency, ohms
 * with the power off between two points), each shown against its healthy band with a plain word
 * whether it is inside, and stored (apart from the readings of the fault, which the diagnosis keeps
 * to). While an ohms point is read, the pad takes ohms (k, M, OL) and the power-off caution stands.
 */
public final class AfterRepairViewModel {
  /** The caution shown while an ohms point is read: the readings screen's power-off caution. */
  public static final String POWER_OFF_CAUTION = PowerOffMode.CAUTION;

  private final Bench bench;
  private final ObservableList<CheckRow> rows = FXCollections.observableArrayList();
  private final IntegerProperty current = new SimpleIntegerProperty(-1);
  private final ValuePadModel pad = new ValuePadModel(ValuePadModel.Quantity.VOLTS);
  private final StringProperty summary = new SimpleStringProperty("");
  private final StringProperty padLine = new SimpleStringProperty("");
  private final BooleanProperty powerOff = new SimpleBooleanProperty(false);
  private final List<AfterRepairReading> stored = new ArrayList<>();

  /** Creates the check's model on a bench. */
  public AfterRepairViewModel(Bench bench) {
    this.bench = bench;
    bench.openCaseProperty().addListener((o, was, now) -> clear());
    current.addListener((o, was, now) -> followPoint());
    rows.addListener((javafx.collections.ListChangeListener<CheckRow>) c -> followPoint());
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

  /**
   * Says what the pad takes for the point being read: "DC volts", "AC volts RMS at 1 kHz", "Ohms,
   * power off"; empty when no point is being read.
   */
  public StringProperty padLineProperty() {
    return padLine;
  }

  /**
   * Whether the point being read is an ohms point: the unit is to be unplugged and discharged, and
   * the power-off caution ({@link #POWER_OFF_CAUTION}) stands.
   */
  public BooleanProperty powerOffProperty() {
    return powerOff;
  }

  private void clear() {
    rows.clear();
    stored.clear();
    current.set(-1);
    summary.set("");
    pad.textProperty().set("");
  }

  /** Sets the pad's unit, its line and the caution for the point being read. */
  private void followPoint() {
    int i = current.get();
    if (i < 0 || i >= rows.size()) {
      padLine.set("");
      powerOff.set(false);
      return;
    }
    AfterRepair.CheckPoint p = rows.get(i).point();
    boolean ohms = p.kind() == Reading.Kind.OHMS;
    pad.quantityProperty()
        .set(ohms ? ValuePadModel.Quantity.METER_OHMS : ValuePadModel.Quantity.VOLTS);
    pad.unsignedProperty().set(p.kind() == Reading.Kind.AC ? ValuePadModel.AC_AMPLITUDE : "");
    padLine.set(
        switch (p.kind()) {
          case DC -> "DC volts";
          case AC -> Words.acVolts(p.measure().word(), p.hz());
          case OHMS -> "Ohms (power off)";
        });
    powerOff.set(ohms);
  }

  /**
   * Lists the points to read again (each point read during the diagnosis in its own kind, with its
   * healthy band), with what was stored from an earlier check of this case, and puts the pad on the
   * first point not read.
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
                  if (CheckRow.samePoint(p, r)) {
                    last = r.value();
                  }
                }
                list.add(new CheckRow(p, CheckRow.title(p), last, last != null));
              }
              rows.setAll(list);
              if (list.isEmpty()) {
                summary.set("No readings were taken in this case: there is nothing to read again.");
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
    CheckRow row = rows.get(i);
    Reading.Kind kind = row.point().kind();
    if (pad.refusedNegative().isPresent()) {
      bench.problems().negativeAmplitude(pad.refusedNegative().getAsDouble());
      return;
    }
    if (!pad.hasValue()) {
      bench
          .problems()
          .show(
              "Type the reading",
              kind == Reading.Kind.OHMS
                  ? "The pad holds no value in ohms."
                  : "The pad holds no value in volts.",
              "Type what the meter shows at "
                  + row.title()
                  + switch (kind) {
                    case DC -> ", e.g. -4.70.";
                    case AC -> ", e.g. 0.72 (" + row.point().measure().words() + ").";
                    case OHMS -> ", e.g. 46k8, or tap OL for the meter's over-range.";
                  });
      return;
    }
    double value = pad.valueProperty().get();
    if (kind == Reading.Kind.AC && value < 0) {
      // What was typed stays on the pad, to be put right.
      bench.problems().negativeAmplitude(value);
      return;
    }
    rows.set(i, new CheckRow(row.point(), row.title(), value, false));
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
        lines.add(r.outsideSentence());
      }
    }
    return lines;
  }

  private void summarize() {
    long read = rows.stream().filter(r -> r.value() != null).count();
    boolean anyOhms = rows.stream().anyMatch(r -> r.point().kind() == Reading.Kind.OHMS);
    if (rows.isEmpty() || read == 0) {
      if (!rows.isEmpty()) {
        summary.set(
            "Read each point again as during the diagnosis (the unit powered as then: keep clear"
                + " of mains and high voltages)."
                + (anyOhms
                    ? " Read the ohms points with the power off: unplug the unit and discharge"
                        + " it first."
                    : ""));
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
