package com.stagewise.circuit.template;

/**
 * One named value a template is built from.
 *
 * @param name the parameter's name, e.g. {@code r2}
 * @param meaning what it sets, in a technician's words, e.g. "feedback resistor R2"
 * @param defaultValue the value used when none is given, as text, e.g. {@code 47k}
 * @param unit the unit of the value ({@code Ω}, {@code F}, {@code V}, {@code Hz}), empty for a
 *     count or a word
 */
public record Parameter(String name, String meaning, String defaultValue, String unit) {}
