package com.stagewise.cli;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.template.Parameter;
import com.stagewise.circuit.template.StageEdits;
import com.stagewise.circuit.template.StageTemplate;
import com.stagewise.circuit.template.Templates;
import com.stagewise.interchange.StageSheet;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code stagewise template [NAME] [--set name=value]… [--rename old=new]… [--out FILE]}: lists the
 * stage templates, or writes the stage sheet of one.
 */
@Command(
    name = "template",
    mixinStandardHelpOptions = true,
    description = {
      "Without NAME, lists the stage templates with their parameters.",
      "With NAME, writes the stage sheet of that template (to --out, or to the screen)."
    })
final class TemplateCommand implements Callable<Integer> {
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Parameters(
      index = "0",
      arity = "0..1",
      paramLabel = "NAME",
      description = "the template, e.g. inverting")
  String name;

  @Option(
      names = "--set",
      paramLabel = "NAME=VALUE",
      description = "a parameter value, e.g. --set r2=47k")
  Map<String, String> values = new LinkedHashMap<>();

  @Option(
      names = "--rename",
      paramLabel = "OLD=NEW",
      description = "a designator to rename, e.g. --rename R2=R15 --rename U1=U3")
  Map<String, String> renames = new LinkedHashMap<>();

  @Option(
      names = "--net",
      paramLabel = "OLD=NEW",
      description = "a net to rename, e.g. --net VCC=+15V")
  Map<String, String> nets = new LinkedHashMap<>();

  @Option(names = "--title", paramLabel = "TEXT", description = "the stage's title")
  String title;

  @Option(
      names = "--board",
      paramLabel = "TEXT",
      description = "the board model the stage belongs to")
  String board;

  @Option(
      names = "--out",
      paramLabel = "FILE",
      description = "the stage sheet to write (*.stage.json)")
  Path out;

  @Override
  public Integer call() {
    PrintWriter screen = spec.commandLine().getOut();
    if (name == null) {
      screen.print(catalogue());
      screen.flush();
      return ExitCode.OK;
    }
    StageTemplate template = Templates.named(name);
    Stage stage = template.build(values);
    try {
      stage = StageEdits.rename(stage, renames);
    } catch (InvalidInputException e) {
      throw new InvalidInputException("--rename", e.field(), withoutField(e));
    }
    try {
      stage = StageEdits.renameNets(stage, nets);
    } catch (InvalidInputException e) {
      throw new InvalidInputException("--net", e.field(), withoutField(e));
    }
    stage =
        StageEdits.titled(
            stage, title == null ? stage.title() : title, board == null ? stage.board() : board);
    if (out == null) {
      screen.print(StageSheet.write(stage));
    } else {
      StageSheet.write(stage, out);
      screen.println("wrote " + out);
    }
    screen.flush();
    return ExitCode.OK;
  }

  private static String withoutField(InvalidInputException e) {
    String prefix = e.field().isEmpty() ? "" : e.field() + ": ";
    return e.getMessage().startsWith(prefix)
        ? e.getMessage().substring(prefix.length())
        : e.getMessage();
  }

  /** Returns the list of templates with their parameters and defaults. */
  static String catalogue() {
    StringBuilder text = new StringBuilder();
    for (StageTemplate template : Templates.all()) {
      text.append(template.name()).append(": ").append(template.description()).append('\n');
      for (Parameter parameter : template.parameters()) {
        String value =
            parameter.defaultValue() + (parameter.unit().isEmpty() ? "" : " " + parameter.unit());
        text.append(
            String.format(
                Locale.ROOT, "    %-8s %-16s %s%n", parameter.name(), value, parameter.meaning()));
      }
      text.append('\n');
    }
    return text.toString();
  }
}
