package com.stagewise.circuit.template;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Stage;
import java.util.List;
import java.util.Map;
import java.util.function.Function;

/**
 * A common op-amp stage that can be built from a few named values, with designators and a package
 * pinout already chosen (see {@link Templates} for the catalogue).
 */
public final class StageTemplate {
  private final String name;
  private final String title;
  private final String description;
  private final List<Parameter> parameters;
  private final Function<Values, Stage> builder;

  StageTemplate(
      String name,
      String title,
      String description,
      List<Parameter> parameters,
      Function<Values, Stage> builder) {
    this.name = name;
    this.title = title;
    this.description = description;
    this.parameters = List.copyOf(parameters);
    this.builder = builder;
  }

  /** Returns the template's id, e.g. {@code sallen-key-low-pass}. */
  public String name() {
    return name;
  }

  /** Returns the title a built stage carries, e.g. "Inverting amplifier". */
  public String title() {
    return title;
  }

  /** Returns what the stage is and does, in a technician's words. */
  public String description() {
    return description;
  }

  /** Returns the parameters with their defaults, in the order a form shows them. */
  public List<Parameter> parameters() {
    return parameters;
  }

  /**
   * Returns the stage built from the given values; a parameter not given takes its default.
   *
   * <p>Values are written as in stage sheets ({@code 4k7}, {@code 100n}, {@code -15}); a few
   * parameters take a word ({@code class}, {@code package}) or {@code none} (an optional part).
   *
   * @param values parameter name to value text; may be empty
   * @throws InvalidInputException naming the parameter, if a name is unknown or a value is bad
   */
  public Stage build(Map<String, String> values) {
    return builder.apply(new Values(this, values));
  }

  /** Returns the stage built from the defaults. */
  public Stage build() {
    return build(Map.of());
  }
}
