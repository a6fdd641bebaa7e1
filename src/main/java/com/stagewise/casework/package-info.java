/**
 * What a technician does to a case, in one place that the app and the command line both call: add a
 * unit, open a case, pick its stage, add readings and store the diagnosis's suspect list, add notes
 * and actions, close it; with the shop's counts and the version text that go with them.
 *
 * <p>Every action checks all it is given first and then writes in one transaction of the history:
 * all of it or nothing. Above {@code interchange}, below {@code report}, {@code ui}, {@code cli}
 * and {@code app} (DESIGN.md, Architecture).
 */
package com.stagewise.casework;
