package com.stagewise.diagnosis;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.circuit.MeterSpec;
import com.stagewise.circuit.Reading;
import com.stagewise.circuit.ReadingSet;
import com.stagewise.circuit.Stage;
import com.stagewise.interchange.StageSheet;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;

/**
 * The fault truth set: faulted units simulated with ngspice (see DEVELOPERS.md, "Reference data and
 * fault truth set"), read back for the diagnosis's accuracy checks.
 */
final class TruthCases {
  static final Path FOLDER = Paths.get("src", "test", "resources", "diagnosis", "truth");

  /** One stage of the truth set with its cases. */
  record StageCases(String name, Stage stage, MeterSpec meter, List<Case> cases) {}

  /**
   * One simulated faulty unit.
   *
   * @param fault the true fault id
   * @param dc every DC reading (all nets and used pins)
   * @param ac the AC readings, if the stage has an AC input
   * @param partial the test points of the partial set (the output and two or three pins)
   * @param ohms the power-off readings between every pair of nets (ngspice, ohmmeter error drawn)
   */
  record Case(
      String fault, List<Reading> dc, List<Reading> ac, Set<String> partial, List<Reading> ohms) {
    ReadingSet full(MeterSpec meter) {
      return new ReadingSet(meter, dc);
    }

    ReadingSet fullWithAc(MeterSpec meter) {
      List<Reading> all = new ArrayList<>(dc);
      all.addAll(ac);
      return new ReadingSet(meter, all);
    }

    ReadingSet fullWithOhms(MeterSpec meter) {
      List<Reading> all = new ArrayList<>(dc);
      all.addAll(ohms);
      return new ReadingSet(meter, all);
    }

    ReadingSet partialWithOhms(MeterSpec meter) {
      List<Reading> some = new ArrayList<>(partial(meter).readings());
      some.addAll(ohms);
      return new ReadingSet(meter, some);
    }

    ReadingSet partial(MeterSpec meter) {
      return new ReadingSet(meter, dc.stream().filter(r -> partial.contains(r.at())).toList());
    }
  }

  private TruthCases() {}

  static List<StageCases> load() {
    ObjectMapper mapper = new ObjectMapper();
    List<StageCases> all = new ArrayList<>();
    try (Stream<Path> files = Files.list(FOLDER)) {
      for (Path file : files.filter(f -> f.toString().endsWith(".json")).sorted().toList()) {
        JsonNode root = mapper.readTree(file.toFile());
        Stage stage =
            StageSheet.read(
                mapper.writeValueAsString(root.get("sheet")), file.getFileName().toString());
        JsonNode m = root.get("meter");
        MeterSpec meter =
            new MeterSpec(
                m.get("percent").asDouble(),
                m.get("counts").asInt(),
                m.get("displayCounts").asInt());
        List<Case> cases = new ArrayList<>();
        for (JsonNode c : root.get("cases")) {
          List<Reading> dc = new ArrayList<>();
          List<Reading> ac = new ArrayList<>();
          for (JsonNode r : c.get("readings")) {
            if (r.has("dc")) {
              dc.add(Reading.dc(r.get("at").asText(), r.get("dc").asDouble()));
            } else {
              ac.add(
                  Reading.ac(r.get("at").asText(), r.get("ac").asDouble(), r.get("hz").asDouble()));
            }
          }
          Set<String> partial = new HashSet<>();
          c.get("partial").forEach(p -> partial.add(p.asText()));
          List<Reading> ohms = new ArrayList<>();
          for (JsonNode r : c.path("ohms")) {
            JsonNode v = r.get("ohms");
            ohms.add(
                Reading.ohms(
                    r.get("at").asText(),
                    r.get("to").asText(),
                    v.isTextual() ? Double.POSITIVE_INFINITY : v.asDouble()));
          }
          cases.add(new Case(c.get("fault").asText(), dc, ac, partial, ohms));
        }
        all.add(new StageCases(file.getFileName().toString(), stage, meter, cases));
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return all;
  }
}
