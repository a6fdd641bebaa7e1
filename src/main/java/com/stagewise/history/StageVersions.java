package com.stagewise.history;

import com.stagewise.history.record.StageSheetRecord;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * The rules of library stage versions, the same for every store: how versions are numbered, which
 * one is the latest, and how a version from another bench (a bundle or the shop server) joins the
 * versions kept here.
 *
 * <p>A library stage is known by its board model and its title, letter case aside. Each saving of a
 * changed stage is a new version numbered one above the highest; a version's text is never
 * replaced. When two benches each saved a different version under the same number, the one saved
 * first keeps the number and the other moves to the next free number, on every bench and the server
 * alike, so that all of them end with the same numbers and nothing is lost. The same text arriving
 * from another bench under another id is the version already kept, not a second one.
 */
public final class StageVersions {
  private StageVersions() {}

  /** Orders versions latest first: the highest number first. */
  public static final Comparator<StageSheetRecord> LATEST_FIRST =
      Comparator.comparingInt(StageSheetRecord::version)
          .reversed()
          .thenComparing(StageSheetRecord::savedAt, Comparator.reverseOrder())
          .thenComparing(StageSheetRecord::id);

  /** Returns the key that tells library stages apart within a board model: the title, any case. */
  public static String stageKey(String title) {
    return title.strip().toLowerCase(Locale.ROOT);
  }

  /** Returns the number a new version of a stage takes: one above the highest, 1 for the first. */
  public static int next(List<StageSheetRecord> versions) {
    return versions.stream().mapToInt(StageSheetRecord::version).max().orElse(0) + 1;
  }

  /** Returns the version among {@code versions} whose sheet text is exactly {@code sheetJson}. */
  public static Optional<StageSheetRecord> withText(
      List<StageSheetRecord> versions, String sheetJson) {
    return versions.stream().filter(v -> v.sheetJson().equals(sheetJson)).findFirst();
  }

  /**
   * Returns the latest version of each stage among {@code sheets} (all of one board model), the
   * stage whose latest version was saved last first.
   */
  public static List<StageSheetRecord> latestOfEach(List<StageSheetRecord> sheets) {
    Map<String, StageSheetRecord> latest = new LinkedHashMap<>();
    for (StageSheetRecord s : sheets) {
      latest.merge(stageKey(s.title()), s, (a, b) -> LATEST_FIRST.compare(a, b) <= 0 ? a : b);
    }
    List<StageSheetRecord> out = new ArrayList<>(latest.values());
    out.sort(
        Comparator.comparing(StageSheetRecord::savedAt, Comparator.reverseOrder())
            .thenComparing(StageSheetRecord::id));
    return out;
  }

  /**
   * Returns whether {@code a} keeps a number that {@code b} claims too: the version saved first
   * keeps it (the smaller id when both were saved at the same moment).
   */
  public static boolean keepsNumber(StageSheetRecord a, StageSheetRecord b) {
    int byTime = a.savedAt().compareTo(b.savedAt());
    return byTime != 0 ? byTime < 0 : a.id().compareTo(b.id()) < 0;
  }

  /** What to do with a version that arrives from another bench. */
  public sealed interface Placement {
    /** It is a version kept here already (same text): nothing to write. */
    record Same(StageSheetRecord local) implements Placement {}

    /**
     * Write {@code record} (insert it, or replace the local copy of its id), after moving {@code
     * moved} (a local version that gives up its number) when present.
     */
    record Write(StageSheetRecord record, Optional<StageSheetRecord> moved) implements Placement {}

    /** The local copy of its id holds other content: the usual rules for differing copies apply. */
    record Differs(StageSheetRecord local) implements Placement {}
  }

  /**
   * Places a version from another bench whose id is new here among the local versions of its stage.
   *
   * @param incoming the version, its board model already the local one
   * @param versions the local versions of the same stage (board model and title)
   * @param numbered whether the bundle carried version numbers (bundles before format version 3 did
   *     not: such a sheet becomes the next version unless its text is kept already)
   * @param now the time of the merge (when a moved version changed)
   */
  public static Placement placeNew(
      StageSheetRecord incoming, List<StageSheetRecord> versions, boolean numbered, Instant now) {
    Optional<StageSheetRecord> same = withText(versions, incoming.sheetJson());
    if (same.isPresent()) {
      return new Placement.Same(same.get());
    }
    int next = next(versions);
    if (!numbered) {
      return new Placement.Write(
          incoming.withVersion(next, incoming.updatedAt()), Optional.empty());
    }
    Optional<StageSheetRecord> holder =
        versions.stream().filter(v -> v.version() == incoming.version()).findFirst();
    if (holder.isEmpty()) {
      return new Placement.Write(incoming, Optional.empty());
    }
    if (keepsNumber(incoming, holder.get())) {
      return new Placement.Write(incoming, Optional.of(holder.get().withVersion(next, now)));
    }
    // Moved here, so the change travels back to the bench it came from on its next sync.
    return new Placement.Write(incoming.withVersion(next, now), Optional.empty());
  }

  /**
   * Places a version from another bench whose id is kept here already. The text of a version never
   * changes; only its number may, when a merge elsewhere moved it: the copy that changed last says
   * where it stands.
   *
   * @param incoming the bundle's copy, its board model already the local one
   * @param local the local copy of the same id
   * @param versions the local versions of its stage
   * @param numbered whether the bundle carried version numbers
   * @param now the time of the merge
   */
  public static Placement placeKnown(
      StageSheetRecord incoming,
      StageSheetRecord local,
      List<StageSheetRecord> versions,
      boolean numbered,
      Instant now) {
    boolean sameText =
        incoming.sheetJson().equals(local.sheetJson())
            && incoming.title().equals(local.title())
            && incoming.boardModelId().equals(local.boardModelId());
    if (!sameText) {
      return new Placement.Differs(local);
    }
    if (!numbered
        || incoming.sameSaving(local)
        || !incoming.updatedAt().isAfter(local.updatedAt())) {
      return new Placement.Same(local);
    }
    Optional<StageSheetRecord> holder =
        versions.stream()
            .filter(v -> v.version() == incoming.version() && !v.id().equals(incoming.id()))
            .findFirst();
    if (holder.isEmpty()) {
      return new Placement.Write(incoming, Optional.empty());
    }
    int next = next(withOut(versions, incoming));
    if (keepsNumber(incoming, holder.get())) {
      return new Placement.Write(incoming, Optional.of(holder.get().withVersion(next, now)));
    }
    return new Placement.Write(incoming.withVersion(next, now), Optional.empty());
  }

  private static List<StageSheetRecord> withOut(
      List<StageSheetRecord> versions, StageSheetRecord incoming) {
    List<StageSheetRecord> all = new ArrayList<>(versions);
    all.removeIf(v -> v.id().equals(incoming.id()));
    all.add(incoming);
    return all;
  }
}
