package com.stagewise.history;

import com.stagewise.history.record.CaseStatus;
import java.time.Instant;
import java.util.Optional;

/**
 * What to look for among the cases; every criterion given must match (empty ones are ignored).
 *
 * @param serial a unit's serial number (exact, ignoring letter case)
 * @param boardModel a board model's name (ignoring letter case) or id
 * @param faultId a confirmed fault id, e.g. {@code R2:open}
 * @param part a part designator named by a confirmed fault or an action, e.g. {@code R2} or {@code
 *     U1} (which also finds {@code U1A:dead} and {@code U1.3:lifted})
 * @param status open or closed
 * @param openedFrom cases opened at or after this time
 * @param openedBefore cases opened before this time
 * @param text words to find in the reported symptom or the notes (each word, as a prefix); the hits
 *     are then ranked by relevance, else newest first
 * @param limit the most hits to return
 */
public record SearchQuery(
    Optional<String> serial,
    Optional<String> boardModel,
    Optional<String> faultId,
    Optional<String> part,
    Optional<CaseStatus> status,
    Optional<Instant> openedFrom,
    Optional<Instant> openedBefore,
    Optional<String> text,
    int limit) {

  /** The number of hits returned when no limit is given. */
  public static final int DEFAULT_LIMIT = 50;

  public SearchQuery {
    if (limit < 1) {
      throw new IllegalArgumentException("limit (" + limit + ") must be at least 1");
    }
  }

  /** Returns a query that matches every case (newest first, up to the default limit). */
  public static SearchQuery all() {
    return new SearchQuery(
        Optional.empty(),
        Optional.empty(),
        Optional.empty(),
        Optional.empty(),
        Optional.empty(),
        Optional.empty(),
        Optional.empty(),
        Optional.empty(),
        DEFAULT_LIMIT);
  }

  public SearchQuery withSerial(String value) {
    return new SearchQuery(
        blankless(value), boardModel, faultId, part, status, openedFrom, openedBefore, text, limit);
  }

  public SearchQuery withBoardModel(String value) {
    return new SearchQuery(
        serial, blankless(value), faultId, part, status, openedFrom, openedBefore, text, limit);
  }

  public SearchQuery withFaultId(String value) {
    return new SearchQuery(
        serial, boardModel, blankless(value), part, status, openedFrom, openedBefore, text, limit);
  }

  public SearchQuery withPart(String value) {
    return new SearchQuery(
        serial,
        boardModel,
        faultId,
        blankless(value),
        status,
        openedFrom,
        openedBefore,
        text,
        limit);
  }

  public SearchQuery withStatus(CaseStatus value) {
    return new SearchQuery(
        serial,
        boardModel,
        faultId,
        part,
        Optional.ofNullable(value),
        openedFrom,
        openedBefore,
        text,
        limit);
  }

  public SearchQuery withOpenedFrom(Instant value) {
    return new SearchQuery(
        serial,
        boardModel,
        faultId,
        part,
        status,
        Optional.ofNullable(value),
        openedBefore,
        text,
        limit);
  }

  public SearchQuery withOpenedBefore(Instant value) {
    return new SearchQuery(
        serial,
        boardModel,
        faultId,
        part,
        status,
        openedFrom,
        Optional.ofNullable(value),
        text,
        limit);
  }

  public SearchQuery withText(String value) {
    return new SearchQuery(
        serial,
        boardModel,
        faultId,
        part,
        status,
        openedFrom,
        openedBefore,
        blankless(value),
        limit);
  }

  public SearchQuery withLimit(int value) {
    return new SearchQuery(
        serial, boardModel, faultId, part, status, openedFrom, openedBefore, text, value);
  }

  private static Optional<String> blankless(String value) {
    return value == null || value.isBlank() ? Optional.empty() : Optional.of(value.strip());
  }
}
