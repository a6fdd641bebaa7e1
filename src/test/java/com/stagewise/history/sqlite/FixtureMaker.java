package com.stagewise.history.sqlite;

import com.stagewise.history.HistoryStore;
import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;

/**
 * Makes the fixture database of an earlier schema version, kept under {@code
 * src/test/resources/com/stagewise/history/sqlite/fixtures/schema-v<n>.db} for the migration test.
 *
 * <p>Run once when a new schema version is added, for the version it replaces (see DEVELOPERS.md):
 * {@code java -cp target/test-classes:target/classes:<deps>
 * com.stagewise.history.sqlite.FixtureMaker 1}.
 */
public final class FixtureMaker {
  /** The symptom of the fixture's closed case, which the migration test searches for. */
  static final String CLOSED_SYMPTOM = "Right channel distorts above half volume";

  /** The note of the fixture's closed case. */
  static final String NOTE = "Replaced the output op-amp; the distortion went away";

  private FixtureMaker() {}

  public static void main(String[] args) throws Exception {
    int version = Integer.parseInt(args[0]);
    Path target =
        Path.of(
            "src/test/resources/com/stagewise/history/sqlite/fixtures/schema-v" + version + ".db");
    Files.createDirectories(target.getParent());
    Files.deleteIfExists(target);
    make(target, version);
  }

  static void make(Path target, int version) {
    Clock clock = Clock.fixed(Instant.parse("2025-06-01T12:00:00Z"), ZoneOffset.UTC);
    try (HistoryStore store = SqliteHistory.open(target, clock, version)) {
      BoardModel model = store.units().boardModel("MX-8 main board", "Northfield Audio (invented)");
      store
          .library()
          .add(model.id(), "Output driver", "{\"format\": \"stagewise-stage\", \"version\": 1}");
      Unit unit = store.units().add("NF-8-0100", model.id(), "job 2025-117");
      RepairCase closed = store.cases().open(unit.id(), CLOSED_SYMPTOM);
      store.cases().addNote(closed.id(), NOTE);
      store
          .cases()
          .addAction(closed.id(), ActionKind.PART_REPLACED, "U3", "dual op-amp", "dual op-amp", "");
      store.cases().close(closed.id(), Outcome.FIXED, List.of("U3B:dead"));
      store.cases().open(unit.id(), "Crackles when cold");
    }
  }
}
