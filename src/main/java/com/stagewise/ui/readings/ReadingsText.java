package com.stagewise.ui.readings;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Diagnosis;
import com.stagewise.diagnosis.Fault;
import com.stagewise.diagnosis.SignalChain;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.ui.words.Words;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** The readings screen's lines about the suspects: the verdict and where along the chain. */
final class ReadingsText {
  private ReadingsText() {}

  /** Returns the chain line for a stage and its top suspects; empty for a single section. */
  static String chainLine(Stage stage, List<Suspect> suspects) {
    if (stage == null || stage.amplifiers().size() < 2 || suspects.isEmpty()) {
      return "";
    }
    SignalChain order = SignalChain.of(stage);
    java.util.Set<String> rails = new java.util.HashSet<>();
    stage.rails().forEach(r -> rails.add(r.net()));
    List<List<String>> at = new ArrayList<>();
    order.sections().forEach(s -> at.add(new ArrayList<>()));
    List<String> nowhere = new ArrayList<>();
    for (Suspect s : suspects) {
      if (s.fault().equals("healthy")) {
        continue;
      }
      Optional<Integer> position;
      try {
        position = order.position(Fault.parse(s.fault(), rails));
      } catch (InvalidInputException e) {
        position = Optional.empty();
      }
      String words = Words.fault(s.fault());
      if (position.isPresent()) {
        at.get(position.get()).add(words);
      } else {
        nowhere.add(words);
      }
    }
    StringBuilder line = new StringBuilder("Along the chain: ");
    for (int i = 0; i < order.sections().size(); i++) {
      line.append(i == 0 ? "" : " › ").append(order.sections().get(i));
      if (!at.get(i).isEmpty()) {
        line.append(" ◀ ").append(String.join(", ", at.get(i)));
      }
    }
    if (!nowhere.isEmpty()) {
      line.append(".  Not in one section: ").append(String.join(", ", nowhere));
    }
    return line.toString();
  }

  /** Returns the verdict line, e.g. "Most likely: R2 open (91 %)". */
  static String verdictLine(Diagnosis diagnosis) {
    return switch (diagnosis.verdict()) {
      case HEALTHY -> "The readings fit a healthy stage.";
      case FAULT ->
          diagnosis.suspects().isEmpty()
              ? "The readings show a fault."
              : "Most likely: "
                  + Words.fault(diagnosis.suspects().get(0).fault())
                  + " ("
                  + Words.percent(diagnosis.suspects().get(0).probability())
                  + ")";
      case INCONCLUSIVE -> "Not clear yet: take the next probe.";
    };
  }
}
