package com.stagewise.solver;

import com.stagewise.circuit.DeviceClass;

/**
 * The parameters of one op-amp section as the solver models it.
 *
 * <p>The output is an internal source {@code gain · (v(in+) − v(in−) + offset)}, clamped to {@code
 * [v(v−) + headroomLow, v(v+) − headroomHigh]}, behind {@code outputResistance}. Bias currents flow
 * from each input's net into the section.
 *
 * @param gain open-loop DC gain, volts per volt, above 0
 * @param offset input offset voltage in volts, added to the differential input
 * @param biasPlus current into the non-inverting input, amperes
 * @param biasMinus current into the inverting input, amperes
 * @param outputResistance ohms, above 0
 * @param headroomLow volts between the v- pin and the lowest output, 0 or more
 * @param headroomHigh volts between the v+ pin and the highest output, 0 or more
 */
public record DeviceParams(
    double gain,
    double offset,
    double biasPlus,
    double biasMinus,
    double outputResistance,
    double headroomLow,
    double headroomHigh) {

  /** Checks the fields; see the record description. */
  public DeviceParams {
    if (!(gain > 0) || !Double.isFinite(gain)) {
      throw new IllegalArgumentException("gain (" + gain + ") must be a finite number above 0");
    }
    if (!(outputResistance > 0) || !Double.isFinite(outputResistance)) {
      throw new IllegalArgumentException(
          "output resistance (" + outputResistance + ") must be a finite number above 0");
    }
    if (!(headroomLow >= 0) || !(headroomHigh >= 0)) {
      throw new IllegalArgumentException(
          "headroom (" + headroomLow + ", " + headroomHigh + ") must be 0 or more");
    }
    if (!Double.isFinite(offset) || !Double.isFinite(biasPlus) || !Double.isFinite(biasMinus)) {
      throw new IllegalArgumentException("offset and bias currents must be finite");
    }
  }

  /** Returns the nominal parameters of a class, with offset and bias currents taken as zero. */
  public static DeviceParams nominal(DeviceClass type) {
    return new DeviceParams(
        type.openLoopGain().nominal(),
        0,
        0,
        0,
        type.outputResistance(),
        type.headroomLow().nominal(),
        type.headroomHigh().nominal());
  }

  /** Returns a copy with another open-loop gain. */
  public DeviceParams withGain(double newGain) {
    return new DeviceParams(
        newGain, offset, biasPlus, biasMinus, outputResistance, headroomLow, headroomHigh);
  }

  /** Returns a copy with another input offset voltage. */
  public DeviceParams withOffset(double newOffset) {
    return new DeviceParams(
        gain, newOffset, biasPlus, biasMinus, outputResistance, headroomLow, headroomHigh);
  }

  /** Returns a copy with other bias currents. */
  public DeviceParams withBias(double plus, double minus) {
    return new DeviceParams(gain, offset, plus, minus, outputResistance, headroomLow, headroomHigh);
  }

  /** Returns a copy with other headroom figures. */
  public DeviceParams withHeadroom(double low, double high) {
    return new DeviceParams(gain, offset, biasPlus, biasMinus, outputResistance, low, high);
  }
}
