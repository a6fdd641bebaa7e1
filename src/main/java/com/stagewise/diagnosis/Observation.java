package com.stagewise.diagnosis;

/**
 * Something the readings show, in a technician's words.
 *
 * @param at the test point it concerns
 * @param text e.g. "output at the upper limit: saturated"
 */
public record Observation(String at, String text) {}
