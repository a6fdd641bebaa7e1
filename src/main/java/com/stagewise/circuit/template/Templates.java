package com.stagewise.circuit.template;

import com.stagewise.circuit.DeviceClass;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.PackageType;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The catalogue of stage templates: the op-amp stages found on most boards, each built from a few
 * named values.
 *
 * <p>Common to all: nets {@code GND}, {@code VCC} and (split supply) {@code VEE}; inputs {@code IN}
 * (or {@code IN1}…), output {@code OUT}; resistors 1 %, capacitors 10 %, rails 5 %. Single-section
 * stages sit in section A of {@code U1}, a dual-8 by default ({@code package} may say single-8 or
 * quad-14). Designators and nets can be changed afterwards with {@link StageEdits}.
 */
public final class Templates {
  private static final List<StageTemplate> ALL = catalogue();

  private Templates() {}

  /** Returns every template, in catalogue order. */
  public static List<StageTemplate> all() {
    return ALL;
  }

  /** Returns the template with this id, if any. */
  public static Optional<StageTemplate> find(String name) {
    return ALL.stream().filter(t -> t.name().equals(name)).findFirst();
  }

  /**
   * Returns the template with this id.
   *
   * @throws InvalidInputException listing the ids, if there is no such template
   */
  public static StageTemplate named(String name) {
    return find(name)
        .orElseThrow(
            () ->
                new InvalidInputException(
                    "",
                    "template",
                    "no template named \""
                        + name
                        + "\" (expected one of "
                        + String.join(", ", ALL.stream().map(StageTemplate::name).toList())
                        + ")"));
  }

  static Parameter p(String name, String meaning, String defaultValue, String unit) {
    return new Parameter(name, meaning, defaultValue, unit);
  }

  static List<Parameter> with(List<Parameter> own, List<Parameter> common) {
    List<Parameter> all = new ArrayList<>(own);
    all.addAll(common);
    return all;
  }

  static List<Parameter> split(String deviceClass) {
    return List.of(
        p("vcc", "positive rail VCC", "15", "V"),
        p("vee", "negative rail VEE", "-15", "V"),
        p(
            "class",
            "op-amp class: classic-bipolar, ground-sensing or rail-to-rail",
            deviceClass,
            ""),
        p(
            "package",
            "package of U1: single-8, dual-8 or quad-14 (section A is used)",
            "dual-8",
            ""));
  }

  static List<Parameter> signal(String dc, String ac, String hz) {
    return List.of(
        p("vin", "DC level of the test input IN", dc, "V"),
        p("vac", "AC amplitude of the test input IN (0 for none)", ac, "V"),
        p("hz", "frequency of the AC test signal", hz, "Hz"));
  }

  private static List<StageTemplate> catalogue() {
    List<StageTemplate> all = new ArrayList<>();
    all.add(
        new StageTemplate(
            "inverting",
            "Inverting amplifier",
            "Inverting amplifier: the signal goes through R1 into the inverting input, R2 feeds the"
                + " output back; gain is -R2/R1 and the inverting input sits at ground (virtual earth).",
            with(
                List.of(
                    p("r1", "input resistor R1", "10k", "Ω"),
                    p("r2", "feedback resistor R2", "47k", "Ω")),
                with(signal("1", "0.1", "1k"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .r("R1", "r1", "IN", "SUM")
                    .r("R2", "r2", "SUM", "OUT")
                    .u1("GND", "SUM", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "non-inverting",
            "Non-inverting amplifier",
            "Non-inverting amplifier: the signal goes straight into the non-inverting input; R2 from"
                + " the output and R1 to ground set the gain, 1 + R2/R1.",
            with(
                List.of(
                    p("r1", "resistor R1 from the inverting input to ground", "10k", "Ω"),
                    p("r2", "feedback resistor R2", "22k", "Ω")),
                with(signal("0.5", "0.1", "1k"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .r("R1", "r1", "FB", "GND")
                    .r("R2", "r2", "FB", "OUT")
                    .u1("IN", "FB", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "voltage-follower",
            "Voltage follower",
            "Voltage follower (buffer): output tied to the inverting input, so the output copies the"
                + " input at unity gain; R1 is the load it drives.",
            with(
                List.of(p("r1", "load resistor R1 from the output to ground", "10k", "Ω")),
                with(signal("2", "0.5", "1k"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .r("R1", "r1", "OUT", "GND")
                    .u1("IN", "OUT", "OUT")
                    .build()));
    all.add(summing());
    all.add(
        new StageTemplate(
            "difference",
            "Difference amplifier",
            "Difference amplifier: IN1 through R1 to the inverting input, IN2 through R3 and R4 to"
                + " the non-inverting input; with R4/R3 = R2/R1 the output is (R2/R1)(IN2 - IN1).",
            with(
                List.of(
                    p("r1", "resistor R1 from IN1 to the inverting input", "10k", "Ω"),
                    p("r2", "feedback resistor R2", "22k", "Ω"),
                    p("r3", "resistor R3 from IN2 to the non-inverting input", "10k", "Ω"),
                    p("r4", "resistor R4 from the non-inverting input to ground", "22k", "Ω"),
                    p("vin1", "DC level of input IN1", "1", "V"),
                    p("vin2", "DC level of input IN2", "1.5", "V"),
                    p("vac", "AC amplitude on IN2 (0 for none)", "0.1", "V"),
                    p("hz", "frequency of the AC test signal", "1k", "Hz")),
                split("classic-bipolar")),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN1", "vin1", null, "hz")
                    .input("IN2", "vin2", "vac", "hz")
                    .r("R1", "r1", "IN1", "NEG")
                    .r("R2", "r2", "NEG", "OUT")
                    .r("R3", "r3", "IN2", "POS")
                    .r("R4", "r4", "POS", "GND")
                    .u1("POS", "NEG", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "integrator",
            "Integrator",
            "Integrator: R1 into the inverting input, C1 from the output back; AC gain falls 6 dB"
                + " per octave, 1/(2 pi f R1 C1). R2 across C1 gives the DC path that keeps the output"
                + " from drifting to a rail (without it any input offset saturates the output).",
            with(
                List.of(
                    p("r1", "input resistor R1", "10k", "Ω"),
                    p("c1", "integrating capacitor C1", "10n", "F"),
                    p("r2", "DC feedback resistor R2 across C1 (none to leave it out)", "1M", "Ω")),
                with(signal("0", "0.1", "1k"), split("classic-bipolar"))),
            v -> {
              Draft draft =
                  new Draft(v)
                      .dualRails()
                      .input("IN", "vin", "vac", "hz")
                      .r("R1", "r1", "IN", "SUM")
                      .c("C1", "c1", "SUM", "OUT");
              OptionalDouble r2 = v.optionalPositive("r2");
              if (r2.isPresent()) {
                draft.r("R2", r2.getAsDouble(), "SUM", "OUT");
              }
              return draft.u1("GND", "SUM", "OUT").build();
            }));
    all.add(
        new StageTemplate(
            "differentiator",
            "Differentiator",
            "Differentiator: C1 into the inverting input, R2 from the output back; AC gain rises 6 dB"
                + " per octave, 2 pi f R2 C1. R1 in series with C1 limits the gain at high frequency"
                + " and keeps the stage stable.",
            with(
                List.of(
                    p("c1", "input capacitor C1", "10n", "F"),
                    p("r1", "series input resistor R1 (none to leave it out)", "1k", "Ω"),
                    p("r2", "feedback resistor R2", "10k", "Ω")),
                with(signal("0", "0.1", "1k"), split("classic-bipolar"))),
            v -> {
              Draft draft = new Draft(v).dualRails().input("IN", "vin", "vac", "hz");
              OptionalDouble r1 = v.optionalPositive("r1");
              if (r1.isPresent()) {
                draft.c("C1", "c1", "IN", "MID").r("R1", r1.getAsDouble(), "MID", "SUM");
              } else {
                draft.c("C1", "c1", "IN", "SUM");
              }
              return draft.r("R2", "r2", "SUM", "OUT").u1("GND", "SUM", "OUT").build();
            }));
    all.add(instrumentation());
    all.add(
        new StageTemplate(
            "transimpedance",
            "Transimpedance amplifier",
            "Transimpedance (current-to-voltage) amplifier for a photodiode or similar sensor: the"
                + " sensor current flows into the inverting input and out through R2, so the output is"
                + " -I x R2; C1 across R2 keeps it stable. The sensor is modelled as the test voltage"
                + " IN behind its large resistance R1, a current of vin/R1.",
            with(
                List.of(
                    p("r1", "sensor resistance R1 (the current source is vin/R1)", "10M", "Ω"),
                    p("r2", "feedback resistor R2 (volts per ampere)", "1M", "Ω"),
                    p("c1", "feedback capacitor C1 across R2", "10p", "F")),
                with(signal("-1", "0.5", "100"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .r("R1", "r1", "IN", "SUM")
                    .r("R2", "r2", "SUM", "OUT")
                    .c("C1", "c1", "SUM", "OUT")
                    .u1("GND", "SUM", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "sallen-key-low-pass",
            "Sallen-Key low-pass filter",
            "Unity-gain Sallen-Key low-pass filter (second order): R1 and R2 in series to the"
                + " non-inverting input, C2 from there to ground, C1 from the R1-R2 junction to the"
                + " output; corner at 1/(2 pi sqrt(R1 R2 C1 C2)). Passes DC at unity gain.",
            with(
                List.of(
                    p("r1", "first series resistor R1", "10k", "Ω"),
                    p("r2", "second series resistor R2", "10k", "Ω"),
                    p("c1", "feedback capacitor C1 (junction to output)", "22n", "F"),
                    p("c2", "capacitor C2 (non-inverting input to ground)", "10n", "F")),
                with(signal("0", "0.5", "1k"), split("classic-bipolar"))),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", "vac", "hz")
                    .r("R1", "r1", "IN", "JCT")
                    .r("R2", "r2", "JCT", "POS")
                    .c("C1", "c1", "JCT", "OUT")
                    .c("C2", "c2", "POS", "GND")
                    .u1("POS", "OUT", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "inverting-schmitt-trigger",
            "Inverting Schmitt trigger",
            "Inverting Schmitt trigger (comparator with hysteresis): the input drives the inverting"
                + " input, R2 feeds the output back to the non-inverting input and R1 takes it to"
                + " ground, so the switching point moves with the output. Between the two thresholds the"
                + " output may rest high or low: both are correct readings.",
            with(
                List.of(
                    p("r1", "resistor R1 from the non-inverting input to ground", "10k", "Ω"),
                    p("r2", "positive feedback resistor R2", "100k", "Ω"),
                    p("vin", "DC level of the test input IN", "0", "V")),
                split("classic-bipolar")),
            v ->
                new Draft(v)
                    .dualRails()
                    .input("IN", "vin", null, "vin")
                    .r("R1", "r1", "POS", "GND")
                    .r("R2", "r2", "POS", "OUT")
                    .u1("POS", "IN", "OUT")
                    .build()));
    all.add(
        new StageTemplate(
            "single-supply-inverting",
            "Single-supply inverting amplifier",
            "Inverting amplifier on one positive rail: R3 and R4 bias the non-inverting input at"
                + " mid-rail (C2 decouples it), C1 blocks the input's DC; the output rests at mid-rail"
                + " and swings -R2/R1 times the AC input around it.",
            with(
                List.of(
                    p("r1", "input resistor R1", "10k", "Ω"),
                    p("r2", "feedback resistor R2", "47k", "Ω"),
                    p("r3", "bias resistor R3 from VCC to the mid-rail point", "100k", "Ω"),
                    p("r4", "bias resistor R4 from the mid-rail point to ground", "100k", "Ω"),
                    p("c1", "input coupling capacitor C1", "1u", "F"),
                    p("c2", "mid-rail decoupling capacitor C2", "10u", "F"),
                    p("vcc", "the single rail VCC", "12", "V"),
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
                signal("0", "0.1", "1k")),
            v ->
                new Draft(v)
                    .singleRail()
                    .input("IN", "vin", "vac", "hz")
                    .c("C1", "c1", "IN", "CPL")
                    .r("R1", "r1", "CPL", "SUM")
                    .r("R2", "r2", "SUM", "OUT")
                    .r("R3", "r3", "VCC", "BIAS")
                    .r("R4", "r4", "BIAS", "GND")
                    .c("C2", "c2", "BIAS", "GND")
                    .u1("BIAS", "SUM", "OUT")
                    .build()));
    all.addAll(JunctionTemplates.catalogue());
    return List.copyOf(all);
  }

  private static StageTemplate summing() {
    List<Parameter> own = new ArrayList<>();
    own.add(p("inputs", "number of inputs, 2 to 4", "3", ""));
    for (int i = 1; i <= 4; i++) {
      own.add(
          p(
              "r" + i,
              "input resistor R" + i + " from IN" + i + " (used when inputs >= " + i + ")",
              "10k",
              "Ω"));
    }
    own.add(p("r5", "feedback resistor R5", "10k", "Ω"));
    String[] levels = {"0.5", "0.25", "-0.1", "0.2"};
    for (int i = 1; i <= 4; i++) {
      own.add(p("vin" + i, "DC level of input IN" + i, levels[i - 1], "V"));
    }
    own.add(p("vac", "AC amplitude on IN1 (0 for none)", "0.1", "V"));
    own.add(p("hz", "frequency of the AC test signal", "1k", "Hz"));
    return new StageTemplate(
        "summing",
        "Summing amplifier",
        "Inverting summing amplifier (mixer): each input through its own resistor into the"
            + " inverting input, R5 feeds the output back; the output is -R5 x (IN1/R1 + IN2/R2 + …).",
        with(own, split("classic-bipolar")),
        v -> {
          int inputs = v.count("inputs", 2, 4);
          Draft draft = new Draft(v).dualRails();
          for (int i = 1; i <= inputs; i++) {
            draft.input("IN" + i, "vin" + i, i == 1 ? "vac" : null, "hz");
          }
          for (int i = 1; i <= inputs; i++) {
            draft.r("R" + i, "r" + i, "IN" + i, "SUM");
          }
          return draft.r("R5", "r5", "SUM", "OUT").u1("GND", "SUM", "OUT").build();
        });
  }

  private static StageTemplate instrumentation() {
    List<Parameter> own =
        List.of(
            p("r1", "first-stage feedback resistor R1 (U1A)", "10k", "Ω"),
            p("r2", "gain resistor R2 between the two inverting inputs", "2k2", "Ω"),
            p("r3", "first-stage feedback resistor R3 (U1B), equal to R1", "10k", "Ω"),
            p("r4", "difference-stage input resistor R4 (from U1A)", "10k", "Ω"),
            p("r5", "difference-stage feedback resistor R5", "10k", "Ω"),
            p("r6", "difference-stage input resistor R6 (from U1B)", "10k", "Ω"),
            p("r7", "difference-stage resistor R7 to the reference (ground)", "10k", "Ω"),
            p("vin1", "DC level of input IN1 (the - input)", "2.5", "V"),
            p("vin2", "DC level of input IN2 (the + input)", "2.55", "V"),
            p("vac", "AC amplitude on IN2 (0 for none)", "0.01", "V"),
            p("hz", "frequency of the AC test signal", "100", "Hz"),
            p("vcc", "positive rail VCC", "15", "V"),
            p("vee", "negative rail VEE", "-15", "V"),
            p(
                "class",
                "op-amp class: classic-bipolar, ground-sensing or rail-to-rail",
                "classic-bipolar",
                ""));
    return new StageTemplate(
        "instrumentation",
        "Three-op-amp instrumentation amplifier",
        "Three-op-amp instrumentation amplifier in one quad package (U1A to U1C; U1D is not part of"
            + " the stage): two non-inverting buffers with gain set by R2 between them, then a"
            + " difference stage. Output = (1 + 2 R1/R2)(R5/R4)(IN2 - IN1) with R1 = R3, R4 = R6,"
            + " R5 = R7.",
        own,
        v -> {
          DeviceClass type = v.deviceClass("class");
          return new Draft(v)
              .dualRails()
              .input("IN1", "vin1", null, "hz")
              .input("IN2", "vin2", "vac", "hz")
              .r("R1", "r1", "OA", "GA")
              .r("R2", "r2", "GA", "GB")
              .r("R3", "r3", "GB", "OB")
              .r("R4", "r4", "OA", "DN")
              .r("R5", "r5", "DN", "OUT")
              .r("R6", "r6", "OB", "DP")
              .r("R7", "r7", "DP", "GND")
              .section("U1", PackageType.QUAD_14, "A", type, "IN1", "GA", "OA")
              .section("U1", PackageType.QUAD_14, "B", type, "IN2", "GB", "OB")
              .section("U1", PackageType.QUAD_14, "C", type, "DP", "DN", "OUT")
              .build();
        });
  }
}
