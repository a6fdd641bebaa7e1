package com.stagewise.ui.readings;

import com.stagewise.diagnosis.ProbeAdvice;
import javafx.beans.binding.Bindings;
import javafx.beans.value.ObservableValue;
import javafx.geometry.Pos;
import javafx.scene.Node;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.control.ToggleButton;
import javafx.scene.control.ToggleGroup;
import javafx.scene.layout.Region;
import javafx.scene.layout.VBox;

/**
 * The power-off parts of the readings screen: the switch between powered and power-off readings,
 * the caution shown while the power is off, the offer of a power-off check the diagnosis ranks
 * first, and the pair of points to read between.
 */
final class PowerOffViews {
  private PowerOffViews() {}

  /** The switch between the two modes, with the offer of the suggested power-off check. */
  static Node modeBar(ReadingsViewModel model) {
    PowerOffMode mode = model.powerOff();
    ToggleGroup group = new ToggleGroup();
    ToggleButton volts = new ToggleButton("Powered: volts");
    volts.setId("mode-volts");
    ToggleButton ohms = new ToggleButton("Power off: ohms");
    ohms.setId("mode-ohms");
    for (ToggleButton b : new ToggleButton[] {volts, ohms}) {
      b.setToggleGroup(group);
      b.getStyleClass().add("mode-switch");
      b.setMinWidth(Region.USE_PREF_SIZE);
    }
    volts.setSelected(!mode.activeProperty().get());
    ohms.setSelected(mode.activeProperty().get());
    volts.setOnAction(e -> model.setPowerOff(false));
    ohms.setOnAction(e -> model.setPowerOff(true));
    // A toggle group lets a tap unselect; the mode is the model's, so the buttons follow it.
    mode.activeProperty()
        .addListener(
            (o, was, on) -> {
              volts.setSelected(!on);
              ohms.setSelected(on);
            });
    group
        .selectedToggleProperty()
        .addListener(
            (o, was, now) -> {
              if (now == null) {
                (mode.activeProperty().get() ? ohms : volts).setSelected(true);
              }
            });
    Label offer = new Label();
    offer.setId("ohms-offer");
    offer.setWrapText(true);
    offer.setMinHeight(Region.USE_PREF_SIZE);
    offer
        .textProperty()
        .bind(
            Bindings.createStringBinding(
                () -> offerText(mode.suggestedProperty().get()), mode.suggestedProperty()));
    Button take = new Button("Take it with the power off");
    take.setId("take-ohms");
    take.getStyleClass().add("primary");
    // Its words wrap onto a second line where larger text leaves the column too narrow.
    take.setWrapText(true);
    take.setMinHeight(Region.USE_PREF_SIZE);
    take.setOnAction(e -> model.takeSuggestedOhmsCheck());
    VBox offerBox = new VBox(6, offer, take);
    offerBox.getStyleClass().add("ohms-offer");
    showWhen(offerBox, mode.leadingProperty().and(mode.activeProperty().not()));
    // The two switches wrap onto two rows when the column is narrow (1024 wide) rather than cut.
    javafx.scene.layout.FlowPane switches = new javafx.scene.layout.FlowPane(6, 6, volts, ohms);
    switches.setPrefWrapLength(280);
    // In the probe column; the caution stands above the pad (banner).
    return new VBox(8, switches, offerBox);
  }

  private static String offerText(ProbeAdvice advice) {
    if (advice == null) {
      return "";
    }
    return "A power-off check tells the suspects apart best: ohms from "
        + com.stagewise.ui.words.Words.pin(advice.at())
        + " to "
        + com.stagewise.ui.words.Words.pin(advice.to())
        + ".";
  }

  /**
   * The caution's key message ({@link PowerOffMode#KEY_CAUTION}), shown for as long as the screen
   * is in power-off mode, above the pad: a button across the banner's width whose tap shows the
   * whole caution ({@link #wholeCaution}) and whose second tap hides it. Each time the power goes
   * off the caution starts short again.
   */
  static ToggleButton cautionKey(ReadingsViewModel model) {
    ToggleButton key = new ToggleButton();
    key.setId("poweroff-key");
    key.getStyleClass().add("poweroff-key");
    key.setWrapText(true);
    key.setMaxWidth(Double.MAX_VALUE);
    key.setMinHeight(Region.USE_PREF_SIZE);
    key.setAlignment(Pos.CENTER_LEFT);
    key.textProperty()
        .bind(
            Bindings.when(key.selectedProperty())
                .then(PowerOffMode.KEY_CAUTION + "  Less \u25b8")
                .otherwise(PowerOffMode.KEY_CAUTION + "  More \u25c2"));
    model.powerOff().activeProperty().addListener((o, was, on) -> key.setSelected(false));
    return key;
  }

  /** The banner above the pad that holds the caution's key message. */
  static Node banner(ReadingsViewModel model, ToggleButton key) {
    VBox banner = new VBox(4, key);
    banner.setId("poweroff-banner");
    banner.getStyleClass().add("poweroff-banner");
    showWhen(banner, model.powerOff().activeProperty());
    return banner;
  }

  /**
   * The whole caution, shown while its key message is tapped open: laid over the top of the probe
   * column beside the pad, so that the value field and Add reading stay where they were, in sight
   * in a 1024×600 window (below the key message it pushed them under the window's edge). A tap on
   * it, or on the key message again, hides it.
   */
  static Node wholeCaution(ReadingsViewModel model, ToggleButton key) {
    Label text = new Label(PowerOffMode.CAUTION);
    text.setId("poweroff-caution");
    text.setWrapText(true);
    text.setMinHeight(Region.USE_PREF_SIZE);
    VBox whole = new VBox(text);
    whole.setId("poweroff-whole");
    whole.getStyleClass().addAll("poweroff-banner", "poweroff-whole");
    whole.setMaxHeight(Region.USE_PREF_SIZE);
    whole.setOnMouseClicked(e -> key.setSelected(false));
    showWhen(whole, key.selectedProperty().and(model.powerOff().activeProperty()));
    return whole;
  }

  /** What to read in power-off mode: the call and the two points (tap one to fill it). */
  static Node pairHeader(ReadingsViewModel model) {
    PowerOffMode mode = model.powerOff();
    Label call = new Label();
    call.setId("ohms-call");
    call.getStyleClass().add("ohms-call");
    call.setWrapText(true);
    call.setMinHeight(Region.USE_PREF_SIZE);
    call.textProperty().bind(mode.call());
    Button from = slot("ohms-from", "From", mode.fromProperty(), false, mode);
    Button to = slot("ohms-to", "To", mode.toProperty(), true, mode);
    VBox box = new VBox(6, call, from, to);
    showWhen(box, mode.activeProperty());
    return box;
  }

  /** Why this pair, in the probe column's part that scrolls. */
  static Node pairWhy(ReadingsViewModel model) {
    PowerOffMode mode = model.powerOff();
    Label why = new Label();
    why.setId("ohms-why");
    why.getStyleClass().add("probe-why");
    why.setWrapText(true);
    why.setMinHeight(Region.USE_PREF_SIZE);
    why.textProperty().bind(mode.whyProperty());
    why.getStyleClass().add("ohms-why");
    showWhen(why, mode.activeProperty());
    return why;
  }

  private static Button slot(
      String id,
      String word,
      ObservableValue<ProbePoint> point,
      boolean second,
      PowerOffMode mode) {
    Button b = new Button();
    b.setId(id);
    b.getStyleClass().add("pair-slot");
    b.setMaxWidth(Double.MAX_VALUE);
    b.setWrapText(true);
    b.setMinHeight(Region.USE_PREF_SIZE);
    b.setAlignment(Pos.CENTER_LEFT);
    b.textProperty()
        .bind(
            Bindings.createStringBinding(
                () ->
                    word
                        + ":  "
                        + (point.getValue() == null
                            ? "(tap a point)"
                            : point.getValue().shortName()),
                point));
    b.setOnAction(e -> mode.fillNext(second));
    Runnable lit =
        () -> {
          boolean on = mode.fillingToProperty().get() == second;
          b.getStyleClass().remove("filling");
          if (on) {
            b.getStyleClass().add("filling");
          }
        };
    mode.fillingToProperty().addListener((o, a, c) -> lit.run());
    lit.run();
    return b;
  }

  static void showWhen(Node node, ObservableValue<Boolean> condition) {
    node.visibleProperty().bind(Bindings.createBooleanBinding(condition::getValue, condition));
    node.managedProperty().bind(node.visibleProperty());
  }
}
