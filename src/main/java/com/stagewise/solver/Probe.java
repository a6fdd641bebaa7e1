package com.stagewise.solver;

import java.util.List;

/**
 * Reads chosen nets from the points and AC responses of one {@link Analysis}, in a fixed order: the
 * cheap way to pick the same test points from thousands of solves.
 */
public final class Probe {
  private final Layout layout;
  private final String[] nets;
  private final int[] index;

  Probe(Layout layout, List<String> nets) {
    this.layout = layout;
    this.nets = nets.toArray(new String[0]);
    this.index = new int[this.nets.length];
    for (int i = 0; i < index.length; i++) {
      Integer at = layout.netIndex.get(this.nets[i]);
      if (at == null) {
        throw new IllegalArgumentException("the stage has no net named " + this.nets[i]);
      }
      index[i] = at;
    }
  }

  /** Returns the nets read, in order. */
  public List<String> nets() {
    return List.of(nets);
  }

  /** Returns the DC volts of the probed nets at a point. */
  public double[] dc(OperatingPoint point) {
    double[] out = new double[index.length];
    if (point.nets() instanceof Layout.NetVolts v && v.layout == layout) {
      for (int i = 0; i < index.length; i++) {
        out[i] = v.volts[index[i]];
      }
    } else {
      for (int i = 0; i < index.length; i++) {
        out[i] = point.nets().get(nets[i]);
      }
    }
    return out;
  }

  /** Returns the probed nets' volts from a solution vector of the network they belong to. */
  double[] read(Network network, double[] x) {
    double[] out = new double[index.length];
    for (int i = 0; i < index.length; i++) {
      out[i] = network.volts(x, index[i]);
    }
    return out;
  }

  /** Returns the AC amplitudes of the probed nets in a response. */
  public double[] acAmplitudes(AcSolution ac) {
    double[] out = new double[index.length];
    if (ac.nets() instanceof Layout.Phasors p && p.layout == layout) {
      for (int i = 0; i < index.length; i++) {
        out[i] = p.amplitude[index[i]];
      }
    } else {
      for (int i = 0; i < index.length; i++) {
        out[i] = ac.nets().get(nets[i]).amplitude();
      }
    }
    return out;
  }
}
