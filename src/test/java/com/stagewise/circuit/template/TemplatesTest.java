package com.stagewise.circuit.template;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.PackageType;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.StageRules;
import com.stagewise.circuit.value.SiValue;
import com.stagewise.circuit.value.ZenerMarking;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;

class TemplatesTest {

  static Stream<StageTemplate> templates() {
    return Templates.all().stream();
  }

  @ParameterizedTest
  @MethodSource("templates")
  void build_defaults_giveASoundStage(StageTemplate template) {
    Stage stage = template.build();
    assertThat(StageRules.problems(stage)).isEmpty();
    assertThat(stage.title()).isEqualTo(template.title());
    assertThat(stage.amplifiers()).isNotEmpty();
  }

  @ParameterizedTest
  @MethodSource("templates")
  void parameters_haveMeaningAndReadableDefaults(StageTemplate template) {
    assertThat(template.description()).isNotBlank();
    assertThat(template.parameters()).extracting(Parameter::name).doesNotHaveDuplicates();
    for (Parameter parameter : template.parameters()) {
      assertThat(parameter.meaning()).isNotBlank();
      if (parameter.name().startsWith("zd")) {
        // A zener's default is its marking, read by the zener marking parser.
        assertThat(ZenerMarking.parse(parameter.defaultValue())).isPositive();
      } else if (!parameter.unit().isEmpty()) {
        // Every default with a unit is a value the shared parser reads.
        SiValue.parse(parameter.defaultValue());
      }
    }
  }

  @ParameterizedTest
  @MethodSource("templates")
  void build_unknownParameter_namesIt(StageTemplate template) {
    InvalidInputException e =
        catchThrowableOfType(
            InvalidInputException.class, () -> template.build(Map.of("r99", "1k")));
    assertThat(e.field()).isEqualTo("r99");
    assertThat(e.getMessage()).contains("template " + template.name(), "unknown parameter");
  }

  @Test
  void ids_areTheCatalogue() {
    assertThat(Templates.all())
        .extracting(StageTemplate::name)
        .containsExactly(
            "inverting",
            "non-inverting",
            "voltage-follower",
            "summing",
            "difference",
            "integrator",
            "differentiator",
            "instrumentation",
            "transimpedance",
            "sallen-key-low-pass",
            "inverting-schmitt-trigger",
            "single-supply-inverting",
            "precision-rectifier",
            "diode-limiter",
            "input-clamp",
            "zener-reference",
            "led-comparator",
            "offset-null",
            "gain-trim");
  }

  static Stream<Arguments> variants() {
    return Stream.of(
        Arguments.of("summing", Map.of("inputs", "2")),
        Arguments.of("summing", Map.of("inputs", "4")),
        Arguments.of("integrator", Map.of("r2", "none")),
        Arguments.of("differentiator", Map.of("r1", "none")),
        Arguments.of("inverting", Map.of("package", "single-8", "class", "rail-to-rail")),
        Arguments.of("non-inverting", Map.of("package", "quad-14", "vac", "0")),
        Arguments.of("single-supply-inverting", Map.of("vcc", "5", "class", "rail-to-rail")));
  }

  @ParameterizedTest
  @MethodSource("variants")
  void build_variants_giveASoundStage(String name, Map<String, String> values) {
    assertThat(StageRules.problems(Templates.named(name).build(values))).isEmpty();
  }

  @Test
  void summing_inputCount_setsTheInputs() {
    Stage two = Templates.named("summing").build(Map.of("inputs", "2"));
    assertThat(two.inputs()).hasSize(2);
    assertThat(two.part("R3")).isEmpty();
    assertThat(Templates.named("summing").build(Map.of("inputs", "4")).parts()).hasSize(5);
  }

  @Test
  void integrator_withoutR2_hasNoDcFeedbackResistor() {
    assertThat(Templates.named("integrator").build(Map.of("r2", "none")).part("R2")).isEmpty();
    assertThat(Templates.named("integrator").build().part("R2")).isPresent();
  }

  @Test
  void instrumentation_usesThreeSectionsOfOneQuad() {
    Stage stage = Templates.named("instrumentation").build();
    assertThat(stage.amplifiers()).extracting(a -> a.ref()).containsExactly("U1A", "U1B", "U1C");
    assertThat(stage.amplifiers()).allMatch(a -> a.packageType() == PackageType.QUAD_14);
    // Quad pinout (industry standard): section C output on pin 8, supplies on 4 and 11.
    assertThat(stage.pinNets())
        .containsEntry("U1.8", "OUT")
        .containsEntry("U1.4", "VCC")
        .containsEntry("U1.11", "VEE");
  }

  @Test
  void singleSupply_groundsTheNegativeSupplyPin() {
    Stage stage = Templates.named("single-supply-inverting").build();
    assertThat(stage.rails()).hasSize(1);
    // Dual-8 pinout: pin 4 is v-, pin 8 is v+.
    assertThat(stage.pinNets()).containsEntry("U1.4", "GND").containsEntry("U1.8", "VCC");
  }

  @ParameterizedTest
  @CsvSource({
    "inverting, r1, 10q", "inverting, r2, -47k", "inverting, r1, 0", "inverting, vcc, -5",
    "inverting, vee, 5", "inverting, class, fast", "inverting, package, dip-16",
        "summing, inputs, 5",
    "summing, inputs, two", "inverting, hz, -1", "inverting, vac, -0.1", "integrator, c1, none"
  })
  void build_badValue_namesTheParameter(String name, String parameter, String value) {
    InvalidInputException e =
        catchThrowableOfType(
            InvalidInputException.class,
            () -> Templates.named(name).build(Map.of(parameter, value)));
    assertThat(e.field()).isEqualTo(parameter);
    assertThat(e.getMessage()).startsWith("template " + name + ": " + parameter + ": ");
  }

  @Test
  void named_unknownTemplate_listsTheIds() {
    assertThatThrownBy(() -> Templates.named("band-pass"))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("band-pass")
        .hasMessageContaining("sallen-key-low-pass");
  }

  @Test
  void rename_partsAndPackage_keepsPinsAndSoundness() {
    Stage stage = Templates.named("instrumentation").build();
    Stage renamed = StageEdits.rename(stage, Map.of("R2", "R12", "U1", "U7", "U1C", "U9C"));
    assertThat(renamed.part("R12")).isPresent();
    assertThat(renamed.amplifiers()).extracting(a -> a.ref()).containsExactly("U7A", "U7B", "U9C");
    assertThat(renamed.packages()).containsExactly("U7");
    assertThat(renamed.pinNets()).containsEntry("U7.8", "OUT");
    assertThat(StageRules.problems(renamed)).isEmpty();
  }

  @Test
  void rename_unknownOrClashing_isRefused() {
    Stage stage = Templates.named("inverting").build();
    assertThat(
            catchThrowableOfType(
                    InvalidInputException.class, () -> StageEdits.rename(stage, Map.of("R9", "R1")))
                .field())
        .isEqualTo("R9");
    assertThatThrownBy(() -> StageEdits.rename(stage, Map.of("R1", "R2")))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("used twice");
  }

  @Test
  void renameNets_everywhere_keepsTheStageSound() {
    Stage stage = Templates.named("inverting").build();
    Stage renamed =
        StageEdits.renameNets(stage, Map.of("VCC", "+15V", "VEE", "-15V", "IN", "LINE_IN"));
    assertThat(renamed.rail("+15V")).isPresent();
    assertThat(renamed.input("LINE_IN")).isPresent();
    assertThat(renamed.amplifiers().get(0).vMinus()).isEqualTo("-15V");
    assertThat(StageRules.problems(renamed)).isEmpty();
    assertThatThrownBy(() -> StageEdits.renameNets(stage, Map.of("IN", "OUT")))
        .isInstanceOf(InvalidInputException.class);
  }
}
