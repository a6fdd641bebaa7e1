package com.stagewise.diagnosis;

import com.stagewise.circuit.Stage;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The places a technician can read on a stage: every net by name, then every used package pin
 * ({@code U1.6}). A pin usually reads the same as its net; it differs when the pin's joint is open.
 */
final class TestPoints {
  final List<String> names = new ArrayList<>();
  final Map<String, Integer> index = new HashMap<>();

  /** For each test point, the net it sits on in the healthy stage. */
  final List<String> netOf = new ArrayList<>();

  final int size;

  TestPoints(Stage stage) {
    for (String net : stage.nets()) {
      add(net, net);
    }
    for (java.util.Map.Entry<String, String> pin : stage.pinNets().entrySet()) {
      add(pin.getKey(), pin.getValue());
    }
    size = names.size();
  }

  private void add(String name, String net) {
    index.put(name, names.size());
    names.add(name);
    netOf.add(net);
  }

  boolean isPin(int i) {
    return !names.get(i).equals(netOf.get(i));
  }
}
