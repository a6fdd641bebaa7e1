package com.stagewise.history.jdbc;

import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;

/**
 * What both stores' searches share: the conditions of a query other than its words, and the mapping
 * of result rows to hits. Each store ranks the words its own way (SQLite's FTS5, the server's text
 * search).
 */
public final class SearchRows {
  private static final int SNIPPET_LENGTH = 80;

  private SearchRows() {}

  /**
   * Appends one condition per criterion of the query other than its words (cases {@code c}, units
   * {@code u}, board models {@code m}), adding their parameters.
   */
  public static void appendFilters(
      StringBuilder sql, List<Object> parameters, SearchQuery query, SqlDialect dialect) {
    if (query.serial().isPresent()) {
      sql.append(" AND ").append(dialect.caselessEquals("u.serial"));
      parameters.add(query.serial().get());
    }
    if (query.boardModel().isPresent()) {
      sql.append(" AND (m.id = ? OR ").append(dialect.caselessEquals("m.name")).append(")");
      parameters.add(query.boardModel().get());
      parameters.add(query.boardModel().get());
    }
    if (query.faultId().isPresent()) {
      sql.append(
          " AND EXISTS (SELECT 1 FROM confirmed_fault f WHERE f.case_id = c.id AND f.fault_id = ?)");
      parameters.add(query.faultId().get());
    }
    if (query.part().isPresent()) {
      sql.append(" AND EXISTS (SELECT 1 FROM case_part p WHERE p.case_id = c.id AND ")
          .append(dialect.caselessEquals("p.part"))
          .append(")");
      parameters.add(query.part().get());
    }
    if (query.status().isPresent()) {
      sql.append(" AND c.status = ?");
      parameters.add(query.status().get().word());
    }
    if (query.openedFrom().isPresent()) {
      sql.append(" AND c.opened_at >= ?");
      parameters.add(query.openedFrom().get());
    }
    if (query.openedBefore().isPresent()) {
      sql.append(" AND c.opened_at < ?");
      parameters.add(query.openedBefore().get());
    }
  }

  /**
   * Runs the search and maps each row to a hit: columns 1 to 9 the case, its unit, model, status,
   * outcome, opening time, symptom and confirmed faults; then, when {@code snippetColumn} is set, a
   * snippet (else the symptom, shortened, stands as snippet); then the score.
   */
  public static List<SearchHit> hits(
      Connection connection, String sql, List<Object> parameters, boolean snippetColumn)
      throws SQLException {
    List<SearchHit> hits = new ArrayList<>();
    try (PreparedStatement statement = connection.prepareStatement(sql)) {
      Rows.bind(statement, parameters.toArray());
      try (ResultSet rs = statement.executeQuery()) {
        while (rs.next()) {
          String outcome = rs.getString(6);
          String faults = rs.getString(9);
          String symptom = rs.getString(8);
          String snippet = snippetColumn ? rs.getString(10) : null;
          hits.add(
              new SearchHit(
                  rs.getString(1),
                  rs.getString(2),
                  rs.getString(3),
                  rs.getString(4),
                  CaseStatus.fromWord(rs.getString(5)).orElseThrow(),
                  outcome == null ? null : Outcome.fromWord(outcome).orElseThrow(),
                  Instant.ofEpochMilli(rs.getLong(7)),
                  symptom,
                  faults == null || faults.isEmpty() ? List.of() : Arrays.asList(faults.split(" ")),
                  snippet == null ? shortened(symptom) : snippet,
                  rs.getDouble(snippetColumn ? 11 : 10)));
        }
      }
    }
    return hits;
  }

  /** Returns the hits with the snippet found for each case in place of its own, where found. */
  public static List<SearchHit> withSnippets(List<SearchHit> hits, Map<String, String> snippets) {
    List<SearchHit> out = new ArrayList<>(hits.size());
    for (SearchHit hit : hits) {
      String snippet = snippets.get(hit.caseId());
      out.add(
          new SearchHit(
              hit.caseId(),
              hit.unitId(),
              hit.serial(),
              hit.boardModel(),
              hit.status(),
              hit.outcome(),
              hit.openedAt(),
              hit.symptom(),
              hit.confirmedFaults(),
              snippet == null ? hit.snippet() : snippet,
              hit.score()));
    }
    return out;
  }

  /** Returns a symptom cut to a snippet's length, with an ellipsis where it was cut. */
  public static String shortened(String symptom) {
    return symptom.length() <= SNIPPET_LENGTH
        ? symptom
        : symptom.substring(0, SNIPPET_LENGTH) + "…";
  }
}
