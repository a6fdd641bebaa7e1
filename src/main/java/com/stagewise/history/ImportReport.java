package com.stagewise.history;

import java.util.List;

/**
 * What an import did: how many records were added, updated from a newer copy, or already there,
 * which records were matched to a local one with another id, and every conflict.
 *
 * @param added records that were new here
 * @param updated records whose copy in the bundle was newer than the local one
 * @param unchanged records that were already here as they are in the bundle
 * @param matched board models matched by name and units matched by serial to a local record with
 *     another id, one sentence each
 * @param conflicts records that differ from the local copy where the local copy is the newer one
 *     (or as new): the local copy was kept
 */
public record ImportReport(
    int added, int updated, int unchanged, List<String> matched, List<Conflict> conflicts) {
  public ImportReport {
    matched = List.copyOf(matched);
    conflicts = List.copyOf(conflicts);
  }

  /**
   * A record that was not imported because the local copy differs and is not older.
   *
   * @param kind the kind of record, e.g. {@code case} or {@code note}
   * @param id its id
   * @param reason what differs and which copy was kept
   */
  public record Conflict(String kind, String id, String reason) {}
}
