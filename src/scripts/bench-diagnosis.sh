#!/usr/bin/env bash
# Runs the diagnosis benchmark (JMH) on one core, beside ngspice on the same fault dictionary.
# Usage: src/scripts/bench-diagnosis.sh   (needs ngspice on the PATH; takes about two minutes)
set -euo pipefail
cd "$(dirname "$0")/../.."
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/bench-classpath.txt
# One core: taskset pins the JVM (and ngspice, its child) to CPU 0 where taskset exists.
pin=""
if command -v taskset >/dev/null 2>&1; then pin="taskset -c 0"; fi
$pin java -cp "target/test-classes:target/classes:$(cat target/bench-classpath.txt)" \
  org.openjdk.jmh.Main DiagnosisBenchmark -rf text -rff target/bench-diagnosis.txt "$@"
