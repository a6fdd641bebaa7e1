package com.stagewise.circuit;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * {@link Stage#hasNet} and {@link Stage#hasUsedPin} answer, without building the sets, exactly what
 * {@code nets().contains} and {@code pinNets().containsKey} answer: on every template, for every
 * net, every used pin, every part lead and names that come near them.
 */
class StageLookupTest {

  static Stream<StageTemplate> templates() {
    return Templates.all().stream();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("templates")
  void lookups_agreeWithTheFullSets(StageTemplate template) {
    Stage stage = template.build();
    List<String> points = new ArrayList<>(stage.nets());
    points.addAll(stage.pinNets().keySet());
    for (Part part : stage.parts()) {
      points.addAll(part.leads());
    }
    for (String pkg : stage.packages()) {
      for (String pin : List.of("0", "06", "+1", "1x", "", "99", "1234", "-1", "8 ")) {
        points.add(pkg + "." + pin);
      }
    }
    List<String> more = new ArrayList<>();
    for (String p : points) {
      more.add(p + ".1");
      more.add(p.toLowerCase(java.util.Locale.ROOT));
    }
    points.addAll(more);
    points.addAll(List.of("", ".", ".1", "U9.1", "NOPE", "U1..1"));
    for (String p : points) {
      assertThat(stage.hasNet(p)).as("hasNet(%s)", p).isEqualTo(stage.nets().contains(p));
      assertThat(stage.hasUsedPin(p))
          .as("hasUsedPin(%s)", p)
          .isEqualTo(stage.pinNets().containsKey(p));
    }
    // The lookups are not empty answers: every net and every used pin is found.
    assertThat(stage.nets()).allMatch(stage::hasNet);
    assertThat(stage.pinNets().keySet()).isNotEmpty().allMatch(stage::hasUsedPin);
  }
}
