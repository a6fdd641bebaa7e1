package com.stagewise.interchange.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowable;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.StoredReading;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * A bundle's readings carry their AC measure ({@code "measure": "rms"} or {@code "pp"}); a peak
 * reading is written as before (no key), so older programs still read it, and a bad measure is
 * refused with the bundle, the path and the words expected.
 */
class MeasureBundleTest {
  private static final Instant AT = Instant.parse("2026-05-06T09:10:11Z");

  private static StoredReading ac(String id, String measure) {
    return new StoredReading(
        id, "c1", "OUT", ReadingKind.AC, 0.33, 1000.0, null, "scope", AT, "", null, null, measure);
  }

  private static String readingsOnly(StoredReading... readings) {
    return "{\"format\": \"stagewise-history\", \"version\": 2, \"exportedAt\": \""
        + AT
        + "\", \"programVersion\": \"t\", \"readings\": ["
        + String.join(
            ", ", List.of(readings).stream().map(r -> BundleTrees.tree(r).toString()).toList())
        + "]}";
  }

  private static HistoryBundle read(String json) {
    return HistoryBundleJson.read(
        new ByteArrayInputStream(json.getBytes(StandardCharsets.UTF_8)), "case.bundle.json");
  }

  @Test
  void measures_roundTrip_andPeakIsWrittenAsBefore() {
    String json = readingsOnly(ac("r1", "rms"), ac("r2", "pp"), ac("r3", null), ac("r4", "peak"));
    assertThat(json).contains("\"measure\":\"rms\"", "\"measure\":\"pp\"");
    assertThat(json.split("\"measure\"", -1)).hasSize(3);
    HistoryBundle bundle = read(json);
    assertThat(bundle.readings())
        .extracting(StoredReading::measureWord)
        .containsExactly("rms", "pp", "peak", "peak");
    assertThat(bundle.readings().get(0)).isEqualTo(ac("r1", "rms"));
  }

  @Test
  void badMeasure_isRefusedNamingTheBundleAndThePath() {
    String json = readingsOnly(ac("r1", "rms")).replace("\"rms\"", "\"average\"");
    Throwable thrown = catchThrowable(() -> read(json));
    assertThat(thrown).isInstanceOf(InvalidInputException.class);
    assertThat(thrown.getMessage())
        .contains("case.bundle.json", "readings[0].measure", "rms, peak or pp", "\"average\"");
  }

  @Test
  void measureOnADcReading_isRefused() {
    String json =
        readingsOnly(ac("r1", "rms"))
            .replace("\"kind\":\"ac\"", "\"kind\":\"dc\"")
            .replace(",\"hz\":1000.0", "");
    Throwable thrown = catchThrowable(() -> read(json));
    assertThat(thrown).isInstanceOf(InvalidInputException.class);
    assertThat(thrown.getMessage()).contains("readings[0].measure", "only an ac reading");
  }
}
