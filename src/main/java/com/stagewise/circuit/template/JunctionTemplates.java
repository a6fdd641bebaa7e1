package com.stagewise.circuit.template;

import static com.stagewise.circuit.template.Templates.p;
import static com.stagewise.circuit.template.Templates.signal;
import static com.stagewise.circuit.template.Templates.split;
import static com.stagewise.circuit.template.Templates.with;

import java.util.ArrayList;
import java.util.List;

/**
 * The templates with diodes, zeners, LEDs and trimmers (stage sheet version 2): the stages a bench
 * meets around op-amps besides plain resistors and capacitors. Textbook circuits (common practice).
 */
final class JunctionTemplates {
  private JunctionTemplates() {}

  private static Parameter diodeClass() {
    return p("diode", "diode class: silicon or schottky", "silicon", "");
  }

  static List<StageTemplate> catalogue() {
    List<StageTemplate> all = new ArrayList<>();
    all.add(
        new StageTemplate(
            "precision-rectifier",
            "Precision half-wave rectifier",
            "Precision half-wave rectifier: D1 sits inside the feedback loop, so the output RECT"
                + " follows a positive input without the diode's drop; for a negative input D1"
                + " turns off, the op-amp output clamps low and R1 holds RECT at ground.",
            with(
                List.of(p("r1", "load resistor R1 from RECT to ground", "10k", "Ω"), diodeClass()),
                with(signal("1", "0.1", "1k"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .diode("D1", "diode", "OUT", "RECT")
                    .r("R1", "r1", "RECT", "GND")
                    .u1("IN", "RECT", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "diode-limiter",
            "Inverting amplifier with diode output limiter",
            "Inverting amplifier whose feedback resistor R2 has two diodes back to back across it:"
                + " while the output stays within about 0.6 V of the summing point the gain is"
                + " -R2/R1; beyond that one diode conducts and limits the swing.",
            with(
                List.of(
                    p("r1", "input resistor R1", "10k", "Ω"),
                    p("r2", "feedback resistor R2", "100k", "Ω"),
                    diodeClass()),
                with(signal("0.2", "0.01", "1k"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .r("R1", "r1", "IN", "SUM")
                    .r("R2", "r2", "SUM", "OUT")
                    .diode("D1", "diode", "SUM", "OUT")
                    .diode("D2", "diode", "OUT", "SUM")
                    .u1("GND", "SUM", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "input-clamp",
            "Buffer with input clamp diodes",
            "Voltage follower behind a series resistor R1 with clamp diodes to the rails: D1 from"
                + " the input pin to VCC and D2 from VEE to the input pin keep the pin within a diode"
                + " drop of the rails when the input is overdriven; R2 is the load.",
            with(
                List.of(
                    p("r1", "series resistor R1 into the clamped pin", "10k", "Ω"),
                    p("r2", "load resistor R2 from the output to ground", "10k", "Ω"),
                    diodeClass()),
                with(signal("18", "0.5", "1k"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .r("R1", "r1", "IN", "PIN")
                    .diode("D1", "diode", "PIN", "VCC")
                    .diode("D2", "diode", "VEE", "PIN")
                    .r("R2", "r2", "OUT", "GND")
                    .u1("PIN", "OUT", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "zener-reference",
            "Zener-referenced set-point buffer",
            "Zener reference buffered by a voltage follower: R1 from VCC feeds zener ZD1, whose"
                + " cathode REF sits at its marked voltage; the follower copies it to OUT, which"
                + " drives the load R2.",
            with(
                List.of(
                    p("r1", "feed resistor R1 from VCC to the zener", "2k2", "Ω"),
                    p("zd1", "zener ZD1's marked voltage", "5V1", "V"),
                    p("r2", "load resistor R2 from the output to ground", "10k", "Ω")),
                split("classic-bipolar")),
            v ->
                new Draft(v)
                    .dualRails()
                    .r("R1", "r1", "VCC", "REF")
                    .zener("ZD1", "zd1", "GND", "REF")
                    .r("R2", "r2", "OUT", "GND")
                    .u1("REF", "OUT", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "led-comparator",
            "Comparator driving an LED",
            "Op-amp used as a comparator on a single rail: R1 and R2 set the threshold at the"
                + " inverting input; above it the output goes high and lights LED D1 through R3.",
            with(
                List.of(
                    p("r1", "threshold resistor R1 from VCC", "10k", "Ω"),
                    p("r2", "threshold resistor R2 to ground", "10k", "Ω"),
                    p("r3", "LED series resistor R3", "1k", "Ω"),
                    p("colour", "LED colour: red, orange, yellow, green, blue or white", "red", ""),
                    p("vcc", "the single rail VCC", "12", "V"),
                    p("vin", "DC level of the test input IN", "8", "V"),
                    p(
                        "class",
                        "op-amp class: classic-bipolar, ground-sensing or rail-to-rail",
                        "ground-sensing",
                        ""),
                    p(
                        "package",
                        "package of U1: single-8, dual-8 or quad-14 (section A is used)",
                        "dual-8",
                        "")),
                List.of()),
            v ->
                new Draft(v)
                    .singleRail()
                    .input("IN", "vin", null, null)
                    .r("R1", "r1", "VCC", "THR")
                    .r("R2", "r2", "THR", "GND")
                    .r("R3", "r3", "OUT", "LED")
                    .led("D1", "colour", "LED", "GND")
                    .u1("IN", "THR", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "offset-null",
            "Inverting amplifier with offset-null trimmer",
            "Inverting amplifier (gain -R2/R1) whose output offset is nulled by trimmer RV1 across"
                + " the rails: its wiper feeds a small current through R3 into the summing point.",
            with(
                List.of(
                    p("r1", "input resistor R1", "10k", "Ω"),
                    p("r2", "feedback resistor R2", "100k", "Ω"),
                    p("r3", "null resistor R3 from the wiper to the summing point", "2M2", "Ω"),
                    p("rv1", "trimmer RV1 end to end", "10k", "Ω"),
                    p("pos", "RV1's wiper position from the VCC end (0 to 1)", "0.5", "")),
                with(signal("0.1", "0.01", "1k"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .r("R1", "r1", "IN", "SUM")
                    .r("R2", "r2", "SUM", "OUT")
                    .trimmer("RV1", "rv1", "pos", "VCC", "NULL", "VEE")
                    .r("R3", "r3", "NULL", "SUM")
                    .u1("GND", "SUM", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "gain-trim",
            "Non-inverting amplifier with gain trimmer",
            "Non-inverting amplifier whose gain is set by trimmer RV1, wired as a variable resistor"
                + " (wiper to its ground end) below R1: gain = 1 + R2/(R1 + RV1 x position), from"
                + " 1 + R2/(R1 + RV1) to 1 + R2/R1.",
            with(
                List.of(
                    p("r1", "resistor R1 from the inverting input to the trimmer", "4k7", "Ω"),
                    p("r2", "feedback resistor R2", "10k", "Ω"),
                    p("rv1", "trimmer RV1 end to end", "10k", "Ω"),
                    p("pos", "RV1's wiper position from the R1 end (0 to 1)", "0.5", "")),
                with(signal("1", "0.1", "1k"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .r("R2", "r2", "OUT", "FB")
                    .r("R1", "r1", "FB", "FOOT")
                    .trimmer("RV1", "rv1", "pos", "FOOT", "GND", "GND")
                    .u1("IN", "FB", "OUT")
                    .build()));
    return all;
  }
}
