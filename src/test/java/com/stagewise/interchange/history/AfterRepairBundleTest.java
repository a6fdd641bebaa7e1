package com.stagewise.interchange.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowable;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.AfterRepairReading;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.ReadingKind;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Readings after the repair in a bundle: format 6 carries their kind, an AC reading's measure and
 * frequency, an ohms reading's second point and "OL"; a DC level is written as format 5 wrote it,
 * and a format-5 entry (no kind) reads as DC volts. What comes in is checked like a readings file's
 * readings, each refusal naming the bundle and the field. Values: the textbook inverting amplifier
 * (0.332 V RMS out for 0.1 V peak in at gain 4.7; R2 = 47 kΩ ± 1 %, power off).
 */
class AfterRepairBundleTest {
  private static final Instant AT = Instant.parse("2026-05-06T09:10:11Z");

  private static AfterRepairReading dc() {
    return new AfterRepairReading("a1", "c1", "OUT", -4.71, "meter", AT, -4.8, -4.6);
  }

  private static AfterRepairReading ac(String measure, double value) {
    return new AfterRepairReading(
        "a2", "c1", "OUT", value, "scope", AT, 0.329, 0.336, ReadingKind.AC, measure, 1000.0, "");
  }

  private static AfterRepairReading ohms(double value, double low, double high) {
    return new AfterRepairReading(
        "a3",
        "c1",
        "SUM",
        value,
        "meter, ohms",
        AT,
        low,
        high,
        ReadingKind.OHMS,
        null,
        null,
        "OUT");
  }

  private static String bundle(int version, String... entries) {
    return "{\"format\": \"stagewise-history\", \"version\": "
        + version
        + ", \"exportedAt\": \""
        + AT
        + "\", \"programVersion\": \"t\", \"afterRepair\": ["
        + String.join(", ", entries)
        + "]}";
  }

  private static String tree(AfterRepairReading r) {
    return AfterRepairFields.tree(r).toString();
  }

  private static HistoryBundle read(String json) {
    return HistoryBundleJson.read(
        new ByteArrayInputStream(json.getBytes(StandardCharsets.UTF_8)), "shop.bundle.json");
  }

  private static String refused(String json) {
    Throwable thrown = catchThrowable(() -> read(json));
    assertThat(thrown).isInstanceOf(InvalidInputException.class);
    return thrown.getMessage();
  }

  @Test
  void format6_roundTrips_everyKind_andWritesDcAsFormat5Did() {
    AfterRepairReading open = ohms(Double.POSITIVE_INFINITY, 46_530, 47_470);
    AfterRepairReading toRail =
        ohms(Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY);
    String json = bundle(6, tree(dc()), tree(ac("rms", 0.333)), tree(ac("pp", 0.94)), tree(open));
    assertThat(tree(dc())).doesNotContain("kind", "measure", "hz", "\"to\"");
    assertThat(tree(ac("rms", 0.333)))
        .contains("\"kind\":\"ac\"", "\"measure\":\"rms\"", "\"hz\":1000.0");
    assertThat(tree(open)).contains("\"kind\":\"ohms\"", "\"to\":\"OUT\"", "\"value\":\"OL\"");
    assertThat(tree(toRail)).contains("\"healthyLow\":\"OL\"", "\"healthyHigh\":\"OL\"");
    assertThat(read(json).afterRepair())
        .containsExactly(dc(), ac("rms", 0.333), ac("pp", 0.94), open);
    assertThat(read(bundle(6, tree(toRail))).afterRepair()).containsExactly(toRail);

    HistoryBundle whole =
        new HistoryBundle(
            HistoryBundle.CURRENT_VERSION,
            AT,
            "t",
            List.of(),
            List.of(),
            List.of(),
            List.of(),
            List.of(),
            List.of(),
            List.of(),
            List.of(),
            List.of(),
            List.of(dc(), ac("rms", 0.333), open));
    String written = HistoryBundleJson.toJson(whole);
    assertThat(written).contains("\"version\" : 6");
    assertThat(read(written).afterRepair()).isEqualTo(whole.afterRepair());
  }

  @Test
  void format5Entry_withoutKind_readsAsDcVolts() {
    String v5 =
        "{\"id\": \"a1\", \"caseId\": \"c1\", \"at\": \"OUT\", \"value\": -4.71, \"meter\":"
            + " \"meter\", \"takenAt\": \""
            + AT
            + "\", \"healthyLow\": -4.8, \"healthyHigh\": -4.6}";
    AfterRepairReading r = read(bundle(5, v5)).afterRepair().get(0);
    assertThat(r).isEqualTo(dc());
    assertThat(r.kind()).isEqualTo(ReadingKind.DC);
    assertThat(r.inside()).isTrue();
    // The keys of format 6 are unknown in a format-5 bundle, as any unknown key is.
    assertThat(refused(bundle(5, tree(ac("rms", 0.333)))))
        .contains("shop.bundle.json", "afterRepair[0].kind", "unknown key");
  }

  @Test
  void badEntries_areRefused_namingTheBundleAndTheField() {
    String rms = tree(ac("rms", 0.333));
    assertThat(refused(bundle(6, rms.replace(",\"measure\":\"rms\"", ""))))
        .contains("shop.bundle.json", "afterRepair[0].measure", "rms, peak or pp");
    assertThat(refused(bundle(6, rms.replace("\"rms\"", "\"average\""))))
        .contains("afterRepair[0].measure", "\"average\"");
    assertThat(refused(bundle(6, rms.replace("\"kind\":\"ac\"", "\"kind\":\"dB\""))))
        .contains("afterRepair[0].kind", "dc, ac or ohms");
    assertThat(refused(bundle(6, tree(dc()).replace("\"at\":\"OUT\"", "\"at\":\"OUT\",\"hz\":50"))))
        .contains("afterRepair[0].hz", "only an ac reading");
    // A frequency no signal generator gives (ReadingRules: the readings file's range).
    assertThat(refused(bundle(6, rms.replace("1000.0", "1.0E12")))).contains("afterRepair[0].hz");
    // 1e6 V is far beyond any rail (the readings file's plausibility rule).
    assertThat(refused(bundle(6, tree(dc()).replace("-4.71", "1000000"))))
        .contains("afterRepair[0].value", "far beyond");
    assertThat(
            refused(bundle(6, tree(dc()).replace("\"healthyHigh\":-4.6", "\"healthyHigh\":1e9"))))
        .contains("afterRepair[0].healthyHigh");
    String open = tree(ohms(Double.POSITIVE_INFINITY, 46_530, 47_470));
    assertThat(refused(bundle(6, open.replace("\"OL\"", "\"ol\""))))
        .contains("afterRepair[0].value", "\"OL\"");
    assertThat(refused(bundle(6, open.replace(",\"to\":\"OUT\"", ""))))
        .contains("afterRepair[0].to");
    assertThat(refused(bundle(6, open.replace("\"value\":\"OL\"", "\"value\":-5"))))
        .contains("afterRepair[0].value");
    // OL is an ohms reading's word only.
    assertThat(refused(bundle(6, tree(dc()).replace("-4.71", "\"OL\""))))
        .contains("afterRepair[0].value");
  }
}
