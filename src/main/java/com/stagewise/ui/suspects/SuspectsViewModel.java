package com.stagewise.ui.suspects;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.PartKind;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.Observation;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.solver.ExpectedAc;
import com.stagewise.solver.ExpectedVolts;
import com.stagewise.ui.Bench;
import com.stagewise.ui.Step;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/**
 * The suspects screen: the ranked suspects with their probability, why, ambiguity group and
 * estimated value; the confirming check; and, for the chosen suspect, its predicted voltages beside
 * the measured and the healthy ones.
 */
public final class SuspectsViewModel {
  private final Bench bench;
  private final ObservableList<SuspectRow> suspects = FXCollections.observableArrayList();
  private final ObjectProperty<SuspectRow> selected = new SimpleObjectProperty<>();
  private final ObservableList<PointRow> comparison = FXCollections.observableArrayList();
  private final StringProperty verdict = new SimpleStringProperty("");
  private final StringProperty confirmingCheck = new SimpleStringProperty("");
  private final StringProperty findings = new SimpleStringProperty("");
  private final ObjectProperty<ExpectedVolts> expected = new SimpleObjectProperty<>();
  private ExpectedAc expectedAc;
  private final ObjectProperty<Suspect> chosenForCloseOut = new SimpleObjectProperty<>();

  /** Creates the suspects screen's model on a bench. */
  public SuspectsViewModel(Bench bench) {
    this.bench = bench;
    bench.diagnosisProperty().addListener((o, was, now) -> refresh());
    bench.stageProperty().addListener((o, was, now) -> solve(now));
    selected.addListener((o, was, now) -> compare());
    solve(bench.stageProperty().get());
    refresh();
  }

  /**
   * One suspect as listed.
   *
   * @param suspect the suspect
   * @param rank its place, 1 for the first
   * @param title the fault in words
   * @param group the faults it cannot be told apart from, in words (empty when alone)
   * @param estimate the estimated value of a drifted part or low rail (empty when none)
   */
  public record SuspectRow(
      Suspect suspect, int rank, String title, String group, String estimate) {}

  /**
   * One test point compared: healthy, measured and under the chosen suspect; DC volts, or for an AC
   * reading the amplitude of the test signal in the reading's measure.
   *
   * @param at the test point
   * @param healthy nominal volts of a healthy stage (NaN when unknown)
   * @param measured the reading (NaN when not read)
   * @param predicted the volts under the chosen suspect (NaN when unknown)
   * @param ac for an AC row, its measure and frequency in words ("AC RMS at 1 kHz"); empty for DC
   */
  public record PointRow(String at, double healthy, double measured, double predicted, String ac) {
    /** Returns a DC row. */
    public PointRow(String at, double healthy, double measured, double predicted) {
      this(at, healthy, measured, predicted, "");
    }
  }

  public ObservableList<SuspectRow> suspects() {
    return suspects;
  }

  public ObjectProperty<SuspectRow> selectedProperty() {
    return selected;
  }

  public ObservableList<PointRow> comparison() {
    return comparison;
  }

  public StringProperty verdictProperty() {
    return verdict;
  }

  public StringProperty confirmingCheckProperty() {
    return confirmingCheck;
  }

  public StringProperty findingsProperty() {
    return findings;
  }

  public ObjectProperty<ExpectedVolts> expectedProperty() {
    return expected;
  }

  /** Returns the stage on the bench. */
  public javafx.beans.value.ObservableObjectValue<Stage> stageProperty() {
    return bench.stageProperty();
  }

  /** Returns the suspect taken to the close-out (null when none). */
  public ObjectProperty<Suspect> chosenForCloseOutProperty() {
    return chosenForCloseOut;
  }

  private void solve(Stage stage) {
    expected.set(null);
    expectedAc = null;
    if (stage == null) {
      return;
    }
    bench
        .tasks()
        .run(
            "Working out the expected voltages",
            () -> new Expected(ExpectedVolts.of(stage), ExpectedAc.of(stage)),
            both -> {
              if (bench.stageProperty().get() == stage) {
                expectedAc = both.ac();
                expected.set(both.volts());
                compare();
              }
            },
            e ->
                bench
                    .problems()
                    .failed(
                        "Could not work out the expected voltages",
                        e,
                        "Check the stage's parts on the Stage screen."));
  }

  private record Expected(ExpectedVolts volts, ExpectedAc ac) {}

  void refresh() {
    Diagnosis d = bench.diagnosisProperty().get();
    Stage stage = bench.stageProperty().get();
    List<SuspectRow> rows = new ArrayList<>();
    if (d != null) {
      int rank = 1;
      for (Suspect s : d.suspects()) {
        List<String> others = new ArrayList<>();
        for (String g : s.group()) {
          if (!g.equals(s.fault())) {
            others.add(Words.fault(g));
          }
        }
        rows.add(
            new SuspectRow(
                s, rank++, Words.fault(s.fault()), String.join(", ", others), estimate(stage, s)));
      }
      verdict.set(
          switch (d.verdict()) {
            case HEALTHY ->
                "The readings fit a healthy stage. Look elsewhere on the board, or take more readings.";
            case FAULT -> "The readings show a fault.";
            case INCONCLUSIVE -> "Not clear yet: take the next probe on the Readings screen.";
          });
      confirmingCheck.set(d.confirmingCheck());
      StringBuilder text = new StringBuilder();
      for (Observation o : d.observations()) {
        text.append("• ").append(Words.pin(o.at())).append(": ").append(o.text()).append('\n');
      }
      for (String note : d.notes()) {
        text.append("• ").append(note).append('\n');
      }
      findings.set(text.toString().strip());
    } else {
      verdict.set("No readings yet. Take readings first.");
      confirmingCheck.set("");
      findings.set("");
    }
    suspects.setAll(rows);
    selected.set(rows.isEmpty() ? null : rows.get(0));
    compare();
  }

  /** Returns the estimated value in words, e.g. "Estimated 6.8 kΩ (marked 4.7 kΩ)". */
  static String estimate(Stage stage, Suspect s) {
    if (s.estimatedValue().isEmpty() || stage == null) {
      return "";
    }
    double value = s.estimatedValue().getAsDouble();
    String what = s.fault().substring(0, s.fault().lastIndexOf(':'));
    Optional<Part> part = stage.part(what);
    if (part.isPresent()) {
      String unit = part.get().kind() == PartKind.CAPACITOR ? "F" : "Ω";
      return "Estimated value "
          + SiValue.format(value, unit, 2)
          + " (marked "
          + SiValue.format(part.get().value(), unit)
          + ")";
    }
    return stage
        .rail(what)
        .map(
            r ->
                "Estimated rail "
                    + Words.volts(value)
                    + " (should be "
                    + Words.volts(r.volts())
                    + ")")
        .orElse("Estimated " + SiValue.format(value, "", 2));
  }

  private void compare() {
    Stage stage = bench.stageProperty().get();
    SuspectRow row = selected.get();
    if (stage == null) {
      comparison.clear();
      return;
    }
    ExpectedVolts volts = expected.get();
    Set<String> points = new LinkedHashSet<>();
    for (Reading r : bench.readings()) {
      if (r.kind() == Reading.Kind.DC) {
        points.add(r.at());
      }
    }
    // Then the stage's own points, so that the comparison shows the whole stage.
    points.addAll(stage.pinNets().keySet());
    List<PointRow> rows = new ArrayList<>();
    for (String at : points) {
      double measured = Double.NaN;
      for (Reading r : bench.readings()) {
        if (r.at().equals(at) && r.kind() == Reading.Kind.DC) {
          measured = r.value();
        }
      }
      double healthy = volts == null ? Double.NaN : volts.at(at);
      double predicted =
          row == null ? Double.NaN : row.suspect().predicted().getOrDefault(at, Double.NaN);
      rows.add(new PointRow(at, healthy, measured, predicted));
    }
    rows.addAll(acRows(stage, row));
    comparison.setAll(rows);
  }

  /**
   * Returns a row for each point read in AC (the last reading there in each measure): the healthy
   * amplitude, the reading and the chosen suspect's, in the reading's measure.
   */
  private List<PointRow> acRows(Stage stage, SuspectRow row) {
    java.util.Map<String, PointRow> rows = new java.util.LinkedHashMap<>();
    for (Reading r : bench.readings()) {
      if (r.kind() != Reading.Kind.AC) {
        continue;
      }
      AcMeasure m = r.measureIn(stage);
      ExpectedAc signal = expectedAc;
      double healthy =
          signal == null || signal.hz() != r.hz() ? Double.NaN : m.fromPeak(signal.at(r.at()));
      Double peak = row == null ? null : row.suspect().predictedAc().get(r.at());
      double predicted = peak == null ? Double.NaN : m.fromPeak(peak);
      String how = "AC " + m.words() + " at " + Words.hertz(r.hz());
      rows.remove(r.at() + how);
      rows.put(r.at() + how, new PointRow(r.at(), healthy, r.value(), predicted, how));
    }
    return new ArrayList<>(rows.values());
  }

  /** Takes the chosen suspect to the close-out as the fault found. */
  public void closeOutWithSelected() {
    SuspectRow row = selected.get();
    chosenForCloseOut.set(row == null ? null : row.suspect());
    bench.go(Step.CLOSE_OUT);
  }

  /** Goes back to the readings for one more probe. */
  public void moreReadings() {
    bench.go(Step.READINGS);
  }
}
