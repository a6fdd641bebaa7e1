#!/usr/bin/env bash
# Times `diagnose` on a demo case from process start, in one run (rounds alternate, so that the
# machine's load falls on every variant alike), beside ngspice computing the same stage's fault
# dictionary in one process (netlists written beforehand, timed in the same rounds). Prints each
# one's median wall time (and its least) and median processor time, with each median's ratio to
# the first variant's.
#   1. java -jar target/stagewise.jar diagnose …                       (plain)
#   2. the same with -XX:SharedArchiveFile=target/stagewise-cli.jsa     (AppCDS, made by mvn package)
#   3. target/stagewise diagnose …: the launcher beside the jar, which adds the archive and
#      -XX:TieredStopAtLevel=1 -XX:+UseSerialGC                        (quick-start JIT and GC)
# With BEFORE=DIR (the target folder of another build, e.g. of an earlier commit, with its jar,
# lib/ and archive) variants 1 and 3 of that build run in the same rounds too, for a before/after
# ratio measured in one run.
# Also times `--version` alone, plain and through the launcher.
# Usage: [BEFORE=DIR] src/scripts/cli-startup.sh [ROUNDS]   (needs mvn package first, and ngspice;
# about two minutes)
set -euo pipefail
cd "$(dirname "$0")/../.."
rounds="${1:-7}"
stage="data/stages/ferrowick-wb2-bridge-amp.stage.json"
readings="data/readings/ferrowick-wb2-bridge-amp.reads-high.readings.json"
[ -f target/stagewise.jar ] || { echo "run mvn -B package first" >&2; exit 1; }
[ -f target/stagewise-cli.jsa ] || bash src/package/cli-cds.sh target
# The fault dictionary's netlists, written (and checked once) by the test code beforehand.
mvn -B -q -DskipTests test-compile
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=target/bench-classpath.txt
IFS=$'\t' read -r spice_dir spice_command < <(java -cp \
  "target/test-classes:target/classes:$(cat target/bench-classpath.txt)" \
  com.stagewise.bench.NgspiceTime --keep "$stage")
trap 'rm -rf "$spice_dir"' EXIT
names=(
  "java -jar target/stagewise.jar diagnose"
  "java -XX:SharedArchiveFile=target/stagewise-cli.jsa -jar target/stagewise.jar diagnose"
  "target/stagewise diagnose"
  "java -jar target/stagewise.jar --version"
  "target/stagewise --version"
  "ngspice, the same fault dictionary, one process"
)
commands=(
  "java -jar target/stagewise.jar diagnose --stage $stage --readings $readings"
  "java -XX:SharedArchiveFile=target/stagewise-cli.jsa -jar target/stagewise.jar diagnose --stage $stage --readings $readings"
  "target/stagewise diagnose --stage $stage --readings $readings"
  "java -jar target/stagewise.jar --version"
  "target/stagewise --version"
  "env -C $spice_dir LC_ALL=C $spice_command"
)
if [ -n "${BEFORE:-}" ]; then
  names+=("before: java -jar $BEFORE/stagewise.jar diagnose"
    "before: java -XX:SharedArchiveFile=… -XX:TieredStopAtLevel=1 -XX:+UseSerialGC -jar $BEFORE/stagewise.jar diagnose")
  commands+=("java -jar $BEFORE/stagewise.jar diagnose --stage $stage --readings $readings"
    "java -XX:SharedArchiveFile=$BEFORE/stagewise-cli.jsa -XX:TieredStopAtLevel=1 -XX:+UseSerialGC -jar $BEFORE/stagewise.jar diagnose --stage $stage --readings $readings")
fi
# Wall time from process start (what the user waits), and processor time (user + system, all
# threads; it counts the work done and moves less with the machine's load than the wall time).
declare -A times cpus
cpu_file=$(mktemp)
for ((r = 0; r < rounds; r++)); do
  for v in "${!commands[@]}"; do
    start=$(date +%s%N)
    # shellcheck disable=SC2086
    /usr/bin/time -o "$cpu_file" -f "%U %S" ${commands[$v]} >/dev/null 2>&1
    end=$(date +%s%N)
    times[$v]+="$(((end - start) / 1000000)) "
    cpus[$v]+="$(awk '{ printf "%d", ($1 + $2) * 1000 }' "$cpu_file") "
  done
done
rm -f "$cpu_file"
median() { echo "$1" | tr ' ' '\n' | grep . | sort -n | sed -n "$((rounds / 2 + 1))p"; }
first=""
first_cpu=""
for v in "${!commands[@]}"; do
  sorted=$(echo "${times[$v]}" | tr ' ' '\n' | grep . | sort -n | paste -sd' ')
  wall=$(median "${times[$v]}")
  least=$(echo "$sorted" | cut -d' ' -f1)
  cpu=$(median "${cpus[$v]}")
  first="${first:-$wall}"
  first_cpu="${first_cpu:-$cpu}"
  echo "${names[$v]}: wall median ${wall} ms (ratio $(awk -v a="$wall" -v b="$first" \
    'BEGIN { printf "%.2f", a / b }')), least ${least} ms; processor median ${cpu} ms (ratio \
$(awk -v a="$cpu" -v b="$first_cpu" 'BEGIN { printf "%.2f", a / b }')); ${rounds} rounds [${sorted}]"
done
echo "load average at the end: $(cut -d' ' -f1-3 /proc/loadavg)"
