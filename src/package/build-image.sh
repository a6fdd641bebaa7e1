#!/usr/bin/env bash
# Builds the self-contained Stagewise app image (its own Java runtime, JavaFX, an icon, a desktop
# entry) with the JDK's jpackage, and a class-data sharing archive (AppCDS) for a quick start.
#
# Run through Maven: `mvn -B package -Ppackage` (after the jar and its libraries are built);
# by hand: src/package/build-image.sh [TARGET_DIR]   (default: target)
#
# The archive is made by starting the image once with the demo data under a virtual display
# (Xvfb; `apt-get install xvfb`) until the unit screen shows; without a display or Xvfb the image is
# built without it and starts a little slower. A copied or moved image makes its own again with
# Stagewise/lib/app/desktop/prepare-quick-start.sh (install-desktop-entry.sh runs it when needed).
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
target="$(cd "${1:-$here/../../target}" && pwd)"
name=Stagewise
version="${STAGEWISE_VERSION:-1.0}"

command -v jpackage >/dev/null || { echo "jpackage not found: it comes with a full JDK 17 (openjdk-17-jdk)" >&2; exit 1; }
[ -f "$target/stagewise.jar" ] || { echo "$target/stagewise.jar is missing: run mvn -B package first" >&2; exit 1; }

work="$target/jpackage"
rm -rf "$work" "$target/dist/$name"
mkdir -p "$work/input/lib" "$work/input/javafx" "$work/input/desktop" "$target/dist"
cp "$target/stagewise.jar" "$work/input/"
for jar in "$target"/lib/*.jar; do
  case "$(basename "$jar")" in
    javafx-*-linux.jar) cp "$jar" "$work/input/javafx/" ;;  # the real JavaFX modules
    javafx-*) ;;                                            # empty stand-ins without a platform
    *) cp "$jar" "$work/input/lib/" ;;
  esac
done
cp "$here/stagewise.desktop.in" "$here/stagewise-mime.xml" "$here/install-desktop-entry.sh" \
  "$here/prepare-quick-start.sh" "$here/train-cds.sh" "$work/input/desktop/"

# JavaFX on the module path (as JavaFX expects; no "unsupported configuration" warning), ControlsFX
# on the class path with the JavaFX internals it reaches for; the same quick-start JVM options as
# `mvn javafx:run` (DEVELOPERS.md, "Time to the first window").
opens=(
  --add-exports=javafx.base/com.sun.javafx.event=ALL-UNNAMED
  --add-exports=javafx.controls/com.sun.javafx.scene.control=ALL-UNNAMED
  --add-exports=javafx.controls/com.sun.javafx.scene.control.behavior=ALL-UNNAMED
  --add-exports=javafx.controls/com.sun.javafx.scene.control.inputmap=ALL-UNNAMED
  --add-exports=javafx.graphics/com.sun.javafx.scene=ALL-UNNAMED
  --add-exports=javafx.graphics/com.sun.javafx.scene.traversal=ALL-UNNAMED
  --add-exports=javafx.graphics/com.sun.javafx.css=ALL-UNNAMED
  --add-opens=javafx.controls/javafx.scene.control.skin=ALL-UNNAMED
)
options="--module-path \$APPDIR/javafx --add-modules javafx.controls ${opens[*]} -Dprism.order=sw -XX:TieredStopAtLevel=1 -XX:+UseSerialGC"

jpackage --type app-image --name "$name" --app-version "$version" --vendor "Stagewise" \
  --description "Bench diagnosis of op-amp stages" \
  --dest "$target/dist" --input "$work/input" \
  --main-jar stagewise.jar --main-class com.stagewise.app.Main \
  --icon "$here/stagewise.png" \
  --jlink-options "--strip-debug --no-man-pages --no-header-files --generate-cds-archive" \
  --java-options "$options"

image="$target/dist/$name"
appdir="$image/lib/app"
cfg="$appdir/$name.cfg"

# The JavaFX jars sit on the module path; take them off the class path jpackage wrote.
sed -i '/^app.classpath=\$APPDIR\/javafx\//d' "$cfg"

# The quick start: a class-data sharing archive, made by one start of the image with the demo
# (prepare-quick-start.sh, shipped in the image, so that a copied or moved image can make its own:
# the JVM takes the archive only in the folder where it was made). -Xshare:auto: should the archive
# be missing or not fit (another folder, a changed jar), the app starts without it instead of failing,
# and says nothing.
sed -i "s|^\[JavaOptions\]|[JavaOptions]\njava-options=-XX:SharedArchiveFile=\$APPDIR/stagewise.jsa\njava-options=-Xshare:auto|" "$cfg"
chmod +x "$appdir/desktop/install-desktop-entry.sh" "$appdir/desktop/prepare-quick-start.sh"
if "$appdir/desktop/prepare-quick-start.sh"; then
  echo "Class-data sharing archive: $appdir/stagewise.jsa"
else
  echo "The image is built without a class-data sharing archive (it starts a little slower)." >&2
fi
echo "App image: $image  (start it with $image/bin/$name; menu entry: $appdir/desktop/install-desktop-entry.sh)"
