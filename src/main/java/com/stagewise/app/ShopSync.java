package com.stagewise.app;

import com.stagewise.casework.Casework;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.ServerAddress;
import com.stagewise.history.StorageException;
import com.stagewise.history.SyncLedger;
import com.stagewise.history.postgres.PgHistory;
import com.stagewise.history.sync.Sync;
import com.stagewise.history.sync.SyncReport;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import javafx.application.Platform;
import javafx.beans.property.ReadOnlyStringProperty;
import javafx.beans.property.ReadOnlyStringWrapper;

/**
 * Syncs the bench's history with the shop server in the background, when one is named ({@code
 * STAGEWISE_SERVER}, else {@code shop.server} in the settings): shortly after start and then every
 * few minutes, on a thread of its own. Each sync connects afresh, so a server that was away is
 * picked up again; while it is away the bench works on its own file. {@link #text} says in the
 * status bar when the last sync ended, how far a running one is, or that the server is away.
 */
final class ShopSync implements AutoCloseable {
  /** Minutes between background syncs. */
  static final int EVERY_MINUTES = 5;

  private static final DateTimeFormatter CLOCK =
      DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT).withZone(ZoneId.systemDefault());

  private final HistoryStore store;
  private final ServerAddress address;
  private final Map<String, String> environment;
  private final ReadOnlyStringWrapper text = new ReadOnlyStringWrapper("");
  private final ScheduledExecutorService thread =
      Executors.newSingleThreadScheduledExecutor(
          r -> {
            Thread t = new Thread(r, "shop-sync");
            t.setDaemon(true);
            return t;
          });

  private ShopSync(HistoryStore store, ServerAddress address, Map<String, String> environment) {
    this.store = store;
    this.address = address;
    this.environment = environment;
  }

  /**
   * Returns the background sync of {@code store} with the server named by the environment or the
   * settings, if one is named; a malformed address shows in the status text and nothing syncs.
   */
  static Optional<ShopSync> start(HistoryStore store, Settings settings) {
    if (!(store instanceof SyncLedger)) {
      return Optional.empty();
    }
    Optional<ServerAddress> address;
    try {
      address = ServerAddress.resolve(settings.shopServer(), System.getenv());
    } catch (RuntimeException e) {
      return Optional.empty();
    }
    if (address.isEmpty()) {
      return Optional.empty();
    }
    ShopSync sync = new ShopSync(store, address.get(), System.getenv());
    sync.show(sync.lastSyncText());
    sync.thread.scheduleWithFixedDelay(sync::runOnce, 3, EVERY_MINUTES * 60L, TimeUnit.SECONDS);
    return Optional.of(sync);
  }

  /** Returns the status bar's words about the shop server. */
  ReadOnlyStringProperty text() {
    return text.getReadOnlyProperty();
  }

  private void runOnce() {
    SyncLedger ledger = (SyncLedger) store;
    try (PgHistory server = PgHistory.open(address, Clock.systemUTC(), environment)) {
      SyncReport report =
          new Sync(ledger, server, "bench app", Casework.version(), Clock.systemUTC())
              .run(
                  (phase, done, total) ->
                      show("Shop server: syncing " + phase + " " + done + "/" + total));
      show(
          "Shop server: synced "
              + CLOCK.format(report.endedAt())
              + (report.conflicts().isEmpty()
                  ? ""
                  : ", " + report.conflicts().size() + " conflicts (see history sync)"));
    } catch (StorageException e) {
      show("Shop server away, working offline" + lastSyncSuffix());
    } catch (RuntimeException e) {
      show("Shop server: sync failed, working offline" + lastSyncSuffix());
    }
  }

  private String lastSyncText() {
    return "Shop server: " + lastSyncSuffix().replaceFirst("^ \\(", "").replaceFirst("\\)$", "");
  }

  private String lastSyncSuffix() {
    Optional<Instant> last = ((SyncLedger) store).lastSync(address.toString());
    return last.map(t -> " (last sync " + CLOCK.format(t) + ")").orElse(" (never synced)");
  }

  private void show(String words) {
    if (Platform.isFxApplicationThread()) {
      text.set(words);
    } else {
      Platform.runLater(() -> text.set(words));
    }
  }

  @Override
  public void close() {
    thread.shutdownNow();
  }
}
