package com.stagewise.ui.readings;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Reading;
import com.stagewise.ui.drawing.BandChart;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import javafx.scene.control.Label;
import javafx.scene.control.ListCell;
import javafx.scene.layout.VBox;

/**
 * One reading's card: its point (or pair of points), its value, and its band chart — volts on a
 * linear axis, AC amplitudes on their own axis from 0 V in the reading's measure, ohms on a
 * logarithmic one. A struck reading shows struck out, without its chart.
 */
final class ReadingCard extends ListCell<ReadingRow> {
  private final BandChart chart = new BandChart();
  private final Label title = new Label();
  private final VBox box = new VBox(2, title, chart);

  ReadingCard() {
    title.setWrapText(true);
    chart.setMaxWidth(Double.MAX_VALUE);
    setPrefWidth(0);
  }

  /** Returns a reading's value as shown: "14.96 V", "0.120 V AC RMS", "46.8 kΩ", "OL". */
  static String valueText(Reading r) {
    return switch (r.kind()) {
      case AC ->
          Words.measured(r.value())
              + " AC "
              + r.measure().map(m -> m.words()).orElse(AcMeasure.PEAK.words());
      case OHMS -> Words.ohms(r.value());
      case DC -> Words.measured(r.value());
    };
  }

  @Override
  protected void updateItem(ReadingRow row, boolean empty) {
    super.updateItem(row, empty);
    if (empty || row == null) {
      setGraphic(null);
      setText(null);
      return;
    }
    Reading r = row.reading();
    String value = valueText(r);
    if (row.struck()) {
      title.setText(
          row.title()
              + ":  "
              + value
              + "  — struck out"
              + (row.struckAt() == null ? "" : " " + Words.dateTime(row.struckAt())));
      if (!title.getStyleClass().contains("struck")) {
        title.getStyleClass().add("struck");
      }
      chart.setVisible(false);
      chart.setManaged(false);
      setText(null);
      setGraphic(box);
      return;
    }
    title.getStyleClass().remove("struck");
    chart.setVisible(true);
    chart.setManaged(true);
    String state =
        Double.isNaN(row.healthyLow())
            ? ""
            : row.healthy() ? "  — in the healthy range" : "  — outside the healthy range";
    title.setText(row.title() + ":  " + value + state);
    List<BandChart.Marker> markers = new ArrayList<>();
    row.predictions().forEach((label, v) -> markers.add(new BandChart.Marker(label, v)));
    if (r.kind() == Reading.Kind.OHMS) {
      chart.showOhms(
          Words.pin(r.at()) + " to " + Words.pin(r.to()),
          row.healthyLow(),
          row.healthyHigh(),
          r.value(),
          markers);
    } else if (r.kind() == Reading.Kind.AC) {
      chart.showAc(
          Words.pin(r.at()) + ", AC",
          row.healthyLow(),
          row.healthyHigh(),
          r.value(),
          markers,
          r.measure().orElse(AcMeasure.PEAK).words());
    } else {
      chart.show(Words.pin(r.at()), row.healthyLow(), row.healthyHigh(), r.value(), markers);
    }
    setText(null);
    setGraphic(box);
  }
}
