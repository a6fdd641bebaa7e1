package com.stagewise.circuit;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Optional;
import java.util.TreeSet;

/**
 * Checks a set of readings against the stage they were taken on: each test point (and the second
 * point {@code to} of an ohms reading) is a net, a used pin or a part lead of the stage, each value
 * lies within {@link Limits} (an ohms reading may also be the meter's over-range, OL), an AC
 * reading matches the stage's AC input, the meter's figures are sane and the set is not too large.
 *
 * <p>The one place for these rules, whoever reads the readings (a file, the readings screen, the
 * diagnosis): one message each, with the JSON path of the field to fix ({@code readings[2].at},
 * {@code meter.percent}).
 */
public final class ReadingRules {
  private ReadingRules() {}

  /** Returns every problem found, in order; an empty list when the readings are sound. */
  public static List<StageRules.Problem> problems(Stage stage, ReadingSet readings) {
    List<StageRules.Problem> problems = new ArrayList<>();
    List<Reading> list = readings.readings();
    if (list.size() > Limits.MAX_READINGS) {
      problems.add(
          new StageRules.Problem(
              "readings",
              list.size()
                  + " readings is more than this program takes for one set (at most "
                  + Limits.MAX_READINGS
                  + ")"));
      return problems;
    }
    checkMeter(readings.meter(), problems);
    double dcLimit = Limits.readingVolts(stage);
    double acLimit = Limits.acReadingVolts(stage);
    double acHz = acHz(stage);
    for (int i = 0; i < list.size(); i++) {
      Reading r = list.get(i);
      // The field paths ("readings[2].at") are written only for a message: a sound set, the
      // usual case on every re-rank, needs none.
      Optional<String> pointProblem = testPointProblem(stage, r.at());
      if (pointProblem.isPresent()) {
        problems.add(new StageRules.Problem(field(i, "at"), pointProblem.get()));
        continue;
      }
      if (r.kind() == Reading.Kind.OHMS) {
        checkOhms(stage, r, i, problems);
        continue;
      }
      double limit = r.kind() == Reading.Kind.AC ? acLimit : dcLimit;
      if (Math.abs(r.value()) > limit) {
        problems.add(
            new StageRules.Problem(field(i, r.kind().word()), beyondRails(stage, r, limit)));
      }
      if (r.kind() == Reading.Kind.AC) {
        if (acHz == 0) {
          problems.add(
              new StageRules.Problem(
                  field(i, r.kind().word()),
                  "the stage has no AC test input, so an AC reading at "
                      + r.at()
                      + " cannot be judged (expected a dc reading)"));
        } else if (!Limits.FREQUENCY_HZ.contains(r.hz())) {
          problems.add(
              new StageRules.Problem(
                  field(i, "hz"), Limits.FREQUENCY_HZ.problem("the reading's frequency", r.hz())));
        } else if (Math.abs(r.hz() - acHz) > 1e-6 * acHz) {
          problems.add(
              new StageRules.Problem(
                  field(i, "hz"),
                  "the AC reading at "
                      + r.at()
                      + " is at "
                      + Limits.shown(r.hz(), "Hz")
                      + " but the stage's test input is at "
                      + Limits.shown(acHz, "Hz")
                      + " (expected a reading at the input's frequency)"));
        }
      }
      if (r.uncertainty().isPresent()
          && !Limits.UNCERTAINTY_VOLTS.contains(r.uncertainty().getAsDouble())) {
        problems.add(
            new StageRules.Problem(
                field(i, "uncertainty"),
                Limits.UNCERTAINTY_VOLTS.problem(
                    "the uncertainty at " + r.at(), r.uncertainty().getAsDouble())));
      }
    }
    return problems;
  }

  /**
   * Returns the problems of one reading whose stage is not at hand (a reading carried by a history
   * bundle): its test point's name, its value against the plausible range, its frequency and its
   * uncertainty. The stage's rails are unknown, so the value is judged against {@code
   * largestDrivenVolts}: the largest rail or input of the stages it may have been taken on, or the
   * end of {@link Limits#RAIL_VOLTS} when none is known. Fields are named {@code at}, {@code
   * value}, {@code hz} and {@code uncertainty}.
   */
  public static List<StageRules.Problem> storedProblems(Reading r, double largestDrivenVolts) {
    List<StageRules.Problem> problems = new ArrayList<>();
    if (r.at().length() > Limits.MAX_NAME_LENGTH) {
      problems.add(
          new StageRules.Problem(
              "at", Limits.tooLong("the test point", r.at().length(), Limits.MAX_NAME_LENGTH)));
    } else if (Limits.hasControlCharacter(r.at())) {
      problems.add(
          new StageRules.Problem(
              "at",
              "the test point holds a control character (expected a net name or a pin such as"
                  + " U1.6)"));
    }
    if (r.kind() == Reading.Kind.OHMS) {
      if (!r.isOverRange() && !Limits.READING_OHMS.contains(r.value())) {
        problems.add(
            new StageRules.Problem(
                "value", Limits.READING_OHMS.problem("the ohms reading at " + r.at(), r.value())));
      }
      return problems;
    }
    double limit =
        (r.kind() == Reading.Kind.AC ? Limits.READING_AC_FACTOR : Limits.READING_RAIL_FACTOR)
                * largestDrivenVolts
            + Limits.READING_MARGIN_VOLTS;
    if (Math.abs(r.value()) > limit) {
      problems.add(
          new StageRules.Problem(
              "value",
              r.kind().word()
                  + " reading at "
                  + r.at()
                  + " ("
                  + Limits.shown(r.value(), "V")
                  + ") is far beyond every rail and input its stage may have (largest "
                  + Limits.shown(largestDrivenVolts, "V")
                  + "; expected at most ±"
                  + Limits.shown(limit, "V")
                  + "; check the decimal point, the unit and the sign)"));
    }
    if (r.kind() == Reading.Kind.AC && !Limits.FREQUENCY_HZ.contains(r.hz())) {
      problems.add(
          new StageRules.Problem(
              "hz", Limits.FREQUENCY_HZ.problem("the reading's frequency", r.hz())));
    }
    if (r.uncertainty().isPresent()
        && !Limits.UNCERTAINTY_VOLTS.contains(r.uncertainty().getAsDouble())) {
      problems.add(
          new StageRules.Problem(
              "uncertainty",
              Limits.UNCERTAINTY_VOLTS.problem(
                  "the uncertainty at " + r.at(), r.uncertainty().getAsDouble())));
    }
    return problems;
  }

  /**
   * Checks the readings and throws on the first problem.
   *
   * @param source the file or screen the readings came from, named in the message
   * @throws InvalidInputException naming the source, the field and the problem
   */
  public static void requireSound(Stage stage, ReadingSet readings, String source) {
    List<StageRules.Problem> problems = problems(stage, readings);
    if (!problems.isEmpty()) {
      StageRules.Problem first = problems.get(0);
      String more =
          problems.size() > 1 ? " (and " + (problems.size() - 1) + " more problem(s))" : "";
      throw new InvalidInputException(source, first.field(), first.message() + more);
    }
  }

  /** Returns the JSON path of a reading's field, e.g. {@code readings[2].at}. */
  private static String field(int index, String name) {
    return "readings[" + index + "]." + name;
  }

  private static void checkOhms(
      Stage stage, Reading r, int index, List<StageRules.Problem> problems) {
    Optional<String> toProblem = testPointProblem(stage, r.to());
    if (toProblem.isPresent()) {
      problems.add(new StageRules.Problem(field(index, "to"), toProblem.get()));
    }
    if (!r.isOverRange() && !Limits.READING_OHMS.contains(r.value())) {
      problems.add(
          new StageRules.Problem(
              field(index, "ohms"),
              "ohms reading from "
                  + r.at()
                  + " to "
                  + r.to()
                  + " ("
                  + Limits.shown(r.value(), "Ω")
                  + ") is beyond any meter's range (expected "
                  + Limits.READING_OHMS.text()
                  + ", or \"OL\" for the meter's over-range; check the prefix and the unit)"));
    }
    if (r.uncertainty().isPresent()
        && !Limits.UNCERTAINTY_OHMS.contains(r.uncertainty().getAsDouble())) {
      problems.add(
          new StageRules.Problem(
              field(index, "uncertainty"),
              Limits.UNCERTAINTY_OHMS.problem(
                  "the uncertainty of the ohms reading from " + r.at(),
                  r.uncertainty().getAsDouble())));
    }
  }

  /**
   * Returns whether a point names a lead of one of the stage's parts ({@code R2.1}) rather than a
   * net or a package pin; the lead itself may still be wrong ({@code R2.7}).
   */
  public static boolean isPartLead(Stage stage, String point) {
    if (stage.hasNet(point) || stage.hasUsedPin(point)) {
      return false;
    }
    int dot = point.lastIndexOf('.');
    return dot > 0 && stage.part(point.substring(0, dot)).isPresent();
  }

  /**
   * Returns what is wrong with a test point, if anything: it must be a net of the stage, a used pin
   * {@code PACKAGE.PIN} of one of its packages or a lead {@code PART.N} of one of its parts ({@link
   * Part#leads()}).
   */
  public static Optional<String> testPointProblem(Stage stage, String at) {
    if (at.length() > Limits.MAX_NAME_LENGTH) {
      return Optional.of(Limits.tooLong("the test point", at.length(), Limits.MAX_NAME_LENGTH));
    }
    if (Limits.hasControlCharacter(at)) {
      return Optional.of(
          "the test point holds a control character (expected a net name or a pin such as U1.6)");
    }
    if (stage.hasNet(at) || stage.hasUsedPin(at)) {
      return Optional.empty();
    }
    int dot = at.lastIndexOf('.');
    Optional<Part> part = dot > 0 ? stage.part(at.substring(0, dot)) : Optional.empty();
    if (part.isPresent()) {
      String ref = part.get().ref();
      List<String> leads = part.get().leads();
      String lead = at.substring(dot + 1);
      if (leads.contains(lead)) {
        return Optional.empty();
      }
      List<String> points = new ArrayList<>(leads.size());
      for (String l : leads) {
        points.add(ref + "." + l);
      }
      return Optional.of(
          "\""
              + lead
              + "\" is not a lead of "
              + ref
              + " (expected "
              + String.join(" or ", points)
              + ")");
    }
    if (dot <= 0) {
      return Optional.of(
          "\""
              + at
              + "\" is not a net of the stage (expected one of "
              + String.join(", ", stage.nets())
              + ", or a package pin such as "
              + examplePin(stage)
              + ")");
    }
    String pkg = at.substring(0, dot);
    Optional<PackageType> type = stage.packageType(pkg);
    if (type.isEmpty()) {
      return Optional.of(
          "package "
              + pkg
              + " is not on the stage (expected a net, or a pin of "
              + (stage.packages().isEmpty() ? "no package" : String.join(", ", stage.packages()))
              + ", e.g. "
              + examplePin(stage)
              + ")");
    }
    String pinText = at.substring(dot + 1);
    if (!isPinNumber(pinText)) {
      return Optional.of(
          "\"" + pinText + "\" is not a pin number (expected e.g. " + examplePin(stage) + ")");
    }
    int pin = Integer.parseInt(pinText);
    if (pin < 1 || pin > type.get().pinCount()) {
      return Optional.of(
          pkg
              + " is a "
              + type.get().word()
              + " package, which has no pin "
              + pin
              + " (expected 1 to "
              + type.get().pinCount()
              + ")");
    }
    TreeSet<Integer> used = new TreeSet<>();
    for (String key : stage.pinNets().keySet()) {
      if (key.startsWith(pkg + ".")) {
        used.add(Integer.parseInt(key.substring(pkg.length() + 1)));
      }
    }
    return Optional.of(
        "pin "
            + pin
            + " of "
            + pkg
            + " is not used by any section of the stage (expected one of pins "
            + used
            + ", or a net)");
  }

  private static void checkMeter(MeterSpec meter, List<StageRules.Problem> problems) {
    if (!Limits.METER_PERCENT.contains(meter.ohms().percent())) {
      problems.add(
          new StageRules.Problem(
              "meter.ohms.percent",
              Limits.METER_PERCENT.problem("the meter's ohms percent", meter.ohms().percent())));
    }
    if (!Limits.METER_COUNTS.contains(meter.ohms().counts())) {
      problems.add(
          new StageRules.Problem(
              "meter.ohms.counts",
              Limits.METER_COUNTS.problem("the meter's ohms counts", meter.ohms().counts())));
    }
    if (!Limits.METER_PERCENT.contains(meter.percent())) {
      problems.add(
          new StageRules.Problem(
              "meter.percent",
              Limits.METER_PERCENT.problem("the meter's percent", meter.percent())));
    }
    if (!Limits.METER_COUNTS.contains(meter.counts())) {
      problems.add(
          new StageRules.Problem(
              "meter.counts", Limits.METER_COUNTS.problem("the meter's counts", meter.counts())));
    }
    if (!Limits.METER_DISPLAY_COUNTS.contains(meter.displayCounts())) {
      problems.add(
          new StageRules.Problem(
              "meter.displayCounts",
              Limits.METER_DISPLAY_COUNTS.problem(
                  "the meter's display counts", meter.displayCounts())));
    }
  }

  private static String beyondRails(Stage stage, Reading r, double limit) {
    return r.kind().word()
        + " reading at "
        + r.at()
        + " ("
        + Limits.shown(r.value(), "V")
        + ") is far beyond every rail and input of the stage (largest "
        + Limits.shown(Limits.largestDrivenVolts(stage), "V")
        + "; expected at most ±"
        + Limits.shown(limit, "V")
        + "; check the decimal point, the unit and the sign)";
  }

  /** Returns the frequency of the stage's first AC input in hertz, 0 when it has none. */
  private static double acHz(Stage stage) {
    for (TestInput input : stage.inputs()) {
      if (input.hasAc()) {
        return input.hz();
      }
    }
    return 0;
  }

  /** Returns whether the text is one to three ASCII digits. */
  private static boolean isPinNumber(String text) {
    if (text.isEmpty() || text.length() > 3) {
      return false;
    }
    for (int i = 0; i < text.length(); i++) {
      if (text.charAt(i) < '0' || text.charAt(i) > '9') {
        return false;
      }
    }
    return true;
  }

  private static String examplePin(Stage stage) {
    Iterator<String> pins = stage.pinNets().keySet().iterator();
    return pins.hasNext() ? pins.next() : "U1.6";
  }
}
