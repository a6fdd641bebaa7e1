package com.stagewise.diagnosis;

import java.util.List;

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
 */
public record Diagnosis(
    Verdict verdict,
    List<Observation> observations,
    List<Suspect> suspects,
    List<ProbeAdvice> nextProbes,
    String confirmingCheck,
    List<String> notes) {

  /** Copies the lists. */
  public Diagnosis {
    observations = List.copyOf(observations);
    suspects = List.copyOf(suspects);
    nextProbes = List.copyOf(nextProbes);
    notes = List.copyOf(notes);
  }
}
