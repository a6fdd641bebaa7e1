package com.stagewise.history;

import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;

/**
 * The base of the store contract tests: every implementation of {@link HistoryStore} passes each
 * {@code *Contract} class through a subclass that says how to open a fresh, empty store.
 */
public abstract class StoreContract {
  /** The time every write is stamped with, unless a test moves the clock. */
  protected final MutableClock clock = new MutableClock(Instant.parse("2026-03-04T10:15:30.123Z"));

  protected HistoryStore store;

  /** Returns a new, empty store that takes its times from {@code clock}. */
  protected abstract HistoryStore openStore(Clock clock);

  @BeforeEach
  void openTheStore() {
    store = openStore(clock);
  }

  @AfterEach
  void closeTheStore() {
    store.close();
  }

  /** A clock that tests move forward by hand. */
  public static final class MutableClock extends Clock {
    private Instant now;

    public MutableClock(Instant start) {
      this.now = start;
    }

    public void set(Instant instant) {
      now = instant;
    }

    public void advanceDays(int days) {
      now = now.plusSeconds(86_400L * days);
    }

    public void advanceMillis(long millis) {
      now = now.plusMillis(millis);
    }

    @Override
    public Instant instant() {
      return now;
    }

    @Override
    public ZoneOffset getZone() {
      return ZoneOffset.UTC;
    }

    @Override
    public Clock withZone(java.time.ZoneId zone) {
      return this;
    }
  }
}
