package com.stagewise.history.sync;

import com.stagewise.history.ImportReport;
import java.time.Instant;
import java.util.List;

/**
 * What one sync did.
 *
 * @param server the server's address
 * @param down records that came down new or newer than the bench's copy
 * @param downUnchanged records that came down and were already here as they are
 * @param up records sent up (new or changed on this bench)
 * @param conflicts records changed on both sides: each side kept its own copy
 * @param endedAt when the sync ended
 */
public record SyncReport(
    String server,
    int down,
    int downUnchanged,
    int up,
    List<ImportReport.Conflict> conflicts,
    Instant endedAt) {
  public SyncReport {
    conflicts = List.copyOf(conflicts);
  }
}
