package com.stagewise.history;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.time.ZoneOffset;

/**
 * A clock that moves on by one step each time it is read, so that every record a test writes has a
 * time of its own, in order (UTC; safe to read from several threads).
 */
public final class SteppingClock extends Clock {
  private final Duration step;
  private Instant now;

  /** A clock whose first reading is {@code start} plus one step. */
  public SteppingClock(Instant start, Duration step) {
    this.now = start;
    this.step = step;
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
    now = now.plus(step);
    return now;
  }
}
