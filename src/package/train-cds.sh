#!/usr/bin/env bash
# Makes the class-data sharing archive of an app image: starts the image's own java exactly as its
# launcher would, with the demo data on a fresh folder, until the window is usable (the unit screen
# laid out with the demo units listed); then ends it,
# and the JVM writes the classes it loaded to WORK/stagewise.jsa. Needs a display (or Xvfb).
# With --check instead of WORK, starts the image's java with the archive it has and -Xshare:on
# (which refuses an archive that does not fit rather than starting without it) and exits 0 only
# when the archive fits the folder the image sits in now (the JVM records the class path's folder).
#
# Usage: train-cds.sh IMAGE_DIR WORK_DIR | train-cds.sh IMAGE_DIR --check
#   (prepare-quick-start.sh, shipped in the image beside this script, runs it)
set -euo pipefail
image="$1"
work="$2"
appdir="$image/lib/app"
cfg="$appdir/Stagewise.cfg"
cp="$(sed -n 's/^app.classpath=//p' "$cfg" | sed "s|\$APPDIR|$appdir|g" | paste -sd:)"
main="$(sed -n 's/^app.mainclass=//p' "$cfg")"
if [ "$work" = "--check" ]; then
  mapfile -t opts < <(sed -n 's/^java-options=//p' "$cfg" | grep -v '^-Xshare' | sed "s|\$APPDIR|$appdir|g")
  exec "$image/lib/runtime/bin/java" "${opts[@]}" -Xshare:on -cp "$cp" "$main" --version >/dev/null 2>&1
fi
# The archive being made must not be read while it is made.
mapfile -t opts < <(sed -n 's/^java-options=//p' "$cfg" | grep -v -e '^-Xshare' -e '^-XX:SharedArchiveFile' | sed "s|\$APPDIR|$appdir|g")
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
