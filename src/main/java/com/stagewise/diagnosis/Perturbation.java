package com.stagewise.diagnosis;

import com.stagewise.circuit.Amplifier;
import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.Part;
import com.stagewise.circuit.Rail;
import com.stagewise.circuit.Stage;
import com.stagewise.solver.Analysis;
import com.stagewise.solver.Change;
import com.stagewise.solver.DeviceParams;
import java.util.ArrayList;
import java.util.List;

/**
 * A change of one number of a stage by one standard deviation, for a prediction's spread (see
 * {@link Predictor}): a fixed change, or a step of a section's device worked out from the analysis
 * it applies to. Held as data rather than as a lambda: each lambda spins a class of its own on
 * first use, which a fresh command-line run pays for.
 *
 * @param fixed the change, or null for a device step
 * @param ref the section of a device step
 * @param step which number of the device a step moves
 * @param by the step (for the gain: the value it is set to)
 * @param movesAc whether the change moves the AC response
 */
record Perturbation(Change fixed, String ref, DeviceStep step, double by, boolean movesAc) {
  /** Standard deviation of a uniform distribution over ±1, in units of the half-width. */
  private static final double UNIFORM_SD = 1 / Math.sqrt(3);

  /** Which number of a section's device a perturbation moves. */
  enum DeviceStep {
    OFFSET,
    BIAS,
    HEADROOM_LOW,
    HEADROOM_HIGH,
    /** Sets the open-loop gain to the step (the class's low end) rather than adding to it. */
    GAIN
  }

  /** Returns the change this perturbation makes to {@code at}. */
  Change change(Analysis at) {
    if (fixed != null) {
      return fixed;
    }
    DeviceParams p = at.device(ref);
    DeviceParams moved =
        switch (step) {
          case OFFSET -> p.withOffset(p.offset() + by);
          case BIAS -> p.withBias(p.biasPlus() + by, p.biasMinus() + by);
          case HEADROOM_LOW -> p.withHeadroom(p.headroomLow() + by, p.headroomHigh());
          case HEADROOM_HIGH -> p.withHeadroom(p.headroomLow(), p.headroomHigh() + by);
          case GAIN -> p.withGain(by);
        };
    return new Change.Device(ref, moved);
  }

  /** Returns every perturbation of a stage's scenario, in the order their changes add. */
  static List<Perturbation> all(Stage stage, Analysis cs) {
    List<Perturbation> list = new ArrayList<>();
    for (Part part : stage.parts()) {
      if (part.tolerance() > 0 && !part.ref().startsWith("~")) {
        double moved = cs.partValue(part.ref()) * (1 + part.tolerance() * UNIFORM_SD);
        Change change = new Change.PartValue(part.ref(), moved);
        list.add(new Perturbation(change, null, null, 0, true));
      }
      if (part.kind().isTrimmer() && !part.sealed() && !part.ref().startsWith("~")) {
        // An unsealed trimmer sits within its setting spread of the sheet's position.
        double position = cs.partPosition(part.ref());
        double step = FaultModel.SET_SPREAD * UNIFORM_SD;
        double moved = position + step <= 1 ? position + step : position - step;
        Change change = new Change.WiperPosition(part.ref(), moved);
        list.add(new Perturbation(change, null, null, 0, true));
      }
    }
    for (Rail rail : stage.rails()) {
      double moved = cs.drivenVolts(rail.net()) * (1 + rail.tolerance() * UNIFORM_SD);
      Change change = new Change.DrivenVolts(rail.net(), moved);
      list.add(new Perturbation(change, null, null, 0, false));
    }
    boolean drifting = drifting(stage);
    for (Amplifier amp : stage.amplifiers()) {
      DeviceClass type = amp.deviceClass();
      String ref = amp.ref();
      double offsetStep = type.offset().high() * UNIFORM_SD;
      // Uniform over the class's range: its standard deviation is the width over √12.
      double biasStep = (type.biasCurrent().high() - type.biasCurrent().low()) / Math.sqrt(12);
      double lowStep = (type.headroomLow().high() - type.headroomLow().low()) / Math.sqrt(12);
      double highStep = (type.headroomHigh().high() - type.headroomHigh().low()) / Math.sqrt(12);
      list.add(new Perturbation(null, ref, DeviceStep.OFFSET, offsetStep, false));
      if (!drifting) {
        // Where a floating input is tied to a rail to stand for its drift, the bias current is
        // already what put it there; moving it again through the tie would count it twice.
        list.add(new Perturbation(null, ref, DeviceStep.BIAS, biasStep, false));
      }
      list.add(new Perturbation(null, ref, DeviceStep.HEADROOM_LOW, lowStep, false));
      list.add(new Perturbation(null, ref, DeviceStep.HEADROOM_HIGH, highStep, false));
      // Gain is spread over a decade or more; the low end of the class's range is the honest step.
      double lowGain = type.openLoopGain().low();
      list.add(new Perturbation(null, ref, DeviceStep.GAIN, lowGain, true));
    }
    return list;
  }

  static boolean drifting(Stage stage) {
    for (Part part : stage.parts()) {
      if (part.ref().startsWith(FaultModel.DRIFT_TIE)) {
        return true;
      }
    }
    return false;
  }
}
