package com.stagewise.circuit;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * {@link Part}'s hand-written equality and hash (written out so that a fresh command-line run does
 * not set up the generated ones through method handles) keep the rules of a record's: see {@link
 * RecordEquality}.
 */
class PartEqualityTest {

  @Test
  void equalExactlyWhenEveryComponentIs() throws Exception {
    List<Part> bases =
        List.of(
            Part.resistor("R1", 10e3, 0.01, "in", "out"),
            new Part("RV1", PartKind.TRIMMER, 5e3, 0.2, "a", "b", "w", 0.4, false, null, null),
            new Part("RV2", PartKind.POTENTIOMETER, 5e3, 0.2, "a", "b", "w", 0.4, true, null, null),
            Part.diode("D1", DiodeClass.SILICON, "an", "ca"),
            Part.led("D2", LedColour.RED, "an", "ca"),
            new Part(
                "Z1", PartKind.ZENER, 5.1, 0.05, "an", "ca", null, Double.NaN, false, null, null));
    Map<String, List<Object>> others =
        Map.ofEntries(
            Map.entry("ref", List.of("R9")),
            Map.entry("kind", List.of(PartKind.CAPACITOR, PartKind.RESISTOR, PartKind.DIODE)),
            Map.entry("value", List.of(4.7e3, 0.0, 6.2)),
            Map.entry("tolerance", List.of(0.05, 0.0)),
            Map.entry("netA", List.of("n9")),
            Map.entry("netB", List.of("n8")),
            Map.entry("wiper", List.of("w9")),
            Map.entry("position", List.of(0.25)),
            Map.entry("sealed", List.of(true, false)),
            Map.entry("diodeClass", List.of(DiodeClass.SCHOTTKY, DiodeClass.SILICON)),
            Map.entry("colour", List.of(LedColour.GREEN)));
    RecordEquality.check(Part.class, bases, others);
  }
}
