package com.stagewise.interchange;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamWriteFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.AcMeasure;
import com.stagewise.solver.AcSolution;
import com.stagewise.solver.ExpectedVolts;
import com.stagewise.solver.OperatingPoint;
import com.stagewise.solver.Phasor;
import com.stagewise.solver.SectionState;
import com.stagewise.solver.SolveResult;
import java.io.UncheckedIOException;
import java.util.Map;
import java.util.Optional;

/**
 * Writes the solution document of {@code stagewise solve --json} (format {@code
 * stagewise-solution}, version 1).
 *
 * <p>{@code dc} holds the volts on every net and every used package pin, {@code sections} the state
 * of every op-amp section ({@code linear}, {@code high}, {@code low}), {@code ac} the amplitude and
 * phase on every net when an input has AC. Numbers are plain JSON numbers. A stage with more than
 * one consistent state (a Schmitt trigger between its thresholds) gives the first in {@code dc} and
 * {@code sections} and the others in {@code alternatives}, a list of {@code {"dc": …, "sections":
 * …}} objects; readers that do not know that field can ignore it.
 *
 * <p>{@code healthy} (an extension of version 1; the keys above are unchanged) holds the healthy
 * range of the first state over the parts' and rails' tolerances ({@link ExpectedVolts}): {@code
 * {"nets": {"OUT": {"low": -4.83, "high": -4.57}, …}, "pins": {"U1.1": {…}, …}}}. It is left out
 * when no range could be worked out.
 */
public final class SolutionJson {
  /** The {@code format} of a solution document. */
  public static final String FORMAT = "stagewise-solution";

  /** The version written. */
  public static final int VERSION = 1;

  private static final ObjectMapper MAPPER =
      JsonMapper.builder()
          .enable(SerializationFeature.INDENT_OUTPUT)
          .enable(StreamWriteFeature.WRITE_BIGDECIMAL_AS_PLAIN)
          .build();

  private SolutionJson() {}

  /**
   * Returns the solution document, ending in a newline.
   *
   * @param solved the consistent operating points; the first is the primary one
   * @param ac the AC response about the primary point, if an input has AC
   */
  public static String write(SolveResult.Solved solved, Optional<AcSolution> ac) {
    return write(solved, ac, null);
  }

  /**
   * Returns the solution document with the healthy ranges, ending in a newline.
   *
   * @param solved the consistent operating points; the first is the primary one
   * @param ac the AC response about the primary point, if an input has AC
   * @param healthy the healthy ranges about the primary point; null or unsolved to leave them out
   */
  public static String write(
      SolveResult.Solved solved, Optional<AcSolution> ac, ExpectedVolts healthy) {
    return write(solved, ac, healthy, AcMeasure.PEAK);
  }

  /**
   * Returns the solution document with the healthy ranges and the AC amplitudes stated in {@code
   * measure} (the measure of the stage's AC input), ending in a newline. The {@code ac} object says
   * its measure ({@code "measure": "rms"}, an extension of version 1: the other keys are
   * unchanged).
   *
   * @param solved the consistent operating points; the first is the primary one
   * @param ac the AC response about the primary point (peak amplitudes), if an input has AC
   * @param healthy the healthy ranges about the primary point; null or unsolved to leave them out
   * @param measure the measure the amplitudes are written in
   */
  public static String write(
      SolveResult.Solved solved,
      Optional<AcSolution> ac,
      ExpectedVolts healthy,
      AcMeasure measure) {
    ObjectNode root = JsonText.object();
    root.put("format", FORMAT);
    root.put("version", VERSION);
    OperatingPoint primary = solved.primary();
    root.set("dc", dc(primary));
    root.set("sections", sections(primary));
    // Plain loops and tests here rather than lambdas: a fresh command-line JVM spins a class for
    // each.
    if (ac.isPresent()) {
      AcSolution solution = ac.get();
      ObjectNode nets = JsonText.object();
      for (Map.Entry<String, Phasor> net : solution.nets().entrySet()) {
        nets.set(
            net.getKey(),
            JsonText.object()
                .<ObjectNode>set(
                    "amplitude", JsonText.number(measure.fromPeak(net.getValue().amplitude())))
                .set("phaseDegrees", JsonText.number(net.getValue().phaseDegrees())));
      }
      root.set(
          "ac",
          JsonText.object()
              .<ObjectNode>set("hz", JsonText.number(solution.hz()))
              .<ObjectNode>put("measure", measure.word())
              .set("nets", nets));
    }
    if (healthy != null && healthy.solved()) {
      root.set("healthy", healthy(primary, healthy));
    }
    if (solved.points().size() > 1) {
      ArrayNode alternatives = root.putArray("alternatives");
      for (OperatingPoint point : solved.points().subList(1, solved.points().size())) {
        alternatives.add(
            JsonText.object().<ObjectNode>set("dc", dc(point)).set("sections", sections(point)));
      }
    }
    try {
      return MAPPER.writeValueAsString(root) + "\n";
    } catch (JsonProcessingException e) {
      throw new UncheckedIOException(e);
    }
  }

  private static ObjectNode dc(OperatingPoint point) {
    ObjectNode nets = JsonText.object();
    for (Map.Entry<String, Double> net : point.nets().entrySet()) {
      nets.set(net.getKey(), JsonText.number(net.getValue()));
    }
    ObjectNode pins = JsonText.object();
    for (Map.Entry<String, Double> pin : point.pins().entrySet()) {
      pins.set(pin.getKey(), JsonText.number(pin.getValue()));
    }
    return JsonText.object().<ObjectNode>set("nets", nets).set("pins", pins);
  }

  private static ObjectNode healthy(OperatingPoint point, ExpectedVolts healthy) {
    ObjectNode nets = JsonText.object();
    for (String net : point.nets().keySet()) {
      range(nets, net, healthy);
    }
    ObjectNode pins = JsonText.object();
    for (String pin : point.pins().keySet()) {
      range(pins, pin, healthy);
    }
    return JsonText.object().<ObjectNode>set("nets", nets).set("pins", pins);
  }

  private static void range(ObjectNode into, String testPoint, ExpectedVolts healthy) {
    double low = healthy.low(testPoint);
    double high = healthy.high(testPoint);
    if (Double.isFinite(low) && Double.isFinite(high)) {
      into.set(
          testPoint,
          JsonText.object()
              .<ObjectNode>set("low", JsonText.number(low))
              .set("high", JsonText.number(high)));
    }
  }

  private static ArrayNode sections(OperatingPoint point) {
    ArrayNode sections = JsonNodeFactory.instance.arrayNode();
    for (Map.Entry<String, SectionState> state : point.states().entrySet()) {
      sections.add(
          JsonText.object().put("ref", state.getKey()).put("state", state.getValue().word()));
    }
    return sections;
  }
}
