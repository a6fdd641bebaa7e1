#!/usr/bin/env bash
# Measures the shop server beside the bench's SQLite file in one run: sync of 10,000 cases up and
# down, then search over 1,000,000 generated cases on both (ServerMeasure; figures in
# DEVELOPERS.md). Starts a throwaway PostgreSQL cluster of its own (needs the postgresql package).
# Usage: src/scripts/bench-server.sh [CASES_FOR_SEARCH] [FOLDER]   (about 15 minutes at 1,000,000;
# the files go to FOLDER, default a temporary folder, about 1.5 GB at 1,000,000)
set -euo pipefail
cd "$(dirname "$0")/../.."
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/bench-classpath.txt
java -cp "target/test-classes:target/classes:$(cat target/bench-classpath.txt)" \
  com.stagewise.history.postgres.ServerMeasure "$@"
