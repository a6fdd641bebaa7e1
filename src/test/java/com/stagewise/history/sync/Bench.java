package com.stagewise.history.sync;

import com.stagewise.history.ExportSelection;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ServerAddress;
import com.stagewise.history.StorageException;
import com.stagewise.history.SyncLedger;
import com.stagewise.history.postgres.PgHistory;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.ReadingKind;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredReading;
import com.stagewise.history.record.Unit;
import com.stagewise.history.sqlite.SqliteHistory;
import java.nio.file.Path;
import java.time.Clock;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;

/**
 * A simulated bench for the sync tests: a history file that adds cases (with readings, a note and a
 * close-out) and syncs with the server. Also run as its own process ({@link #main}).
 */
final class Bench {
  static final String MODEL = "MX-8 main board";

  private Bench() {}

  /** Adds one case on unit {@code serial}: two readings, a note, closed fixed with R2 open. */
  static RepairCase addCase(HistoryStore store, String serial, int i) {
    String modelId = store.units().boardModel(MODEL, "Northfield Audio").id();
    Unit unit =
        store.units().bySerial(serial).stream()
            .findFirst()
            .orElseGet(() -> store.units().add(serial, modelId, ""));
    RepairCase c = store.cases().open(unit.id(), "hum on the left channel, round " + i);
    var now = Clock.systemUTC().instant();
    store
        .cases()
        .addReadings(
            c.id(),
            List.of(
                new StoredReading(
                    HistoryStore.newId(),
                    c.id(),
                    "OUT",
                    ReadingKind.DC,
                    13.4,
                    null,
                    null,
                    "m",
                    now),
                new StoredReading(
                    HistoryStore.newId(),
                    c.id(),
                    "U1.2",
                    ReadingKind.DC,
                    0.6,
                    null,
                    null,
                    "m",
                    now),
                // A power-off reading, so that every sync test carries ohms readings and OL.
                new StoredReading(
                    HistoryStore.newId(),
                    c.id(),
                    "U1.2",
                    ReadingKind.OHMS,
                    i % 2 == 0 ? Double.POSITIVE_INFINITY : 46800,
                    null,
                    null,
                    "m",
                    now,
                    "OUT")),
            null);
    store.cases().addNote(c.id(), "feedback resistor looked cracked, " + serial);
    return store.cases().close(c.id(), Outcome.FIXED, List.of(i % 2 == 0 ? "R2:open" : "C1:short"));
  }

  /** Runs one sync of the bench file with the server. */
  static SyncReport sync(HistoryStore store, PgHistory server, String name) {
    return new Sync((SyncLedger) store, server, name, "test", Clock.systemUTC())
        .run(Sync.Progress.NONE);
  }

  /**
   * What a history holds, comparable across benches: every case, reading, note and action as
   * records, units by id and serial, board models by name (a model made on two benches has two ids
   * and is matched by name).
   */
  static Set<String> content(HistoryStore store) {
    HistoryBundle b = store.transfer().export(new ExportSelection.All(), "test");
    Set<String> out = new TreeSet<>();
    b.boardModels().forEach(m -> out.add("model " + m.name()));
    b.units().forEach(u -> out.add("unit " + u.id() + " " + u.serial()));
    b.cases().forEach(c -> out.add("case " + c));
    b.readings().forEach(r -> out.add("reading " + r));
    b.notes().forEach(n -> out.add("note " + n));
    b.actions().forEach(a -> out.add("action " + a));
    b.suspectLists().forEach(l -> out.add("list " + l));
    return out;
  }

  /**
   * {@code work DB ADDRESS NAME N}: adds N cases, syncing after each, and prints {@code synced i};
   * {@code loop DB ADDRESS NAME}: prints {@code ready} once its file is open, then syncs for ever
   * (until killed), printing {@code synced i} after each. User and password come from
   * PGUSER/PGPASSWORD.
   */
  public static void main(String[] args) throws InterruptedException {
    String mode = args[0];
    Path db = Path.of(args[1]);
    ServerAddress address = ServerAddress.parse("test", args[2]);
    String name = args[3];
    Map<String, String> env = System.getenv();
    PgHistory server = null;
    try (HistoryStore store = SqliteHistory.open(db)) {
      int n = mode.equals("work") ? Integer.parseInt(args[4]) : Integer.MAX_VALUE;
      if (!mode.equals("work")) {
        System.out.println("ready");
        System.out.flush();
      }
      for (int i = 0; i < n; i++) {
        if (mode.equals("work")) {
          addCase(store, name + "-" + (i % 3), i);
        }
        // As a bench does: a server that cannot be reached (a busy machine's connect timing out)
        // leaves the bench working on its file; the next sync catches up.
        try {
          if (server == null) {
            server = PgHistory.open(address, Clock.systemUTC(), env);
          }
          sync(store, server, name);
          System.out.println("synced " + i);
        } catch (StorageException e) {
          System.out.println("offline " + i);
          if (server != null) {
            server.close();
            server = null;
          }
          Thread.sleep(200);
        }
        System.out.flush();
      }
    } finally {
      if (server != null) {
        server.close();
      }
    }
  }
}
