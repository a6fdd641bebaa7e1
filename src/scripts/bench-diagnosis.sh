#!/usr/bin/env bash
# Runs the diagnosis benchmark (JMH), beside ngspice on the same fault dictionary.
# Usage: src/scripts/bench-diagnosis.sh [JMH options]   (needs ngspice on the PATH; about two minutes)
# CLASSES=DIR times the program's classes in DIR (for
# example another revision's, compiled as src/scripts/bench-cpu.sh does) instead of target/classes.
set -euo pipefail
cd "$(dirname "$0")/../.."
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/bench-classpath.txt
# Not pinned by default: on the build machine a JVM pinned with taskset runs at about half speed
# (DEVELOPERS.md, "Every core kept busy"); CORES=0 or CORES=0,1 pins it to those cores where taskset exists.
pin=""
if [ -n "${CORES:-}" ] && command -v taskset >/dev/null 2>&1; then pin="taskset -c $CORES"; fi
$pin java -cp "target/test-classes:${CLASSES:-target/classes}:$(cat target/bench-classpath.txt)" \
  org.openjdk.jmh.Main DiagnosisBenchmark -rf text -rff target/bench-diagnosis.txt "$@"
