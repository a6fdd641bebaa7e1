#!/usr/bin/env bash
# Kills a history writer with SIGKILL in the middle of its writes, round after round, and counts
# the acknowledged writes lost. Each round starts a writer JVM (WriterProcess: one case a
# transaction, with 5 readings, a suspect list of 3 and 2 notes, printing "committed <id>" after
# each commit), waits for a seeded count of 1 to 8 commits, and kills it at once; afterwards every
# acknowledged case must be in the file, whole, and the file must pass SQLite's integrity_check and
# the full-text indexes their own. Prints the figures; exit 0 only when nothing was lost.
# Usage: src/scripts/kill-writes.sh [ROUNDS [SEED [MOST_COMMITS]]]
#   (default 200 rounds; about 1.5 s a round here, so about 5 minutes)
set -euo pipefail
cd "$(dirname "$0")/../.."
rounds="${1:-200}"
seed="${2:-20260304}"
most="${3:-8}"
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/kill-classpath.txt
mkdir -p target/kill
db="target/kill/history-$(date +%s).db"
java -Dslf4j.internal.verbosity=ERROR -cp "target/test-classes:target/classes:$(cat target/kill-classpath.txt)" \
  com.stagewise.history.sqlite.KillRounds "$db" "$rounds" "$seed" "$most"
