#!/usr/bin/env bash
# Processor time of full diagnoses, two builds of the program side by side in one run: the classes
# of a git revision ("before", default main) and the working tree's ("after"), alternated round by
# round, each in a JVM of its own (DiagnosisCpuTime: warm-up, then the median of the timed runs of
# the diagnosing thread's processor time, the wall time and the whole process's processor time).
# Each pairing runs on one thread (the JVM told it has one processor, the common pool given no
# workers, so the diagnosing thread's processor time is all the diagnosis's work) and, where the
# machine has two cores, on two with the common pool as the JVM sets it up (wall time the figure).
# Nothing is pinned with taskset: on the build machine that runs a JVM at about half speed.
# Usage: src/scripts/bench-cpu.sh [REVISION] [ROUNDS] [STAGES…]   (about 5 minutes with defaults)
set -euo pipefail
cd "$(dirname "$0")/../.."
rev="${1:-main}"
rounds="${2:-3}"
shift $(( $# > 2 ? 2 : $# )) || true
stages=("$@")
if [ ${#stages[@]} -eq 0 ]; then stages=(instrumentation chain-12); fi
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/bench-classpath.txt
deps="$(cat target/bench-classpath.txt)"
before="target/bench-before"
rm -rf "$before" && mkdir -p "$before/src" "$before/classes"
git archive "$rev" src/main | tar -x -C "$before/src"
find "$before/src/src/main/java" -name '*.java' > "$before/sources.txt"
javac -nowarn -encoding UTF-8 --release 17 -cp "$deps" -d "$before/classes" @"$before/sources.txt"
cp -r "$before/src/src/main/resources/." "$before/classes/"
run() { # cores classes stage
  local pool=""
  # One thread: the JVM told it has one processor and the common pool given no workers (not pinned
  # with taskset, which on the build machine runs a JVM at about half speed).
  if [ "$1" = "0" ]; then
    pool="-XX:ActiveProcessorCount=1 -Djava.util.concurrent.ForkJoinPool.common.parallelism=0"
  fi
  java $pool -cp "target/test-classes:$2:$deps" com.stagewise.bench.DiagnosisCpuTime "$3" 6 40
}
cores=("0")
if [ "$(nproc)" -ge 2 ]; then cores+=("0,1"); fi
echo "stage thread-cpu-ms wall-ms process-cpu-ms  (medians; before = $rev, after = working tree)"
for round in $(seq 1 "$rounds"); do
  for stage in "${stages[@]}"; do
    for c in "${cores[@]}"; do
      echo "round $round cores $c before: $(run "$c" "$before/classes" "$stage")"
      echo "round $round cores $c after:  $(run "$c" target/classes "$stage")"
    done
  done
done
