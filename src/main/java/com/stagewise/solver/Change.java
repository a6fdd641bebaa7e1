package com.stagewise.solver;

import java.util.Objects;

/**
 * One changed number of a stage for a solve: a part's value, a trimmer's wiper position, a driven
 * net's voltage or a section's device parameters. The topology stays; only the number moves.
 */
public sealed interface Change
    permits Change.PartValue, Change.WiperPosition, Change.DrivenVolts, Change.Device {

  /**
   * A part's value changed.
   *
   * @param ref the part's designator
   * @param value ohms or farads (a zener's marked volts), 0 or more (0 Ω is a link or a dead short)
   */
  record PartValue(String ref, double value) implements Change {
    /** Checks the value. */
    public PartValue {
      Objects.requireNonNull(ref, "ref");
      if (!(value >= 0) || !Double.isFinite(value)) {
        throw new IllegalArgumentException(
            "value of " + ref + " (" + value + ") must be a finite number, 0 or more");
      }
    }
  }

  /**
   * A trimmer's wiper moved along its track.
   *
   * @param ref the trimmer's designator
   * @param position the wiper's share of the way from the first end, 0 to 1
   */
  record WiperPosition(String ref, double position) implements Change {
    /** Checks the position. */
    public WiperPosition {
      Objects.requireNonNull(ref, "ref");
      if (!(position >= 0 && position <= 1)) {
        throw new IllegalArgumentException(
            "position of " + ref + " (" + position + ") must be between 0 and 1");
      }
    }
  }

  /**
   * A driven net (ground, a rail or an input) held at another voltage.
   *
   * @param net the net's name
   * @param volts its voltage, finite
   */
  record DrivenVolts(String net, double volts) implements Change {
    /** Checks the voltage. */
    public DrivenVolts {
      Objects.requireNonNull(net, "net");
      if (!Double.isFinite(volts)) {
        throw new IllegalArgumentException("volts of " + net + " (" + volts + ") must be finite");
      }
    }
  }

  /**
   * A section's device parameters replaced.
   *
   * @param section the section's designator
   * @param params its new parameters
   */
  record Device(String section, DeviceParams params) implements Change {
    /** Checks the fields. */
    public Device {
      Objects.requireNonNull(section, "section");
      Objects.requireNonNull(params, "params");
    }
  }
}
