package com.stagewise.cli.history;

import com.stagewise.casework.Casework;
import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.SearchHit;
import com.stagewise.history.SearchQuery;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.interchange.history.HistoryJson;
import java.io.PrintWriter;
import java.util.List;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code history search}: cases by serial, model, fault, part, status, dates and words. */
@Command(
    name = "search",
    mixinStandardHelpOptions = true,
    description = "Find cases by serial, board model, fault, part, status, dates and words.")
final class SearchCommand extends HistorySubcommand {
  @Option(names = "--serial", description = "The unit's serial number (exact, any letter case).")
  String serial;

  @Option(names = "--model", description = "The board model.")
  String model;

  @Option(names = "--fault", description = "A confirmed fault id, e.g. R2:open.")
  String fault;

  @Option(
      names = "--part",
      description = "A part named by a confirmed fault or an action, e.g. R2 or U1.")
  String part;

  @Option(names = "--status", description = "open or closed.")
  String status;

  @Option(
      names = "--from",
      paramLabel = "DATE",
      description = "Opened on or after this date (2026-03-01, UTC) or time.")
  String from;

  @Option(
      names = "--to",
      paramLabel = "DATE",
      description = "Opened on or before this date (UTC, the whole day) or before this time.")
  String to;

  @Option(names = "--text", description = "Words to find in symptoms and notes.")
  String text;

  @Option(
      names = "--limit",
      defaultValue = "50",
      description = "The most cases to list (default ${DEFAULT-VALUE}).")
  int limit;

  @Override
  boolean readsOnly() {
    return true;
  }

  @Override
  void run(Casework work, PrintWriter out) {
    if (limit < 1) {
      throw new InvalidInputException(
          "command line", "--limit", "expected 1 or more, got " + limit);
    }
    SearchQuery query =
        SearchQuery.all()
            .withSerial(serial)
            .withBoardModel(model)
            .withFaultId(fault)
            .withPart(part)
            .withText(text)
            .withLimit(limit);
    if (status != null) {
      query =
          query.withStatus(
              CaseStatus.fromWord(status)
                  .orElseThrow(
                      () ->
                          new InvalidInputException(
                              "command line",
                              "--status",
                              "expected open or closed, got '" + status + "'")));
    }
    if (from != null) {
      query = query.withOpenedFrom(Lookups.time("--from", from, false));
    }
    if (to != null) {
      query = query.withOpenedBefore(Lookups.time("--to", to, true));
    }
    List<SearchHit> hits = work.history().cases().search(query);
    out.print(json() ? HistoryJson.hits(hits) + System.lineSeparator() : HistoryText.hits(hits));
  }
}
