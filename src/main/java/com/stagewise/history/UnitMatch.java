package com.stagewise.history;

import com.stagewise.history.record.Unit;

/**
 * One unit found by a unit search.
 *
 * @param unit the unit
 * @param boardModel its board model's name
 * @param openCases how many of its cases are open
 */
public record UnitMatch(Unit unit, String boardModel, int openCases) {}
