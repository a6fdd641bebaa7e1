package com.stagewise.ui.stage;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.value.BandedValue;
import com.stagewise.circuit.value.ColourCode;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.SmdCode;
import com.stagewise.circuit.value.Tolerance;
import java.util.List;
import javafx.beans.property.ReadOnlyObjectProperty;
import javafx.beans.property.ReadOnlyObjectWrapper;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;
import javafx.collections.FXCollections;
import javafx.collections.ObservableList;

/** Reads a resistor's value off its colour bands or its SMD marking, for the value pad. */
public final class DecoderModel {
  /** The band colours offered, in the order of their digits, then the multiplier-only ones. */
  public static final List<String> COLOURS =
      List.of(
          "black", "brown", "red", "orange", "yellow", "green", "blue", "violet", "grey", "white",
          "gold", "silver");

  private final ObservableList<String> bands = FXCollections.observableArrayList();
  private final StringProperty smd = new SimpleStringProperty("");
  private final ReadOnlyObjectWrapper<Double> ohms = new ReadOnlyObjectWrapper<>();
  private final ReadOnlyStringWrapper result =
      new ReadOnlyStringWrapper("Tap the bands from the left, or type the SMD code.");

  /** Creates an empty decoder. */
  public DecoderModel() {
    bands.addListener((javafx.collections.ListChangeListener<String>) c -> decodeBands());
    smd.addListener((o, was, now) -> decodeSmd());
  }

  public ObservableList<String> bands() {
    return bands;
  }

  public StringProperty smdProperty() {
    return smd;
  }

  /** Returns the decoded resistance, or null when there is none yet. */
  public ReadOnlyObjectProperty<Double> ohmsProperty() {
    return ohms.getReadOnlyProperty();
  }

  /** Returns what was decoded, or what is still missing, in words. */
  public ReadOnlyStringProperty resultProperty() {
    return result.getReadOnlyProperty();
  }

  /** Adds a band (read from the end away from the tolerance band); at most six. */
  public void addBand(String colour) {
    if (bands.size() < 6) {
      bands.add(colour);
    }
  }

  /** Removes the last band. */
  public void removeBand() {
    if (!bands.isEmpty()) {
      bands.remove(bands.size() - 1);
    }
  }

  /** Clears the bands and the code. */
  public void clear() {
    bands.clear();
    smd.set("");
  }

  private void decodeBands() {
    if (bands.isEmpty()) {
      ohms.set(null);
      result.set("Tap the bands from the left, or type the SMD code.");
      return;
    }
    if (bands.size() < 3) {
      ohms.set(null);
      result.set(String.join(" – ", bands) + ": at least 3 bands are needed.");
      return;
    }
    try {
      BandedValue value = ColourCode.decode(List.copyOf(bands));
      ohms.set(value.ohms());
      result.set(
          String.join(" – ", bands)
              + " = "
              + SiValue.format(value.ohms(), "Ω")
              + " ±"
              + Tolerance.format(value.tolerance()));
    } catch (InvalidInputException e) {
      ohms.set(null);
      result.set("Not a colour code: " + e.getMessage());
    }
  }

  private void decodeSmd() {
    String code = smd.get() == null ? "" : smd.get().strip();
    if (code.isEmpty()) {
      decodeBands();
      return;
    }
    try {
      double value = SmdCode.decode(code);
      ohms.set(value);
      result.set(
          "SMD " + code.toUpperCase(java.util.Locale.ROOT) + " = " + SiValue.format(value, "Ω"));
    } catch (InvalidInputException e) {
      ohms.set(null);
      result.set("Not an SMD code yet: " + e.getMessage());
    }
  }
}
