package com.stagewise.history.postgres;

import static com.stagewise.history.jdbc.SearchRows.appendFilters;
import static com.stagewise.history.jdbc.SearchRows.hits;
import static com.stagewise.history.jdbc.SearchRows.withSnippets;

import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.jdbc.SqlDialect;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Finds cases on the shop server by their unit, board model, confirmed faults, parts, status, dates
 * and words, with the same criteria and order as the bench's search.
 *
 * <p>Words use PostgreSQL's text search: the tsvector columns of symptoms and notes (GIN indexes,
 * schema version 2), every word of the query required as a word prefix, ranked by {@code ts_rank}
 * with the rank divided by 1 + the logarithm of the text's length (normalisation 1, PostgreSQL
 * documentation 12.3.3, "Ranking Search Results"), so that a short text that holds the word often
 * ranks above a long one that mentions it once. A case found through several texts keeps its best
 * rank; its snippet ({@code ts_headline}) comes from its symptom if that matches, else from its
 * best note. Every value the user typed is a bound parameter.
 */
final class TextSearch {
  private static final String HEADLINE_OPTIONS =
      "StartSel=[, StopSel=], MaxWords=16, MinWords=6, ShortWord=1, MaxFragments=1,"
          + " FragmentDelimiter=…";

  private TextSearch() {}

  static List<SearchHit> run(Connection connection, SearchQuery query) throws SQLException {
    List<Object> parameters = new ArrayList<>();
    StringBuilder sql = new StringBuilder();
    boolean ranked = query.text().isPresent();
    String words = "";
    if (ranked) {
      words = queryText(query.text().get());
      if (words.isEmpty()) {
        return List.of();
      }
      sql.append("WITH q AS (SELECT query_of(?) AS q),")
          .append(" text_hit (case_id, score) AS (")
          .append("SELECT c.id, ts_rank(c.symptom_words, q.q, 1) FROM repair_case c, q")
          .append(" WHERE c.symptom_words @@ q.q")
          .append(" UNION ALL SELECT n.case_id, ts_rank(n.text_words, q.q, 1) FROM case_note n, q")
          .append(" WHERE n.text_words @@ q.q),")
          .append(" best (case_id, score) AS (SELECT case_id, max(score) FROM text_hit")
          .append(" GROUP BY case_id) ");
      parameters.add(words);
    }
    sql.append("SELECT c.id, u.id, u.serial, m.name, c.status, c.outcome, c.opened_at, c.symptom,")
        .append(" (SELECT string_agg(fault_id, ' ' ORDER BY position) FROM confirmed_fault f")
        .append(" WHERE f.case_id = c.id), ")
        .append(ranked ? "best.score" : "0")
        .append(
            ranked ? " FROM best JOIN repair_case c ON c.id = best.case_id" : " FROM repair_case c")
        .append(" JOIN unit u ON u.id = c.unit_id JOIN board_model m ON m.id = u.board_model_id")
        .append(" WHERE 1 = 1");
    appendFilters(sql, parameters, query, SqlDialect.POSTGRES);
    sql.append(
            ranked
                ? " ORDER BY best.score DESC, c.opened_at DESC, c.id COLLATE \"C\""
                : " ORDER BY c.opened_at DESC, c.id COLLATE \"C\"")
        .append(" LIMIT ?");
    parameters.add(query.limit());
    List<SearchHit> hits = hits(connection, sql.toString(), parameters, false);
    return ranked && !hits.isEmpty() ? withSnippets(hits, snippets(connection, words, hits)) : hits;
  }

  /** Returns, for each hit, its symptom's matching words in context, else its best note's. */
  private static Map<String, String> snippets(
      Connection connection, String words, List<SearchHit> hits) throws SQLException {
    String[] ids = hits.stream().map(SearchHit::caseId).toArray(String[]::new);
    String symptoms =
        "SELECT c.id, ts_headline('simple', c.symptom, q.q, ?) FROM repair_case c,"
            + " (SELECT query_of(?) AS q) q WHERE c.id = ANY (?) AND c.symptom_words @@ q.q";
    String notes =
        "SELECT n.case_id, ts_headline('simple', n.text, q.q, ?) FROM case_note n,"
            + " (SELECT query_of(?) AS q) q WHERE n.case_id = ANY (?) AND n.text_words @@ q.q"
            + " ORDER BY ts_rank(n.text_words, q.q, 1) DESC";
    Map<String, String> snippets = new HashMap<>();
    for (String sql : List.of(symptoms, notes)) {
      try (PreparedStatement statement = connection.prepareStatement(sql)) {
        statement.setString(1, HEADLINE_OPTIONS);
        statement.setString(2, words);
        statement.setArray(3, connection.createArrayOf("text", ids));
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
   * Returns a text-search query that needs every word of {@code text} as a word prefix, whatever
   * characters it holds: each run of letters and digits becomes one quoted prefix term ({@code
   * 'word':*}), all joined by AND, so that operators and quotes typed by the user are searched for,
   * not obeyed. Empty when the text has no letter or digit.
   */
  static String queryText(String text) {
    StringBuilder query = new StringBuilder();
    StringBuilder word = new StringBuilder();
    String lower = text.toLowerCase(Locale.ROOT);
    for (int i = 0; i <= lower.length(); ) {
      int cp = i < lower.length() ? lower.codePointAt(i) : ' ';
      if (Character.isLetterOrDigit(cp)) {
        word.appendCodePoint(cp);
      } else if (word.length() > 0) {
        if (query.length() > 0) {
          query.append(" & ");
        }
        query.append('\'').append(word).append("':*");
        word.setLength(0);
      }
      i += i < lower.length() ? Character.charCount(cp) : 1;
    }
    return query.toString();
  }
}
