#!/usr/bin/env bash
# Makes the class-data sharing archive of an app image: starts the image's own java exactly as its
# launcher would, with the demo data on a fresh folder, until the window is usable (the unit screen
# laid out with the demo units listed); then ends it,
# and the JVM writes the classes it loaded to WORK/stagewise.jsa. Needs a display (or Xvfb).
#
# Usage: src/package/train-cds.sh IMAGE_DIR WORK_DIR   (build-image.sh runs it)
set -euo pipefail
image="$1"
work="$2"
appdir="$image/lib/app"
cfg="$appdir/Stagewise.cfg"
cp="$(sed -n 's/^app.classpath=//p' "$cfg" | sed "s|\$APPDIR|$appdir|g" | paste -sd:)"
mapfile -t opts < <(sed -n 's/^java-options=//p' "$cfg" | sed "s|\$APPDIR|$appdir|g")
main="$(sed -n 's/^app.mainclass=//p' "$cfg")"
log="$work/train.log"
data="$work/train-data"
mkdir -p "$data"
XDG_DATA_HOME="$data" "$image/lib/runtime/bin/java" "${opts[@]}" \
  -XX:ArchiveClassesAtExit="$work/stagewise.jsa" -Dstagewise.timing=true \
  -cp "$cp" "$main" --demo >"$log" 2>&1 &
pid=$!
for _ in $(seq 1 600); do
  grep -q "usable window" "$log" && break
  kill -0 "$pid" 2>/dev/null || break
  sleep 0.1
done
sleep 1
kill -TERM "$pid" 2>/dev/null || true
wait "$pid" 2>/dev/null || true
