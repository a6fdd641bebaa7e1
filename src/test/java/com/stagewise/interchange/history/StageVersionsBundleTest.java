package com.stagewise.interchange.history;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.stagewise.history.ExportSelection;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StageSheetRecord;
import com.stagewise.history.record.Unit;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Bundles carry library stage versions, and bundles written before them still import. */
class StageVersionsBundleTest {
  private static final String SHEET = HistoryFixtures.SHEET;

  /** The same stage with R1 changed from 10k to 22k: an edit, a later version. */
  private static final String EDITED = SHEET.replace("\"10k\"", "\"22k\"");

  @TempDir Path folder;

  private final Clock clock = Clock.fixed(Instant.parse("2026-03-04T10:15:30Z"), ZoneOffset.UTC);

  @Test
  void writeAndRead_keepsEveryVersionWithWhoAndWhen_andTheCasesVersion() throws Exception {
    try (HistoryStore store = SqliteHistory.open(folder.resolve("a.db"), clock)) {
      BoardModel model = store.units().boardModel("MX-8", "");
      Unit unit = store.units().add("NF-1", model.id(), "");
      RepairCase rc = store.cases().open(unit.id(), "hum");
      store.library().save(model.id(), "Input buffer", SHEET, "Ann");
      StageSheetRecord used = store.library().useForCase(rc.id(), "Input buffer", EDITED, "Ben");
      HistoryBundle bundle = store.transfer().export(new ExportSelection.All(), "test");

      String json = HistoryBundleJson.toJson(bundle);
      JsonNode tree = new ObjectMapper().readTree(json);
      assertThat(tree.get("version").asInt()).isEqualTo(HistoryBundle.CURRENT_VERSION);
      JsonNode second = tree.get("stageSheets").get(1);
      assertThat(second.get("version").asInt()).isEqualTo(2);
      assertThat(second.get("savedBy").asText()).isEqualTo("Ben");
      assertThat(second.get("savedAt").asText()).isEqualTo("2026-03-04T10:15:30Z");
      assertThat(tree.get("cases").get(0).get("stageSheetId").asText()).isEqualTo(used.id());

      HistoryBundle back =
          HistoryBundleJson.read(
              new ByteArrayInputStream(json.getBytes(StandardCharsets.UTF_8)), "shop.json");
      assertThat(back.stageSheets()).isEqualTo(bundle.stageSheets());
      assertThat(back.cases()).isEqualTo(bundle.cases());
    }
  }

  /**
   * A bundle as the program wrote it before versions (format version 2): its stage sheets carry no
   * version, nobody who saved them, and its cases name no stage.
   */
  @Test
  void versionTwoBundle_imports_itsSheetsBecomeVersionsOfTheirStage() throws Exception {
    String older =
        """
        {"format": "stagewise-history", "version": 2,
         "exportedAt": "2026-01-10T08:00:00Z", "programVersion": "0.9",
         "boardModels": [{"id": "0b6c2f9a-43a8-4a7e-9f0e-7a1c5d6e8f01", "name": "MX-8",
                          "maker": "", "notes": "", "updatedAt": "2026-01-10T08:00:00Z"}],
         "stageSheets": [
           {"id": "1c7d3e0b-54b9-4b8f-8a1f-8b2d6e7f9a02",
            "boardModelId": "0b6c2f9a-43a8-4a7e-9f0e-7a1c5d6e8f01", "title": "Input buffer",
            "sheet": %s, "updatedAt": "2026-01-10T08:00:00Z"},
           {"id": "2d8e4f1c-65ca-4c90-9b20-9c3e7f80ab03",
            "boardModelId": "0b6c2f9a-43a8-4a7e-9f0e-7a1c5d6e8f01", "title": "Input buffer",
            "sheet": %s, "updatedAt": "2026-01-11T08:00:00Z"}],
         "units": [{"id": "3e9f5021-76db-4da1-8c31-ad4f8091bc04", "serial": "NF-2",
                    "boardModelId": "0b6c2f9a-43a8-4a7e-9f0e-7a1c5d6e8f01", "owner": "",
                    "updatedAt": "2026-01-10T08:00:00Z"}],
         "cases": [{"id": "4fa06132-87ec-4eb2-9d42-be5091a2cd05",
                    "unitId": "3e9f5021-76db-4da1-8c31-ad4f8091bc04",
                    "openedAt": "2026-01-10T08:00:00Z", "symptom": "hum", "status": "open",
                    "confirmedFaults": [], "updatedAt": "2026-01-10T08:00:00Z"}]}
        """
            .formatted(
                new ObjectMapper().writeValueAsString(SHEET),
                new ObjectMapper().writeValueAsString(EDITED));
    HistoryBundle bundle =
        HistoryBundleJson.read(
            new ByteArrayInputStream(older.getBytes(StandardCharsets.UTF_8)), "older.json");
    assertThat(bundle.numbersStageVersions()).isFalse();

    try (HistoryStore store = SqliteHistory.open(folder.resolve("b.db"), clock)) {
      BoardModel model = store.units().boardModel("MX-8", "");
      // This bench kept the first sheet's text already, under an id of its own.
      store.library().save(model.id(), "Input buffer", SHEET, "Ann");

      store.transfer().importBundle(bundle, "older.json");

      assertThat(store.library().versions(model.id(), "input buffer"))
          .extracting(s -> s.version() + " " + s.savedBy() + " " + s.sheetJson().length())
          .containsExactly("2  " + EDITED.length(), "1 Ann " + SHEET.length());
      StageSheetRecord second = store.library().versions(model.id(), "Input buffer").get(0);
      assertThat(second.savedAt()).isEqualTo(Instant.parse("2026-01-11T08:00:00Z"));
      assertThat(
              store
                  .cases()
                  .find("4fa06132-87ec-4eb2-9d42-be5091a2cd05")
                  .orElseThrow()
                  .stageSheetId())
          .isNull();
    }
  }
}
