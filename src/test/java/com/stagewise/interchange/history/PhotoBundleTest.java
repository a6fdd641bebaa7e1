package com.stagewise.interchange.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.Cases;
import com.stagewise.history.ExportSelection;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ImportReport;
import com.stagewise.history.TestPictures;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import com.stagewise.history.sqlite.SqliteHistory;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.Base64;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Bundles carry photos of the board (format 4): the picture in Base64 (RFC 4648) pieces, read back
 * byte for byte; a bundle of format 3, written before photos, still imports; a photo that is not a
 * picture or not Base64 is refused naming its field.
 */
class PhotoBundleTest {
  @TempDir Path folder;

  private final Clock clock = Clock.fixed(Instant.parse("2026-03-04T10:15:30Z"), ZoneOffset.UTC);
  private final ObjectMapper json = new ObjectMapper();

  /** A real PNG with 1.5 MB of noise after its end, which PNG readers skip (ISO/IEC 15948). */
  private static byte[] largePng() {
    byte[] png = TestPictures.png(32, 24);
    byte[] noise = new byte[1_500_000];
    new Random(20261203).nextBytes(noise);
    byte[] all = java.util.Arrays.copyOf(png, png.length + noise.length);
    System.arraycopy(noise, 0, all, png.length, noise.length);
    return all;
  }

  private HistoryBundle exportWith(Path file, byte[] picture) {
    try (HistoryStore store = SqliteHistory.open(file, clock)) {
      BoardModel model = store.units().boardModel("MX-8", "");
      Unit unit = store.units().add("NF-1", model.id(), "");
      RepairCase rc = store.cases().open(unit.id(), "hum");
      if (picture != null) {
        store.cases().attachPhoto(rc.id(), new Cases.PhotoDraft("top.png", picture, "Ann"));
      }
      return store.transfer().export(new ExportSelection.All(), "test");
    }
  }

  private static HistoryBundle read(String text) {
    return HistoryBundleJson.read(
        new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), "shop.json");
  }

  @Test
  void writeAndRead_keepsThePictureByteForByte_inPiecesNoLongerThanTheStringLimit()
      throws Exception {
    byte[] picture = largePng();
    HistoryBundle bundle = exportWith(folder.resolve("a.db"), picture);
    String text = HistoryBundleJson.toJson(bundle);
    JsonNode tree = json.readTree(text);
    assertThat(tree.get("version").asInt()).isEqualTo(HistoryBundle.CURRENT_VERSION);
    JsonNode photo = tree.get("photos").get(0);
    assertThat(photo.get("fileName").asText()).isEqualTo("top.png");
    assertThat(photo.get("mediaType").asText()).isEqualTo("image/png");
    assertThat(photo.get("attachedBy").asText()).isEqualTo("Ann");
    assertThat(photo.get("attachedAt").asText()).isEqualTo("2026-03-04T10:15:30Z");
    // 1.5 MB is 2 million Base64 characters: more than one piece, none over the limit.
    assertThat(photo.get("image").size()).isEqualTo(3);
    for (JsonNode piece : photo.get("image")) {
      assertThat(piece.asText().length()).isLessThanOrEqualTo(PhotoFields.PIECE);
    }

    HistoryBundle back = read(text);
    assertThat(back.photos()).isEqualTo(bundle.photos());
    assertThat(back.photos().get(0).image()).isEqualTo(picture);
    try (HistoryStore other = SqliteHistory.open(folder.resolve("b.db"), clock)) {
      ImportReport report = other.transfer().importBundle(back, "shop.json");
      assertThat(report.conflicts()).isEmpty();
      CasePhoto there =
          other.cases().caseFile(back.cases().get(0).id()).orElseThrow().photos().get(0);
      assertThat(other.cases().photo(there.id()).orElseThrow().image()).isEqualTo(picture);
    }
  }

  @Test
  void readingsAfterRepair_writeAndRead_withTheirBands_andABandlessOne() throws Exception {
    HistoryBundle bundle;
    try (HistoryStore store = SqliteHistory.open(folder.resolve("a.db"), clock)) {
      BoardModel model = store.units().boardModel("MX-8", "");
      Unit unit = store.units().add("NF-1", model.id(), "");
      RepairCase rc = store.cases().open(unit.id(), "hum");
      store
          .cases()
          .addAfterRepair(
              rc.id(),
              java.util.List.of(
                  new com.stagewise.history.record.AfterRepairReading(
                      HistoryStore.newId(),
                      rc.id(),
                      "OUT",
                      -4.71,
                      "m",
                      clock.instant(),
                      -4.8,
                      -4.6),
                  new com.stagewise.history.record.AfterRepairReading(
                      HistoryStore.newId(),
                      rc.id(),
                      "SUM",
                      0.001,
                      "m",
                      clock.instant(),
                      null,
                      null)));
      bundle = store.transfer().export(new ExportSelection.All(), "test");
    }
    String text = HistoryBundleJson.toJson(bundle);
    JsonNode entry = json.readTree(text).get("afterRepair").get(0);
    assertThat(entry.get("healthyLow").asDouble()).isEqualTo(-4.8);
    assertThat(json.readTree(text).get("afterRepair").get(1).has("healthyLow")).isFalse();
    assertThat(read(text).afterRepair()).isEqualTo(bundle.afterRepair()).hasSize(2);
  }

  @Test
  void aFormat3Bundle_writtenBeforePhotos_stillImports() throws Exception {
    HistoryBundle bundle = exportWith(folder.resolve("a.db"), null);
    ObjectNode tree = (ObjectNode) json.readTree(HistoryBundleJson.toJson(bundle));
    tree.put("version", 3);
    tree.remove("photos");
    HistoryBundle old = read(json.writeValueAsString(tree));
    assertThat(old.version()).isEqualTo(3);
    assertThat(old.photos()).isEmpty();
    try (HistoryStore other = SqliteHistory.open(folder.resolve("b.db"), clock)) {
      ImportReport report = other.transfer().importBundle(old, "old.json");
      assertThat(report.conflicts()).isEmpty();
      assertThat(other.cases().find(bundle.cases().get(0).id())).isPresent();
    }
  }

  @Test
  void aPhotoThatIsNotAPicture_isRefusedNamingItsField_andNothingIsImported() throws Exception {
    HistoryBundle bundle = exportWith(folder.resolve("a.db"), TestPictures.png(8, 8));
    ObjectNode tree = (ObjectNode) json.readTree(HistoryBundleJson.toJson(bundle));
    ObjectNode photo = (ObjectNode) tree.get("photos").get(0);
    ArrayNode pieces = photo.putArray("image");
    pieces.add(
        Base64.getEncoder().encodeToString("not a picture".getBytes(StandardCharsets.US_ASCII)));
    HistoryBundle bad = read(json.writeValueAsString(tree));
    try (HistoryStore other = SqliteHistory.open(folder.resolve("b.db"), clock)) {
      assertThatThrownBy(() -> other.transfer().importBundle(bad, "shop.json"))
          .isInstanceOf(InvalidInputException.class)
          .hasMessageContaining("photos[0].image")
          .hasMessageContaining("PNG or JPEG");
      assertThat(other.isEmpty()).isTrue();
    }
  }

  @Test
  void aPhotoThatIsNotBase64_isRefusedNamingItsField() throws Exception {
    HistoryBundle bundle = exportWith(folder.resolve("a.db"), TestPictures.png(8, 8));
    ObjectNode tree = (ObjectNode) json.readTree(HistoryBundleJson.toJson(bundle));
    ((ObjectNode) tree.get("photos").get(0)).putArray("image").add("*** not base64 ***");
    assertThatThrownBy(() -> read(json.writeValueAsString(tree)))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("photos[0].image")
        .hasMessageContaining("Base64");
  }
}
