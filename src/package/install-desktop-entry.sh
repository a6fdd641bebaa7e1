#!/usr/bin/env bash
# Adds Stagewise to this user's application menu and lets stage sheets (*.stage.json) open with it.
# Run it from the unpacked app image: Stagewise/lib/app/desktop/install-desktop-entry.sh
# Nothing outside your home folder and the Stagewise folder is changed; remove the files it names to
# undo. It also prepares the quick start for the folder Stagewise sits in now, if the one it came
# with was made elsewhere (prepare-quick-start.sh, beside this script).
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
app="$(cd "$here/../../.." && pwd)"
share="${XDG_DATA_HOME:-$HOME/.local/share}"
mkdir -p "$share/applications" "$share/mime/packages"
sed "s|@APP@|$app|g" "$here/stagewise.desktop.in" >"$share/applications/stagewise.desktop"
cp "$here/stagewise-mime.xml" "$share/mime/packages/stagewise-stage.xml"
if command -v update-mime-database >/dev/null 2>&1; then
  update-mime-database "$share/mime" || true
fi
if command -v update-desktop-database >/dev/null 2>&1; then
  update-desktop-database "$share/applications" || true
fi
if command -v xdg-mime >/dev/null 2>&1; then
  xdg-mime default stagewise.desktop application/x-stagewise-stage || true
fi
echo "Added $share/applications/stagewise.desktop and $share/mime/packages/stagewise-stage.xml"
"$here/prepare-quick-start.sh" --if-needed ||
  echo "Stagewise starts without its quick-start archive here (a little slower); see above." >&2
