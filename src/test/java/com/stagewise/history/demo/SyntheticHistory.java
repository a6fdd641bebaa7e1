package com.stagewise.history.demo;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseNote;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairAction;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.UUID;

/**
 * Generated filler history for benchmarks: many board models, units and cases with readings, notes
 * and actions, from a seeded random generator. Not demo data and not for tests of the diagnosis:
 * its symptoms are words drawn at random.
 */
public final class SyntheticHistory {
  /** Cases per generated unit (on average). */
  static final int CASES_PER_UNIT = 4;

  /** Board models generated. */
  static final int BOARD_MODELS = 50;

  private static final String[] WORDS = {
    "hum",
    "hiss",
    "crackle",
    "distortion",
    "dead",
    "intermittent",
    "noise",
    "clipping",
    "offset",
    "drift",
    "channel",
    "output",
    "input",
    "left",
    "right",
    "bus",
    "fader",
    "knob",
    "warm",
    "cold",
    "after",
    "transport",
    "gig",
    "rail",
    "supply",
    "fuse",
    "regulator",
    "smell",
    "burnt",
    "display",
    "relay",
    "click",
    "pop",
    "mute",
    "phantom",
    "power",
    "meter",
    "needle",
    "stuck",
    "oscillates",
    "squeal",
    "motorboating",
    "ground",
    "loop",
    "headphone",
    "monitor",
    "aux",
    "send",
    "return",
    "insert",
    "gain",
    "trim",
    "pan",
    "equaliser",
    "filter"
  };

  private static final String[] FAULTS = {
    "R1:open",
    "R2:open",
    "R2:high",
    "R3:low",
    "C1:short",
    "C2:open",
    "U1A:dead",
    "U1A:stuck-high",
    "U1B:stuck-low",
    "U1.6-7:bridge",
    "U1.3:lifted",
    "VCC:missing",
    "VEE:low",
    "healthy"
  };

  private SyntheticHistory() {}

  /** Returns the serial number of generated unit {@code index}, as the benchmarks look it up. */
  public static String serial(int index) {
    return String.format(java.util.Locale.ROOT, "SYN-%07d", index);
  }

  /** Returns the units generated for {@code cases} cases. */
  public static int unitsFor(int cases) {
    return Math.max(1, cases / CASES_PER_UNIT);
  }

  /** Words in the generated texts: the trade words above, then made-up words. */
  public static final int VOCABULARY = 5_000;

  private static final String[] SYLLABLES = {
    "ka", "lo", "mi", "ne", "ru", "sa", "te", "vo", "zi", "pa", "bu", "de", "fo", "gi", "ha", "jo",
    "ku", "li", "mo", "nu"
  };

  /**
   * Returns the word of rank {@code rank} (0 is the most frequent): the trade words first, then
   * made-up words of three syllables.
   */
  public static String word(int rank) {
    if (rank < WORDS.length) {
      return WORDS[rank];
    }
    int i = rank - WORDS.length;
    return SYLLABLES[i % 20]
        + SYLLABLES[(i / 20) % 20]
        + SYLLABLES[(i / 400) % 20]
        + (i / 8000 == 0 ? "" : "x");
  }

  /**
   * Returns a word drawn as in natural text (Zipf's law, frequency about 1/rank): a few words are
   * in many texts, most words in few.
   */
  public static String textWord(Random random) {
    // Inverse of the continuous 1/r distribution on [1, VOCABULARY + 1).
    int rank = (int) Math.floor(Math.pow(VOCABULARY + 1, random.nextDouble())) - 1;
    return word(Math.min(rank, VOCABULARY - 1));
  }

  /**
   * Adds {@code cases} generated cases with {@code readingsPerCase} readings each to the store, in
   * transactions of {@code chunk} cases (imports of generated bundles).
   */
  public static void fill(
      HistoryStore store, int cases, int readingsPerCase, long seed, int chunk) {
    Generator generator = new Generator(cases, seed);
    store
        .transfer()
        .importBundle(
            bundle(generator.models, generator.units, List.of(), List.of(), List.of(), List.of()),
            "generator");
    for (int first = 0; first < cases; first += chunk) {
      store
          .transfer()
          .importBundle(
              generator.cases(Math.min(chunk, cases - first), readingsPerCase), "generator");
    }
  }

  /**
   * Returns {@code cases} generated cases with their board models, units and children as one
   * bundle.
   */
  public static HistoryBundle bundle(int cases, int readingsPerCase, long seed) {
    Generator generator = new Generator(cases, seed);
    HistoryBundle children = generator.cases(cases, readingsPerCase);
    return new HistoryBundle(
        HistoryBundle.CURRENT_VERSION,
        Instant.EPOCH,
        "generator",
        generator.models,
        List.of(),
        generator.units,
        children.cases(),
        children.readings(),
        List.of(),
        children.actions(),
        children.notes());
  }

  /** The generator's state: its random numbers, board models and units. */
  private static final class Generator {
    private static final Instant START = Instant.parse("2021-01-01T00:00:00Z");
    private static final long SPAN_MILLIS = 5L * 365 * 86_400_000L;
    private final Random random;
    private final List<BoardModel> models = new ArrayList<>();
    private final List<Unit> units = new ArrayList<>();

    Generator(int cases, long seed) {
      random = new Random(seed);
      for (int m = 0; m < BOARD_MODELS; m++) {
        models.add(new BoardModel(id(random), "Synthetic board " + m, "Generated", "", START));
      }
      for (int u = 0; u < unitsFor(cases); u++) {
        units.add(new Unit(id(random), serial(u), models.get(u % BOARD_MODELS).id(), "", START));
      }
    }

    HistoryBundle cases(int count, int readingsPerCase) {
      List<RepairCase> caseList = new ArrayList<>();
      List<StoredReading> readings = new ArrayList<>();
      List<CaseNote> notes = new ArrayList<>();
      List<RepairAction> actions = new ArrayList<>();
      for (int c = 0; c < count; c++) {
        Instant opened = START.plusMillis((long) (random.nextDouble() * SPAN_MILLIS));
        String caseId = id(random);
        Unit unit = units.get(random.nextInt(units.size()));
        boolean closed = random.nextDouble() < 0.85;
        String fault = FAULTS[random.nextInt(FAULTS.length)];
        Instant closedAt = opened.plusSeconds(86_400L * (1 + random.nextInt(20)));
        Outcome outcome =
            random.nextInt(10) < 8 ? Outcome.FIXED : Outcome.values()[1 + random.nextInt(2)];
        caseList.add(
            new RepairCase(
                caseId,
                unit.id(),
                opened,
                sentence(random, 6 + random.nextInt(10)),
                closed ? CaseStatus.CLOSED : CaseStatus.OPEN,
                closed ? closedAt : null,
                closed ? outcome : null,
                closed ? List.of(fault) : List.of(),
                closed ? closedAt : opened));
        for (int r = 0; r < readingsPerCase; r++) {
          readings.add(
              new StoredReading(
                  id(random),
                  caseId,
                  "U1." + (1 + random.nextInt(8)),
                  ReadingKind.DC,
                  Math.round((random.nextDouble() * 30 - 15) * 1000) / 1000.0,
                  null,
                  null,
                  "6000-count",
                  opened.plusSeconds(60L * r)));
        }
        notes.add(
            new CaseNote(
                id(random),
                caseId,
                opened.plusSeconds(600),
                sentence(random, 10 + random.nextInt(20)),
                opened.plusSeconds(600)));
        if (closed && !fault.equals("healthy")) {
          String part = fault.substring(0, fault.indexOf(':'));
          actions.add(
              new RepairAction(
                  id(random),
                  caseId,
                  closedAt,
                  ActionKind.PART_REPLACED,
                  part,
                  "old",
                  "new",
                  "",
                  closedAt));
        }
      }
      return bundle(List.of(), List.of(), caseList, readings, notes, actions);
    }
  }

  private static HistoryBundle bundle(
      List<BoardModel> models,
      List<Unit> units,
      List<RepairCase> cases,
      List<StoredReading> readings,
      List<CaseNote> notes,
      List<RepairAction> actions) {
    return new HistoryBundle(
        HistoryBundle.CURRENT_VERSION,
        Instant.EPOCH,
        "generator",
        models,
        List.of(),
        units,
        cases,
        readings,
        List.of(),
        actions,
        notes);
  }

  private static String sentence(Random random, int words) {
    StringBuilder text = new StringBuilder();
    for (int w = 0; w < words; w++) {
      if (w > 0) {
        text.append(' ');
      }
      text.append(textWord(random));
    }
    return text.toString();
  }

  private static String id(Random random) {
    return new UUID(
            (random.nextLong() & ~0xF000L) | 0x4000L,
            (random.nextLong() & 0x3FFFFFFFFFFFFFFFL) | 0x8000000000000000L)
        .toString();
  }
}
