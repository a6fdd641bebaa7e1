#!/usr/bin/env bash
# Measures the time from launching the bench app to its first window being shown.
#
# Usage: src/scripts/time-to-window.sh [RUNS]      (default 5 runs; prints each and the median)
#        JAVA_OPTIONS="..." src/scripts/time-to-window.sh   (other JVM options, e.g. " " for the defaults)
#        IMAGE=target/dist/Stagewise src/scripts/time-to-window.sh [RUNS]
#            (the app image of `mvn -B package -Ppackage`, started by its own launcher; with
#             NO_CDS=1 its class-data sharing archive is left out, for the comparison)
#
# Each run starts the app with --demo on a fresh, empty data folder (so the demo data is filled
# on first start, as on a new machine), under a virtual X display (Xvfb; `apt-get install xvfb`)
# unless DISPLAY is already set. The app prints the milliseconds from its process start to the
# first window shown when started with -Dstagewise.timing=true; the run then ends the app.
set -euo pipefail
cd "$(dirname "$0")/../.."
runs="${1:-5}"
if [ -z "${DISPLAY:-}" ]; then
  # No display: run this script again inside a virtual one.
  exec xvfb-run -a -s "-screen 0 1280x800x24" "$0" "$runs"
fi

image="${IMAGE:-}"
if [ -z "$image" ]; then
  mvn -B -q -o compile dependency:build-classpath -Dmdep.outputFile=target/classpath.txt -Dmdep.includeScope=runtime >/dev/null \
    || mvn -B -q compile dependency:build-classpath -Dmdep.outputFile=target/classpath.txt -Dmdep.includeScope=runtime >/dev/null
  cp="target/classes:$(cat target/classpath.txt)"
fi

work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
if [ -n "$image" ] && [ -n "${NO_CDS:-}" ]; then
  # A copy of the image whose launcher leaves the app's archive out (the runtime's own stays).
  cp -a "$image" "$work/image"
  image="$work/image"
  sed -i '/SharedArchiveFile\|Xshare/d' "$image/lib/app/Stagewise.cfg"
fi

one_run() {
  local n="$1" out="$work/run-$1.log" data="$work/data-$1"
  mkdir -p "$data"
  if [ -n "$image" ]; then
    # The image's own launcher with its own options; JAVA_TOOL_OPTIONS adds the timing line.
    XDG_DATA_HOME="$data" JAVA_TOOL_OPTIONS="-Dstagewise.timing=true" \
        "$image/bin/Stagewise" --demo >"$out" 2>&1 &
  else
    # The same JVM options as the javafx-maven-plugin's run configuration in pom.xml.
    XDG_DATA_HOME="$data" java ${JAVA_OPTIONS:--XX:TieredStopAtLevel=1 -XX:+UseSerialGC} -Dprism.order=sw \
        -Dstagewise.timing=true -cp "$cp" \
        com.stagewise.app.Main --demo >"$out" 2>&1 &
  fi
  local pid=$!
  for _ in $(seq 1 600); do
    if grep -q "first window shown" "$out"; then break; fi
    if ! kill -0 "$pid" 2>/dev/null; then break; fi
    sleep 0.1
  done
  kill "$pid" 2>/dev/null || true
  wait "$pid" 2>/dev/null || true
  local ms cpu
  ms="$(sed -n 's/.*first window shown \([0-9]*\) ms.*/\1/p' "$out" | head -n 1)"
  cpu="$(sed -n 's/.*first window shown .*cpu \([0-9]*\) ms.*/\1/p' "$out" | head -n 1)"
  if [ -z "$ms" ]; then
    echo "run $n: no window shown; the app said:" >&2
    cat "$out" >&2
    exit 1
  fi
  echo "$ms ${cpu:-?}"
}

measure() {
  local results=() cpus=()
  for n in $(seq 1 "$runs"); do
    read -r ms cpu <<<"$(one_run "$n")"
    echo "run $n: first window after $ms ms (processor time $cpu ms)"
    results+=("$ms")
    cpus+=("$cpu")
  done
  median="$(printf '%s\n' "${results[@]}" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}')"
  cpu_median="$(printf '%s\n' "${cpus[@]}" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}')"
  echo "median of $runs runs: $median ms from process start to the first window, processor time $cpu_median ms"
}

measure
