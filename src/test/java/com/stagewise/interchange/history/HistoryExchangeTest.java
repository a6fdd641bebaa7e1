package com.stagewise.interchange.history;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.ExportSelection;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.SteppingClock;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HistoryExchangeTest {
  static final String SHEET = HistoryFixtures.SHEET;
  static final String AWKWARD = HistoryFixtures.AWKWARD;
  static final String AWKWARD_LINE = HistoryFixtures.AWKWARD_LINE;
  static final String AWKWARD_SERIAL = HistoryFixtures.AWKWARD_SERIAL;

  @TempDir Path folder;
  private final SteppingClock clock =
      new SteppingClock(Instant.parse("2026-02-01T08:00:00Z"), Duration.ofMillis(1));

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

  // ---- helpers ----------------------------------------------------------------------------------

  private HistoryStore open(String name) {
    return HistoryFixtures.open(folder, name, clock);
  }

  private void fill(HistoryStore store) {
    HistoryFixtures.fill(store, clock);
  }

  private static HistoryBundle withoutExportTime(HistoryBundle b) {
    return HistoryFixtures.withoutExportTime(b);
  }

  private static HistoryBundle roundTrip(HistoryBundle bundle) {
    String json = HistoryBundleJson.toJson(bundle);
    return HistoryBundleJson.read(
        new ByteArrayInputStream(json.getBytes(StandardCharsets.UTF_8)), "bundle.json");
  }
}
