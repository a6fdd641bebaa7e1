#!/usr/bin/env bash
# The full diagnosis in a warm JVM beside ngspice computing the same stage's fault dictionary in one
# process (netlists written beforehand), measured round by round side by side (NgspiceRatio), so a
# slow spell of the machine falls on both sides of each ratio. Prints each round and the medians.
# Usage: src/scripts/bench-ngspice-ratio.sh [STAGE] [ROUNDS] [DIAGNOSES_PER_ROUND]
#   (needs ngspice on the PATH; about a minute with the defaults: instrumentation, 15, 200)
set -euo pipefail
cd "$(dirname "$0")/../.."
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/bench-classpath.txt
java -cp "target/test-classes:${CLASSES:-target/classes}:$(cat target/bench-classpath.txt)" \
  com.stagewise.bench.NgspiceRatio "${1:-instrumentation}" 10 "${2:-15}" "${3:-200}"
