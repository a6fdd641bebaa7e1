package com.stagewise.diagnosis;

import com.stagewise.circuit.InvalidInputException;
import java.util.List;
import java.util.regex.Pattern;

/**
 * The answer for one set of readings: the verdict, what the readings show, the ranked suspects, the
 * probes worth taking next, a confirming check for the first suspect, and notes.
 *
 * @param verdict healthy, fault or inconclusive
 * @param observations what the readings show, in a technician's words
 * @param suspects ranked by probability, which sums to 1 over the list
 * @param nextProbes ranked by expected information gain, best first
 * @param confirmingCheck how to confirm the first suspect at the bench (empty when healthy)
 * @param notes other things worth knowing: an input that is off, faults no reading can see
 * @throws InvalidInputException if any number of the answer is not finite (a probability, a
 *     predicted or estimated value, a probe's bits or frequency) or a text shows one: the edge
 *     check that keeps "NaN %" from ever being printed or stored
 */
public record Diagnosis(
    Verdict verdict,
    List<Observation> observations,
    List<Suspect> suspects,
    List<ProbeAdvice> nextProbes,
    String confirmingCheck,
    List<String> notes) {

  /** A number word in a text that is not inside quotes (a quoted one is the user's own text). */
  private static final Pattern NOT_A_NUMBER =
      Pattern.compile("(?<![\"\\w])(NaN|-?Infinity)(?![\"\\w])");

  /** Copies the lists and checks that every number is finite. */
  public Diagnosis {
    observations = List.copyOf(observations);
    suspects = List.copyOf(suspects);
    nextProbes = List.copyOf(nextProbes);
    notes = List.copyOf(notes);
    for (Suspect s : suspects) {
      requireFinite(s.probability(), "the probability of " + s.fault());
      if (s.estimatedValue().isPresent()) {
        requireFinite(s.estimatedValue().getAsDouble(), "the estimated value of " + s.fault());
      }
      for (java.util.Map.Entry<String, Double> e : s.predicted().entrySet()) {
        // The message only when it is needed: a suspect has a value at every point.
        if (!Double.isFinite(e.getValue())) {
          throw notFinite("the volts " + s.fault() + " gives at " + e.getKey());
        }
      }
      requireText(s.why());
    }
    for (ProbeAdvice p : nextProbes) {
      requireFinite(p.bits(), "the information of probing " + p.at());
      requireFinite(p.hz(), "the frequency of probing " + p.at());
      requireText(p.why());
    }
    for (Observation o : observations) {
      requireText(o.text());
    }
    for (String note : notes) {
      requireText(note);
    }
    requireText(confirmingCheck);
  }

  private static void requireFinite(double value, String what) {
    if (!Double.isFinite(value)) {
      throw notFinite(what);
    }
  }

  private static void requireText(String text) {
    // The pattern can only match where one of its words is: most texts have neither.
    if ((text.contains("NaN") || text.contains("Infinity")) && NOT_A_NUMBER.matcher(text).find()) {
      throw notFinite("a number in the explanation");
    }
  }

  private static InvalidInputException notFinite(String what) {
    return new InvalidInputException(
        "",
        "",
        "the diagnosis cannot be worked out: "
            + what
            + " is not a finite number (expected the stage's values and the readings within their"
            + " plausible ranges)");
  }
}
