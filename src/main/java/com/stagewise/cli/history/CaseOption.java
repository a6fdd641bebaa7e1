package com.stagewise.cli.history;

import picocli.CommandLine.Option;

/** The case a subcommand works on: {@code --case ID}, the id or its first characters. */
final class CaseOption {
  @Option(
      names = "--case",
      required = true,
      paramLabel = "ID",
      description = "The case id (or its first characters).")
  String caseId;
}
