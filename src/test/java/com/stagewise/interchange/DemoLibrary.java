package com.stagewise.interchange;

import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.StageEdits;
import com.stagewise.circuit.template.Templates;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * The demo stage library in {@code data/stages/}: one sheet per template, set on the boards of an
 * invented workshop's bench (every maker and board here is made up for the demo).
 *
 * <p>To write the sheets again after changing a template or this list, run from the project folder:
 *
 * <pre>
 * mvn -B -o test-compile dependency:build-classpath -Dmdep.outputFile=target/cp.txt
 * java -cp "target/classes:target/test-classes:$(cat target/cp.txt)" com.stagewise.interchange.DemoLibrary data/stages
 * </pre>
 *
 * {@code DemoLibraryTest} fails while the files and this list disagree, so the two stay in step.
 */
public final class DemoLibrary {
  private DemoLibrary() {}

  /**
   * One demo stage: a template with its values, renamed to fit its board.
   *
   * @param file the sheet's file name
   * @param template the template id
   * @param values the template parameter values
   * @param designators designator renames, old to new
   * @param nets net renames, old to new
   * @param title the stage's title
   * @param board the (invented) board model
   */
  record Entry(
      String file,
      String template,
      Map<String, String> values,
      Map<String, String> designators,
      Map<String, String> nets,
      String title,
      String board) {

    /** Returns the stage this entry describes. */
    Stage build() {
      Stage stage = Templates.named(template).build(values);
      stage = StageEdits.rename(stage, designators);
      stage = StageEdits.renameNets(stage, nets);
      return StageEdits.titled(stage, title, board);
    }
  }

  static final String MIXER = "Larkspur SM-8 mixer, channel strip board";
  static final String SUPPLY = "Halden PSU-30 bench supply, control board";
  static final String LOGGER = "Ostrander DL-5 data logger, analogue input card";
  static final String SCALE = "Ferrowick WB-2 weighing scale, bridge amplifier board";
  static final String METER = "Quillon LX-2 light meter, sensor board";
  static final String OVEN = "Brannock TC-4 oven controller, front panel board";

  /**
   * Demo sheets written by hand, not from a template: a whole signal chain (five sections over two
   * quad packages, one feeding the next) of an invented preamp's channel board.
   */
  static final List<String> HAND_WRITTEN = List.of("tarnwell-ps4-channel-chain.stage.json");

  /** Returns the entries of the demo library, one per template. */
  static List<Entry> entries() {
    return List.of(
        new Entry(
            "larkspur-sm8-line-driver.stage.json",
            "inverting",
            Map.of("r1", "10k", "r2", "47k", "vin", "1", "vac", "0.1", "hz", "1k"),
            Map.of("R1", "R14", "R2", "R15", "U1", "U3"),
            Map.of("VCC", "+15V", "VEE", "-15V"),
            "Line driver, left channel",
            MIXER),
        new Entry(
            "larkspur-sm8-mic-preamp.stage.json",
            "non-inverting",
            Map.of("r1", "1k", "r2", "33k", "vin", "0.05", "vac", "0.01", "hz", "1k"),
            Map.of("R1", "R3", "R2", "R4"),
            Map.of("VCC", "+15V", "VEE", "-15V", "IN", "MIC"),
            "Microphone preamp, second gain stage",
            MIXER),
        new Entry(
            "ostrander-dl5-input-buffer.stage.json",
            "voltage-follower",
            Map.of("vin", "2.048", "vac", "0.5", "hz", "50", "package", "quad-14"),
            Map.of("R1", "R22", "U1", "U5"),
            Map.of("IN", "CH1_IN", "OUT", "CH1_BUF"),
            "Channel 1 input buffer",
            LOGGER),
        new Entry(
            "larkspur-sm8-mix-bus.stage.json",
            "summing",
            Map.of(
                "inputs", "4", "r5", "10k", "vin1", "0.5", "vin2", "0.25", "vin3", "-0.1", "vin4",
                "0.2"),
            Map.of("R1", "R61", "R2", "R62", "R3", "R63", "R4", "R64", "R5", "R65", "U1", "U12"),
            Map.of("VCC", "+15V", "VEE", "-15V", "OUT", "MIX_L"),
            "Left mix bus amplifier",
            MIXER),
        new Entry(
            "halden-psu30-current-sense.stage.json",
            "difference",
            Map.of(
                "r1", "1k", "r2", "10k", "r3", "1k", "r4", "10k", "vin1", "12", "vin2", "12.1",
                "vac", "0", "vcc", "24", "vee", "-5"),
            Map.of("R1", "R31", "R2", "R32", "R3", "R33", "R4", "R34", "U1", "U4"),
            Map.of(
                "IN1",
                "SHUNT_LO",
                "IN2",
                "SHUNT_HI",
                "OUT",
                "I_SENSE",
                "VCC",
                "+24V",
                "VEE",
                "-5V"),
            "Output current sense",
            SUPPLY),
        new Entry(
            "halden-psu30-error-amp.stage.json",
            "integrator",
            Map.of(
                "r1", "10k", "c1", "100n", "r2", "1M", "vin", "0.005", "vac", "0.1", "hz", "100",
                "vcc", "24", "vee", "-5"),
            Map.of("R1", "R41", "C1", "C12", "R2", "R42", "U1", "U4"),
            Map.of("IN", "V_ERR", "OUT", "DRIVE", "VCC", "+24V", "VEE", "-5V"),
            "Voltage loop error amplifier",
            SUPPLY),
        new Entry(
            "ostrander-dl5-rate-detector.stage.json",
            "differentiator",
            Map.of("c1", "100n", "r1", "1k", "r2", "47k", "vac", "0.1", "hz", "20"),
            Map.of("C1", "C31", "R1", "R31", "R2", "R32", "U1", "U6"),
            Map.of(),
            "Rate-of-change detector, channel 1",
            LOGGER),
        new Entry(
            "ferrowick-wb2-bridge-amp.stage.json",
            "instrumentation",
            Map.of("r2", "1k", "vin1", "2.5", "vin2", "2.502", "vac", "0.001", "hz", "10"),
            Map.of("U1", "U2"),
            Map.of("IN1", "BRIDGE_N", "IN2", "BRIDGE_P", "OUT", "WEIGHT"),
            "Load-cell bridge amplifier",
            SCALE),
        new Entry(
            "quillon-lx2-photo-amp.stage.json",
            "transimpedance",
            Map.of("r1", "10M", "r2", "2M2", "c1", "22p", "vin", "-2", "vac", "0.5", "hz", "100"),
            Map.of("R1", "RD1", "R2", "R7", "C1", "C4", "U1", "U2"),
            Map.of("IN", "PHOTO"),
            "Photodiode amplifier",
            METER),
        new Entry(
            "larkspur-sm8-treble-filter.stage.json",
            "sallen-key-low-pass",
            Map.of(
                "r1", "4k7", "r2", "4k7", "c1", "22n", "c2", "10n", "vin", "0", "vac", "0.5", "hz",
                "1k"),
            Map.of("R1", "R71", "R2", "R72", "C1", "C71", "C2", "C72", "U1", "U14"),
            Map.of("VCC", "+15V", "VEE", "-15V"),
            "Treble roll-off filter",
            MIXER),
        new Entry(
            "halden-psu30-fan-switch.stage.json",
            "inverting-schmitt-trigger",
            Map.of("r1", "10k", "r2", "220k", "vin", "0.2", "vcc", "24", "vee", "-5"),
            Map.of("R1", "R51", "R2", "R52", "U1", "U4"),
            Map.of("IN", "TEMP_SENSE", "OUT", "FAN_DRIVE", "VCC", "+24V", "VEE", "-5V"),
            "Heatsink fan switch",
            SUPPLY),
        new Entry(
            "larkspur-sm8-insert-return.stage.json",
            "single-supply-inverting",
            Map.of("vcc", "12", "vac", "0.1", "hz", "1k"),
            Map.of(
                "R1", "R81", "R2", "R82", "R3", "R83", "R4", "R84", "C1", "C81", "C2", "C82", "U1",
                "U15"),
            Map.of("VCC", "+12V"),
            "Insert return amplifier (12 V section)",
            MIXER),
        new Entry(
            "ostrander-dl5-peak-rectifier.stage.json",
            "precision-rectifier",
            Map.of("vin", "0.8", "vac", "0.1", "hz", "50", "r1", "22k"),
            Map.of("D1", "D7", "R1", "R27", "U1", "U7"),
            Map.of("IN", "CH2_IN", "RECT", "CH2_RECT", "OUT", "U7_OUT"),
            "Channel 2 precision rectifier",
            LOGGER),
        new Entry(
            "larkspur-sm8-clip-limiter.stage.json",
            "diode-limiter",
            Map.of("vin", "0.2", "vac", "0.01", "hz", "1k", "r1", "10k", "r2", "100k"),
            Map.of("R1", "R91", "R2", "R92", "D1", "D91", "D2", "D92", "U1", "U16"),
            Map.of("VCC", "+15V", "VEE", "-15V", "OUT", "CLIP_OUT"),
            "Headphone clip limiter",
            MIXER),
        new Entry(
            "ostrander-dl5-input-protect.stage.json",
            "input-clamp",
            Map.of("vin", "5", "vac", "0.5", "hz", "50", "r1", "4k7", "r2", "47k"),
            Map.of("R1", "R41", "R2", "R42", "D1", "D41", "D2", "D42", "U1", "U8"),
            Map.of("IN", "CH3_IN", "PIN", "CH3_PIN", "OUT", "CH3_BUF"),
            "Channel 3 input protection and buffer",
            LOGGER),
        new Entry(
            "halden-psu30-set-point.stage.json",
            "zener-reference",
            Map.of("r1", "3k3", "zd1", "6V2", "r2", "10k", "vcc", "24", "vee", "-5"),
            Map.of("R1", "R55", "R2", "R56", "ZD1", "ZD3", "U1", "U5"),
            Map.of("REF", "VREF", "OUT", "V_SET", "VCC", "+24V", "VEE", "-5V"),
            "Output voltage set-point reference",
            SUPPLY),
        new Entry(
            "brannock-tc4-over-temp.stage.json",
            "led-comparator",
            Map.of("vin", "7", "r1", "10k", "r2", "10k", "r3", "1k", "colour", "red"),
            Map.of("R1", "R11", "R2", "R12", "R3", "R13", "D1", "LED2", "U1", "U2"),
            Map.of("IN", "TEMP", "THR", "LIMIT", "OUT", "ALARM", "LED", "LED_A", "VCC", "+12V"),
            "Over-temperature lamp",
            OVEN),
        new Entry(
            "quillon-lx2-offset-null.stage.json",
            "offset-null",
            Map.of("vin", "0.1", "vac", "0.01", "hz", "100", "pos", "0.5"),
            Map.of("R1", "R21", "R2", "R22", "R3", "R23", "RV1", "RV2", "U1", "U3"),
            Map.of("IN", "RANGE_IN", "OUT", "RANGE_OUT"),
            "Range amplifier with offset null",
            METER),
        new Entry(
            "ferrowick-wb2-span-trim.stage.json",
            "gain-trim",
            Map.of("vin", "1.2", "vac", "0.1", "hz", "10", "pos", "0.5"),
            Map.of("R1", "R31", "R2", "R32", "RV1", "RV1", "U1", "U3"),
            Map.of("IN", "WEIGHT", "OUT", "SPAN_OUT"),
            "Span adjustment amplifier",
            SCALE));
  }

  /** Writes every sheet of the library into the folder given as the first argument. */
  public static void main(String[] args) throws IOException {
    Path folder = Path.of(args.length > 0 ? args[0] : "data/stages");
    Files.createDirectories(folder);
    for (Entry entry : entries()) {
      StageSheet.write(entry.build(), folder.resolve(entry.file()));
    }
  }
}
