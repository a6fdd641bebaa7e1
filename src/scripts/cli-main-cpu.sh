#!/usr/bin/env bash
# The processor time of the main thread of a cold `diagnose` of the bridge amplifier demo case,
# for several builds alternated round by round in one run (the order turned each round), each in a
# JVM of its own started as `java -cp … com.stagewise.bench.MainThreadCpu diagnose …` (the
# program's main on that thread, the jar's manifest Class-Path as with java -jar). The main
# thread's time leaves out the compiler's and collector's threads and moves far less with the
# machine's load than the wall time, which cli-startup.sh gives. Prints each build's median (and
# least) main-thread time, with its ratio to the first build's, the median processor time of the
# whole process and the median wall time.
# Usage: src/scripts/cli-main-cpu.sh ROUNDS DIR…   (each DIR a target folder with stagewise.jar and
# lib/, e.g. target and a copy of an earlier build's)
set -euo pipefail
cd "$(dirname "$0")/../.."
rounds="$1"
shift
dirs=("$@")
n=${#dirs[@]}
stage="data/stages/ferrowick-wb2-bridge-amp.stage.json"
readings="data/readings/ferrowick-wb2-bridge-amp.reads-high.readings.json"
mvn -B -q -DskipTests test-compile
declare -A walls cpus mains
time_file=$(mktemp)
main_file=$(mktemp)
trap 'rm -f "$time_file" "$main_file"' EXIT
for ((r = 0; r < rounds; r++)); do
  for ((k = 0; k < n; k++)); do
    i=$(((k + r) % n))
    start=$(date +%s%N)
    /usr/bin/time -o "$time_file" -f "%U %S" java -Dcpu.out="$main_file" \
      -cp "target/test-classes:${dirs[$i]}/stagewise.jar" com.stagewise.bench.MainThreadCpu \
      diagnose --stage "$stage" --readings "$readings" >/dev/null 2>&1
    end=$(date +%s%N)
    walls[$i]+="$(((end - start) / 1000000)) "
    cpus[$i]+="$(awk '{ printf "%d", ($1 + $2) * 1000 }' "$time_file") "
    mains[$i]+="$(cat "$main_file") "
  done
done
median() { echo "$1" | tr ' ' '\n' | grep . | sort -n | sed -n "$(((rounds + 1) / 2))p"; }
least() { echo "$1" | tr ' ' '\n' | grep . | sort -n | head -1; }
first=""
for ((i = 0; i < n; i++)); do
  main=$(median "${mains[$i]}")
  first="${first:-$main}"
  echo "${dirs[$i]}: main thread median ${main} ms (ratio $(awk -v a="$main" -v b="$first" \
    'BEGIN { printf "%.2f", a / b }'), least $(least "${mains[$i]}") ms); process $(median \
    "${cpus[$i]}") ms; wall $(median "${walls[$i]}") ms; ${rounds} rounds"
done
echo "load average at the end: $(cut -d' ' -f1-3 /proc/loadavg)"
