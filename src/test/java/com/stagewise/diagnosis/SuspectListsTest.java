package com.stagewise.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.ReadingSet;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.zip.GZIPInputStream;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;

/**
 * The suspect lists of every case of the fault truth set (full DC, full DC and AC, partial DC) stay
 * what they were before the solver's search and the diagnosis's incremental work were made faster:
 * same faults in the same order, same groups, probabilities equal up to their last printed digit
 * (the diagnosis JSON prints six decimals).
 *
 * <p>The recorded lists ({@code suspect-lists.txt.gz}) were written by {@link #main} from the
 * diagnosis as it was before those changes; rewrite them only for a change that is meant to alter
 * the ranking, and say so in the commit.
 */
class SuspectListsTest {
  static final Path RECORDED =
      Paths.get("src", "test", "resources", "diagnosis", "suspect-lists.txt.gz");

  /**
   * One unit in the last printed digit of a probability (six decimals), with rounding either way.
   */
  private static final double LAST_DIGIT = 1.5e-6;

  @Test
  void everyTruthCase_ranksAsRecorded() throws IOException {
    Map<String, String> recorded = read();
    Map<String, String> now = lists();
    assertThat(now.keySet()).containsExactlyElementsOf(recorded.keySet());
    List<String> differ = new ArrayList<>();
    for (Map.Entry<String, String> e : recorded.entrySet()) {
      String mismatch = compare(e.getValue(), now.get(e.getKey()));
      if (mismatch != null) {
        differ.add(e.getKey() + ": " + mismatch);
      }
    }
    assertThat(differ).as("suspect lists that changed").isEmpty();
  }

  @Test
  void compare_letsOnlyTiedSuspectsTradePlaces() {
    String before = "FAULT a=0.500000[a,b,c] b=0.200000[a,b,c] c=0.200000[a,b,c]";
    // Tied neighbours in either order, and a tie cut by the list's end filled by a tied member.
    assertThat(compare(before, "FAULT a=0.500001[a,b,c] c=0.200000[a,b,c] b=0.200001[a,b,c]"))
        .isNull();
    assertThat(compare(before, "FAULT a=0.500000[a,b,c] b=0.200000[a,b,c] d=0.200000[a,b,c,d]"))
        .isNotNull();
    assertThat(compare(before, "FAULT a=0.500000[a,b,c] b=0.200000[a,b,c] c=0.200000[a,b,c]"))
        .isNull();
    String tail = "FAULT a=0.500000[a,b,c] b=0.200000[a,b,c]";
    assertThat(compare(tail, "FAULT a=0.500000[a,b,c] c=0.200000[a,b,c]")).isNull();
    // Suspects of different probabilities may not trade places, nor a moved one change its own.
    assertThat(compare(before, "FAULT b=0.500000[a,b,c] a=0.200000[a,b,c] c=0.200000[a,b,c]"))
        .isNotNull();
    assertThat(compare(before, "FAULT a=0.500000[a,b,c] c=0.200000[a,b,c] b=0.210000[a,b,c]"))
        .isNotNull();
    assertThat(compare(before, "FAULT a=0.500000[a,b] b=0.200000[a,b,c] c=0.200000[a,b,c]"))
        .isNotNull();
  }

  /** Writes the recorded lists from the current diagnosis. */
  public static void main(String[] args) throws IOException {
    Files.createDirectories(RECORDED.getParent());
    try (Writer out =
        new OutputStreamWriter(
            new GZIPOutputStream(Files.newOutputStream(RECORDED)), StandardCharsets.UTF_8)) {
      for (Map.Entry<String, String> e : lists().entrySet()) {
        out.write(e.getKey() + "\t" + e.getValue() + "\n");
      }
    }
  }

  private static Map<String, String> read() throws IOException {
    Map<String, String> map = new LinkedHashMap<>();
    try (BufferedReader in =
        new BufferedReader(
            new InputStreamReader(
                new GZIPInputStream(Files.newInputStream(RECORDED)), StandardCharsets.UTF_8))) {
      String line;
      while ((line = in.readLine()) != null) {
        int tab = line.indexOf('\t');
        map.put(line.substring(0, tab), line.substring(tab + 1));
      }
    }
    return map;
  }

  /** Every case's suspect lists, keyed "stage#case/mode", one text per list. */
  static Map<String, String> lists() {
    Map<String, String> map = new LinkedHashMap<>();
    for (TruthCases.StageCases stage : TruthCases.load()) {
      Diagnoser diagnoser = Diagnoser.of(stage.stage());
      List<TruthCases.Case> cases = stage.cases();
      for (int i = 0; i < cases.size(); i++) {
        TruthCases.Case c = cases.get(i);
        String key = stage.name() + "#" + i + "/";
        map.put(key + "dc", text(diagnoser.diagnose(c.full(stage.meter()))));
        if (!c.ac().isEmpty()) {
          map.put(key + "dc+ac", text(diagnoser.diagnose(c.fullWithAc(stage.meter()))));
        }
        ReadingSet partial = c.partial(stage.meter());
        if (!partial.readings().isEmpty()) {
          map.put(key + "partial", text(diagnoser.diagnose(partial)));
        }
      }
    }
    return map;
  }

  /** A suspect list as text: {@code fault=probability[group,…]} separated by spaces. */
  private static String text(Diagnosis d) {
    List<String> items = new ArrayList<>();
    for (Suspect s : d.suspects()) {
      items.add(
          String.format(Locale.ROOT, "%s=%.6f", s.fault(), s.probability())
              + "["
              + String.join(",", s.group().stream().sorted().toList())
              + "]");
    }
    return d.verdict().name() + " " + String.join(" ", items);
  }

  /** Returns null when two lists agree as the class says, else what differs. */
  static String compare(String before, String after) {
    String[] a = before.split(" ");
    String[] b = after.split(" ");
    if (!a[0].equals(b[0])) {
      return "verdict " + a[0] + " became " + b[0];
    }
    if (a.length != b.length) {
      return "list of " + (a.length - 1) + " became " + (b.length - 1) + ": " + after;
    }
    for (int i = 1; i < a.length; i++) {
      Item x = Item.of(a[i]);
      Item y = Item.of(b[i]);
      if (!x.fault.equals(y.fault)) {
        // Suspects whose probabilities agree within the last digit may trade places (a tie
        // broken by the last bits of the arithmetic): the place keeps its probability, and the
        // fault that moved keeps its own.
        if (Math.abs(x.probability - y.probability) > 2 * LAST_DIGIT) {
          return "suspect " + i + " " + x.fault + " became " + y.fault;
        }
        Item moved = find(a, y.fault);
        if (moved == null) {
          // Not listed before: a tie cut by the list's length, so every suspect from here to the
          // end was tied with it, and it was in their group.
          for (int j = i; j < a.length; j++) {
            if (Math.abs(Item.of(a[j]).probability - y.probability) > 2 * LAST_DIGIT) {
              return "suspect " + i + " " + x.fault + " became " + y.fault;
            }
          }
          if (!List.of(x.group.split(",")).contains(y.fault)) {
            return "suspect " + i + " " + x.fault + " became " + y.fault + ", not of its group";
          }
          continue;
        }
        x = moved;
      }
      if (Math.abs(x.probability - y.probability) > LAST_DIGIT) {
        return x.fault + " " + x.probability + " became " + y.probability;
      }
      if (!x.group.equals(y.group)) {
        return x.fault + " group [" + x.group + "] became [" + y.group + "]";
      }
    }
    return null;
  }

  /** The item of a fault in a list's words (verdict first), or null when it is not listed. */
  private static Item find(String[] words, String fault) {
    for (int i = 1; i < words.length; i++) {
      Item item = Item.of(words[i]);
      if (item.fault.equals(fault)) {
        return item;
      }
    }
    return null;
  }

  private record Item(String fault, double probability, String group) {
    static Item of(String text) {
      int eq = text.indexOf('=');
      int bracket = text.indexOf('[');
      return new Item(
          text.substring(0, eq),
          Double.parseDouble(text.substring(eq + 1, bracket)),
          text.substring(bracket + 1, text.length() - 1));
    }
  }
}
