package com.stagewise.circuit.value;

import java.util.OptionalInt;

/**
 * What a resistor's colour bands say: its nominal resistance, its tolerance and, on six-band
 * resistors, its temperature coefficient.
 *
 * @param ohms the nominal resistance in ohms
 * @param tolerance the tolerance as a fraction (0.05 for ±5 %)
 * @param ppmPerKelvin the temperature coefficient in ppm/K, present for six bands only
 */
public record BandedValue(double ohms, double tolerance, OptionalInt ppmPerKelvin) {}
