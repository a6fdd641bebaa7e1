#!/usr/bin/env bash
# Runs the signal-chain and stage-editor benchmarks (JMH): the five-section chain's full
# diagnosis beside the largest single stages and beside ngspice on the same fault dictionaries, and
# the editor's re-check and redraw after an edit.
# Usage: src/scripts/bench-chain.sh [JMH options]   (needs ngspice on the PATH; about six minutes)
set -euo pipefail
cd "$(dirname "$0")/../.."
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/bench-classpath.txt
# Not pinned by default: on the build machine a JVM pinned with taskset runs at about half speed
# (DEVELOPERS.md, "Every core kept busy"); CORES=0 or CORES=0,1 pins it to those cores where taskset exists.
pin=""
if [ -n "${CORES:-}" ] && command -v taskset >/dev/null 2>&1; then pin="taskset -c $CORES"; fi
$pin java -Djava.awt.headless=true -cp "target/test-classes:target/classes:$(cat target/bench-classpath.txt)" \
  org.openjdk.jmh.Main 'ChainBenchmark|EditorBenchmark' -rf text -rff target/bench-chain.txt "$@"
