#!/usr/bin/env bash
# Runs the growth benchmark (JMH): full diagnosis of the first 1…12 sections of the
# 12-section test chain. Prints the parts, sections and faults of each size first.
# Usage: src/scripts/bench-growth.sh [JMH options]   (about five minutes)
# CORES and CLASSES as for src/scripts/bench-diagnosis.sh.
set -euo pipefail
cd "$(dirname "$0")/../.."
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/bench-classpath.txt
# Not pinned by default: on the build machine a JVM pinned with taskset runs at about half speed
# (DEVELOPERS.md, "Every core kept busy"); CORES=0 or CORES=0,1 pins it to those cores where taskset exists.
pin=""
if [ -n "${CORES:-}" ] && command -v taskset >/dev/null 2>&1; then pin="taskset -c $CORES"; fi
cp="target/test-classes:${CLASSES:-target/classes}:$(cat target/bench-classpath.txt)"
java -cp "$cp" com.stagewise.bench.ChainSizes
$pin java -cp "$cp" org.openjdk.jmh.Main ChainGrowthBenchmark -rf text -rff target/bench-growth.txt "$@"
