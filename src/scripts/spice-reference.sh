#!/usr/bin/env bash
# Regenerates the reference data made with ngspice (Debian package `ngspice`, version 39):
#   src/test/resources/reference/spice/*.json   (solver reference answers)
#   src/test/resources/diagnosis/truth/*.json   (simulated fault truth set)
#   src/test/resources/reference/ohms/*.json    (power-off resistances, every fault)
# Usage: src/scripts/spice-reference.sh [reference|truth [missing]|ohms|timing STAGE-NAME]   (default: all three)
#   truth missing: only the stages that have no truth file yet
set -euo pipefail
cd "$(dirname "$0")/../.."
command -v ngspice >/dev/null || { echo "ngspice is not on the PATH: apt-get install ngspice" >&2; exit 1; }
mvn -B -q -DskipTests test-compile
cp_file=target/spice-reference.classpath
mvn -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile="$cp_file" >/dev/null
cp="target/test-classes:target/classes:$(cat "$cp_file")"
what="${1:-all}"
case "$what" in
  reference) java -cp "$cp" com.stagewise.reference.SpiceReference ;;
  truth) java -cp "$cp" com.stagewise.reference.FaultTruth ${2:-} ;;
  ohms) java -cp "$cp" com.stagewise.reference.PowerOffReference ;;
  timing) java -cp "$cp" com.stagewise.reference.SpiceBatch "${2:-}" ;;
  all)
    java -cp "$cp" com.stagewise.reference.SpiceReference
    java -cp "$cp" com.stagewise.reference.FaultTruth
    java -cp "$cp" com.stagewise.reference.PowerOffReference ;;
  *) echo "usage: $0 [reference|truth [missing]|ohms|timing STAGE-NAME]" >&2; exit 2 ;;
esac
