#!/usr/bin/env bash
# Measures the time from launching the bench app to its first window being shown, and to the
# window being usable (the unit screen laid out with the demo's units listed, the history open and
# nothing left to do in the background, so that a tap is taken at once).
#
# Usage: src/scripts/time-to-window.sh [RUNS]      (default 5 runs; prints each and the median)
#        JAVA_OPTIONS="..." src/scripts/time-to-window.sh   (other JVM options, e.g. " " for the defaults)
#        IMAGE=target/dist/Stagewise src/scripts/time-to-window.sh [RUNS]
#            (the app image of `mvn -B package -Ppackage`, started by its own launcher; with
#             NO_CDS=1 its class-data sharing archive is left out, for the comparison)
#
# Each run starts the app with --demo on a fresh, empty data folder (so the demo data is filled
# on first start, as on a new machine), under a virtual X display (Xvfb; `apt-get install xvfb`)
# unless DISPLAY is already set. Started with -Dstagewise.timing=true, the app prints the
# milliseconds (and the processor time of all its threads) from its process start to the first
# window shown and to the usable window; the run then ends the app.
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
  local n="$1" image="$2" out="$work/run-$1.log" data="$work/data-$1"
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
    if grep -q "usable window" "$out"; then break; fi
    if ! kill -0 "$pid" 2>/dev/null; then break; fi
    sleep 0.1
  done
  kill "$pid" 2>/dev/null || true
  wait "$pid" 2>/dev/null || true
  local ms cpu ums ucpu
  ms="$(sed -n 's/.*first window shown \([0-9]*\) ms.*/\1/p' "$out" | head -n 1)"
  cpu="$(sed -n 's/.*first window shown .*cpu \([0-9]*\) ms.*/\1/p' "$out" | head -n 1)"
  ums="$(sed -n 's/.*usable window \([0-9]*\) ms.*/\1/p' "$out" | head -n 1)"
  ucpu="$(sed -n 's/.*usable window .*cpu \([0-9]*\) ms.*/\1/p' "$out" | head -n 1)"
  if [ -z "$ms" ] || [ -z "$ums" ]; then
    echo "run $n: no usable window within 60 s; the app said:" >&2
    cat "$out" >&2
    exit 1
  fi
  echo "$ms ${cpu:-?} $ums ${ucpu:-?}"
}

median_of() {
  printf '%s\n' "$@" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'
}

report() {
  local label="$1" file="$2"
  # Each line of the file: first-window ms, its processor ms, usable ms, its processor ms.
  echo "$label median of $(wc -l <"$file") runs: first window $(median_of $(cut -d' ' -f1 "$file")) ms" \
    "(processor time $(median_of $(cut -d' ' -f2 "$file")) ms)," \
    "usable window $(median_of $(cut -d' ' -f3 "$file")) ms" \
    "(processor time $(median_of $(cut -d' ' -f4 "$file")) ms) from process start"
}

ratio() {
  awk -v a="$1" -v b="$2" 'BEGIN {printf "%.2f", b / a}'
}

measure() {
  local compare="${COMPARE:-}"
  echo "load average before: $(cut -d' ' -f1-3 /proc/loadavg)"
  : >"$work/a.txt"
  : >"$work/b.txt"
  for n in $(seq 1 "$runs"); do
    local line
    line="$(one_run "a$n" "$image")"
    read -r ms cpu ums ucpu <<<"$line"
    echo "run $n${compare:+ (A)}: first window after $ms ms (processor time $cpu ms), usable after $ums ms (processor time $ucpu ms)"
    echo "$line" >>"$work/a.txt"
    if [ -n "$compare" ]; then
      line="$(one_run "b$n" "$compare")"
      read -r ms cpu ums ucpu <<<"$line"
      echo "run $n (B): first window after $ms ms (processor time $cpu ms), usable after $ums ms (processor time $ucpu ms)"
      echo "$line" >>"$work/b.txt"
    fi
  done
  if [ -z "$compare" ]; then
    report "" "$work/a.txt"
  else
    report "A ($image)" "$work/a.txt"
    report "B ($compare)" "$work/b.txt"
    local col
    for col in 1 2 3 4; do
      local a b
      a="$(median_of $(cut -d' ' -f$col "$work/a.txt"))"
      b="$(median_of $(cut -d' ' -f$col "$work/b.txt"))"
      case $col in
        1) echo -n "ratios B/A: first window $(ratio "$a" "$b")" ;;
        2) echo -n " (processor $(ratio "$a" "$b"))" ;;
        3) echo -n ", usable window $(ratio "$a" "$b")" ;;
        4) echo " (processor $(ratio "$a" "$b"))" ;;
      esac
    done
  fi
  echo "load average after: $(cut -d' ' -f1-3 /proc/loadavg)"
}

measure
