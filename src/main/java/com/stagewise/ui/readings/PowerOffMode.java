package com.stagewise.ui.readings;

import com.stagewise.circuit.Reading;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.ProbeAdvice;
import java.util.Optional;
import javafx.beans.binding.Bindings;
import javafx.beans.binding.StringBinding;
import javafx.beans.property.BooleanProperty;
import javafx.beans.property.IntegerProperty;
import javafx.beans.property.ObjectProperty;
import javafx.beans.property.SimpleBooleanProperty;
import javafx.beans.property.SimpleIntegerProperty;
import javafx.beans.property.SimpleObjectProperty;
import javafx.beans.property.SimpleStringProperty;
import javafx.beans.property.StringProperty;

/**
 * The readings screen's power-off mode: the unit unplugged and discharged, the meter on ohms, and a
 * reading between two points (nets, package pins, part leads) instead of at one.
 *
 * <p>The two points are filled in turn by the technician's taps (on the schematic, the package or
 * the list); the pair of the diagnosis's best ohms check is chosen for them until they pick their
 * own. Plain Java with JavaFX properties, no nodes.
 */
public final class PowerOffMode {
  /**
   * The caution shown for as long as the screen is in power-off mode (DESIGN.md, "Safety": the
   * usual cautions where they matter, discharging capacitors before ohms checks; common practice).
   */
  /** The caution's key message, in sight for as long as ohms are read. */
  public static final String KEY_CAUTION =
      "Unplug and discharge the capacitors before any ohms check.";

  /** The whole caution, one tap away from its key message. */
  public static final String CAUTION =
      "Power off before reading ohms: unplug the unit (not just its switch), discharge its"
          + " capacitors — the large ones first, through a resistor, never with a screwdriver — and"
          + " wait until they read near 0\u00a0V. Then set the meter to ohms. Mains-powered equipment"
          + " can hurt or kill even when switched off; local codes and licensed practice come"
          + " first.";

  private final BooleanProperty active = new SimpleBooleanProperty(false);
  private final IntegerProperty cautionsShown = new SimpleIntegerProperty(0);
  private final ObjectProperty<ProbePoint> from = new SimpleObjectProperty<>();
  private final ObjectProperty<ProbePoint> to = new SimpleObjectProperty<>();
  private final BooleanProperty fillingTo = new SimpleBooleanProperty(false);
  private final ObjectProperty<ProbeAdvice> suggested = new SimpleObjectProperty<>();
  private final BooleanProperty leading = new SimpleBooleanProperty(false);
  private final StringProperty why = new SimpleStringProperty("");
  private boolean chosenByHand;

  /** Returns whether the screen is in power-off mode. */
  public BooleanProperty activeProperty() {
    return active;
  }

  /** Returns how often the power-off caution came up (once each time the mode is entered). */
  public IntegerProperty cautionsShownProperty() {
    return cautionsShown;
  }

  /** Returns the first point of the pair (null until chosen). */
  public ObjectProperty<ProbePoint> fromProperty() {
    return from;
  }

  /** Returns the second point of the pair (null until chosen). */
  public ObjectProperty<ProbePoint> toProperty() {
    return to;
  }

  /** Returns whether the next point tapped goes into the second place ("to"). */
  public BooleanProperty fillingToProperty() {
    return fillingTo;
  }

  /** Returns the diagnosis's best ohms check, or null when it offers none. */
  public ObjectProperty<ProbeAdvice> suggestedProperty() {
    return suggested;
  }

  /**
   * Returns whether the best ohms check is the first of all next probes (it tells the suspects
   * apart better than any powered probe, or the unit is mains-powered): the volts mode then offers
   * it.
   */
  public BooleanProperty leadingProperty() {
    return leading;
  }

  /** Returns why the pair is worth reading (the diagnosis's words), or that it was chosen. */
  public StringProperty whyProperty() {
    return why;
  }

  /** Returns the line shown large: what to read now. */
  public StringBinding call() {
    return Bindings.createStringBinding(
        () -> {
          if (from.get() == null) {
            return "Choose the first point";
          }
          if (to.get() == null) {
            return "Choose the second point";
          }
          return "Read ohms from " + from.get().shortName() + " to " + to.get().shortName();
        },
        from,
        to);
  }

  void enter() {
    if (!active.get()) {
      active.set(true);
      cautionsShown.set(cautionsShown.get() + 1);
    }
  }

  void leave() {
    active.set(false);
  }

  /** Says which place the next point goes into: the first ({@code false}) or the second. */
  public void fillNext(boolean second) {
    fillingTo.set(second);
  }

  /** Puts a point tapped or picked into the place being filled, then moves on to the other. */
  void choose(ProbePoint point) {
    if (!chosenByHand && !fillingTo.get()) {
      // The first tap on a suggested pair starts a pair of the technician's own.
      to.set(null);
    }
    chosenByHand = true;
    if (fillingTo.get()) {
      to.set(point);
      fillingTo.set(from.get() == null);
    } else {
      from.set(point);
      fillingTo.set(true);
    }
    why.set(
        matchesSuggestion()
            ? shortWhy(suggested.get().why())
            : "Chosen by you. Read with the power off, the meter on ohms.");
  }

  /** Sets both points at once (a reading being corrected, or the suggested pair taken). */
  void set(ProbePoint first, ProbePoint second, String reason, boolean byHand) {
    chosenByHand = byHand;
    from.set(first);
    to.set(second);
    fillingTo.set(false);
    why.set(reason);
  }

  /** Empties both places. */
  void clear() {
    set(null, null, "", false);
  }

  /**
   * Takes the diagnosis's best ohms check (null for none) and whether it leads every next probe;
   * the pair follows it unless the technician chose their own.
   */
  void suggest(Stage stage, ProbeAdvice advice, boolean first) {
    suggested.set(advice);
    leading.set(advice != null && first);
    if (!chosenByHand) {
      followSuggestion(stage);
    }
  }

  /** Makes the suggested pair the one to read (clears the pair when there is none). */
  void followSuggestion(Stage stage) {
    ProbeAdvice advice = suggested.get();
    Optional<ProbePoint> a =
        advice == null || stage == null
            ? Optional.empty()
            : ProbePoint.of(stage, advice.at(), Reading.Kind.OHMS, 0);
    Optional<ProbePoint> b =
        advice == null || stage == null
            ? Optional.empty()
            : ProbePoint.of(stage, advice.to(), Reading.Kind.OHMS, 0);
    if (a.isPresent() && b.isPresent()) {
      set(a.get(), b.get(), shortWhy(advice.why()), false);
    } else {
      clear();
    }
  }

  /** Forgets the pair and the suggestion (another stage or case). */
  void reset() {
    clear();
    suggested.set(null);
    leading.set(false);
  }

  /**
   * Returns the diagnosis's why of an ohms check without what the caution and the call already say
   * (power off, unplug, discharge, the two points): "Across R2: OL if R2 is open; 47 kΩ … if U1 pin
   * 1 is lifted". A why of another shape is returned as it is.
   */
  static String shortWhy(String why) {
    int read = why.indexOf("read ohms from ");
    int colon = read < 0 ? -1 : why.indexOf(": ", read);
    if (colon < 0) {
      return why;
    }
    String head = why.substring(read, colon);
    int across = head.indexOf("(across ");
    String rest = why.substring(colon + 2);
    String text =
        across < 0
            ? "It reads " + rest
            : "Across " + head.substring(across + 8, head.lastIndexOf(')')) + ": " + rest;
    if (why.startsWith("The unit is mains-powered")) {
      text = "The unit is mains-powered and this check tells the leading suspects apart. " + text;
    }
    return text.endsWith(".") ? text : text + ".";
  }

  /** Returns whether the pair is the suggested one, in either order. */
  boolean matchesSuggestion() {
    ProbeAdvice s = suggested.get();
    if (s == null || from.get() == null || to.get() == null) {
      return false;
    }
    String a = from.get().at();
    String b = to.get().at();
    return a.equals(s.at()) && b.equals(s.to()) || a.equals(s.to()) && b.equals(s.at());
  }

  /** Returns whether the pair was chosen by hand (it then stays after a reading is re-ranked). */
  boolean chosenByHand() {
    return chosenByHand;
  }
}
