#!/usr/bin/env bash
# Prepares the quick start of this app image for the folder it sits in now: the class-data sharing
# archive lib/app/stagewise.jsa, which the JVM uses only in the folder where it was made (it checks
# the class path it recorded). The image's build runs this once; run it again after copying or
# moving the Stagewise folder (install-desktop-entry.sh does so when the archive does not fit).
# Without a fitting archive Stagewise still starts, only a little slower.
#
# It starts Stagewise once with the demo shop in a temporary data folder (your own history is not
# touched) until the unit screen shows, then ends it: on a virtual display (Xvfb) when there is
# one, else on yours (a window opens and closes by itself, a few seconds).
#
# Usage: Stagewise/lib/app/desktop/prepare-quick-start.sh [--if-needed]
#   --if-needed: do nothing when the archive already fits this folder.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
image="$(cd "$here/../../.." && pwd)"
appdir="$image/lib/app"
if [ "${1:-}" = "--if-needed" ] && [ -s "$appdir/stagewise.jsa" ] &&
  bash "$here/train-cds.sh" "$image" --check; then
  echo "The quick start already fits this folder ($appdir/stagewise.jsa)."
  exit 0
fi
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
if command -v xvfb-run >/dev/null 2>&1; then
  xvfb-run -a -s "-screen 0 1280x800x24" bash "$here/train-cds.sh" "$image" "$work"
elif [ -n "${DISPLAY:-}" ]; then
  echo "Preparing the quick start: a Stagewise window opens and closes by itself."
  bash "$here/train-cds.sh" "$image" "$work"
else
  echo "No display and no Xvfb (apt-get install xvfb): the quick start was not prepared;" \
    "Stagewise starts without it, a little slower." >&2
  exit 1
fi
if [ ! -s "$work/stagewise.jsa" ]; then
  echo "The quick start could not be prepared (the trial start wrote no archive; its output:" \
    "$work/train.log follows). Stagewise starts without it, a little slower." >&2
  cat "$work/train.log" >&2 || true
  exit 1
fi
# A read-only archive left by an earlier run is replaced, not written into.
rm -f "$appdir/stagewise.jsa"
cp "$work/stagewise.jsa" "$appdir/stagewise.jsa"
chmod 0644 "$appdir/stagewise.jsa"
if ! bash "$here/train-cds.sh" "$image" --check; then
  echo "The archive was made but the JVM does not take it here; Stagewise starts without it." >&2
  exit 1
fi
echo "Quick start prepared for this folder: $appdir/stagewise.jsa"
