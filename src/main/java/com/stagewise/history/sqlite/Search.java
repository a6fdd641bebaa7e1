package com.stagewise.history.sqlite;

import static com.stagewise.history.jdbc.SearchRows.appendFilters;
import static com.stagewise.history.jdbc.SearchRows.hits;
import static com.stagewise.history.jdbc.SearchRows.withSnippets;

import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.jdbc.Rows;
import com.stagewise.history.jdbc.SqlDialect;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * Finds cases by their unit, board model, confirmed faults, parts, status, dates and words.
 *
 * <p>Words are looked up in the full-text indexes of symptoms and notes (FTS5) and ranked with
 * bm25; a case found through several texts keeps its best rank and that text's snippet. The SQL is
 * assembled from fixed pieces; every value the user typed is a bound parameter.
 */
final class Search {
  private static final String SNIPPET_OPEN = "[";
  private static final String SNIPPET_CLOSE = "]";
  private static final int SNIPPET_TOKENS = 12;

  /** Matching notes per case assumed when only the best notes are ranked (see {@link #run}). */
  static final int NOTES_PER_CASE = 50;

  private Search() {}

  static List<SearchHit> run(Connection connection, SearchQuery query) throws SQLException {
    List<Object> parameters = new ArrayList<>();
    StringBuilder sql = new StringBuilder();
    boolean ranked = query.text().isPresent();
    if (ranked) {
      String match = matchExpression(query.text().get());
      if (match.isEmpty()) {
        return List.of();
      }
      appendTextHits(sql, parameters, match, query);
    }
    sql.append("SELECT c.id, u.id, u.serial, m.name, c.status, c.outcome, c.opened_at, c.symptom,")
        .append(" (SELECT group_concat(fault_id, ' ') FROM (SELECT fault_id FROM confirmed_fault f")
        .append(" WHERE f.case_id = c.id ORDER BY position)), ")
        .append(ranked ? "NULL, -best.score" : "NULL, 0")
        .append(
            ranked
                ? " FROM best JOIN repair_case c ON c.row = best.case_row"
                : " FROM repair_case c")
        .append(" JOIN unit u ON u.id = c.unit_id JOIN board_model m ON m.id = u.board_model_id")
        .append(" WHERE 1 = 1");
    appendFilters(sql, parameters, query, SqlDialect.SQLITE);
    sql.append(
            ranked ? " ORDER BY best.score, c.opened_at DESC" : " ORDER BY c.opened_at DESC, c.id")
        .append(" LIMIT ?");
    parameters.add(query.limit());
    List<SearchHit> hits = hits(connection, sql.toString(), parameters, true);
    return ranked && !hits.isEmpty()
        ? withSnippets(hits, snippets(connection, matchExpression(query.text().get()), hits))
        : hits;
  }

  /**
   * Appends the common table expressions {@code text_hit} (every matching symptom and note, by
   * case) and {@code best} (each case's best rank).
   */
  private static void appendTextHits(
      StringBuilder sql, List<Object> parameters, String match, SearchQuery query) {
    // Rank every matching case by its best text, without snippets: snippets are made for the
    // returned hits only (making one for each of thousands of matches costs far more).
    // With words only (no other criterion), only the best texts of each index can make the
    // first hits: a case among the first n has its best symptom among the first n symptoms, and
    // its best note among the first n · NOTES_PER_CASE notes unless the cases above it hold
    // more matching notes than that. Taking just those (FTS5 keeps the top of a rank-ordered
    // LIMIT without sorting every match) spares joining and grouping every match of a common
    // word.
    boolean wordsOnly =
        query.serial().isEmpty()
            && query.boardModel().isEmpty()
            && query.faultId().isEmpty()
            && query.part().isEmpty()
            && query.status().isEmpty()
            && query.openedFrom().isEmpty()
            && query.openedBefore().isEmpty();
    String cap = wordsOnly ? " ORDER BY rank LIMIT ?" : "";
    sql.append("WITH text_hit (case_row, score) AS (")
        .append("SELECT * FROM (SELECT rowid, rank FROM symptom_text WHERE symptom_text MATCH ?")
        .append(cap)
        .append(")")
        .append(
            " UNION ALL SELECT rc.row, n.score FROM (SELECT rowid AS note_row, rank AS score FROM note_text")
        .append(" WHERE note_text MATCH ?")
        .append(cap)
        .append(") n")
        .append(
            " JOIN case_note cn ON cn.row = n.note_row JOIN repair_case rc ON rc.id = cn.case_id),")
        .append(" best (case_row, score) AS (SELECT case_row, min(score) FROM text_hit")
        .append(" GROUP BY case_row) ");
    parameters.add(match);
    if (wordsOnly) {
      parameters.add(query.limit());
    }
    parameters.add(match);
    if (wordsOnly) {
      parameters.add((long) query.limit() * NOTES_PER_CASE);
    }
  }

  /**
   * Returns, for each hit's case, the matching words of its symptom in context, else of its
   * best-matching note: two queries for all hits together.
   */
  private static Map<String, String> snippets(
      Connection connection, String match, List<SearchHit> hits) throws SQLException {
    String format =
        "snippet(%s, 0, '"
            + SNIPPET_OPEN
            + "', '"
            + SNIPPET_CLOSE
            + "', '…', "
            + SNIPPET_TOKENS
            + ")";
    String marks = String.join(", ", java.util.Collections.nCopies(hits.size(), "?"));
    Object[] parameters = new Object[hits.size() + 1];
    parameters[0] = match;
    for (int i = 0; i < hits.size(); i++) {
      parameters[i + 1] = hits.get(i).caseId();
    }
    String symptoms =
        "SELECT c.id, "
            + String.format(java.util.Locale.ROOT, format, "symptom_text")
            + " FROM symptom_text JOIN repair_case c ON c.row = symptom_text.rowid"
            + " WHERE symptom_text MATCH ? AND c.id IN ("
            + marks
            + ")";
    String notes =
        "SELECT cn.case_id, "
            + String.format(java.util.Locale.ROOT, format, "note_text")
            + " FROM note_text JOIN case_note cn ON cn.row = note_text.rowid"
            + " WHERE note_text MATCH ? AND cn.case_id IN ("
            + marks
            + ") ORDER BY rank";
    Map<String, String> snippets = new java.util.HashMap<>();
    for (String sql : List.of(symptoms, notes)) {
      try (PreparedStatement statement = connection.prepareStatement(sql)) {
        Rows.bind(statement, parameters);
        try (ResultSet rs = statement.executeQuery()) {
          while (rs.next()) {
            snippets.putIfAbsent(rs.getString(1), rs.getString(2));
          }
        }
      }
    }
    return snippets;
  }

  /**
   * Returns an FTS5 query that finds every word of {@code text} as a word prefix, whatever
   * characters the text holds: each word becomes a quoted string (inner quotes doubled), so that
   * quotes, operators and column names typed by the user are searched for, not obeyed.
   */
  static String matchExpression(String text) {
    StringBuilder match = new StringBuilder();
    for (String word : text.strip().split("\\s+")) {
      // FTS5 splits on punctuation itself; a word that is only punctuation would match nothing.
      if (word.isEmpty() || word.codePoints().noneMatch(Character::isLetterOrDigit)) {
        continue;
      }
      if (match.length() > 0) {
        match.append(' ');
      }
      match.append('"').append(word.replace("\"", "\"\"")).append("\"*");
    }
    return match.toString();
  }
}
