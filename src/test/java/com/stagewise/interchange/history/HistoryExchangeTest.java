package com.stagewise.interchange.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.ExportSelection;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.StoredSuspect;
import com.stagewise.history.record.SuspectListRecord;
import com.stagewise.history.record.Unit;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.util.List;
import java.util.function.Consumer;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class HistoryExchangeTest {
  /** A sound stage sheet (a unity-gain buffer), with a character outside ASCII in its title. */
  static final String SHEET =
      "{\"format\": \"stagewise-stage\", \"version\": 1, \"title\": \"Buffer Ω\","
          + " \"rails\": [{\"net\": \"VCC\", \"volts\": 15}, {\"net\": \"VEE\", \"volts\": -15}],"
          + " \"inputs\": [{\"net\": \"IN\", \"dc\": 1}],"
          + " \"parts\": [{\"ref\": \"R1\", \"kind\": \"resistor\", \"value\": \"10k\","
          + " \"nets\": [\"OUT\", \"GND\"]}],"
          + " \"amplifiers\": [{\"ref\": \"U1A\", \"package\": \"U1\", \"packageType\": \"dual-8\","
          + " \"section\": \"A\", \"class\": \"classic-bipolar\", \"inPlus\": \"IN\","
          + " \"inMinus\": \"OUT\", \"out\": \"OUT\", \"vPlus\": \"VCC\", \"vMinus\": \"VEE\"}]}";

  /** Text that tends to break storage, escaping or search: quotes, SQL, unicode, line breaks. */
  static final String AWKWARD =
      "It's \"dead\"; '); DROP TABLE unit;-- 100 % \\ back\\slash\ttab\nnew line — Ω µ ü ß 中文 עברית"
          + " 🔧 e\u0301 (combining) \u200b zero-width";

  @TempDir Path folder;
  private final TickingClock clock = new TickingClock(Instant.parse("2026-02-01T08:00:00Z"));

  @Test
  void exportThenImport_intoEmptyHistory_bringsEverythingExactly() {
    try (HistoryStore a = open("a.db");
        HistoryStore b = open("b.db")) {
      fill(a);
      HistoryBundle exported = a.transfer().export(new ExportSelection.All(), "test");
      HistoryBundle parsed = roundTrip(exported);
      assertThat(parsed).isEqualTo(exported);
      ImportReport report = b.transfer().importBundle(parsed, "bundle.json");
      assertThat(report.conflicts()).isEmpty();
      assertThat(report.added()).isEqualTo(exported.size());
      HistoryBundle again = b.transfer().export(new ExportSelection.All(), "test");
      assertThat(withoutExportTime(again)).isEqualTo(withoutExportTime(exported));
      assertThat(b.units().bySerial(AWKWARD_SERIAL).get(0).owner()).isEqualTo(AWKWARD_LINE);
    }
  }

  @Test
  void importTwice_duplicatesNothing() {
    try (HistoryStore a = open("a.db");
        HistoryStore b = open("b.db")) {
      fill(a);
      HistoryBundle bundle = roundTrip(a.transfer().export(new ExportSelection.All(), "test"));
      b.transfer().importBundle(bundle, "x");
      ImportReport second = b.transfer().importBundle(bundle, "x");
      assertThat(second.added()).isZero();
      assertThat(second.updated()).isZero();
      assertThat(second.unchanged()).isEqualTo(bundle.size());
      assertThat(b.transfer().export(new ExportSelection.All(), "t").size())
          .isEqualTo(bundle.size());
    }
  }

  @Test
  void import_newerLocalEdit_isKeptAndReported() {
    try (HistoryStore a = open("a.db");
        HistoryStore b = open("b.db")) {
      fill(a);
      HistoryBundle early = a.transfer().export(new ExportSelection.All(), "t");
      b.transfer().importBundle(early, "x");
      RepairCase open =
          b
              .cases()
              .search(com.stagewise.history.SearchQuery.all().withStatus(CaseStatus.OPEN))
              .stream()
              .map(h -> b.cases().find(h.caseId()).orElseThrow())
              .findFirst()
              .orElseThrow();
      // Bench B closes the case; then a stale copy from A (still open, older) arrives.
      b.cases().close(open.id(), Outcome.FIXED, List.of("C7:short"));
      ImportReport report = b.transfer().importBundle(early, "x");
      assertThat(report.conflicts())
          .extracting(ImportReport.Conflict::id)
          .containsExactly(open.id());
      assertThat(report.conflicts().get(0).reason()).contains("kept the local copy");
      assertThat(b.cases().find(open.id()).orElseThrow().status()).isEqualTo(CaseStatus.CLOSED);
    }
  }

  @Test
  void import_newerBundleCopy_replacesTheOlderLocalOne() {
    try (HistoryStore a = open("a.db");
        HistoryStore b = open("b.db")) {
      fill(a);
      b.transfer().importBundle(a.transfer().export(new ExportSelection.All(), "t"), "x");
      String openId =
          a.cases()
              .search(com.stagewise.history.SearchQuery.all().withStatus(CaseStatus.OPEN))
              .get(0)
              .caseId();
      a.cases().close(openId, Outcome.RETURNED, List.of());
      ImportReport report =
          b.transfer().importBundle(a.transfer().export(new ExportSelection.All(), "t"), "x");
      assertThat(report.updated()).isEqualTo(1);
      assertThat(report.conflicts()).isEmpty();
      assertThat(b.cases().find(openId).orElseThrow().outcome()).isEqualTo(Outcome.RETURNED);
    }
  }

  @Test
  void import_sameModelAndSerialUnderOtherIds_matchesInsteadOfDuplicating() {
    try (HistoryStore a = open("a.db");
        HistoryStore b = open("b.db")) {
      BoardModel ma = a.units().boardModel("PSU-30", "");
      Unit ua = a.units().add("H-1", ma.id(), "");
      a.cases().open(ua.id(), "dead on arrival");
      BoardModel mb = b.units().boardModel("psu-30", "");
      Unit ub = b.units().add("H-1", mb.id(), "");
      ImportReport report =
          b.transfer()
              .importBundle(roundTrip(a.transfer().export(new ExportSelection.All(), "t")), "x");
      assertThat(report.matched()).hasSize(2);
      assertThat(b.units().boardModels()).hasSize(1);
      assertThat(b.units().bySerial("H-1")).containsExactly(ub);
      assertThat(b.cases().unitHistory(ub.id()).orElseThrow().cases()).hasSize(1);
    }
  }

  @Test
  void export_selections_holdWhatTheyRefer() {
    try (HistoryStore a = open("a.db")) {
      fill(a);
      Unit unit = a.units().bySerial("NF-8-0001").get(0);
      HistoryBundle one = a.transfer().export(new ExportSelection.OneUnit(unit.id()), "t");
      assertThat(one.units()).containsExactly(unit);
      assertThat(one.boardModels()).extracting(BoardModel::id).containsExactly(unit.boardModelId());
      assertThat(one.cases()).allMatch(c -> c.unitId().equals(unit.id())).hasSize(1);
      assertThat(one.stageSheets()).hasSize(1);
      HistoryBundle model =
          a.transfer().export(new ExportSelection.OneBoardModel(unit.boardModelId()), "t");
      assertThat(model.units()).hasSize(2);
      Instant firstOpened =
          a.transfer().export(new ExportSelection.All(), "t").cases().get(0).openedAt();
      HistoryBundle range =
          a.transfer()
              .export(
                  new ExportSelection.OpenedBetween(firstOpened, firstOpened.plusMillis(1)), "t");
      assertThat(range.cases()).hasSize(1);
      assertThat(range.units()).hasSize(1);
      assertThat(range.boardModels()).hasSize(1);
      // A selection is importable on its own.
      try (HistoryStore c = open("c.db")) {
        assertThat(c.transfer().importBundle(roundTrip(range), "x").conflicts()).isEmpty();
      }
    }
  }

  static Stream<Arguments> hostileBundles() {
    return Stream.of(
        Arguments.of(
            "broken JSON",
            (Consumer<ObjectNode>) null,
            "{\"format\": \"stagewise-history\", \"version\": 1,",
            "the text ends too early at line 1, column 46"),
        Arguments.of(
            "trailing data",
            null,
            "{\"format\": \"stagewise-history\", \"version\": 1} {}",
            "there is more text after the end of the JSON object"),
        Arguments.of(
            "duplicate key",
            null,
            "{\"format\": \"stagewise-history\", \"version\": 1, \"version\": 1}",
            "key \"version\" appears twice in one object"),
        Arguments.of("not an object", null, "[1, 2]", "expected a history bundle as a JSON object"),
        Arguments.of(
            "newer version",
            edit(r -> r.put("version", HistoryBundle.CURRENT_VERSION + 1)),
            null,
            "version: bundle format version " + (HistoryBundle.CURRENT_VERSION + 1) + " is newer"),
        Arguments.of(
            "wrong format", edit(r -> r.put("format", "stagewise-stage")), null, "format:"),
        Arguments.of("unknown key", edit(r -> r.put("extra", true)), null, "extra: unknown key"),
        Arguments.of(
            "wrong type",
            edit(r -> first(r, "readings").put("value", "13.4")),
            null,
            "readings[0].value: expected the reading's value (a number), found the string"),
        Arguments.of(
            "wrong type of list",
            edit(r -> r.put("cases", "none")),
            null,
            "cases: expected an array"),
        Arguments.of(
            "bad status",
            edit(r -> first(r, "cases").put("status", "maybe")),
            null,
            "cases[0].status"),
        Arguments.of(
            "bad time", edit(r -> first(r, "notes").put("at", "yesterday")), null, "notes[0].at"),
        Arguments.of(
            "huge string",
            edit(r -> first(r, "notes").put("text", "x".repeat(3_000_000))),
            null,
            "holds a text longer than 2100000 characters"),
        Arguments.of(
            "long note",
            edit(r -> first(r, "notes").put("text", "x".repeat(60_000))),
            null,
            "notes[0].text: is too long"),
        Arguments.of(
            "line break in serial",
            edit(r -> first(r, "units").put("serial", "A\nB")),
            null,
            "units[0].serial"),
        Arguments.of(
            "bad id",
            edit(r -> first(r, "units").put("id", "1; DROP TABLE unit")),
            null,
            "units[0].id: expected an id"),
        Arguments.of(
            "duplicate id",
            edit(
                r ->
                    ((ObjectNode) r.get("notes").get(0))
                        .put("id", r.get("readings").get(0).get("id").textValue())),
            null,
            "appears twice"),
        Arguments.of(
            "id of the wrong kind",
            edit(
                r ->
                    first(r, "readings")
                        .put("caseId", r.get("units").get(0).get("id").textValue())),
            null,
            "readings[0].caseId: expected the id of a case, but"),
        Arguments.of(
            "dangling reference",
            edit(r -> first(r, "cases").put("unitId", "00000000-0000-4000-8000-000000000000")),
            null,
            "cases[0].unitId: no unit"),
        Arguments.of(
            "bad fault id",
            edit(r -> ((ArrayNode) r.get("cases").get(0).get("confirmedFaults")).add("R2 is open")),
            null,
            "cases[0].confirmedFaults"),
        Arguments.of(
            "NaN",
            null,
            "{\"format\":\"stagewise-history\",\"version\":1,\"readings\":[{\"id\":\"x\","
                + "\"caseId\":\"y\",\"at\":\"OUT\",\"kind\":\"dc\",\"value\":NaN}]}",
            "readings[0].value: expected the reading's value as a finite number, found a number that is not finite (\"NaN\", which JSON does not allow)"),
        Arguments.of(
            "stage sheet that is not JSON",
            edit(r -> first(r, "stageSheets").put("sheet", "not json at all")),
            null,
            "stageSheets[0].sheet: not valid JSON"),
        Arguments.of(
            "empty stage sheet",
            edit(r -> first(r, "stageSheets").put("sheet", "{}")),
            null,
            "stageSheets[0].sheet.format: missing field"),
        Arguments.of(
            "stage sheet with a negative resistor",
            edit(r -> first(r, "stageSheets").put("sheet", SHEET.replace("\"10k\"", "\"-10k\""))),
            null,
            "stageSheets[0].sheet.parts[0].value"),
        Arguments.of(
            "bad reading named by the bundle, not the history",
            edit(r -> first(r, "readings").put("at", "")),
            null,
            "readings[0].at: must not be empty"),
        Arguments.of(
            // Issue 9: readings of 1e308 V were stored with exit 0. Limits.READING_RAIL_FACTOR:
            // 2 × the largest rail (15 V in SHEET) + 1 V = 31 V.
            "reading of 1e308 volts",
            edit(r -> first(r, "readings").put("value", 1e308)),
            null,
            "readings[0].value: dc reading at U1.1 (1.000e+308 V) is far beyond every rail"),
        Arguments.of(
            "reading beyond the rails of its board model's sheet",
            edit(r -> first(r, "readings").put("value", 40)),
            null,
            "expected at most ±31 V"),
        Arguments.of(
            "AC reading at an absurd frequency",
            edit(r -> ((ObjectNode) r.get("readings").get(1)).put("hz", 1e15)),
            null,
            "readings[1].hz: the reading's frequency (1.000e+15 Hz) is outside the plausible range"),
        Arguments.of(
            "reading with an absurd uncertainty",
            edit(r -> ((ObjectNode) r.get("readings").get(1)).put("uncertainty", 1e300)),
            null,
            "readings[1].uncertainty: the uncertainty at OUT"),
        Arguments.of(
            "dc reading with a frequency",
            edit(r -> first(r, "readings").put("hz", 50)),
            null,
            "readings[0].hz"),
        Arguments.of(
            "time far in the future",
            edit(r -> first(r, "notes").put("updatedAt", "2999-01-01T00:00:00Z")),
            null,
            "notes[0].updatedAt: the time 2999-01-01T00:00:00Z lies in the future"),
        Arguments.of(
            "stage version zero",
            edit(r -> first(r, "stageSheets").put("version", 0)),
            null,
            "stageSheets[0].version: expected a version number, 1 or more, found 0"),
        Arguments.of(
            "stage version as text",
            edit(r -> first(r, "stageSheets").put("version", "2")),
            null,
            "stageSheets[0].version: expected a version number, 1 or more (a whole number)"),
        Arguments.of(
            "case names a stage version that is not there",
            edit(r -> first(r, "cases").put("stageSheetId", HistoryStore.newId())),
            null,
            "cases[0].stageSheetId: no stage sheet with id"),
        Arguments.of(
            "closed without outcome",
            edit(r -> first(r, "cases").put("status", "closed").remove("outcome")),
            null,
            "cases[0]"));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("hostileBundles")
  void import_hostileBundle_isRefusedWithTheFieldAndNothingChanges(
      String name, Consumer<ObjectNode> edit, String text, String expected) throws Exception {
    try (HistoryStore a = open("a.db");
        HistoryStore b = open("b.db")) {
      fill(a);
      String json = text;
      if (json == null) {
        ObjectNode tree =
            (ObjectNode)
                new ObjectMapper()
                    .readTree(
                        HistoryBundleJson.toJson(
                            a.transfer().export(new ExportSelection.All(), "t")));
        // Cases are written oldest first; make the first case the closed one for the edits.
        edit.accept(tree);
        json = tree.toString();
      }
      BoardModel before = b.units().boardModel("Local board", "");
      HistoryBundle localBefore = b.transfer().export(new ExportSelection.All(), "t");
      String input = json;
      assertThatThrownBy(
              () ->
                  b.transfer()
                      .importBundle(
                          HistoryBundleJson.read(
                              new ByteArrayInputStream(input.getBytes(StandardCharsets.UTF_8)),
                              "bundle.json"),
                          "bundle.json"))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageStartingWith("bundle.json: ")
          .hasMessageContaining(expected)
          // Each message names the bundle once, not "history", and repeats no prefix.
          .satisfies(
              e -> {
                String message = e.getMessage();
                assertThat(message.indexOf("bundle.json"))
                    .isEqualTo(message.lastIndexOf("bundle.json"));
                assertThat(message)
                    .doesNotStartWith("history")
                    .doesNotContain(
                        "Jackson", "JsonNode", "JsonReadFeature", "StreamReadConstraints");
              });
      assertThat(withoutExportTime(b.transfer().export(new ExportSelection.All(), "t")))
          .isEqualTo(withoutExportTime(localBefore));
      assertThat(b.units().boardModels()).containsExactly(before);
    }
  }

  @Test
  void import_failureAfterSomeRecordsWereWritten_leavesNothing() {
    try (HistoryStore a = open("a.db");
        HistoryStore b = open("b.db")) {
      fill(a);
      HistoryBundle bundle = a.transfer().export(new ExportSelection.All(), "t");
      // A reading whose value is not finite passes the JSON reader only through the API; the
      // check runs before the merge, so add one that breaks the database's CHECK constraint
      // instead:
      // a case that is open but has an outcome is refused by the bundle checks too. Use a unit that
      // refers to a board model missing everywhere, placed after valid records.
      Unit orphan =
          new Unit(HistoryStore.newId(), "ORPHAN", HistoryStore.newId(), "", clock.instant());
      List<Unit> units = new java.util.ArrayList<>(bundle.units());
      units.add(orphan);
      HistoryBundle broken =
          new HistoryBundle(
              1,
              bundle.exportedAt(),
              "t",
              bundle.boardModels(),
              bundle.stageSheets(),
              units,
              bundle.cases(),
              bundle.readings(),
              bundle.suspectLists(),
              bundle.actions(),
              bundle.notes());
      assertThatThrownBy(() -> b.transfer().importBundle(broken, "x"))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("units[" + (units.size() - 1) + "].boardModelId");
      assertThat(b.isEmpty()).isTrue();
    }
  }

  // ---- helpers ----------------------------------------------------------------------------------

  static final String AWKWARD_LINE = AWKWARD.replace('\n', ' ');

  static final String AWKWARD_SERIAL = "SN \"42\"; x'y' — Ω";

  private HistoryStore open(String name) {
    return SqliteHistory.open(folder.resolve(name), clock);
  }

  /** Fills a history with two board models, three units, one closed and two open cases. */
  private void fill(HistoryStore store) {
    BoardModel mixer = store.units().boardModel("MX-8 main board", "Northfield Audio (invented)");
    store.library().add(mixer.id(), "Input buffer", SHEET);
    BoardModel psu = store.units().boardModel("PSU-30", "Harbour Instruments (invented)");
    Unit m1 = store.units().add("NF-8-0001", mixer.id(), "");
    Unit m2 = store.units().add("NF-8-0002", mixer.id(), "job 17");
    Unit p1 = store.units().add(AWKWARD_SERIAL, psu.id(), AWKWARD_LINE);
    RepairCase closed = store.cases().open(m1.id(), "Hum, left channel");
    store
        .cases()
        .addReadings(
            closed.id(),
            List.of(
                new StoredReading(
                    HistoryStore.newId(),
                    closed.id(),
                    "U1.1",
                    ReadingKind.DC,
                    13.41,
                    null,
                    null,
                    "6000-count",
                    clock.instant()),
                new StoredReading(
                    HistoryStore.newId(),
                    closed.id(),
                    "OUT",
                    ReadingKind.AC,
                    0.0,
                    1000.0,
                    0.001,
                    "",
                    clock.instant())),
            new SuspectListRecord(
                HistoryStore.newId(),
                closed.id(),
                clock.instant(),
                "0.1.0",
                "fault",
                List.of(
                    new StoredSuspect("R2:open", 0.7, List.of("R2:open", "R1:high"), AWKWARD, 1),
                    new StoredSuspect("U1A:stuck-high", 0.3, List.of("U1A:stuck-high"), "", 2)),
                "U1.2 dc\nOUT ac 1000 Hz"));
    store.cases().addAction(closed.id(), ActionKind.PART_REPLACED, "R2", "47k", "47k 1%", AWKWARD);
    store.cases().addNote(closed.id(), AWKWARD);
    store.cases().close(closed.id(), Outcome.FIXED, List.of("R2:open"));
    store.cases().open(m2.id(), "No output");
    store.cases().open(p1.id(), AWKWARD);
  }

  private static HistoryBundle roundTrip(HistoryBundle bundle) {
    String json = HistoryBundleJson.toJson(bundle);
    return HistoryBundleJson.read(
        new ByteArrayInputStream(json.getBytes(StandardCharsets.UTF_8)), "bundle.json");
  }

  private static HistoryBundle withoutExportTime(HistoryBundle b) {
    return new HistoryBundle(
        b.version(),
        Instant.EPOCH,
        "",
        b.boardModels(),
        b.stageSheets(),
        b.units(),
        b.cases(),
        b.readings(),
        b.suspectLists(),
        b.actions(),
        b.notes());
  }

  private static Consumer<ObjectNode> edit(Consumer<ObjectNode> edit) {
    return edit;
  }

  private static ObjectNode first(ObjectNode root, String array) {
    JsonNode node = root.get(array).get(0);
    return (ObjectNode) node;
  }

  /** A clock that moves one millisecond every time it is read, so every record has its own time. */
  static final class TickingClock extends Clock {
    private Instant now;

    TickingClock(Instant start) {
      now = start;
    }

    @Override
    public ZoneId getZone() {
      return ZoneOffset.UTC;
    }

    @Override
    public Clock withZone(ZoneId zone) {
      return this;
    }

    @Override
    public synchronized Instant instant() {
      now = now.plusMillis(1);
      return now;
    }
  }
}
