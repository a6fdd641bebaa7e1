#!/usr/bin/env bash
# Makes the class-data sharing archive (AppCDS) of the command line: runs target/stagewise.jar once
# on a demo case (diagnose), and the JVM writes the classes it loaded to target/stagewise-cli.jsa.
# mvn package runs it from the project root. The archive fits the same java and the same jar path:
#   java -XX:SharedArchiveFile=target/stagewise-cli.jsa -jar target/stagewise.jar diagnose …
# (a java or jar that does not match is noticed by the JVM, which then runs without the archive).
# It also puts the launcher src/package/stagewise beside the jar (target/stagewise), which starts
# the jar with the archive and the quick-start options.
set -euo pipefail
target="${1:-target}"
stage="data/stages/ferrowick-wb2-bridge-amp.stage.json"
readings="data/readings/ferrowick-wb2-bridge-amp.reads-high.readings.json"
install -m 755 src/package/stagewise "$target/stagewise"
rm -f "$target/stagewise-cli.jsa"
if java -XX:ArchiveClassesAtExit="$target/stagewise-cli.jsa" -jar "$target/stagewise.jar" \
  diagnose --stage "$stage" --readings "$readings" >"$target/cli-cds.log" 2>&1; then
  echo "Class-data sharing archive of the command line: $target/stagewise-cli.jsa"
else
  echo "No class-data sharing archive made (see $target/cli-cds.log); the jar runs without it" >&2
fi
