#!/usr/bin/env bash
# Times `diagnose` on a demo case from process start, in one run (rounds alternate, so that the
# machine's load falls on every variant alike), beside ngspice computing the same stage's fault
# dictionary in one process (netlists written beforehand). Prints the median of each.
#   1. java -jar target/stagewise.jar diagnose …                       (plain)
#   2. the same with -XX:SharedArchiveFile=target/stagewise-cli.jsa     (AppCDS, made by mvn package)
#   3. AppCDS with -XX:TieredStopAtLevel=1 -XX:+UseSerialGC            (quick-start JIT and GC)
# Usage: src/scripts/cli-startup.sh [ROUNDS]   (needs mvn package first, and ngspice; about a minute)
set -euo pipefail
cd "$(dirname "$0")/../.."
rounds="${1:-7}"
stage="data/stages/ferrowick-wb2-bridge-amp.stage.json"
readings="data/readings/ferrowick-wb2-bridge-amp.reads-high.readings.json"
[ -f target/stagewise.jar ] || { echo "run mvn -B package first" >&2; exit 1; }
[ -f target/stagewise-cli.jsa ] || bash src/package/cli-cds.sh target
variants=(
  ""
  "-XX:SharedArchiveFile=target/stagewise-cli.jsa"
  "-XX:SharedArchiveFile=target/stagewise-cli.jsa -XX:TieredStopAtLevel=1 -XX:+UseSerialGC"
)
declare -A times
for ((r = 0; r < rounds; r++)); do
  for v in "${!variants[@]}"; do
    start=$(date +%s%N)
    # shellcheck disable=SC2086
    java ${variants[$v]} -jar target/stagewise.jar diagnose --stage "$stage" --readings "$readings" >/dev/null
    end=$(date +%s%N)
    times[$v]+="$(((end - start) / 1000000)) "
  done
done
for v in "${!variants[@]}"; do
  sorted=$(echo "${times[$v]}" | tr ' ' '\n' | grep . | sort -n | paste -sd' ')
  median=$(echo "$sorted" | tr ' ' '\n' | sed -n "$((rounds / 2 + 1))p")
  echo "diagnose, java ${variants[$v]:-(no options)}: median ${median} ms of ${rounds} [${sorted}]"
done
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/bench-classpath.txt
java -cp "target/test-classes:target/classes:$(cat target/bench-classpath.txt)" \
  com.stagewise.bench.NgspiceTime "$stage" "$rounds"
