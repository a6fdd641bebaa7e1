package com.stagewise.ui.readings;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Reading;
import com.stagewise.ui.widget.ValuePadModel;
import javafx.beans.binding.Bindings;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleObjectProperty;

/**
 * The point to probe while the unit is powered, and how it is read: the suggestion of the diagnosis
 * until the technician picks a point, DC or AC as the pad is set (an AC point in the measure chosen
 * on the pad). Plain Java with JavaFX properties, no nodes.
 */
final class PoweredProbe {
  private final ObjectProperty<ProbePoint> probe = new SimpleObjectProperty<>();
  private final AcChoice ac;
  private final PowerOffMode powerOff;
  private boolean chosenByHand;

  PoweredProbe(AcChoice ac, PowerOffMode powerOff) {
    this.ac = ac;
    this.powerOff = powerOff;
  }

  ObjectProperty<ProbePoint> property() {
    return probe;
  }

  /** Returns whether the technician picked the point (suggestions then leave it alone). */
  boolean chosenByHand() {
    return chosenByHand;
  }

  /** Makes the technician's pick the point to probe. */
  void choose(ProbePoint p) {
    chosenByHand = true;
    show(p);
  }

  /** Shows a suggestion unless the technician picked a point. */
  void suggest(ProbePoint p) {
    if (!chosenByHand) {
      show(p);
    }
  }

  /** Goes back to the suggestions (after a reading is added, or on request). */
  void release() {
    chosenByHand = false;
  }

  /** Shows a point to probe, an AC one in the measure chosen; the pad follows its kind. */
  void show(ProbePoint p) {
    ProbePoint shown = p;
    if (shown != null && shown.kind() == Reading.Kind.AC) {
      shown = shown.withMeasure(ac.measureProperty().get());
    }
    if (shown != null && !powerOff.activeProperty().get()) {
      ac.acProperty().set(shown.kind() == Reading.Kind.AC);
    }
    probe.set(shown);
  }

  /** Switches the pad between DC and AC volts; the point stays, read the other way. */
  void setAc(boolean on) {
    if (on && !ac.availableProperty().get()) {
      return;
    }
    ac.acProperty().set(on);
    ProbePoint p = probe.get();
    if (p != null && (p.kind() == Reading.Kind.AC) != on) {
      choose(p.readAs(on ? Reading.Kind.AC : Reading.Kind.DC, ac.hzProperty().get()));
    }
  }

  /** Chooses the measure AC readings are typed in; an AC point shown takes it at once. */
  void setMeasure(AcMeasure measure) {
    ac.choose(measure);
    ProbePoint p = probe.get();
    if (p != null && p.kind() == Reading.Kind.AC) {
      probe.set(p.withMeasure(measure));
    }
  }

  /**
   * Keeps the pad's sign key off while it takes an AC amplitude (powered, AC chosen): an RMS, peak
   * or peak-to-peak amplitude is never negative. DC keeps its sign; ohms have none.
   */
  void unsignWhileAc(ValuePadModel pad) {
    pad.unsignedProperty()
        .bind(
            Bindings.when(ac.acProperty().and(powerOff.activeProperty().not()))
                .then(ValuePadModel.AC_AMPLITUDE)
                .otherwise(""));
  }

  /** Returns the point as the pad would take it now, for one picked at {@code point}. */
  Reading.Kind kindForPicks() {
    return ac.acProperty().get() ? Reading.Kind.AC : Reading.Kind.DC;
  }
}
